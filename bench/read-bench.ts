// Reader speed and memory on generated projects: (a) a hierarchy of 40+ sheets and 10+ MB,
// (b) one 5 MB sheet. For each: the bare s-expression parse of every file (sexpr-plus as used,
// and our own tokenizer for comparison) and the full read (parse + extraction + connectivity +
// parts), each in a fresh child process so its peak RSS is its own. Measured, never asserted.
import { spawnSync } from "node:child_process";
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { nodeFileSource, readDesign } from "../src/read/index.js";
import { parseSexpr } from "../src/read/sexpr.js";
import { generateProject } from "./gen-project.js";

type Mode = "idle" | "parse" | "parse-own" | "parse-largest" | "read";

interface ChildJob {
  mode: Mode;
  dir: string;
  root: string;
}

interface ChildResult {
  ms: number;
  bytes: number;
  peakRssMB: number;
  /** Heap still in use after a full GC, with the result alive (MiB). */
  retainedMB: number;
  detail: string;
}

/** Each timing is the best of this many fresh processes (the machine is shared; noise is high). */
const REPEATS = 3;

const CHILD_ENV = "LOADLINE_READ_BENCH_CHILD";

function schematicFiles(dir: string): string[] {
  return readdirSync(dir).filter((f) => f.endsWith(".kicad_sch")).map((f) => join(dir, f)).sort();
}

/** Runs one measurement in this (child) process. */
function runJob(job: ChildJob): ChildResult {
  const files = schematicFiles(job.dir);
  const sizes = files.map((f) => statSync(f).size);
  const t0 = performance.now();
  let bytes = 0;
  let detail = "";
  if (job.mode === "parse" || job.mode === "parse-own" || job.mode === "parse-largest") {
    const list = job.mode === "parse-largest" ? [files[sizes.indexOf(Math.max(...sizes))] as string] : files;
    const tokenizers = new Set<string>();
    for (const f of list) {
      const data = readFileSync(f);
      bytes += data.length;
      const r = parseSexpr(data, f, { tokenizer: job.mode === "parse-own" ? "own" : "auto" });
      if (!r.ok) throw new Error(`${r.error.file}:${r.error.line}:${r.error.column}: ${r.error.message}`);
      tokenizers.add(r.tokenizer);
    }
    detail = `${list.length} file(s), tokenizer ${[...tokenizers].join("+")}`;
  } else if (job.mode === "read") {
    const r = readDesign(job.root, { fs: nodeFileSource() });
    if (!r.ok) throw new Error(`${r.error.file}:${r.error.line}:${r.error.column}: ${r.error.message}`);
    bytes = sizes.reduce((a, b) => a + b, 0);
    detail = `${r.circuit.sheets.length} sheet instances, ${r.circuit.parts.length} parts, ${r.circuit.nets.length} nets`;
  }
  const ms = performance.now() - t0;
  (globalThis as { gc?: () => void }).gc?.();
  const retainedMB = process.memoryUsage().heapUsed / 1048576;
  return { ms, bytes, peakRssMB: process.resourceUsage().maxRSS / 1024, retainedMB, detail };
}

function runChild(job: ChildJob, nodeFlags: string[]): { ok: true; result: ChildResult } | { ok: false; message: string } {
  const script = process.argv[1];
  if (script === undefined) throw new Error("cannot locate the benchmark script to re-run it");
  const child = spawnSync(process.execPath, [...nodeFlags, script], {
    env: { ...process.env, [CHILD_ENV]: JSON.stringify(job) },
    encoding: "utf8",
    maxBuffer: 1 << 20,
  });
  if (child.status !== 0) return { ok: false, message: child.stderr.trim().split("\n").slice(-1)[0] ?? `exit ${child.status}` };
  const line = child.stdout.trim().split("\n").pop() ?? "";
  return { ok: true, result: JSON.parse(line) as ChildResult };
}

