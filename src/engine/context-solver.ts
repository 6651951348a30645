// The one place the Context meets src/solve. Rules see only the Context; this file adapts the
// solver's functions to what the Context offers, so a change in the solver's signatures is absorbed
// here. Types are re-exported so rule files import them from the engine, not from the solver.
import type { Circuit, Part } from "../circuit/types.js";
import type { SolverCircuit } from "../solve/netlist.js";
import type { ComplexPoint } from "./context-types.js";
import { buildSolverCircuit } from "../solve/from-circuit.js";
import type { BuildNote, PartRatings } from "../solve/from-circuit.js";
import type { ImpedancePoint, OperatingPoint } from "../solve/types.js";
import { acSweep, impedanceBetween, impedanceToGround, solveOperatingPoint, THERMAL_VOLTAGE } from "../solve/index.js";
import { E_SERIES } from "../solve/eseries.js";
import type { ESeriesName } from "../solve/eseries.js";
import { estimateCapacitorParasitics, selfResonantFrequency } from "../solve/parasitics.js";

export type { BjtOperatingPoint, DeviceOperatingPoint, DiodeOperatingPoint, JfetOperatingPoint, MosfetOperatingPoint, OperatingPoint } from "../solve/types.js";

export type { PartRatings } from "../solve/from-circuit.js";

export interface Unmodelled {
  ref: string;
  reason: string;
}

export interface SolverBuild {
  solver: SolverCircuit;
  /** Observations made while building (assumed ESR, default model used, …). */
  notes: BuildNote[];
  unmodelled: Unmodelled[];
  /** Circuit net name -> solver node name ("0" for ground). */
  nodeOfNet: Record<string, string>;
  ratings: Record<string, PartRatings>;
}

export type Built = { ok: true; build: SolverBuild } | { ok: false; problem: string };

export interface CapacitorModel {
  farads: number;
  esr: number;
  esl: number;
  /** 1/(2π√(L·C)) */
  srfHertz: number;
  /** Where ESR/ESL came from ("0603 MLCC default", "ESL field"). */
  source: string;
}

/** The solver netlist of a circuit, with the reason each unmodelled part was left out. */
export function buildSolver(circuit: Circuit, railVolts: Record<string, number>, modelsText?: string): Built {
  const result = buildSolverCircuit(circuit, modelsText === undefined ? { railVolts } : { railVolts, modelsText });
  const reasonOf = (ref: string): string => {
    const note = result.notes.find((n) => n.ref === ref && /is not simulated/.test(n.message));
    return note ? note.message.replace(/^.*? is not simulated: /, "") : "not simulated";
  };
  return {
    ok: true,
    build: {
      solver: result.solver,
      notes: result.notes,
      unmodelled: result.unmodelled.map((ref) => ({ ref, reason: reasonOf(ref) })),
      nodeOfNet: result.nodeOfNet,
      ratings: result.ratings,
    },
  };
}

export function solveDc(solver: SolverCircuit): OperatingPoint {
  return solveOperatingPoint(solver);
}

function toPoints(frequencies: number[], re: ArrayLike<number>, im: ArrayLike<number>): ComplexPoint[] {
  return frequencies.map((hertz, k) => {
    const r = re[k] ?? Number.NaN;
    const i = im[k] ?? Number.NaN;
    return { hertz, re: r, im: i, magnitude: Math.hypot(r, i) };
  });
}

/** The solver's impedance points as the Context's, or undefined when any point is unsolved (NaN). */
function solvedPoints(points: ImpedancePoint[]): ComplexPoint[] | undefined {
  if (points.some((p) => !Number.isFinite(p.mag))) return undefined;
  return points.map((p) => ({ hertz: p.f, re: p.re, im: p.im, magnitude: p.mag }));
}

/** Z from a node to ground (1 A injected). Undefined when the network could not be solved. */
export function impedanceAt(solver: SolverCircuit, op: OperatingPoint | null, node: string, freqs: number[], passiveOnly: boolean): ComplexPoint[] | undefined {
  return solvedPoints(impedanceToGround(solver, op, node, freqs, { passiveOnly }));
}

/** Z between two nodes: 1 A driven into `a` and drawn from `b`, Z = V(a) − V(b). Undefined when
 * the network could not be solved. */
export function impedanceBetweenAt(solver: SolverCircuit, op: OperatingPoint | null, a: string, b: string, freqs: number[], passiveOnly: boolean): ComplexPoint[] | undefined {
  return solvedPoints(impedanceBetween(solver, op, a, b, freqs, { passiveOnly }));
}

/** V(output)/V(input) with a test current driven into the input node (independent of what drives it). */
export function transferAt(solver: SolverCircuit, op: OperatingPoint | null, input: string, output: string, freqs: number[]): ComplexPoint[] | undefined {
  const ac = acSweep(solver, op, freqs, { kind: "current", node: input });
  const vin = ac.nodeVoltages[input];
  const vout = output === "0" ? undefined : ac.nodeVoltages[output];
  if (ac.problem !== undefined || !vin || !vout) return undefined;
  const re: number[] = [];
  const im: number[] = [];
  freqs.forEach((_, k) => {
    const ar = vout.re[k] ?? Number.NaN, ai = vout.im[k] ?? Number.NaN;
    const br = vin.re[k] ?? Number.NaN, bi = vin.im[k] ?? Number.NaN;
    const d = br * br + bi * bi;
    re.push((ar * br + ai * bi) / d);
    im.push((ai * br - ar * bi) / d);
  });
  return toPoints(freqs, re, im);
}

/** The mantissas of one decade of a series, ascending (1.0 … 9.1 for E24), IEC 60063. */
export function seriesDecade(series: ESeriesName): readonly number[] {
  return E_SERIES[series];
}


export function capacitorModel(part: Part): CapacitorModel | undefined {
  const farads = part.parsed.number;
  if (farads === undefined || !(farads > 0)) return undefined;
  const { esr, esl, basis } = estimateCapacitorParasitics(part);
  return { farads, esr, esl, srfHertz: selfResonantFrequency(farads, esl), source: basis };
}

/** kT/q at the solver's analysis temperature (27 °C, as SPICE and ngspice default). */
export function thermalVoltage(): number {
  return THERMAL_VOLTAGE;
}
