// model-coverage: the note names what could not be analysed and which rules that limited. The
// unknown part number is invented; the built-in 2N3904 card is the published one (reference-data §4.1).
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { describeRuleBoards, lintBoard } from "./helpers/rule-boards.js";
import { lint } from "../src/engine/lint.js";
import { memoryFileSource } from "../src/read/index.js";
import { kicadNetlist } from "../fixtures/rules/netlist-writer.js";

describeRuleBoards("model-coverage");

describe("model-coverage", () => {
  it("is one note per design, listing the unmodelled part and the limited rules", () => {
    const { findings } = lintBoard(resolve("fixtures/rules/model-coverage/unknown-transistor.net"));
    const notes = findings.filter((f) => f.rule === "model-coverage");
    expect(notes).toHaveLength(1);
    expect(notes[0]?.severity).toBe("note");
    expect(notes[0]?.data.unmodelled).toEqual(["Q1"]);
  });

  it("names the rule a missing model limited: a cascode whose upper device has no model", () => {
    // Generic NPN symbol with an invented part number: classified npn, but no card anywhere.
    const text = kicadNetlist("cascode-unknown", [
      "R1 +9V b2 12k", "R2 b2 b1 5.6k", "R3 b1 GND 6.8k", "C1 b2 GND 10u pol",
      "Q1 c1 b1 e1 2N3904", "R4 e1 GND 1k", "C2 e1 GND 100u pol", "Q2 c2 b2 c1 XQ9999", "R5 +9V c2 1.5k",
      "C5 +9V GND 100u pol", "C6 +9V GND 100n",
    ]).replaceAll('(part "XQ9999")', '(part "Q_NPN_EBC")');
    const result = lint({ paths: ["/m/cascode-unknown.net"], fs: memoryFileSource({ "/m/cascode-unknown.net": text }) });
    const note = result.designs[0]?.findings.find((f) => f.rule === "model-coverage");
    expect(note?.data.unmodelled).toEqual(["Q2"]);
    // Every rule that needs Q2's operating point says so: the grounding of its base, the stack's
    // headroom and its place on the load line (in the order the rules run).
    expect(note?.data.limitedRules).toEqual(["base-ac-ground", "stack-headroom", "bias-centre"]);
    expect(note?.message).toContain("base-ac-ground (Q2 not modelled");
  });
  it("says when a power net has no stated voltage, and rail-bypass still checks its bypass", () => {
    const text = kicadNetlist("vcc", ["R1 VCC b 56k", "R2 b GND 10k", "R3 VCC c 1.5k", "R4 e GND 680", "C4 e GND 100u pol", "Q1 c b e 2N3904"]);
    const result = lint({ paths: ["/v/vcc.net"], fs: memoryFileSource({ "/v/vcc.net": text }) });
    const findings = result.designs[0]?.findings ?? [];
    expect(findings.find((f) => f.rule === "model-coverage")?.data.unresolvedRails).toEqual(["VCC"]);
    const rail = findings.find((f) => f.rule === "rail-bypass");
    expect(rail?.severity).toBe("error");
    expect(rail?.data.targetOhms).toBeCloseTo(15, 9); // R3 1.5 kΩ / 100
  });
});
