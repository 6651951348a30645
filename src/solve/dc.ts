// DC operating point: Newton–Raphson over the devices' companion stamps, with the convergence
// test of Berkeley SPICE (RELTOL 1e-3, VNTOL 1 µV, ABSTOL 1 pA) and its two continuation
// fall-backs — gmin stepping (a shunt conductance on every node, shrunk decade by decade) and
// source stepping (supplies ramped up from zero). Every loop is bounded by an iteration cap and
// a wall-clock deadline, so a hopeless circuit returns a reason instead of hanging.

import { TOLERANCES, type DcLoadContext, type DcMode, type Device } from "./device.js";
import { elaborate, type ElaboratedCircuit } from "./elaborate.js";
import { RealSystem, type FactorStructure, type PatternSnapshot, type Unknown } from "./mna.js";
import { preparedCircuit, type PreparedCircuit } from "./prepared.js";
import type { SolverCircuit } from "./netlist.js";
import { RealStamper } from "./stamp.js";
import type { DeviceOperatingPoint, OperatingPoint, SolveMethod } from "./types.js";

export interface DcOptions {
  /** Total Newton iterations allowed across all strategies (default 3000). */
  maxIterations?: number;
  /** Wall-clock budget in milliseconds (default 10 000). */
  maxMillis?: number;
  /** Junction shunt conductance, SPICE's GMIN (default 1e-12 S). */
  gmin?: number;
}

const { reltol: RELTOL, vntol: VNTOL, abstol: ABSTOL } = TOLERANCES;
/** Iterations for the first, plain attempt (SPICE's ITL1). */
const PLAIN_NEWTON_LIMIT = 100;
/** Iterations per continuation step. */
const STEP_NEWTON_LIMIT = 60;
const MAX_CONTINUATION_STEPS = 200;
const DEFAULT_MAX_ITERATIONS = 3000;
const DEFAULT_MAX_MILLIS = 10_000;
const DEFAULT_GMIN = 1e-12;

/** Why a Newton run stopped without converging. */
type NewtonFailure =
  | { reason: "iterations"; worstUnknown: Unknown; worstStep: number; stillLimiting?: string; unsettled?: string }
  | { reason: "singular"; unknown: Unknown }
  | { reason: "not-finite" }
  | { reason: "iteration-cap" }
  | { reason: "deadline" };

type NewtonOutcome = { ok: true; iterations: number } | ({ ok: false; iterations: number } & NewtonFailure);

interface NewtonRun {
  diagGmin: number;
  srcFactor: number;
  limit: number;
  /** How the first iteration evaluates devices. */
  firstMode: DcMode;
}

/** Solver state for one circuit: the devices, the matrix and the current iterate. */
class DcSolver {
  system!: RealSystem;
  private stamp!: RealStamper;
  x!: Float64Array;
  private xNew!: Float64Array;
  totalIterations = 0;
  readonly ctx: DcLoadContext;
  private baseReady = false;
  private readonly varying: Device[];
  /** Absolute part of each unknown's convergence tolerance: ABSTOL for currents, VNTOL for voltages. */
  private absTol!: Float64Array;
  /** Unknowns that are node voltages, where gmin stepping puts its shunts. */
  private voltageUnknowns!: Int32Array;
  /** Last device whose junction step was limited in the latest load, for the explanation. */
  private lastLimiting: string | undefined;
  /** The pattern snapshot given did not fit the circuit, so the solve went on without it. */
  leftSnapshot = false;

  constructor(
    readonly elaborated: ElaboratedCircuit,
    readonly gmin: number,
    readonly maxIterations: number,
    readonly deadline: number,
    pattern: PatternSnapshot | null,
    factors: FactorStructure | null,
  ) {
    this.ctx = { mode: "normal", gmin, srcFactor: 1, limited: false };
    this.varying = elaborated.devices.filter((d) => !d.dcConstant);
    this.attach(new RealSystem(elaborated.unknowns.size, pattern ?? undefined, 3 * elaborated.unknowns.size, factors));
  }

