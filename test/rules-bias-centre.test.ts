// bias-centre: region errors and load-line position, against ngspice on the same circuits (the 9 V
// common-emitter stage of reference-data §6.5 and variants) and against Shockley's equation for
// the JFET self-bias example of Boylestad & Nashelsky (reference-data §5(b)).
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { biasCentre } from "../rules/bias-centre.js";
import type { Finding } from "../src/engine/types.js";
import { checkExpected, expectedBoards } from "./helpers/expectations.js";
import { kicadNetlist } from "../fixtures/rules/netlist-writer.js";
import { num, rel, ruleFindings, ruleFindingsInMemory } from "./helpers/run-rule.js";
import { opValue, referenceRuns } from "./support/ngspice.js";

const FOLDER = join(process.cwd(), "fixtures/rules/bias-centre");


/** Datasheet VCE(sat) of the 2N3904, ≤ 0.2 V at IC 10 mA, IB 1 mA (reference-data §4.5). */
const VCE_SAT = 0.2;

describe("bias-centre on the fixture boards", () => {
  for (const { expected, board } of expectedBoards(FOLDER)) {
    it(`${expected.board}: ${expected.why.slice(0, 60)}…`, () => {
      checkExpected(ruleFindings(biasCentre, board), expected);
    });
  }
});

describe("bias-centre load-line figures against ngspice (live where installed, else recorded)", () => {
  const cases: Array<[string, string, number]> = [
    ["ce-near-saturation.net", "bias_ce_rc8k2", 8200],
    ["ce-near-cutoff.net", "bias_ce_rc1k", 1000],
  ];
  for (const [boardName, deck, rc] of cases) {
    it(`${boardName}: VCE, IC, position and centring resistor from ${deck}.cir`, () => {
      const [f] = ruleFindings(biasCentre, join(FOLDER, boardName));
      for (const { label, data } of referenceRuns(deck)) {
        const vce = opValue(data, "v(c)") - opValue(data, "v(e)");
        const ic = opValue(data, "i(@q1[ic])");
        expect(rel(num(f, "volts"), vce), label).toBeLessThan(0.005);
        expect(rel(num(f, "amps"), ic), label).toBeLessThan(0.01);
        // Load line from VCE(sat) to the 9 V cut-off end (emitter returns to ground) [CALC].
        expect(rel(num(f, "fraction"), (vce - VCE_SAT) / (9 - VCE_SAT)), label).toBeLessThan(0.01);
        const centre = (VCE_SAT + 9) / 2;
        expect(rel(num(f, "centringOhms"), rc + (vce - centre) / ic), label).toBeLessThan(0.01);
      }
    });
  }

  it("the swapped divider saturates in ngspice too: collector-base junction forward (bias_ce_swapped.cir)", () => {
    const [f] = ruleFindings(biasCentre, join(FOLDER, "ce-divider-swapped.net"));
    expect(f?.data.region).toBe("saturation");
    for (const { label, data } of referenceRuns("bias_ce_swapped")) {
      expect(opValue(data, "v(b)") - opValue(data, "v(c)"), label).toBeGreaterThan(0.4);
      expect(rel(num(f, "vce"), opValue(data, "v(c)") - opValue(data, "v(e)")), label).toBeLessThan(0.01);
    }
  });
});

describe("bias-centre JFET self-bias against Shockley's equation (Boylestad & Nashelsky, reference-data §5(b))", () => {
  it("RD 5.1 k: ID, VDS, VDS(sat) and the position on the load line", () => {
    // ID = IDSS(1 + ID·RS/VP)² with IDSS 8 mA, VP −6 V, RS 1 kΩ: the smaller root.
    const idss = 8e-3, vp = -6, rs = 1e3, rd = 5.1e3, vdd = 20;
    const a = (idss * rs * rs) / (vp * vp), b = (2 * idss * rs) / vp - 1, c = idss;
    const id = (-b - Math.sqrt(b * b - 4 * a * c)) / (2 * a);
    expect(rel(id, 2.5876e-3)).toBeLessThan(1e-3); // the reference's exact root [CALC]
    const vds = vdd - id * (rd + rs);
    const vdsSat = -id * rs - vp;
    const [f] = ruleFindings(biasCentre, join(FOLDER, "jfet-selfbias-5k1", "jfet-selfbias-5k1.net"));
    expect(rel(num(f, "amps"), id)).toBeLessThan(1e-3);
    expect(rel(num(f, "volts"), vds)).toBeLessThan(1e-3);
    expect(rel(num(f, "satVolts"), vdsSat)).toBeLessThan(1e-3);
    expect(rel(num(f, "fraction"), (vds - vdsSat) / (vdd - vdsSat))).toBeLessThan(0.01);
    expect(f?.message).toContain("triode (ohmic) edge");
  });
});

describe("bias-centre: switches are not amplifiers", () => {
  it("the 2N7000 gain switches of fixtures/hier-two-channel (gates from a logic latch through 10k) are not judged", () => {
    const found = ruleFindings(biasCentre, join(process.cwd(), "fixtures/hier-two-channel/hier-two-channel.kicad_sch"));
    expect(found.map((f) => f.message)).toEqual([]);
  });

  it("a MOSFET whose gate is DC-driven from a header is a switch; the same stage with only a pull-down is cut off", () => {
    const stage = ["R3 +9V d 1k", "R4 s GND 100", "M1 d g s 2N7000", "R2 g GND 100k"];
    const header = kicadNetlist("h", [...stage, "R1 ctl g 10k", "P1 ctl GND"]);
    expect(ruleFindingsInMemory(biasCentre, { "/h/h.net": header }, "/h/h.net")).toEqual([]);
    const [f] = ruleFindingsInMemory(biasCentre, { "/h/h.net": kicadNetlist("h", stage) }, "/h/h.net");
    expect(f?.data.region).toBe("cut-off");
    expect(f?.message).toContain("VGS 0 V");
  });
});

describe("bias-centre on the clean board", () => {
  it("fixtures/clean/clean-preamp.kicad_sch gives no warning or error", () => {
    const found = ruleFindings(biasCentre, join(process.cwd(), "fixtures/clean/clean-preamp.kicad_sch"));
    expect(found.filter((x) => x.severity !== "note").map((x) => x.message)).toEqual([]);
  });
});
