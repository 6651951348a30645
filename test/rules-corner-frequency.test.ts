// corner-frequency against published worked examples: Boylestad & Nashelsky's BJT low-frequency
// example (ch. 9; answers from memory, recomputed in reference-data §3) and their JFET self-bias
// example with the ngspice 39 transconductance (reference-data §5(b), recorded deck).
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { createContext } from "../src/engine/context.js";
import { testConfig } from "./helpers/config.js";
import { readDesign } from "../src/read/index.js";
import { loadRecording, opValue } from "./support/ngspice.js";
import { describeRuleBoards, lintBoard } from "./helpers/rule-boards.js";

describeRuleBoards("corner-frequency");

describe("corner-frequency: the resistance each capacitor works into", () => {
  it("emitter bypass: RE ∥ (rπ + R's)/(β+1) from the hybrid-π model at the solved operating point", () => {
    const read = readDesign(resolve("fixtures/rules/corner-frequency/ce-audio/ce-audio.net"));
    if (!read.ok) throw new Error(read.error.message);
    const ctx = createContext(read.circuit, testConfig({ band: { low: 100, high: 20e3, isDefault: false } }));
    const q = ctx.device("Q1");
    if (q?.kind !== "bjt") throw new Error("Q1 not solved");
    // Textbook small-signal result (Boylestad & Nashelsky ch. 9): R_e = RE ∥ (R's/β + r_e); in
    // hybrid-π terms RE ∥ (rπ + R's)/(β+1), with R's = Rs ∥ R1 ∥ R2 and β = gm·rπ.
    const rpi = 1 / q.gpi;
    const beta = q.gm * rpi;
    const rsPrime = 1 / (1 / 1e3 + 1 / 40e3 + 1 / 10e3);
    const branch = (rpi + rsPrime) / (beta + 1);
    const expected = (2e3 * branch) / (2e3 + branch);
    const { findings } = lintBoard(resolve("fixtures/rules/corner-frequency/ce-audio/ce-audio.net"));
    const ce = findings.find((f) => f.parts.includes("C3"));
    expect(Math.abs(Number(ce?.data.seenOhms) / expected - 1)).toBeLessThan(0.005);
    expect(Number(ce?.data.cornerHertz)).toBeCloseTo(1 / (2 * Math.PI * Number(ce?.data.seenOhms) * 20e-6), 6);
    // And the suggested value meets corner ≤ f_low/10 and is an E12 member (IEC 60063).
    expect(1 / (2 * Math.PI * Number(ce?.data.seenOhms) * Number(ce?.data.suggestedFarads))).toBeLessThanOrEqual(10);
  });

  it("source bypass: RS ∥ 1/gm with the ngspice transconductance of the same JFET stage", () => {
    const gm = opValue(loadRecording("jfet_selfbias"), "@j1[gm]");
    expect(gm).toBeCloseTo(1.516603e-3, 8); // reference-data §5(b)
    const expected = 1 / (1 / 1e3 + gm);
    const { findings } = lintBoard(resolve("fixtures/rules/corner-frequency/jfet-source-bypass/jfet-source-bypass.net"));
    const cs = findings.find((f) => f.parts.includes("C1"));
    expect(Math.abs(Number(cs?.data.seenOhms) / expected - 1)).toBeLessThan(0.005);
  });
});
