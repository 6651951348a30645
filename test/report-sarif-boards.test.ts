// SARIF from real runs over the bundled boards (not hand-made results): it must validate against the
// OASIS SARIF 2.1.0 schema (test/schemas, byte-exact copy of the Errata 01 file), list every rule,
// and place each result on the `(symbol …)` line of the part it names, as code scanning shows it.
import { readFileSync } from "node:fs";
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import ajvDraft04 from "ajv-draft-04";
import ajvFormats from "ajv-formats";
import type { Log } from "sarif";
import { allRules } from "../rules/index.js";
import { lint } from "../src/engine/lint.js";
import { formatSarif } from "../src/report/sarif.js";

const ajv = new ajvDraft04.default({ allErrors: true, strict: false });
ajvFormats.default(ajv);
const validate = ajv.compile(JSON.parse(readFileSync(new URL("./schemas/sarif-2.1.0.json", import.meta.url), "utf8")) as object);

const BOARDS = [
  "fixtures/demo/demo-preamp.kicad_sch",
  "fixtures/hier-two-channel/hier-two-channel.kicad_sch",
  "fixtures/ce-follower-9v/ce-follower-9v.kicad_sch",
  "fixtures/dual-gate-cascode/dual-gate-cascode.kicad_sch",
];

describe("SARIF over the bundled boards", () => {
  const root = process.cwd();
  const result = lint({ paths: BOARDS.map((b) => resolve(b)) });
  const log = JSON.parse(formatSarif(result, { cwd: root, root })) as Log;
  const run = log.runs[0];

  it("validates against the SARIF 2.1.0 schema", () => {
    const ok = validate(log);
    expect(ok ? "" : ajv.errorsText(validate.errors)).toBe("");
  });

  it("describes every rule and reports every finding", () => {
    expect(run?.tool.driver.rules?.map((r) => r.id).sort()).toEqual(allRules.map((r) => r.id).sort());
    const findings = result.designs.flatMap((d) => d.findings);
    expect(findings.length).toBeGreaterThan(0);
    expect(run?.results?.length).toBe(findings.length);
  });

  it("points each result at a line of a committed schematic that holds a placed symbol", () => {
    for (const r of run?.results ?? []) {
      const loc = r.locations?.[0]?.physicalLocation;
      const uri = decodeURIComponent(loc?.artifactLocation?.uri ?? "");
      expect(uri.startsWith("/")).toBe(false);
      const line = loc?.region?.startLine ?? 0;
      if (line === 0) continue;
      const text = readFileSync(resolve(root, uri), "utf8").split(/\r?\n/)[line - 1] ?? "";
      expect(text.trimStart().startsWith("(symbol"), `${uri}:${line} is ${text.trim()}`).toBe(true);
    }
  });
});
