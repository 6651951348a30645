// Solver speed: DC operating point and a 1001-point AC sweep on generated circuits of about 10,
// 100 and 1000 nodes (ladders of capacitor-coupled CE stages, RC ladders), against ngspice's own
// reported analysis time on the same netlists. Measured, never asserted: `npm run bench` (or
// `npm run bench -- solve`).
//
// Like for like: ngspice's "Total analysis time" is user CPU time (getrusage) around its whole
// analysis job — circuit set-up (matrix structure, temperature pre-processing) and, for `ac`, its
// own operating point — without parsing. Ours is user CPU time (process.cpuUsage) per call of
// the public entry points, which do the same work: solveOperatingPoint (topology check,
// elaboration, Newton, device reports) and, for AC, solveOperatingPoint + acSweep (the phasor of
// every node and branch, as ngspice keeps every vector). Both are averaged over many runs in one
// process. ngspice re-uses its parsed circuit between runs but rebuilds its matrix and ordering;
// we re-use what a solve of the same circuit object left (topology check, symbolic analysis), so
// DC is also shown with a new circuit object on every call (nothing re-used), and for the first
// call in a fresh process (JIT compilation included).

import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { acSweep, logSpace, solveOperatingPoint } from "../src/solve/index.js";
import type { Element, ModelCard, SolverCircuit } from "../src/solve/netlist.js";

/** The 2N3904 Gummel–Poon card of reference-data 4.1 (RB 10 Ω and RC 1 Ω add internal nodes). */
const Q2N3904: ModelCard = {
  name: "Q2N3904",
  type: "NPN",
  params: {
    IS: 6.734e-15, VAF: 74.03, BF: 416.4, NE: 1.259, ISE: 6.734e-15, IKF: 66.78e-3, BR: 0.7371, NC: 2, RC: 1, RB: 10,
    CJC: 3.638e-12, MJC: 0.3085, VJC: 0.75, FC: 0.5, CJE: 4.493e-12, MJE: 0.2593, VJE: 0.75, TR: 239.5e-9, TF: 301.2e-12,
    ITF: 0.4, VTF: 4, XTF: 2,
  },
  source: "reference-data 4.1",
};

export interface BenchCase {
  name: string;
  circuit: SolverCircuit;
  source: string;
  out: string;
  nodes: number;
}

/** Capacitor-coupled common-emitter stages in cascade, 3 nodes each plus the rail and the input. */
export function ceLadder(stages: number): BenchCase {
  const el: Element[] = [
    { kind: "V", name: "VCC", pos: "vcc", neg: "0", dc: 9 },
    { kind: "V", name: "VIN", pos: "in", neg: "0", dc: 0, ac: 1 },
    { kind: "C", name: "CIN", a: "in", b: "b0", farads: 10e-6 },
  ];
  for (let i = 0; i < stages; i++) {
    el.push(
      { kind: "R", name: `R1_${i}`, a: "vcc", b: `b${i}`, ohms: 56e3 },
      { kind: "R", name: `R2_${i}`, a: `b${i}`, b: "0", ohms: 10e3 },
      { kind: "R", name: `RC_${i}`, a: "vcc", b: `c${i}`, ohms: 3.9e3 },
      { kind: "R", name: `RE_${i}`, a: `e${i}`, b: "0", ohms: 680 },
      { kind: "C", name: `CE_${i}`, a: `e${i}`, b: "0", farads: 100e-6 },
      { kind: "Q", name: `Q_${i}`, c: `c${i}`, b: `b${i}`, e: `e${i}`, model: Q2N3904 },
    );
    // Heavy interstage attenuation keeps every stage in its linear range.
    if (i + 1 < stages) {
      el.push({ kind: "C", name: `CC_${i}`, a: `c${i}`, b: `x${i}`, farads: 10e-6 });
      el.push({ kind: "R", name: `RA_${i}`, a: `x${i}`, b: `b${i + 1}`, ohms: 1e6 });
    }
  }
  return { name: `CE ladder, ${stages} stages`, circuit: { title: "bench CE ladder", elements: el }, source: "VIN", out: `c${stages - 1}`, nodes: 4 * stages + 1 };
}

export function rcLadder(sections: number): BenchCase {
  const el: Element[] = [{ kind: "V", name: "VIN", pos: "n0", neg: "0", dc: 1, ac: 1 }];
  for (let i = 1; i <= sections; i++) {
    el.push({ kind: "R", name: `R${i}`, a: `n${i - 1}`, b: `n${i}`, ohms: 1e3 });
    el.push({ kind: "C", name: `C${i}`, a: `n${i}`, b: "0", farads: 1e-9 });
  }
  el.push({ kind: "R", name: "RL", a: `n${sections}`, b: "0", ohms: 1e6 });
  return { name: `RC ladder, ${sections} sections`, circuit: { title: "bench RC ladder", elements: el }, source: "VIN", out: `n${Math.min(sections, 3)}`, nodes: sections + 1 };
}

function spiceNumber(v: number): string {
  return Number.isInteger(v) ? String(v) : v.toExponential(10);
}

