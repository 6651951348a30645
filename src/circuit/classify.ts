// What a symbol is (resistor, NPN, dual-gate MOSFET …) and which of its pins plays which role.
// Evidence, strongest first: simulator fields (Sim.Device, Spice_Primitive), the library id, a known part
// name in the value, the reference prefix, the pin names. A transistor whose polarity nothing tells is
// "other": the kind is never guessed. Roles come from pin names, then the `Q_NPN_EBC`-style letter order
// of the library id, then Sim.Pins, then Spice_Node_Sequence, then the usual package of a named part.
import type { PartKind, PinRoles } from "./types.js";
import { lookupPartName } from "./part-names.js";
import { parseSimPins } from "./source-spec.js";

export interface ClassifyInput {
  ref: string;
  libId: string;
  value: string;
  /** Pin number → pin name as drawn. */
  pinNames: Record<string, string>;
  /** Pin number → electrical type (`passive`, `input`, `power_in`, `no_connect` …). */
  pinTypes: Record<string, string>;
  fields: Record<string, string>;
  isPowerSymbol: boolean;
}

export interface Classification {
  kind: PartKind;
  roles: PinRoles;
}

/** The roles a kind needs before it can be simulated. */
export const REQUIRED_ROLES: Record<PartKind, readonly string[]> = {
  resistor: ["1", "2"],
  capacitor: ["1", "2"],
  "polarized-capacitor": ["+", "-"],
  inductor: ["1", "2"],
  diode: ["A", "K"],
  zener: ["A", "K"],
  npn: ["B", "C", "E"],
  pnp: ["B", "C", "E"],
  njfet: ["G", "D", "S"],
  pjfet: ["G", "D", "S"],
  nmos: ["G", "D", "S"],
  pmos: ["G", "D", "S"],
  "dual-gate-mosfet": ["G1", "G2", "D", "S"],
  "voltage-source": ["+", "-"],
  "current-source": ["+", "-"],
  battery: ["+", "-"],
  connector: [],
  "power-flag": [],
  other: [],
};

function field(fields: Record<string, string>, name: string): string | undefined {
  const want = name.toLowerCase();
  for (const [k, v] of Object.entries(fields)) {
    if (k.toLowerCase() === want && v.trim() !== "" && v.trim() !== "~") return v.trim();
  }
  return undefined;
}

function splitLibId(libId: string): { lib: string; name: string } {
  const i = libId.indexOf(":");
  return i < 0 ? { lib: "", name: libId } : { lib: libId.slice(0, i), name: libId.slice(i + 1) };
}

/** Leading letters of the reference: `RV1` → `RV`, `BT1` → `BT`, `#PWR03` → `#PWR`. */
function refPrefix(ref: string): string {
  return /^#?[A-Za-z]*/.exec(ref)?.[0].toUpperCase() ?? "";
}

type Family = "bjt" | "jfet" | "mos" | "diode" | "fet";

interface Evidence {
  kind?: PartKind;
  family?: Family;
}

function kindFromSimDevice(device: string, libName: string): Evidence | undefined {
  switch (device.toUpperCase()) {
    case "R": return { kind: "resistor" };
    case "C": return { kind: isPolarizedName(libName) ? "polarized-capacitor" : "capacitor" };
    case "L": return { kind: "inductor" };
    case "D": return { family: "diode" };
    case "NPN": return { kind: "npn" };
    case "PNP": return { kind: "pnp" };
    case "NJFET": return { kind: "njfet" };
    case "PJFET": return { kind: "pjfet" };
    case "NMOS": return { kind: "nmos" };
    case "PMOS": return { kind: "pmos" };
    case "V": return { kind: /battery/i.test(libName) ? "battery" : "voltage-source" };
    case "I": return { kind: "current-source" };
    default: return undefined; // SUBCKT, SPICE, XSPICE …: look at the other evidence
  }
}

function kindFromSpicePrimitive(prim: string, libName: string): Evidence | undefined {
  switch (prim.toUpperCase()) {
    case "R": return { kind: "resistor" };
    case "C": return { kind: isPolarizedName(libName) ? "polarized-capacitor" : "capacitor" };
    case "L": return { kind: "inductor" };
    case "D": return { family: "diode" };
    case "Q": return { family: "bjt" };
    case "J": return { family: "jfet" };
    case "M": return { family: "mos" };
    case "V": return { kind: /battery/i.test(libName) ? "battery" : "voltage-source" };
    case "I": return { kind: "current-source" };
    default: return undefined;
  }
}

