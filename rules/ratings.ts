/**
 * ratings — no part is used beyond its ratings at the operating point: electrolytics the right way
 * round, capacitor voltages, resistor dissipation, and transistor and diode limits, each with a
 * derating margin.
 *
 * ## What it checks
 * At the DC operating point:
 * - every polarized capacitor (aluminium or tantalum electrolytic) has its + terminal at or above its
 *   − terminal; reversed by more than 0.1 V (unless set) is an error;
 * - every capacitor with a voltage rating (in its Value, `10u 25V`, or a Voltage field) has its DC
 *   voltage within the rating: above the derated figure (80 % unless set) a warning, above the
 *   rating an error;
 * - every resistor's dissipation V²/R within its power rating — from the Value or a Power field, else
 *   by footprint size (0402 1/16 W, 0603 1/10 W, 0805 1/8 W, 1206 1/4 W, through-hole 1/4 W), else an
 *   assumed 0.1 W — above the derated figure (50 % unless set) a warning, above the rating an error;
 * - every transistor's VCE, VCB, IC and dissipation (FET: VDS, ID, dissipation; JFET: reverse VGS)
 *   and every diode's reverse voltage, forward current and (zener) dissipation against the absolute
 *   maximum ratings the parts library holds for it, with the same margins.
 * Ratings are the datasheets' 25 °C figures; parts without known ratings are listed by
 * `model-coverage`.
 *
 * ## Why it matters
 * A reversed electrolytic conducts, heats and can vent; one run near its rated voltage ages fast. A
 * resistor at its full rating runs at 70 °C or more above ambient and drifts; a transistor near
 * VCEO or its dissipation limit fails at the first warm day or supply transient. None of these show
 * in a small-signal simulation — they show in the field.
 *
 * ## Example
 * A 9 V stage with a "10u 6.3V" electrolytic from the rail to ground: 9 V across a 6.3 V part, an
 * error. A 1 kΩ 0603 resistor with 12 V across it takes 144 mW against 1/10 W, an error; the same in
 * 1206 (1/4 W) is a warning at 58 % of its rating.
 *
 * ## References
 * Voltage derating of capacitors to about 80 % and power derating of resistors to about 50 % of their
 * ratings: common practice in reliability derating guidelines. Chip resistor ratings by case size:
 * the usual thick-film figures at 70 °C, common practice. Absolute maximum ratings: the device
 * datasheets (2N3904 VCEO 40 V, 625 mW; 2N7000 VDSS 60 V, 200 mA, 400 mW; J310 25 V; 1N4148 100 V,
 * 200 mA), as compiled in the project's reference notes §4.
 */
import type { Part } from "../src/circuit/types.js";
import type { Context, DeviceOperatingPoint, PartRatings } from "../src/engine/context.js";
import type { Rule } from "../src/engine/rule.js";
import type { Finding, FindingData, RuleDoc } from "../src/engine/types.js";
import { byRef, finding, numberOption, si } from "./support.js";

const ID = "ratings";

const doc: RuleDoc = {
  what:
    "At the DC operating point: every polarized capacitor with + at or above − (reversed by more than 0.1 V is an error); every capacitor with a voltage rating (Value or Voltage field) inside it, with a warning above the derated figure (80 %) and an error above the rating; every resistor's V²/R inside its power rating (Value or Power field, else by footprint: 0402 1/16 W, 0603 1/10 W, 0805 1/8 W, 1206 1/4 W, through-hole 1/4 W, else 0.1 W assumed), warning above 50 %, error above 100 %; and every transistor's VCE, VCB, IC and dissipation (VDS, ID, dissipation; a JFET's reverse VGS) and every diode's reverse voltage, forward current and zener dissipation against the parts library's absolute maximum ratings, with the same margins.",
  why:
    "A reversed electrolytic conducts, heats and can vent, and one run near its rated voltage ages fast. A resistor at its full rating runs 70 °C or more above ambient and drifts; a transistor near VCEO or its dissipation limit fails on the first warm day or supply transient. A small-signal simulation shows none of it; the field does.",
  fix:
    "Turn a reversed electrolytic round (its + toward the higher DC voltage) or use a non-polarized part; choose a capacitor rated well above its DC voltage; use a larger resistor package or a higher resistance, or share the power between two parts; for a transistor, lower the supply or the current, or choose a part with higher ratings. Where the margin is a deliberate choice, set the derating options in loadline.json.",
  references: [
    "Capacitor voltage derated to about 80 %, resistor power to about 50 % of rating: common practice in reliability derating guidelines",
    "Chip resistor power by case size (0402 1/16 W, 0603 1/10 W, 0805 1/8 W, 1206 1/4 W) and 1/4 W through-hole parts: the usual thick-film figures at 70 °C, common practice",
    "Absolute maximum ratings at 25 °C: device datasheets (2N3904 VCEO 40 V, IC 200 mA, 625 mW; 2N7000 VDSS 60 V, 200 mA, 400 mW; J310 V(BR)GSS 25 V; 1N4148 VRRM 100 V, 200 mA), as compiled in the project's reference notes §4",
    "Reverse voltage on aluminium electrolytics: at most about 1 V and not continuously (common practice); 0.1 V as the reporting threshold is ours",
  ],
  example:
    "A \"10u 6.3V\" electrolytic across a 9 V rail: an error. A 1 kΩ 0603 resistor with 12 V across it takes 144 mW against 1/10 W, an error; in a 1206 (1/4 W) it is a warning at 58 % of the rating.",
};

