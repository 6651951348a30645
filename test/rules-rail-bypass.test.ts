// rail-bypass against figures from outside the project: the ngspice 39 run of the 100 µF / 100 nF /
// 5 nF bypass network (reference-data §2.4, recorded in test/reference/ngspice) and the series
// R-L-C capacitor model |Z| = |ESR + j(ωL − 1/ωC)| (reference-data §2.1) evaluated here by hand.
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { createContext } from "../src/engine/context.js";
import { defaultConfig } from "../src/engine/config.js";
import { readDesign } from "../src/read/index.js";
import { acFrequencies, acVector, loadRecording } from "./support/ngspice.js";
import { describeRuleBoards, lintBoard } from "./helpers/rule-boards.js";
import { railBypass } from "../rules/rail-bypass.js";
import { resolveRuleOptions } from "../src/engine/rule.js";

/** Series R-L-C branch impedance (reference-data §2.1), complex as [re, im]. */
function branch(f: number, c: number, esr: number, esl: number): [number, number] {
  const w = 2 * Math.PI * f;
  return [esr, w * esl - 1 / (w * c)];
}
function magnitude([re, im]: [number, number]): number {
  return Math.hypot(re, im);
}

describeRuleBoards("rail-bypass");

describe("rail-bypass: the supply network solved against ngspice", () => {
  const read = readDesign(resolve("fixtures/rules/rail-bypass/ladder-ok.net"));
  if (!read.ok) throw new Error(read.error.message);
  const ctx = createContext(read.circuit, defaultConfig());
  const recording = loadRecording("bypass_100u_100n_5n");
  const freqs = acFrequencies(recording);
  const rail = acVector(recording, "v(rail)");

  it("matches |Z| of the 100 µF / 100 nF / 5 nF network within 0.5 % from 1 kHz to 1 GHz", () => {
    // Every 20th point of the recorded 200-per-decade sweep: 61 frequencies over six decades.
    const picked = freqs.map((f, i) => ({ f, i })).filter(({ i }) => i % 20 === 0);
    const points = ctx.impedance("+9V", picked.map((p) => p.f), { passiveOnly: true });
    expect(points).toBeDefined();
    for (const [k, { i }] of picked.entries()) {
      const expected = Math.hypot(rail.re[i] ?? NaN, rail.im[i] ?? NaN);
      // The board adds the 2N3904 stage's resistors across the rail (≥ 11 kΩ): < 0.01 % at these |Z|.
      expect(Math.abs((points?.[k]?.magnitude ?? NaN) - expected) / expected).toBeLessThan(0.005);
    }
  });

  it("puts the rail curve and its target in the report", () => {
    const { result } = lintBoard(resolve("fixtures/rules/rail-bypass/ladder-ok.net"));
    const report = result.designs[0]?.rails.find((r) => r.net === "+9V");
    expect(report?.targetOhms).toBeCloseTo(15, 9); // 1.5 kΩ / 100
    expect(report?.targetBasis).toContain("default target");
    // Worst in band: the damped plateau, 0.3547 Ω at 3.68 MHz (reference-data §2.4, ngspice 39).
    expect(report?.worst?.ohms).toBeCloseTo(0.3547, 3);
    expect(Math.abs((report?.worst?.hertz ?? 0) / 3.68e6 - 1)).toBeLessThan(0.01);
    expect(report?.curve[0]?.[0]).toBeCloseTo(50e3, 0); // a decade below 0.5 MHz
  });
});