function isPolarizedName(name: string): boolean {
  return /^(C_Polarized|CP(\d|_|$)|C_Pol)/i.test(name);
}

function kindFromLibId(libId: string): Evidence | undefined {
  const { lib, name } = splitLibId(libId);
  if (/^power$/i.test(lib)) return { kind: "power-flag" };
  if (/^Connector/i.test(lib) || /^Conn_/i.test(name)) return { kind: "connector" };
  if (/^R(_Small)?(_US)?$/.test(name)) return { kind: "resistor" };
  if (isPolarizedName(name)) return { kind: "polarized-capacitor" };
  if (/^C(_Small)?(_US)?$|^C_(Variable|Trim)/.test(name)) return { kind: "capacitor" };
  if (/^L(_Small)?(_US)?$|^L_(Core|Ferrite|Iron|Air)/.test(name)) return { kind: "inductor" };
  if (/^D_Zener|^DZ(_|$)/i.test(name)) return { kind: "zener" };
  if (/^(D|D_Schottky|D_Small|LED)(_Small)?(_ALT)?(_Filled)?$/.test(name)) return { kind: "diode" };
  if (/^Battery(_Cell)?$/i.test(name)) return { kind: "battery" };
  let m = /^Q_(NPN|PNP)(_Darlington)?(_[BCE]+)?$/.exec(name);
  if (m) return { kind: m[1] === "NPN" ? "npn" : "pnp" };
  m = /^Q_(NJFET|PJFET)(_[DGS]+)?$/.exec(name);
  if (m) return { kind: m[1] === "NJFET" ? "njfet" : "pjfet" };
  if (/dual.?gate/i.test(name)) return { kind: "dual-gate-mosfet" };
  m = /^Q_(NMOS|PMOS)(_[DGSB]+)?$/.exec(name);
  if (m) return { kind: m[1] === "NMOS" ? "nmos" : "pmos" };
  if (/^Simulation_SPICE$/i.test(lib)) {
    if (name === "0") return { kind: "power-flag" };
    if (/^V[A-Z]*$/.test(name)) return { kind: "voltage-source" };
    if (/^I[A-Z]*$/.test(name)) return { kind: "current-source" };
    const sim = kindFromSimDevice(name, name);
    if (sim) return sim;
  }
  if (/^Transistor_BJT$/i.test(lib)) return { family: "bjt" };
  if (/^Transistor_FET$/i.test(lib)) return { family: "fet" };
  if (/^Diode$/i.test(lib)) return { family: "diode" };
  return undefined;
}

function kindFromRefPrefix(prefix: string, pinNames: string[]): Evidence | undefined {
  switch (prefix) {
    case "R": return { kind: "resistor" };
    case "C": return { kind: pinNames.includes("+") ? "polarized-capacitor" : "capacitor" };
    case "L": return { kind: "inductor" };
    case "D": return { family: "diode" };
    case "BT": return { kind: "battery" };
    case "V": return { kind: "voltage-source" };
    case "I": return { kind: "current-source" };
    case "J": case "P": case "CN": case "X": return { kind: "connector" };
    case "Q": case "T": return {};
    default: return prefix.startsWith("#") ? { kind: "power-flag" } : undefined;
  }
}

/** Upper-case pin name without KiCad markup (`~{…}`, `_{…}`, `^{…}`); "" for unnamed (`~`). */
function cleanPinName(name: string): string {
  const n = name.replace(/[~_^]\{([^}]*)\}/g, "$1").trim().toUpperCase().replace(/\u2212/g, "-");
  return n === "~" ? "" : n;
}

const ROLE_ALIASES: Record<string, readonly string[]> = {
  B: ["B", "BASE"],
  C: ["C", "COLLECTOR", "COL"],
  E: ["E", "EMITTER", "EMIT"],
  G: ["G", "GATE"],
  D: ["D", "DRAIN"],
  S: ["S", "SOURCE"],
  G1: ["G1", "GATE1", "GATE 1", "GATE_1"],
  G2: ["G2", "GATE2", "GATE 2", "GATE_2"],
  A: ["A", "ANODE"],
  K: ["K", "CATHODE", "KATHODE"],
  "+": ["+", "POS", "PLUS", "P"],
  "-": ["-", "NEG", "MINUS", "N"],
  BULK: ["B", "BULK", "SUBSTRATE", "SUB"],
};

