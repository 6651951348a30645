import { describe, expect, it } from "vitest";
import { buildSolverCircuit } from "../src/solve/from-circuit.js";
import { solveOperatingPoint } from "../src/solve/index.js";
import type { OperatingPoint } from "../src/solve/index.js";
import { findModelCard, parseModelCards } from "../src/solve/spice-card.js";
import { opValue, readDeck, referenceRuns } from "./support/ngspice.js";
import { parseValue } from "../src/circuit/value.js";
import type { Circuit, Net, Part, PartKind, PinRoles } from "../src/circuit/types.js";
import type { Element } from "../src/solve/netlist.js";

// Circuits are built by hand here, as the reader would produce them; no files are read.

interface PartSpec {
  kind: PartKind;
  value: string;
  /** role → net; pin numbers are assigned 1, 2, 3 … in this order. */
  nets: Record<string, string>;
  libId?: string;
  footprint?: string;
  fields?: Record<string, string>;
  dnp?: boolean;
}

function part(ref: string, spec: PartSpec): Part {
  const pins: Record<string, string> = {};
  const roles: PinRoles = {};
  Object.entries(spec.nets).forEach(([role, net], i) => {
    const pin = String(i + 1);
    pins[pin] = net;
    roles[role] = pin;
  });
  const fields = spec.fields ?? {};
  return {
    ref, value: spec.value, parsed: parseValue(spec.value, spec.kind, fields), kind: spec.kind, libId: spec.libId ?? "",
    footprint: spec.footprint ?? "", pins, pinNames: {}, roles, fields, dnp: spec.dnp ?? false, excludedFromSim: false,
    origin: { file: "board.kicad_sch", line: 1, column: 1, sheetPath: "/" },
  };
}

function circuit(parts: Part[], power: string[] = [], extra: Partial<Circuit> = {}): Circuit {
  const names = new Set<string>();
  for (const p of parts) for (const n of Object.values(p.pins)) names.add(n);
  for (const n of power) names.add(n);
  const nets: Net[] = [...names].map((name) => ({
    name, aliases: [name], pins: [], isGround: name === "GND", isPower: power.includes(name) || name === "GND", noConnect: false,
  }));
  return { file: "boards/demo.kicad_sch", format: "kicad_sch", version: "20231120", parts, nets, sheets: [], notes: [], modelLibraries: [], ...extra };
}

const R = (ref: string, value: string, a: string, b: string, extra: Partial<PartSpec> = {}): Part =>
  part(ref, { kind: "resistor", value, nets: { "1": a, "2": b }, libId: "Device:R", ...extra });
const C = (ref: string, value: string, a: string, b: string, extra: Partial<PartSpec> = {}): Part =>
  part(ref, { kind: "capacitor", value, nets: { "1": a, "2": b }, libId: "Device:C", footprint: "Capacitor_SMD:C_0603_1608Metric", ...extra });
const CP = (ref: string, value: string, plus: string, minus: string): Part =>
  part(ref, { kind: "polarized-capacitor", value, nets: { "+": plus, "-": minus }, libId: "Device:C_Polarized", footprint: "Capacitor_THT:CP_Radial_D6.3mm_P2.50mm" });

function byName(elements: Element[], name: string): Element | undefined {
  return elements.find((e) => e.name === name);
}

/** The CE stage of shared/notes/ngspice/ce_9v_2n3904.cir (reference-data §6.5), drawn as a schematic:
 * +9V power symbol, divider 56k/10k, RC 3k9, RE 680 with 100 µF bypass, coupling caps, 10k load. */
function ceStage(): Circuit {
  return circuit(
    [
      R("R1", "56k", "+9V", "/B"),
      R("R2", "10k", "/B", "GND"),
      R("R3", "3k9", "+9V", "/C"),
      R("R4", "680", "/E", "GND"),
      CP("C1", "100uF 16V", "/E", "GND"),
      part("Q1", { kind: "npn", value: "2N3904", nets: { C: "/C", B: "/B", E: "/E" }, libId: "Transistor_BJT:2N3904" }),
      part("V1", { kind: "voltage-source", value: "DC 0", nets: { "+": "/IN", "-": "GND" }, fields: { "Sim.Device": "V", "Sim.Params": "dc=0 ac=1" } }),
      CP("C2", "10uF", "/B", "/IN"),
      CP("C3", "10uF", "/C", "/OUT"),
      R("R5", "10k", "/OUT", "GND"),
    ],
    ["+9V"],
  );
}

