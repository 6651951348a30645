// The bundled Action run as the runner runs it: `node dist/index.js` with INPUT_* variables (hyphens
// kept, as @actions/core 3.0.1 reads them), GITHUB_WORKSPACE, and GITHUB_OUTPUT / GITHUB_STEP_SUMMARY
// files that exist beforehand (shared notes §2, §4). The boards in test/fixtures-action/ are invented:
// a signal-tracer netlist with its rail bypass capacitors left off (a fact of the trade: a rail with
// no capacitor to ground is not bypassed at all), the same board with the finding suppressed, and a
// schematic cut off mid-file.
import { spawnSync } from "node:child_process";
import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import ajvDraft04 from "ajv-draft-04";
import ajvFormats from "ajv-formats";
import { lint } from "../src/engine/lint.js";
import { countBySeverity } from "../src/engine/result.js";

const repo = new URL("..", import.meta.url).pathname;
const bundle = join(repo, "dist/index.js");
let workspace = "";

interface Run {
  code: number | null;
  stdout: string;
  outputs: Record<string, string>;
  summary: string;
}

function runAction(inputs: Record<string, string>): Run {
  const out = join(workspace, `.out-${Math.random().toString(36).slice(2)}`);
  const summary = `${out}-summary`;
  writeFileSync(out, "");
  writeFileSync(summary, "");
  const env: Record<string, string> = {
    PATH: process.env["PATH"] ?? "",
    GITHUB_ACTIONS: "true",
    GITHUB_WORKSPACE: workspace,
    GITHUB_OUTPUT: out,
    GITHUB_STEP_SUMMARY: summary,
    // The defaults action.yml declares; the runner always passes them.
    "INPUT_PATHS": ".", "INPUT_CONFIG": "", "INPUT_FAIL-ON": "error", "INPUT_SARIF-FILE": "", "INPUT_HTML-FILE": "",
    "INPUT_ANNOTATIONS": "true", "INPUT_SUMMARY": "true",
  };
  for (const [name, value] of Object.entries(inputs)) env[`INPUT_${name.toUpperCase()}`] = value;
  const child = spawnSync(process.execPath, [bundle], { cwd: workspace, env, encoding: "utf8", timeout: 60_000 });
  const outputs: Record<string, string> = {};
  // name<<ghadelimiter_UUID \n value \n ghadelimiter_UUID
  for (const m of readFileSync(out, "utf8").matchAll(/^([\w-]+)<<(ghadelimiter_[0-9a-f-]+)\n([\s\S]*?)\n\2\n/gm)) {
    outputs[m[1] ?? ""] = m[3] ?? "";
  }
  return { code: child.status, stdout: child.stdout, outputs, summary: readFileSync(summary, "utf8") };
}

/** The 1-based line of the `(comp` list whose ref is `ref`: where an annotation must land. */
function compLine(file: string, ref: string): number {
  const lines = readFileSync(join(workspace, file), "utf8").split("\n");
  const at = lines.findIndex((l, i) => l.trim() === `(ref "${ref}")` && lines[i - 1]?.trim() === "(comp");
  return at; // the line before, counted from 1
}

beforeAll(() => {
  const build = spawnSync("npm", ["run", "build"], { cwd: repo, encoding: "utf8", timeout: 120_000 });
  if (build.status !== 0 || !existsSync(bundle)) throw new Error(`npm run build failed:\n${build.stdout}\n${build.stderr}`);
  workspace = mkdtempSync(join(tmpdir(), "loadline-action-"));
  cpSync(join(repo, "test/fixtures-action"), workspace, { recursive: true });
}, 180_000);

afterAll(() => {
  if (workspace) rmSync(workspace, { recursive: true, force: true });
});

