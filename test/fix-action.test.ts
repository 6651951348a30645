// The Action's `fix` input: the step function on its own (with the stand-in rule), and the real
// entry point bundled and run as the runner runs it (INPUT_* variables, GITHUB_OUTPUT file), where
// the files it reports as fixed must be exactly the files whose bytes changed.
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { build } from "esbuild";
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { runFixStep } from "../src/fix/action-step.js";
import { copyFixtures, FIXTURES, wishRule } from "./fix-helpers.js";

let dir: string;
let done: () => void;
beforeEach(() => ({ dir, done } = copyFixtures()));
afterEach(() => done());

describe("runFixStep", () => {
  it("logs each change, lists the changed files and leaves them in the workspace", () => {
    const step = runFixStep({ paths: ["."], cwd: dir, lintRules: [wishRule({ R3: "6k8" })] });
    expect(step).toEqual({
      code: 0,
      changedFiles: ["divider-crlf.kicad_sch"],
      lines: ["loadline fix: divider-crlf.kicad_sch: R3 7k3 -> 6k8", "loadline fix: 1 value(s) changed in 1 file(s), left in the workspace; 0 refused"],
    });
    expect(readFileSync(join(dir, "divider-crlf.kicad_sch"), "utf8")).toContain('(property "Value" "6k8"');
  });

  it("turns a refusal into a warning annotation on the file", () => {
    const step = runFixStep({ paths: ["two-channel/receiver.kicad_sch"], cwd: dir, lintRules: [wishRule({ R107: "6k8", R207: "7k5" })] });
    expect(step.code).toBe(1);
    expect(step.changedFiles).toEqual([]);
    expect(step.lines[0]).toBe(
      "::warning title=loadline fix,file=two-channel/channel.kicad_sch::fix not made: R107/R207 share one value in two-channel/channel.kicad_sch; R107 (/channel 1/) wants 6k8, R207 (/channel 2/) wants 7k5: not changed",
    );
  });
});

describe("the bundled Action with fix: true", () => {
  let bundleDir = "";
  beforeAll(async () => {
    bundleDir = mkdtempSync(join(tmpdir(), "loadline-action-bundle-"));
    await build({
      entryPoints: [join(import.meta.dirname, "..", "src/action/index.ts")], outfile: join(bundleDir, "index.mjs"), bundle: true,
      platform: "node", target: "node20", format: "esm", logLevel: "silent",
      banner: { js: "import { createRequire as __r } from 'node:module'; const require = __r(import.meta.url);" },
    });
  });
  afterAll(() => rmSync(bundleDir, { recursive: true, force: true }));

  function runAction(): { code: number | null; stdout: string; fixed: string[] } {
    const out = join(bundleDir, `out-${Math.random().toString(36).slice(2)}`);
    writeFileSync(out, "");
    const env = {
      PATH: process.env["PATH"] ?? "", GITHUB_ACTIONS: "true", GITHUB_WORKSPACE: dir, GITHUB_OUTPUT: out,
      "INPUT_PATHS": ".", "INPUT_CONFIG": "", "INPUT_FAIL-ON": "never", "INPUT_SARIF-FILE": "", "INPUT_HTML-FILE": "",
      "INPUT_ANNOTATIONS": "false", "INPUT_SUMMARY": "false", "INPUT_FIX": "true",
    };
    const run = spawnSync(process.execPath, [join(bundleDir, "index.mjs")], { cwd: dir, env, encoding: "utf8" });
    // GITHUB_OUTPUT holds `name<<delimiter`, the value lines, then the delimiter.
    const outputs = readFileSync(out, "utf8");
    const match = /fixed-files<<(\S+)\n([\s\S]*?)\n?\1/.exec(outputs);
    const fixed = match?.[2] ? match[2].split("\n").filter((l) => l !== "") : [];
    return { code: run.status, stdout: run.stdout, fixed };
  }

  it("reports as fixed exactly the files whose bytes changed, and nothing on the second run", () => {
    // Every schematic under fixtures/fix: the Action lints the whole workspace.
    const files = ["divider-crlf.kicad_sch", "two-channel/receiver.kicad_sch", "two-channel/channel.kicad_sch",
      "two-channel-v6/receiver.kicad_sch", "two-channel-v6/channel.kicad_sch"];
    const first = runAction();
    expect(first.code).toBe(0);
    expect(first.stdout).toMatch(/loadline fix: (nothing to fix|\d+ value\(s\) changed)/);
    const changed = files.filter((f) => !readFileSync(join(dir, f)).equals(readFileSync(join(FIXTURES, f))));
    expect(first.fixed.sort()).toEqual(changed.sort());
    const second = runAction();
    expect(second.fixed).toEqual([]);
    expect(second.stdout).toContain("loadline fix: nothing to fix");
  });
});