describe("a CE stage becomes the ngspice deck's elements (shared/notes/ngspice/ce_9v_2n3904.cir)", () => {
  const built = buildSolverCircuit(ceStage(), { railVolts: {} });
  const els = built.solver.elements;

  it("has one element per deck line, on the deck's nodes", () => {
    // Deck: VCC vcc 0 DC 9 / R1 vcc b 56k / R2 b 0 10k / RC vcc c 3.9k / RE e 0 680 / CE e 0 100u /
    // Q1 c b e Q2N3904 / VIN in 0 DC 0 AC 1 / CIN in b 10u / COUT c out 10u / RL out 0 10k
    expect(byName(els, "Vrail_+9V")).toEqual({ kind: "V", name: "Vrail_+9V", pos: "+9V", neg: "0", dc: 9 });
    expect(byName(els, "R1")).toEqual({ kind: "R", name: "R1", a: "+9V", b: "/B", ohms: 56e3 });
    expect(byName(els, "R2")).toEqual({ kind: "R", name: "R2", a: "/B", b: "0", ohms: 10e3 });
    expect(byName(els, "R3")).toMatchObject({ a: "+9V", b: "/C", ohms: 3900 });
    expect(byName(els, "R4")).toMatchObject({ a: "/E", b: "0", ohms: 680 });
    expect(byName(els, "C1")).toMatchObject({ kind: "C", a: "/E", b: "0", farads: 100e-6 });
    expect(byName(els, "Q1")).toMatchObject({ kind: "Q", c: "/C", b: "/B", e: "/E" });
    expect(byName(els, "V1")).toMatchObject({ kind: "V", pos: "/IN", neg: "0", dc: 0, ac: 1 });
    expect(byName(els, "C2")).toMatchObject({ kind: "C", a: "/B", b: "/IN", farads: 10e-6 });
    expect(byName(els, "R5")).toMatchObject({ a: "/OUT", b: "0", ohms: 10e3 });
    expect(els).toHaveLength(11);
    expect(built.unmodelled).toEqual([]);
    expect(built.nodeOfNet).toMatchObject({ GND: "0", "+9V": "+9V", "/B": "/B" });
  });

  it("gives the transistor the 2N3904 card of the deck and its ratings", () => {
    const q = byName(els, "Q1");
    if (q?.kind !== "Q") throw new Error("Q1 missing");
    expect(q.model.type).toBe("NPN");
    expect(q.model.params.IS).toBeCloseTo(6.734e-15, 20);
    expect(q.model.params.BF).toBe(416.4);
    expect(q.model.params.IKF).toBeCloseTo(66.78e-3, 12);
    expect(built.ratings.Q1?.vceo).toBe(40);
  });

  it("puts the electrolytic's ESR/ESL from the parasitics table on C1 (100 µF / 16 V → 1.6 Ω, ≈10 nH)", () => {
    expect(byName(els, "C1")).toMatchObject({ esr: 1.6, esl: 10e-9 });
  });

  it("solves to ngspice 39's operating point: v(b) 1.305896, v(c) 5.337942, v(e) 0.6431401 V (reference-data §6.5 [SIM])", () => {
    const op = solveOperatingPoint(built.solver);
    expect(op.converged).toBe(true);
    const v = op.nodeVoltages;
    expect(Math.abs((v["/B"] ?? 0) - 1.305896) / 1.305896).toBeLessThan(2e-3);
    expect(Math.abs((v["/C"] ?? 0) - 5.337942) / 5.337942).toBeLessThan(2e-3);
    expect(Math.abs((v["/E"] ?? 0) - 0.6431401) / 0.6431401).toBeLessThan(2e-3);
  });
});

