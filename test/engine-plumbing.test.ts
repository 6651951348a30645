// Plumbing checks: JSON positions (RFC 8259 grammar), path globs (the .gitignore conventions, common
// practice), suppressions and the result counters. The demo parts below are invented.
import { describe, expect, it } from "vitest";
import { parseJsonWithPositions, plainValue } from "../src/engine/json-positions.js";
import { matchesGlob } from "../src/engine/glob.js";
import { applySuppressions, matchesIgnore, readSuppression, suppressionProblems } from "../src/engine/suppress.js";
import { countBySeverity, exitCodeFor } from "../src/engine/result.js";
import type { LintResult } from "../src/engine/result.js";
import type { Finding } from "../src/engine/types.js";
import type { Part } from "../src/circuit/types.js";
import { ruleLevel, runRules } from "../src/engine/runner.js";
import { checkRuleOption } from "../src/engine/rule.js";
import type { Rule } from "../src/engine/rule.js";

function demoPart(ref: string, fields: Record<string, string>): Part {
  return {
    ref, value: "4k7", parsed: { text: "4k7", number: 4700 }, kind: "resistor", libId: "Device:R", footprint: "",
    pins: { "1": "N1", "2": "N2" }, pinNames: {}, roles: {}, fields, dnp: false, excludedFromSim: false,
    origin: { file: "board.kicad_sch", line: 40, column: 3, sheetPath: "/" },
  };
}

function demoFinding(rule: string, parts: string[], severity: Finding["severity"] = "warning"): Finding {
  return { rule, severity, message: `${rule} on ${parts.join(", ")}`, parts, nets: [], file: "board.kicad_sch", line: 40, column: 3, sheetPath: "/", data: {} };
}

describe("parseJsonWithPositions", () => {
  it("gives the same value as JSON.parse and 1-based key positions", () => {
    const text = '{\n  "band": {\n    "low": "1.8MHz",\n    "high": 3e7\n  },\n  "ignore": ["a", "b"]\n}';
    const result = parseJsonWithPositions(text);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(plainValue(result.node)).toEqual(JSON.parse(text));
    if (result.node.kind !== "object") throw new Error("expected an object");
    const band = result.node.entries[0];
    expect(band?.keyPos).toEqual({ line: 2, column: 3 });
    if (band?.value.kind !== "object") throw new Error("expected an object");
    expect(band.value.entries[1]?.keyPos).toEqual({ line: 4, column: 5 });
    expect(band.value.entries[1]?.value.pos).toEqual({ line: 4, column: 13 });
  });

  it("reports a trailing comma where it is, and a missing brace at the end of the file", () => {
    const trailing = parseJsonWithPositions('{\n  "a": 1,\n}');
    expect(trailing).toEqual({ ok: false, error: { line: 3, column: 1, message: "trailing comma before '}'" } });
    const open = parseJsonWithPositions('{"a": 1');
    expect(open.ok).toBe(false);
    if (!open.ok) expect(open.error.message).toBe("expected ',' or '}' but found end of file");
  });

  it("agrees with JSON.parse on escapes and numbers (RFC 8259 §6, §7)", () => {
    const text = '["a\\u00b5\\n\\"", -0.5e-3, 0, true, false, null]';
    const result = parseJsonWithPositions(text);
    expect(result.ok && plainValue(result.node)).toEqual(JSON.parse(text));
  });

  it("refuses duplicate keys, comments and absurd nesting without throwing", () => {
    expect(parseJsonWithPositions('{"a":1,"a":2}')).toMatchObject({ ok: false, error: { column: 8 } });
    expect(parseJsonWithPositions('{ // no\n}')).toMatchObject({ ok: false, error: { message: "comments are not allowed in JSON" } });
    expect(parseJsonWithPositions("[".repeat(10_000))).toMatchObject({ ok: false, error: { message: "nesting deeper than 64 levels" } });
  });
});

