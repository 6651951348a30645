// The one place the Context meets src/solve. Rules see only the Context; this file adapts the
// solver's functions to what the Context offers, so a change in the solver's signatures is absorbed
// here. Types are re-exported so rule files import them from the engine, not from the solver.
//
// INTERIM: the solver (src/solve/index.ts, from-circuit.ts) is being written in parallel. Until it
// lands, the functions below report "solver not available" and the types mirror its agreed shape.
import type { Circuit, Part } from "../circuit/types.js";
import type { SolverCircuit } from "../solve/netlist.js";
import type { ComplexPoint } from "./context-types.js";

/** One device's DC operating point in practitioner signs (positive VCE/IC for a working npn and pnp). */
export interface DeviceOperatingPoint {
  type: string;
  /** "active", "saturation", "cut-off", "reverse", "linear", … */
  region: string;
  vbe?: number;
  vce?: number;
  ic?: number;
  ib?: number;
  vgs?: number;
  vds?: number;
  id?: number;
  power?: number;
  gm?: number;
  gpi?: number;
  go?: number;
  gds?: number;
  cpi?: number;
  cmu?: number;
  cgs?: number;
  cgd?: number;
}

export interface OperatingPoint {
  converged: boolean;
  /** Solver node name -> volts. */
  nodeVoltages: Record<string, number>;
  branchCurrents: Record<string, number>;
  devices: Record<string, DeviceOperatingPoint>;
  /** Why it failed, when it did. */
  problem?: string;
}

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
  return { converged: false, nodeVoltages: {}, branchCurrents: {}, devices: {}, problem: NOT_YET };
}

export function impedanceAt(_solver: SolverCircuit, _op: OperatingPoint | null, _node: string, _freqs: number[], _passiveOnly: boolean): ComplexPoint[] | undefined {
  return undefined;
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
