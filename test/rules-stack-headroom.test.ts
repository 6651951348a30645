// stack-headroom: each device's VCE − VCE(sat) (VDS − VDS(sat)), the output swing the stack allows
// and the supply it would need, checked against ngspice on the same circuits (the cascode of
// reference-data §6.6 and variants, a dual-gate MOSFET as two channels) and the reference's own
// hand limits (swing ≈ 2.5 V down, 2.56 V up).
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { stackHeadroom } from "../rules/stack-headroom.js";
import type { Finding } from "../src/engine/types.js";
import { checkExpected, expectedBoards } from "./helpers/expectations.js";
import { num, numbers, rel, ruleFindings } from "./helpers/run-rule.js";
import { acFrequencies, acVector, opValue, referenceRuns } from "./support/ngspice.js";

const FOLDER = join(process.cwd(), "fixtures/rules/stack-headroom");
const board = (name: string): string => join(FOLDER, name, `${name}.net`);



/** VCE1 = V(c1) − V(e1), VCE2 = V(c2) − V(c1) of a cascode deck (Q1 lower, Q2 upper). */
function cascodeVce(deck: string): Array<{ label: string; vce: [number, number]; vc2: number }> {
  return referenceRuns(deck).map(({ label, data }) => ({
    label,
    vce: [opValue(data, "v(c1)") - opValue(data, "v(e1)"), opValue(data, "v(c2)") - opValue(data, "v(c1)")],
    vc2: opValue(data, "v(c2)"),
  }));
}

/** Datasheet VCE(sat) of the 2N3904, ≤ 0.2 V at IC 10 mA, IB 1 mA (reference-data §4.5). */
const VCE_SAT = 0.2;

describe("stack-headroom on the fixture boards", () => {
  for (const { expected, board: path } of expectedBoards(FOLDER)) {
    it(`${expected.board}: ${expected.why.slice(0, 60)}…`, () => {
      checkExpected(ruleFindings(stackHeadroom, path), expected);
    });
  }
});

describe("stack-headroom figures against ngspice: the 9 V cascode (reference-data §6.6)", () => {
  const [f] = ruleFindings(stackHeadroom, board("cascode-3v-swing"));

  it("reports each device's VCE and headroom over the datasheet VCE(sat)", () => {
    expect(f?.data.devices).toEqual(["Q1", "Q2"]);
    for (const run of cascodeVce("cascode_9v_12k_5k6_6k8")) {
      // reference-data §6.6 [SIM]: VCE1 2.052159 V, VCE2 2.656804 V.
      expect(rel(numbers(f, "volts")[0] ?? 0, run.vce[0]), run.label).toBeLessThan(0.005);
      expect(rel(numbers(f, "volts")[1] ?? 0, run.vce[1]), run.label).toBeLessThan(0.005);
      expect(rel(numbers(f, "headroomVolts")[1] ?? 0, run.vce[1] - VCE_SAT), run.label).toBeLessThan(0.005);
    }
    expect(numbers(f, "satVolts")).toEqual([VCE_SAT, VCE_SAT]);
  });

  it("splits the output swing between the devices as ngspice's AC solution does", () => {
    // Share of the output swing across each device at the band centre 10^6.5 Hz, from the recorded
    // and live AC sweep of the same cascode: |v(c1) − v(e1)|/|v(c2)| and |v(c2) − v(c1)|/|v(c2)|.
    for (const { label, data } of referenceRuns("cascode_9v_12k_5k6_6k8")) {
      const k = acFrequencies(data).findIndex((hz) => Math.abs(hz / 10 ** 6.5 - 1) < 1e-6);
      expect(k, `${label}: 3.1623 MHz on the grid`).toBeGreaterThanOrEqual(0);
      const at = (v: string): [number, number] => [acVector(data, v).re[k] ?? Number.NaN, acVector(data, v).im[k] ?? Number.NaN];
      const [c1, e1, c2] = [at("v(c1)"), at("v(e1)"), at("v(c2)")];
      const out = Math.hypot(...c2);
      const share1 = Math.hypot(c1[0] - e1[0], c1[1] - e1[1]) / out;
      const share2 = Math.hypot(c2[0] - c1[0], c2[1] - c1[1]) / out;
      expect(Math.abs((numbers(f, "swingShare")[0] ?? 0) - share1), `${label} Q1 share ${share1}`).toBeLessThan(0.002);
      expect(rel(numbers(f, "swingShare")[1] ?? 0, share2), `${label} Q2 share`).toBeLessThan(0.005);
      // Toward the devices the output stops when Q2 reaches VCE(sat): (VCE2 − 0.2 V)/share2.
      const vce2 = opValue(data, "v(c2)") - opValue(data, "v(c1)");
      expect(rel(num(f, "towardDevicesVolts"), (vce2 - VCE_SAT) / share2), label).toBeLessThan(0.005);
    }
  });

  it("gives the supply the stack would need for 3 V at the same currents", () => {
    // 9 V + (3·share2 − (VCE2 − 0.2)) + (3 − (9 − VC2)); Q1's share of 3 V is far inside its 1.85 V [CALC].
    for (const run of cascodeVce("cascode_9v_12k_5k6_6k8")) {
      const share2 = numbers(f, "swingShare")[1] ?? 1;
      const expected = 9 + (3 * share2 - (run.vce[1] - VCE_SAT)) + (3 - (9 - run.vc2));
      expect(rel(num(f, "supplyNeededVolts"), expected), run.label).toBeLessThan(0.002);
    }
    expect(f?.data.shortDevices).toEqual(["Q2"]);
  });
});

