// What rules may ask about a design. Everything is computed on first request and cached, so a rule
// that never asks for the AC response costs nothing. Rules never do circuit math themselves: when a
// rule needs a figure that is not here, add it here (and to src/solve), not in the rule.
import type { Circuit, Part } from "../circuit/types.js";

export type Configuration =
  | "common-emitter"
  | "common-base"
  | "common-collector"
  | "common-source"
  | "common-gate"
  | "common-drain"
  | "unknown";

/** One active device and how it is used, decided from the AC topology (which terminal is grounded
 * for signal, which carries the input and which the output). */
export interface Stage {
  ref: string;
  part: Part;
  /** npn, pnp, njfet, pjfet, nmos, pmos, dual-gate-mosfet */
  type: string;
  configuration: Configuration;
  /** Role ("B", "C", "E", "G", "D", "S", "G1", "G2") -> net name. */
  nets: Record<string, string>;
}

/** Devices stacked in series from a rail to ground (a cascode: the CE/CS device at the bottom, the
 * CB/CG device above it), bottom first. */
export interface Stack {
  refs: string[];
  rail: string;
  /** Loads between the top device and the rail (collector/drain resistors, chokes). */
  loads: string[];
}

/** The Thevenin equivalent of the DC bias network a base or gate sees, devices removed. */
export interface BiasThevenin {
  volts: number;
  ohms: number;
  parts: string[];
}

export interface Rail {
  net: string;
  volts: number;
  /** How the voltage was known: from the net name (+9V), the config, a battery value, a field. */
  from: "name" | "config" | "battery" | "field";
}

export interface BandOfOperation {
  low: number;
  high: number;
  /** True when the user did not configure a band, so messages say "(default band)". */
  isDefault: boolean;
}

export interface ComplexPoint {
  hertz: number;
  re: number;
  im: number;
  magnitude: number;
}
