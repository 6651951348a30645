/**
 * stack-headroom — every device of a series stack keeps enough voltage above saturation for the
 * signal swing the design is meant to carry.
 *
 * ## What it checks
 * Every stack of devices in series from a rail toward ground — a bipolar or FET cascode, a
 * totem-pole bias stack, and the two channels of every dual-gate MOSFET, which is a cascode in one
 * package. For each device its headroom at the operating point: VCE − VCE(sat) (the part's rated
 * VCE(sat), else 0.2 V), or VDS − VDS(sat) with VDS(sat) = VGS − VTO (JFET) or VGS − VTH (MOSFET).
 * For the stack as a whole the largest undistorted peak swing at its output: toward the devices,
 * until the first device reaches its saturation edge, each carrying its share of the swing (from
 * the small-signal solution: nearly all of it across the output device, a few per cent across the
 * lower ones, which the cascode holds still); away from them the DC drop across a resistive load (a choke lets the output rise above the rail,
 * so it sets no limit there). Each is compared with the configured signal swing (`swing`, 1 V peak
 * unless set), and the supply the stack would need for that swing at the same currents is given.
 *
 * ## Why it matters
 * Stacking devices buys bandwidth and isolation with voltage: every device needs its own VCE(sat)
 * or VDS(sat) plus the swing, and the load needs the swing again. On a low rail the top device runs
 * into saturation on the signal's negative peaks (or the load into cut-off on its positive ones)
 * long before the small-signal gain says anything is wrong — the stage clips, its intermodulation
 * rises and, in a receiver front end, strong signals start producing spurious responses.
 *
 * ## Example
 * A 9 V two-transistor cascode (divider 12 k/5.6 k/6.8 k, RE 1 k, RC 1.5 kΩ, 2N3904) sits at
 * VCE1 2.05 V and VCE2 2.66 V: headrooms 1.85 V and 2.46 V over a 0.2 V VCE(sat). Q2 carries 99 % of
 * the output swing and Q1 about 1 %, so the output can swing 2.49 V down before Q2 saturates and
 * 2.56 V up before Q2 cuts off: 2.49 V peak at most. With `swing` set to 3 V the rule warns and says
 * the stack would need about 9.95 V.
 *
 * ## References
 * Cascode output swing limited by the upper device's saturation and the load: P. R. Gray and
 * R. G. Meyer, Analysis and Design of Analog Integrated Circuits; A. S. Sedra and K. C. Smith,
 * Microelectronic Circuits. VDS(sat) = VGS − VTO: Shichman–Hodges (square-law) model. VCE(sat)
 * 0.2 V for small-signal parts: datasheet figure at IC 10 mA, IB 1 mA (2N3904 class), used as
 * common practice where a part has no rating.
 */
import type { Part } from "../src/circuit/types.js";
import type { Context } from "../src/engine/context.js";
import type { Stack } from "../src/engine/context-types.js";
import { netOfRole, terminalsOf } from "../src/engine/context-topology.js";
import type { Rule } from "../src/engine/rule.js";
import type { Finding, RuleDoc } from "../src/engine/types.js";
import { finding, si } from "./support.js";

const ID = "stack-headroom";

const doc: RuleDoc = {
  what:
    "For every stack of devices in series from a rail (cascodes, totem-pole bias stacks, and the two channels of every dual-gate MOSFET), computes each device's headroom at the operating point — VCE − VCE(sat) (the part's rated VCE(sat), else 0.2 V), or VDS − VDS(sat) with VDS(sat) = VGS − VTO (JFET) or VGS − VTH (MOSFET) — and the largest undistorted peak swing at the stack's output: toward the devices, until the first reaches its saturation edge while carrying its small-signal share of the swing (nearly all across the output device in a cascode), away from them the DC drop across a resistive load (a choke sets no limit). Compares each with the configured signal swing and gives the supply the stack would need at the same currents.",
  why:
    "A stack spends voltage: each device needs its saturation voltage plus the swing, and the load needs the swing again. On a low rail the top device saturates on the signal's negative peaks, or the load cuts off on the positive ones, while the small-signal gain looks fine: the stage clips, intermodulation rises, and strong signals produce spurious responses.",
  fix:
    "Raise the rail toward the supply given, move the bias so the short device gets the volts (a lower divider tap for the upper base, a smaller emitter or source resistor), use a smaller collector resistor or a choke load, or set \"swing\" in loadline.json to the peak swing the stage really carries.",
  references: [
    "Cascode output swing bounded by the upper device's saturation and by the load: P. R. Gray and R. G. Meyer, Analysis and Design of Analog Integrated Circuits",
    "Cascode and output swing: A. S. Sedra and K. C. Smith, Microelectronic Circuits",
    "VDS(sat) = VGS − VTO at the edge of pinch-off: the Shichman–Hodges (square-law) FET model",
    "VCE(sat) 0.2 V where the part has no rating: the small-signal datasheet figure at IC 10 mA, IB 1 mA (2N3904 class), common practice",
  ],
  example:
    "9 V cascode, divider 12 k/5.6 k/6.8 k, RE 1 k, RC 1.5 kΩ, 2N3904: VCE1 2.05 V, VCE2 2.66 V, headrooms 1.85 V and 2.46 V; Q2 carries 99 % of the swing. The output swings 2.49 V down and 2.56 V up, so 2.49 V peak at most; with swing 3 V the rule warns that about 9.95 V would be needed.",
};