describe("rail-bypass: figures recomputed from the series R-L-C model", () => {
  it("no-rf-capacitor: |Z| of 100 µF / 0.3 Ω / 10 nH at 30 MHz, and a suggestion that meets the target", () => {
    const z30 = magnitude(branch(30e6, 100e-6, 0.3, 10e-9));
    expect(z30).toBeCloseTo(1.9086, 4);
    const { findings } = lintBoard(resolve("fixtures/rules/rail-bypass/no-rf-capacitor.net"));
    const rf = findings.find((f) => f.message.includes("no RF capacitor"));
    expect(Number(rf?.data.highEdgeOhms) / z30 - 1).toBeLessThan(0.002);
    // The suggested part was solved into the network: it must bring the worst point under 1 Ω, and
    // its self-resonance must sit in the upper part of the band where the gap is.
    expect(Number(rf?.data.worstOhmsWithSuggestion)).toBeLessThanOrEqual(1);
    expect(Number(rf?.data.suggestedSrfHertz)).toBeGreaterThan(3e6);
  });

  it("no-bulk: |Z| of 100 nF / 30 mΩ / 0.9 nH at 0.5 MHz and the capacitance the low edge needs", () => {
    const z = magnitude(branch(0.5e6, 100e-9, 0.03, 0.9e-9));
    const { findings } = lintBoard(resolve("fixtures/rules/rail-bypass/no-bulk.net"));
    const bulk = findings.find((f) => f.message.includes("no bulk"));
    expect(Math.abs(Number(bulk?.data.lowEdgeOhms) / z - 1)).toBeLessThan(0.002);
    expect(Number(bulk?.data.neededFarads)).toBeCloseTo(1 / (2 * Math.PI * 0.5e6 * 1), 12);
    expect(Number(bulk?.data.worstOhmsWithSuggestion)).toBeLessThanOrEqual(1);
  });

  it("anti-resonance: the lossless estimate 1/(2π√((L1+L2)·C1C2/(C1+C2))) is within 3 % of the solved peak", () => {
    // reference-data §2.4: lossless formula 51.57 MHz against the damped peak at 52.71 MHz.
    const lossless = 1 / (2 * Math.PI * Math.sqrt((1.2e-9 + 0.8e-9) * (100e-9 * 5e-9) / (105e-9)));
    expect(lossless / 1e6).toBeCloseTo(51.57, 1);
    const { findings } = lintBoard(resolve("fixtures/rules/rail-bypass/anti-resonance/anti-resonance.net"));
    const peak = findings.find((f) => f.message.includes("anti-resonate"));
    expect(Math.abs(Number(peak?.data.atHertz) / lossless - 1)).toBeLessThan(0.03);
  });
});

describe("rail-bypass: a bulk capacitor held up by its ESR is named as such, not as missing", () => {
  // jfet-cascode at the default 0.5–30 MHz band: +12V has C5 47 µF 25 V (ESR 2.9 Ω, reference-data
  // §2.3 first figure for 47 µF / 25 V) beside 100 nF ceramics. At 500 kHz 47 µF is only 6.8 mΩ of
  // reactance, so the electrolytic's ESR, not its capacitance, sets the floor.
  const path = resolve("fixtures/jfet-cascode/jfet-cascode.kicad_sch");
  const read = readDesign(path);
  if (!read.ok) throw new Error(read.error.message);
  const ctx = createContext(read.circuit, defaultConfig());
  const findings = railBypass.check(ctx, resolveRuleOptions(railBypass, undefined));
  const low = findings.find((f) => f.data.esrLimited === true);

  it("says the ESR limits the low end and names the part", () => {
    expect(low?.message).toContain("C5 (47 µF) has capacitance enough, but its ESR of 2.9 Ω");
    expect(low?.message).not.toContain("no bulk capacitance");
  });

  it("reports |Z| at the low edge as the rail capacitors' series R-L-C branches in parallel (reference-data §2.1)", () => {
    const f = Number(low?.data.atHertz);
    let yRe = 0;
    let yIm = 0;
    for (const c of ctx.groundingCapacitors("+12V")) {
      const m = ctx.capacitor(c.ref);
      if (!m) continue;
      const [re, im] = branch(f, m.farads, m.esr, m.esl);
      const d = re * re + im * im;
      yRe += re / d;
      yIm -= im / d;
    }
    const z = 1 / Math.hypot(yRe, yIm);
    expect(Math.abs(Number(low?.data.lowEdgeOhms) / z - 1)).toBeLessThan(0.02);
  });
});
