import { describe, expect, it } from "vitest";
import { buildSolverCircuit } from "../src/solve/from-circuit.js";
import { solveOperatingPoint } from "../src/solve/index.js";
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
