// e-series: membership and snapping against IEC 60063 (tables as compiled in reference-data §1),
// and the operating-point shifts it reports against ngspice on the same circuit (the cascode bias
// design of reference-data §5(c), 2N3904 card): the decks test/reference/ngspice/eseries_cascode_*.cir
// are that board with each proposed value in place, run live where ngspice is installed and read
// from their recordings otherwise.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { eSeries } from "../rules/e-series.js";
import { kicadNetlist } from "../fixtures/rules/netlist-writer.js";
import type { Finding } from "../src/engine/types.js";
import { checkExpected, expectedBoards } from "./helpers/expectations.js";
import { num, numbers, rel, ruleFindings, ruleFindingsInMemory } from "./helpers/run-rule.js";
import { opValue, referenceRuns } from "./support/ngspice.js";

const FOLDER = join(process.cwd(), "fixtures/rules/e-series");



/** VCE1, VCE2 and IC1, IC2 of the cascode deck's operating point (Q1 lower, Q2 upper). */
function cascodeFigures(deck: string): Array<{ label: string; vce: [number, number]; ic: [number, number] }> {
  return referenceRuns(deck).map(({ label, data }) => ({
    label,
    vce: [opValue(data, "v(c1)") - opValue(data, "v(e1)"), opValue(data, "v(c2)") - opValue(data, "v(c1)")],
    ic: [opValue(data, "i(@q1[ic])"), opValue(data, "i(@q2[ic])")],
  }));
}

/** Our figures against ngspice's: node voltages within 0.5 % and currents within 1 % (the solver's
 * stated agreement with ngspice, issue 3). */
function expectCascode(volts: number[], amps: number[], deck: string): void {
  for (const run of cascodeFigures(deck)) {
    for (const i of [0, 1]) {
      expect(rel(volts[i] ?? Number.NaN, run.vce[i] ?? Number.NaN), `${deck} (${run.label}) VCE${i + 1}`).toBeLessThan(0.005);
      expect(rel(amps[i] ?? Number.NaN, run.ic[i] ?? Number.NaN), `${deck} (${run.label}) IC${i + 1}`).toBeLessThan(0.01);
    }
  }
}

describe("e-series on the fixture boards", () => {
  for (const { expected, board } of expectedBoards(FOLDER)) {
    it(`${expected.board}: ${expected.why.slice(0, 60)}…`, () => {
      checkExpected(ruleFindings(eSeries, board), expected);
    });
  }
});

