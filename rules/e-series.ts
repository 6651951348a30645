/**
 * e-series — every resistor value (capacitors and inductors when asked) is a preferred number of
 * the configured IEC 60063 series, and an odd value comes with the neighbour that disturbs the bias
 * least.
 *
 * ## What it checks
 * Each fitted resistor's value against the series configured for resistors (`series.resistor`,
 * E24 unless set); capacitors against `series.capacitor` when `series.capacitorCheck` is true, and
 * inductors against `series.inductor` when the `inductors` option is on. A tolerance in the Value or
 * a Tolerance field that belongs to a finer series is respected: a 1 % resistor may be any E96
 * value, so it is checked (and corrected) against E96. For a value that is not a member, the DC
 * operating point is re-solved with each of the two neighbouring members in its place, and the
 * one that moves the transistors' VCE and IC (VDS and ID) least, relatively, is proposed — not
 * simply the nearer one. The proposal is carried as a fix edit (written in the board's own style,
 * `7k5` beside `4k7`), and the operating point with every proposed value fitted together is
 * reported as well, since `loadline fix` applies them together.
 *
 * ## Why it matters
 * A value outside the series has to be made from two parts, ordered specially, or is quietly
 * swapped for the nearest stock value at assembly — and "nearest" is not always the value that keeps
 * the stage where it was designed: a bias divider snapped the wrong way can move a cascode's upper
 * VCE by a quarter. Knowing the shift before the swap is the difference between a design and a guess.
 *
 * ## Example
 * A 9 V cascode designed with a 51 k/25 k/14 k divider, 700 Ω emitter and 3.3 kΩ collector
 * resistor: 25 k, 14 k and 700 Ω are not E24 values. The rule proposes 24 k, 15 k and 680 Ω; with all
 * three fitted the solver gives VCE1 2.43 → 2.33 V, VCE2 3.12 → 2.73 V and IC1 0.866 → 0.995 mA
 * (2N3904 card), as ngspice does.
 *
 * ## References
 * IEC 60063:2015, Preferred number series for resistors and capacitors (tables as compiled in the
 * project's reference notes); series/tolerance pairing E12 10 %, E24 5 %, E96 1 % as tabulated with
 * the standard. Judging nearness on a ratio scale because the series are geometric: common practice.
 */
import type { Part } from "../src/circuit/types.js";
import { rewriteValueText } from "../src/circuit/value.js";
import type { Context, DeviceOperatingPoint, OperatingPoint } from "../src/engine/context.js";
import type { ESeriesName } from "../src/engine/config.js";
import type { Rule } from "../src/engine/rule.js";
import type { Finding, FindingData, FixEdit, RuleDoc } from "../src/engine/types.js";
import { E_SERIES_NAMES, isInSeries, neighbours, seriesForTolerance } from "../src/solve/eseries.js";
import { byRef, finding, si } from "./support.js";

const ID = "e-series";

const doc: RuleDoc = {
  what:
    "Checks every fitted resistor's value against the IEC 60063 series configured for resistors (E24 unless series.resistor says otherwise); capacitors too when series.capacitorCheck is true, inductors when the inductors option is on. A tolerance belonging to a finer series is respected (a 1 % part may be any E96 value). For a value outside the series it re-solves the DC operating point with each neighbouring member in its place and proposes the one that moves the transistors' VCE and IC (VDS and ID) least, as a fix edit written in the board's own style, and reports the operating point with every proposed value fitted together.",
  why:
    "A value outside the series has to be built from two parts or ordered specially, or it is swapped for the nearest stock value at assembly without anyone checking what that does. The nearer value is not always the kinder one: snapping a bias divider the wrong way can move a cascode's upper VCE by a quarter. The shift should be known before the swap.",
  fix:
    "Apply the proposed value (loadline fix does it in place) after reading the operating-point shift it causes; if the shift is too large for the design, combine two series values or use a finer series part (and state its tolerance on the part, e.g. 1 %).",
  references: [
    "IEC 60063:2015, Preferred number series for resistors and capacitors (E3–E192 tables, as compiled in the project's reference notes)",
    "Series/tolerance pairing (E12 10 %, E24 5 %, E48 2 %, E96 1 %, E192 0.5 % and tighter): tables published with the standard",
    "Nearness judged by ratio, as the series are geometric: common practice",
  ],
  example:
    "9 V cascode, divider 51 k/25 k/14 k, RE 700 Ω, RC 3.3 kΩ, 2N3904 card: 25 k, 14 k and 700 Ω are not E24. Proposed 24 k, 15 k and 680 Ω; all three fitted move VCE1 2.43 → 2.33 V, VCE2 3.12 → 2.73 V and IC1 0.866 → 0.995 mA, as ngspice gives.",
};