describe("rails", () => {
  it("from names (+9V, +3V3, -5V, a sub-sheet's /preamp/+5V) and from railVolts (VCC); unknown ones are a note", () => {
    const c = circuit(
      [R("R1", "1k", "+9V", "GND"), R("R2", "1k", "+3V3", "GND"), R("R3", "1k", "-5V", "GND"), R("R4", "1k", "VCC", "GND"), R("R5", "1k", "VBIAS", "GND"), R("R6", "1k", "/preamp/+5V", "GND")],
      ["+9V", "+3V3", "-5V", "VCC", "VBIAS", "/preamp/+5V"],
    );
    const built = buildSolverCircuit(c, { railVolts: { VCC: 12 } });
    const rails = Object.fromEntries(built.solver.elements.filter((e) => e.kind === "V").map((e) => [e.name, e.kind === "V" ? e.dc : 0]));
    expect(rails).toEqual({ "Vrail_+9V": 9, "Vrail_+3V3": 3.3, "Vrail_-5V": -5, Vrail_VCC: 12, "Vrail_/preamp/+5V": 5 });
    expect(built.notes.map((n) => n.message)).toContain('power net VBIAS has no known voltage: give it one under "rails" in the config, e.g. "rails": { "VBIAS": "9V" }');
  });

  it("a battery drives its rail itself, with the common-practice 9 V alkaline internal resistance", () => {
    const c = circuit([part("BT1", { kind: "battery", value: "9V", nets: { "+": "+9V", "-": "GND" }, libId: "Device:Battery" }), R("R1", "1k", "+9V", "GND")], ["+9V"]);
    const built = buildSolverCircuit(c, { railVolts: {} });
    expect(built.solver.elements.filter((e) => e.kind === "V")).toEqual([{ kind: "V", name: "BT1", pos: "+9V", neg: "0", dc: 9, series: 1.5 }]);
    expect(built.notes.some((n) => n.ref === "BT1" && /common practice/.test(n.message))).toBe(true);
    expect(built.notes.some((n) => /rail \+9V is driven by BT1/.test(n.message))).toBe(true);
    const own = buildSolverCircuit(circuit([part("BT1", { kind: "battery", value: "9V", nets: { "+": "+9V", "-": "GND" }, fields: { R_internal: "2.5" } })], ["+9V"]), { railVolts: {} });
    expect(own.solver.elements[0]).toMatchObject({ series: 2.5 });
  });
});

describe("models", () => {
  it("Sim.Device + Sim.Params make an inline card that replaces the built-in one (KiCad semantics)", () => {
    const q = part("Q1", { kind: "npn", value: "2N3904", nets: { C: "c", B: "b", E: "GND" }, fields: { "Sim.Device": "NPN", "Sim.Params": "bf=50 is=1e-15 area=2" } });
    const built = buildSolverCircuit(circuit([q]), { railVolts: {} });
    const el = byName(built.solver.elements, "Q1");
    expect(el?.kind === "Q" ? el.model.params : undefined).toEqual({ BF: 50, IS: 1e-15 });
    expect(el?.kind === "Q" ? el.model.source : "").toMatch(/Sim.Params of Q1/);
    expect(built.ratings.Q1?.vceo).toBe(40);
  });

  it("Sim.Params without Sim.Device override parameters of the built-in card", () => {
    const q = part("Q1", { kind: "npn", value: "2N3904", nets: { C: "c", B: "b", E: "GND" }, fields: { "Sim.Params": "bf=200" } });
    const el = byName(buildSolverCircuit(circuit([q]), { railVolts: {} }).solver.elements, "Q1");
    if (el?.kind !== "Q") throw new Error("no Q1");
    expect(el.model.params.BF).toBe(200);
    expect(el.model.params.VAF).toBe(74.03);
    expect(el.model.source).toMatch(/overridden by Sim.Params of Q1 \(BF\)/);
  });

  it("Sim.Library + Sim.Name find a card in a model library read with the design", () => {
    const q = part("Q2", { kind: "pnp", value: "MyPNP", nets: { C: "c", B: "b", E: "e" }, fields: { "Sim.Library": "models/own.lib", "Sim.Name": "QOWN" } });
    const c = circuit([q], [], { modelLibraries: [{ path: "models/own.lib", text: "* invented card\n.model QOWN PNP(BF=123 VAF=40)\n" }] });
    const el = byName(buildSolverCircuit(c, { railVolts: {} }).solver.elements, "Q2");
    expect(el?.kind === "Q" ? el.model : undefined).toMatchObject({ name: "QOWN", type: "PNP", params: { BF: 123, VAF: 40 } });
  });

  it("the config's model text, by value", () => {
    const j = part("Q3", { kind: "njfet", value: "JMINE", nets: { D: "d", G: "GND", S: "s" } });
    const built = buildSolverCircuit(circuit([j]), { railVolts: {}, modelsText: ".model JMINE NJF(VTO=-2 BETA=1m)" });
    const el = byName(built.solver.elements, "Q3");
    expect(el?.kind === "J" ? el.model.params : undefined).toEqual({ VTO: -2, BETA: 1e-3 });
  });

  it("a card of the wrong polarity is not used, and says so", () => {
    const q = part("Q4", { kind: "npn", value: "2N3906", nets: { C: "c", B: "b", E: "e" } });
    const built = buildSolverCircuit(circuit([q]), { railVolts: {} });
    expect(built.unmodelled).toEqual(["Q4"]);
    expect(built.notes.some((n) => /type PNP, but the symbol is a npn/.test(n.message))).toBe(true);
  });

  it("a dual-gate MOSFET is two level-1 channels in series plus back-to-back gate diodes", () => {
    const q = part("Q5", { kind: "dual-gate-mosfet", value: "BF998", nets: { S: "s", D: "d", G2: "g2", G1: "g1" } });
    const els = buildSolverCircuit(circuit([q]), { railVolts: {} }).solver.elements;
    expect(els.map((e) => e.name).sort()).toEqual(["Q5.g1", "Q5.g1a", "Q5.g1b", "Q5.g2", "Q5.g2a", "Q5.g2b"]);
    expect(byName(els, "Q5.g1")).toMatchObject({ kind: "M", d: "Q5#mid", g: "g1", s: "s", b: "s" });
    expect(byName(els, "Q5.g2")).toMatchObject({ kind: "M", d: "d", g: "g2", s: "Q5#mid", b: "s" });
    expect(byName(els, "Q5.g1a")).toMatchObject({ kind: "D", anode: "g1", cathode: "Q5#g1prot" });
    expect(byName(els, "Q5.g1b")).toMatchObject({ kind: "D", anode: "s", cathode: "Q5#g1prot" });
  });

  it("JFET self-bias solves to the Shockley answer ngspice gives: ID 2.587622 mA, VD 11.46085 V (reference-data §5(b) [SIM])", () => {
    const c = circuit(
      [
        R("RD", "3.3k", "VDD", "d"), R("RG", "1Meg", "g", "GND"), R("RS", "1k", "s", "GND"),
        part("J1", { kind: "njfet", value: "JSB", nets: { D: "d", G: "g", S: "s" } }),
      ],
      ["VDD"],
    );
    const built = buildSolverCircuit(c, { railVolts: { VDD: 20 }, modelsText: ".model JSB NJF(VTO=-6 BETA=0.22222m LAMBDA=0 IS=1e-14)" });
    const op = solveOperatingPoint(built.solver);
    expect(op.converged).toBe(true);
    expect(Math.abs((op.nodeVoltages.d ?? 0) - 11.46085) / 11.46085).toBeLessThan(1e-3);
    expect(Math.abs((op.nodeVoltages.s ?? 0) - 2.587622) / 2.587622).toBeLessThan(1e-3);
  });
});

