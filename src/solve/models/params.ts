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

const tableDefaults = new WeakMap<readonly ParamSpec[], Readonly<Record<string, number>>>();

/** The card's parameters over the table's defaults (upper-case SPICE names). */
export function resolveParams(card: ModelCard, table: readonly ParamSpec[]): ResolvedParams {
  let defaults = tableDefaults.get(table);
  if (!defaults) {
    const d: Record<string, number> = {};
    for (const spec of table) d[spec.name] = spec.default;
    defaults = Object.freeze(d);
    tableDefaults.set(table, defaults);
  }
  const resolved: Record<string, number> = { ...defaults };
  for (const key in card.params) {
    const given = card.params[key];
    // Cards should already be upper case (netlist.ts); a stray "Is" or "vaf" still counts.
    const name = key.toUpperCase();
    if (given !== undefined && Number.isFinite(given) && name in resolved) resolved[name] = given;
  }
  return resolved;
}

/** Whether the card sets the parameter (SPICE distinguishes "given" from "default" for a few). */
export function isGiven(card: ModelCard, name: string): boolean {
  for (const key in card.params) {
    const v = card.params[key];
    if (key.toUpperCase() === name && v !== undefined && Number.isFinite(v)) return true;
  }
  return false;
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
