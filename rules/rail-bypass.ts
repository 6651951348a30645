/**
 * rail-bypass — every supply rail is held to AC ground across the band.
 *
 * ## What it checks
 * For each supply rail, the impedance from the rail to ground of the passive supply network:
 * every capacitor with its ESR and ESL, the series resistors and chokes of RC/LC decoupling, and
 * an on-board battery's internal resistance (an off-board supply counts as open). It is swept over
 * the band and a decade beyond each edge, and judged inside the band against a target: by default
 * 1/100 of the smallest collector/drain load fed from the rail, or the `targetOhms` option. It
 * reports a rail with no bypass capacitor at all; the worst |Z| over the target and its frequency;
 * anti-resonance peaks between two named capacitors; a missing bulk capacitor (the rail is still
 * capacitive and too high at the band's low edge); a missing RF capacitor (every capacitor's
 * self-resonance lies below the band's top); and the value whose self-resonance fills the gap.
 *
 * ## Why it matters
 * Every stage draws its signal current through the rail. Whatever impedance the rail has at a
 * frequency becomes a common path between the stages it feeds: signal from a later stage appears on
 * an earlier one's collector supply, and a multi-stage amplifier with gain at that frequency can
 * oscillate or motor-boat. Keeping the rail 40 dB below the smallest load keeps that coupling 40 dB
 * down. Two capacitors of different value form a parallel resonance between their self-resonant
 * frequencies, where the pair is worse than either alone; a large electrolytic is inductive long
 * before HF, and a small ceramic is capacitive and too high at the low end.
 *
 * ## Example
 * A 9 V rail with 100 µF, 100 nF and 5 nF (ESL 8, 1.2 and 0.8 nH) feeding a 1.5 kΩ collector load
 * has a 15 Ω default target and passes; the same rail feeding a 50 Ω collector load (target 0.5 Ω)
 * fails at the 100 nF / 5 nF anti-resonance, 0.889 Ω at 52.7 MHz, if the band reaches that high.
 * Fix: add a value between the two (e.g. 22 nF), choose closer values, or accept more loss.
 *
 * ## References
 * Series R-L-C capacitor model and self-resonance 1/(2π√(LC)): capacitor application notes (common).
 * Parallel anti-resonance between unequal capacitors and the effect of ESR on its height: D. Brooks,
 * "ESR and bypass capacitor self-resonant behavior", UltraCAD Design, 2000.
 * Target impedance ΔV/ΔI: L. D. Smith et al., IEEE Trans. Advanced Packaging, 1999.
 * The 1/100-of-the-load default (40 dB of stage isolation) is common practice, not a standard.
 */
import type { Part } from "../src/circuit/types.js";
import type { Context } from "../src/engine/context.js";
import type { ComplexPoint, Rail } from "../src/engine/context-types.js";
import type { Rule } from "../src/engine/rule.js";
import type { Finding, RuleDoc } from "../src/engine/types.js";
import { faradsForReactance, refinePeak, suggestShuntCapacitor } from "./bypass-search.js";
import type { CapacitorSuggestion } from "./bypass-search.js";
import { bandText, byRef, finding, numberOption, si } from "./support.js";

const ID = "rail-bypass";

