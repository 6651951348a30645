// The circuit graph: what `read` produces and everything downstream consumes.
// Plain data only (no classes, no methods) so it serialises, diffs and crosses worker boundaries.
// All figures are SI base units (ohms, farads, henries, volts, amperes, watts).

/** Where something came from, for annotations: 1-based line and column of the `(symbol …)` list. */
export interface Origin {
  file: string;
  line: number;
  column: number;
  /** Human sheet path of the instance, `/` for the root, `/preamp/` for a sub-sheet. */
  sheetPath: string;
}

/** A character range of a file's text (JS string offsets, end exclusive), e.g. a Value string token
 * including its quotes. The fix command turns it into bytes. */
export interface TextSpan {
  file: string;
  start: number;
  end: number;
}

export type PartKind =
  | "resistor"
  | "capacitor"
  | "polarized-capacitor"
  | "inductor"
  | "diode"
  | "zener"
  | "npn"
  | "pnp"
  | "njfet"
  | "pjfet"
  | "nmos"
  | "pmos"
  | "dual-gate-mosfet"
  | "voltage-source"
  | "current-source"
  | "battery"
  | "connector"
  | "power-flag"
  | "other";

/** A Value field as read. `number` is absent when the text could not be read as a number; then
 * `problem` says why and the part is flagged, never guessed. */
export interface ParsedValue {
  text: string;
  number?: number;
  /** Unit letter(s) found or implied by the part kind: "Ω", "F", "H", "V", "A". */
  unit?: string;
  voltageRating?: number;
  /** Fractional tolerance: 0.01 for 1 %. */
  tolerance?: number;
  powerRating?: number;
  /** How the number was written, so a fix can write a new value the same way. */
  style?: "rkm" | "prefix" | "prefix-unit" | "plain";
  problem?: string;
  /** Read, but with a doubt worth showing (e.g. `3,300uF`: decimal or thousands comma?). */
  warning?: string;
}

/**
 * Pin roles by kind:
 * - resistor/capacitor/inductor: "1", "2" (polarized capacitor: "+", "-")
 * - diode/zener: "A", "K"
 * - npn/pnp: "B", "C", "E"
 * - njfet/pjfet, nmos/pmos: "G", "D", "S" (and "B" for a four-terminal MOSFET)
 * - dual-gate-mosfet: "G1", "G2", "D", "S"
 * - voltage-source/battery/current-source: "+", "-"
 * The value is the symbol's pin number.
 */
export type PinRoles = Record<string, string>;

export interface Part {
  /** Resolved per instance (a sheet used twice yields two parts with two references). */
  ref: string;
  /** The Value field text as written ("4k7", "100uF 25V"); "" when empty. */
  value: string;
  parsed: ParsedValue;
  kind: PartKind;
  /** "Device:R", "Transistor_BJT:2N3904"; netlist libsource "lib:part". */
  libId: string;
  footprint: string;
  /** Pin number -> net name. Pins of units never placed are absent. */
  pins: Record<string, string>;
  /** Pin number -> pin name as drawn ("" when unnamed). */
  pinNames: Record<string, string>;
  roles: PinRoles;
  /** Every other property of the symbol (user fields, Sim.*, Spice_*, Datasheet, Description). */
  fields: Record<string, string>;
  dnp: boolean;
  excludedFromSim: boolean;
  origin: Origin;
  /** The Value property's quoted string in the source file, when read from a schematic. */
  valueSpan?: TextSpan;
}

export interface NetPin {
  ref: string;
  pin: string;
}

export interface Net {
  /** Name by the editor's precedence rules, or a stable generated name. Unique within a circuit. */
  name: string;
  /** Every label/power name attached to the net (the chosen name included). */
  aliases: string[];
  /** Sorted by ref (natural order) then pin. */
  pins: NetPin[];
  /** Named GND/GNDA/0/VSS-style ground, or a power symbol of ground type. */
  isGround: boolean;
  /** Driven by a power symbol or a power_in pin name. */
  isPower: boolean;
  /** Carries a no_connect flag or a no-connect pin. */
  noConnect: boolean;
}

export interface SheetInstance {
  /** Human path `/`, `/preamp/`. */
  path: string;
  file: string;
}

/** A non-fatal observation made while reading (unknown version, unreadable value, orphan wire). */
export interface ReadNote {
  file: string;
  line: number;
  column: number;
  message: string;
  ref?: string;
}

export interface ModelLibrary {
  /** Path as written in the field, and the resolved project-relative path. */
  path: string;
  text: string;
}

export interface Circuit {
  /** The root file the design was read from (as given on the command line). */
  file: string;
  format: "kicad_sch" | "kicad_net";
  /** File-format version stamp (schematic `version`, netlist `version`). */
  version: string;
  parts: Part[];
  nets: Net[];
  sheets: SheetInstance[];
  notes: ReadNote[];
  /** Model libraries referenced by Sim.Library / Spice_Lib_File fields, read at `read` time. */
  modelLibraries: ModelLibrary[];
}

/** A file that could not be read. `line`/`column` are 1-based; 0 when the problem is the file as a whole. */
export interface ReadError {
  file: string;
  line: number;
  column: number;
  message: string;
}

export type ReadResult = { ok: true; circuit: Circuit } | { ok: false; error: ReadError };
