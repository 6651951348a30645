/**
 * base-ac-ground — the base of a common-base stage (and gate 2 of a dual-gate MOSFET, or the gate
 * of a common-gate stage) is an AC ground across the band.
 *
 * ## What it checks
 * For the upper device of every bipolar cascode and every other common-base stage, for gate 2 of
 * every dual-gate MOSFET and for the gate of every common-gate stage: |Z| from that node to ground
 * over the band, through the bias divider and its capacitors. A capacitor to a rail counts only as
 * well as the rail is itself bypassed (the whole passive network is solved, rail capacitors and
 * source impedance included). The limit is what the stage tolerates: for a bipolar device
 * |Zb| ≤ k·|(β+1)·r_e ∥ 1/(jωCπ)|, i.e. |Zb|/(β+1) ≤ k·r_e at low frequency with r_e = V_T/I_C
 * and β = I_C/I_B from the operating point; for a FET gate |Zg| ≤ k/(ωC_gs). Reports a missing
 * capacitor, the frequencies where grounding fails, and the value needed (snapped up to the
 * configured capacitor series).
 *
 * ## Why it matters
 * A common-base stage works only while its base sits still. Impedance left in the base circuit
 * appears in series with the input resistance the emitter sees, divided by β+1; once it is no longer
 * small against r_e the stage degenerates, its input impedance rises and — in a cascode — the lower
 * device's collector swings again, bringing its Miller capacitance back: the bandwidth the cascode
 * was built for is lost (an un-bypassed base divides it by about five in our reference cascode).
 *
 * ## Example
 * A 9 V cascode biased at 1.7 mA (β ≈ 145, r_e ≈ 15 Ω) tolerates about 220 Ω in its upper base
 * with k = 0.1. A 10 µF base capacitor (0.03 Ω at 0.5 MHz) passes; 1 nF (318 Ω at 0.5 MHz) fails
 * from the band's low edge, and about 1.5 nF is needed.
 *
 * ## References
 * Common-base input impedance r_e + Z_b/(β+1) and the hybrid-π model: Sedra & Smith, Microelectronic
 * Circuits; Gray & Meyer, Analysis and Design of Analog Integrated Circuits.
 * Cascode base bypass Xc ≤ R_Th/10 and k = 0.1 (an order of magnitude): common practice.
 */
import type { Part } from "../src/circuit/types.js";
import type { Context, DeviceOperatingPoint } from "../src/engine/context.js";
import type { ComplexPoint, Stage } from "../src/engine/context-types.js";
import type { Rule } from "../src/engine/rule.js";
import type { Finding, RuleDoc } from "../src/engine/types.js";
import { faradsForReactance, suggestShuntCapacitor } from "./bypass-search.js";
import { bandText, finding, numberOption, si } from "./support.js";

const ID = "base-ac-ground";

const doc: RuleDoc = {
  what:
    "For every common-base stage (the upper device of a bipolar cascode), gate 2 of every dual-gate MOSFET and the gate of every common-gate stage, sweeps |Z| from that node to ground over the band through the bias divider and its capacitors; a capacitor to a rail counts only as well as that rail is bypassed, because the whole passive network is solved. The limit is what the stage tolerates: |Zb|/(β+1) ≤ k·r_e at low frequency (r_e = V_T/I_C, β = I_C/I_B from the operating point), falling with the device's Cπ at high frequency; for a FET gate |Zg| ≤ k/(ωCgs). Reports a missing capacitor, where grounding fails, and the value needed.",
  why:
    "A common-base or common-gate stage works only while its base or gate sits still. Impedance left there appears in series with the emitter's input resistance (divided by β+1 for a bipolar device) and degenerates the stage; in a cascode the lower device's collector starts to swing again and its Miller capacitance comes back, so the bandwidth the cascode exists for is lost.",
  fix:
    "Bypass the base (gate 2, gate) to ground with the value suggested, mounted at the pin with short leads; if it is bypassed to a rail, make sure that rail is bypassed at the same frequencies, or return the capacitor to ground instead.",
  references: [
    "Common-base input impedance r_e + Z_b/(β+1), hybrid-π model: A. S. Sedra and K. C. Smith, Microelectronic Circuits",
    "Cascode bandwidth and the Miller effect: P. R. Gray and R. G. Meyer, Analysis and Design of Analog Integrated Circuits",
    "k = 0.1 (an order of magnitude below the stage's own input impedance) and Xc ≤ R_Th/10 at the band's low edge: common practice",
  ],
  example:
    "A 9 V cascode at 1.7 mA (β ≈ 145, r_e ≈ 15 Ω) tolerates about 220 Ω in the upper base with k = 0.1: a 10 µF base capacitor passes, 1 nF (318 Ω at 0.5 MHz) fails from the band's low edge, and about 1.5 nF is needed.",
};

const options = {
  k: {
    type: "number" as const,
    default: 0.1,
    description: "How small the base (gate) impedance must be against what the stage tolerates: |Zb|/(β+1) ≤ k·r_e.",
  },
};