  /** Takes `system` as the matrix, with the iterate and per-unknown vectors from its arena. */
  private attach(system: RealSystem): void {
    const { unknowns } = this.elaborated;
    const n = unknowns.size;
    const arena = system.arena;
    const x = arena.f64(n);
    if (this.x) x.set(this.x);
    this.system = system;
    this.stamp = new RealStamper(system);
    this.x = x;
    this.xNew = arena.f64(n);
    this.absTol = arena.f64(n);
    let voltages = 0;
    for (let i = 0; i < n; i++) {
      const branch = unknowns.isBranch(i);
      this.absTol[i] = branch ? ABSTOL : VNTOL;
      if (!branch) voltages++;
    }
    this.voltageUnknowns = arena.i32(voltages);
    for (let i = 0, v = 0; i < n; i++) if (!unknowns.isBranch(i)) this.voltageUnknowns[v++] = i;
  }

  private load(x: Float64Array, mode: DcMode, srcFactor: number, diagGmin: number): void {
    const ctx = this.ctx;
    ctx.mode = mode;
    ctx.srcFactor = srcFactor;
    ctx.limited = false;
    // Resistors, inductors and capacitors stamp the same entries every iteration: once is enough.
    if (!this.baseReady) {
      this.system.begin();
      for (const device of this.elaborated.devices) if (device.dcConstant) device.loadDc(x, this.stamp, ctx);
      this.system.saveBase();
      this.baseReady = true;
    }
    this.system.beginFromBase();
    this.lastLimiting = undefined;
    for (const device of this.varying) {
      const before: boolean = ctx.limited;
      ctx.limited = false;
      device.loadDc(x, this.stamp, ctx);
      if (ctx.limited) this.lastLimiting = device.name;
      ctx.limited ||= before;
    }
    if (diagGmin > 0) {
      const voltages = this.voltageUnknowns;
      for (let v = 0; v < voltages.length; v++) {
        const i = voltages[v] as number;
        this.system.add(i, i, diagGmin);
      }
    }
    if (this.system.offSnapshot) {
      // The circuit object was edited in place since the pattern was recorded: start over from
      // a fresh pattern, so the result is what solving the circuit afresh gives.
      const stale = this.system;
      this.leftSnapshot = true;
      this.attach(new RealSystem(this.elaborated.unknowns.size, undefined, 3 * this.elaborated.unknowns.size));
      stale.release();
      this.baseReady = false;
      this.load(this.x, mode, srcFactor, diagGmin);
    }
  }

  newton(run: NewtonRun): NewtonOutcome {
    const absTol = this.absTol;
    const n = absTol.length;
    for (let iter = 0; iter < run.limit; iter++) {
      if (this.totalIterations >= this.maxIterations) return { ok: false, iterations: iter, reason: "iteration-cap" };
      // The clock is read on the first iteration and every eighth after: at most seven iterations
      // past a budget of seconds, and no clock read on most iterations.
      if ((this.totalIterations & 7) === 0 && Date.now() >= this.deadline) return { ok: false, iterations: iter, reason: "deadline" };
      this.totalIterations++;
      this.load(this.x, iter === 0 ? run.firstMode : "normal", run.srcFactor, run.diagGmin);
      const limited = this.ctx.limited;
      const solved = this.system.solve(this.xNew);
      if (!solved.ok) return { ok: false, iterations: iter + 1, reason: "singular", unknown: solved.singularUnknown };
      let worstUnknown = -1, worstRatio = 0, worstStep = 0, finite = true;
      const xNew = this.xNew, x = this.x;
      for (let i = 0; i < n; i++) {
        const xn = xNew[i] as number, xo = x[i] as number;
        if (!Number.isFinite(xn)) { finite = false; break; }
        const tol = RELTOL * Math.max(Math.abs(xn), Math.abs(xo)) + (absTol[i] as number);
        const ratio = Math.abs(xn - xo) / tol;
        if (ratio > worstRatio) { worstRatio = ratio; worstUnknown = i; worstStep = xn - xo; }
      }
      if (!finite) return { ok: false, iterations: iter + 1, reason: "not-finite" };
      [this.x, this.xNew] = [this.xNew, this.x];
      const first = iter === 0 && run.firstMode === "init-junction";
      const unsettled = !first && !limited && worstRatio <= 1 ? this.unsettledDevice() : "not checked";
      if (!first && !limited && worstRatio <= 1 && unsettled === undefined) return { ok: true, iterations: iter + 1 };
      if (iter === run.limit - 1) {
        const failure: NewtonOutcome = { ok: false, iterations: iter + 1, reason: "iterations", worstUnknown, worstStep };
        if (limited && this.lastLimiting !== undefined) failure.stillLimiting = this.lastLimiting;
        if (unsettled !== undefined && unsettled !== "not checked") failure.unsettled = unsettled;
        return failure;
      }
    }
    return { ok: false, iterations: run.limit, reason: "iterations", worstUnknown: -1, worstStep: 0 };
  }

