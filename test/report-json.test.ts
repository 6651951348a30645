// The JSON report against its own shipped schema (schema/report.schema.json, draft-07, checked with
// ajv), plus the properties the schema cannot state: stable order and lossless user text.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { Ajv } from "ajv";
import { formatJson, REPORT_SCHEMA_VERSION } from "../src/report/json.js";
import { BASE, HOSTILE, LONG_VALUE, ROOT, demoResult } from "./helpers/demo-lint-result.js";

const schema: unknown = JSON.parse(readFileSync(new URL("../schema/report.schema.json", import.meta.url), "utf8"));
const ajv = new Ajv({ allErrors: true, strict: true, allowUnionTypes: true });
const validate = ajv.compile(schema as object);

interface ReportShape {
  schemaVersion: number;
  summary: Record<string, number>;
  findings: { rule: string; file: string; line: number; message: string; data: Record<string, unknown>; suppressed: { reason: string } | null }[];
  designs: { file: string; rails: { net: string; curve: [number, number | null][] }[] }[];
}

describe("formatJson", () => {
  const text = formatJson(demoResult());
  const report = JSON.parse(text) as ReportShape;

  it("validates against schema/report.schema.json", () => {
    const ok = validate(report);
    expect(ok ? "" : ajv.errorsText(validate.errors)).toBe("");
    expect(report.schemaVersion).toBe(REPORT_SCHEMA_VERSION);
  });

  it("orders designs by file and findings by file, line, column, rule", () => {
    expect(report.designs.map((d) => d.file)).toEqual(["hw/broken.kicad_sch", "hw/rf board/front-end.kicad_sch"]);
    expect(report.findings.map((f) => `${f.file}:${f.line}`)).toEqual([
      "hw/rf board/front-end.kicad_sch:40",
      "hw/rf board/front-end.kicad_sch:52",
      "hw/rf board/preamp.kicad_sch:88",
      "hw/rf board/preamp.kicad_sch:120",
    ]);
    const shuffled = demoResult();
    shuffled.designs.reverse();
    shuffled.designs[1]?.findings.reverse();
    expect(formatJson(shuffled)).toBe(text);
  });

  it("keeps user text exactly and writes non-finite figures as null", () => {
    const hostile = report.findings.find((f) => f.rule === "cascode-base");
    expect(hostile?.message).toBe(`Q2 base: ${HOSTILE}`);
    expect(hostile?.data).toEqual({ openOhms: null, note: HOSTILE });
    expect(report.findings[0]?.message).toBe(`R7 ${LONG_VALUE} is not an E24 value`);
    expect(report.findings[0]?.suppressed).toEqual({ reason: "matched pair, select on test <b>" });
    expect(report.designs[1]?.rails[0]?.curve.at(-1)).toEqual([1e8, null]);
  });

  it("counts standing findings and suppressed ones apart", () => {
    expect(report.summary).toEqual({ error: 1, warning: 1, note: 1, suppressed: 1, designs: 2 });
  });
});

describe("formatJson paths", () => {
  it("are relative to the repository root and POSIX, as SARIF and annotations are", () => {
    // The run names files absolutely (as lint does); the report shows them from the repository root.
    const result = demoResult();
    for (const d of result.designs) {
      d.file = `${ROOT}/${d.file}`;
      for (const f of d.findings) f.file = `${ROOT}/${f.file}`;
    }
    const report = JSON.parse(formatJson(result, BASE)) as { findings: { file: string }[]; designs: { file: string }[] };
    expect(report.findings.length).toBeGreaterThan(0);
    for (const f of report.findings) expect(f.file.startsWith("hw/rf board/")).toBe(true);
    expect(report.designs.map((d) => d.file)).toContain("hw/rf board/front-end.kicad_sch");
  });
});