/** One position in a stack: a device, or one channel of a dual-gate MOSFET. */
interface Position {
  part: Part;
  label: string;
  channel?: "g1" | "g2";
  /** VCE or VDS at the operating point (practitioner signs). */
  volts: number;
  satVolts: number;
  satBasis: string;
  voltsLabel: "VCE" | "VDS";
  /** The nets across it (collector/emitter, drain/source; a channel's internal node has none). */
  topNet?: string;
  bottomNet?: string;
}

interface StackView {
  refs: string[];
  rail: string;
  loads: string[];
  /** Made from a lone dual-gate MOSFET's two channels. */
  tetrode: boolean;
}

function isNType(part: Part): boolean {
  return part.kind === "npn" || part.kind === "njfet" || part.kind === "nmos" || part.kind === "dual-gate-mosfet";
}

/** The stacks the Context found, plus every dual-gate MOSFET that is not already part of one. */
function stacksToCheck(ctx: Context): StackView[] {
  const out: StackView[] = ctx.stacks().map((s: Stack) => ({ ...s, tetrode: false }));
  const inStacks = new Set(out.flatMap((s) => s.refs));
  for (const device of ctx.devices()) {
    if (device.kind !== "dual-gate-mosfet" || inStacks.has(device.ref)) continue;
    const drain = netOfRole(device, "D");
    const path = drain === undefined ? undefined : ctx.supplyPath(drain);
    out.push({ refs: [device.ref], rail: path?.rail ?? "", loads: path?.parts.map((p) => p.ref) ?? [], tetrode: true });
  }
  return out;
}

function positionsOf(ctx: Context, stack: StackView): { positions: Position[]; missing: string[] } {
  const positions: Position[] = [];
  const missing: string[] = [];
  for (const ref of stack.refs) {
    const part = ctx.part(ref);
    if (!part) continue;
    const channels: Array<"g1" | "g2" | undefined> = part.kind === "dual-gate-mosfet" ? ["g1", "g2"] : [undefined];
    for (const channel of channels) {
      const device = ctx.device(ref, channel);
      const edge = ctx.saturationEdge(ref, channel);
      if (!device || !edge || device.kind === "diode") {
        missing.push(ref);
        continue;
      }
      const volts = device.kind === "bjt" ? device.vce : device.vds;
      const label = channel ? `${ref} (gate-${channel === "g1" ? "1" : "2"} channel)` : ref;
      const t = terminalsOf(part.kind);
      // A dual-gate channel's far end is the internal node between the channels: not a net.
      const topNet = channel === "g1" ? undefined : t ? netOfRole(part, t.top) : undefined;
      const bottomNet = channel === "g2" ? undefined : t ? netOfRole(part, t.bottom) : undefined;
      positions.push({
        part, label, ...(channel ? { channel } : {}), volts, satVolts: edge.volts, satBasis: edge.basis,
        voltsLabel: device.kind === "bjt" ? "VCE" : "VDS", ...(topNet !== undefined ? { topNet } : {}), ...(bottomNet !== undefined ? { bottomNet } : {}),
      });
    }
  }
  return { positions, missing: [...new Set(missing)] };
}

