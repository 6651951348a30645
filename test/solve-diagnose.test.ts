// Singular-matrix diagnosis in the trade's words, bad input, and the solver's hard caps. The
// facts checked are MNA facts: a node reached only through capacitors (or current sources, or
// an insulated gate) has no defined DC voltage; a loop of ideal voltage sources and/or
// inductors has no defined DC current.

import { describe, expect, it } from "vitest";
import { acSweep, diagnoseTopology, solveOperatingPoint } from "../src/solve/index.js";
import type { Element, ModelCard, SolverCircuit } from "../src/solve/netlist.js";
import { parseDeck } from "./support/deck.js";
import { readDeck } from "./support/ngspice.js";

const circuit = (elements: Element[]): SolverCircuit => ({ title: "diagnosis", elements });
const NPN: ModelCard = { name: "QT", type: "NPN", params: { IS: 1e-15, BF: 100 }, source: "test card" };
const NMOS: ModelCard = { name: "MT", type: "NMOS", params: { VTO: 2, KP: 0.1 }, source: "test card" };

describe("diagnoseTopology", () => {
  it("names a node that only capacitors touch", () => {
    const c = circuit([
      { kind: "V", name: "VIN", pos: "in", neg: "0", dc: 1 },
      { kind: "R", name: "R1", a: "in", b: "0", ohms: 1e3 },
      { kind: "C", name: "C3", a: "in", b: "b1", farads: 1e-6 },
      { kind: "C", name: "C4", a: "b1", b: "0", farads: 1e-6 },
    ]);
    const problems = diagnoseTopology(c);
    expect(problems).toHaveLength(1);
    expect(problems[0]?.kind).toBe("no-dc-path");
    expect(problems[0]?.nodes).toEqual(["b1"]);
    expect(problems[0]?.elements).toEqual(["C3", "C4"]);
    expect(problems[0]?.message).toContain("node b1 has no DC path to ground (only capacitors C3, C4 touch it)");
    const op = solveOperatingPoint(c);
    expect(op.converged).toBe(false);
    expect(op.problem).toContain("node b1 has no DC path to ground");
  });

  it("names an AC-coupled MOSFET gate with no bias resistor", () => {
    const c = circuit([
      { kind: "V", name: "VDD", pos: "vdd", neg: "0", dc: 9 },
      { kind: "R", name: "RD", a: "vdd", b: "d", ohms: 1e3 },
      { kind: "M", name: "M1", d: "d", g: "g", s: "0", b: "0", model: NMOS },
      { kind: "V", name: "VIN", pos: "in", neg: "0", dc: 0 },
      { kind: "C", name: "C1", a: "in", b: "g", farads: 1e-7 },
    ]);
    const [problem] = diagnoseTopology(c);
    expect(problem?.message).toContain("node g has no DC path to ground (only capacitor C1 and the insulated gate of M1 touch it)");
  });

  it("groups several floating nodes and names what isolates them", () => {
    const c = circuit([
      { kind: "V", name: "V1", pos: "a", neg: "0", dc: 5 },
      { kind: "I", name: "I1", pos: "a", neg: "x", dc: 1e-3 },
      { kind: "R", name: "R9", a: "x", b: "y", ohms: 1e3 },
      { kind: "C", name: "C9", a: "y", b: "0", farads: 1e-9 },
    ]);
    const [problem] = diagnoseTopology(c);
    expect(problem?.nodes).toEqual(["x", "y"]);
    expect(problem?.message).toContain("nodes x, y have no DC path to ground (they reach the rest of the circuit only through capacitor C9 and current source I1)");
  });

  it("reports two ideal voltage sources in parallel as a loop", () => {
    const c = circuit([
      { kind: "V", name: "V1", pos: "vcc", neg: "0", dc: 9 },
      { kind: "V", name: "V2", pos: "vcc", neg: "0", dc: 9 },
      { kind: "R", name: "R1", a: "vcc", b: "0", ohms: 1e3 },
    ]);
    const [problem] = diagnoseTopology(c);
    expect(problem?.kind).toBe("source-loop");
    expect(problem?.elements.sort()).toEqual(["V1", "V2"]);
    expect(problem?.message).toContain("voltage source V2 and voltage source V1 form a loop with no resistance");
    // A battery's internal resistance breaks the loop: then it is a valid (if odd) circuit.
    const withRs = circuit([
      { kind: "V", name: "V1", pos: "vcc", neg: "0", dc: 9 },
      { kind: "V", name: "V2", pos: "vcc", neg: "0", dc: 9, series: 0.5 },
      { kind: "R", name: "R1", a: "vcc", b: "0", ohms: 1e3 },
    ]);
    expect(diagnoseTopology(withRs)).toEqual([]);
    expect(solveOperatingPoint(withRs).converged).toBe(true);
  });

  it("reports a voltage source shorted by an ideal inductor, and two ideal inductors in a loop", () => {
    const shorted = circuit([
      { kind: "V", name: "V1", pos: "a", neg: "0", dc: 1 },
      { kind: "L", name: "L1", a: "a", b: "0", henries: 1e-6 },
    ]);
    const [p1] = diagnoseTopology(shorted);
    expect(p1?.message).toContain("inductor L1 and voltage source V1 form a loop with no resistance (nodes 0, a)");
    const coils = circuit([
      { kind: "V", name: "V1", pos: "a", neg: "0", dc: 1 },
      { kind: "R", name: "R1", a: "a", b: "b", ohms: 100 },
      { kind: "L", name: "L1", a: "b", b: "0", henries: 1e-6 },
      { kind: "L", name: "L2", a: "b", b: "0", henries: 2e-6 },
    ]);
    const [p2] = diagnoseTopology(coils);
    expect(p2?.elements.sort()).toEqual(["L1", "L2"]);
    expect(p2?.message).toContain("give the inductor its winding resistance");
    // With winding resistance the circuit solves: the 1 V splits over R1 and the two windings.
    const wound = circuit([
      { kind: "V", name: "V1", pos: "a", neg: "0", dc: 1 },
      { kind: "R", name: "R1", a: "a", b: "b", ohms: 100 },
      { kind: "L", name: "L1", a: "b", b: "0", henries: 1e-6, series: 100 },
      { kind: "L", name: "L2", a: "b", b: "0", henries: 2e-6, series: 100 },
    ]);
    const op = solveOperatingPoint(wound);
    expect(op.converged).toBe(true);
    // Ohm's law: 1 V across 100 Ω + (100 ∥ 100) Ω → V(b) = 1/3 V, 1/300 A in each winding.
    expect(op.nodeVoltages["b"]).toBeCloseTo(1 / 3, 9);
    expect(op.branchCurrents["L1"]).toBeCloseTo(1 / 300, 9);
  });

  it("rejects values that are not finite numbers with the element named", () => {
    const c = circuit([
      { kind: "V", name: "V1", pos: "a", neg: "0", dc: 1 },
      { kind: "R", name: "R7", a: "a", b: "0", ohms: Number.NaN },
    ]);
    const [problem] = diagnoseTopology(c);
    expect(problem?.kind).toBe("invalid-value");
    expect(problem?.message).toBe("R7 has a resistance that is not a finite number (NaN)");
    expect(solveOperatingPoint(c).problem).toContain("R7 has a resistance");
  });

  it("says when nothing connects to ground", () => {
    const c = circuit([
      { kind: "V", name: "V1", pos: "a", neg: "b", dc: 1 },
      { kind: "R", name: "R1", a: "a", b: "b", ohms: 1e3 },
    ]);
    expect(diagnoseTopology(c)[0]?.message).toContain("no element connects to ground (node 0)");
  });

  it("passes a well-formed amplifier", () => {
    const c = circuit([
      { kind: "V", name: "VCC", pos: "vcc", neg: "0", dc: 9 },
      { kind: "R", name: "R1", a: "vcc", b: "b", ohms: 56e3 },
      { kind: "R", name: "R2", a: "b", b: "0", ohms: 10e3 },
      { kind: "R", name: "RC", a: "vcc", b: "c", ohms: 3.9e3 },
      { kind: "R", name: "RE", a: "e", b: "0", ohms: 680 },
      { kind: "C", name: "CE", a: "e", b: "0", farads: 1e-4 },
      { kind: "Q", name: "Q1", c: "c", b: "b", e: "e", model: NPN },
    ]);
    expect(diagnoseTopology(c)).toEqual([]);
  });
});

