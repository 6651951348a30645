// End to end: the built CLI's `fix` on a copy of the demo board. The e-series finding on R2 (8k5,
// not an E24 value) carries a fix; `loadline fix` must change exactly the bytes of that one Value
// string to the neighbour the rule's own re-solve chose, `--dry-run` must print a unified diff and
// write nothing, and a second run must find nothing to fix and leave the file byte-identical.
import { execFileSync, spawnSync } from "node:child_process";
import { copyFileSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { lint } from "../src/engine/lint.js";
import type { Finding } from "../src/engine/types.js";
import { loadRecording, opValue } from "./support/ngspice.js";

const ROOT = resolve(import.meta.dirname, "..");
const CLI = join(ROOT, "dist", "cli.js");
const DEMO = join(ROOT, "fixtures", "demo", "demo-preamp.kicad_sch");

/** IEC 60063:2015 Table 1, E24, one decade (shared/notes/reference-data.md §1.1). */
const E24 = [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];

/** An RKM resistance code as IEC 60062 writes it ("8k2" = 8.2 kΩ, "4R7" = 4.7 Ω). */
function rkmOhms(code: string): number {
  const m = /^(\d+)([RkM])(\d*)$/.exec(code);
  if (!m) return Number.NaN;
  const scale = { R: 1, k: 1e3, M: 1e6 }[m[2] as "R" | "k" | "M"];
  return Number(`${m[1]}.${m[3] || "0"}`) * scale;
}

/** Largest relative change of Q1/Q2 VCE and IC from R2 = 8k5 to the given deck (ngspice 39). */
function ngspiceShift(deck: string): number {
  const figures = (name: string): number[] => {
    const rec = loadRecording(name);
    const v = (x: string): number => opValue(rec, x);
    return [v("v(mid)") - v("v(e1)"), v("v(c2)") - v("v(mid)"), v("i(@q1[ic])"), v("i(@q2[ic])")];
  };
  const before = figures("board_demo_preamp_r2_8k5");
  const after = figures(deck);
  return Math.max(...before.map((b, i) => Math.abs((after[i] ?? Number.NaN) - b) / Math.abs(b)));
}

function hasGnuPatch(): boolean {
  const run = spawnSync("patch", ["--version"], { encoding: "utf8" });
  return run.status === 0 && run.stdout.includes("GNU patch");
}

function newestUnder(dir: string): number {
  return readdirSync(dir).reduce((newest, name) => {
    const path = join(dir, name);
    const st = statSync(path);
    return Math.max(newest, st.isDirectory() ? newestUnder(path) : st.mtimeMs);
  }, 0);
}

/** dist/cli.js bundles src/ and rules/: rebuild it when it is missing or older than either. */
function ensureBuilt(): void {
  const sources = Math.max(newestUnder(join(ROOT, "src")), newestUnder(join(ROOT, "rules")));
  if (existsSync(CLI) && statSync(CLI).mtimeMs >= sources) return;
  execFileSync(process.execPath, [join(ROOT, "scripts", "build.mjs")], { cwd: ROOT, stdio: "pipe", timeout: 120_000 });
}

function cli(args: string[], cwd: string): { code: number | null; stdout: string; stderr: string } {
  const run = spawnSync(process.execPath, [CLI, ...args], { cwd, encoding: "utf8", timeout: 120_000, env: { ...process.env, NO_COLOR: "1" } });
  return { code: run.status, stdout: run.stdout, stderr: run.stderr };
}

let dir = "";
let board = "";
let original: Buffer;
let finding: Finding;

beforeAll(() => {
  ensureBuilt();
  dir = mkdtempSync(join(tmpdir(), "loadline-fix-demo-"));
  board = join(dir, "demo-preamp.kicad_sch");
  copyFileSync(DEMO, board);
  // An empty config beside the copy: the defaults, and no config lookup past the temporary folder.
  writeFileSync(join(dir, "loadline.json"), "{}\n");
  original = readFileSync(board);
  const design = lint({ paths: [board] }).designs[0];
  const found = design?.findings.filter((f) => f.rule === "e-series" && f.parts.includes("R2")) ?? [];
  expect(found).toHaveLength(1);
  finding = found[0] as Finding;
}, 180_000);

afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
});