/** The circuit as an ngspice netlist body (elements and models only). */
function netlist(circuit: SolverCircuit): string {
  const lines: string[] = [];
  const models = new Map<string, ModelCard>();
  for (const e of circuit.elements) {
    switch (e.kind) {
      case "R": lines.push(`R${e.name} ${e.a} ${e.b} ${spiceNumber(e.ohms)}`); break;
      case "C": lines.push(`C${e.name} ${e.a} ${e.b} ${spiceNumber(e.farads)}`); break;
      case "L": lines.push(`L${e.name} ${e.a} ${e.b} ${spiceNumber(e.henries)}`); break;
      case "V": lines.push(`V${e.name} ${e.pos} ${e.neg} DC ${spiceNumber(e.dc)}${e.ac ? ` AC ${spiceNumber(e.ac)}` : ""}`); break;
      case "I": lines.push(`I${e.name} ${e.pos} ${e.neg} DC ${spiceNumber(e.dc)}${e.ac ? ` AC ${spiceNumber(e.ac)}` : ""}`); break;
      case "Q": lines.push(`Q${e.name} ${e.c} ${e.b} ${e.e} ${e.model.name}`); models.set(e.model.name, e.model); break;
      default: throw new Error(`bench netlist writer: ${e.kind} not needed here`);
    }
  }
  for (const m of models.values()) {
    lines.push(`.model ${m.name} ${m.type}(${Object.entries(m.params).map(([k, v]) => `${k}=${spiceNumber(v)}`).join(" ")})`);
  }
  return lines.join("\n");
}

function ngspiceAvailable(): string | null {
  const run = spawnSync("ngspice", ["-v"], { encoding: "utf8", timeout: 10_000 });
  const m = /\*\*\s*(ngspice-[\w.+-]+)/.exec(run.stdout ?? "");
  return run.status === 0 && m ? (m[1] ?? null) : null;
}