export const stackHeadroom: Rule<Context> = {
  id: ID,
  title: "Stacked devices keep headroom for the signal swing",
  severity: "warning",
  doc,
  options: {},
  tags: ["bias", "headroom"],
  check(ctx) {
    const stacks = stacksToCheck(ctx);
    if (stacks.length === 0) return [];
    if (!ctx.operatingPoint()) {
      ctx.noteLimited(ID, `no operating point (${ctx.operatingPointProblem() ?? "not solved"}): stack headroom not computed`, stacks.flatMap((s) => s.refs));
      return [];
    }
    const swing = ctx.config.swing.volts;
    const swingText = ctx.config.swing.isDefault ? `${si(swing, "V")} peak (the default; set "swing" in loadline.json)` : `${si(swing, "V")} peak`;
    const findings: Finding[] = [];
    for (const stack of stacks) {
      const { positions, missing } = positionsOf(ctx, stack);
      if (missing.length > 0 || positions.length === 0) {
        ctx.noteLimited(ID, "a device of the stack has no operating point", missing.length > 0 ? missing : stack.refs);
        continue;
      }
      const bottomPart = positions[0]?.part;
      const topPart = positions[positions.length - 1]?.part;
      if (!bottomPart || !topPart) continue;
      const nType = isNType(topPart);
      // The output: the top device's collector/drain in an n-type stack, the bottom device's in a
      // p-type one (its devices hang from the rail by their emitters/sources).
      const outputPart = nType ? topPart : bottomPart;
      const outputPosition = nType ? positions[positions.length - 1] : positions[0];
      const outputNet = netOfRole(outputPart, terminalsOf(outputPart.kind)?.output ?? "");
      const outputVolts = outputNet === undefined ? undefined : ctx.voltage(outputNet);
      const railVolts = stack.rail === "" ? undefined : ctx.rail(stack.rail)?.volts ?? ctx.voltage(stack.rail);
      const firstLoad = stack.loads[0] === undefined ? undefined : ctx.part(stack.loads[0]);

      const headrooms = positions.map((p) => p.volts - p.satVolts);
      const controlNet = netOfRole(bottomPart, terminalsOf(bottomPart.kind)?.control ?? "");
      const shares = swingShares(ctx, positions, nType ? positions.length - 1 : 0, controlNet, outputNet);
      // Toward the devices: the output moves until the first device, carrying its share of the
      // swing, reaches its saturation edge.
      const limits = positions.map((_, i) => {
        const share = shares.values[i] ?? 1;
        return share > 1e-6 ? (headrooms[i] ?? 0) / share : Number.POSITIVE_INFINITY;
      });
      const towardDevices = Math.min(...limits);
      const limiting = positions[limits.indexOf(towardDevices)] ?? outputPosition;
      // Away from the devices: a resistive load lets the output go no further than the rail (the
      // device cutting off); a choke lets it ring above the rail, so the devices set the limit.
      let towardLoad: number | undefined;
      let loadText: string;
      if (nType && firstLoad?.kind === "resistor" && railVolts !== undefined && outputVolts !== undefined) {
        towardLoad = railVolts - outputVolts;
        loadText = `${si(towardLoad, "V")} up before ${outputPart.ref} cuts off (the DC drop across ${firstLoad.ref})`;
      } else if (nType && firstLoad?.kind === "inductor") {
        towardLoad = Number.POSITIVE_INFINITY;
        loadText = `above the rail on the positive peaks (choke load ${firstLoad.ref}: no limit from the load)`;
      } else {
        towardLoad = undefined;
        loadText = "the load-side limit was not computed (no resistive load from the output to the rail found)";
      }
      const maxSwing = Math.min(towardDevices, towardLoad ?? Number.POSITIVE_INFINITY);
      const saturated = positions.filter((_, i) => (headrooms[i] ?? 0) <= 0);
      if (saturated.length === 0 && maxSwing >= swing) continue;

      const short = positions.filter((_, i) => (headrooms[i] ?? 0) < (shares.values[i] ?? 1) * swing);
      const deficit = positions.reduce((sum, _, i) => sum + Math.max(0, (shares.values[i] ?? 1) * swing - (headrooms[i] ?? 0)), 0)
        + (towardLoad !== undefined && Number.isFinite(towardLoad) ? Math.max(0, swing - towardLoad) : 0);
      const supplyNeeded = railVolts !== undefined ? railVolts + deficit : undefined;
      // Named top first, as drawn: "Q2 over Q1".
      const name = stack.tetrode ? `${stack.refs[0] ?? ""} (a dual-gate MOSFET: two channels in series)` : `the stack ${[...stack.refs].reverse().join(" over ")}`;
      const headroomText = positions.map((p, i) => {
        const share = shares.values[i] ?? 1;
        const carries = share < 0.99 ? ` (it carries ${Number((share * 100).toPrecision(2))} % of the output swing)` : "";
        return `${p.label} ${p.voltsLabel} ${si(p.volts, "V")} − ${si(p.satVolts, "V")} = ${si(headrooms[i] ?? 0, "V")}${carries}`;
      }).join(", ");
      const direction = nType ? "down" : "up";
      const swingDirections = nType
        ? `its output ${outputNet ?? "?"} can swing ${si(towardDevices, "V")} ${direction} before ${limiting?.label ?? "a device"} saturates and ${loadText}`
        : `its output ${outputNet ?? "?"} can swing ${si(towardDevices, "V")} ${direction} before ${limiting?.label ?? "a device"} saturates`;
      const supplyText = supplyNeeded !== undefined && deficit > 0
        ? ` At the same currents, with the extra volts where they are short, it would need about ${si(supplyNeeded, "V")} instead of ${si(railVolts ?? 0, "V")}.`
        : "";
      const severe = saturated.length > 0;
      findings.push(finding(ctx, ID, {
        at: outputPart,
        severity: severe ? "error" : "warning",
        message: `${capitalise(name)} from ${stack.rail || "its supply"}: headroom ${headroomText}${severe ? ` — ${saturated.map((p) => p.label).join(", ")} already at or below the saturation edge, not amplifying` : ""}. ${capitalise(swingDirections)}, so ${si(Math.max(0, maxSwing), "V")} peak at most undistorted, against a swing of ${swingText}.${supplyText}${shares.basis}`,
        parts: [...stack.refs, ...stack.loads],
        nets: [...(outputNet !== undefined ? [outputNet] : []), ...(stack.rail ? [stack.rail] : [])],
        data: {
          devices: positions.map((p) => p.label),
          volts: positions.map((p) => p.volts),
          satVolts: positions.map((p) => p.satVolts),
          headroomVolts: headrooms,
          swingShare: shares.values,
          satBasis: positions.map((p) => p.satBasis),
          towardDevicesVolts: towardDevices,
          ...(towardLoad !== undefined && Number.isFinite(towardLoad) ? { towardLoadVolts: towardLoad } : {}),
          maxSwingVolts: maxSwing,
          swingVolts: swing,
          ...(railVolts !== undefined ? { railVolts } : {}),
          ...(supplyNeeded !== undefined ? { supplyNeededVolts: supplyNeeded } : {}),
          shortDevices: short.map((p) => p.label),
        },
      }));
    }
    return findings;
  },
};

