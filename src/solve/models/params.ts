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

interface ResolvedEntry {
  /** The card's parameter values when resolved, to notice a card edited in place. */
  seen: Array<[string, number]>;
  resolved: ResolvedParams;
}

const resolvedCache = new WeakMap<readonly ParamSpec[], WeakMap<ModelCard, ResolvedEntry>>();

function stillMatches(card: ModelCard, seen: Array<[string, number]>): boolean {
  let count = 0;
  for (const key in card.params) {
    const entry = seen[count++];
    if (!entry || entry[0] !== key || !Object.is(entry[1], card.params[key])) return false;
  }
  return count === seen.length;
}

/**
 * The card's parameters over the table's defaults (upper-case SPICE names). Cards are shared by
 * many elements, so the result is cached per card and re-checked against the card's values.
 */
export function resolveParams(card: ModelCard, table: readonly ParamSpec[]): ResolvedParams {
  let perCard = resolvedCache.get(table);
  if (!perCard) resolvedCache.set(table, (perCard = new WeakMap()));
  const cached = perCard.get(card);
  if (cached && stillMatches(card, cached.seen)) return cached.resolved;
  const resolved: Record<string, number> = {};
  for (const spec of table) resolved[spec.name] = spec.default;
  const seen: Array<[string, number]> = [];
  for (const key in card.params) {
    const given = card.params[key];
    seen.push([key, given as number]);
    // Cards should already be upper case (netlist.ts); a stray "Is" or "vaf" still counts.
    const name = key.toUpperCase();
    if (given !== undefined && Number.isFinite(given) && name in resolved) resolved[name] = given;
  }
  const frozen = Object.freeze(resolved);
  perCard.set(card, { seen, resolved: frozen });
  return frozen;
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