  /** Name of the first device whose currents are still moving beyond tolerance, if any. */
  private unsettledDevice(): string | undefined {
    for (const device of this.elaborated.devices) if (device.converged && !device.converged(this.x)) return device.name;
    return undefined;
  }

  /** Evaluates every device exactly at the accepted solution so reports match the node voltages. */
  finalEvaluation(srcFactor: number): void {
    this.load(this.x, "no-limit", srcFactor, 0);
  }

  get remaining(): number { return Math.max(0, this.maxIterations - this.totalIterations); }
}

interface StrategyResult {
  ok: boolean;
  /** Last failure, for the explanation. */
  failure?: NewtonFailure;
  /** How far a continuation got, for the explanation. */
  progress?: string;
}

function isHardStop(f: NewtonFailure | undefined): boolean {
  return f !== undefined && (f.reason === "iteration-cap" || f.reason === "deadline" || f.reason === "singular");
}

function plainNewton(solver: DcSolver): StrategyResult {
  solver.x.fill(0);
  const r = solver.newton({ diagGmin: 0, srcFactor: 1, limit: PLAIN_NEWTON_LIMIT, firstMode: "init-junction" });
  return r.ok ? { ok: true } : { ok: false, failure: r };
}

/** Shunts every node to ground with a conductance that starts large and is relaxed step by step. */
function gminStepping(solver: DcSolver): StrategyResult {
  solver.x.fill(0);
  let diag = 1e-2;
  let factor = 10;
  let lastGood = -1;
  let saved: Float64Array | null = null;
  let failure: NewtonFailure | undefined;
  for (let step = 0; step < MAX_CONTINUATION_STEPS; step++) {
    const r = solver.newton({
      diagGmin: diag,
      srcFactor: 1,
      limit: STEP_NEWTON_LIMIT,
      firstMode: saved ? "no-limit" : "init-junction",
    });
    if (r.ok) {
      saved = solver.x.slice();
      lastGood = diag;
      if (diag <= solver.gmin) break;
      if (r.iterations <= STEP_NEWTON_LIMIT / 4) factor = Math.min(factor * Math.sqrt(factor), 10);
      diag = Math.max(diag / factor, solver.gmin);
      continue;
    }
    failure = r;
    if (!saved || isHardStop(r)) {
      return { ok: false, failure: r, progress: saved ? `stalled at a node shunt of ${lastGood.toExponential(1)} S` : "failed even with 10 mS on every node" };
    }
    factor = Math.sqrt(Math.sqrt(factor));
    if (factor < 1.00005) return { ok: false, failure: r, progress: `stalled at a node shunt of ${lastGood.toExponential(1)} S` };
    solver.x.set(saved);
    diag = lastGood / factor;
  }
  if (!saved || lastGood > solver.gmin) return { ok: false, failure, progress: `stopped at a node shunt of ${lastGood.toExponential(1)} S` };
  const r = solver.newton({ diagGmin: 0, srcFactor: 1, limit: STEP_NEWTON_LIMIT, firstMode: "no-limit" });
  return r.ok ? { ok: true } : { ok: false, failure: r, progress: "converged with shunts but not after removing the last one" };
}

