/**
 * bias-centre — an amplifying device is in its active region, and a common-emitter or
 * common-source stage sits near the middle of its DC load line.
 *
 * ## What it checks
 * Every transistor the topology shows as an amplifier (common emitter/base/collector, common
 * source/gate/drain, both channels of a dual-gate MOSFET) must be in its amplifying region at the
 * operating point: forward-active for a bipolar device, saturation (pinch-off) for a FET. A device
 * in saturation, cut-off or reverse (triode or cut-off for a FET) is an error. For a common-emitter
 * or common-source stage with a resistive collector (drain) load, the quiescent VCE (VDS) is placed
 * on its DC load line, between the saturation edge (VCE(sat), or VDS(sat) = VGS − VTO) and the
 * cut-off end (the load's supply less the potential the emitter or source network returns to); a
 * position outside the allowed fraction of that span (25 %–75 % unless set) is a warning, with the
 * collector resistor that would centre it at the same current. A device whose base or gate is
 * driven over a DC path from a logic IC or a connector is taken as a switch (or biased from off the
 * board) and not judged.
 *
 * ## Why it matters
 * A stage biased near one end of its load line clips one half of the waveform long before the
 * other: near saturation the negative peaks flatten, near cut-off the positive ones, and the
 * asymmetry shows up as even-order distortion and a gain that moves with signal level. A device
 * sitting in saturation or cut-off does not amplify at all — a common result of a divider resistor
 * in the wrong place, a swapped value or an open bias path.
 *
 * ## Example
 * A 9 V common-emitter stage, divider 56 k/10 k, RE 680 Ω, 2N3904: IC 0.94 mA, VCE 4.69 V, about
 * half way along its 0.2–9 V span — no finding. With RC raised from 3.9 kΩ to 8.2 kΩ, VCE falls to
 * 0.71 V, 6 % of the span: a warning, and about 4.0 kΩ (3.9 kΩ in E24) would centre it.
 *
 * ## References
 * DC load line and the mid-point (centred) Q point: R. L. Boylestad and L. Nashelsky, Electronic
 * Devices and Circuit Theory, ch. 4; A. P. Malvino and D. J. Bates, Electronic Principles.
 * Operating regions of the bipolar transistor (Ebers–Moll) and the FET (Shichman–Hodges).
 * The 25 %–75 % window: common practice, our default.
 */
import type { Part } from "../src/circuit/types.js";
import type { Context, DeviceOperatingPoint } from "../src/engine/context.js";
import type { Stage } from "../src/engine/context-types.js";
import { otherNet, terminalsOf } from "../src/engine/context-topology.js";
import type { Rule } from "../src/engine/rule.js";
import type { Finding, RuleDoc } from "../src/engine/types.js";
import { finding, numberOption, si } from "./support.js";

const ID = "bias-centre";

const doc: RuleDoc = {
  what:
    "Every transistor used as an amplifier (common emitter/base/collector, common source/gate/drain, both channels of a dual-gate MOSFET) must be in its amplifying region at the operating point — forward-active for a bipolar device, saturation (pinch-off) for a FET; saturation, cut-off or reverse (triode or cut-off) is an error. A common-emitter or common-source stage with a resistive load is placed on its DC load line, between the saturation edge (VCE(sat), or VDS(sat) = VGS − VTO) and the cut-off end (the load's supply less what the emitter or source network returns to); outside the allowed fraction of that span (25 %–75 % by default) is a warning, with the load resistor that would centre it at the same current. A device whose base or gate is DC-driven from a logic IC or a connector is taken as a switch and not judged.",
  why:
    "A stage biased near one end of its load line clips one half of the waveform long before the other: near saturation the negative peaks flatten, near cut-off the positive ones, and the asymmetry appears as even-order distortion and a gain that moves with signal level. A device in saturation or cut-off does not amplify at all — usually a divider resistor in the wrong place, a swapped value or an open bias path.",
  fix:
    "Move the bias point: change the collector (drain) resistor toward the value given, or the emitter resistor or divider that sets the current. For a device in the wrong region, check the bias network's values and connections first.",
  references: [
    "DC load line and the mid-point Q point: R. L. Boylestad and L. Nashelsky, Electronic Devices and Circuit Theory, ch. 4",
    "Centring the Q point on the load line: A. P. Malvino and D. J. Bates, Electronic Principles",
    "Operating regions: Ebers–Moll (bipolar) and Shichman–Hodges (FET) models",
    "The 25 %–75 % window: common practice, our default",
  ],
  example:
    "9 V common-emitter stage, divider 56 k/10 k, RE 680 Ω, 2N3904: IC 0.94 mA, VCE 4.69 V, about half way along its 0.2–9 V span, no finding. With RC 8.2 kΩ instead of 3.9 kΩ, VCE falls to 0.71 V, 6 % of the span: a warning, and about 4.0 kΩ (3.9 kΩ in E24) would centre it.",
};