const doc: RuleDoc = {
  what:
    "For each supply rail, sweeps the impedance from the rail to ground of the passive supply network (capacitors with ESR and ESL, decoupling resistors and chokes, an on-board battery's internal resistance; an off-board supply counts as open) over the band and a decade beyond each edge. Inside the band it is judged against a target: 1/100 of the smallest collector/drain load fed from the rail by default, or the targetOhms option. Reports a rail with no bypass at all, the worst |Z| over target and where, anti-resonance peaks between two named capacitors, a missing bulk capacitor at the low end, a missing RF capacitor at the high end (every self-resonance below the band's top), and the value whose self-resonance fills the gap.",
  why:
    "The rail is a common path between every stage it feeds: its impedance at a frequency couples a later stage's signal current back into an earlier stage, and with gain at that frequency the amplifier oscillates or motor-boats. Holding the rail 40 dB under the smallest load keeps that coupling 40 dB down. Two unequal capacitors resonate in parallel between their self-resonances, where the pair is worse than either alone; an electrolytic is inductive long before HF, and a small ceramic is too high at the low end.",
  fix:
    "Add the suggested capacitor from the rail to ground, close to the load it serves (short leads: about 1 nH per mm of loop). For an anti-resonance, add a value between the two capacitors or pick values less than a decade apart. For the low end, add or enlarge the bulk electrolytic. Set targetOhms when the default target (from the loads) does not fit the design.",
  references: [
    "Series R-L-C capacitor model, self-resonance f = 1/(2π√(L·C)): capacitor manufacturers' application notes",
    "D. Brooks, \"ESR and bypass capacitor self-resonant behavior - how to select bypass caps\", UltraCAD Design, 2000",
    "L. D. Smith et al., target impedance ΔV/ΔI, IEEE Transactions on Advanced Packaging, 1999",
    "1/100 of the smallest load (40 dB of stage-to-stage isolation) as the default target: common practice",
  ],
  example:
    "A 9 V rail with 100 µF, 100 nF and 5 nF (ESL 8, 1.2 and 0.8 nH) feeding a 1.5 kΩ collector load has a 15 Ω default target and passes; fed to a 50 Ω load (target 0.5 Ω) it fails at the 100 nF / 5 nF anti-resonance, 0.889 Ω at 52.7 MHz, when the band reaches that high. Add a value between the two (e.g. 22 nF) or choose values closer together.",
};

const options = {
  targetOhms: {
    type: "number" as const,
    default: 0,
    unit: "ohm",
    description: "Largest |Z| from any rail to ground allowed in the band; 0 derives it from the loads (1/loadRatio of the smallest collector/drain load fed from the rail).",
  },
  loadRatio: {
    type: "number" as const,
    default: 100,
    description: "How many times smaller than the smallest load fed from it the rail's |Z| must stay (100 = 40 dB) when targetOhms is 0.",
  },
};

const SOURCE_KINDS = new Set(["battery", "voltage-source", "current-source", "power-flag", "connector"]);

interface Target {
  ohms: number;
  basis: string;
  isDefault: boolean;
}

/** A rail to check; `volts` is undefined for a power net whose voltage nothing states. */
type CheckedRail = Pick<Rail, "net"> & { volts: number | undefined };

function voltsText(rail: CheckedRail): string {
  return rail.volts === undefined ? "voltage not stated" : si(rail.volts, "V");
}

function chooseTarget(ctx: Context, rail: CheckedRail, configured: number, ratio: number): Target | undefined {
  if (configured > 0) return { ohms: configured, basis: `configured target ${si(configured, "Ω")}`, isDefault: false };
  const loads = ctx.railLoads(rail.net);
  if (loads.length === 0 || !(ratio > 0)) return undefined;
  const smallest = loads.reduce((a, b) => (b.ohms < a.ohms ? b : a));
  const what = smallest.part.kind === "inductor" ? `${smallest.part.ref}'s ${si(smallest.ohms, "Ω")} reactance at the band's low edge` : `${smallest.part.ref} ${si(smallest.ohms, "Ω")}`;
  const ohms = smallest.ohms / ratio;
  return {
    ohms,
    basis: `default target ${si(ohms, "Ω")} (1/${ratio} of the smallest collector/drain load fed from it, ${what} feeding ${smallest.device.ref})`,
    isDefault: true,
  };
}

function inBand(ctx: Context, points: ComplexPoint[]): ComplexPoint[] {
  const { low, high } = ctx.band;
  return points.filter((p) => p.hertz >= low * (1 - 1e-9) && p.hertz <= high * (1 + 1e-9));
}

/** Local maxima of |Z| on the grid (above both neighbours), each refined between its neighbours. */
function peaks(ctx: Context, net: string, points: ComplexPoint[]): ComplexPoint[] {
  const out: ComplexPoint[] = [];
  for (let i = 1; i < points.length - 1; i++) {
    const prev = points[i - 1];
    const here = points[i];
    const next = points[i + 1];
    if (!prev || !here || !next || !(here.magnitude > prev.magnitude && here.magnitude >= next.magnitude)) continue;
    out.push(refinePeak(ctx, net, prev.hertz, next.hertz) ?? here);
  }
  return out;
}

/** The highest in-band point; an interior maximum is refined, since the grid may straddle it. */
function refinedWorst(ctx: Context, net: string, judged: ComplexPoint[]): ComplexPoint | undefined {
  let index = -1;
  judged.forEach((p, i) => {
    if (index < 0 || p.magnitude > (judged[index]?.magnitude ?? 0)) index = i;
  });
  const here = judged[index];
  const prev = judged[index - 1];
  const next = judged[index + 1];
  if (!here || !prev || !next) return here;
  const refined = refinePeak(ctx, net, prev.hertz, next.hertz);
  return refined && refined.magnitude > here.magnitude ? refined : here;
}