const options = {
  reverseVolts: {
    type: "number" as const,
    default: 0.1,
    unit: "V",
    description: "Reverse DC voltage on a polarized capacitor above which it is reported.",
  },
  voltageDerating: {
    type: "number" as const,
    default: 0.8,
    description: "Fraction of a voltage rating (capacitors, transistor and diode voltages) above which a warning is given.",
  },
  powerDerating: {
    type: "number" as const,
    default: 0.5,
    description: "Fraction of a power rating (resistors, transistors, zeners) above which a warning is given.",
  },
  currentDerating: {
    type: "number" as const,
    default: 0.8,
    description: "Fraction of a current rating (collector, drain, diode forward current) above which a warning is given.",
  },
  unknownResistorWatts: {
    type: "number" as const,
    default: 0.1,
    description: "Power rating assumed for a resistor with no rating and no recognised footprint, in watts.",
  },
};

const ELECTROLYTIC_CAUTION = "A reversed or over-voltage electrolytic can overheat and vent: correct it before powering the board.";

interface Derating {
  voltage: number;
  power: number;
  current: number;
}

/** One measured figure against its limit: nothing, a warning above the derated limit, an error above the limit. */
function judge(value: number, limit: number, derating: number): "error" | "warning" | undefined {
  if (!(limit > 0)) return undefined;
  if (value > limit * (1 + 1e-9)) return "error";
  if (value > limit * derating * (1 + 1e-9)) return "warning";
  return undefined;
}

function percentOf(value: number, limit: number): string {
  return `${Math.round((value / limit) * 100)} %`;
}

function twoNets(part: Part, first: string, second: string): [string, string] | undefined {
  const a = part.pins[part.roles[first] ?? ""];
  const b = part.pins[part.roles[second] ?? ""];
  return a !== undefined && b !== undefined ? [a, b] : undefined;
}

function capacitorFindings(ctx: Context, part: Part, reverseVolts: number, derating: Derating): Finding[] {
  const polarized = part.kind === "polarized-capacitor";
  const nets = polarized ? twoNets(part, "+", "-") : twoNets(part, "1", "2");
  if (!nets) return [];
  const va = ctx.voltage(nets[0]);
  const vb = ctx.voltage(nets[1]);
  if (va === undefined || vb === undefined) return [];
  const across = va - vb;
  const out: Finding[] = [];
  if (polarized && across < -reverseVolts) {
    out.push(finding(ctx, ID, {
      at: part,
      severity: "error",
      message: `${part.ref} (${part.value}) is reverse-biased at the operating point: its + terminal (${nets[0]}, ${si(va, "V")}) is ${si(-across, "V")} below its − terminal (${nets[1]}, ${si(vb, "V")}). Turn it round or use a non-polarized capacitor. ${ELECTROLYTIC_CAUTION}`,
      parts: [part.ref],
      nets,
      data: { reverseVolts: -across, plusVolts: va, minusVolts: vb, thresholdVolts: reverseVolts },
    }));
  }
  const rating = part.parsed.voltageRating;
  if (rating !== undefined) {
    const level = judge(Math.abs(across), rating, derating.voltage);
    if (level) {
      const caution = polarized ? ` ${ELECTROLYTIC_CAUTION}` : "";
      out.push(finding(ctx, ID, {
        at: part,
        severity: level,
        message: `${part.ref} (${part.value}) has ${si(Math.abs(across), "V")} DC across it, ${percentOf(Math.abs(across), rating)} of its ${si(rating, "V")} rating${level === "error" ? ", beyond it" : `, above the ${Math.round(derating.voltage * 100)} % derating`}. Use a part rated for at least ${si(Math.abs(across) / derating.voltage, "V")}.${caution}`,
        parts: [part.ref],
        nets,
        data: { volts: Math.abs(across), ratedVolts: rating, derating: derating.voltage, fraction: Math.abs(across) / rating },
      }));
    }
  }
  return out;
}