/** Runs `op` (or one AC sweep) `repeat` times inside ngspice and returns its analysis seconds per run. */
function ngspiceAnalysisTime(circuit: SolverCircuit, command: string, repeat: number): number {
  const dir = mkdtempSync(join(tmpdir(), "loadline-bench-"));
  try {
    const deck = join(dir, "bench.cir");
    writeFileSync(deck, [
      "* loadline solver benchmark",
      netlist(circuit),
      ".control",
      "let k = 0",
      `while k < ${repeat}`,
      `  ${command}`,
      "  destroy all",
      "  let k = k + 1",
      "end",
      "rusage everything",
      "quit",
      ".endc",
      ".end",
      "",
    ].join("\n"));
    const run = spawnSync("ngspice", ["-n", "-b", deck], { cwd: dir, encoding: "utf8", timeout: 600_000 });
    const log = `${run.stdout ?? ""}${run.stderr ?? ""}`;
    const m = /Total analysis time \(seconds\) = ([\d.eE+-]+)/.exec(log);
    if (!m) throw new Error(`ngspice printed no analysis time:\n${log.slice(0, 2000)}`);
    return Number(m[1]) / repeat;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** 1001 points, the grid of ngspice's `ac dec 125 1 100Meg`. */
const FREQUENCIES = logSpace(1, 1e8, 125);
const NGSPICE_AC = "ac dec 125 1 100Meg";

function benchCases(): BenchCase[] {
  return [ceLadder(3), ceLadder(25), ceLadder(250), rcLadder(10), rcLadder(100), rcLadder(1000)];
}

function solveDc(c: BenchCase, circuit: SolverCircuit = c.circuit): void {
  const op = solveOperatingPoint(circuit);
  if (!op.converged) throw new Error(`${c.name}: no operating point (${op.problem ?? ""})`);
}

function solveAc(c: BenchCase): void {
  const op = solveOperatingPoint(c.circuit);
  const ac = acSweep(c.circuit, op, FREQUENCIES, { kind: "source", name: c.source });
  if (ac.problem !== undefined) throw new Error(`${c.name}: ${ac.problem}`);
}

/** User CPU seconds per call of `fn`: the mean over a batch of at least `minSeconds`, best of three batches. */
function cpuPerCall(fn: () => void, minSeconds: number): number {
  const warmUntil = performance.now() + 1000 * Math.min(0.3, minSeconds);
  do fn(); while (performance.now() < warmUntil);
  let best = Infinity;
  for (let batch = 0; batch < 3; batch++) {
    const start = process.cpuUsage().user;
    let calls = 0, used = 0;
    do {
      fn();
      calls++;
      used = (process.cpuUsage().user - start) / 1e6;
    } while (used < minSeconds || calls < 3);
    best = Math.min(best, used / calls);
  }
  return best;
}

const FIRST_CALL_ENV = "LOADLINE_SOLVE_BENCH_FIRST";
/** First-call figures are the best of this many fresh processes. */
const FIRST_CALL_PROCESSES = 3;

interface FirstCall { dcSeconds: number; acSeconds: number }

/** In a fresh process: the first DC call, then the first AC call (its operating point included). */
function firstCalls(index: number): FirstCall {
  const c = benchCases()[index];
  if (!c) throw new Error(`no benchmark case ${index}`);
  let t = performance.now();
  solveDc(c);
  const dcSeconds = (performance.now() - t) / 1000;
  t = performance.now();
  solveAc(c);
  return { dcSeconds, acSeconds: (performance.now() - t) / 1000 };
}

function measureFirstCalls(index: number): FirstCall {
  const script = process.argv[1];
  if (script === undefined) throw new Error("cannot locate the benchmark script to re-run it");
  let best: FirstCall = { dcSeconds: Infinity, acSeconds: Infinity };
  for (let i = 0; i < FIRST_CALL_PROCESSES; i++) {
    const child = spawnSync(process.execPath, [script, "solve"], { env: { ...process.env, [FIRST_CALL_ENV]: String(index) }, encoding: "utf8" });
    if (child.status !== 0) throw new Error(`first-call child failed: ${child.stderr.trim().split("\n").slice(-1)[0] ?? ""}`);
    const r = JSON.parse(child.stdout.trim().split("\n").pop() ?? "") as FirstCall;
    best = { dcSeconds: Math.min(best.dcSeconds, r.dcSeconds), acSeconds: Math.min(best.acSeconds, r.acSeconds) };
  }
  return best;
}

function ms(seconds: number | undefined): string {
  if (seconds === undefined || !Number.isFinite(seconds)) return "      n/a";
  return (seconds * 1000).toFixed(seconds < 1e-3 ? 3 : seconds < 1e-1 ? 2 : 1).padStart(9);
}

function ratio(ours: number, theirs: number | undefined): string {
  if (theirs === undefined || !(theirs > 0)) return "      n/a";
  return `${(ours / theirs).toFixed(2)}×`.padStart(9);
}

export async function benchSolve(): Promise<void> {
  const version = ngspiceAvailable();
  const cases = benchCases();
  console.log(`\nsolver: DC operating point and ${FREQUENCIES.length}-point AC sweep, milliseconds per analysis`);
  console.log(version ? `reference: ${version}, analysis time from its own rusage counters` : "reference: ngspice not installed, our times only");
  const dcHead = ["first", "new obj", "warm", "ngspice", "ratio"], acHead = ["first", "warm", "ngspice", "ratio"];
  const cell = (text: string): string => text.padStart(9);
  console.log(`${"".padEnd(36)} | ${"DC operating point".padEnd(45)} | AC sweep, operating point included`);
  console.log(`${"case".padEnd(30)}${"nodes".padStart(6)} |${dcHead.map(cell).join("")} |${acHead.map(cell).join("")}`);
  for (const [index, c] of cases.entries()) {
    const first = measureFirstCalls(index);
    const fresh = cpuPerCall(() => solveDc(c, { title: c.circuit.title, elements: [...c.circuit.elements] }), 0.3);
    const dc = cpuPerCall(() => solveDc(c), 0.3);
    const ac = cpuPerCall(() => solveAc(c), 0.5);
    let ngDc: number | undefined, ngAc: number | undefined;
    if (version) {
      const scale = Math.max(1, Math.round(1000 / c.nodes));
      const opRuns = Math.min(2000, 20 * scale), acRuns = Math.min(200, 2 * scale);
      ngDc = Math.min(ngspiceAnalysisTime(c.circuit, "op", opRuns), ngspiceAnalysisTime(c.circuit, "op", opRuns));
      ngAc = Math.min(ngspiceAnalysisTime(c.circuit, NGSPICE_AC, acRuns), ngspiceAnalysisTime(c.circuit, NGSPICE_AC, acRuns));
    }
    console.log(
      `${c.name.padEnd(30)}${String(c.nodes).padStart(6)} |${ms(first.dcSeconds)}${ms(fresh)}${ms(dc)}${ms(ngDc)}${ratio(dc, ngDc)} |` +
        `${ms(first.acSeconds)}${ms(ac)}${ms(ngAc)}${ratio(ac, ngAc)}`,
    );
  }
  console.log("warm    = our user CPU time per call (process.cpuUsage), mean over >= 0.3 s (DC) / 0.5 s (AC) of calls on the same");
  console.log("          circuit object after warm-up, best of 3 batches: solveOperatingPoint, resp. solveOperatingPoint + acSweep");
  console.log("new obj = as warm, but every call gets a new circuit object (same elements), so nothing from an earlier solve is re-used");
  console.log(`first   = wall time of the first call in a fresh Node process (JIT compilation included; AC after one DC), best of ${FIRST_CALL_PROCESSES}`);
  console.log(`ngspice = its "Total analysis time" (user CPU, rusage) per run of \`op\` / \`${NGSPICE_AC}\`, averaged over many runs in one`);
  console.log("          process, best of 2 processes; it includes its circuit set-up (matrix, ordering) and, for ac, its operating point");
  console.log("ratio   = warm / ngspice (below 1: we are faster)");
}

// Child mode: the parent re-runs this bundle to time first calls in a fresh process.
const firstCallCase = process.env[FIRST_CALL_ENV];
if (firstCallCase !== undefined) {
  process.stdout.write(`${JSON.stringify(firstCalls(Number(firstCallCase)))}\n`);
  process.exit(0);
}
