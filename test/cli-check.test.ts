// The check, rules and init commands end to end (run from source through scripts/run-ts.mjs), on the
// invented boards in test/fixtures-action/. Exit codes are design.md's: 0 clean or under the
// threshold, 1 findings at or over it, 2 the run failed.
import { spawnSync } from "node:child_process";
import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Ajv } from "ajv";
import { loadConfig } from "../src/engine/config.js";
import { starterConfig, RAIL_PLACEHOLDER } from "../src/cli/init.js";
import { allRules } from "../rules/index.js";

const repo = new URL("..", import.meta.url).pathname;
let work = "";

function cli(args: string[], cwd = work): { code: number | null; stdout: string; stderr: string } {
  const env: NodeJS.ProcessEnv = { ...process.env, NO_COLOR: "1" };
  delete env["GITHUB_WORKSPACE"];
  const r = spawnSync(process.execPath, [join(repo, "scripts/run-ts.mjs"), join(repo, "src/cli/index.ts"), ...args], { cwd, encoding: "utf8", env, timeout: 60_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

beforeAll(() => {
  work = mkdtempSync(join(tmpdir(), "loadline-cli-"));
  cpSync(join(repo, "test/fixtures-action"), work, { recursive: true });
});
afterAll(() => {
  if (work) rmSync(work, { recursive: true, force: true });
});

describe("loadline check", () => {
  it("writes several reports in one run: --format/--output pairs and shorthand files", () => {
    const r = cli(["check", "tracer", "--format", "json", "--output", "out/a.json", "--sarif", "out/a.sarif", "--html", "out/a.html", "--format", "text", "--no-color"]);
    expect(r.code).toBe(1);
    expect(r.stdout).toMatch(/tracer\/tracer\.net:\d+:5 {2}error {3}rail-bypass R1, R3, R5 {2}Rail \+9V/);
    const json = JSON.parse(readFileSync(join(work, "out/a.json"), "utf8")) as { schemaVersion: number; summary: { error: number } };
    expect(json.schemaVersion).toBe(1);
    expect(json.summary.error).toBe(1);
    expect((JSON.parse(readFileSync(join(work, "out/a.sarif"), "utf8")) as { version: string }).version).toBe("2.1.0");
    expect(readFileSync(join(work, "out/a.html"), "utf8")).toMatch(/^<!DOCTYPE html>/);
  });

  it("exits 0 under the threshold and 2 on a broken file", () => {
    expect(cli(["check", "tracer", "--fail-on", "never"]).code).toBe(0);
    expect(cli(["check", "quiet"]).code).toBe(0); // its only error is suppressed
    const broken = cli(["check", "broken.kicad_sch"]);
    expect(broken.code).toBe(2);
    expect(broken.stdout).toContain("broken.kicad_sch:3:1  could not check: expected ')'");
  });

  it("refuses usage mistakes with exit 2 and says why", () => {
    const two = cli(["check", "tracer", "--format", "json", "--format", "sarif"]);
    expect(two.code).toBe(2);
    expect(two.stderr).toContain("only one format can go to standard output (json, sarif)");
    const orphan = cli(["check", "tracer", "--output", "x.json"]);
    expect(orphan.code).toBe(2);
    expect(orphan.stderr).toContain("--output FILE goes right after the --format it is for");
    const missing = cli(["check", "no-such-board.kicad_sch"]);
    expect(missing.code).toBe(2);
    expect(missing.stdout).toContain("no-such-board.kicad_sch  error: no such file or folder");
  });
});

describe("loadline rules", () => {
  it("lists every rule with its default severity and explains one", () => {
    const list = cli(["rules"], repo);
    expect(list.code).toBe(0);
    for (const rule of allRules) expect(list.stdout).toMatch(new RegExp(`^${rule.id} +${rule.severity} +`, "m"));
    const one = cli(["rules", "rail-bypass"], repo);
    expect(one.stdout).toContain("Why it matters");
    const typo = cli(["rules", "rail-bypas"], repo);
    expect(typo.code).toBe(2);
    expect(typo.stderr).toContain("unknown rule 'rail-bypas' (did you mean 'rail-bypass'?)");
  });
});

describe("loadline init", () => {
  it("writes a starter config that validates, and never overwrites it", () => {
    const dir = join(work, "tracer");
    const first = cli(["init"], dir);
    expect(first.code).toBe(0);
    const text = readFileSync(join(dir, "loadline.json"), "utf8");
    const schema: unknown = JSON.parse(readFileSync(join(repo, "schema/loadline.schema.json"), "utf8"));
    const ajv = new Ajv({ strict: true, allowUnionTypes: true });
    expect(ajv.validate(schema as object, JSON.parse(text))).toBe(true);
    // +9V names its voltage, so no rail needs one; the band is the default written out.
    const loaded = loadConfig(text, "loadline.json", allRules);
    expect(loaded.errors).toEqual([]);
    expect(loaded.config.band.low).toBeCloseTo(0.5e6, 0);
    expect(loaded.config.band.high).toBeCloseTo(30e6, 0);
    const again = cli(["init"], dir);
    expect(again.code).toBe(2);
    expect(again.stderr).toContain("loadline.json already exists here");
    expect(readFileSync(join(dir, "loadline.json"), "utf8")).toBe(text);
  });

  it("lists rails without a voltage under a placeholder the next run insists on", () => {
    const text = starterConfig(["VCC", "VBIAS", "VCC"]);
    const { config, errors } = loadConfig(text, "loadline.json", allRules);
    expect(Object.keys(JSON.parse(text).rails as object)).toEqual(["VBIAS", "VCC"]);
    expect(errors.map((e) => e.message)).toEqual([
      `rails.VBIAS: '${RAIL_PLACEHOLDER}' is not a voltage; write it like "12V"`,
      `rails.VCC: '${RAIL_PLACEHOLDER}' is not a voltage; write it like "12V"`,
    ]);
    expect(config.rails).toEqual({});
    expect(existsSync(join(work, "loadline.json"))).toBe(false);
  });
});
