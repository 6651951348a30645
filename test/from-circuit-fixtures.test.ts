// The bundled dual-gate board through the whole run: its tetrode is a subcircuit in a model library
// beside the schematic (fixtures/dual-gate-cascode/dg-mosfet.lib: two level-1 channels, Sim.Pins in
// SOT-143 order) and its zener's Value is only "15V". Both must be modelled. The operating point itself
// is checked against ngspice on the same kind of block in from-circuit.test.ts; here only the wiring.
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { lint } from "../src/engine/lint.js";
import { readDesign } from "../src/read/index.js";
import { buildSolverCircuit } from "../src/solve/from-circuit.js";

const BOARD = resolve("fixtures/dual-gate-cascode/dual-gate-cascode.kicad_sch");

describe("fixtures/dual-gate-cascode", () => {
  it("models Q1 by its subcircuit (channels Q1.g1 / Q1.g2) and D3 by the voltage in its Value", () => {
    const read = readDesign(BOARD);
    if (!("circuit" in read) || !read.circuit) throw new Error("board not read");
    const built = buildSolverCircuit(read.circuit, { railVolts: {} });
    expect(built.unmodelled).toEqual([]);
    const names = built.solver.elements.map((e) => e.name);
    expect(names).toEqual(expect.arrayContaining(["Q1.g1", "Q1.g2", "D3"]));
    const d3 = built.solver.elements.find((e) => e.name === "D3");
    expect(d3?.kind === "D" && d3.model.params.BV).toBeCloseTo(15 - 5e-3 * 5, 9);
  });

  it("the check no longer reports Q1 or D3 as not modelled", () => {
    const result = lint({ paths: [BOARD] });
    const design = result.designs[0];
    const coverage = design?.findings.find((f) => f.rule === "model-coverage");
    const unmodelled = (coverage?.data.unmodelled ?? []) as unknown[];
    expect(unmodelled).not.toContain("Q1");
    expect(unmodelled).not.toContain("D3");
    expect(coverage?.message ?? "").not.toMatch(/Q1 not modelled/);
  });
});
