// gate-protection: floating gates, unclamped gates reachable from a socket, gate voltages against
// the datasheet ratings of the built-in parts (2N7000 VGSS ±20 V, BF998 protection diodes ±8–12 V,
// reference-data §4.3–§4.4) and forward-biased JFET gates, with the figures checked against ngspice
// on the same circuits (live where installed, else the recorded output).
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { gateProtection } from "../rules/gate-protection.js";
import { kicadNetlist } from "../fixtures/rules/netlist-writer.js";
import type { Finding } from "../src/engine/types.js";
import { checkExpected, expectedBoards } from "./helpers/expectations.js";
import { num, rel, ruleFindings, ruleFindingsInMemory } from "./helpers/run-rule.js";
import { opValue, referenceRuns } from "./support/ngspice.js";

const FOLDER = join(process.cwd(), "fixtures/rules/gate-protection");
const board = (name: string): string => join(FOLDER, `${name}.net`);


describe("gate-protection on the fixture boards", () => {
  for (const { expected, board: path } of expectedBoards(FOLDER)) {
    it(`${expected.board}: ${expected.why.slice(0, 60)}…`, () => {
      checkExpected(ruleFindings(gateProtection, path), expected);
    });
  }
});

describe("gate-protection figures against ngspice", () => {
  it("JFET forward gate: VGS and gate current (gate_jfet_forward.cir)", () => {
    const [f] = ruleFindings(gateProtection, board("jfet-forward-gate"));
    for (const { label, data } of referenceRuns("gate_jfet_forward")) {
      expect(rel(num(f, "vgs"), opValue(data, "v(g)")), label).toBeLessThan(0.005);
      expect(rel(num(f, "gateAmps"), opValue(data, "i(@j1[ig])")), label).toBeLessThan(0.01);
    }
  });

  it("dual-gate gate 2 over its rating: VG2S (gate_dualgate_g2_over.cir)", () => {
    const [f] = ruleFindings(gateProtection, board("dual-gate-g2-over-rating"));
    for (const { label, data } of referenceRuns("gate_dualgate_g2_over")) {
      expect(rel(num(f, "vgs"), opValue(data, "v(g2)") - opValue(data, "v(s)")), label).toBeLessThan(0.005);
    }
  });
});

describe("gate-protection messages", () => {
  it("carry the ESD caution where a MOSFET gate is at risk", () => {
    for (const name of ["mosfet-exposed-unclamped", "mosfet-floating-gate", "mosfet-rail-beyond-rating"]) {
      const [f] = ruleFindings(gateProtection, board(name));
      expect(f?.message, name).toContain("antistatic precautions");
    }
  });

  it("count a gate-to-source zener as a clamp", () => {
    const lines = ["R1 +9V g 1M", "R2 g GND 470k", "R3 +9V d 1k", "R4 s GND 100", "M1 d g s 2N7000", "C2 in g 100n", "P1 in GND", "D1 s g BZX79C12"];
    expect(ruleFindingsInMemory(gateProtection, { "/z/z.net": kicadNetlist("z", lines) }, "/z/z.net")).toEqual([]);
  });

  it("find a gate reached through a series resistor and an inductor, and name the path", () => {
    const lines = ["R1 +9V g 1M", "R2 g GND 470k", "R3 +9V d 1k", "R4 s GND 100", "M1 d g s 2N7000", "R6 a g 47", "L1 b a 1u", "C2 in b 100n", "P1 in GND"];
    const [f] = ruleFindingsInMemory(gateProtection, { "/p/p.net": kicadNetlist("p", lines) }, "/p/p.net");
    expect(f?.data.path).toEqual(["R6", "L1", "C2"]);
    expect(f?.data.entry).toBe("P1");
  });
});

describe("gate-protection: built-in protection and diode pairs", () => {
  const exposed = (part: string): string[] => ["R2 +12V g2 100k", "R3 g2 GND 100k", "R4 g1 GND 100k", "R5 s GND 100", "R1 +12V d 1k", part, "C3 in g1 1n", "P1 in GND"];

  it("an unknown dual-gate part whose description states gate protection diodes passes", () => {
    const lines = exposed("M1 d g2 g1 s DGX Description=tetrode,gate-protection-diodes-inside");
    expect(ruleFindingsInMemory(gateProtection, { "/d/d.net": kicadNetlist("d", lines) }, "/d/d.net")).toEqual([]);
  });

  it("the same part without that statement is reported as not known to be protected", () => {
    const [f] = ruleFindingsInMemory(gateProtection, { "/d/d.net": kicadNetlist("d", exposed("M1 d g2 g1 s DGX")) }, "/d/d.net");
    expect(f?.message).toContain("not known to have built-in gate protection");
  });

  it("the dual-gate fixture board (overload diode pair at the input, protected part) gives nothing, as fixtures/README.md says", () => {
    const found = ruleFindings(gateProtection, join(process.cwd(), "fixtures/dual-gate-cascode/dual-gate-cascode.kicad_sch"));
    expect(found.map((f) => f.message)).toEqual([]);
  });
});

describe("gate-protection on the clean board", () => {
  it("fixtures/clean/clean-preamp.kicad_sch gives no warning or error", () => {
    const found = ruleFindings(gateProtection, join(process.cwd(), "fixtures/clean/clean-preamp.kicad_sch"));
    expect(found.filter((x) => x.severity !== "note").map((x) => x.message)).toEqual([]);
  });
});
