// `loadline bias` on the bipolar cascode fixture, which is the 9 V cascode deck of reference-data
// §6.6 (12k/5.6k/6.8k stack, 2N3904 GP card) drawn as a KiCad 7 schematic. Check values are the
// ngspice 39 figures printed in §6.6 [SIM].
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { runBias } from "../src/cli/bias.js";
import type { BiasReport } from "../src/engine/bias.js";

function run(paths: string[], json: boolean): { code: number; out: string; err: string } {
  let out = "";
  let err = "";
  const code = runBias(paths, { json }, { stdout: (s) => { out += s; }, stderr: (s) => { err += s; }, cwd: process.cwd() });
  return { code, out, err };
}

describe("loadline bias", () => {
  const board = resolve("fixtures/bjt-cascode-stack/bjt-cascode-stack.kicad_sch");

  it("gives the cascode's Q-points and rail current as ngspice does (reference-data §6.6)", () => {
    const { code, out } = run([board], true);
    expect(code).toBe(0);
    const report = JSON.parse(out.trim()) as BiasReport;
    expect(report.converged).toBe(true);
    const rail = report.rails.find((r) => r.net === "+9V");
    expect(rail?.volts).toBe(9);
    // i(vcc) = −2.08509 mA in SPICE sign: the supply delivers 2.08509 mA.
    expect(Math.abs((rail?.amps ?? 0) / 2.08509e-3 - 1)).toBeLessThan(0.01);
    const q1 = report.devices.find((d) => d.ref === "Q1");
    const q2 = report.devices.find((d) => d.ref === "Q2");
    if (!q1 || !("vce" in q1) || !q2 || !("vce" in q2)) throw new Error("Q1/Q2 missing or not bipolar");
    expect(q1.region).toBe("active");
    expect(q2.region).toBe("active");
    expect(Math.abs(q1.vce - 2.052159)).toBeLessThan(1e-3 + 0.005 * 2.052159);
    expect(Math.abs(q2.vce - 2.656804)).toBeLessThan(1e-3 + 0.005 * 2.656804);
    expect(Math.abs(q1.ic / 1.718729e-3 - 1)).toBeLessThan(0.01);
    expect(Math.abs(q2.ic / 1.706952e-3 - 1)).toBeLessThan(0.01);
    // VBE1 = v(b1) − v(e1) = 2.410284 − 1.730640 V.
    expect(Math.abs(q1.vbe - (2.410284 - 1.73064))).toBeLessThan(1e-3);
  });

  it("prints a readable table without --json", () => {
    const { code, out } = run([board], false);
    expect(code).toBe(0);
    expect(out).toContain("DC solution converged");
    expect(out).toMatch(/Q1\s+npn\s+active\s+VBE 0\.68 V\s+VCE 2\.05 V\s+IC 1\.72 mA/);
  });

  it("reports an unreadable design with file, line and column, still reports the others, and exits 2", () => {
    const { code, out, err } = run(["fixtures/does-not-exist.kicad_sch", board], true);
    expect(code).toBe(2);
    expect(err).toMatch(/does-not-exist\.kicad_sch:0:0: error: /);
    expect(out.trim().split("\n")).toHaveLength(1);
  });
});