describe("e-series operating-point shifts on the cascode design (ngspice)", () => {
  const findings = ruleFindings(eSeries, join(FOLDER, "cascode-design-values.net"));
  const byRef = (ref: string): Finding | undefined => findings.find((f) => f.parts.includes(ref));

  it("reports the devices in order Q1 (lower), Q2 (upper)", () => {
    expect(byRef("R2")?.data.devices).toEqual(["Q1", "Q2"]);
  });

  it("starts from the design's own operating point", () => {
    // reference-data §5(c), 2N3904 row [SIM]: VCE1 2.4349 V, VCE2 3.1176 V, IC1 0.8660 mA.
    const f = byRef("R2");
    expect(rel(numbers(f, "beforeVolts")[0] ?? 0, 2.4349)).toBeLessThan(0.005);
    expect(rel(numbers(f, "beforeVolts")[1] ?? 0, 3.1176)).toBeLessThan(0.005);
    expect(rel(numbers(f, "beforeAmps")[0] ?? 0, 0.8660e-3)).toBeLessThan(0.01);
    expectCascode(numbers(f, "beforeVolts"), numbers(f, "beforeAmps"), "eseries_cascode_design");
  });

  const cases: Array<[string, string, string]> = [
    ["R2", "eseries_cascode_r2_24k", "eseries_cascode_r2_27k"],
    ["R3", "eseries_cascode_r3_13k", "eseries_cascode_r3_15k"],
    ["R4", "eseries_cascode_re_680", "eseries_cascode_re_750"],
  ];
  for (const [ref, belowDeck, aboveDeck] of cases) {
    it(`${ref}: each neighbour's re-solved VCE/IC agree with ngspice`, () => {
      const f = byRef(ref);
      expectCascode(numbers(f, "belowVolts"), numbers(f, "belowAmps"), belowDeck);
      expectCascode(numbers(f, "aboveVolts"), numbers(f, "aboveAmps"), aboveDeck);
    });
  }

  it("chooses the neighbour with the smaller largest relative shift, as ngspice ranks them", () => {
    // Largest relative change of VCE1, VCE2, IC1, IC2 from the design point, from ngspice alone.
    const [design] = cascodeFigures("eseries_cascode_design");
    const worst = (deck: string): number => {
      const [run] = cascodeFigures(deck);
      if (!design || !run) throw new Error("no run");
      return Math.max(...[0, 1].flatMap((i) => [rel(run.vce[i] ?? 0, design.vce[i] ?? 1), rel(run.ic[i] ?? 0, design.ic[i] ?? 1)]));
    };
    for (const [ref, belowDeck, aboveDeck] of cases) {
      const f = byRef(ref);
      const expectBelow = worst(belowDeck) < worst(aboveDeck);
      expect(num(f, "chosen"), ref).toBe(expectBelow ? num(f, "below") : num(f, "above"));
      expect(rel(num(f, "belowShift"), worst(belowDeck)), `${ref} below shift`).toBeLessThan(0.05);
      expect(rel(num(f, "aboveShift"), worst(aboveDeck)), `${ref} above shift`).toBeLessThan(0.05);
    }
  });

  it("reports the point with every proposal fitted together, as ngspice and reference-data §5(c) give it", () => {
    // reference-data §5(c), E24 2N3904 row [SIM]: VCE1 2.3309 V, VCE2 2.7299 V, IC1 0.9945 mA.
    const f = byRef("R3");
    const volts = numbers(f, "combinedVolts");
    const amps = numbers(f, "combinedAmps");
    expect(rel(volts[0] ?? 0, 2.3309)).toBeLessThan(0.005);
    expect(rel(volts[1] ?? 0, 2.7299)).toBeLessThan(0.005);
    expect(rel(amps[0] ?? 0, 0.9945e-3)).toBeLessThan(0.01);
    expectCascode(volts, amps, "eseries_cascode_e24");
    expect(f?.message).toContain("With every proposed value fitted together (R2 24 kΩ, R3 15 kΩ, R4 680 Ω)");
  });

  it("says a netlist cannot be fixed in place", () => {
    expect(byRef("R2")?.fix).toBeUndefined();
    expect(byRef("R2")?.data.hasFix).toBe(false);
    expect(byRef("R2")?.message).toContain("no automatic fix");
  });
});

/** A passive divider (no transistor: the choice falls to the nearer value by ratio). */
function divider(values: string[], config?: object): Finding[] {
  const lines = values.map((v, i) => `R${i + 1} +9V n${i} ${v}`);
  const files: Record<string, string> = { "/b/d.net": kicadNetlist("d", [...lines, ...values.map((_, i) => `R${i + 101} n${i} GND 10k`)]) };
  if (config) files["/b/loadline.json"] = JSON.stringify(config);
  return ruleFindingsInMemory(eSeries, files, "/b/d.net");
}