interface Shares {
  /** Per position, its VCE (VDS) swing per volt of output swing. */
  values: number[];
  /** A sentence for the message when a share could not be computed (empty otherwise). */
  basis: string;
}

/**
 * How much of the output swing each device's VCE (VDS) carries: from the small-signal transfer at
 * the band's geometric centre, driven at the bottom device's base or gate, |H(top) − H(bottom)| /
 * |H(output)|. In a cascode the lower device's collector is held by the upper device's emitter, so
 * its share is a few per cent; the output device carries nearly all. Where the transfer cannot be
 * had (no AC solution, a channel's internal node) the share is taken as 1, the cautious reading.
 */
function swingShares(ctx: Context, positions: Position[], outputIndex: number, inputNet: string | undefined, outputNet: string | undefined): Shares {
  const ones = positions.map(() => 1);
  if (inputNet === undefined || outputNet === undefined || ctx.isSupply(inputNet)) {
    return { values: ones, basis: " (Each device is held to the whole swing: the stack's input could not be driven for the small-signal shares.)" };
  }
  const hertz = Math.sqrt(ctx.band.low * ctx.band.high);
  const at = (net: string | undefined): { re: number; im: number } | undefined => {
    if (net === undefined) return undefined;
    if (ctx.isSupply(net)) return { re: 0, im: 0 };
    const point = ctx.transfer(inputNet, net, [hertz])?.[0];
    return point && Number.isFinite(point.re) && Number.isFinite(point.im) ? { re: point.re, im: point.im } : undefined;
  };
  const out = at(outputNet);
  const outMagnitude = out ? Math.hypot(out.re, out.im) : 0;
  if (!out || !(outMagnitude > 1e-9)) {
    return { values: ones, basis: " (Each device is held to the whole swing: no small-signal transfer to the output was found.)" };
  }
  let unknown = false;
  const values = positions.map((p, i) => {
    const top = at(p.topNet);
    const bottom = at(p.bottomNet);
    if (!top || !bottom) {
      if (i !== outputIndex) unknown = true;
      return 1;
    }
    return Math.hypot(top.re - bottom.re, top.im - bottom.im) / outMagnitude;
  });
  return { values, basis: unknown ? " (A device whose terminals are not both nets — a dual-gate channel — is held to the whole swing.)" : "" };
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