const options = {
  low: {
    type: "number" as const,
    default: 0.25,
    description: "Lowest allowed position on the load line, as a fraction from the saturation edge (0) to cut-off (1).",
  },
  high: {
    type: "number" as const,
    default: 0.75,
    description: "Highest allowed position on the load line, as a fraction from the saturation edge (0) to cut-off (1).",
  },
};

/** A device whose base or gate is driven over a DC path from a part the checker does not model (a
 * logic IC) or from a connector is a switch or is biased from off the board: its region is set by a
 * control signal the operating point cannot know, so it is not judged as an amplifier. */
function drivenFromOutside(ctx: Context, stage: Stage): boolean {
  const t = terminalsOf(stage.part.kind);
  const controls = stage.type === "dual-gate-mosfet" ? ["G1", "G2"] : t ? [t.control] : [];
  return controls.some((role) => {
    const net = stage.nets[role];
    if (net === undefined || ctx.isSupply(net)) return false;
    return ctx.dcNetwork(net).nets.some((n) => !ctx.isSupply(n) && ctx.partsOn(n).some(({ part }) => part.kind === "other" || part.kind === "connector"));
  });
}

/** Figures at numerical-noise level read as zero: under a microvolt, under a picoampere. */
function shown(value: number, unit: string): string {
  return si(Math.abs(value) < (unit === "V" ? 1e-6 : 1e-12) ? 0 : value, unit);
}

const AMPLIFYING_BJT = new Set(["active"]);
const AMPLIFYING_FET = new Set(["saturation"]);

const REGION_TEXT: Record<string, string> = {
  saturation: "saturation",
  "cut-off": "cut-off",
  reverse: "reverse-active (collector and emitter swapped?)",
  triode: "the triode (ohmic) region",
};

function isAmplifying(device: DeviceOperatingPoint): boolean {
  if (device.kind === "bjt") return AMPLIFYING_BJT.has(device.region);
  if (device.kind === "jfet" || device.kind === "mosfet") return AMPLIFYING_FET.has(device.region);
  return true;
}

function regionFinding(ctx: Context, stage: Stage, device: DeviceOperatingPoint, channel: "g1" | "g2" | undefined): Finding {
  const who = channel ? `${stage.ref} (gate-${channel === "g1" ? "1" : "2"} channel)` : stage.ref;
  const region = device.kind === "diode" ? device.region : device.region;
  const figures = device.kind === "bjt"
    ? `VBE ${shown(device.vbe, "V")}, VCE ${shown(device.vce, "V")}, IC ${shown(device.ic, "A")}`
    : device.kind === "diode" ? "" : `VGS ${shown(device.vgs, "V")}, VDS ${shown(device.vds, "V")}, ID ${shown(device.id, "A")}`;
  const wanted = device.kind === "bjt" ? "forward-active" : "saturation (pinch-off)";
  const hint = region === "cut-off"
    ? "It carries no signal current: check that the base/gate bias reaches the device and the emitter/source returns to its supply."
    : "It has no gain left: check the collector/drain load and the bias divider for a value too large or in the wrong place.";
  return finding(ctx, ID, {
    at: stage.part,
    severity: "error",
    message: `${who}, a ${stage.configuration} stage, is in ${REGION_TEXT[region] ?? region} at the operating point (${figures}), not ${wanted} where it should amplify. ${hint}`,
    parts: [stage.ref],
    nets: Object.values(stage.nets),
    data: { region, configuration: stage.configuration, ...(channel ? { channel } : {}), ...numericFigures(device) },
  });
}