/** The original bytes with the finding's span (a quoted KiCad string) replaced by the proposal. */
function expectedAfterFix(): Buffer {
  const fix = finding.fix;
  if (!fix) throw new Error("the R2 finding carries no fix");
  return Buffer.concat([original.subarray(0, fix.span.start), Buffer.from(`"${fix.replacement}"`, "utf8"), original.subarray(fix.span.end)]);
}

describe("loadline fix on the demo board (built CLI, temporary copy)", () => {
  it("the R2 finding proposes the E24 neighbour the rule's re-solve picked, at the bytes of \"8k5\"", () => {
    const fix = finding.fix;
    expect(fix).toBeDefined();
    if (!fix) return;
    expect(fix.span.file).toBe(board);
    expect(original.subarray(fix.span.start, fix.span.end).toString("utf8")).toBe('"8k5"');
    // The value written is the one the rule's re-solve chose (data.chosen), in the sheet's RKM style.
    const chosen = Number(finding.data.chosen);
    expect(rkmOhms(fix.replacement)).toBe(chosen);
    expect(fix.replacement).toMatch(/^\d+k\d*$/);
    // Independently (IEC 60063 Table 1): 8.2 k is an E24 member and, with 9.1 k, one of the two
    // members adjacent to 8.5 k — no E24 value lies between it and 8.5 k.
    const members = E24.map((m) => Math.round(m * 1000));
    expect(members).toContain(8200);
    const below = Math.max(...members.filter((v) => v < 8500));
    const above = Math.min(...members.filter((v) => v > 8500));
    expect([below, above]).toEqual([8200, 9100]);
    expect([below, above]).toContain(chosen);
    // And it is the neighbour that moves the bias less in ngspice (recorded decks of this board).
    const kinder = ngspiceShift("board_demo_preamp_r2_8k2") < ngspiceShift("board_demo_preamp_r2_9k1") ? 8200 : 9100;
    expect(chosen).toBe(kinder);
  });

  it("--dry-run prints a unified diff of that one line and writes nothing", () => {
    const run = cli(["fix", board, "--dry-run"], dir);
    expect(run.code, run.stderr).toBe(0);
    expect(readFileSync(board).equals(original)).toBe(true);
    const lines = run.stdout.split("\n");
    expect(lines[0]).toMatch(/^--- /);
    expect(lines[1]).toMatch(/^\+\+\+ /);
    expect(lines.filter((l) => l.startsWith("@@"))).toHaveLength(1);
    const removed = lines.filter((l) => l.startsWith("-") && !l.startsWith("---"));
    const added = lines.filter((l) => l.startsWith("+") && !l.startsWith("+++"));
    expect(removed).toHaveLength(1);
    expect(added).toHaveLength(1);
    expect(removed[0]).toContain('"8k5"');
    expect(added[0]).toBe(`+${removed[0]?.slice(1).replace('"8k5"', '"8k2"')}`);
    expect(run.stderr).toContain("would change R2 8k5 -> 8k2");
    expect(run.stderr).toContain("dry run: nothing written");
    // GNU patch, an independent reader of the format, turns the original into the fixed bytes.
    if (hasGnuPatch()) {
      const copy = join(dir, "patched.kicad_sch");
      copyFileSync(board, copy);
      const patch = spawnSync("patch", ["--quiet", "--binary", copy], { input: run.stdout, encoding: "utf8" });
      expect(patch.status, patch.stderr).toBe(0);
      expect(readFileSync(copy).equals(expectedAfterFix())).toBe(true);
      rmSync(copy);
    }
  });

  it("fix changes exactly the bytes of that value, and a second run finds nothing and leaves the file as it is", () => {
    const first = cli(["fix", board], dir);
    expect(first.code, first.stderr).toBe(0);
    expect(first.stdout).toContain("changed R2 8k5 -> 8k2");
    const after = readFileSync(board);
    const expected = expectedAfterFix();
    expect(after.length).toBe(original.length);
    expect(after.equals(expected)).toBe(true);

    const second = cli(["fix", board], dir);
    expect(second.code, second.stderr).toBe(0);
    expect(second.stdout).toBe("nothing to fix\n");
    expect(readFileSync(board).equals(after)).toBe(true);
  });
});
