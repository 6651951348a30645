// Small-signal AC analysis: every device is linearised at the DC operating point (its
// conductances plus jω times its junction, diffusion and overlap capacitances), one source or a
// 1 A test current is driven, and the complex MNA system is solved at each frequency.

import { solveOperatingPoint, solvedStateOf } from "./dc.js";
import type { AcLoadContext } from "./device.js";
import { elaborate, type ElaboratedCircuit } from "./elaborate.js";
import { preparedCircuit } from "./prepared.js";
import { ComplexSystem, GROUND, type Unknown } from "./mna.js";
import type { SolverCircuit } from "./netlist.js";
import { ComplexStamper } from "./stamp.js";
import type { AcExcitation, AcResult, ComplexSeries, ImpedancePoint, OperatingPoint, TransferPoint } from "./types.js";

export interface AcOptions {
  /**
   * Leave out every semiconductor, short voltage sources (keeping their series resistance) and
   * open current sources: the passive network alone, as a supply-bypass check wants it. No
   * operating point is needed.
   */
  passiveOnly?: boolean;
}

/** Tiny shunt on every node in the passive-only view, so nodes left by removed devices stay defined (1 TΩ). */
const PASSIVE_SHUNT = 1e-12;

function series(length: number): ComplexSeries {
  return { re: new Float64Array(length).fill(NaN), im: new Float64Array(length).fill(NaN) };
}

function failedResult(frequencies: number[], problem: string): AcResult {
  return { frequencies: [...frequencies], nodeVoltages: {}, branchCurrents: {}, problem };
}

/** The devices to linearise: the operating point's own when it belongs to this circuit. */
function linearisationFor(circuit: SolverCircuit, op: OperatingPoint | null, passiveOnly: boolean): ElaboratedCircuit | string {
  // The passive view needs no operating point; the node numbering is the circuit's own (shared).
  if (passiveOnly) return elaborate(circuit, preparedCircuit(circuit).numbering);
  if (!op) return "an AC analysis with active devices needs a DC operating point";
  if (!op.converged) return `no small-signal analysis without a DC operating point: ${op.problem ?? "it did not converge"}`;
  const state = solvedStateOf(op);
  if (state && state.elaborated.circuit === circuit) return state.elaborated;
  // An operating point from elsewhere (another circuit object, or deserialised): solve again.
  const again = solveOperatingPoint(circuit);
  const fresh = solvedStateOf(again);
  if (!again.converged || !fresh) return `no small-signal analysis without a DC operating point: ${again.problem ?? "it did not converge"}`;
  return fresh.elaborated;
}