/** Ramps every independent source from zero to its full value. */
function sourceStepping(solver: DcSolver): StrategyResult {
  solver.x.fill(0);
  const start = solver.newton({ diagGmin: 0, srcFactor: 0, limit: STEP_NEWTON_LIMIT, firstMode: "init-junction" });
  if (!start.ok) return { ok: false, failure: start, progress: "failed with every source at zero" };
  let reached = 0;
  let raise = 1e-3;
  let saved = solver.x.slice();
  for (let step = 0; step < MAX_CONTINUATION_STEPS * 5; step++) {
    const target = Math.min(1, reached + raise);
    const r = solver.newton({ diagGmin: 0, srcFactor: target, limit: STEP_NEWTON_LIMIT, firstMode: "no-limit" });
    if (r.ok) {
      reached = target;
      saved = solver.x.slice();
      if (reached >= 1) return { ok: true };
      if (r.iterations <= STEP_NEWTON_LIMIT / 4) raise *= 1.5;
      continue;
    }
    if (isHardStop(r)) return { ok: false, failure: r, progress: `reached ${(reached * 100).toFixed(1)} % of the supplies` };
    raise /= 10;
    solver.x.set(saved);
    if (raise < 1e-7) return { ok: false, failure: r, progress: `reached ${(reached * 100).toFixed(1)} % of the supplies` };
  }
  return { ok: false, progress: `reached ${(reached * 100).toFixed(1)} % of the supplies` };
}

function describeFailure(solver: DcSolver, failure: NewtonFailure | undefined): string {
  const unknowns = solver.elaborated.unknowns;
  if (!failure) return "";
  switch (failure.reason) {
    case "iteration-cap": return `stopped at the cap of ${solver.maxIterations} Newton iterations`;
    case "deadline": return "stopped at the time limit";
    case "not-finite": return "the iterate overflowed (a device was driven to an absurd voltage)";
    case "singular": return `the matrix became singular at ${unknowns.describe(failure.unknown)}`;
    case "iterations": {
      const where: string[] = [];
      if (failure.stillLimiting) where.push(`${failure.stillLimiting}'s junction steps were still being limited`);
      if (failure.unsettled) where.push(`${failure.unsettled}'s currents were still changing`);
      if (failure.worstUnknown >= 0) {
        where.push(`the largest change was ${formatStep(failure.worstStep, unknowns.info[failure.worstUnknown]?.kind === "branch")} at ${unknowns.describe(failure.worstUnknown)}`);
      }
      return where.length ? `Newton's method did not settle (${where.join("; ")})` : "Newton's method did not settle";
    }
  }
}

function formatStep(value: number, isCurrent: boolean): string {
  const unit = isCurrent ? "A" : "V";
  return `${value.toPrecision(3)} ${unit}`;
}

function singularMessage(solver: DcSolver, unknown: Unknown): string {
  const info = solver.elaborated.unknowns.info[unknown];
  if (info?.kind === "branch") {
    return `the current through ${info.name} is not fixed by the circuit (the matrix is singular there); check for a loop of voltage sources or inductors, or a source with nothing across it`;
  }
  const where = info?.kind === "internal-node" ? `internal node ${info.name}` : `node ${info?.name ?? unknown}`;
  return `the DC voltage of ${where} is not fixed by the circuit (the matrix is singular there); give it a DC path to ground`;
}

/** Solved state kept for the AC analysis, keyed by the result object handed to callers. */
export interface SolvedState {
  elaborated: ElaboratedCircuit;
  x: Float64Array;
}

/**
 * The solved state rides on the result object under a non-enumerable symbol, so it lives exactly
 * as long as the result and stays out of equality checks, spreads and JSON. (A WeakMap keyed by
 * the result did the same, but its entries outlive young-generation collections and every solve
 * then paid for a full one.)
 */
const SOLVED_STATE = Symbol("loadline solved state");

interface CarriesSolvedState {
  [SOLVED_STATE]?: SolvedState;
}

export function solvedStateOf(op: OperatingPoint): SolvedState | undefined {
  return (op as OperatingPoint & CarriesSolvedState)[SOLVED_STATE];
}

function emptyResult(problem: string): OperatingPoint {
  return {
    converged: false,
    method: "newton",
    iterations: 0,
    nodeVoltages: {},
    branchCurrents: {},
    deliveredCurrents: {},
    devices: {},
    problem,
  };
}