function numericFigures(device: DeviceOperatingPoint): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [k, v] of Object.entries(device)) if (typeof v === "number" && Number.isFinite(v) && ["vbe", "vce", "ic", "vgs", "vds", "id"].includes(k)) out[k] = v;
  return out;
}

/** The potential a node's DC network returns to: 0 when it reaches ground, a rail's volts when it
 * reaches only that rail, undefined when it reaches neither (or several rails and no ground). */
function returnPotential(ctx: Context, net: string): number | undefined {
  if (ctx.isGround(net)) return 0;
  const rail = ctx.rail(net);
  if (rail) return rail.volts;
  const reached = ctx.dcNetwork(net).nets.filter((n) => ctx.isSupply(n));
  if (reached.some((n) => ctx.isGround(n))) return 0;
  const volts = [...new Set(reached.map((n) => ctx.rail(n)?.volts).filter((v): v is number => v !== undefined))];
  return volts.length === 1 ? volts[0] : undefined;
}

interface LoadLine {
  load: Part;
  /** The supply the load returns to (its volts), and the potential at the other end of the device. */
  loadSupplyVolts: number;
  commonReturnVolts: number;
}

/** A resistive load line: the collector/drain resistor and both supplies, for an n-type stage fed
 * from a rail through its load, or a p-type stage whose load returns to ground. */
function loadLineOf(ctx: Context, stage: Stage): LoadLine | undefined {
  const t = terminalsOf(stage.part.kind);
  if (!t) return undefined;
  const output = stage.nets[t.output];
  const common = stage.nets[t.common];
  if (output === undefined || common === undefined || ctx.isSupply(output)) return undefined;
  const pType = stage.part.kind === "pnp" || stage.part.kind === "pjfet" || stage.part.kind === "pmos";
  const commonReturn = returnPotential(ctx, common);
  if (commonReturn === undefined) return undefined;
  if (!pType) {
    const path = ctx.supplyPath(output);
    const first = path?.parts[0];
    if (!path || first?.kind !== "resistor") return undefined;
    const rail = ctx.rail(path.rail);
    return rail ? { load: first, loadSupplyVolts: rail.volts, commonReturnVolts: commonReturn } : undefined;
  }
  const toGround = ctx.partsOn(output).find(({ part }) => part.kind === "resistor" && ctx.isGround(otherNet(part, output) ?? ""));
  return toGround ? { load: toGround.part, loadSupplyVolts: 0, commonReturnVolts: commonReturn } : undefined;
}

