// The fixture helper's invented HF preamp in its two versions (fixtures/gen/boards/cascode-preamp.ts):
// the clean board must draw no warning or error from these rules; the demo board's 100 pF
// common-base bypass and 100 µF + 100 nF rail must be reported.
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { lintBoard } from "./helpers/rule-boards.js";

const OURS = ["rail-bypass", "base-ac-ground", "corner-frequency", "model-coverage"];

describe("shared fixture boards", () => {
  it("clean-preamp: no warnings or errors from rail-bypass, base-ac-ground, corner-frequency, model-coverage", () => {
    const { findings } = lintBoard(resolve("fixtures/clean/clean-preamp.kicad_sch"));
    const ours = findings.filter((f) => OURS.includes(f.rule) && f.severity !== "note");
    expect(ours.map((f) => `${f.rule}: ${f.message}`)).toEqual([]);
  });

  it("demo-preamp: the 100 pF base bypass fails; |Zb| = R_Th ∥ 100 pF at the band's low edge", () => {
    const { findings } = lintBoard(resolve("fixtures/demo/demo-preamp.kicad_sch"));
    const base = findings.find((f) => f.rule === "base-ac-ground");
    expect(base?.severity).toBe("warning");
    expect(base?.parts).toEqual(["Q2", "C2"]);
    // R_Th at B2 = 18k ∥ (8k5 + 6k8) with the transistors removed; 100 pF at 0.5 MHz is 3.18 kΩ.
    const rth = (18e3 * 15.3e3) / 33.3e3;
    const expected = 1 / Math.hypot(1 / rth, 2 * Math.PI * 0.5e6 * 100e-12);
    expect(Math.abs(Number(base?.data.worstOhms) / expected - 1)).toBeLessThan(0.01);
    expect(Number(base?.data.atHertz)).toBeCloseTo(0.5e6, 0);
  });

  it("demo-preamp: every rail capacitor self-resonates below 30 MHz (100 nF 0603: 16.8 MHz)", () => {
    const { findings } = lintBoard(resolve("fixtures/demo/demo-preamp.kicad_sch"));
    const rf = findings.find((f) => f.rule === "rail-bypass" && f.message.includes("no RF capacitor"));
    // 100 nF with the 0603 ESL of 0.9 nH (reference-data §2.1/§2.2): 16.8 MHz.
    expect(Number(rf?.data.highestSrfHertz) / 1e6).toBeCloseTo(16.78, 1);
    // The rail still meets its 15 Ω default target (R5 1.5 kΩ / 100), so this is a note.
    expect(rf?.severity).toBe("note");
  });
});