const options = {
  inductors: {
    type: "boolean" as const,
    default: false,
    description: "Also check inductor values, against series.inductor (off by default: many chokes come in other value sets).",
  },
};

type CheckedKind = "resistor" | "capacitor" | "inductor";

interface Odd {
  part: Part;
  kind: CheckedKind;
  value: number;
  /** The series the value is checked and corrected against. */
  series: ESeriesName;
  /** Why that series: "configured" or the tolerance that chose it. */
  seriesBasis: string;
  below: number;
  above: number;
}

/** One device figure pair: VCE and IC of a bipolar transistor, VDS and ID of a FET channel. */
interface DeviceFigures {
  name: string;
  volts: number;
  amps: number;
  voltsLabel: "VCE" | "VDS";
  ampsLabel: "IC" | "ID";
}

/** Relative changes below these floors are measured against the floor, so a device near cut-off
 * (IC ≈ 0) cannot dominate the choice with an enormous ratio. Our choice. */
const VOLTS_FLOOR = 10e-3;
const AMPS_FLOOR = 1e-6;

function kindOf(part: Part): CheckedKind | undefined {
  if (part.kind === "resistor") return "resistor";
  if (part.kind === "capacitor" || part.kind === "polarized-capacitor") return "capacitor";
  if (part.kind === "inductor") return "inductor";
  return undefined;
}

function finer(a: ESeriesName, b: ESeriesName): ESeriesName {
  return E_SERIES_NAMES.indexOf(a) >= E_SERIES_NAMES.indexOf(b) ? a : b;
}

function oddValues(ctx: Context, checkInductors: boolean): Odd[] {
  const out: Odd[] = [];
  for (const part of ctx.circuit.parts) {
    if (part.dnp) continue;
    const kind = kindOf(part);
    if (kind === undefined) continue;
    if (kind === "capacitor" && !ctx.config.series.capacitorCheck) continue;
    if (kind === "inductor" && !checkInductors) continue;
    const value = part.parsed.number;
    // Zero-ohm links and unreadable values are not preferred numbers; the reader reports the latter.
    if (value === undefined || !(value > 0) || !Number.isFinite(value)) continue;
    const configured = ctx.config.series[kind];
    const tolerance = part.parsed.tolerance;
    const bySeries = tolerance !== undefined ? seriesForTolerance(tolerance) : undefined;
    const series = bySeries !== undefined ? finer(configured, bySeries) : configured;
    if (isInSeries(value, configured, 1e-6) || isInSeries(value, series, 1e-6)) continue;
    const { below, above } = neighbours(value, series);
    if (!Number.isFinite(below) || !Number.isFinite(above)) continue;
    const seriesBasis = series === configured
      ? ctx.config.defaulted.includes(`series.${kind}`) ? `the default series for a ${kind}; set "series.${kind}" in loadline.json to change it` : `the series configured for a ${kind}`
      : `the series of its ${formatTolerance(tolerance ?? 0)} tolerance`;
    out.push({ part, kind, value, series, seriesBasis, below, above });
  }
  return out.sort((a, b) => byRef(a.part, b.part));
}

function formatTolerance(tol: number): string {
  return `${Number((tol * 100).toPrecision(3))} %`;
}

function figuresOf(point: OperatingPoint): DeviceFigures[] {
  const out: DeviceFigures[] = [];
  for (const [name, d] of Object.entries(point.devices)) {
    const f = figuresOfDevice(name, d);
    if (f) out.push(f);
  }
  return out.sort((a, b) => a.name.localeCompare(b.name, "en", { numeric: true }));
}

function figuresOfDevice(name: string, d: DeviceOperatingPoint): DeviceFigures | undefined {
  switch (d.kind) {
    case "bjt": return { name, volts: d.vce, amps: d.ic, voltsLabel: "VCE", ampsLabel: "IC" };
    case "jfet":
    case "mosfet": return { name, volts: d.vds, amps: d.id, voltsLabel: "VDS", ampsLabel: "ID" };
    case "diode": return undefined;
  }
}

interface Shift {
  /** Largest relative change of any device's VCE/IC (VDS/ID). */
  worst: number;
  /** The device and figure of that largest change ("Q2 VCE"). */
  worstWhat: string;
  after: DeviceFigures[];
}