describe("stack-headroom figures against ngspice: variants", () => {
  it("6 V rail: VCEs as ngspice gives them (stack_cascode_6v.cir)", () => {
    const [f] = ruleFindings(stackHeadroom, board("cascode-6v"));
    for (const run of cascodeVce("stack_cascode_6v")) {
      expect(rel(numbers(f, "volts")[0] ?? 0, run.vce[0]), run.label).toBeLessThan(0.005);
      expect(rel(numbers(f, "volts")[1] ?? 0, run.vce[1]), run.label).toBeLessThan(0.005);
      expect(rel(num(f, "towardLoadVolts"), 6 - run.vc2), run.label).toBeLessThan(0.005);
    }
  });

  it("choke load: no load-side limit, Q2's VCE as ngspice gives it (stack_cascode_choke.cir)", () => {
    const [f] = ruleFindings(stackHeadroom, board("cascode-choke-load"));
    expect(f?.data.towardLoadVolts).toBeUndefined();
    for (const run of cascodeVce("stack_cascode_choke")) {
      expect(rel(numbers(f, "volts")[1] ?? 0, run.vce[1]), run.label).toBeLessThan(0.005);
    }
  });

  it("dual-gate MOSFET: each channel's VDS and VDS(sat) = VGS − VTO as ngspice gives them (stack_dualgate_5v.cir)", () => {
    const [f] = ruleFindings(stackHeadroom, board("dual-gate-5v"));
    expect(f?.data.devices).toEqual(["M1 (gate-1 channel)", "M1 (gate-2 channel)"]);
    for (const { label, data } of referenceRuns("stack_dualgate_5v")) {
      const vds = [opValue(data, "v(mid)") - opValue(data, "v(s)"), opValue(data, "v(d)") - opValue(data, "v(mid)")];
      const vgs = [opValue(data, "v(g1)") - opValue(data, "v(s)"), opValue(data, "v(g2)") - opValue(data, "v(mid)")];
      const vto = -0.8; // the library card's VTO (reference-data §4.4 estimate)
      for (const i of [0, 1]) {
        expect(rel(numbers(f, "volts")[i] ?? 0, vds[i] ?? 0), `${label} VDS${i + 1}`).toBeLessThan(0.005);
        expect(rel(numbers(f, "satVolts")[i] ?? 0, (vgs[i] ?? 0) - vto), `${label} VDS(sat)${i + 1}`).toBeLessThan(0.005);
      }
    }
  });
});

describe("stack-headroom on the clean board", () => {
  it("fixtures/clean/clean-preamp.kicad_sch gives no warning or error", () => {
    const found = ruleFindings(stackHeadroom, join(process.cwd(), "fixtures/clean/clean-preamp.kicad_sch"));
    expect(found.filter((x) => x.severity !== "note").map((x) => x.message)).toEqual([]);
  });
});
