// ratings: reversed electrolytics, capacitor voltage, resistor dissipation and device limits at the
// operating point, against ngspice on the same circuits (live where installed, else recorded),
// Joule's law and the datasheet ratings held by the built-in library (reference-data §4).
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { ratings } from "../rules/ratings.js";
import { kicadNetlist } from "../fixtures/rules/netlist-writer.js";
import type { Finding } from "../src/engine/types.js";
import { checkExpected, expectedBoards } from "./helpers/expectations.js";
import { num, rel, ruleFindings, ruleFindingsInMemory } from "./helpers/run-rule.js";
import { opValue, referenceRuns } from "./support/ngspice.js";

const FOLDER = join(process.cwd(), "fixtures/rules/ratings");
const board = (name: string): string => join(FOLDER, `${name}.net`);
const byPart = (found: Finding[], ref: string): Finding | undefined => found.find((f) => f.parts.includes(ref));


describe("ratings on the fixture boards", () => {
  for (const { expected, board: path } of expectedBoards(FOLDER)) {
    it(`${expected.board}: ${expected.why.slice(0, 60)}…`, () => {
      checkExpected(ruleFindings(ratings, path), expected);
    });
  }
});

describe("ratings figures against ngspice", () => {
  it("reversed input electrolytic: the base voltage of the 9 V CE stage (ce_9v_2n3904.cir)", () => {
    const f = byPart(ruleFindings(ratings, board("electrolytic-reversed")), "C2");
    for (const { label, data } of referenceRuns("ce_9v_2n3904")) {
      expect(rel(num(f, "reverseVolts"), opValue(data, "v(b)")), label).toBeLessThan(0.005);
    }
  });

  it("2N918 VCE over VCEO (ratings_vhf_over_vceo.cir)", () => {
    const f = byPart(ruleFindings(ratings, board("vhf-transistor-over-vceo")), "Q1");
    for (const { label, data } of referenceRuns("ratings_vhf_over_vceo")) {
      expect(rel(num(f, "vce"), opValue(data, "v(c)") - opValue(data, "v(e)")), label).toBeLessThan(0.005);
    }
  });

  it("emitter follower dissipation VCE·IC + VBE·IB and the emitter resistor's V²/R (ratings_follower_2n3904.cir)", () => {
    const found = ruleFindings(ratings, board("follower-dissipation"));
    for (const { label, data } of referenceRuns("ratings_follower_2n3904")) {
      const [vb, ve, ic, ib] = [opValue(data, "v(b)"), opValue(data, "v(e)"), opValue(data, "i(@q1[ic])"), opValue(data, "i(@q1[ib])")];
      expect(rel(num(byPart(found, "Q1"), "watts"), (12 - ve) * ic + (vb - ve) * ib), label).toBeLessThan(0.005);
      expect(rel(num(byPart(found, "R3"), "watts"), (ve * ve) / 100), label).toBeLessThan(0.005);
    }
  });

  it("2N7000 drain current and its drain resistor's V²/R (ratings_mosfet_2n7000.cir)", () => {
    const found = ruleFindings(ratings, board("mosfet-overcurrent"));
    for (const { label, data } of referenceRuns("ratings_mosfet_2n7000")) {
      expect(rel(num(byPart(found, "M1"), "id"), opValue(data, "i(@m1[id])")), label).toBeLessThan(0.005);
      expect(rel(num(byPart(found, "R3"), "watts"), (12 - opValue(data, "v(d)")) ** 2 / 47), label).toBeLessThan(0.005);
    }
  });

  it("1N4148 forward current (ratings_diode_1n4148.cir)", () => {
    const f = byPart(ruleFindings(ratings, board("diode-overcurrent")), "D1");
    for (const { label, data } of referenceRuns("ratings_diode_1n4148")) {
      expect(rel(num(f, "ifwd"), -opValue(data, "i(vcc)")), label).toBeLessThan(0.005);
    }
  });
});

describe("ratings: resistor power rating sources", () => {
  const run = (lines: string[]): Finding[] => ruleFindingsInMemory(ratings, { "/r/r.net": kicadNetlist("r", lines) }, "/r/r.net");

  it("a through-hole resistor is taken as 1/4 W (common practice): 144 mW is 58 %", () => {
    const [f] = run(["R1 +12V GND 1k footprint=Resistor_THT:R_Axial_DIN0207_L6.3mm_D2.5mm_P10.16mm_Horizontal"]);
    expect(num(f, "ratedWatts")).toBe(0.25);
    expect(f?.severity).toBe("warning");
  });

  it("an 0402 resistor is 1/16 W (common practice): 9 V across 1 kΩ (81 mW) is beyond it", () => {
    const [f] = run(["R1 +9V GND 1k footprint=Resistor_SMD:R_0402_1005Metric"]);
    expect(num(f, "ratedWatts")).toBe(1 / 16);
    expect(rel(num(f, "watts"), 81 / 1000)).toBeLessThan(1e-9);
    expect(f?.severity).toBe("error");
  });

  it("a rating written in the Value wins over the footprint: 144 mW in a 1k/1W part passes, in a 1k/0.25W part warns", () => {
    expect(run(["R1 +12V GND 1k/1W footprint=Resistor_SMD:R_0603_1608Metric"]).map((f) => f.message)).toEqual([]);
    const [f] = run(["R1 +12V GND 1k/0.25W footprint=Resistor_SMD:R_0603_1608Metric"]);
    expect(num(f, "ratedWatts")).toBe(0.25);
    expect(f?.severity).toBe("warning");
  });

  it("without a rating or a known footprint the assumed 0.1 W is said to be assumed", () => {
    const [f] = run(["R1 +12V GND 1k footprint="]);
    expect(f?.data.ratingAssumed).toBe(true);
    expect(f?.message).toContain("0.1 W assumed");
  });
});

describe("ratings on the clean board", () => {
  it("fixtures/clean/clean-preamp.kicad_sch gives no warning or error", () => {
    const found = ruleFindings(ratings, join(process.cwd(), "fixtures/clean/clean-preamp.kicad_sch"));
    expect(found.filter((x) => x.severity !== "note").map((x) => x.message)).toEqual([]);
  });
});