function shiftBetween(before: DeviceFigures[], afterPoint: OperatingPoint): Shift {
  const after = figuresOf(afterPoint);
  let worst = 0;
  let worstWhat = "";
  for (const b of before) {
    const a = after.find((x) => x.name === b.name);
    if (!a) continue;
    const dv = Math.abs(a.volts - b.volts) / Math.max(Math.abs(b.volts), VOLTS_FLOOR);
    const di = Math.abs(a.amps - b.amps) / Math.max(Math.abs(b.amps), AMPS_FLOOR);
    if (dv > worst) { worst = dv; worstWhat = `${b.name} ${b.voltsLabel}`; }
    if (di > worst) { worst = di; worstWhat = `${b.name} ${b.ampsLabel}`; }
  }
  return { worst, worstWhat, after };
}

/** "Q1 VCE 2.43 → 2.33 V, IC 0.866 → 0.995 mA" for the devices that moved noticeably. */
function movesText(before: DeviceFigures[], after: DeviceFigures[]): string {
  const parts: string[] = [];
  for (const b of before) {
    const a = after.find((x) => x.name === b.name);
    if (!a) continue;
    const moved = Math.abs(a.volts - b.volts) / Math.max(Math.abs(b.volts), VOLTS_FLOOR) > 1e-3
      || Math.abs(a.amps - b.amps) / Math.max(Math.abs(b.amps), AMPS_FLOOR) > 1e-3;
    if (!moved) continue;
    parts.push(`${b.name} ${b.voltsLabel} ${si(b.volts, "V")} → ${si(a.volts, "V")}, ${b.ampsLabel} ${si(b.amps, "A")} → ${si(a.amps, "A")}`);
  }
  return parts.length > 0 ? parts.join("; ") : "no transistor's VCE/IC (VDS/ID) moves by more than 0.1 %";
}

const UNIT: Record<CheckedKind, string> = { resistor: "Ω", capacitor: "F", inductor: "H" };

function percent(x: number): string {
  return `${Number((x * 100).toPrecision(2))} %`;
}

interface Choice {
  odd: Odd;
  chosen: number;
  /** How it was chosen: by the operating point, or by ratio when the point could not tell. */
  by: "operating-point" | "nearest";
  why: string;
  data: FindingData;
}

function nearerByRatio(odd: Odd): number {
  return Math.abs(Math.log(odd.value / odd.below)) <= Math.abs(Math.log(odd.above / odd.value)) ? odd.below : odd.above;
}

function choose(ctx: Context, odd: Odd, base: OperatingPoint | undefined, before: DeviceFigures[]): Choice {
  const u = UNIT[odd.kind];
  const nearest = nearerByRatio(odd);
  const common: FindingData = { value: odd.value, series: odd.series, below: odd.below, above: odd.above };
  // Only resistors change the DC solution (capacitors are open, inductors short at DC).
  if (odd.kind !== "resistor" || !base || before.length === 0) {
    const reason = odd.kind !== "resistor" ? `a ${odd.kind} does not set the DC operating point`
      : !base ? `no operating point (${ctx.operatingPointProblem() ?? "not solved"})` : "no transistor in the solution";
    return { odd, chosen: nearest, by: "nearest", why: `the nearer by ratio (${reason})`, data: { ...common, chosenBy: "nearest" } };
  }
  const tries = [odd.below, odd.above].map((candidate) => {
    const point = ctx.operatingPointWith({ [odd.part.ref]: candidate });
    return { candidate, shift: point ? shiftBetween(before, point) : undefined };
  });
  const [low, high] = tries;
  if (!low?.shift || !high?.shift) {
    const failed = tries.filter((t) => !t.shift).map((t) => si(t.candidate, u)).join(" and ");
    ctx.noteLimited(ID, `the operating point did not converge with ${odd.part.ref} = ${failed}`, [odd.part.ref]);
    const usable = tries.find((t) => t.shift);
    const chosen = usable?.candidate ?? nearest;
    return { odd, chosen, by: "nearest", why: `the only neighbour the operating point could be solved with`, data: { ...common, chosenBy: "nearest" } };
  }
  // Within 1e-6 relative the two are the same to the design; the nearer by ratio then decides.
  const tie = Math.abs(low.shift.worst - high.shift.worst) <= 1e-6;
  const best = tie ? (nearest === odd.below ? low : high) : low.shift.worst < high.shift.worst ? low : high;
  const other = best === low ? high : low;
  const bestShift = best.shift ?? low.shift;
  const otherShift = other.shift ?? high.shift;
  const why = tie
    ? `both neighbours leave the operating point the same (within ${percent(1e-6)}), so the nearer by ratio`
    : `it moves the operating point least: ${movesText(before, bestShift.after)} (largest shift ${percent(bestShift.worst)}, ${bestShift.worstWhat}); ${si(other.candidate, u)} would move it ${percent(otherShift.worst)} (${otherShift.worstWhat})`;
  const data: FindingData = {
    ...common,
    chosenBy: tie ? "nearest" : "operating-point",
    devices: before.map((d) => d.name),
    beforeVolts: before.map((d) => d.volts),
    beforeAmps: before.map((d) => d.amps),
    belowVolts: before.map((d) => low.shift?.after.find((x) => x.name === d.name)?.volts ?? Number.NaN),
    belowAmps: before.map((d) => low.shift?.after.find((x) => x.name === d.name)?.amps ?? Number.NaN),
    aboveVolts: before.map((d) => high.shift?.after.find((x) => x.name === d.name)?.volts ?? Number.NaN),
    aboveAmps: before.map((d) => high.shift?.after.find((x) => x.name === d.name)?.amps ?? Number.NaN),
    belowShift: low.shift.worst,
    aboveShift: high.shift.worst,
  };
  return { odd, chosen: best.candidate, by: tie ? "nearest" : "operating-point", why, data };
}