/** Best time of REPEATS fresh processes; the largest peak RSS seen. */
function measure(job: ChildJob): ChildResult {
  let best: ChildResult | undefined;
  let peak = 0;
  for (let i = 0; i < REPEATS; i++) {
    const r = runChild(job, ["--expose-gc"]);
    if (!r.ok) throw new Error(`benchmark child (${job.mode}) failed: ${r.message}`);
    peak = Math.max(peak, r.result.peakRssMB);
    if (!best || r.result.ms < best.ms) best = r.result;
  }
  return { ...(best as ChildResult), peakRssMB: peak };
}

function row(cells: string[], widths: number[]): string {
  return cells.map((c, i) => (i === 0 ? c.padEnd(widths[i] ?? 0) : c.padStart(widths[i] ?? 0))).join("  ");
}

export async function benchRead(): Promise<void> {
  const base = mkdtempSync(join(tmpdir(), "loadline-read-bench-"));
  try {
    const projects = [
      { name: "hierarchy (40 sheets, 10 MB)", dir: join(base, "hier"), opts: { sheets: 40, targetBytes: 10_500_000 } },
      { name: "single sheet (5 MB)", dir: join(base, "flat"), opts: { sheets: 1, targetBytes: 5_000_000, singleSheet: true } },
    ];
    console.log("reader benchmark (each figure from a fresh process; MB = 10^6 bytes, RSS in MiB)");
    const idle = measure({ mode: "idle", dir: base, root: "" });
    console.log(`baseline RSS of an idle benchmark process: ${idle.peakRssMB.toFixed(0)} MiB\n`);
    const widths = [34, 9, 9, 9, 9, 10, 0];
    for (const p of projects) {
      const g = generateProject(p.dir, p.opts);
      const files = schematicFiles(p.dir);
      const largest = Math.max(...files.map((f) => statSync(f).size));
      console.log(`${p.name}: ${files.length} files, ${(g.bytes / 1e6).toFixed(2)} MB, largest file ${(largest / 1e6).toFixed(2)} MB`);
      console.log(row(["  measurement", "best ms", "MB/s", "peak RSS", "retained", "vs parse", "detail"], widths));
      const results: [string, ChildResult][] = [
        ["  parse, sexpr-plus (as used)", measure({ mode: "parse", dir: p.dir, root: g.root })],
        ["  parse, own tokenizer", measure({ mode: "parse-own", dir: p.dir, root: g.root })],
        ["  parse largest file only", measure({ mode: "parse-largest", dir: p.dir, root: g.root })],
        ["  full read (readDesign)", measure({ mode: "read", dir: p.dir, root: g.root })],
      ];
      const parseMs = results[0]?.[1].ms ?? 1;
      for (const [label, r] of results) {
        const vs = label.includes("full read") ? `+${((r.ms / parseMs - 1) * 100).toFixed(0)} %` : "";
        console.log(row([label, r.ms.toFixed(0), (r.bytes / 1e6 / (r.ms / 1000)).toFixed(2), `${r.peakRssMB.toFixed(0)} MiB`,
          `${r.retainedMB.toFixed(0)} MiB`, vs, r.detail], widths));
      }
      // Memory follows the largest sheet if the whole read fits in a heap sized from that sheet alone.
      const largestPeak = results[2]?.[1].peakRssMB ?? 100;
      const cap = Math.max(64, Math.ceil((2 * largestPeak) / 16) * 16);
      const capped = runChild({ mode: "read", dir: p.dir, root: g.root }, [`--max-old-space-size=${cap}`]);
      console.log(`  full read with the V8 heap capped at ${cap} MiB (2 x the largest file's parse peak): ${capped.ok ? `ok, peak RSS ${capped.result.peakRssMB.toFixed(0)} MiB` : `failed (${capped.message})`}`);
      console.log("");
    }
  } finally {
    rmSync(base, { recursive: true, force: true });
  }
}

// Child mode: the parent re-runs this bundle with the job in the environment; do it and leave.
const childJob = process.env[CHILD_ENV];
if (childJob !== undefined) {
  const result = runJob(JSON.parse(childJob) as ChildJob);
  process.stdout.write(`${JSON.stringify(result)}\n`);
  process.exit(0);
}