describe("what is left out, and what cannot be modelled", () => {
  it("DNP and excluded parts are left out with one note", () => {
    const c = circuit([R("R1", "1k", "a", "GND"), R("R2", "2k2", "a", "GND", { dnp: true }), R("R3", "1k", "a", "GND", { fields: { "Sim.Enable": "0" } })]);
    const built = buildSolverCircuit(c, { railVolts: {} });
    expect(built.solver.elements.map((e) => e.name)).toEqual(["R1"]);
    expect(built.notes.map((n) => n.message)).toContain("left out as DNP or excluded from simulation: R2, R3");
    expect(built.unmodelled).toEqual([]);
  });

  it("lists each unmodelled part once, with the reason", () => {
    const c = circuit([
      part("U1", { kind: "other", value: "TL072", nets: {}, libId: "Amplifier_Operational:TL072" }),
      part("D1", { kind: "diode", value: "LED", nets: { A: "a", K: "GND" }, libId: "Device:LED" }),
      R("R1", "4k7k", "a", "GND"),
      part("Q9", { kind: "npn", value: "2N3904", nets: { B: "b", C: "c" } }),
    ]);
    const built = buildSolverCircuit(c, { railVolts: {} });
    expect(built.unmodelled).toEqual(["U1", "D1", "R1", "Q9"]);
    const why = (ref: string): string => built.notes.find((n) => n.ref === ref)?.message ?? "";
    expect(why("D1")).toMatch(/no model found for 'LED'/);
    expect(why("R1")).toMatch(/cannot read '4k7k' as a resistance/);
    expect(why("Q9")).toMatch(/cannot tell which pin is E/);
    expect(why("U1")).toMatch(/no model for a 'TL072'/);
  });

  it("connectors are left open with one note; a zero-ohm link is 1 mΩ; an inductor takes its DCR field", () => {
    const c = circuit([
      part("J1", { kind: "connector", value: "Conn_01x02", nets: { "1": "in", "2": "GND" } }),
      R("R1", "0", "in", "x"),
      part("L1", { kind: "inductor", value: "10uH", nets: { "1": "x", "2": "GND" }, fields: { DCR: "0.35 ohm" } }),
      part("L2", { kind: "inductor", value: "1uH", nets: { "1": "x", "2": "GND" } }),
    ]);
    const built = buildSolverCircuit(c, { railVolts: {} });
    expect(byName(built.solver.elements, "R1")).toMatchObject({ ohms: 1e-3 });
    expect(byName(built.solver.elements, "L1")).toMatchObject({ henries: 10e-6, series: 0.35 });
    expect(byName(built.solver.elements, "L2")).toMatchObject({ series: 0.1 });
    expect(built.notes.map((n) => n.message)).toContain("connectors are left open (what plugs into them is not simulated): J1");
  });
});