function fixFor(odd: Odd, chosen: number): FixEdit | undefined {
  const span = odd.part.valueSpan;
  if (!span) return undefined;
  const replacement = rewriteValueText(chosen, odd.part.kind, odd.part.parsed);
  return { span, replacement, description: `${odd.part.ref} ${odd.part.value} -> ${replacement}` };
}

export const eSeries: Rule<Context> = {
  id: ID,
  title: "Part values are IEC 60063 preferred numbers",
  severity: "warning",
  doc,
  options,
  tags: ["values"],
  check(ctx, opts) {
    const odds = oddValues(ctx, opts.inductors === true);
    if (odds.length === 0) return [];
    const base = ctx.operatingPoint();
    const before = base ? figuresOf(base) : [];
    const choices = odds.map((odd) => choose(ctx, odd, base, before));

    // Every proposed resistor value fitted together: what `loadline fix` would leave the board at.
    const resistorChoices = choices.filter((c) => c.odd.kind === "resistor");
    const together: Record<string, number> = {};
    for (const c of resistorChoices) together[c.odd.part.ref] = c.chosen;
    const combined = base && before.length > 0 && resistorChoices.length > 1 ? ctx.operatingPointWith(together) : undefined;
    const combinedFigures = combined ? figuresOf(combined) : undefined;

    const findings: Finding[] = [];
    for (const c of choices) {
      const { odd } = c;
      const u = UNIT[odd.kind];
      const fix = fixFor(odd, c.chosen);
      const data: FindingData = { ...c.data, chosen: c.chosen, hasFix: fix !== undefined };
      if (!fix) data.noFixReason = "the design was read from a netlist, which cannot be edited in place; change the value in the schematic";
      let togetherText = "";
      if (combinedFigures && odd.kind === "resistor") {
        togetherText = ` With every proposed value fitted together (${resistorChoices.map((x) => `${x.odd.part.ref} ${si(x.chosen, "Ω")}`).join(", ")}): ${movesText(before, combinedFigures)}.`;
        data.combinedVolts = before.map((d) => combinedFigures.find((x) => x.name === d.name)?.volts ?? Number.NaN);
        data.combinedAmps = before.map((d) => combinedFigures.find((x) => x.name === d.name)?.amps ?? Number.NaN);
      }
      const fixText = fix ? "" : " (no automatic fix: the design was read from a netlist; change it in the schematic)";
      findings.push(finding(ctx, ID, {
        at: odd.part,
        severity: "warning",
        message: `${odd.part.ref} ${si(odd.value, u)} is not an ${odd.series} value (${odd.seriesBasis}); its neighbours are ${si(odd.below, u)} and ${si(odd.above, u)}. Use ${si(c.chosen, u)}: ${c.why}.${togetherText}${fixText}`,
        parts: [odd.part.ref],
        nets: Object.values(odd.part.pins),
        data,
        ...(fix ? { fix } : {}),
      }));
    }
    return findings;
  },
};
