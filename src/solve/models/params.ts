// Parameter tables in SPICE spelling with SPICE defaults, and resolution of a `.model` card
// against a table. Names a model does not use are reported, not silently dropped, so the parts
// library and users can see what was approximated.

import type { ModelCard } from "../netlist.js";

export interface ParamSpec {
  /** SPICE name, upper case (IS, BF, VAF …). */
  name: string;
  /** SPICE default; Infinity where SPICE means "not given = infinite" (VAF, IKF, BV …). */
  default: number;
  unit: string;
  description: string;
}

export type ResolvedParams = Readonly<Record<string, number>>;

export function resolveParams(card: ModelCard, table: readonly ParamSpec[]): ResolvedParams {
  const resolved: Record<string, number> = {};
  for (const spec of table) {
    const given = card.params[spec.name];
    resolved[spec.name] = given !== undefined && Number.isFinite(given) ? given : spec.default;
  }
  return resolved;
}

/** Whether the card sets the parameter (SPICE distinguishes "given" from "default" for a few). */
export function isGiven(card: ModelCard, name: string): boolean {
  const v = card.params[name];
  return v !== undefined && Number.isFinite(v);
}

/** Card parameters the model does not use (temperature coefficients, noise, unsupported effects). */
export function unusedParams(card: ModelCard, table: readonly ParamSpec[], alsoKnown: readonly string[] = []): string[] {
  const known = new Set<string>([...table.map((p) => p.name), ...alsoKnown, "LEVEL"]);
  return Object.keys(card.params).filter((k) => !known.has(k.toUpperCase()));
}

/** Reads a resolved parameter; the tables guarantee presence, this keeps the index type honest. */
export function param(p: ResolvedParams, name: string): number {
  const v = p[name];
  if (v === undefined) throw new Error(`model parameter ${name} missing from its table`);
  return v;
}

/** SPICE treats 0 for an Early voltage or knee current as "infinite"; returns its reciprocal. */
export function inverseOrZero(value: number): number {
  return value === 0 || !Number.isFinite(value) ? 0 : 1 / value;
}