function roleOfName(name: string, kind: PartKind): string | undefined {
  const n = cleanPinName(name);
  if (n === "") return undefined;
  const want = [...REQUIRED_ROLES[kind]];
  if (kind === "nmos" || kind === "pmos") want.push("BULK");
  for (const role of want) {
    if ((ROLE_ALIASES[role] ?? [role]).includes(n)) return role === "BULK" ? "B" : role;
  }
  return undefined;
}

/** Pin numbers in natural order ("2" before "10"). */
function pinNumbers(input: ClassifyInput): string[] {
  const all = new Set([...Object.keys(input.pinNames), ...Object.keys(input.pinTypes)]);
  return [...all]
    .filter((p) => input.pinTypes[p] !== "no_connect")
    .sort((a, b) => a.localeCompare(b, "en", { numeric: true }));
}

function assign(roles: PinRoles, role: string, pin: string): void {
  if (roles[role] === undefined) roles[role] = pin;
}

function rolesFromNames(input: ClassifyInput, kind: PartKind, pins: string[]): PinRoles {
  const roles: PinRoles = {};
  for (const p of pins) {
    const role = roleOfName(input.pinNames[p] ?? "", kind);
    if (role) assign(roles, role, p);
  }
  return roles;
}

/** `Q_NPN_EBC` → pin 1 E, 2 B, 3 C; `Q_NMOS_GDSB`; `Q_NPN_BCEC` (second C is the tab). */
function rolesFromLibLetters(libId: string, kind: PartKind, pins: string[]): PinRoles {
  const { name } = splitLibId(libId);
  const m = /_([BCEGDS]{3,4})$/.exec(name);
  if (!m || !/^Q_/.test(name)) return {};
  const letters = [...(m[1] ?? "")];
  const roles: PinRoles = {};
  const isFet = kind === "njfet" || kind === "pjfet" || kind === "nmos" || kind === "pmos";
  letters.forEach((letter, i) => {
    const pin = pins.includes(String(i + 1)) || pins.length === 0 ? String(i + 1) : pins[i];
    if (pin === undefined) return;
    if (isFet && !"GDSB".includes(letter)) return;
    if (!isFet && !"BCE".includes(letter)) return;
    assign(roles, letter, pin);
  });
  return roles;
}

/** Sim.Pins maps symbol pins to model pins (`1=C 2=B 3=E`, `1=K 2=A`, `1=+ 2=-`). */
function rolesFromSimPins(text: string, kind: PartKind): PinRoles {
  const roles: PinRoles = {};
  const pairs = parseSimPins(text);
  const needed = REQUIRED_ROLES[kind];
  const modelOrder = SPICE_NODE_ORDER[kind] ?? [];
  for (const [pin, modelPin] of Object.entries(pairs)) {
    const byName = roleOfName(modelPin, kind);
    if (byName) {
      assign(roles, byName, pin);
      continue;
    }
    // Numbered model pins (`1=1 2=2`, or subcircuit node numbers): position in SPICE node order.
    const idx = Number(modelPin);
    const role = Number.isInteger(idx) ? modelOrder[idx - 1] : undefined;
    if (role && (needed.includes(role) || role === "B")) assign(roles, role, pin);
  }
  return roles;
}

/** SPICE element node order per kind. */
const SPICE_NODE_ORDER: Partial<Record<PartKind, readonly string[]>> = {
  resistor: ["1", "2"],
  capacitor: ["1", "2"],
  "polarized-capacitor": ["+", "-"],
  inductor: ["1", "2"],
  diode: ["A", "K"],
  zener: ["A", "K"],
  npn: ["C", "B", "E"],
  pnp: ["C", "B", "E"],
  njfet: ["D", "G", "S"],
  pjfet: ["D", "G", "S"],
  nmos: ["D", "G", "S", "B"],
  pmos: ["D", "G", "S", "B"],
  "voltage-source": ["+", "-"],
  "current-source": ["+", "-"],
  battery: ["+", "-"],
};

/** Spice_Node_Sequence lists symbol pin numbers in SPICE node order (`3 2 1` for a BJT = C B E). */
function rolesFromNodeSequence(text: string, kind: PartKind): PinRoles {
  const order = SPICE_NODE_ORDER[kind];
  if (!order) return {};
  const roles: PinRoles = {};
  text.trim().split(/[\s,]+/).forEach((pin, i) => {
    const role = order[i];
    if (role && pin !== "") assign(roles, role, pin);
  });
  return roles;
}