describe("matchesGlob (.gitignore-style conventions, common practice)", () => {
  const cases: [string, string, boolean][] = [
    ["hw/old/a.kicad_sch", "hw/old/**", true],
    ["hw/old", "hw/old/**", true],
    ["hw/older/a.kicad_sch", "hw/old/**", false],
    ["hw/a.kicad_sch", "hw/*.kicad_sch", true],
    ["hw/sub/a.kicad_sch", "hw/*.kicad_sch", false],
    ["hw/sub/a.kicad_sch", "hw/**/*.kicad_sch", true],
    ["hw/a.kicad_sch", "hw/**/*.kicad_sch", true],
    ["deep/x/y/z-old.kicad_sch", "*-old.kicad_sch", true],
    ["legacy/x/y.net", "legacy", true],
    ["./legacy\\y.net", "legacy/*", true],
    ["rev1.kicad_sch", "rev?.kicad_sch", true],
    ["rev12.kicad_sch", "rev?.kicad_sch", false],
    ["revB.kicad_sch", "rev[A-C].kicad_sch", true],
    ["revD.kicad_sch", "rev[A-C].kicad_sch", false],
    ["revD.kicad_sch", "rev[!A-C].kicad_sch", true],
  ];
  for (const [path, glob, expected] of cases) {
    it(`${glob} ${expected ? "matches" : "does not match"} ${path}`, () => {
      expect(matchesGlob(path, glob)).toBe(expected);
    });
  }

  it("stays polynomial on a pattern that makes backtracking matchers explode", () => {
    const path = "a".repeat(200);
    expect(matchesGlob(path, "*a*a*a*a*a*a*a*a*a*a*b")).toBe(false);
  });

  it("matchesIgnore is true when any glob matches", () => {
    expect(matchesIgnore("hw/scratch/t.kicad_sch", ["docs/**", "scratch"])).toBe(true);
    expect(matchesIgnore("hw/main.kicad_sch", ["docs/**", "scratch"])).toBe(false);
  });
});

describe("suppressions", () => {
  it("reads ids, 'all' and the reason after the first colon", () => {
    expect(readSuppression(demoPart("R7", { "loadline-ignore": "e-series: matched pair, select on test" }))).toEqual({
      ref: "R7", rules: ["e-series"], reason: "matched pair, select on test",
    });
    expect(readSuppression(demoPart("R8", { "Loadline-Ignore": "e-series, rail-bypass stack-headroom" }))?.rules).toEqual([
      "e-series", "rail-bypass", "stack-headroom",
    ]);
    expect(readSuppression(demoPart("R9", { "loadline-ignore": "ALL: prototype only" }))?.rules).toBe("all");
    expect(readSuppression(demoPart("R10", { "loadline-ignore": "  " }))).toBeUndefined();
  });

  it("marks covered findings, keeps them, and leaves the rest alone", () => {
    const parts = [demoPart("R7", { "loadline-ignore": "e-series: matched pair" }), demoPart("C3", { "loadline-ignore": "all" })];
    const findings = [demoFinding("e-series", ["R7"]), demoFinding("rail-bypass", ["R7"]), demoFinding("rail-bypass", ["C9", "C3"])];
    const out = applySuppressions(findings, parts);
    expect(out).toHaveLength(3);
    expect(out[0]?.suppressed).toEqual({ reason: "matched pair" });
    expect(out[1]?.suppressed).toBeUndefined();
    expect(out[2]?.suppressed).toEqual({ reason: "loadline-ignore on C3, no reason given" });
    expect(findings[0]?.suppressed).toBeUndefined();
  });

  it("points at a suppression that names an unknown rule", () => {
    const problems = suppressionProblems([demoPart("R7", { "loadline-ignore": "eseries: typo" })], ["e-series"]);
    expect(problems).toEqual([expect.objectContaining({ file: "board.kicad_sch", line: 40, column: 3 })]);
    expect(problems[0]?.message).toContain("unknown rule 'eseries'");
  });
});