describe("solver caps and explanations", () => {
  const cascode = (): SolverCircuit => circuit([
    { kind: "V", name: "VCC", pos: "vcc", neg: "0", dc: 9 },
    { kind: "R", name: "R1", a: "vcc", b: "b2", ohms: 12e3 },
    { kind: "R", name: "R2", a: "b2", b: "b1", ohms: 5.6e3 },
    { kind: "R", name: "R3", a: "b1", b: "0", ohms: 6.8e3 },
    { kind: "Q", name: "Q1", c: "c1", b: "b1", e: "e1", model: NPN },
    { kind: "R", name: "RE", a: "e1", b: "0", ohms: 1e3 },
    { kind: "Q", name: "Q2", c: "c2", b: "b2", e: "c1", model: NPN },
    { kind: "R", name: "RC", a: "vcc", b: "c2", ohms: 1.5e3 },
  ]);

  it("stops at the iteration cap and says so", () => {
    const op = solveOperatingPoint(cascode(), { maxIterations: 3 });
    expect(op.converged).toBe(false);
    expect(op.iterations).toBeLessThanOrEqual(3);
    expect(op.problem).toContain("stopped at the cap of 3 Newton iterations");
    // Without the cap the same circuit solves.
    expect(solveOperatingPoint(cascode()).converged).toBe(true);
  });

  it("explains a circuit that outlasts the cap: which strategy got how far, and which device kept limiting", () => {
    // A bistable Schmitt trigger (deck schmitt_bistable_re1k) needs source stepping; capped at
    // 150 iterations it stops inside gmin stepping.
    const deck = parseDeck(readDeck("schmitt_bistable_re1k"), "schmitt_bistable_re1k.cir");
    const op = solveOperatingPoint(deck.circuit, { maxIterations: 150 });
    expect(op.converged).toBe(false);
    expect(op.iterations).toBeLessThanOrEqual(150);
    expect(op.problem).toMatch(/plain Newton: Newton's method did not settle \(q\d's junction steps were still being limited/);
    expect(op.problem).toContain("gmin stepping: stalled at a node shunt of");
    expect(op.problem).toContain("stopped at the cap of 150 Newton iterations");
  });

  it("stops at the time limit and says so", () => {
    const op = solveOperatingPoint(cascode(), { maxMillis: 0 });
    expect(op.converged).toBe(false);
    expect(op.problem).toContain("stopped at the time limit");
  });

  it("an AC sweep without an operating point says why instead of throwing", () => {
    const c = cascode();
    const failed = solveOperatingPoint(c, { maxIterations: 2 });
    const ac = acSweep(c, failed, [1e3], { kind: "source", name: "VCC" });
    expect(ac.problem).toContain("no small-signal analysis without a DC operating point");
    expect(acSweep(c, null, [1e3], { kind: "current", node: "nowhere" }, { passiveOnly: true }).problem).toBe("there is no node named nowhere");
    expect(acSweep(c, null, [-5], { kind: "current", node: "c2" }, { passiveOnly: true }).problem).toContain("positive finite");
  });
});
