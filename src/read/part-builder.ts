// What both readers do once they know a part's fields and pins: classify it, parse its value, and
// put nets and pins into the one documented order.
import { classifyPart } from "../circuit/classify.js";
import type { Net, Origin, Part, TextSpan } from "../circuit/types.js";
import { parseValue } from "../circuit/value.js";
import { comparePins, naturalCompare } from "./natural-order.js";

export interface PartInput {
  ref: string;
  value: string;
  libId: string;
  footprint: string;
  pins: Record<string, string>;
  pinNames: Record<string, string>;
  pinTypes: Record<string, string>;
  fields: Record<string, string>;
  dnp: boolean;
  excludedFromSim: boolean;
  origin: Origin;
  valueSpan?: TextSpan;
}

export function buildPart(input: PartInput): Part {
  const { kind, roles } = classifyPart({
    ref: input.ref,
    libId: input.libId,
    value: input.value,
    pinNames: input.pinNames,
    pinTypes: input.pinTypes,
    fields: input.fields,
    isPowerSymbol: false,
  });
  const part: Part = {
    ref: input.ref,
    value: input.value,
    parsed: parseValue(input.value, kind, input.fields),
    kind,
    libId: input.libId,
    footprint: input.footprint,
    pins: sortedRecord(input.pins),
    pinNames: sortedRecord(input.pinNames),
    roles,
    fields: input.fields,
    dnp: input.dnp,
    excludedFromSim: input.excludedFromSim,
    origin: input.origin,
  };
  if (input.valueSpan) part.valueSpan = input.valueSpan;
  return part;
}

function sortedRecord(r: Record<string, string>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const k of Object.keys(r).sort(naturalCompare)) out[k] = r[k] ?? "";
  return out;
}

/** Pins by natural reference then pin; nets by name; parts by reference. */
export function sortCircuit(parts: Part[], nets: Net[]): void {
  for (const n of nets) n.pins.sort(comparePins);
  nets.sort((a, b) => naturalCompare(a.name, b.name));
  parts.sort((a, b) => naturalCompare(a.ref, b.ref));
}