export function acSweep(
  circuit: SolverCircuit,
  op: OperatingPoint | null,
  frequencies: number[],
  excitation: AcExcitation,
  opts: AcOptions = {},
): AcResult {
  const passiveOnly = opts.passiveOnly ?? false;
  const bad = frequencies.find((f) => !(Number.isFinite(f) && f > 0));
  if (bad !== undefined) return failedResult(frequencies, `AC frequencies must be positive finite numbers (got ${bad})`);
  const lin = linearisationFor(circuit, op, passiveOnly);
  if (typeof lin === "string") return failedResult(frequencies, lin);
  const { unknowns, devices } = lin;

  let injectAt: Unknown = GROUND;
  let returnAt: Unknown = GROUND;
  let excitedSource: string | null = null;
  if (excitation.kind === "source") {
    const source = circuit.elements.find((el) => el.name === excitation.name);
    if (!source || (source.kind !== "V" && source.kind !== "I")) {
      return failedResult(frequencies, `there is no independent source named ${excitation.name} to drive`);
    }
    if (passiveOnly) return failedResult(frequencies, "the passive-only view has its sources removed; drive it with a test current instead");
    excitedSource = excitation.name;
  } else {
    const node = unknowns.lookup(excitation.node);
    if (node === undefined) return failedResult(frequencies, `there is no node named ${excitation.node}`);
    const back = excitation.returnNode === undefined ? GROUND : unknowns.lookup(excitation.returnNode);
    if (back === undefined) return failedResult(frequencies, `there is no node named ${excitation.returnNode ?? ""}`);
    if (node === back) return failedResult(frequencies, "a test current into and out of the same node measures nothing; choose two different nodes");
    injectAt = node;
    returnAt = back;
  }

  const n = unknowns.size;
  const system = new ComplexSystem(n);
  const stamp = new ComplexStamper(system);
  const xr = new Float64Array(n), xi = new Float64Array(n);
  const ctx: AcLoadContext = { omega: 0, excitedSource };
  // Output series resolved once, in unknown order, all in one buffer: series o keeps its real
  // parts at [2oL, 2oL + L) and its imaginary parts right after, so the per-frequency copy is a
  // flat loop.
  const L = frequencies.length;
  const nodeVoltages: Record<string, ComplexSeries> = {};
  const branchCurrents: Record<string, ComplexSeries> = {};
  const outIndex: number[] = [];
  for (let i = 0; i < unknowns.nodeCount; i++) outIndex.push(i);
  for (const d of devices) if (d.branch !== undefined) outIndex.push(d.branch);
  const outputs = new Float64Array(2 * L * outIndex.length).fill(NaN);
  const outOf = (o: number): ComplexSeries => ({ re: outputs.subarray(2 * o * L, (2 * o + 1) * L), im: outputs.subarray((2 * o + 1) * L, (2 * o + 2) * L) });
  for (let i = 0; i < unknowns.nodeCount; i++) nodeVoltages[unknowns.nodeName(i)] = outOf(i);
  let o = unknowns.nodeCount;
  for (const d of devices) if (d.branch !== undefined) branchCurrents[d.name] = outOf(o++);
  const outUnknown = Int32Array.from(outIndex);
  const shunted: number[] = [];
  if (passiveOnly) for (let i = 0; i < n; i++) if (!unknowns.isBranch(i)) shunted.push(i);
  let problem: string | undefined;

  // Everything affine in ω is assembled twice (ω = 0 and ω = 1) and then interpolated per point;
  // only the rest (capacitors with ESR/ESL) is stamped at every frequency.
  const included = devices.filter((d) => !(passiveOnly && d.active));
  const affine = included.filter((d) => d.acAffine === true);
  const perPoint = included.filter((d) => d.acAffine !== true);
  for (const which of [0, 1] as const) {
    ctx.omega = which;
    system.begin();
    for (const device of affine) device.loadAc(stamp, ctx);
    for (const i of shunted) system.add(i, i, PASSIVE_SHUNT, 0);
    if (excitation.kind === "current") {
      system.addRhs(injectAt, 1, 0);
      system.addRhs(returnAt, -1, 0);
    }
    system.saveAffinePart(which);
  }

  const store = (k: number, re: Float64Array, im: Float64Array): void => {
    for (let o = 0, at = k; o < outUnknown.length; o++, at += 2 * L) {
      const index = outUnknown[o] as number;
      outputs[at] = re[index] as number;
      outputs[at + L] = im[index] as number;
    }
  };
  const single = (k: number): void => {
    const f = frequencies[k] as number;
    ctx.omega = 2 * Math.PI * f;
    system.beginAt(ctx.omega);
    for (const device of perPoint) device.loadAc(stamp, ctx);
    const solved = system.solve(xr, xi);
    if (!solved.ok) {
      problem ??= `the small-signal matrix is singular at ${unknowns.describe(solved.singularUnknown)} (${f} Hz)`;
      return;
    }
    store(k, xr, xi);
  };
  // With nothing stamped per point, two frequencies share one pass over the factorisation plan.
  const yr = perPoint.length === 0 ? new Float64Array(n) : xr, yi = perPoint.length === 0 ? new Float64Array(n) : xi;
  for (let k = 0; k < L; k++) {
    if (perPoint.length === 0 && k > 0 && k + 1 < L &&
        system.solveAffinePair(2 * Math.PI * (frequencies[k] as number), 2 * Math.PI * (frequencies[k + 1] as number), xr, xi, yr, yi)) {
      store(k, xr, xi);
      store(k + 1, yr, yi);
      k++;
      continue;
    }
    single(k);
  }

  const result: AcResult = { frequencies: [...frequencies], nodeVoltages, branchCurrents };
  if (problem !== undefined) result.problem = problem;
  return result;
}

function phaseDeg(re: number, im: number): number {
  return (Math.atan2(im, re) * 180) / Math.PI;
}

function nanSeries(length: number): ComplexSeries {
  return series(length);
}

/**
 * Impedance from `node` to ground: 1 A is injected and the node voltage read. With
 * `passiveOnly` the active devices and sources are taken out (see AcOptions) and `op` may be null.
 * Points are NaN where the network could not be solved.
 */
