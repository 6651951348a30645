import { describe, expect, it } from "vitest";
import { parseModelCards } from "../src/solve/spice-card.js";
import { expandSubcircuit, MAX_SUBCKT_DEPTH } from "../src/solve/subckt-expand.js";
import { findSubcircuit, readSubcktStatement } from "../src/solve/subckt-syntax.js";
import type { Element } from "../src/solve/netlist.js";

// Syntax as SPICE defines it (the SPICE3 / ngspice element-line formats: name, nodes, model or value,
// then keyword parameters). Library texts below are invented for the test.

const rel = (a: number | undefined, b: number, tol = 1e-12): void => {
  expect(a).toBeDefined();
  expect(Math.abs((a ?? Number.NaN) - b) / Math.abs(b)).toBeLessThanOrEqual(tol);
};

describe("element lines inside a subcircuit", () => {
  it("reads R C L with SPICE numbers and the M multiplier (R/m, L/m, C·m)", () => {
    const r = readSubcktStatement("R1 a b 4.7k m=2", 3);
    expect("statement" in r && r.statement).toMatchObject({ kind: "R", name: "R1", nodes: ["A", "B"], line: 3 });
    rel("statement" in r && r.statement.kind === "R" ? r.statement.value : undefined, 2350);
    const c = readSubcktStatement("Cx 1 0 10p IC=0", 4);
    expect("statement" in c && c.statement.kind === "C" ? c.statement.value : undefined).toBeCloseTo(10e-12, 20);
    expect("statement" in c ? c.ignored : []).toEqual(["IC=0"]);
    const l = readSubcktStatement("L1 1 2 1meg", 5);
    rel("statement" in l && l.statement.kind === "L" ? l.statement.value : undefined, 1e6);
  });
  it("tells a BJT's substrate node from its area by what the fifth word is", () => {
    const withArea = readSubcktStatement("Q1 c b e QMOD 2", 1);
    expect("statement" in withArea && withArea.statement).toMatchObject({ nodes: ["C", "B", "E"], model: "QMOD", area: 2 });
    const withSubstrate = readSubcktStatement("Q1 c b e sub QMOD", 1);
    expect("statement" in withSubstrate && withSubstrate.statement).toMatchObject({ nodes: ["C", "B", "E"], model: "QMOD" });
    expect("statement" in withSubstrate ? withSubstrate.ignored[0] : "").toMatch(/substrate node SUB/);
  });
  it("reads MOSFET W and L, passes AD/AS by, and refuses a multiplier", () => {
    const m = readSubcktStatement("M1 d g s b NCH W=200u L=10u AD=1p", 7);
    const st = "statement" in m && m.statement.kind === "M" ? m.statement : undefined;
    expect(st).toMatchObject({ kind: "M", model: "NCH" });
    rel(st?.w, 200e-6);
    rel(st?.l, 10e-6);
    expect("statement" in m ? m.ignored : []).toEqual(["AD=1p"]);
    const mult = readSubcktStatement("M2 d g s b NCH M=4", 8);
    expect("problem" in mult && mult.problem).toMatch(/multiplier M=4 is not supported/);
  });
  it("reads sources as DC (and AC) values; a waveform's value at time zero", () => {
    const v = readSubcktStatement("V1 a 0 DC 5 AC 1", 1);
    expect("statement" in v && v.statement).toMatchObject({ kind: "V", dc: 5, ac: 1 });
    const i = readSubcktStatement("I1 a 0 SIN(1m 1m 1k)", 2);
    expect("statement" in i && i.statement).toMatchObject({ kind: "I", dc: 1e-3 });
  });
  it("refuses what it cannot represent, saying what", () => {
    expect(readSubcktStatement("E1 3 0 1 2 1e5", 1)).toEqual({ problem: expect.stringMatching(/E1 \(voltage-controlled voltage source\) is not supported/) as string });
    expect(readSubcktStatement("R1 a b {rval}", 1)).toEqual({ problem: expect.stringMatching(/expressions/) as string });
    expect(readSubcktStatement("X1 a b SUB params: g=2", 1)).toEqual({ problem: expect.stringMatching(/parameters passed to a subcircuit/) as string });
    expect(readSubcktStatement("D1 a", 1)).toEqual({ problem: expect.stringMatching(/D1 needs 2 nodes and a model name/) as string });
  });
});

