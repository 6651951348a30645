// The element lines of a `.subckt` body, read into typed statements: R C L V I D Q J M and X
// (a nested instance). Anything the solver cannot represent — other element letters, `{expressions}`,
// parameters passed to an instance, a MOSFET multiplier — is a `problem` naming the line, so a part
// that uses the subcircuit is left out with that reason rather than simulated wrongly.
// Names and nodes are upper-cased: SPICE is case-insensitive, and one spelling keeps them comparable.
import { parseSourceSpec } from "../circuit/source-spec.js";
import { parseSpiceNumber } from "../circuit/spice-number.js";
import type { ModelCard } from "./netlist.js";

interface StatementBase {
  /** Upper-cased element name as written (`M1`, `XDIE`). */
  name: string;
  /** 1-based line in the library text. */
  line: number;
}

export interface SubcktPassive extends StatementBase { kind: "R" | "C" | "L"; nodes: [string, string]; value: number }
export interface SubcktSource extends StatementBase { kind: "V" | "I"; nodes: [string, string]; dc: number; ac?: number }
export interface SubcktDevice extends StatementBase {
  kind: "D" | "Q" | "J" | "M";
  /** D: anode, cathode; Q: collector, base, emitter; J: drain, gate, source; M: drain, gate, source, bulk. */
  nodes: string[];
  model: string;
  area?: number;
  w?: number;
  l?: number;
}
export interface SubcktInstance extends StatementBase { kind: "X"; nodes: string[]; subckt: string }

export type SubcktStatement = SubcktPassive | SubcktSource | SubcktDevice | SubcktInstance;

export interface SubcktProblem {
  line: number;
  message: string;
}

/** A `.subckt NAME pins… / .ends` block. */
export interface SubcircuitDef {
  /** As written (`DGMOS_EST`); looked up case-insensitively. */
  name: string;
  /** Upper-cased pin names, in the order of the `.subckt` line. */
  pins: string[];
  statements: SubcktStatement[];
  /** `.model` cards written inside the block (visible to its own elements only). */
  models: ModelCard[];
  /** What makes the block unusable; each names its line. Empty when the block can be expanded. */
  problems: SubcktProblem[];
  /** Instance parameters we read past without effect (`AD=`, `IC=`), each naming its line. */
  ignored: SubcktProblem[];
  /** Line of the `.subckt` statement. */
  line: number;
  /** Where the block was read ("model library 'dg-mosfet.lib'"). */
  source: string;
}

export type ReadStatement =
  | { statement: SubcktStatement; ignored: string[] }
  | { problem: string };

const LETTER_NAMES: Record<string, string> = {
  E: "voltage-controlled voltage source", F: "current-controlled current source", G: "voltage-controlled current source",
  H: "current-controlled voltage source", B: "behavioural source", K: "coupled inductors", T: "transmission line",
  O: "lossy transmission line", U: "distributed RC line", S: "voltage-controlled switch", W: "current-controlled switch",
  A: "code model", Z: "MESFET", N: "device model", P: "coupled transmission line", Y: "transmission line",
};

/** Instance keywords that only matter to transient or initial-condition analyses. */
const TRANSIENT_ONLY = new Set(["IC", "OFF", "TEMP", "DTEMP"]);

/** Blank-separated words with `KEY = value` joined to `KEY=value`; parentheses kept (sources need them). */
function words(text: string): string[] {
  return text.replace(/\s*=\s*/g, "=").split(/\s+/).filter((w) => w !== "");
}

function isKeyValue(w: string): boolean {
  return /^[A-Za-z_][\w.]*=/.test(w);
}

function splitKeyValues(ws: readonly string[]): { positional: string[]; keyed: Map<string, string>; flags: string[] } {
  const positional: string[] = [];
  const keyed = new Map<string, string>();
  const flags: string[] = [];
  for (const w of ws) {
    if (isKeyValue(w)) {
      const eq = w.indexOf("=");
      keyed.set(w.slice(0, eq).toUpperCase(), w.slice(eq + 1));
    } else if (/^off$/i.test(w)) flags.push("OFF");
    else positional.push(w);
  }
  return { positional, keyed, flags };
}

function numberOf(raw: string, what: string): number | { problem: string } {
  const v = parseSpiceNumber(raw);
  return v === undefined ? { problem: `cannot read ${what} '${raw}' as a number` } : v;
}

