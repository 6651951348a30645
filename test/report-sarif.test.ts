// SARIF output against the OASIS SARIF 2.1.0 schema (Errata 01, draft-04; copied byte-exact into
// test/schemas/, sha256 c3b4bb2d…2682e) and against what GitHub code scanning reads (GitHub docs,
// "SARIF support for code scanning"). Input is the invented demo project in helpers/.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import ajvDraft04 from "ajv-draft-04";
import ajvFormats from "ajv-formats";
import type { Log } from "sarif";
import { formatSarif, fingerprint, normaliseMessage, FINGERPRINT_KEY } from "../src/report/sarif.js";
import { BASE, HOSTILE, demoResult } from "./helpers/demo-lint-result.js";

const Ajv04 = ajvDraft04.default;
const addFormats = ajvFormats.default;
const schema: unknown = JSON.parse(readFileSync(new URL("./schemas/sarif-2.1.0.json", import.meta.url), "utf8"));
const ajv = new Ajv04({ allErrors: true, strict: false });
addFormats(ajv);
const validate = ajv.compile(schema as object);

function sarif(): { text: string; log: Log } {
  const text = formatSarif(demoResult(), BASE);
  return { text, log: JSON.parse(text) as Log };
}

describe("formatSarif", () => {
  it("validates against the OASIS SARIF 2.1.0 schema, hostile text and all", () => {
    const { log } = sarif();
    const ok = validate(log);
    expect(ok ? "" : ajv.errorsText(validate.errors)).toBe("");
  });

  it("describes every rule for code scanning, with no security-severity (notes §5)", () => {
    const { text, log } = sarif();
    const rules = log.runs[0]?.tool.driver.rules ?? [];
    expect(rules.map((r) => r.id)).toEqual(["rail-bypass", "cascode-base", "e-series", "gate-protection"]);
    const railBypass = rules[0];
    expect(railBypass?.name).toBe("RailBypass");
    expect(railBypass?.defaultConfiguration?.level).toBe("error");
    expect(railBypass?.properties?.["problem.severity"]).toBe("error");
    expect(railBypass?.help?.markdown).toContain("## Why it matters");
    expect(rules[2]?.properties?.["problem.severity"]).toBe("recommendation");
    expect(rules[3]?.defaultConfiguration?.enabled).toBe(false);
    expect(text).not.toContain("security-severity");
  });

  it("points results at repository-relative, per-segment percent-encoded paths", () => {
    const { log } = sarif();
    const run = log.runs[0];
    expect(run?.originalUriBaseIds?.["%SRCROOT%"]?.uri).toBe("file:///work/demo-repo/");
    const first = run?.results?.[0];
    const location = first?.locations?.[0]?.physicalLocation;
    expect(location?.artifactLocation).toEqual({ uri: "hw/rf%20board/front-end.kicad_sch", uriBaseId: "%SRCROOT%" });
    expect(location?.region).toEqual({ startLine: 40, startColumn: 7 });
    for (const result of run?.results ?? []) {
      expect(run?.tool.driver.rules?.[result.ruleIndex ?? -1]?.id).toBe(result.ruleId);
    }
  });

  it("carries suppressions, fixes and read errors", () => {
    const { log } = sarif();
    const run = log.runs[0];
    const suppressed = run?.results?.find((r) => r.suppressions);
    expect(suppressed?.suppressions).toEqual([{ kind: "inSource", status: "accepted", justification: "matched pair, select on test <b>" }]);
    const fixed = run?.results?.find((r) => r.fixes);
    expect(fixed?.fixes?.[0]?.artifactChanges[0]?.replacements[0]?.deletedRegion).toEqual({ charOffset: 1000, charLength: 5 });
    expect(run?.invocations?.[0]?.executionSuccessful).toBe(false);
    expect(run?.invocations?.[0]?.toolExecutionNotifications?.[0]?.message.text).toBe("expected ')' but the file ended");
  });

  it("keeps hostile text intact as data (JSON escaping is the only transformation)", () => {
    const { log } = sarif();
    const hostile = log.runs[0]?.results?.find((r) => r.ruleId === "cascode-base");
    expect(hostile?.message.text).toBe(`Q2 base: ${HOSTILE}`);
    expect(hostile?.properties?.["data"]).toEqual({ openOhms: null, note: HOSTILE });
  });

  it("fingerprints survive a changed figure but not a changed part", () => {
    const a = { rule: "rail-bypass", parts: ["C12", "C13"], message: "+12V_RF: |Z| reaches 4.2 Ω at 28 MHz, over the 1.2 Ω target" };
    const tuned = { ...a, message: "+12V_RF: |Z| reaches 3.9 Ω at 26.5 MHz, over the 1.2 Ω target" };
    const otherPart = { ...a, parts: ["C12", "C14"] };
    expect(normaliseMessage(a.message)).toBe("+#V_RF: |Z| reaches # Ω at # MHz, over the # Ω target");
    expect(fingerprint(tuned, "hw/a.kicad_sch")).toBe(fingerprint(a, "hw/a.kicad_sch"));
    expect(fingerprint({ ...a, parts: ["C13", "C12"] }, "hw/a.kicad_sch")).toBe(fingerprint(a, "hw/a.kicad_sch"));
    expect(fingerprint(otherPart, "hw/a.kicad_sch")).not.toBe(fingerprint(a, "hw/a.kicad_sch"));
    expect(fingerprint(a, "hw/b.kicad_sch")).not.toBe(fingerprint(a, "hw/a.kicad_sch"));
    const { log } = sarif();
    const prints = (log.runs[0]?.results ?? []).map((r) => r.partialFingerprints?.[FINGERPRINT_KEY]);
    expect(new Set(prints).size).toBe(prints.length);
    for (const p of prints) expect(p).toMatch(/^[0-9a-f]{32}:\d+$/);
  });

  it("is byte-identical across runs (stable order)", () => {
    expect(formatSarif(demoResult(), BASE)).toBe(formatSarif(demoResult(), BASE));
  });
});

describe("fingerprint nets", () => {
  it("tells two rails apart even when the figure-free messages agree", () => {
    const base = { rule: "rail-bypass", parts: ["C1"], message: "+12V: |Z| 3 Ω over target" };
    expect(fingerprint({ ...base, nets: ["+12V"] }, "a.kicad_sch")).not.toBe(fingerprint({ ...base, nets: ["+5V"], message: "+5V: |Z| 3 Ω over target" }, "a.kicad_sch"));
  });
});
