// The compact record kept for each schematic file once its s-expression tree has been dropped:
// only what connectivity, references and the Circuit need. Coordinates are grid units
// (geometry.ts); point lists are flat number arrays [x0, y0, x1, y1, …] to keep memory small.
import type { ReadNote } from "../../circuit/types.js";
import type { Mirror } from "./geometry.js";

export interface LibPin {
  number: string;
  /** "" when unnamed. */
  name: string;
  /** Electrical type as written (`passive`, `power_in`, …; `unconnected` read as `no_connect`). */
  type: string;
  /** Connection point in library coordinates (Y up), grid units. */
  x: number;
  y: number;
  /** 0 = common to every unit. */
  unit: number;
  /** 0 = common to every body style. */
  style: number;
  hidden: boolean;
  /** Alternate name → electrical type. */
  alternates: Map<string, string>;
}

export interface LibSymbol {
  /** The embedded name, `Nickname:Name`. */
  id: string;
  /** `(power)` / `(power global)` → "global"; `(power local)` → "local". */
  power: "global" | "local" | undefined;
  pins: LibPin[];
  unitCount: number;
  /** Library-level properties (Reference prefix, Value, ki_* …). */
  properties: Record<string, string>;
  /** Name of the parent when the symbol is derived (`extends`); resolved after extraction. */
  extendsName?: string;
}

export interface InstanceData {
  reference?: string;
  unit?: number;
  value?: string;
  /** Where the per-instance value is written (v6 root `symbol_instances`), for fixes. */
  valueSpan?: { start: number; end: number };
  footprint?: string;
}

export interface PlacedSymbol {
  /** Key into `SheetData.lib`: `lib_name` when present, else `lib_id`. */
  libKey: string;
  libId: string;
  x: number;
  y: number;
  angle: number;
  mirror: Mirror;
  unit: number;
  bodyStyle: number;
  uuid: string;
  reference: string;
  value: string;
  /** Character range of the Value property's quoted token (quotes included). */
  valueSpan?: { start: number; end: number };
  footprint: string;
  /** Every property except Reference, Value and Footprint. */
  fields: Record<string, string>;
  inBom: boolean;
  onBoard: boolean;
  dnp: boolean;
  excludeFromSim: boolean;
  /** Pin number → selected alternate name. */
  alternates: Map<string, string>;
  /** v7+ per-symbol instance data keyed by lower-cased sheet path (`/rootuuid/sheetuuid`). */
  instances: Map<string, InstanceData>;
  /** 7.0-development `default_instance`. */
  defaultInstance?: InstanceData;
  line: number;
  column: number;
}

export type LabelKind = "local" | "global" | "hierarchical";

export interface SheetLabel {
  kind: LabelKind;
  text: string;
  x: number;
  y: number;
  shape: string;
  line: number;
  column: number;
}

export interface SheetPin {
  name: string;
  shape: string;
  x: number;
  y: number;
  line: number;
  column: number;
}

export interface SheetRef {
  name: string;
  /** `Sheetfile` as written. */
  fileName: string;
  uuid: string;
  pins: SheetPin[];
  dnp: boolean;
  excludeFromSim: boolean;
  onBoard: boolean;
  line: number;
  column: number;
}

export interface SheetData {
  /** The path the file was opened by (shown in messages and origins). */
  file: string;
  version: number;
  /** File-level UUID (the root sheet's UUID when this is the root), lower-cased; "" when absent. */
  uuid: string;
  lib: Map<string, LibSymbol>;
  symbols: PlacedSymbol[];
  /** Wire segments, 4 numbers each. */
  wires: number[];
  buses: number[];
  /** Bus entries as segments (at, at + size), 4 numbers each. */
  busEntries: number[];
  /** Points, 2 numbers each. */
  junctions: number[];
  noConnects: number[];
  labels: SheetLabel[];
  sheets: SheetRef[];
  /** v6 root `symbol_instances`: lower-cased `/sheetuuid/…/symboluuid` → instance data. */
  symbolInstances: Map<string, InstanceData>;
  busAliases: Map<string, string[]>;
  notes: ReadNote[];
}