describe(".subckt blocks in library text", () => {
  const text = [
    "* invented library",
    ".subckt DG S D G2 G1",
    "M1 MID G1 S S NCH",
    "M2 D G2 MID S NCH",
    ".model NCH NMOS(LEVEL=1 VTO=-0.8 KP=28m)",
    ".ends DG",
    ".subckt OPA IN+ IN- OUT",
    "E1 OUT 0 IN+ IN- 1e5",
    ".ends",
    ".subckt TUNED A B PARAMS: F0=10MEG",
    "L1 A B 1u",
    ".ends",
    ".subckt SCALED A B",
    ".param rv=1k",
    "R1 A B 1k",
    ".ends",
    ".model QTOP NPN(BF=100)",
    ".subckt OPEN A",
  ].join("\n");
  const parsed = parseModelCards(text, "model library 'parts.lib'");

  it("keeps pins in order, elements, and cards local to the block", () => {
    const dg = findSubcircuit(parsed.subcircuits, "dg");
    expect(dg?.pins).toEqual(["S", "D", "G2", "G1"]);
    expect(dg?.statements.map((s) => s.name)).toEqual(["M1", "M2"]);
    expect(dg?.models.map((m) => m.name)).toEqual(["NCH"]);
    expect(dg?.problems).toEqual([]);
    expect(parsed.models.map((m) => m.name)).toEqual(["QTOP"]);
  });
  it("records what makes a block unusable on the line it is on", () => {
    expect(findSubcircuit(parsed.subcircuits, "OPA")?.problems).toEqual([{ line: 8, message: expect.stringMatching(/^element E1 \(voltage-controlled voltage source\)/) as string }]);
    expect(findSubcircuit(parsed.subcircuits, "TUNED")?.problems[0]).toMatchObject({ line: 10, message: expect.stringMatching(/takes parameters/) as string });
    expect(findSubcircuit(parsed.subcircuits, "SCALED")?.problems[0]).toMatchObject({ line: 14, message: expect.stringMatching(/'\.param' inside subcircuit SCALED is not supported/) as string });
    expect(parsed.notes).toContainEqual({ line: 18, message: "subcircuit OPEN has no .ends; not used" });
  });
});

describe("expansion", () => {
  const lib = parseModelCards(
    [
      ".subckt PKG C B E",
      "RB B BI 10",
      "XDIE C BI E DIE",
      ".ends",
      ".subckt DIE C B E",
      "Q1 C B E QDIE",
      "R0 B 0 1meg",
      ".ends",
      ".model QDIE NPN(BF=150)",
      ".subckt LOOP A",
      "X1 A LOOP",
      ".ends",
      ".subckt WRONG A B",
      "Q1 A B 0 DMOD",
      ".model DMOD D(IS=1e-14)",
      ".ends",
    ].join("\n"),
    "model library 'pkg.lib'",
  );
  const pkg = findSubcircuit(lib.subcircuits, "PKG");

  it("maps pins to the enclosing nodes, prefixes internal nodes and names, keeps node 0 global", () => {
    if (!pkg) throw new Error("PKG not read");
    const ex = expandSubcircuit(pkg, new Map([["C", "vcc"], ["B", "in"], ["E", "out"]]), "Q7", lib);
    expect(ex.ok).toBe(true);
    const els: Element[] = ex.ok ? ex.elements : [];
    expect(els.map((e) => e.name)).toEqual(["Q7:RB", "Q7:XDIE:Q1", "Q7:XDIE:R0"]);
    expect(els[0]).toMatchObject({ a: "in", b: "Q7:BI", ohms: 10 });
    expect(els[1]).toMatchObject({ c: "vcc", b: "Q7:BI", e: "out" });
    expect(els[1]?.kind === "Q" && els[1].model.name).toBe("QDIE");
    expect(els[2]).toMatchObject({ a: "Q7:BI", b: "0" });
  });
  it("stops a subcircuit that contains itself within the depth bound, naming the chain", () => {
    const loop = findSubcircuit(lib.subcircuits, "LOOP");
    if (!loop) throw new Error("LOOP not read");
    const ex = expandSubcircuit(loop, new Map([["A", "n"]]), "U1", lib);
    expect(ex.ok).toBe(false);
    expect(!ex.ok && ex.problem).toMatch(/subcircuit LOOP contains itself \(LOOP → LOOP\)/);
    expect(MAX_SUBCKT_DEPTH).toBeGreaterThan(2);
  });
  it("refuses a model of the wrong type for the element, naming the line", () => {
    const wrong = findSubcircuit(lib.subcircuits, "WRONG");
    if (!wrong) throw new Error("WRONG not read");
    const ex = expandSubcircuit(wrong, new Map([["A", "a"], ["B", "b"]]), "U2", lib);
    expect(!ex.ok && ex.problem).toBe("model library 'pkg.lib', line 14: Q1 is a Q element but model DMOD is type D");
  });
  it("needs every pin connected", () => {
    if (!pkg) throw new Error("PKG not read");
    const ex = expandSubcircuit(pkg, new Map([["C", "vcc"]]), "Q7", lib);
    expect(!ex.ok && ex.problem).toMatch(/pins B, E not connected/);
  });
});