/** Reads `M=` (parallel copies) and the parameters we pass by; any other key is a problem. */
function readKeyed(keyed: Map<string, string>, allowed: readonly string[], ignorable: readonly string[]): { values: Map<string, number>; ignored: string[] } | { problem: string } {
  const values = new Map<string, number>();
  const ignored: string[] = [];
  for (const [key, raw] of keyed) {
    if (allowed.includes(key)) {
      const v = numberOf(raw, key);
      if (typeof v !== "number") return v;
      values.set(key, v);
    } else if (ignorable.includes(key) || TRANSIENT_ONLY.has(key)) ignored.push(`${key}=${raw}`);
    else return { problem: `instance parameter ${key}=${raw} is not supported` };
  }
  return { values, ignored };
}

function readPassive(kind: "R" | "C" | "L", name: string, line: number, rest: string[]): ReadStatement {
  const { positional, keyed, flags } = splitKeyValues(rest);
  const [a, b, valueWord] = positional;
  if (a === undefined || b === undefined) return { problem: `${name} needs two nodes and a value, as in '${name} 1 2 10k'` };
  const valueKey = { R: ["R", "RESISTANCE"], C: ["C", "CAPACITANCE"], L: ["L", "INDUCTANCE"] }[kind];
  const rawValue = valueWord ?? valueKey.map((k) => keyed.get(k)).find((v) => v !== undefined);
  for (const k of valueKey) keyed.delete(k);
  if (rawValue === undefined) return { problem: `${name} has no value` };
  if (positional.length > 3) return { problem: `${name}: '${positional.slice(3).join(" ")}' after the value is not supported (semiconductor resistors and capacitors need a model we do not have)` };
  const value = numberOf(rawValue, `the value of ${name}`);
  if (typeof value !== "number") return value;
  const extra = readKeyed(keyed, ["M"], ["TC", "TC1", "TC2", "NOISY", "SCALE", "AC"]);
  if ("problem" in extra) return extra;
  const m = extra.values.get("M") ?? 1;
  if (!(m > 0)) return { problem: `${name}: multiplier M=${m} must be positive` };
  // M parallel copies: R and L divide, C multiplies (as SPICE does).
  const scaled = kind === "C" ? value * m : value / m;
  return { statement: { kind, name, line, nodes: [a.toUpperCase(), b.toUpperCase()], value: scaled }, ignored: [...extra.ignored, ...flags] };
}

function readSource(kind: "V" | "I", name: string, line: number, rest: string[]): ReadStatement {
  const [pos, neg, ...spec] = rest;
  if (pos === undefined || neg === undefined) return { problem: `${name} needs two nodes, as in '${name} 1 0 DC 5'` };
  const text = spec.join(" ");
  const read = text.trim() === "" ? { dc: 0 } : parseSourceSpec(text);
  if ("error" in read) return { problem: `${name}: ${read.error}` };
  const ignored = read.waveform !== undefined ? [`${read.waveform} waveform (its value at time zero, ${read.dc ?? 0}, is used)`] : [];
  return {
    statement: { kind, name, line, nodes: [pos.toUpperCase(), neg.toUpperCase()], dc: read.dc ?? 0, ...(read.ac !== undefined ? { ac: read.ac } : {}) },
    ignored,
  };
}

const DEVICE_NODES: Record<"D" | "J" | "M", number> = { D: 2, J: 3, M: 4 };

