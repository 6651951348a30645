import { describe, expect, it } from "vitest";
import { findModelCard, parseModelCards } from "../src/solve/spice-card.js";
import { parseSpiceNumber } from "../src/circuit/spice-number.js";

const rel = (a: number | undefined, b: number): void => {
  expect(a).toBeDefined();
  expect(Math.abs((a ?? Number.NaN) - b)).toBeLessThanOrEqual(Math.abs(b) * 1e-12);
};

// Scale factors T G Meg K mil m u n p f, case-insensitive, letters after the scale ignored:
// ngspice User's Manual, "Syntax" section on numbers (section number from memory) — also how ngspice 39
// read every card in shared/notes/ngspice/*.cir.
describe("SPICE numbers", () => {
  const cases: [string, number][] = [
    ["6.734f", 6.734e-15], ["1meg", 1e6], ["2.5MEG", 2.5e6], ["10mil", 254e-6], ["1e-15", 1e-15],
    ["4.7kohm", 4700], [".7371", 0.7371], ["66.78m", 66.78e-3], ["1M", 1e-3], ["1F", 1e-15],
    ["3.638p", 3.638e-12], ["239.5n", 239.5e-9], ["100u", 100e-6], ["1T", 1e12], ["2G", 2e9], ["-3.409", -3.409],
  ];
  it.each(cases)("%s = %d", (text, v) => rel(parseSpiceNumber(text), v));
  it("rejects what is not a number", () => {
    expect(parseSpiceNumber("abc")).toBeUndefined();
    expect(parseSpiceNumber("{rval}")).toBeUndefined();
    expect(parseSpiceNumber("1k5")).toBeUndefined();
  });
});

describe(".model cards", () => {
  it("reads the 2N3904 Gummel–Poon card as ngspice 39 did (shared/notes/ngspice/ce_9v_2n3904.cir)", () => {
    const text = `* CE stage card
.model Q2N3904 NPN(Is=6.734f Xti=3 Eg=1.11 Vaf=74.03 Bf=416.4 Ne=1.259 Ise=6.734f Ikf=66.78m
+ Xtb=1.5 Br=.7371 Nc=2 Isc=0 Ikr=0 Rc=1 Cjc=3.638p Mjc=.3085 Vjc=.75 Fc=.5 Cje=4.493p Mje=.2593
+ Vje=.75 Tr=239.5n Tf=301.2p Itf=.4 Vtf=4 Xtf=2 Rb=10)`;
    const { models, notes } = parseModelCards(text, "test text");
    expect(notes).toEqual([]);
    expect(models).toHaveLength(1);
    const q = models[0];
    expect(q?.type).toBe("NPN");
    expect(q?.name).toBe("Q2N3904");
    rel(q?.params.IS, 6.734e-15);
    rel(q?.params.BF, 416.4);
    rel(q?.params.IKF, 66.78e-3);
    rel(q?.params.BR, 0.7371);
    rel(q?.params.TF, 301.2e-12);
    expect(Object.keys(q?.params ?? {})).toHaveLength(27);
    expect(q?.source).toBe("test text, line 2");
  });
  it("takes cards without parentheses, blanks round '=', comments and lower-case keywords", () => {
    const text = [
      "* invented test cards",
      ".MODEL dtest d",
      "+ is = 4.352n   ; saturation current",
      "+ n=1.906 rs=0.6458 $ series resistance",
      "+ bv=110 ibv=100u",
      "",
      ".model jtest njf (beta=3.384m vto=-3.409 lambda=17m)",
      ".model mtest NMOS (LEVEL=1 VTO=2.094 KP=0.2628)",
    ].join("\n");
    const { models, notes } = parseModelCards(text);
    expect(notes).toEqual([]);
    expect(models.map((m) => [m.name, m.type])).toEqual([["dtest", "D"], ["jtest", "NJF"], ["mtest", "NMOS"]]);
    rel(findModelCard(models, "DTEST")?.params.IS, 4.352e-9);
    rel(findModelCard(models, "dtest")?.params.BV, 110);
    rel(findModelCard(models, "jtest")?.params.VTO, -3.409);
    expect(models[2]?.source).toBe("model text, line 8");
  });
  it("reports what it does not support, with line numbers", () => {
    const text = [
      ".model m3 NMOS(LEVEL=3 VTO=1)",
      ".model bsim NMOS level=54",
      ".model vd VDMOS(Rd=1)",
      ".subckt OPAMP 1 2 3",
      "R1 1 2 1k",
      ".ends",
      ".model q1 ako:q2 NPN(BF=100)",
      ".model qv NPN(level=4 BF=100)",
      ".model q9 PNP(BF=100 VAF={va} mfg=Invented)",
      ".model q9 PNP(BF=200)",
    ].join("\n");
    const { models, notes, subcircuits } = parseModelCards(text);
    expect(models.map((m) => m.name)).toEqual(["q9"]);
    // A .subckt block is read as a block (test/subckt.test.ts), not reported as unsupported.
    expect(subcircuits.map((d) => [d.name, d.pins, d.problems.length])).toEqual([["OPAMP", ["1", "2", "3"], 0]]);
    expect(models[0]?.params).toEqual({ BF: 100 });
    const byLine = notes.map((n) => [n.line, n.message]);
    expect(byLine).toEqual([
      [1, "model m3: LEVEL=3: only LEVEL=1 (Shichman–Hodges) MOSFETs are supported"],
      [2, "model bsim: LEVEL=54: only LEVEL=1 (Shichman–Hodges) MOSFETs are supported"],
      [3, "model vd: type VDMOS is not supported (supported: D, NPN, PNP, NJF, PJF, NMOS and PMOS level 1)"],
      [7, "model q1: 'AKO' cards (a kind of another model) are not supported"],
      [8, "model qv: LEVEL=4: only level 1 NPN models are supported"],
      [9, "model q9: cannot read VAF='{va}' as a number; ignored"],
      [10, "model q9 is defined again (first at line 9); the first is used"],
    ]);
  });
});
