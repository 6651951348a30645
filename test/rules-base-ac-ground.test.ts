// base-ac-ground against figures from outside the project: the operating point of the ngspice 39
// cascode deck (reference-data §6.6, recorded in test/reference/ngspice) for what the common-base
// stage tolerates, and the divider's Thevenin resistance in parallel with the base capacitor,
// computed here by hand, for the base impedance.
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { createContext } from "../src/engine/context.js";
import { defaultConfig } from "../src/engine/config.js";
import { readDesign } from "../src/read/index.js";
import { loadRecording, opValue } from "./support/ngspice.js";
import { describeRuleBoards, lintBoard } from "./helpers/rule-boards.js";

describeRuleBoards("base-ac-ground");

const VT = 0.025852; // kT/q at 27 °C, the temperature ngspice runs at (reference-data, header note)

describe("base-ac-ground: what the common-base stage tolerates, from the ngspice operating point", () => {
  const rec = loadRecording("cascode_9v_12k_5k6_6k8");
  const ic2 = opValue(rec, "i(@q2[ic])");
  const ib2 = opValue(rec, "i(@q2[ib])");
  const cpi2 = opValue(rec, "@q2[cpi]");

  it("0.1·(β+1)·VT/IC and the Cπ roll-off agree with the finding's limit", () => {
    const limitLow = 0.1 * (ic2 / ib2 + 1) * (VT / ic2);
    expect(limitLow).toBeCloseTo(221.0, 0); // reference-data §6.6 figures: IC2 1.707 mA, IB2 11.78 µA
    const { findings } = lintBoard(resolve("fixtures/rules/base-ac-ground/cascode-1n.net"));
    const f = findings.find((x) => x.rule === "base-ac-ground");
    expect(Math.abs(Number(f?.data.lowFrequencyLimitOhms) / limitLow - 1)).toBeLessThan(0.02);
    // At 0.5 MHz the limit is 0.1/|1/((β+1)r_e) + jωCπ| with Cπ from the same ngspice run.
    const w = 2 * Math.PI * 0.5e6;
    const limitAt = 0.1 / Math.hypot(1 / (limitLow / 0.1), w * cpi2);
    expect(Math.abs(Number(f?.data.limitOhms) / limitAt - 1)).toBeLessThan(0.03);
  });

  it("the base impedance is the divider's Thevenin resistance in parallel with the capacitor", () => {
    const read = readDesign(resolve("fixtures/rules/base-ac-ground/cascode-1n.net"));
    if (!read.ok) throw new Error(read.error.message);
    const ctx = createContext(read.circuit, defaultConfig());
    const rth = (12e3 * 12.4e3) / (12e3 + 12.4e3); // reference-data §3: 6.10 kΩ
    for (const f of [0.5e6, 2e6, 10e6]) {
      const expected = 1 / Math.hypot(1 / rth, 2 * Math.PI * f * 1e-9);
      const got = ctx.impedance("b2", [f], { passiveOnly: true })?.[0]?.magnitude ?? NaN;
      // ESR/ESL of the 0603 part and the rail's own impedance move this by well under 1 %.
      expect(Math.abs(got / expected - 1)).toBeLessThan(0.01);
    }
  });

  it("classifies the cascode halves and finds the stack", () => {
    const read = readDesign(resolve("fixtures/rules/base-ac-ground/cascode-1n.net"));
    if (!read.ok) throw new Error(read.error.message);
    const ctx = createContext(read.circuit, defaultConfig());
    expect(ctx.stage("Q1")?.configuration).toBe("common-emitter");
    expect(ctx.stage("Q2")?.configuration).toBe("common-base");
    expect(ctx.stacks()).toEqual([{ refs: ["Q1", "Q2"], rail: "+9V", loads: ["R5"] }]);
    // The DC operating point against ngspice (reference-data §6.6): IC2 1.706952 mA.
    const q2 = ctx.device("Q2");
    expect(q2?.kind).toBe("bjt");
    if (q2?.kind === "bjt") expect(Math.abs(q2.ic / 1.706952e-3 - 1)).toBeLessThan(0.01);
  });

  it("bias(): the Thevenin equivalent of the upper base network, transistors removed", () => {
    const read = readDesign(resolve("fixtures/rules/base-ac-ground/cascode-1n.net"));
    if (!read.ok) throw new Error(read.error.message);
    const ctx = createContext(read.circuit, defaultConfig());
    const bias = ctx.bias("Q2", "B");
    // Unloaded divider (reference-data §6.6): VB2 = 9·12.4k/24.4k = 4.574 V, R_Th = 12k ∥ 12.4k.
    expect(bias?.volts).toBeCloseTo(9 * 12.4 / 24.4, 6);
    expect(bias?.ohms).toBeCloseTo((12e3 * 12.4e3) / 24.4e3, 3);
    // R6 sits behind the coupling capacitor C3: not part of the DC network.
    expect(bias?.parts).toEqual(["R1", "R2", "R3"]);
  });
});