describe("countBySeverity and exitCodeFor (exit codes as design.md states them)", () => {
  const design = (findings: Finding[], errors: LintResult["designs"][number]["errors"] = []): LintResult["designs"][number] => ({
    file: "board.kicad_sch", sheetFiles: ["board.kicad_sch"], findings, rails: [], bases: [], devices: [], errors,
  });
  const result = (designs: LintResult["designs"]): LintResult => ({ designs, band: { low: 5e5, high: 3e7, isDefault: true }, toolVersion: "0.0.0" });
  const suppressed = { ...demoFinding("e-series", ["R7"], "error"), suppressed: { reason: "matched pair" } };

  it("counts findings that stand by severity and suppressed ones apart", () => {
    const r = result([design([demoFinding("a", ["R1"], "error"), demoFinding("b", ["R2"], "note"), suppressed])]);
    expect(countBySeverity(r)).toEqual({ error: 1, warning: 0, note: 1, suppressed: 1 });
  });

  it("fails at or over the threshold, ignores suppressed findings, and exits 2 on a failed read", () => {
    const warn = result([design([demoFinding("a", ["R1"], "warning"), suppressed])]);
    expect(exitCodeFor(warn, "error")).toBe(0);
    expect(exitCodeFor(warn, "warning")).toBe(1);
    expect(exitCodeFor(warn, "note")).toBe(1);
    expect(exitCodeFor(warn, "never")).toBe(0);
    const broken = result([design([], [{ file: "bad.kicad_sch", line: 3, column: 1, message: "expected ')'" }])]);
    expect(exitCodeFor(broken, "never")).toBe(2);
  });
});

describe("runRules (the runner contract)", () => {
  const ctx = { board: "demo" };
  const make = (id: string, severity: Finding["severity"], check: Rule<typeof ctx>["check"]): Rule<typeof ctx> => ({
    id, title: id, severity, doc: { what: "", why: "", fix: "", references: [] },
    options: { limitOhms: { type: "number", default: "2.5 ohm", unit: "Ω", description: "demo" } }, check,
  });
  const seen: unknown[] = [];
  const rules = [
    make("a-rule", "warning", (_c, options) => {
      seen.push(options["limitOhms"]);
      return [demoFinding("wrong-id", ["R1"], "note")];
    }),
    make("b-rule", "error", () => [demoFinding("b-rule", ["R2"], "error")]),
    make("c-rule", "note", () => {
      throw new Error("demo failure");
    }),
  ];

  it("passes resolved options, stamps the rule id, applies configured severity, skips 'off', isolates a throwing rule", () => {
    const config = { rules: { "a-rule": { severity: "error" as const, options: { limitOhms: 1.5 } }, "b-rule": { severity: "off" as const, options: {} } } };
    const out = runRules(rules, ctx, config, "board.kicad_sch");
    expect(seen).toEqual([1.5]);
    expect(out.findings.map((f) => [f.rule, f.severity])).toEqual([["a-rule", "error"]]);
    expect(out.problems).toHaveLength(1);
    expect(out.problems[0]?.message).toContain("rule 'c-rule' stopped with an internal error");
    expect(out.problems[0]?.message).toContain("demo failure");
  });

  it("keeps a rule's own per-finding severity when the config sets none, and reads unit defaults ('2.5 ohm' = 2.5 Ω)", () => {
    seen.length = 0;
    const out = runRules(rules.slice(0, 2), ctx, { rules: {} }, "board.kicad_sch");
    expect(out.findings.map((f) => f.severity)).toEqual(["note", "error"]);
    expect(seen[0]).toBeCloseTo(2.5, 12);
    expect(ruleLevel(rules[1] ?? rules[0]!, { rules: { "b-rule": { severity: "off", options: {} } } })).toBe("off");
  });
});

describe("checkRuleOption", () => {
  it("converts quantities with SI prefixes (BIPM SI Brochure: k = 1e3, M = 1e6) and refuses the wrong kind", () => {
    const freq = { type: "number" as const, default: "10MHz", unit: "Hz", description: "" };
    const ok = checkRuleOption(freq, "455 kHz");
    expect(ok.ok && ok.value).toBeCloseTo(455e3, 6);
    expect(checkRuleOption(freq, "455 kV")).toEqual({ ok: false, expected: "a frequency such as '10MHz'" });
    expect(checkRuleOption({ type: "string[]", default: [], description: "", enum: ["a", "b"] }, ["a", "c"])).toEqual({ ok: false, expected: "a list of 'a', 'b'" });
    expect(checkRuleOption({ type: "boolean", default: false, description: "" }, "yes")).toEqual({ ok: false, expected: "true or false" });
  });
});