function collectResult(solver: DcSolver, converged: boolean, method: SolveMethod, problem?: string): OperatingPoint {
  const { unknowns, devices } = solver.elaborated;
  const x = solver.x;
  for (let i = 0; i < x.length; i++) {
    if (!Number.isFinite(x[i] as number)) { x.fill(0); break; }
  }
  solver.finalEvaluation(1);
  const nodeVoltages: Record<string, number> = {};
  for (let i = 0; i < unknowns.nodeCount; i++) nodeVoltages[unknowns.nodeName(i)] = x[i] as number;
  const branchCurrents: Record<string, number> = {};
  const deliveredCurrents: Record<string, number> = {};
  const deviceReports: Record<string, DeviceOperatingPoint> = {};
  for (const device of devices) {
    if (device.branch !== undefined) branchCurrents[device.name] = x[device.branch] as number;
    if (device.delivered) deliveredCurrents[device.name] = device.delivered(x, 1);
    if (device.report) deviceReports[device.name] = device.report(x);
  }
  const result: OperatingPoint = {
    converged,
    method,
    iterations: solver.totalIterations,
    nodeVoltages,
    branchCurrents,
    deliveredCurrents,
    devices: deviceReports,
  };
  if (problem !== undefined) result.problem = problem;
  Object.defineProperty(result, SOLVED_STATE, { value: { elaborated: solver.elaborated, x: x.slice() } satisfies SolvedState });
  return result;
}

/**
 * Finds the DC operating point. Never throws for a bad circuit and never runs past its caps:
 * `converged: false` comes with a `problem` saying why, in the trade's words.
 */
export function solveOperatingPoint(circuit: SolverCircuit, opts: DcOptions = {}): OperatingPoint {
  const prepared = preparedCircuit(circuit);
  if (prepared.problems.length > 0) return emptyResult(prepared.problems.map((p) => p.message).join("; "));

  const maxIterations = Math.max(1, Math.floor(opts.maxIterations ?? DEFAULT_MAX_ITERATIONS));
  const maxMillis = Math.max(0, opts.maxMillis ?? DEFAULT_MAX_MILLIS);
  const gmin = opts.gmin ?? DEFAULT_GMIN;
  const solver = new DcSolver(elaborate(circuit, prepared.numbering), gmin, maxIterations, Date.now() + maxMillis, prepared.dcPattern, prepared.dcFactors);
  try {
    return solveWith(solver, prepared);
  } finally {
    // The result holds copies only (collectResult), so the solver's arrays can serve the next solve.
    solver.system.release();
  }
}

function solveWith(solver: DcSolver, prepared: PreparedCircuit): OperatingPoint {
  const plain = plainNewton(solver);
  if (!prepared.dcPattern || solver.leftSnapshot) {
    prepared.dcPattern = solver.system.firstPattern;
    prepared.dcFactors = solver.system.firstFactors;
  }
  if (plain.ok) return collectResult(solver, true, "newton");
  if (plain.failure?.reason === "singular") {
    return collectResult(solver, false, "newton", singularMessage(solver, plain.failure.unknown));
  }
  const attempts: string[] = [`plain Newton: ${describeFailure(solver, plain.failure)}`];
  if (!isHardStop(plain.failure)) {
    const gminRun = gminStepping(solver);
    if (gminRun.ok) return collectResult(solver, true, "gmin-stepping");
    attempts.push(`gmin stepping: ${gminRun.progress ?? ""}${gminRun.failure ? ` (${describeFailure(solver, gminRun.failure)})` : ""}`);
    if (!isHardStop(gminRun.failure)) {
      const sourceRun = sourceStepping(solver);
      if (sourceRun.ok) return collectResult(solver, true, "source-stepping");
      attempts.push(`source stepping: ${sourceRun.progress ?? ""}${sourceRun.failure ? ` (${describeFailure(solver, sourceRun.failure)})` : ""}`);
    }
  }
  const problem =
    `no DC operating point found after ${solver.totalIterations} iterations — ${attempts.join("; ")}. ` +
    "Look for a stage without a bias path, positive feedback around a DC loop, or model parameters far outside their usual range.";
  return collectResult(solver, false, "newton", problem);
}