function suggestionText(ctx: Context, s: CapacitorSuggestion | undefined, target: number): string {
  if (!s) return "";
  const pkg = s.like ? ` like ${s.like}` : " (0603 ceramic)";
  const outcome = s.worstRatio <= 1
    ? `brings the worst in-band |Z| to ${si(s.worstOhms, "Ω")}, under the target`
    : `lowers the worst in-band |Z| to ${si(s.worstOhms, "Ω")} at ${si(s.atHertz, "Hz")}, still over ${si(target, "Ω")}; more than one part is needed`;
  return ` Adding ${si(s.farads, "F")}${pkg} from the rail to ground (self-resonant at ${si(s.model.srfHertz, "Hz")}) ${outcome}.`;
}

function suggestionData(s: CapacitorSuggestion | undefined): Record<string, number> {
  if (!s) return {};
  return { suggestedFarads: s.farads, suggestedSrfHertz: s.model.srfHertz, worstOhmsWithSuggestion: s.worstOhms };
}

function checkRail(ctx: Context, rail: CheckedRail, configuredTarget: number, ratio: number): Finding[] {
  const feeds = ctx.partsOn(rail.net).filter(({ part }) => !SOURCE_KINDS.has(part.kind));
  if (feeds.length === 0) return [];
  const caps = [...ctx.groundingCapacitors(rail.net)].sort(byRef);
  const loads = ctx.railLoads(rail.net);
  const anchor = loads[0]?.part ?? feeds[0]?.part;
  const target = chooseTarget(ctx, rail, configuredTarget, ratio);
  const findings: Finding[] = [];

  if (caps.length === 0) {
    findings.push(finding(ctx, ID, {
      at: anchor,
      severity: "error",
      message: `Rail ${rail.net} (${voltsText(rail)}) has no bypass capacitor to ground: every stage on it shares the supply's impedance. Add a bulk electrolytic and a ceramic (e.g. 100 nF) next to ${anchor?.ref ?? "the load"}.`,
      parts: feeds.map((f) => f.part.ref).filter((r, i, all) => all.indexOf(r) === i).sort((a, b) => a.localeCompare(b, "en", { numeric: true })),
      nets: [rail.net],
      data: { ...(rail.volts !== undefined ? { volts: rail.volts } : {}), capacitors: 0, ...(target ? { targetOhms: target.ohms, targetIsDefault: target.isDefault } : {}) },
    }));
  }

  const frequencies = ctx.frequencies(40);
  const points = ctx.impedance(rail.net, frequencies, { passiveOnly: true });
  if (!points) {
    ctx.noteLimited(ID, `no impedance sweep: ${ctx.solverProblem() ?? "the supply network could not be built"}`, caps.map((c) => c.ref));
    return findings;
  }
  const judged = inBand(ctx, points);
  const worstPoint = refinedWorst(ctx, rail.net, judged);
  if (!target || !worstPoint) {
    if (!target && caps.length > 0) ctx.noteLimited(ID, `no target for rail ${rail.net}: no collector/drain load found on it (set targetOhms)`, []);
    return findings;
  }
  // The report's rail table needs a voltage; a rail whose voltage nothing states is judged but not drawn.
  if (rail.volts !== undefined) ctx.report.addRail({
    net: rail.net,
    volts: rail.volts,
    targetOhms: target.ohms,
    targetBasis: target.basis,
    curve: points.map((p) => [p.hertz, p.magnitude]),
    worst: { ohms: worstPoint.magnitude, hertz: worstPoint.hertz },
  });
  if (caps.length === 0) return findings;

  const limit = (): number => target.ohms;
  const models = caps
    .map((part) => ({ part, model: ctx.capacitor(part.ref) }))
    .filter((c): c is { part: Part; model: NonNullable<typeof c.model> } => c.model !== undefined);
  // Templates for suggestions: an RF part copies the board's lowest-ESL ceramic (a generic 0603
  // when there is none); a bulk part copies the largest capacitor.
  const ceramics = models.filter((m) => m.part.kind === "capacitor");
  const lowestEsl = ceramics.reduce<(typeof models)[number] | undefined>((a, b) => (!a || b.model.esl < a.model.esl ? b : a), undefined);
  const largest = models.reduce<(typeof models)[number] | undefined>((a, b) => (!a || b.model.farads > a.model.farads ? b : a), undefined);
  const anchorCap = lowestEsl ?? largest;
  const series = ctx.config.series.capacitor;
  const judgedHz = judged.map((p) => p.hertz);
  const capParts = caps.map((c) => c.ref);
  const targetPhrase = `the ${target.basis}`;

  const srfs = models.map((m) => ({ part: m.part, srf: m.model.srfHertz, farads: m.model.farads }));
  // The high end: every capacitor already inductive below the band's top. Reported whatever the
  // target says (a note when the rail still meets it), because the next board revision with a
  // smaller load or a longer trace will not.
  const highEdge = judged[judged.length - 1];
  const highestSrf = Math.max(...srfs.map((s) => s.srf));
  if (highEdge && srfs.length > 0 && highestSrf < ctx.band.high) {
    const over = highEdge.magnitude > target.ohms;
    const rf = suggestShuntCapacitor(ctx, {
      net: rail.net, frequencies: judgedHz, limit, aimHertz: ctx.band.high, like: lowestEsl?.part.ref, series,
    });
    findings.push(finding(ctx, ID, {
      at: anchorCap?.part ?? anchor,
      severity: over ? "warning" : "note",
      message: `Rail ${rail.net}: no RF capacitor for the top of the band — every bypass capacitor is self-resonant below ${si(ctx.band.high, "Hz")} (highest ${si(highestSrf, "Hz")}), so the rail is inductive there: ${si(highEdge.magnitude, "Ω")} at ${si(highEdge.hertz, "Hz")}, ${over ? "over" : "still under"} the target ${si(target.ohms, "Ω")}.${suggestionText(ctx, rf, target.ohms)}`,
      parts: capParts,
      nets: [rail.net],
      data: { highEdgeOhms: highEdge.magnitude, atHertz: highEdge.hertz, targetOhms: target.ohms, highestSrfHertz: highestSrf, overTarget: over, ...suggestionData(rf) },
    }));
  }
  if (worstPoint.magnitude <= target.ohms) return findings;

  // The summary: the worst point and the one part that best fills the gap there — sized by its
  // reactance where the rail is still capacitive (too little capacitance), by its self-resonance
  // where the rail has turned inductive (the capacitors are past resonance).
  const capacitiveWorst = worstPoint.im < 0;
  const summaryLike = capacitiveWorst ? largest?.part : lowestEsl?.part;
  const summarySuggestion = capacitiveWorst
    ? suggestShuntCapacitor(ctx, { net: rail.net, frequencies: judgedHz, limit, aimHertz: worstPoint.hertz, like: summaryLike?.ref, alsoLike: [undefined], series },
        ctx.snapUp(faradsForReactance(target.ohms, worstPoint.hertz), series))
    : suggestShuntCapacitor(ctx, { net: rail.net, frequencies: judgedHz, limit, aimHertz: worstPoint.hertz, like: summaryLike?.ref, series });
  findings.push(finding(ctx, ID, {
    at: anchorCap?.part ?? anchor,
    severity: "warning",
    message: `Rail ${rail.net}: |Z| to ground reaches ${si(worstPoint.magnitude, "Ω")} at ${si(worstPoint.hertz, "Hz")}, over ${targetPhrase}, within ${bandText(ctx)}.${suggestionText(ctx, summarySuggestion, target.ohms)}`,
    parts: capParts,
    nets: [rail.net],
    data: {
      ...(rail.volts !== undefined ? { volts: rail.volts } : {}), worstOhms: worstPoint.magnitude, atHertz: worstPoint.hertz, targetOhms: target.ohms,
      targetIsDefault: target.isDefault, bandIsDefault: ctx.band.isDefault, ...suggestionData(summarySuggestion),
    },
  }));

  // Anti-resonances: a peak between two capacitors' self-resonances, over the target, in band.
  for (const peak of peaks(ctx, rail.net, points)) {
    if (peak.magnitude <= target.ohms) continue;
    if (peak.hertz < ctx.band.low * (1 - 1e-9) || peak.hertz > ctx.band.high * (1 + 1e-9)) continue;
    const below = srfs.filter((s) => s.srf < peak.hertz).reduce<(typeof srfs)[number] | undefined>((a, b) => (!a || b.srf > a.srf ? b : a), undefined);
    const above = srfs.filter((s) => s.srf > peak.hertz).reduce<(typeof srfs)[number] | undefined>((a, b) => (!a || b.srf < a.srf ? b : a), undefined);
    if (!below || !above) continue;
    const fill = suggestShuntCapacitor(ctx, {
      net: rail.net, frequencies: judgedHz, limit, aimHertz: peak.hertz, like: above.part.ref, series,
    });
    findings.push(finding(ctx, ID, {
      at: above.part,
      severity: "warning",
      message: `Rail ${rail.net}: ${below.part.ref} (${si(below.farads, "F")}, self-resonant at ${si(below.srf, "Hz")}) and ${above.part.ref} (${si(above.farads, "F")}, ${si(above.srf, "Hz")}) anti-resonate: |Z| peaks at ${si(peak.magnitude, "Ω")} at ${si(peak.hertz, "Hz")}, over the target ${si(target.ohms, "Ω")}.${suggestionText(ctx, fill, target.ohms)}`,
      parts: [below.part.ref, above.part.ref],
      nets: [rail.net],
      data: {
        peakOhms: peak.magnitude, atHertz: peak.hertz, targetOhms: target.ohms,
        lowerSrfHertz: below.srf, upperSrfHertz: above.srf, capacitors: [below.part.ref, above.part.ref], ...suggestionData(fill),
      },
    }));
  }

  // The low end: still capacitive and over target at the band's low edge means too little bulk.
  const lowEdge = judged[0];
  if (lowEdge && lowEdge.magnitude > target.ohms && -lowEdge.im > target.ohms) {
    const neededFarads = faradsForReactance(target.ohms, lowEdge.hertz);
    const bulk = suggestShuntCapacitor(ctx, {
      net: rail.net, frequencies: judgedHz, limit, aimHertz: lowEdge.hertz, like: largest?.part.ref, alsoLike: [undefined], series, spanDecades: 1,
    }, ctx.snapUp(neededFarads, series));
    // A bulk part with capacitance enough but a lossy ESR (an electrolytic at the table's figure)
    // needs a different remedy from a missing one: say which it is.
    const esrLimited = largest !== undefined && largest.model.farads >= neededFarads && largest.model.esr > target.ohms;
    const cause = esrLimited && largest
      ? `${largest.part.ref} (${si(largest.model.farads, "F")}) has capacitance enough, but its ESR of ${si(largest.model.esr, "Ω")} (${largest.model.source.includes("from the part's ESR field") ? "from its ESR field" : "estimated for its type and rating; an ESR field overrides it"}) holds |Z| at ${si(lowEdge.magnitude, "Ω")} at the band's low edge ${si(lowEdge.hertz, "Hz")}, over the target ${si(target.ohms, "Ω")}; use a low-ESR part, give its ESR field if the datasheet's figure is lower, or add a ceramic of at least ${si(neededFarads, "F")} beside it.`
      : `no bulk capacitance for the low end — |Z| is ${si(lowEdge.magnitude, "Ω")} (capacitive) at the band's low edge ${si(lowEdge.hertz, "Hz")}, over the target ${si(target.ohms, "Ω")}; at least ${si(neededFarads, "F")} is needed there.`;
    findings.push(finding(ctx, ID, {
      at: largest?.part ?? anchor,
      severity: "warning",
      message: `Rail ${rail.net}: ${cause}${suggestionText(ctx, bulk, target.ohms)}`,
      parts: capParts,
      nets: [rail.net],
      data: { lowEdgeOhms: lowEdge.magnitude, atHertz: lowEdge.hertz, targetOhms: target.ohms, neededFarads, esrLimited, ...suggestionData(bulk) },
    }));
  }

  return findings;
}

export const railBypass: Rule<Context> = {
  id: ID,
  title: "Supply rails are bypassed to ground across the band",
  severity: "warning",
  doc,
  options,
  tags: ["rf", "supply"],
  check(ctx, opts) {
    const configured = numberOption(opts, "targetOhms", 0);
    const ratio = numberOption(opts, "loadRatio", 100);
    const rails: CheckedRail[] = [...ctx.rails(), ...ctx.unresolvedRails().map((net) => ({ net, volts: undefined }))];
    return rails.flatMap((rail) => checkRail(ctx, rail, configured, ratio));
  },
};