function rolesFromPackage(names: string[], kind: PartKind, pins: string[]): PinRoles {
  for (const n of names) {
    const known = lookupPartName(n);
    if (!known?.pinOrder || known.kind !== kind) continue;
    const roles: PinRoles = {};
    known.pinOrder.forEach((role, i) => {
      const pin = String(i + 1);
      if (pins.length === 0 || pins.includes(pin)) assign(roles, role, pin);
    });
    return roles;
  }
  return {};
}

/** Two-terminal parts with unnamed pins: pin 1 and pin 2. For a polarized capacitor, battery or
 * source pin 1 is +; for a diode pin 1 is the cathode — the KiCad library convention and the usual
 * package marking (INF for the library, from the symbols read while writing the reader notes). */
function rolesByNumber(kind: PartKind, pins: string[]): PinRoles {
  const [first, second] = pins.length >= 2 ? pins : ["1", "2"];
  if (first === undefined || second === undefined || pins.length > 2) return {};
  switch (kind) {
    case "resistor": case "capacitor": case "inductor":
      return { "1": first, "2": second };
    case "polarized-capacitor": case "battery": case "voltage-source": case "current-source":
      return { "+": first, "-": second };
    case "diode": case "zener":
      return { K: first, A: second };
    default:
      return {};
  }
}

function isComplete(roles: PinRoles, kind: PartKind): boolean {
  return REQUIRED_ROLES[kind].every((r) => roles[r] !== undefined);
}

function resolveRoles(input: ClassifyInput, kind: PartKind): PinRoles {
  const pins = pinNumbers(input);
  if (REQUIRED_ROLES[kind].length === 0) return {};
  const { name: symbolName } = splitLibId(input.libId);
  const passive = kind === "resistor" || kind === "capacitor" || kind === "inductor";
  const candidates: PinRoles[] = [];
  if (!passive) candidates.push(rolesFromNames(input, kind, pins));
  candidates.push(rolesFromLibLetters(input.libId, kind, pins));
  const simPins = field(input.fields, "Sim.Pins");
  if (simPins) candidates.push(rolesFromSimPins(simPins, kind));
  const sequence = field(input.fields, "Spice_Node_Sequence");
  if (sequence) candidates.push(rolesFromNodeSequence(sequence, kind));
  candidates.push(rolesFromPackage([input.value, symbolName], kind, pins));
  candidates.push(rolesByNumber(kind, pins));
  const complete = candidates.find((c) => isComplete(c, kind));
  if (complete) {
    const out = { ...complete };
    // A four-terminal MOSFET's bulk pin is named even when the roles came from elsewhere.
    if ((kind === "nmos" || kind === "pmos") && out.B === undefined) {
      const bulk = rolesFromNames(input, kind, pins).B;
      if (bulk !== undefined && !Object.values(out).includes(bulk)) out.B = bulk;
    }
    return out;
  }
  // Partial: the one that says most; the rules report the missing roles.
  let best: PinRoles = {};
  for (const c of candidates) if (Object.keys(c).length > Object.keys(best).length) best = c;
  return best;
}

const HINT_FIELDS = ["Description", "ki_description", "ki_keywords", "Sim.Name", "Spice_Model"];

/** Polarity or device type from words: `NPN`, `N-Channel MOSFET`, `N-JFET`, `Zener`. */
function kindFromWords(text: string, family: Family | undefined): PartKind | undefined {
  const t = ` ${text.toUpperCase()} `;
  const has = (re: RegExp): boolean => re.test(t);
  if (family === undefined || family === "bjt") {
    if (has(/\bNPN\b/) && !has(/\bPNP\b/)) return "npn";
    if (has(/\bPNP\b/) && !has(/\bNPN\b/)) return "pnp";
  }
  if (family === undefined || family === "fet" || family === "mos" || family === "jfet") {
    if (has(/DUAL[- ]?GATE|TETRODE/)) return "dual-gate-mosfet";
    const jfet = has(/JFET|\bJ-?FET\b|\bNJF\b|\bPJF\b/);
    const mos = has(/MOSFET|\bMOS\b|NMOS|PMOS/);
    const n = has(/\bN-?CHANNEL\b|\bN-CH\b|\bNCH\b|\bN-JFET\b|\bNJFET\b|\bNMOS\b|\bNJF\b/);
    const p = has(/\bP-?CHANNEL\b|\bP-CH\b|\bPCH\b|\bP-JFET\b|\bPJFET\b|\bPMOS\b|\bPJF\b/);
    if (n !== p) {
      if (jfet || family === "jfet") return n ? "njfet" : "pjfet";
      if (mos || family === "mos") return n ? "nmos" : "pmos";
    }
  }
  if (family === undefined || family === "diode") {
    if (has(/ZENER/)) return "zener";
  }
  return undefined;
}