export function impedanceToGround(
  circuit: SolverCircuit,
  op: OperatingPoint | null,
  node: string,
  frequencies: number[],
  opts: AcOptions = {},
): ImpedancePoint[] {
  const ac = acSweep(circuit, op, frequencies, { kind: "current", node }, opts);
  const v = ac.nodeVoltages[node] ?? nanSeries(frequencies.length);
  return frequencies.map((f, k) => {
    const re = v.re[k] as number, im = v.im[k] as number;
    return { f, mag: Math.hypot(re, im), phaseDeg: phaseDeg(re, im), re, im };
  });
}

/**
 * Impedance between nodes `a` and `b`: 1 A is driven into `a` and out of `b`, and V(a) − V(b)
 * read. Same options and NaN convention as impedanceToGround.
 */
export function impedanceBetween(
  circuit: SolverCircuit,
  op: OperatingPoint | null,
  a: string,
  b: string,
  frequencies: number[],
  opts: AcOptions = {},
): ImpedancePoint[] {
  if (b === "0") return impedanceToGround(circuit, op, a, frequencies, opts);
  const ac = acSweep(circuit, op, frequencies, { kind: "current", node: a, returnNode: b }, opts);
  const zero = { re: new Float64Array(frequencies.length), im: new Float64Array(frequencies.length) };
  const va = a === "0" ? zero : (ac.nodeVoltages[a] ?? nanSeries(frequencies.length));
  const vb = ac.nodeVoltages[b] ?? nanSeries(frequencies.length);
  return frequencies.map((f, k) => {
    const re = (va.re[k] as number) - (vb.re[k] as number), im = (va.im[k] as number) - (vb.im[k] as number);
    return { f, mag: Math.hypot(re, im), phaseDeg: phaseDeg(re, im), re, im };
  });
}

/** Voltage at `outNode` per unit drive of source `sourceName` (V/V for a voltage source, Ω for a current source). */
export function transfer(
  circuit: SolverCircuit,
  op: OperatingPoint | null,
  sourceName: string,
  outNode: string,
  frequencies: number[],
): TransferPoint[] {
  const ac = acSweep(circuit, op, frequencies, { kind: "source", name: sourceName });
  const v = outNode === "0" ? { re: new Float64Array(frequencies.length), im: new Float64Array(frequencies.length) } : (ac.nodeVoltages[outNode] ?? nanSeries(frequencies.length));
  return frequencies.map((f, k) => {
    const re = v.re[k] as number, im = v.im[k] as number;
    return { f, gainDb: 20 * Math.log10(Math.hypot(re, im)), phaseDeg: phaseDeg(re, im), re, im };
  });
}

/**
 * Logarithmically spaced frequencies from f1 to f2, `pointsPerDecade` per decade, starting at f1;
 * f2 is appended when the grid does not land on it.
 */
export function logSpace(f1: number, f2: number, pointsPerDecade: number): number[] {
  if (!(f1 > 0 && f2 >= f1 && pointsPerDecade > 0)) return [];
  const steps = Math.floor(Math.log10(f2 / f1) * pointsPerDecade + 1e-9);
  const out: number[] = [];
  for (let k = 0; k <= steps; k++) out.push(f1 * Math.pow(10, k / pointsPerDecade));
  const last = out[out.length - 1] ?? f1;
  if (last < f2 * (1 - 1e-9)) out.push(f2);
  return out;
}

/**
 * Frequency where the gain has fallen `dropDb` below its maximum: "upper" searches above the
 * peak, "lower" below it. Interpolates linearly in dB against log-frequency between the two
 * grid points that straddle the level; null when the curve never falls that far.
 */
export function findCorner(
  curve: ReadonlyArray<{ f: number; gainDb: number }>,
  dropDb = 3,
  direction: "upper" | "lower" = "upper",
): number | null {
  let peak = -1;
  let peakDb = -Infinity;
  curve.forEach((p, i) => {
    if (p.gainDb > peakDb) { peakDb = p.gainDb; peak = i; }
  });
  if (peak < 0) return null;
  const level = peakDb - dropDb;
  const step = direction === "upper" ? 1 : -1;
  for (let i = peak + step; i >= 0 && i < curve.length; i += step) {
    const here = curve[i], prev = curve[i - step];
    if (!here || !prev) break;
    if (here.gainDb <= level) {
      const t = (prev.gainDb - level) / (prev.gainDb - here.gainDb);
      const lf = Math.log10(prev.f) + t * (Math.log10(here.f) - Math.log10(prev.f));
      return Math.pow(10, lf);
    }
  }
  return null;
}
