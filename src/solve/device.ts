// What the Newton engine and the AC sweep know about an element: it can load its DC companion
// stamps at a trial solution, load its small-signal admittances at the operating point, and
// describe its operating point. Nothing here knows what a transistor is.

import type { UnknownMap } from "./mna.js";
import type { ModelCard } from "./netlist.js";
import type { ComplexStamp, RealStamp, Unknown } from "./stamp.js";
import type { DeviceOperatingPoint } from "./types.js";

/**
 * init-junction: first iteration from scratch; semiconductors use SPICE's initial junction
 *   voltages instead of the (all-zero) trial solution.
 * normal: evaluate at the trial solution with junction limiting.
 * no-limit: evaluate exactly at the trial solution (final evaluation, restarts from a saved point).
 */
export type DcMode = "init-junction" | "normal" | "no-limit";

export interface DcLoadContext {
  mode: DcMode;
  /** Conductance SPICE places across every pn junction (siemens). */
  gmin: number;
  /** Scale of every independent source (source stepping), 1 normally. */
  srcFactor: number;
  /** Set by a model when it limited a step in this load: the iterate cannot be final. */
  limited: boolean;
}

/** SPICE's convergence tolerances (RELTOL, VNTOL, ABSTOL). */
export const TOLERANCES = { reltol: 1e-3, vntol: 1e-6, abstol: 1e-12 } as const;

/** True when the change from `previous` to `next` is within SPICE's current tolerance. */
export function currentSettled(predicted: number, previous: number): boolean {
  const tol = TOLERANCES.reltol * Math.max(Math.abs(predicted), Math.abs(previous)) + TOLERANCES.abstol;
  return Math.abs(predicted - previous) <= tol;
}

export interface AcLoadContext {
  omega: number;
  /** Name of the one independent source driven with unit amplitude, or null. */
  excitedSource: string | null;
}

export interface Device {
  readonly name: string;
  /** Semiconductors are active; the passive-only impedance view leaves them out. */
  readonly active: boolean;
  /** External nodes this element touches, for diagnostics. */
  readonly nodes: readonly Unknown[];
  /** Branch unknown of a V source or inductor. */
  readonly branch?: Unknown;
  /**
   * loadDc stamps the same matrix entries whatever the trial solution and stamps no right-hand
   * side (resistors, inductors, capacitors): the engine assembles these once per solve.
   */
  readonly dcConstant?: boolean;
  /**
   * loadAc's stamps are affine in ω (G + jωC), so the sweep can assemble them once; false for
   * elements such as a capacitor with ESR/ESL whose admittance is not.
   */
  readonly acAffine?: boolean;
  loadDc(x: Float64Array, stamp: RealStamp, ctx: DcLoadContext): void;
  loadAc(stamp: ComplexStamp, ctx: AcLoadContext): void;
  /**
   * Device-level convergence test of a new iterate: the currents its linearisation predicts at
   * `x` must be within tolerance of those at the last load. Node voltages alone are not enough:
   * a millivolt on a junction is several per cent of its current.
   */
  converged?(x: Float64Array): boolean;
  /** Operating-point report; semiconductors only. Valid after a load at the final solution. */
  report?(x: Float64Array): DeviceOperatingPoint;
  /** Current delivered into the circuit by an independent source at the solution. */
  delivered?(x: Float64Array, srcFactor: number): number;
}

/**
 * Constants a model derives from a card and an element size, shared by the elements of one
 * elaboration (a board's transistors mostly share a card). Lives for one elaboration only: a
 * card edited in place between solves is read afresh by the next.
 */
export class ElaborationMemo {
  private readonly byKind = new Map<object, Map<ModelCard, Map<string | number, unknown>>>();

  /**
   * `make()`, or what it returned for the same kind, card and size earlier in this elaboration.
   * `kind` must be the model's own (its parameter table), so one kind always stores one type.
   */
  derived<T>(kind: object, card: ModelCard, size: string | number, make: () => T): T {
    let cards = this.byKind.get(kind);
    if (!cards) this.byKind.set(kind, (cards = new Map()));
    let sizes = cards.get(card);
    if (!sizes) cards.set(card, (sizes = new Map()));
    if (sizes.has(size)) return sizes.get(size) as T;
    const made = make();
    sizes.set(size, made);
    return made;
  }
}

/** Turns one element into a device, allocating any internal nodes and branches it needs. */
export type DeviceFactory<E> = (element: E, unknowns: UnknownMap, memo?: ElaborationMemo) => Device;