interface Checked {
  ref: string;
  role: "B" | "G" | "G2";
  net: string;
  stage: Stage;
  what: string;
}

function candidates(ctx: Context): Checked[] {
  const out: Checked[] = [];
  for (const stage of ctx.stages()) {
    if (stage.type === "dual-gate-mosfet") {
      const net = stage.nets.G2;
      if (net !== undefined) out.push({ ref: stage.ref, role: "G2", net, stage, what: "gate 2" });
    } else if (stage.configuration === "common-base") {
      const net = stage.nets.B;
      if (net !== undefined) out.push({ ref: stage.ref, role: "B", net, stage, what: "base" });
    } else if (stage.configuration === "common-gate") {
      const net = stage.nets.G;
      if (net !== undefined) out.push({ ref: stage.ref, role: "G", net, stage, what: "gate" });
    }
  }
  return out;
}

interface Tolerance {
  limit(hertz: number): number;
  /** The figures the limit came from, for the message and `data`. */
  basis: string;
  data: Record<string, number>;
}

/** What the stage tolerates at each frequency, from its operating point. */
function tolerance(ctx: Context, device: DeviceOperatingPoint, k: number): Tolerance | undefined {
  if (device.kind === "bjt") {
    if (!(device.ic > 0) || !(device.ib > 0)) return undefined;
    const vt = ctx.thermalVoltage();
    const re = vt / device.ic;
    const beta = device.ic / device.ib;
    const rin = (beta + 1) * re;
    const cpi = device.cpi > 0 ? device.cpi : 0;
    return {
      limit: (f) => k / Math.hypot(1 / rin, 2 * Math.PI * f * cpi),
      basis: `k·(β+1)·r_e = ${k} × ${Math.round(beta + 1)} × ${si(re, "Ω")} = ${si(k * rin, "Ω")} (I_C ${si(device.ic, "A")}, β ${beta.toFixed(0)}${cpi > 0 ? `, less at high frequency through Cπ ${si(cpi, "F")}` : ""})`,
      data: { icAmps: device.ic, beta, reOhms: re, lowFrequencyLimitOhms: k * rin, cpiFarads: cpi },
    };
  }
  if (device.kind === "jfet" || device.kind === "mosfet") {
    if (!(device.cgs > 0)) return undefined;
    const cgs = device.cgs;
    return {
      limit: (f) => k / (2 * Math.PI * f * cgs),
      basis: `k/(ωC_gs) with C_gs ${si(cgs, "F")}`,
      data: { cgsFarads: cgs },
    };
  }
  return undefined;
}

function inBand(ctx: Context, points: ComplexPoint[]): ComplexPoint[] {
  return points.filter((p) => p.hertz >= ctx.band.low * (1 - 1e-9) && p.hertz <= ctx.band.high * (1 + 1e-9));
}

