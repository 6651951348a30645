// Structure questions of the Context on small hand-built boards. The expected configurations are
// facts of the trade: in a bipolar cascode the lower device is common-emitter and the upper one,
// whose emitter is fed by the lower collector and whose base is bypassed, is common-base.
import { describe, expect, it } from "vitest";
import { createContext, logGrid } from "../src/engine/context.js";
import { testConfig as defaultConfig } from "./helpers/config.js";
import { voltsFromNetName } from "../src/engine/context-rails.js";
import { buildCircuit } from "./helpers/build-circuit.js";

// The cascode of reference-data §6.6 (ngspice netlist cascode_9v_12k_5k6_6k8.cir), nets renamed.
const cascode = [
  "R1 +9V b2 12k", "R2 b2 b1 5.6k", "R3 b1 GND 6.8k", "CB2 b2 GND 10u",
  "Q1 c1 b1 e1 npn", "RE e1 GND 1k", "CE e1 GND 100u", "Q2 c2 b2 c1 npn", "RC +9V c2 1.5k",
  "CIN in b1 10u", "COUT c2 out 10u", "RL out GND 10k", "CBULK +9V GND 100u", "CHF +9V GND 100n",
];

describe("rail names", () => {
  it("reads KiCad power-symbol spellings", () => {
    expect(voltsFromNetName("+9V")).toBe(9);
    expect(voltsFromNetName("+3V3")).toBeCloseTo(3.3, 12);
    expect(voltsFromNetName("+3.3V")).toBeCloseTo(3.3, 12);
    expect(voltsFromNetName("-5V")).toBe(-5);
    expect(voltsFromNetName("/preamp/+12V")).toBe(12);
    expect(voltsFromNetName("VCC_9V")).toBe(9);
    expect(voltsFromNetName("VCC")).toBeUndefined();
    expect(voltsFromNetName("R10V")).toBeUndefined();
  });
});

describe("Context topology", () => {
  const ctx = createContext(buildCircuit(cascode), defaultConfig());

  it("finds ground and the rail", () => {
    expect(ctx.ground()).toEqual(["GND"]);
    expect(ctx.rails()).toEqual([{ net: "+9V", volts: 9, from: "name" }]);
  });

  it("classifies the cascode halves", () => {
    expect(ctx.stage("Q1")?.configuration).toBe("common-emitter");
    expect(ctx.stage("Q2")?.configuration).toBe("common-base");
    expect(ctx.stage("Q2")?.nets).toEqual({ C: "c2", B: "b2", E: "c1" });
  });

  it("finds the stack with its load", () => {
    expect(ctx.stacks()).toEqual([{ refs: ["Q1", "Q2"], rail: "+9V", loads: ["RC"] }]);
  });

  it("lists the loads fed from the rail", () => {
    const loads = ctx.railLoads("+9V");
    expect(loads.map((l) => [l.part.ref, l.device.ref, l.ohms])).toEqual([["RC", "Q2", 1500]]);
  });

  it("finds the base bypass and the rail bypasses", () => {
    expect(ctx.groundingCapacitors("b2").map((p) => p.ref)).toEqual(["CB2"]);
    expect(ctx.groundingCapacitors("+9V").map((p) => p.ref).sort()).toEqual(["CBULK", "CHF"]);
  });

  it("still calls the upper device common-base when its base bypass is missing", () => {
    const bare = createContext(buildCircuit(cascode.filter((l) => !l.startsWith("CB2"))), defaultConfig());
    expect(bare.stage("Q2")?.configuration).toBe("common-base");
  });

  it("tells an emitter follower and a common-gate JFET apart", () => {
    const c = createContext(buildCircuit([
      "Q1 +9V b e npn", "R1 +9V b 100k", "R2 b GND 100k", "RE e GND 1k", "CIN in b 1u",
      "J1 d GND s njfet", "RS s GND 220", "RD +9V d 1k", "CS in2 s 10n",
    ]), defaultConfig());
    expect(c.stage("Q1")?.configuration).toBe("common-collector");
    expect(c.stage("J1")?.configuration).toBe("common-gate");
  });

  it("does not take a tuned collector tank for an AC ground", () => {
    const c = createContext(buildCircuit([
      "Q1 c b GND npn", "L1 +9V c 10u", "C1 +9V c 1n", "R1 +9V b 470k", "CIN in b 10n",
    ]), defaultConfig());
    expect(c.stage("Q1")?.configuration).toBe("common-emitter");
  });
});

describe("frequency grid", () => {
  it("spans a decade beyond each band edge and includes the edges", () => {
    const f = logGrid(50e3, 300e6, 20, [0.5e6, 30e6]);
    expect(f[0]).toBeCloseTo(50e3, 6);
    expect(f[f.length - 1]).toBeCloseTo(300e6, 0);
    expect(f).toContain(0.5e6);
    expect(f).toContain(30e6);
  });
});