describe("the bundled Action", () => {
  it("annotates the unbypassed rail, skips the suppressed board, writes outputs, summary, SARIF and HTML, and fails the step", () => {
    const run = runAction({ paths: "tracer\nquiet/quiet.net", "sarif-file": "reports/loadline.sarif", "html-file": "reports/loadline.html" });
    expect(run.code).toBe(1);
    const line = compLine("tracer/tracer.net", "R3");
    expect(line).toBeGreaterThan(1);
    // Other rules may add notes about these boards; the rail finding is the one this test is about.
    const annotations = run.stdout.split("\n").filter((l) => l.startsWith("::"));
    const rail = annotations.filter((l) => l.includes("loadline rail-bypass"));
    expect(rail).toHaveLength(1);
    expect(rail[0]).toMatch(new RegExp(`^::error title=loadline rail-bypass \\(R1%2C R3%2C R5\\),file=tracer/tracer.net,line=${line},col=5::Rail \\+9V `));
    expect(annotations.filter((l) => l.startsWith("::error"))).toHaveLength(1);
    expect(run.outputs["sarif-file"]).toBe("reports/loadline.sarif");
    expect(run.outputs["errors"]).toBe("1");
    const warnings = Number(run.outputs["warnings"]);
    const notes = Number(run.outputs["notes"]);
    expect(annotations.filter((l) => l.startsWith("::warning"))).toHaveLength(Math.min(10, warnings));
    const plural = (n: number, word: string): string => `${n} ${word}${n === 1 ? "" : "s"}`;
    expect(run.summary).toContain(`**1 error, ${plural(warnings, "warning")}, ${plural(notes, "note")}, 1 suppressed** in 2 designs`);
    expect(run.summary).toContain("<summary>1 suppressed finding</summary>");
    expect(run.summary).toContain("bench supply board, bypass sits on the mainboard");

    const sarif: unknown = JSON.parse(readFileSync(join(workspace, "reports/loadline.sarif"), "utf8"));
    const schema: unknown = JSON.parse(readFileSync(join(repo, "test/schemas/sarif-2.1.0.json"), "utf8"));
    const ajv = new ajvDraft04.default({ allErrors: true, strict: false });
    ajvFormats.default(ajv);
    const validate = ajv.compile(schema as object);
    expect(validate(sarif) ? "" : ajv.errorsText(validate.errors)).toBe("");
    const text = JSON.stringify(sarif);
    expect(text).toContain('"uri":"tracer/tracer.net","uriBaseId":"%SRCROOT%"');
    expect(text).toContain('"kind":"inSource"');

    const html = readFileSync(join(workspace, "reports/loadline.html"), "utf8");
    expect(html).toContain("Rail +9V (9 V) has no bypass capacitor to ground");
  });

  it("passes with fail-on never and prints no annotations when they are turned off", () => {
    const run = runAction({ paths: "tracer", "fail-on": "never", annotations: "false" });
    expect(run.code).toBe(0);
    expect(run.stdout.split("\n").filter((l) => l.startsWith("::"))).toEqual([]);
    expect(run.outputs["errors"]).toBe("1");
  });

  it("exits 2 with an error annotation at the place a schematic breaks", () => {
    const run = runAction({ paths: "broken.kicad_sch" });
    expect(run.code).toBe(2);
    expect(run.stdout).toMatch(/^::error title=loadline could not check this file,file=broken.kicad_sch,line=3,col=1::expected '\)'/m);
  });

  it("refuses a bad input with a clear message and exit 2", () => {
    const run = runAction({ paths: "tracer", "fail-on": "sometimes" });
    expect(run.code).toBe(2);
    expect(run.stdout).toContain("::error title=loadline::input 'fail-on' must be one of error, warning, note, never, got 'sometimes'");
    const bad = runAction({ paths: "tracer", annotations: "yes" });
    expect(bad.code).toBe(2);
    expect(bad.stdout).toContain("::error title=loadline::input 'annotations' must be true or false, got 'yes'");
  });

  it("on the demo board: one annotation per finding on its part's symbol line, and outputs that match an in-process lint", () => {
    cpSync(join(repo, "fixtures/demo"), join(workspace, "hw/demo"), { recursive: true });
    const board = "hw/demo/demo-preamp.kicad_sch";
    const expected = lint({ paths: [join(workspace, board)] });
    const counts = countBySeverity(expected);
    const run = runAction({ paths: board, "fail-on": "warning" });
    expect(run.code).toBe(counts.error + counts.warning > 0 ? 1 : 0);
    expect(run.outputs["errors"]).toBe(String(counts.error));
    expect(run.outputs["warnings"]).toBe(String(counts.warning));
    expect(run.outputs["notes"]).toBe(String(counts.note));
    const lines = readFileSync(join(workspace, board), "utf8").split("\n");
    const annotations = run.stdout.split("\n").filter((l) => /^::(error|warning|notice) /.test(l));
    const findings = expected.designs.flatMap((d) => d.findings);
    expect(annotations).toHaveLength(findings.length);
    for (const f of findings) {
      const level = f.severity === "note" ? "notice" : f.severity;
      const mine = annotations.find((a) => a.startsWith(`::${level} title=loadline ${f.rule} `) && a.includes(`file=${board},line=${f.line},`));
      expect(mine, `${f.rule} on ${f.parts.join(", ")}`).toBeDefined();
      // The annotation's line is the part's `(symbol` list in the schematic.
      expect(lines[f.line - 1]?.trimStart().startsWith("(symbol")).toBe(true);
    }
    // The summary carries the rail's worst figure.
    expect(run.summary).toContain("+12V");
  });
});