describe("e-series snapping oracles (reference-data §1.4)", () => {
  it("nearest E24 to 319 is 330 [DOC: a published E-series package's documentation]", () => {
    const [f] = divider(["319"]);
    expect(num(f, "chosen")).toBe(330);
    expect(f?.data.chosenBy).toBe("nearest");
  });

  it("the E24 members around 5000 are 4700 and 5100 [DOC, same source]", () => {
    const [f] = divider(["5000"]);
    expect([num(f, "below"), num(f, "above")]).toEqual([4700, 5100]);
  });

  it("a 1 % part is held to E96: 184 Ω has 187 Ω as its next member up [DOC, same source]", () => {
    const [f] = divider(["184 Tolerance=1%"]);
    expect(f?.data.series).toBe("E96");
    expect(num(f, "above")).toBe(187);
    expect(f?.message).toContain("the series of its 1 % tolerance");
  });

  it("16 834.2 Ω snaps to 16.9 kΩ in E96 [DOC: an open-source EDA calculator's help]", () => {
    const [f] = divider(["16834.2 Tolerance=1%"]);
    expect(num(f, "chosen")).toBe(16900);
  });

  it("E12 ratio mid-points: 25k → 27k, 14k → 15k, 51k → 47k, 700 → 680, 5.0k → 4.7k [CALC, reference-data §1.4]", () => {
    const found = divider(["25k", "14k", "51k", "700", "5.0k"], { series: { resistor: "E12" } });
    expect(found.map((f) => [f.parts[0], num(f, "chosen")])).toEqual([["R1", 27000], ["R2", 15000], ["R3", 47000], ["R4", 680], ["R5", 4700]]);
    expect(found[0]?.message).toContain("the series configured for a resistor");
  });

  it("a member of the configured series passes whatever its tolerance (5 % part at 4.7k)", () => {
    expect(divider(["4k7 Tolerance=5%"])).toEqual([]);
  });

  it("capacitors only with series.capacitorCheck, against series.capacitor (E12 by default)", () => {
    const board = kicadNetlist("c", ["R1 +9V a 10k", "C1 a GND 5n"]);
    expect(ruleFindingsInMemory(eSeries, { "/c/c.net": board }, "/c/c.net")).toEqual([]);
    const found = ruleFindingsInMemory(eSeries, { "/c/c.net": board, "/c/loadline.json": JSON.stringify({ series: { capacitorCheck: true } }) }, "/c/c.net");
    expect(found).toHaveLength(1);
    expect([num(found[0], "below"), num(found[0], "above"), num(found[0], "chosen")]).toEqual([4.7e-9, 5.6e-9, 4.7e-9]);
    expect(found[0]?.message).toContain("a capacitor does not set the DC operating point");
  });

  it("inductors only with the inductors option", () => {
    const board = kicadNetlist("l", ["L1 +9V a 11u", "R1 a GND 1k"]);
    expect(ruleFindingsInMemory(eSeries, { "/l/l.net": board }, "/l/l.net")).toEqual([]);
    const config = { rules: { "e-series": { options: { inductors: true } } } };
    const found = ruleFindingsInMemory(eSeries, { "/l/l.net": board, "/l/loadline.json": JSON.stringify(config) }, "/l/l.net");
    expect([num(found[0], "below"), num(found[0], "above")]).toEqual([10e-6, 12e-6]);
  });
});

describe("e-series fix edits on a schematic", () => {
  it("carries the chosen value as an edit of the Value string, in the board's own style", () => {
    // fixtures/fix/divider-crlf.kicad_sch: R3 is 7k3 with a ±1 % Tolerance field, so E96 applies:
    // its neighbours are 7.15 k and 7.32 k (IEC 60063 E96; 7.23 k is E192 only), and 7.32 k is nearer by ratio.
    const path = join(process.cwd(), "fixtures/fix/divider-crlf.kicad_sch");
    const found = ruleFindings(eSeries, path);
    const f = found.find((x) => x.parts.includes("R3"));
    expect([num(f, "below"), num(f, "above"), num(f, "chosen")]).toEqual([7150, 7320, 7320]);
    expect(f?.fix?.replacement).toBe("7k32");
    expect(f?.fix?.description).toBe("R3 7k3 -> 7k32");
    const text = readFileSync(path, "utf8");
    const span = f?.fix?.span;
    expect(span?.file).toBe(path);
    expect(text.slice(span?.start ?? 0, span?.end ?? 0)).toBe('"7k3"');
    expect(f?.data.hasFix).toBe(true);
  });
});