export const biasCentre: Rule<Context> = {
  id: ID,
  title: "Amplifying devices are biased in their active region, near the middle of the load line",
  severity: "warning",
  doc,
  options,
  tags: ["bias"],
  check(ctx, opts) {
    const low = numberOption(opts, "low", 0.25);
    const high = numberOption(opts, "high", 0.75);
    const stages = ctx.stages().filter((s) => s.configuration !== "unknown" && !drivenFromOutside(ctx, s));
    if (stages.length === 0) return [];
    if (!ctx.operatingPoint()) {
      ctx.noteLimited(ID, `no operating point (${ctx.operatingPointProblem() ?? "not solved"}): bias not checked`, stages.map((s) => s.ref));
      return [];
    }
    const findings: Finding[] = [];
    for (const stage of stages) {
      const channels: Array<"g1" | "g2" | undefined> = stage.type === "dual-gate-mosfet" ? ["g1", "g2"] : [undefined];
      let wrongRegion = false;
      for (const channel of channels) {
        const device = ctx.device(stage.ref, channel);
        if (!device) {
          ctx.noteLimited(ID, "a device has no operating point", [stage.ref]);
          continue;
        }
        if (!isAmplifying(device)) {
          wrongRegion = true;
          findings.push(regionFinding(ctx, stage, device, channel));
        }
      }
      if (wrongRegion) continue;
      if (stage.configuration !== "common-emitter" && stage.configuration !== "common-source") continue;
      if (stage.type === "dual-gate-mosfet") continue; // its drain swing is the gate-2 channel's: stack-headroom judges it
      const device = ctx.device(stage.ref);
      const edge = ctx.saturationEdge(stage.ref);
      const line = loadLineOf(ctx, stage);
      if (!device || device.kind === "diode" || !edge || !line) continue;
      const volts = device.kind === "bjt" ? device.vce : device.vds;
      const amps = device.kind === "bjt" ? device.ic : device.id;
      const label = device.kind === "bjt" ? "VCE" : "VDS";
      // Practitioner signs: the span is positive for n and p types alike.
      const cutoff = Math.abs(line.loadSupplyVolts - line.commonReturnVolts);
      const span = cutoff - edge.volts;
      if (!(span > 0)) continue;
      const fraction = (volts - edge.volts) / span;
      if (fraction >= low && fraction <= high) continue;
      const centre = edge.volts + span / 2;
      const loadOhms = line.load.parsed.number;
      // At the same current, the load drop that puts VCE at the centre: R' = R + (VCE − centre)/IC.
      const centringOhms = loadOhms !== undefined && amps > 0 ? loadOhms + (volts - centre) / amps : undefined;
      const bipolar = device.kind === "bjt";
      // "Saturation" means the amplifying region of a FET, so its low end is named the triode edge.
      const lowEdge = bipolar ? "the saturation edge" : "the triode (ohmic) edge, VDS(sat)";
      const end = fraction < low ? (bipolar ? "saturation" : "the triode region") : "cut-off";
      const clips = fraction < low ? "negative" : "positive";
      const series = ctx.config.series.resistor;
      const stock = centringOhms !== undefined && centringOhms > 0 ? ctx.snapNearest(centringOhms, series) : undefined;
      const suggestion = centringOhms !== undefined && centringOhms > 0
        ? ` At the same ${bipolar ? "IC" : "ID"} (${si(amps, "A")}), ${line.load.ref} of about ${si(centringOhms, "Ω")} (${si(stock ?? centringOhms, "Ω")} in ${series}) instead of ${si(loadOhms ?? 0, "Ω")} would centre it.`
        : "";
      findings.push(finding(ctx, ID, {
        at: stage.part,
        severity: "warning",
        message: `${stage.ref} (${stage.configuration}) sits at ${label} ${si(volts, "V")}, ${Math.round(fraction * 100)} % of the way along its load line from ${lowEdge} (${si(edge.volts, "V")}) to cut-off (${si(cutoff, "V")}), outside ${Math.round(low * 100)} %–${Math.round(high * 100)} %: it is close to ${end}, so the output's ${clips} peaks clip first.${suggestion}`,
        parts: [stage.ref, line.load.ref],
        nets: Object.values(stage.nets),
        data: {
          volts, amps, satVolts: edge.volts, cutoffVolts: cutoff, fraction, low, high, centreVolts: centre,
          ...(centringOhms !== undefined && centringOhms > 0 ? { centringOhms } : {}),
          ...(stock !== undefined ? { centringSeriesOhms: stock } : {}),
          ...(loadOhms !== undefined ? { loadOhms } : {}),
        },
      }));
    }
    return findings;
  },
};