// --- subcircuits --------------------------------------------------------------------------------------

/** The library part of the deck: from its "* library" line to "* end of library". */
function deckLibrary(name: string): string {
  const lines = readDeck(name).split(/\r?\n/);
  const from = lines.findIndex((l) => l.trim().toLowerCase() === "* library");
  const to = lines.findIndex((l) => l.trim().toLowerCase() === "* end of library");
  if (from < 0 || to < from) throw new Error(`${name}.cir has no "* library" … "* end of library" part`);
  return lines.slice(from + 1, to).join("\n");
}

/** test/reference/ngspice/subckt_dualgate_follower.cir drawn as a schematic: each top-level deck line is
 * a part; the X lines are parts whose Sim.Library is the deck's library part. Q1's symbol pins are in
 * SOT-143 order (1=S 2=D 3=G2 4=G1) while the block's pins are written D G1 G2 S, so only Sim.Pins
 * connects it right; Q2 and J1 have no Sim.Pins and connect by position. */
function subcktBoard(): Circuit {
  const lib = { path: "follower.lib", text: deckLibrary("subckt_dualgate_follower") };
  return circuit(
    [
      R("RD", "2.2k", "vdd", "d"), R("RS", "270", "src", "GND"), R("RG1", "1Meg", "g1", "GND"),
      R("R1", "100k", "vdd", "g2"), R("R2", "47k", "g2", "GND"), R("RJS", "330", "js", "GND"),
      part("Q1", {
        kind: "dual-gate-mosfet", value: "DG-DEMO", nets: { S: "src", D: "d", G2: "g2", G1: "g1" },
        fields: { "Sim.Library": "follower.lib", "Sim.Name": "DGSUB", "Sim.Pins": "1=S 2=D 3=G2 4=G1" },
      }),
      part("Q2", { kind: "npn", value: "NPN-PKG", nets: { C: "vdd", B: "d", E: "e" }, fields: { "Sim.Library": "follower.lib", "Sim.Name": "npnpkg" } }),
      part("J1", { kind: "njfet", value: "J-PKG", nets: { D: "e", G: "GND", S: "js" }, fields: { "Sim.Library": "follower.lib", "Sim.Name": "JPKG" } }),
    ],
    ["vdd"],
    { modelLibraries: [lib] },
  );
}

/** ngspice's name for one of our values: nodes inside instance XQ1 are `xq1.mid`, ours `Q1:MID`. */
const SUBCKT_VECTORS: Array<[string, (op: OperatingPoint) => number | undefined]> = [
  ...["d", "src", "g2", "e", "js"].map((n): [string, (op: OperatingPoint) => number | undefined] => [`v(${n})`, (op) => op.nodeVoltages[n]]),
  ...[["xq1.mid", "Q1:MID"], ["xq2.bi", "Q2:BI"], ["xq2.ci", "Q2:CI"], ["xq2.cj", "Q2:CJ"], ["xq2.ei", "Q2:EI"], ["xj1.di", "J1:DI"], ["xj1.si", "J1:SI"]]
    .map(([theirs, mine]): [string, (op: OperatingPoint) => number | undefined] => [`v(${theirs})`, (op) => op.nodeVoltages[mine ?? ""]]),
  ["i(vdd)", (op) => op.branchCurrents["Vrail_vdd"]],
  ["i(l.xq2.le)", (op) => op.branchCurrents["Q2:LE"]],
  ["i(v.xq2.vsense)", (op) => op.branchCurrents["Q2:VSENSE"]],
  ["i(@m.xq1.m1[id])", (op) => { const d = op.devices["Q1.g1"]; return d?.kind === "mosfet" ? d.id : undefined; }],
  ["i(@m.xq1.m2[id])", (op) => { const d = op.devices["Q1.g2"]; return d?.kind === "mosfet" ? d.id : undefined; }],
  ["i(@q.xq2.xdie.q1[ic])", (op) => { const d = op.devices["Q2"]; return d?.kind === "bjt" ? d.ic : undefined; }],
  ["i(@q.xq2.xdie.q1[ib])", (op) => { const d = op.devices["Q2"]; return d?.kind === "bjt" ? d.ib : undefined; }],
  ["i(@j.xj1.j1[id])", (op) => { const d = op.devices["J1"]; return d?.kind === "jfet" ? d.id : undefined; }],
];

