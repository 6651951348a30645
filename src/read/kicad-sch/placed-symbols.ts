// One placed `(symbol …)` item of a sheet (KiCad format notes §6): library link, placement,
// unit, properties, flags, alternates and the per-instance data of KiCad 7+ files.
import type { ReadNote } from "../../circuit/types.js";
import { argNumber, argText, childOf, childrenOf, flagOf, tokenEnd, where, type SList } from "../sexpr.js";
import { unescapeKicad } from "./escapes.js";
import { inRange, quarterTurn, toGrid, type Mirror } from "./geometry.js";
import { readProperty } from "./properties.js";
import type { InstanceData, PlacedSymbol } from "./sheet-data.js";
import { fieldText } from "./versions.js";

export function readPlacedSymbol(sym: SList, version: number, file: string, text: string, notes: ReadNote[]): PlacedSymbol | undefined {
  const pos = where(sym);
  const note = (message: string): void => { notes.push({ file, line: pos.line, column: pos.column, message }); };
  const rawLibId = argText(childOf(sym, "lib_id"), 1);
  if (rawLibId === undefined) { note("placed symbol without (lib_id …); ignored"); return undefined; }
  const libId = unescapeKicad(rawLibId);
  const libName = argText(childOf(sym, "lib_name"), 1);
  const at = childOf(sym, "at");
  const xmm = argNumber(at, 1);
  const ymm = argNumber(at, 2);
  if (xmm === undefined || ymm === undefined || !inRange(toGrid(xmm)) || !inRange(toGrid(ymm))) {
    note(`placed symbol ${libId} without a readable (at x y) position; ignored`);
    return undefined;
  }
  const turn = quarterTurn(argNumber(at, 3) ?? 0);
  if (!turn.exact) note(`symbol rotation ${argNumber(at, 3) ?? 0}° is not a multiple of 90°; read as ${turn.angle}°`);
  const mirrorText = argText(childOf(sym, "mirror"), 1);
  const mirror: Mirror = mirrorText === "x" || mirrorText === "y" ? mirrorText : undefined;

  let reference = "";
  let value = "";
  let valueSpan: { start: number; end: number } | undefined;
  let footprint = "";
  const fields: Record<string, string> = {};
  for (const propList of childrenOf(sym, "property")) {
    const prop = readProperty(propList);
    if (!prop) continue;
    const shown = fieldText(prop.value, version);
    switch (prop.name.toLowerCase()) {
      case "reference": reference = shown; break;
      case "value":
        value = shown;
        valueSpan = { start: prop.valueNode.location.start.offset, end: tokenEnd(prop.valueNode, text) };
        break;
      case "footprint": footprint = shown; break;
      // A repeated user field overwrites the earlier one, as the editor does on load.
      default: fields[prop.name] = shown;
    }
  }

  const alternates = new Map<string, string>();
  for (const pin of childrenOf(sym, "pin")) {
    const number = argText(pin, 1);
    const alt = argText(childOf(pin, "alternate"), 1);
    if (number !== undefined && alt !== undefined) alternates.set(number, alt);
  }

  const instances = new Map<string, InstanceData>();
  for (const inst of childrenOf(sym, "instances")) {
    for (const project of childrenOf(inst, "project")) {
      for (const path of childrenOf(project, "path")) {
        const p = argText(path, 1);
        if (p !== undefined) instances.set(p.toLowerCase(), readInstanceData(path, version, text));
      }
    }
  }
  const defaultList = childOf(sym, "default_instance");

  const out: PlacedSymbol = {
    libKey: libName !== undefined ? unescapeKicad(libName) : libId,
    libId,
    x: toGrid(xmm),
    y: toGrid(ymm),
    angle: turn.angle,
    mirror,
    unit: Math.max(1, Math.trunc(argNumber(childOf(sym, "unit"), 1) ?? 1)),
    bodyStyle: Math.max(1, Math.trunc(argNumber(childOf(sym, "body_style") ?? childOf(sym, "convert"), 1) ?? 1)),
    uuid: (argText(childOf(sym, "uuid"), 1) ?? "").toLowerCase(),
    reference,
    value,
    footprint,
    fields,
    inBom: flagOf(sym, "in_bom") !== false,
    onBoard: flagOf(sym, "on_board") !== false,
    dnp: flagOf(sym, "dnp") === true || dnpField(fields),
    excludeFromSim: flagOf(sym, "exclude_from_sim") === true || simDisabledByField(fields),
    alternates,
    instances,
    line: pos.line,
    column: pos.column,
  };
  if (valueSpan) out.valueSpan = valueSpan;
  if (defaultList) out.defaultInstance = readInstanceData(defaultList, version, text);
  return out;
}

/** `(path … (reference "R5") (unit 1) (value "10k") (footprint "…"))` or a `default_instance`. */
export function readInstanceData(list: SList, version: number, text: string): InstanceData {
  const data: InstanceData = {};
  const reference = argText(childOf(list, "reference"), 1);
  if (reference !== undefined) data.reference = reference;
  const unit = argNumber(childOf(list, "unit"), 1);
  if (unit !== undefined && unit >= 1) data.unit = Math.trunc(unit);
  const valueList = childOf(list, "value");
  const valueNode = valueList?.content[1];
  if (valueNode !== undefined && valueNode.type !== "list") {
    data.value = fieldText(valueNode.content, version);
    data.valueSpan = { start: valueNode.location.start.offset, end: tokenEnd(valueNode, text) };
  }
  const footprint = argText(childOf(list, "footprint"), 1);
  if (footprint !== undefined) data.footprint = fieldText(footprint, version);
  return data;
}

const FALSE_TEXT = new Set(["", "0", "n", "no", "false", "off"]);

/** Before the `dnp` flag (20220914) practitioners marked unfitted parts with a field named DNP or
 * DNF holding a true-ish value (common practice, not a KiCad convention). */
function dnpField(fields: Record<string, string>): boolean {
  for (const [name, value] of Object.entries(fields)) {
    const n = name.toLowerCase();
    if ((n === "dnp" || n === "dnf") && !FALSE_TEXT.has(value.trim().toLowerCase())) return true;
  }
  return false;
}

/** 7.0 wrote `Sim.Enable` = 0, 6.x `Spice_Netlist_Enabled` = N for parts left out of simulation. */
function simDisabledByField(fields: Record<string, string>): boolean {
  for (const [name, value] of Object.entries(fields)) {
    const n = name.toLowerCase();
    if ((n === "sim.enable" || n === "spice_netlist_enabled") && FALSE_TEXT.has(value.trim().toLowerCase()) && value.trim() !== "") {
      return true;
    }
  }
  return false;
}
