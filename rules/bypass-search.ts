// Finding the capacitor that closes a gap in a net's impedance to ground: try the IEC 60063 values
// around the one whose self-resonance (with the package's ESL) sits where it is needed, add each to
// the real network in turn, and keep the one that brings |Z| furthest under the limit. The search
// is over what-ifs the Context solves; no impedance formula lives here.
import type { ESeriesName } from "../src/engine/config.js";
import type { CapacitorModel, Context } from "../src/engine/context.js";
import type { ComplexPoint } from "../src/engine/context-types.js";
import { faradsForSelfResonance } from "../src/solve/reactance.js";
export { faradsForReactance } from "../src/solve/reactance.js";

export interface CapacitorSuggestion {
  farads: number;
  model: CapacitorModel;
  /** The template it copies; undefined for the generic 0603 ceramic. */
  like: string | undefined;
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
  /** An existing capacitor whose package and dielectric the suggestion copies (a generic 0603
   * ceramic when absent). */
  like?: string;
  /** Further templates to try besides `like` (undefined = generic 0603 ceramic); the best wins. */
  alsoLike?: (string | undefined)[];
  series: ESeriesName;
  /** Search this many decades either side of the aimed value. */
  spanDecades?: number;
  /** Capacitors the suggestion replaces rather than joins (their refs). */
  replaces?: string[];
}

/** The capacitor whose self-resonance would sit at `hertz` in this package: C = 1/((2πf)²·ESL). */
export function faradsForResonance(ctx: Context, hertz: number, like?: string): number | undefined {
  // ESL is a property of the package, nearly independent of value: read it from a 100 nF stand-in.
  const esl = ctx.capacitorLike(like, 100e-9)?.esl;
  if (esl === undefined || !(esl > 0)) return undefined;
  return faradsForSelfResonance(hertz, esl);
}

export function worstAgainst(points: ComplexPoint[], limit: (hertz: number) => number): { ratio: number; ohms: number; hertz: number } {
  let worst = { ratio: 0, ohms: 0, hertz: points[0]?.hertz ?? 0 };
  for (const p of points) {
    const ratio = p.magnitude / limit(p.hertz);
    if (ratio > worst.ratio) worst = { ratio, ohms: p.magnitude, hertz: p.hertz };
  }
  return worst;
}

/** The single shunt capacitor to add (or to fit instead of `replaces`), judged by solving the network
 * with it in place: the smallest value that holds |Z| under the limit everywhere, or, when none
 * does, the one that comes closest. */
export function suggestShuntCapacitor(ctx: Context, request: SearchRequest, centreFarads?: number): CapacitorSuggestion | undefined {
  const node = ctx.nodeOf(request.net);
  const aimFarads = centreFarads ?? faradsForResonance(ctx, request.aimHertz, request.like);
  if (node === undefined || aimFarads === undefined) return undefined;
  const span = 10 ** (request.spanDecades ?? 1);
  let best: CapacitorSuggestion | undefined;
  const templates = [request.like, ...(request.alsoLike ?? [])].filter((t, i, all) => all.indexOf(t) === i);
  let meets: CapacitorSuggestion | undefined;
  for (const like of templates) {
    const found = searchOne(ctx, request, like, node, aimFarads, span);
    if (!found) continue;
    if (found.worstRatio <= 1 && (!meets || found.farads < meets.farads)) meets = found;
    if (!best || found.worstRatio < best.worstRatio * 0.99) best = found;
  }
  return meets ?? best;
}

function searchOne(ctx: Context, request: SearchRequest, like: string | undefined, node: string, aimFarads: number, span: number): CapacitorSuggestion | undefined {
  let best: CapacitorSuggestion | undefined;
  for (const farads of ctx.seriesValues(request.series, aimFarads / span, aimFarads * span)) {
    const model = ctx.capacitorLike(like, farads);
    if (!model) continue;
    const extra = [{ kind: "C" as const, name: "Csuggested", a: node, b: "0", farads, esr: model.esr, esl: model.esl }];
    const points = ctx.impedance(request.net, request.frequencies, { passiveOnly: true, extra, without: request.replaces ?? [] });
    if (!points) continue;
    const worst = worstAgainst(points, request.limit);
    const candidate = { farads, model, like, worstRatio: worst.ratio, worstOhms: worst.ohms, atHertz: worst.hertz };
    // Values rise through the loop, so the first that meets the limit is the smallest that does.
    if (worst.ratio <= 1) return candidate;
    // Otherwise the closest; among near-equals (within 1 %) the smaller part.
    if (!best || worst.ratio < best.worstRatio * 0.99) best = candidate;
  }
  return best;
}

/**
 * The top of a local maximum of |Z| found between two grid points, by repeated finer sweeps of the
 * real network (three rounds of 21 points each narrow the bracket a thousandfold). A coarse grid
 * can miss a sharp anti-resonance by several per cent; this puts it within 0.1 %.
 */
export function refinePeak(ctx: Context, net: string, lowHertz: number, highHertz: number): ComplexPoint | undefined {
  let lo = lowHertz;
  let hi = highHertz;
  let best: ComplexPoint | undefined;
  for (let round = 0; round < 3; round++) {
    const grid = Array.from({ length: 21 }, (_, i) => lo * (hi / lo) ** (i / 20));
    const points = ctx.impedance(net, grid, { passiveOnly: true });
    if (!points) return best;
    let index = 0;
    points.forEach((p, i) => {
      if (p.magnitude > (points[index]?.magnitude ?? -1)) index = i;
    });
    best = points[index];
    lo = grid[Math.max(0, index - 1)] ?? lo;
    hi = grid[Math.min(grid.length - 1, index + 1)] ?? hi;
  }
  return best;
}