describe("parts modelled by subcircuits (test/reference/ngspice/subckt_dualgate_follower.cir)", () => {
  const built = buildSolverCircuit(subcktBoard(), { railVolts: { vdd: 12 } });
  const els = built.solver.elements;
  const op = solveOperatingPoint(built.solver);

  it("expands every instance, nested ones too, with prefixed internal nodes and names", () => {
    expect(built.unmodelled).toEqual([]);
    const names = els.map((e) => e.name);
    expect(names).toEqual(expect.arrayContaining(["Q1.g1", "Q1.g2", "Q1:RLEAK", "Q2:RBB", "Q2:VSENSE", "Q2:LE", "Q2:CBE", "Q2", "Q2:XDIE:D1", "J1:RDD", "J1"]));
    expect(byName(els, "Q1.g1")).toMatchObject({ kind: "M", d: "Q1:MID", g: "g1", s: "src", b: "src" });
    const m2 = byName(els, "Q1.g2");
    expect(m2).toMatchObject({ kind: "M", d: "d", g: "g2", s: "Q1:MID" });
    expect(m2?.kind === "M" ? m2.w : undefined).toBeCloseTo(200e-6, 12);
    expect(byName(els, "Q2")).toMatchObject({ kind: "Q", c: "Q2:CJ", b: "Q2:BI", e: "Q2:EI" });
    expect(byName(els, "Q2:XDIE:D1")).toMatchObject({ kind: "D", anode: "Q2:EI", cathode: "Q2:BI" });
    const note = built.notes.find((n) => n.ref === "Q1")?.message ?? "";
    expect(note).toMatch(/modelled by subcircuit DGSUB from 'follower.lib'.*Q1:M1 is the gate-1 channel \(Q1.g1\), Q1:M2 the gate-2 channel \(Q1.g2\)/);
  });

  // 0.1 mV and 0.1 % (ngspice's default RELTOL): tighter than the solver's deck tests, as this deck
  // has no hard-to-converge device; a flattening mistake moves these by volts.
  it("solves to ngspice's operating point of the same deck (±0.1 mV on nodes, ±0.1 % on currents)", () => {
    expect(op.converged).toBe(true);
    for (const run of referenceRuns("subckt_dualgate_follower")) {
      for (const [vector, mine] of SUBCKT_VECTORS) {
        const ref = opValue(run.data, vector);
        const value = mine(op);
        expect(value, `${run.label}: no value of ours for ${vector}`).toBeDefined();
        const err = Math.abs((value ?? Number.NaN) - ref);
        const limit = vector.startsWith("v(") ? 1e-4 : 1e-3 * Math.abs(ref);
        expect(err, `${run.label}: ${vector} ours ${value} vs ngspice ${ref}`).toBeLessThanOrEqual(limit);
      }
    }
  });

  it("without Sim.Pins the dual-gate block connects by position: symbol pin 1 (S) lands on the block's first pin, D", () => {
    const board = subcktBoard();
    const q1 = board.parts.find((p) => p.ref === "Q1");
    if (q1) q1.fields = { "Sim.Library": "follower.lib", "Sim.Name": "DGSUB" };
    const positional = buildSolverCircuit(board, { railVolts: { vdd: 12 } });
    // Symbol pin 1 (S, on src) lands on the block's first pin D.
    expect(positional.solver.elements.find((e) => e.name.startsWith("Q1") && e.kind === "M" && e.d === "src")).toBeDefined();
  });

  it("KiCad 6 fields: Spice_Lib_File + Spice_Model name the block, Spice_Node_Sequence lists symbol pins in its pin order", () => {
    const lib = { path: "follower.lib", text: deckLibrary("subckt_dualgate_follower") };
    // Symbol pins 1=E 2=B 3=C, so the sequence "3 2 1" is C B E, the block's order.
    const q = part("Q6", { kind: "npn", value: "X", nets: { E: "e", B: "b", C: "c" }, fields: { Spice_Lib_File: "follower.lib", Spice_Model: "NPNPKG", Spice_Node_Sequence: "3 2 1" } });
    const els6 = buildSolverCircuit(circuit([q], [], { modelLibraries: [lib] }), { railVolts: {} }).solver.elements;
    expect(byName(els6, "Q6:RBB")).toMatchObject({ a: "b", b: "Q6:BI" });
    expect(byName(els6, "Q6:RCC")).toMatchObject({ a: "c", b: "Q6:CI" });
    expect(byName(els6, "Q6:LE")).toMatchObject({ a: "e", b: "Q6:EI" });
  });

  it("a block the solver cannot represent leaves the part out, naming the library line", () => {
    const lib = { path: "amp.lib", text: "* invented\n.subckt GAIN IN OUT\nRIN IN 0 10k\nE1 OUT 0 IN 0 10\n.ends\n" };
    const u = part("Q3", { kind: "npn", value: "GAIN", nets: { C: "c", B: "b", E: "e" }, fields: { "Sim.Library": "amp.lib", "Sim.Name": "GAIN", "Sim.Pins": "1=OUT 2=IN" } });
    const b = buildSolverCircuit(circuit([u], [], { modelLibraries: [lib] }), { railVolts: {} });
    expect(b.unmodelled).toEqual(["Q3"]);
    expect(b.notes.find((n) => n.ref === "Q3" && /is not simulated/.test(n.message))?.message).toMatch(
      /subcircuit GAIN from 'amp.lib' cannot be used: model library 'amp.lib', line 4: element E1 \(voltage-controlled voltage source\) is not supported/,
    );
  });

  it("a Sim.Pins naming a pin the block lacks, or a pin count that does not match, is a reason, not a guess", () => {
    const lib = { path: "follower.lib", text: deckLibrary("subckt_dualgate_follower") };
    const wrongName = part("Q4", { kind: "npn", value: "X", nets: { C: "c", B: "b", E: "e" }, fields: { "Sim.Library": "follower.lib", "Sim.Name": "NPNPKG", "Sim.Pins": "1=C 2=B 3=EMITTER" } });
    const fourPins = part("Q5", { kind: "dual-gate-mosfet", value: "X", nets: { S: "s", D: "d", G2: "g2", G1: "g1" }, fields: { "Sim.Library": "follower.lib", "Sim.Name": "NPNPKG" } });
    const b = buildSolverCircuit(circuit([wrongName, fourPins], [], { modelLibraries: [lib] }), { railVolts: {} });
    expect(b.unmodelled).toEqual(["Q4", "Q5"]);
    const why = (ref: string): string => b.notes.find((n) => n.ref === ref && /is not simulated/.test(n.message))?.message ?? "";
    expect(why("Q4")).toMatch(/maps pin 3 to EMITTER, which is not a pin of subcircuit NPNPKG \(C B E\)/);
    expect(why("Q5")).toMatch(/the symbol has 4 pins and subcircuit NPNPKG has 3/);
  });
});