function readDevice(kind: "D" | "Q" | "J" | "M", name: string, line: number, rest: string[]): ReadStatement {
  const { positional, keyed, flags } = splitKeyValues(rest);
  let nodeCount: number;
  if (kind === "Q") {
    // `Q c b e model [area]` or `Q c b e substrate model [area]`: a number in fifth place is an area.
    const fifth = positional[4];
    nodeCount = positional.length >= 6 || (fifth !== undefined && parseSpiceNumber(fifth) === undefined) ? 4 : 3;
  } else nodeCount = DEVICE_NODES[kind];
  const nodes = positional.slice(0, nodeCount).map((n) => n.toUpperCase());
  const model = positional[nodeCount];
  if (nodes.length < nodeCount || model === undefined) {
    const example = { D: "D1 A K DMOD", Q: "Q1 C B E QMOD", J: "J1 D G S JMOD", M: "M1 D G S B MMOD" }[kind];
    return { problem: `${name} needs ${nodeCount} nodes and a model name, as in '${example}'` };
  }
  const after = positional.slice(nodeCount + 1);
  if (after.length > (kind === "M" ? 0 : 1)) return { problem: `${name}: '${after.join(" ")}' after the model name is not understood` };
  if (kind === "M") {
    const m = keyed.get("M");
    if (m !== undefined && parseSpiceNumber(m) !== 1) return { problem: `${name}: the MOSFET multiplier M=${m} is not supported; write the copies out` };
    keyed.delete("M");
  }
  const allowed = kind === "M" ? ["W", "L"] : ["AREA", "M"];
  const ignorable = kind === "M" ? ["AD", "AS", "PD", "PS", "NRD", "NRS"] : [];
  const extra = readKeyed(keyed, allowed, ignorable);
  if ("problem" in extra) return { problem: `${name}: ${extra.problem}` };
  const statement: SubcktDevice = { kind, name, line, nodes, model: model.toUpperCase() };
  if (kind === "M") {
    const w = extra.values.get("W");
    const l = extra.values.get("L");
    if (w !== undefined) statement.w = w;
    if (l !== undefined) statement.l = l;
  } else {
    const positionalArea = after[0] !== undefined ? numberOf(after[0], `the area of ${name}`) : undefined;
    if (positionalArea !== undefined && typeof positionalArea !== "number") return positionalArea;
    const area = (positionalArea ?? extra.values.get("AREA") ?? 1) * (extra.values.get("M") ?? 1);
    if (!(area > 0)) return { problem: `${name}: area ${area} must be positive` };
    if (area !== 1) statement.area = area;
  }
  const ignored = [...extra.ignored, ...flags];
  if (kind === "Q" && nodeCount === 4) ignored.push(`substrate node ${nodes[3]} (the Gummel–Poon model here has no substrate junction)`);
  if (kind === "Q") statement.nodes = nodes.slice(0, 3);
  return { statement, ignored };
}

function readInstance(name: string, line: number, rest: string[]): ReadStatement {
  if (rest.some((w) => isKeyValue(w) || /^params:$/i.test(w))) {
    return { problem: `${name}: parameters passed to a subcircuit are not supported (expressions are not evaluated)` };
  }
  const subckt = rest[rest.length - 1];
  if (subckt === undefined) return { problem: `${name} needs its nodes and a subcircuit name, as in '${name} 1 2 3 SUBNAME'` };
  return { statement: { kind: "X", name, line, nodes: rest.slice(0, -1).map((n) => n.toUpperCase()), subckt: subckt.toUpperCase() }, ignored: [] };
}

/** One element statement of a subcircuit body. */
export function readSubcktStatement(text: string, line: number): ReadStatement {
  if (/[{}']/.test(text)) return { problem: "expressions ({…} or '…') are not evaluated; write the numbers out" };
  const [first, ...rest] = words(text);
  const name = (first ?? "").toUpperCase();
  const letter = name.charAt(0);
  switch (letter) {
    case "R": case "C": case "L": return readPassive(letter, name, line, rest);
    case "V": case "I": return readSource(letter, name, line, rest);
    case "D": case "Q": case "J": case "M": return readDevice(letter, name, line, rest);
    case "X": return readInstance(name, line, rest);
    default: {
      const what = LETTER_NAMES[letter];
      return { problem: `element ${name}${what ? ` (${what})` : ""} is not supported in a subcircuit; supported: R, C, L, V, I, D, Q, J, M and X` };
    }
  }
}

/** Pins and problems of a `.subckt NAME pins… [params: …]` line. */
export function readSubcktHeader(text: string): { name: string; pins: string[]; problem?: string } {
  const ws = words(text).slice(1);
  const name = ws[0] ?? "";
  const rest = ws.slice(1);
  const paramsAt = rest.findIndex((w) => isKeyValue(w) || /^params:/i.test(w));
  const pins = (paramsAt < 0 ? rest : rest.slice(0, paramsAt)).map((p) => p.toUpperCase());
  if (name === "") return { name: "?", pins, problem: "a .subckt line needs a name and its pins, as in '.subckt NAME A B C'" };
  if (paramsAt >= 0) return { name, pins, problem: `subcircuit ${name} takes parameters ('${rest.slice(paramsAt).join(" ")}'): parameters and expressions are not supported` };
  if (pins.length === 0) return { name, pins, problem: `subcircuit ${name} has no pins` };
  const seen = new Set<string>();
  for (const p of pins) {
    if (seen.has(p)) return { name, pins, problem: `subcircuit ${name} names pin ${p} twice` };
    seen.add(p);
  }
  return { name, pins };
}

/** The definition named `name`, compared case-insensitively as SPICE does. */
export function findSubcircuit(defs: readonly SubcircuitDef[], name: string): SubcircuitDef | undefined {
  const want = name.trim().toUpperCase();
  return defs.find((d) => d.name.toUpperCase() === want);
}