function resistorFinding(ctx: Context, part: Part, derating: Derating, unknownWatts: number): Finding | undefined {
  const watts = ctx.dissipation(part.ref);
  const rating = ctx.resistorPowerRating(part.ref, unknownWatts);
  if (watts === undefined || !rating) return undefined;
  const level = judge(watts, rating.watts, derating.power);
  if (!level) return undefined;
  const needed = watts / derating.power;
  return finding(ctx, ID, {
    at: part,
    severity: level,
    message: `${part.ref} (${part.value}) dissipates ${si(watts, "W")} at the operating point, ${percentOf(watts, rating.watts)} of its ${si(rating.watts, "W")} rating (${rating.basis})${level === "error" ? ", beyond its rating" : `, above the ${Math.round(derating.power * 100)} % derating`}. Use a part rated for at least ${si(needed, "W")} (a larger package), or a higher resistance if the circuit allows.`,
    parts: [part.ref],
    nets: Object.values(part.pins),
    data: { watts, ratedWatts: rating.watts, ratingAssumed: rating.assumed, derating: derating.power, fraction: watts / rating.watts, ratingBasis: rating.basis },
  });
}

interface Check {
  what: string;
  value: number;
  limit: number | undefined;
  derating: number;
  unit: string;
  key: string;
}

/** The figures of a device at its operating point against its ratings (practitioner signs). */
function deviceChecks(device: DeviceOperatingPoint, r: PartRatings, totalPower: number, d: Derating, part: Part): Check[] {
  switch (device.kind) {
    case "bjt":
      return [
        { what: "VCE", value: device.vce, limit: r.vceo, derating: d.voltage, unit: "V", key: "vce" },
        { what: "VCB", value: device.vcb, limit: r.vcbo, derating: d.voltage, unit: "V", key: "vcb" },
        { what: "reverse VBE", value: -device.vbe, limit: r.vebo, derating: d.voltage, unit: "V", key: "vebReverse" },
        { what: "IC", value: device.ic, limit: r.icMax, derating: d.current, unit: "A", key: "ic" },
        { what: "dissipation", value: totalPower, limit: r.ptot, derating: d.power, unit: "W", key: "watts" },
      ];
    case "jfet":
      return [
        { what: "VDS", value: Math.abs(device.vds), limit: r.vds, derating: d.voltage, unit: "V", key: "vds" },
        { what: "reverse VGS", value: -device.vgs, limit: r.vgsMax, derating: d.voltage, unit: "V", key: "vgsReverse" },
        { what: "ID", value: device.id, limit: r.idMax, derating: d.current, unit: "A", key: "id" },
        { what: "gate current", value: device.ig, limit: r.igMax, derating: d.current, unit: "A", key: "ig" },
        { what: "dissipation", value: totalPower, limit: r.ptot, derating: d.power, unit: "W", key: "watts" },
      ];
    case "mosfet":
      return [
        { what: part.kind === "dual-gate-mosfet" ? "VDS (both channels)" : "VDS", value: Math.abs(device.vds), limit: r.vds, derating: d.voltage, unit: "V", key: "vds" },
        { what: "ID", value: device.id, limit: r.idMax, derating: d.current, unit: "A", key: "id" },
        { what: "dissipation", value: totalPower, limit: r.ptot, derating: d.power, unit: "W", key: "watts" },
      ];
    case "diode": {
      const zener = part.kind === "zener";
      return [
        ...(zener ? [] : [{ what: "reverse voltage", value: -device.vd, limit: r.vrrm, derating: d.voltage, unit: "V", key: "vReverse" }]),
        { what: "forward current", value: device.id, limit: r.ifMax, derating: d.current, unit: "A", key: "ifwd" },
        { what: "dissipation", value: totalPower, limit: r.ptot, derating: d.power, unit: "W", key: "watts" },
      ];
    }
  }
}