// --- zeners by voltage and the built-in tetrode's capacitances ------------------------------------------

describe("a zener whose Value is its voltage gets the generic card (test/reference/ngspice/zener_generic_by_voltage.cir)", () => {
  const zenerAt5mA = (value: string): { built: ReturnType<typeof buildSolverCircuit>; volts: number | undefined } => {
    const c = circuit([
      part("D3", { kind: "zener", value, nets: { A: "GND", K: "k" }, libId: "Device:D_Zener" }),
      part("I1", { kind: "current-source", value: "DC 5m", nets: { "+": "GND", "-": "k" }, fields: { "Sim.Device": "I", "Sim.Params": "dc=5m" } }),
    ]);
    const built = buildSolverCircuit(c, { railVolts: {} });
    const op = solveOperatingPoint(built.solver);
    return { built, volts: op.converged ? op.nodeVoltages.k : undefined };
  };

  it.each([["15V", 15], ["5V6", 5.6], ["6.2V", 6.2], ["ZENER 6.2V", 6.2], ["BZX55C15", 15]])("%s: %d V across it at IBV 5 mA (±1 mV)", (value, volts) => {
    const { built, volts: measured } = zenerAt5mA(value);
    expect(built.unmodelled).toEqual([]);
    const d = byName(built.solver.elements, "D3");
    expect(d?.kind === "D" && d.model.source).toMatch(/generic zener card by voltage/);
    expect(Math.abs((measured ?? Number.NaN) - volts)).toBeLessThanOrEqual(1e-3);
  });

  it("the card is the deck's, and ngspice puts the stated 15 V and 5.6 V across it at 5 mA too (±1 mV)", () => {
    const text = readDeck("zener_generic_by_voltage");
    for (const [value, node, volts] of [["15V", "k15", 15], ["5V6", "k56", 5.6]] as const) {
      const d = byName(zenerAt5mA(value).built.solver.elements, "D3");
      const card = d?.kind === "D" ? d.model : undefined;
      const deckCard = findModelCard(parseModelCards(text, "deck").models, card?.name ?? "?");
      expect(Object.keys(deckCard?.params ?? {}).sort()).toEqual(Object.keys(card?.params ?? {}).sort());
      for (const [k, v] of Object.entries(card?.params ?? {})) {
        expect(Math.abs((deckCard?.params[k] ?? Number.NaN) - v) / Math.abs(v), `${card?.name} ${k}`).toBeLessThan(1e-9);
      }
      for (const run of referenceRuns("zener_generic_by_voltage")) {
        expect(Math.abs(opValue(run.data, `v(${node})`) - volts), run.label).toBeLessThanOrEqual(1e-3);
      }
    }
  });

  it("a zener with no voltage anywhere is still left out, with a hint to write it", () => {
    const { built } = zenerAt5mA("D_Zener");
    expect(built.unmodelled).toEqual(["D3"]);
    expect(built.notes.find((n) => n.ref === "D3")?.message).toMatch(/write the zener voltage in its Value/);
  });
});

