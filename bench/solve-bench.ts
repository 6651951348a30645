// Solver speed: DC operating point and a 1001-point AC sweep on generated circuits of about 10,
// 100 and 1000 nodes (ladders of capacitor-coupled CE stages, RC ladders), against ngspice's own
// reported analysis time on the same netlists in the same run (`rusage` in a .control loop —
// cumulative "Total analysis time", which excludes process start and netlist parsing).
// Measured, never asserted: `npm run bench` (or `npm run bench -- solve`).

import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { diagnoseTopology, logSpace, solveOperatingPoint, transfer } from "../src/solve/index.js";
import { elaborate } from "../src/solve/elaborate.js";
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

interface BenchCase {
  name: string;
  circuit: SolverCircuit;
  source: string;
  out: string;
  nodes: number;
}

/** Capacitor-coupled common-emitter stages in cascade, 3 nodes each plus the rail and the input. */
function ceLadder(stages: number): BenchCase {
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

function rcLadder(sections: number): BenchCase {
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

interface NgspiceTiming { opSeconds: number; acSeconds: number; version: string }

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

/** Median seconds per call of `fn`, after warm-up, repeating until ~0.3 s or `maxReps`. */
function timeIt(fn: () => void, maxReps: number): number {
  for (let i = 0; i < 3; i++) fn();
  const samples: number[] = [];
  const start = performance.now();
  while (samples.length < maxReps && (samples.length < 3 || performance.now() - start < 300)) {
    const t = performance.now();
    fn();
    samples.push((performance.now() - t) / 1000);
  }
  samples.sort((a, b) => a - b);
  return samples[Math.floor(samples.length / 2)] ?? NaN;
}

function ms(seconds: number): string {
  return (seconds * 1000).toFixed(seconds < 1e-3 ? 3 : 1).padStart(9);
}

function ratio(ours: number, theirs: number | undefined): string {
  if (theirs === undefined || !(theirs > 0)) return "      n/a";
  return `${(ours / theirs).toFixed(2)}×`.padStart(9);
}

export async function benchSolve(): Promise<void> {
  const version = ngspiceAvailable();
  const cases = [ceLadder(3), ceLadder(25), ceLadder(250), rcLadder(10), rcLadder(100), rcLadder(1000)];
  const frequencies = logSpace(1, 1e8, 125); // 1001 points, the same grid as `ac dec 125 1 100Meg`
  console.log(`\nsolver: DC operating point and ${frequencies.length}-point AC sweep`);
  console.log(version ? `reference: ${version}, analysis time from its own rusage counters` : "reference: ngspice not installed, our times only");
  console.log("case                          nodes |  DC ours ms  (setup)  ngspice   ratio |  AC ours ms  ngspice   ratio");
  for (const c of cases) {
    const dc = timeIt(() => { solveOperatingPoint(c.circuit); }, 2000);
    // Per-call set-up inside solveOperatingPoint (topology check, devices, unknowns), which
    // ngspice does once before its analysis timer starts.
    const setup = timeIt(() => { diagnoseTopology(c.circuit); elaborate(c.circuit); }, 2000);
    const op = solveOperatingPoint(c.circuit);
    if (!op.converged) throw new Error(`${c.name}: no operating point (${op.problem ?? ""})`);
    const ac = timeIt(() => { transfer(c.circuit, op, c.source, c.out, frequencies); }, 50);
    let ngDc: number | undefined, ngAc: number | undefined;
    if (version) {
      const scale = Math.max(1, Math.round(1000 / c.nodes));
      ngDc = ngspiceAnalysisTime(c.circuit, "op", Math.min(2000, 20 * scale));
      ngAc = ngspiceAnalysisTime(c.circuit, "ac dec 125 1 100Meg", Math.min(200, 2 * scale));
    }
    console.log(
      `${c.name.padEnd(30)}${String(c.nodes).padStart(5)} |${ms(dc)}${ms(setup)}${ngDc !== undefined ? ms(ngDc) : "      n/a"}${ratio(dc, ngDc)} |${ms(ac)}${ngAc !== undefined ? ms(ngAc) : "      n/a"}${ratio(ac, ngAc)}`,
    );
  }
  console.log("ratio = ours / ngspice (below 1 is faster). ngspice's counters have 1 ms resolution, summed over many repeats;");
  console.log("(setup) is the part of our DC time spent on topology checks and device set-up, excluded from ngspice's counter.");
}
