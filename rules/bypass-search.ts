// Finding the capacitor that closes a gap in a net's impedance to ground: try the IEC 60063 values
// around the one whose self-resonance (with the package's ESL) sits where it is needed, add each to
// the real network in turn, and keep the one that brings |Z| furthest under the limit. The search
// is over what-ifs the Context solves; no impedance formula lives here.
import type { ESeriesName } from "../src/engine/config.js";
import type { CapacitorModel, Context } from "../src/engine/context.js";
import type { ComplexPoint } from "../src/engine/context-types.js";

export interface CapacitorSuggestion {
  farads: number;
  model: CapacitorModel;
  /** Worst |Z|/limit over the judged frequencies with the capacitor added (≤ 1 means it is enough). */
  worstRatio: number;
  worstOhms: number;
  atHertz: number;
}

export interface SearchRequest {
  net: string;
  /** Frequencies to judge at (in band) and the largest |Z| allowed at each. */
  frequencies: number[];
  limit(hertz: number): number;
  /** Where the new part's self-resonance should sit. */
  aimHertz: number;
  /** An existing capacitor whose package and dielectric the suggestion copies. */
  like?: string;
  series: ESeriesName;
  /** Search this many decades either side of the aimed value. */
  spanDecades?: number;
}

/** The capacitor whose self-resonance would sit at `hertz` in this package: C = 1/((2πf)²·ESL). */
export function faradsForResonance(ctx: Context, hertz: number, like?: string): number | undefined {
  // ESL is a property of the package, nearly independent of value: read it from a 100 nF stand-in.
  const esl = ctx.capacitorLike(like, 100e-9)?.esl;
  if (esl === undefined || !(esl > 0)) return undefined;
  return 1 / ((2 * Math.PI * hertz) ** 2 * esl);
}

/** The capacitance whose reactance is `ohms` at `hertz`: C = 1/(2πfX). */
export function faradsForReactance(ohms: number, hertz: number): number {
  return 1 / (2 * Math.PI * hertz * ohms);
}

export function worstAgainst(points: ComplexPoint[], limit: (hertz: number) => number): { ratio: number; ohms: number; hertz: number } {
  let worst = { ratio: 0, ohms: 0, hertz: points[0]?.hertz ?? 0 };
  for (const p of points) {
    const ratio = p.magnitude / limit(p.hertz);
    if (ratio > worst.ratio) worst = { ratio, ohms: p.magnitude, hertz: p.hertz };
  }
  return worst;
}

/** The best single shunt capacitor to add, judged by solving the network with it in place. */
export function suggestShuntCapacitor(ctx: Context, request: SearchRequest, centreFarads?: number): CapacitorSuggestion | undefined {
  const node = ctx.nodeOf(request.net);
  const aimFarads = centreFarads ?? faradsForResonance(ctx, request.aimHertz, request.like);
  if (node === undefined || aimFarads === undefined) return undefined;
  const span = 10 ** (request.spanDecades ?? 1);
  let best: CapacitorSuggestion | undefined;
  for (const farads of ctx.seriesValues(request.series, aimFarads / span, aimFarads * span)) {
    const model = ctx.capacitorLike(request.like, farads);
    if (!model) continue;
    const extra = [{ kind: "C" as const, name: "Csuggested", a: node, b: "0", farads, esr: model.esr, esl: model.esl }];
    const points = ctx.impedance(request.net, request.frequencies, { passiveOnly: true, extra });
    if (!points) continue;
    const worst = worstAgainst(points, request.limit);
    // Prefer a clear improvement; among near-equals (within 1 %) the smaller, cheaper part.
    if (!best || worst.ratio < best.worstRatio * 0.99) {
      best = { farads, model, worstRatio: worst.ratio, worstOhms: worst.ohms, atHertz: worst.hertz };
    }
  }
  return best;
}
