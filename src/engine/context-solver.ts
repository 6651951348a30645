// The one place the Context meets src/solve. Rules see only the Context; this file adapts the
// solver's functions to what the Context offers, so a change in the solver's signatures is absorbed
// here. Types are re-exported so rule files import them from the engine, not from the solver.
//
// INTERIM: the solver (src/solve/index.ts, from-circuit.ts) is being written in parallel. Until it
// lands, the functions below report "solver not available" and the types mirror its agreed shape.
import type { Circuit, Part } from "../circuit/types.js";
import type { SolverCircuit } from "../solve/netlist.js";
import type { ComplexPoint } from "./context-types.js";
import type { OperatingPoint } from "../solve/types.js";

export type { BjtOperatingPoint, DeviceOperatingPoint, DiodeOperatingPoint, JfetOperatingPoint, MosfetOperatingPoint, OperatingPoint } from "../solve/types.js";

/** Absolute maximum ratings of a part, SI units; any may be absent. */
export interface PartRatings {
  vceo?: number;
  vcbo?: number;
  vebo?: number;
  icMax?: number;
  vdsMax?: number;
  vgsMax?: number;
  idMax?: number;
  powerMax?: number;
  voltageMax?: number;
  source?: string;
}

export interface Unmodelled {
  ref: string;
  reason: string;
}

export interface SolverBuild {
  solver: SolverCircuit;
  /** Observations made while building (assumed ESR, default model used, …). */
  notes: string[];
  unmodelled: Unmodelled[];
  /** Circuit net name -> solver node name. */
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

const NOT_YET = "the circuit solver is not available in this build";

export function buildSolver(_circuit: Circuit, _railVolts: Record<string, number>, _modelsText?: string): Built {
  return { ok: false, problem: NOT_YET };
}

export function solveDc(_solver: SolverCircuit): OperatingPoint {
  return { converged: false, method: "newton", iterations: 0, nodeVoltages: {}, branchCurrents: {}, deliveredCurrents: {}, devices: {}, problem: NOT_YET };
}

export function impedanceAt(_solver: SolverCircuit, _op: OperatingPoint | null, _node: string, _freqs: number[], _passiveOnly: boolean): ComplexPoint[] | undefined {
  return undefined;
}

export function impedanceBetweenAt(_solver: SolverCircuit, _op: OperatingPoint | null, _a: string, _b: string, _freqs: number[], _passiveOnly: boolean): ComplexPoint[] | undefined {
  return undefined;
}

// INTERIM until src/solve/eseries.ts lands: one decade of each series, IEC 60063 Table 1
// (reference-data §1.1). E48 and finer fall back to E24 for now.
const DECADES: Record<string, number[]> = {
  E3: [1.0, 2.2, 4.7],
  E6: [1.0, 1.5, 2.2, 3.3, 4.7, 6.8],
  E12: [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2],
  E24: [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1],
};

/** The mantissas of one decade of a series, ascending (1.0 … 9.1 for E24). */
export function seriesDecade(series: string): number[] {
  return DECADES[series] ?? DECADES.E24 ?? [];
}

export function transferAt(_solver: SolverCircuit, _op: OperatingPoint | null, _input: string, _output: string, _freqs: number[]): ComplexPoint[] | undefined {
  return undefined;
}

export function capacitorModel(_part: Part): CapacitorModel | undefined {
  return undefined;
}

export function thermalVoltage(): number {
  // kT/q at 27 °C, the temperature SPICE (and ngspice's default TNOM) uses.
  return (1.380649e-23 * 300.15) / 1.602176634e-19;
}