describe("the built-in tetrode's gate capacitances (BF998 typicals, reference-data §4.4)", () => {
  it("each channel's C_gs at the operating point is the datasheet's Cg1ss 2.1 pF / Cg2ss 1.2 pF (±1 %); gate 1's C_gd is Cdg1 25 fF", () => {
    // An invented 12 V stage: gate 2 at 4 V from a divider, gate 1 at 0 V, 100 Ω source resistor, 1 kΩ drain load.
    const c = circuit(
      [
        R("R1", "200k", "+12V", "g2"), R("R2", "100k", "g2", "GND"), R("R3", "100k", "g1", "GND"),
        R("R4", "100", "s", "GND"), R("R5", "1k", "+12V", "d"),
        part("Q1", { kind: "dual-gate-mosfet", value: "BF998", nets: { S: "s", D: "d", G2: "g2", G1: "g1" } }),
      ],
      ["+12V"],
    );
    const built = buildSolverCircuit(c, { railVolts: {} });
    const op = solveOperatingPoint(built.solver);
    expect(op.converged).toBe(true);
    const g1 = op.devices["Q1.g1"];
    const g2 = op.devices["Q1.g2"];
    expect(g1?.kind === "mosfet" && g1.region).toBe("saturation");
    expect(g2?.kind === "mosfet" && g2.region).toBe("saturation");
    const cgs1 = g1?.kind === "mosfet" ? g1.cgs : Number.NaN;
    const cgs2 = g2?.kind === "mosfet" ? g2.cgs : Number.NaN;
    const cgd1 = g1?.kind === "mosfet" ? g1.cgd : Number.NaN;
    expect(Math.abs(cgs1 - 2.1e-12) / 2.1e-12).toBeLessThanOrEqual(0.01);
    expect(Math.abs(cgs2 - 1.2e-12) / 1.2e-12).toBeLessThanOrEqual(0.01);
    expect(Math.abs(cgd1 - 25e-15) / 25e-15).toBeLessThanOrEqual(0.01);
    // Within the datasheet's Cg1ss maximum of 2.5 pF even with gate 1's C_gd added.
    expect(cgs1 + cgd1).toBeLessThanOrEqual(2.5e-12);
    const card = byName(built.solver.elements, "Q1.g2");
    expect(card?.kind === "M" && card.model.source).toMatch(/CGSO = 1\.2 pF \/ 100 µm = 12 nF\/m/);
  });
});