function checkOne(ctx: Context, c: Checked, k: number): Finding[] {
  const part = c.stage.part;
  const caps = ctx.groundingCapacitors(c.net);
  const onRail = ctx.rail(c.net) !== undefined;
  const device = c.role === "G2" ? ctx.device(c.ref, "g2") : ctx.device(c.ref);
  const tol = device ? tolerance(ctx, device, k) : undefined;
  const series = ctx.config.series.capacitor;
  const low = ctx.band.low;
  const kind = c.stage.configuration === "unknown" ? "stage" : `${c.stage.configuration} stage`;

  if (!tol) {
    const unmodelled = ctx.unmodelled().some((u) => u.ref === c.ref);
    const why = device ? `no usable small-signal figures for ${c.ref}`
      : unmodelled ? `${c.ref} not modelled` : `no operating point for ${c.ref} (${ctx.operatingPointProblem() ?? "not solved"})`;
    ctx.noteLimited(ID, `${why}: the ${c.what} impedance limit could not be computed`, [c.ref]);
  }

  if (caps.length === 0 && !onRail) {
    const neededFarads = tol ? ctx.snapUp(faradsForReactance(tol.limit(low), low), series) : undefined;
    return [finding(ctx, ID, {
      at: part,
      severity: "error",
      message: `${c.ref} (${kind}): its ${c.what} (net ${c.net}) has no capacitor to ground, so it is not an AC ground and the stage degenerates.${neededFarads !== undefined ? ` Bypass it with at least ${si(neededFarads, "F")} (${si(tol?.limit(low) ?? 0, "Ω")} allowed at ${si(low, "Hz")}: ${tol?.basis}).` : " Bypass it to ground at the pin."}`,
      parts: [c.ref],
      nets: [c.net],
      data: { capacitors: 0, ...(neededFarads !== undefined ? { neededFarads } : {}), ...(tol?.data ?? {}) },
    })];
  }
  if (!tol) return [];

  const frequencies = ctx.frequencies(40);
  const points = ctx.impedance(c.net, frequencies, { passiveOnly: true });
  if (!points) {
    ctx.noteLimited(ID, `no impedance sweep: ${ctx.solverProblem() ?? "the network could not be built"}`, [c.ref]);
    return [];
  }
  const judged = inBand(ctx, points);
  ctx.report.addBase({
    ref: c.ref,
    net: c.net,
    curve: points.map((p) => [p.hertz, p.magnitude]),
    limitOhms: Math.min(...judged.map((p) => tol.limit(p.hertz))),
    limitCurve: judged.map((p) => [p.hertz, tol.limit(p.hertz)]),
  });
  const failing = judged.filter((p) => p.magnitude > tol.limit(p.hertz));
  if (failing.length === 0) return [];

  const worst = failing.reduce((a, b) => (b.magnitude / tol.limit(b.hertz) > a.magnitude / tol.limit(a.hertz) ? b : a));
  const first = failing[0] ?? worst;
  const last = failing[failing.length - 1] ?? worst;
  const capacitive = first.im < 0;
  const largest = [...caps].sort((a, b) => (b.parsed.number ?? 0) - (a.parsed.number ?? 0))[0];
  const smallest = [...caps].sort((a, b) => (a.parsed.number ?? 0) - (b.parsed.number ?? 0))[0];
  const judgedHz = judged.map((p) => p.hertz);
  let suggestion;
  let neededFarads: number | undefined;
  if (capacitive) {
    // Too little capacitance: size it for the lowest failing frequency, then confirm by solving.
    neededFarads = faradsForReactance(tol.limit(first.hertz), first.hertz);
    suggestion = suggestShuntCapacitor(ctx, {
      net: c.net, frequencies: judgedHz, limit: tol.limit, aimHertz: first.hertz, like: largest?.ref, series, spanDecades: 1,
      replaces: largest ? [largest.ref] : [],
    }, ctx.snapUp(neededFarads, series));
  } else {
    // Inductive: the capacitors are past self-resonance; a smaller one resonating there fills in.
    suggestion = suggestShuntCapacitor(ctx, {
      net: c.net, frequencies: judgedHz, limit: tol.limit, aimHertz: first.hertz, like: smallest?.ref, series,
    });
  }
  const range = failing.length === judged.length ? "across the whole band" : `from ${si(first.hertz, "Hz")} to ${si(last.hertz, "Hz")}`;
  const action = capacitive
    ? `${largest ? `fitting ${si(suggestion?.farads ?? 0, "F")} to ground instead of ${largest.ref}` : `adding ${si(suggestion?.farads ?? 0, "F")}`}`
    : `adding ${si(suggestion?.farads ?? 0, "F")} like ${smallest?.ref ?? "the bypass"} (self-resonant at ${si(suggestion?.model.srfHertz ?? 0, "Hz")})`;
  const advice = suggestion
    ? ` ${capacitive ? `About ${si(neededFarads ?? suggestion.farads, "F")} is needed; ` : ""}${action} ${suggestion.worstRatio <= 1 ? "holds the node under the limit across the band" : `brings the worst to ${si(suggestion.worstOhms, "Ω")} at ${si(suggestion.atHertz, "Hz")}, still over the limit`}.`
    : "";
  // A capacitor returned to a rail grounds the node only as well as that rail is bypassed.
  const toRails = caps
    .map((cap) => ({ cap, rail: Object.values(cap.pins).find((n) => n !== c.net && ctx.rail(n) !== undefined) }))
    .filter((x): x is { cap: Part; rail: string } => x.rail !== undefined);
  const railNote = toRails.length > 0
    ? ` ${toRails.map((x) => `${x.cap.ref} returns to ${x.rail}`).join(", ")}: the node is only as well grounded as that rail is bypassed — bypass the rail, or return the capacitor to ground.`
    : "";
  return [finding(ctx, ID, {
    at: largest ?? part,
    severity: "warning",
    message: `${c.ref} (${kind}): its ${c.what} (net ${c.net}) is not an AC ground ${range} within ${bandText(ctx)}: |Z| to ground is ${si(worst.magnitude, "Ω")} at ${si(worst.hertz, "Hz")} where the stage tolerates ${si(tol.limit(worst.hertz), "Ω")} (${tol.basis}).${railNote}${advice}`,
    parts: [c.ref, ...caps.map((p: Part) => p.ref)],
    nets: [c.net],
    data: {
      worstOhms: worst.magnitude, atHertz: worst.hertz, limitOhms: tol.limit(worst.hertz),
      failsFromHertz: first.hertz, failsToHertz: last.hertz, k, ...tol.data,
      ...(neededFarads !== undefined ? { neededFarads } : {}),
      ...(suggestion ? { suggestedFarads: suggestion.farads, worstOhmsWithSuggestion: suggestion.worstOhms, worstRatioWithSuggestion: suggestion.worstRatio } : {}),
    },
  })];
}

export const baseAcGround: Rule<Context> = {
  id: ID,
  title: "Common-base bases and common-gate gates are AC grounds across the band",
  severity: "warning",
  doc,
  options,
  tags: ["rf", "cascode"],
  check(ctx, opts) {
    const k = numberOption(opts, "k", 0.1);
    return candidates(ctx).flatMap((c) => checkOne(ctx, c, k));
  },
};
