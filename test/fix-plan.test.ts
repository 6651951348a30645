// Planning fixes: grouping by span, multi-instance sheets, overlaps, rule filters. The data here is
// invented (two-channel receiver front end); what is checked is the decision, not a figure.
import { describe, expect, it } from "vitest";
import type { Part, TextSpan } from "../src/circuit/types.js";
import type { Finding } from "../src/engine/types.js";
import { planFixes } from "../src/fix/plan.js";

function part(ref: string, value: string, sheetPath: string, span: TextSpan): Part {
  return {
    ref,
    value,
    parsed: { text: value },
    kind: "resistor",
    libId: "Device:R",
    footprint: "",
    pins: {},
    pinNames: {},
    roles: {},
    fields: {},
    dnp: false,
    excludedFromSim: false,
    origin: { file: span.file, line: 1, column: 1, sheetPath },
    valueSpan: span,
  };
}

function finding(rule: string, ref: string, sheetPath: string, span: TextSpan, replacement: string, suppressed = false): Finding {
  return {
    rule,
    severity: "warning",
    message: `${ref} is off-series`,
    parts: [ref],
    nets: [],
    file: span.file,
    line: 1,
    column: 1,
    sheetPath,
    data: {},
    fix: { span, replacement, description: `${ref} -> ${replacement}` },
    ...(suppressed ? { suppressed: { reason: "test" } } : {}),
  };
}

const shared: TextSpan = { file: "amp.kicad_sch", start: 100, end: 105 };
const rootSpan: TextSpan = { file: "top.kicad_sch", start: 40, end: 45 };
const parts = [part("R107", "7k3", "/channel 1/", shared), part("R207", "7k3", "/channel 2/", shared), part("R1", "1k1", "/", rootSpan)];

describe("planFixes", () => {
  it("applies a shared value once when every instance wants the same, and says it covers them all", () => {
    const plan = planFixes([
      { parts, findings: [finding("e-series", "R107", "/channel 1/", shared, "6k8"), finding("e-series", "R207", "/channel 2/", shared, "6k8")] },
    ]);
    expect(plan.refused).toEqual([]);
    expect(plan.files).toHaveLength(1);
    const edit = plan.files[0]?.edits[0];
    expect(plan.files[0]?.edits).toHaveLength(1);
    expect(edit?.replacement).toBe("6k8");
    expect(edit?.refs).toEqual(["R107", "R207"]);
    expect(edit?.description).toBe("R107/R207 7k3 -> 6k8 (one value in amp.kicad_sch, shared by /channel 1/, /channel 2/; right for every instance)");
  });

  it("refuses a shared value when the instances want different values, naming each wish", () => {
    const plan = planFixes([
      { parts, findings: [finding("e-series", "R107", "/channel 1/", shared, "6k8"), finding("e-series", "R207", "/channel 2/", shared, "7k5")] },
    ]);
    expect(plan.files).toEqual([]);
    expect(plan.refused.map((r) => r.reason)).toEqual([
      "R107/R207 share one value in amp.kicad_sch; R107 (/channel 1/) wants 6k8, R207 (/channel 2/) wants 7k5: not changed",
    ]);
  });

  it("refuses a shared value when one instance has no fix or has its finding suppressed", () => {
    const onlyOne = planFixes([{ parts, findings: [finding("e-series", "R107", "/channel 1/", shared, "6k8")] }]);
    expect(onlyOne.files).toEqual([]);
    expect(onlyOne.refused[0]?.reason).toBe(
      "R107/R207 share one value in amp.kicad_sch; R107 (/channel 1/) wants 6k8, but R207 (/channel 2/) has no fix for it: not changed",
    );
    const muted = planFixes([
      { parts, findings: [finding("e-series", "R107", "/channel 1/", shared, "6k8"), finding("e-series", "R207", "/channel 2/", shared, "6k8", true)] },
    ]);
    expect(muted.refused[0]?.reason).toMatch(/R207 \(\/channel 2\/\) has its finding suppressed: not changed$/);
  });

  it("keeps a plain single-instance fix with the rule's own description, and filters by rule", () => {
    const findings = [finding("e-series", "R1", "/", rootSpan, "1k"), finding("other-rule", "R107", "/channel 1/", shared, "6k8")];
    const plan = planFixes([{ parts, findings }], { rules: ["e-series"] });
    expect(plan.refused).toEqual([]);
    expect(plan.files.map((f) => f.file)).toEqual(["top.kicad_sch"]);
    expect(plan.files[0]?.edits[0]?.description).toBe("R1 -> 1k");
  });

  it("skips suppressed findings entirely when no one else asks", () => {
    const plan = planFixes([{ parts, findings: [finding("e-series", "R1", "/", rootSpan, "1k", true)] }]);
    expect(plan).toEqual({ files: [], refused: [] });
  });

  it("refuses overlapping edits and two rules that disagree on one span", () => {
    const inner: TextSpan = { file: "top.kicad_sch", start: 42, end: 50 };
    const overlap = planFixes([{ parts, findings: [finding("e-series", "R1", "/", rootSpan, "1k"), finding("other-rule", "R9", "/", inner, "2k")] }]);
    expect(overlap.files).toEqual([]);
    expect(overlap.refused).toHaveLength(2);
    expect(overlap.refused[0]?.reason).toMatch(/overlaps another edit in top\.kicad_sch \(R9\); neither is made/);

    const disagree = planFixes([{ parts, findings: [finding("e-series", "R1", "/", rootSpan, "1k"), finding("other-rule", "R1", "/", rootSpan, "1k2")] }]);
    expect(disagree.refused[0]?.reason).toBe("R1 in top.kicad_sch; R1 (/) wants 1k [e-series], R1 (/) wants 1k2 [other-rule]: not changed");

    const agree = planFixes([{ parts, findings: [finding("e-series", "R1", "/", rootSpan, "1k"), finding("other-rule", "R1", "/", rootSpan, "1k")] }]);
    expect(agree.files[0]?.edits).toHaveLength(1);
    expect(agree.files[0]?.edits[0]?.rules).toEqual(["e-series", "other-rule"]);
  });

  it("refuses a fix that would write the value already there", () => {
    const plan = planFixes([{ parts, findings: [finding("e-series", "R1", "/", rootSpan, "1k1")] }]);
    expect(plan.refused[0]?.reason).toMatch(/already has \(1k1\)/);
  });

  it("treats two designs that include the same sheet file as sharing its value", () => {
    const a = { parts: [part("R107", "7k3", "/channel 1/", shared)], findings: [finding("e-series", "R107", "/channel 1/", shared, "6k8")] };
    const b = { parts: [part("R107", "7k3", "/channel 1/", shared)], findings: [] };
    expect(planFixes([a, b]).refused[0]?.reason).toMatch(/has no fix for it/);
    expect(planFixes([a, { ...b, findings: a.findings }]).files[0]?.edits).toHaveLength(1);
  });
});