/** A dual-gate MOSFET seen whole: VDS from drain to source across both channels, ID of the string. */
function wholeDevice(ctx: Context, part: Part): DeviceOperatingPoint | undefined {
  if (part.kind !== "dual-gate-mosfet") return ctx.device(part.ref);
  const top = ctx.device(part.ref, "g2");
  const drain = ctx.netOf(part.ref, "D");
  const source = ctx.netOf(part.ref, "S");
  const vd = drain === undefined ? undefined : ctx.voltage(drain);
  const vs = source === undefined ? undefined : ctx.voltage(source);
  if (!top || top.kind !== "mosfet" || vd === undefined || vs === undefined) return undefined;
  return { ...top, vds: vd - vs };
}

function deviceFindings(ctx: Context, part: Part, derating: Derating): Finding[] {
  const ratings = ctx.rating(part.ref);
  const device = wholeDevice(ctx, part);
  if (!ratings || !device) return [];
  const power = ctx.dissipation(part.ref) ?? device.power;
  const out: Finding[] = [];
  for (const check of deviceChecks(device, ratings, power, derating, part)) {
    if (check.limit === undefined) continue;
    const level = judge(check.value, check.limit, check.derating);
    if (!level) continue;
    const data: FindingData = { [check.key]: check.value, limit: check.limit, derating: check.derating, fraction: check.value / check.limit, ratingSource: ratings.source };
    out.push(finding(ctx, ID, {
      at: part,
      severity: level,
      message: `${part.ref} (${part.value}) runs at ${check.what} ${si(check.value, check.unit)} at the operating point, ${percentOf(check.value, check.limit)} of its ${si(check.limit, check.unit)} absolute maximum${level === "error" ? ", beyond it" : `, above the ${Math.round(check.derating * 100)} % derating`} (the parts library's 25 °C rating). Lower the ${check.unit === "W" ? "supply or the current" : check.unit === "A" ? "current" : "voltage"} or choose a part with higher ratings.`,
      parts: [part.ref],
      nets: Object.values(part.pins),
      data,
    }));
  }
  return out;
}

const DEVICE_KINDS = new Set(["npn", "pnp", "njfet", "pjfet", "nmos", "pmos", "dual-gate-mosfet", "diode", "zener"]);

export const ratings: Rule<Context> = {
  id: ID,
  title: "Parts stay inside their ratings at the operating point",
  severity: "warning",
  doc,
  options,
  tags: ["ratings", "reliability"],
  check(ctx, opts) {
    const derating: Derating = {
      voltage: numberOption(opts, "voltageDerating", 0.8),
      power: numberOption(opts, "powerDerating", 0.5),
      current: numberOption(opts, "currentDerating", 0.8),
    };
    const reverseVolts = numberOption(opts, "reverseVolts", 0.1);
    const unknownWatts = numberOption(opts, "unknownResistorWatts", 0.1);
    const parts = ctx.circuit.parts.filter((p) => !p.dnp).sort(byRef);
    if (!ctx.operatingPoint()) {
      const checked = parts.filter((p) => p.kind === "polarized-capacitor" || p.kind === "resistor" || DEVICE_KINDS.has(p.kind));
      if (checked.length > 0) ctx.noteLimited(ID, `no operating point (${ctx.operatingPointProblem() ?? "not solved"}): ratings not checked`, checked.map((p) => p.ref));
      return [];
    }
    const findings: Finding[] = [];
    const unrated: string[] = [];
    for (const part of parts) {
      if (part.kind === "capacitor" || part.kind === "polarized-capacitor") findings.push(...capacitorFindings(ctx, part, reverseVolts, derating));
      else if (part.kind === "resistor") {
        const f = resistorFinding(ctx, part, derating, unknownWatts);
        if (f) findings.push(f);
      } else if (DEVICE_KINDS.has(part.kind)) {
        if (!ctx.rating(part.ref) && ctx.device(part.ref) !== undefined) unrated.push(part.ref);
        findings.push(...deviceFindings(ctx, part, derating));
      }
    }
    if (unrated.length > 0) ctx.noteLimited(ID, "no absolute maximum ratings known for parts outside the built-in library: device limits not checked", unrated);
    return findings;
  },
};