function fitsFamily(kind: PartKind, family: Family | undefined): boolean {
  switch (family) {
    case undefined: return true;
    case "bjt": return kind === "npn" || kind === "pnp";
    case "jfet": return kind === "njfet" || kind === "pjfet";
    case "mos": return kind === "nmos" || kind === "pmos" || kind === "dual-gate-mosfet";
    case "fet": return kind === "njfet" || kind === "pjfet" || kind === "nmos" || kind === "pmos" || kind === "dual-gate-mosfet";
    case "diode": return kind === "diode" || kind === "zener";
  }
}

/** Names a model or part may go by: the value, the symbol name, a SPICE model name without its
 * element letter (`Q2N3904` → `2N3904`, `D1N4148` → `1N4148`). */
function candidateNames(input: ClassifyInput): string[] {
  const names = [input.value, splitLibId(input.libId).name];
  for (const f of ["Sim.Name", "Spice_Model"]) {
    const v = field(input.fields, f);
    if (v) names.push(v, v.replace(/^[QDJM](?=\d)/i, ""));
  }
  return names.filter((n) => n.trim() !== "");
}

function pinNameSet(input: ClassifyInput): string[] {
  return Object.values(input.pinNames).map(cleanPinName).filter((n) => n !== "");
}

/** Device family from pin names alone: B/C/E, G/D/S, G1/G2. */
function familyFromPins(names: string[]): { family?: Family; kind?: PartKind } {
  const has = (n: string): boolean => names.includes(n);
  if (has("G1") && has("G2") && has("D") && has("S")) return { kind: "dual-gate-mosfet" };
  if (has("B") && has("C") && has("E")) return { family: "bjt" };
  if (has("G") && has("D") && has("S")) return { family: "fet" };
  if (has("A") && has("K")) return { family: "diode" };
  return {};
}

/** Decides kind and pin roles from everything a symbol carries. */
export function classifyPart(input: ClassifyInput): Classification {
  const { name: symbolName } = splitLibId(input.libId);
  if (input.isPowerSymbol) return { kind: "power-flag", roles: {} };
  const pinNames = pinNameSet(input);

  const evidence: Evidence[] = [];
  const simDevice = field(input.fields, "Sim.Device");
  if (simDevice) {
    const s = kindFromSimDevice(simDevice, symbolName);
    if (s) evidence.push(s);
  }
  const prim = field(input.fields, "Spice_Primitive");
  if (prim) {
    const s = kindFromSpicePrimitive(prim, symbolName);
    if (s) evidence.push(s);
  }
  const fromLib = kindFromLibId(input.libId);
  if (fromLib) evidence.push(fromLib);
  const fromPins = familyFromPins(pinNames);

  let kind = evidence.find((e) => e.kind !== undefined)?.kind;
  const family = evidence.find((e) => e.family !== undefined)?.family ?? fromPins.family;

  // A known part number refines a family (Transistor_BJT:2N3904) and classifies a bare symbol.
  if (kind === undefined) {
    for (const n of candidateNames(input)) {
      const known = lookupPartName(n);
      if (known && fitsFamily(known.kind, family)) {
        kind = known.kind;
        break;
      }
    }
  }
  // A plain diode symbol carrying a zener's part number is a zener.
  if (kind === "diode") {
    const known = candidateNames(input).map(lookupPartName).find((k) => k !== undefined);
    if (known?.kind === "zener") kind = "zener";
  }
  if (kind === undefined && fromPins.kind) kind = fromPins.kind;
  if (kind === undefined) {
    const words = [symbolName, input.value, ...HINT_FIELDS.map((f) => field(input.fields, f) ?? "")].join(" ");
    const fromWords = kindFromWords(words, family);
    if (fromWords && fitsFamily(fromWords, family)) kind = fromWords;
  }
  if (kind === undefined && family === "diode") kind = "diode";
  if (kind === undefined && family === undefined) {
    const byRef = kindFromRefPrefix(refPrefix(input.ref), pinNames);
    if (byRef?.kind) kind = byRef.kind;
    else if (byRef?.family === "diode") kind = "diode";
  }
  if (kind === undefined) kind = "other";
  return { kind, roles: resolveRoles(input, kind) };
}
