// Builds a Circuit in memory from a SPICE-like list, for tests of the Context that should not
// depend on the reader: "R1 vcc b2 12k", "Q2 c2 b2 c1 npn" (C B E), "J1 d g s njfet" (D G S).
import type { Circuit, Net, Part, PartKind } from "../../src/circuit/types.js";

const PREFIX: Record<string, number> = { f: 1e-15, p: 1e-12, n: 1e-9, u: 1e-6, m: 1e-3, k: 1e3, M: 1e6, G: 1e9 };

function number(text: string): number | undefined {
  const m = /^([0-9.]+)([fpnumkMG]?)/.exec(text);
  if (!m) return undefined;
  return Number(m[1]) * (PREFIX[m[2] ?? ""] ?? 1);
}

const ROLES: Record<string, string[]> = {
  npn: ["C", "B", "E"], pnp: ["C", "B", "E"], njfet: ["D", "G", "S"], pjfet: ["D", "G", "S"],
  nmos: ["D", "G", "S"], pmos: ["D", "G", "S"], "dual-gate-mosfet": ["D", "G1", "G2", "S"],
};

export function buildCircuit(lines: string[], options: { ground?: string[]; power?: string[] } = {}): Circuit {
  const ground = new Set(options.ground ?? ["GND"]);
  const power = new Set(options.power ?? []);
  const parts: Part[] = [];
  let line = 0;
  for (const text of lines) {
    line++;
    const [ref = "", ...rest] = text.trim().split(/\s+/);
    const letter = ref[0] ?? "";
    let kind: PartKind;
    let nets: string[];
    let value = "";
    const roles: Record<string, string> = {};
    if (letter === "Q" || letter === "J" || letter === "M") {
      const type = rest[rest.length - 1] as PartKind;
      kind = type;
      nets = rest.slice(0, -1);
      (ROLES[type] ?? []).forEach((role, i) => (roles[role] = String(i + 1)));
      value = type;
    } else {
      kind = letter === "R" ? "resistor" : letter === "C" ? (rest[3] === "pol" ? "polarized-capacitor" : "capacitor")
        : letter === "L" ? "inductor" : letter === "B" ? "battery" : letter === "D" ? "diode" : "other";
      nets = rest.slice(0, 2);
      value = rest[2] ?? "";
      if (kind === "polarized-capacitor" || kind === "battery") { roles["+"] = "1"; roles["-"] = "2"; }
      else if (kind === "diode") { roles.A = "1"; roles.K = "2"; }
      else { roles["1"] = "1"; roles["2"] = "2"; }
    }
    const pins: Record<string, string> = {};
    nets.forEach((n, i) => (pins[String(i + 1)] = n));
    const parsedNumber = number(value);
    parts.push({
      ref, value, kind, libId: `test:${kind}`, footprint: "", pins, pinNames: {}, roles, fields: {},
      parsed: parsedNumber === undefined ? { text: value } : { text: value, number: parsedNumber },
      dnp: false, excludedFromSim: false, origin: { file: "test.net", line, column: 1, sheetPath: "/" },
    });
  }
  const netNames = new Set(parts.flatMap((p) => Object.values(p.pins)));
  const nets: Net[] = [...netNames].sort().map((name) => ({
    name, aliases: [name],
    pins: parts.flatMap((p) => Object.entries(p.pins).filter(([, n]) => n === name).map(([pin]) => ({ ref: p.ref, pin }))),
    isGround: ground.has(name), isPower: power.has(name) || /^\+/.test(name), noConnect: false,
  }));
  return { file: "test.net", format: "kicad_net", version: "E", parts, nets, sheets: [{ path: "/", file: "test.net" }], notes: [], modelLibraries: [] };
}
