// The `fix` command's output and exit codes, and its dry-run diff applied by GNU patch (an
// independent reader of the unified format) reproducing exactly the bytes `fix` writes.
import { execFileSync } from "node:child_process";
import { cpSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { runFixCommand, type FixCommandOptions } from "../src/cli/fix.js";
import type { FixRequest } from "../src/fix/run.js";
import { copyFixtures, wishRule } from "./fix-helpers.js";

let dir: string;
let done: () => void;
beforeEach(() => ({ dir, done } = copyFixtures()));
afterEach(() => done());

function command(paths: string[], options: Partial<FixCommandOptions>, request: Partial<FixRequest>) {
  let stdout = "";
  let stderr = "";
  const code = runFixCommand(paths, { rule: [], dryRun: false, color: false, ...options }, {
    stdout: (s) => (stdout += s), stderr: (s) => (stderr += s), cwd: dir, isTTY: false, env: {},
  }, request);
  return { code, stdout, stderr };
}

function hasPatch(): boolean {
  try {
    return execFileSync("patch", ["--version"], { encoding: "utf8" }).includes("GNU patch");
  } catch {
    return false;
  }
}

const both = [wishRule({ R3: "6k8", R107: "6k8", R207: "6k8" })];

describe("loadline fix (command)", () => {
  it("lists what changed per file and exits 0; the second run says nothing to fix", () => {
    const first = command(["divider-crlf.kicad_sch", "two-channel/receiver.kicad_sch"], {}, { lintRules: both });
    expect(first.code).toBe(0);
    expect(first.stdout).toBe(
      [
        "divider-crlf.kicad_sch",
        "  changed R3 7k3 -> 6k8",
        "two-channel/channel.kicad_sch",
        "  changed R107/R207 7k3 -> 6k8 (one value in two-channel/channel.kicad_sch, shared by /channel 1/, /channel 2/; right for every instance)",
        "2 values changed in 2 files",
        "",
      ].join("\n"),
    );
    const second = command(["divider-crlf.kicad_sch", "two-channel/receiver.kicad_sch"], {}, { lintRules: both });
    expect(second).toEqual({ code: 0, stdout: "nothing to fix\n", stderr: "" });
  });

  it("exits 1 and says why when a fix is refused", () => {
    const result = command(["two-channel/receiver.kicad_sch"], {}, { lintRules: [wishRule({ R107: "6k8", R207: "7k5" })] });
    expect(result.code).toBe(1);
    expect(result.stdout).toBe(
      [
        "not changed",
        "  refused R107/R207 share one value in two-channel/channel.kicad_sch; R107 (/channel 1/) wants 6k8, R207 (/channel 2/) wants 7k5: not changed",
        "nothing changed; 1 fix refused",
        "",
      ].join("\n"),
    );
  });

  it("exits 2 on an unknown --rule and on a missing file, changing nothing", () => {
    const unknown = command(["divider-crlf.kicad_sch"], { rule: ["no-such-rule"] }, { lintRules: both });
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toBe("loadline fix: --rule no-such-rule: no such rule (rules: value-wish)\nloadline fix: the check failed, so nothing was changed\n");
    const missing = command(["nowhere.kicad_sch"], {}, { lintRules: both });
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/nowhere\.kicad_sch/);
  });

  it("--rule limits the fixes to that rule", () => {
    const result = command(["divider-crlf.kicad_sch"], { rule: ["other"] }, { lintRules: [wishRule({ R3: "6k8" }), wishRule({ R2: "5k6" }, { id: "other" })] });
    expect(result.code).toBe(0);
    expect(result.stdout).toContain("changed R2 4k7 -> 5k6");
    expect(result.stdout).not.toContain("R3");
  });

  it.runIf(hasPatch())("--dry-run prints only the diff on stdout; GNU patch applies it to the same bytes fix writes", () => {
    const paths = ["divider-crlf.kicad_sch", "two-channel/receiver.kicad_sch"];
    const dry = command(paths, { dryRun: true }, { lintRules: both });
    expect(dry.code).toBe(0);
    expect(dry.stdout.startsWith("--- a/divider-crlf.kicad_sch\n")).toBe(true);
    expect(dry.stderr).toMatch(/2 values would change in 2 files \(dry run: nothing written\)\n$/);

    // Apply the diff to a second, untouched copy with GNU patch, then let fix write the first copy.
    const other = mkdtempSync(join(tmpdir(), "loadline-patch-"));
    try {
      cpSync(dir, other, { recursive: true });
      execFileSync("patch", ["-p1", "--binary", "--quiet"], { cwd: other, input: dry.stdout });
      expect(command(paths, {}, { lintRules: both }).code).toBe(0);
      for (const file of ["divider-crlf.kicad_sch", "two-channel/channel.kicad_sch", "two-channel/receiver.kicad_sch"]) {
        expect(readFileSync(join(other, file)).equals(readFileSync(join(dir, file)))).toBe(true);
      }
    } finally {
      rmSync(other, { recursive: true, force: true });
    }
  });
});