// operatingPointWith (what the e-series rule uses) against the ngspice 39 runs of the Neamen cascode
// design (reference-data §5(c): exact 51k/25k/14k, RE 700, RC 3.3k vs the E24 set 51k/24k/15k, 680).
describe("operatingPointWith: re-solving with resistors changed", () => {
  it("moves VCE2 and IC1 as ngspice shows for E24 snapping (2N3904 GP card)", async () => {
    const { kicadNetlist } = await import("../fixtures/rules/netlist-writer.js");
    const { readDesign, memoryFileSource } = await import("../src/read/index.js");
    const text = kicadNetlist("neamen", [
      "R1 +9V b2 51k", "R2 b2 b1 25k", "R3 b1 GND 14k", "Q1 c1 b1 e1 2N3904", "R4 e1 GND 700",
      "Q2 c2 b2 c1 2N3904", "R5 +9V c2 3.3k",
    ]);
    const read = readDesign("/n/neamen.net", { fs: memoryFileSource({ "/n/neamen.net": text }) });
    if (!read.ok) throw new Error(read.error.message);
    const ctx = createContext(read.circuit, defaultConfig());
    const vce = (op: ReturnType<typeof ctx.operatingPoint>, ref: string): number => {
      const d = op?.devices[ref];
      return d?.kind === "bjt" ? d.vce : NaN;
    };
    const exact = ctx.operatingPoint();
    expect(Math.abs(vce(exact, "Q2") / 3.1176 - 1)).toBeLessThan(0.01); // [SIM] exact set, 2N3904 GP
    const e24 = ctx.operatingPointWith({ R2: 24e3, R3: 15e3, R4: 680 });
    expect(Math.abs(vce(e24, "Q2") / 2.7299 - 1)).toBeLessThan(0.01); // [SIM] E24 set
    expect(Math.abs(vce(e24, "Q1") / 2.3309 - 1)).toBeLessThan(0.01);
    const q1 = e24?.devices.Q1;
    expect(q1?.kind === "bjt" ? q1.ic : NaN).toBeGreaterThan(0.9945e-3 * 0.99);
    expect(q1?.kind === "bjt" ? q1.ic : NaN).toBeLessThan(0.9945e-3 * 1.01);
    // Cached: the same overrides give the same object back.
    expect(ctx.operatingPointWith({ R4: 680, R3: 15e3, R2: 24e3 })).toBe(e24);
  });
});

// transfer(): the small-signal voltage transfer at the operating point, against the ngspice 39 run of
// the 9 V common-emitter stage (reference-data §6.5, deck ce_9v_2n3904.cir, recorded).
describe("transfer: V(out)/V(in) at the operating point", () => {
  it("matches |v(out)/v(b)| of the ngspice common-emitter deck from 100 Hz to 10 MHz within 1 %", async () => {
    const { kicadNetlist } = await import("../fixtures/rules/netlist-writer.js");
    const { readDesign, memoryFileSource } = await import("../src/read/index.js");
    const { acFrequencies, acVector, loadRecording } = await import("./support/ngspice.js");
    // The deck's capacitors are ideal: ESR and ESL fields of 0 keep ours ideal too.
    const ideal = "ESR=0 ESL=0";
    const text = kicadNetlist("ce", [
      "R1 +9V b 56k", "R2 b GND 10k", "R3 +9V c 3.9k", "R4 e GND 680", `C1 e GND 100u ${ideal}`,
      "Q1 c b e 2N3904", `C2 in b 10u ${ideal}`, `C3 c out 10u ${ideal}`, "R5 out GND 10k", "R6 in GND 1G",
    ]);
    const read = readDesign("/t/ce.net", { fs: memoryFileSource({ "/t/ce.net": text }) });
    if (!read.ok) throw new Error(read.error.message);
    const ctx = createContext(read.circuit, defaultConfig());
    const rec = loadRecording("ce_9v_2n3904");
    const freqs = acFrequencies(rec);
    const vb = acVector(rec, "v(b)");
    const vout = acVector(rec, "v(out)");
    const picked = freqs.map((f, i) => ({ f, i })).filter(({ f }) => f >= 100 && f <= 10e6).filter((_, k) => k % 5 === 0);
    const got = ctx.transfer("b", "out", picked.map((p) => p.f));
    expect(got).toBeDefined();
    for (const [k, { i }] of picked.entries()) {
      const expected = Math.hypot(vout.re[i] ?? NaN, vout.im[i] ?? NaN) / Math.hypot(vb.re[i] ?? NaN, vb.im[i] ?? NaN);
      expect(Math.abs((got?.[k]?.magnitude ?? NaN) / expected - 1)).toBeLessThan(0.01);
    }
  });
});
