/**
 * gate-protection — every insulated gate has a defined DC potential, a clamp where it can be reached
 * from outside the board, and a voltage inside its rating; no JFET gate is forward-biased.
 *
 * ## What it checks
 * For every MOSFET gate (both gates of a dual-gate MOSFET):
 * - a DC path to a defined potential — through resistors or inductors to ground, a rail, a source
 *   or another device's output. A gate with none floats: an error, naming the gate net and the part.
 * - where the gate can be reached from an external connector, an antenna or a coil input through
 *   coupling capacitors, resistors and inductors, a clamp: diodes or a zener from the gate (or a net
 *   on the way to it) to ground or a rail, or from gate to source, or protection built into the part
 *   (the parts library says which parts have it; for a part it does not know, the symbol's
 *   description may say so). Missing, a warning.
 * - its DC gate-source voltage at the operating point within the gate rating (VGS max, or the
 *   breakdown of built-in protection diodes): beyond it, an error. Where the gate reaches a rail
 *   through resistors, the rail alone is compared with the rating too: if it exceeds it, a fault or
 *   the switch-on transient can put it on the gate (for a protected gate, the diode current the
 *   path resistance allows is compared with the gate current rating instead).
 * For every junction FET: a gate junction forward-biased at the operating point (VGS above +0.5 V
 * for an n-channel device unless set) is a warning.
 *
 * ## Why it matters
 * An insulated gate is a capacitor of a few picofarads with nothing to bleed its charge: left
 * floating it drifts to wherever leakage and static put it, the drain current with it, and a few
 * tens of volts of static — less than a touch delivers — punch through the oxide. A gate wired to
 * an antenna or an input socket meets exactly those charges. A forward-biased JFET gate draws
 * current from the source, loads it and rectifies the signal.
 *
 * ## Example
 * A 2N7000 common-source stage whose gate is fed from a BNC input through 100 nF with 1 MΩ to ground:
 * the gate has a DC path, but nothing clamps it and the 2N7000 has no protection diode: a warning.
 * A BF998 dual-gate stage fed the same way passes (its gates carry protection diodes); with gate 1's
 * resistor to ground left off, gate 1 floats: an error.
 *
 * ## References
 * Gate oxide and ESD: device datasheets' handling instructions (2N7000: VGSS ±20 V, no protection
 * diode; BF998: back-to-back gate protection diodes, V(BR)G1SS ±8–12 V, still antistatic handling).
 * JFET gate forward conduction above about +0.5 V: common practice (J310: VGS(f) ≤ 1.0 V at 1 mA).
 * Facts as compiled in the project's reference notes, §4.2–§4.4 and §7.
 */
import type { Part } from "../src/circuit/types.js";
import type { Context, PartRatings } from "../src/engine/context.js";
import { otherNet } from "../src/engine/context-topology.js";
import type { Rule } from "../src/engine/rule.js";
import type { Finding, RuleDoc } from "../src/engine/types.js";
import { byRef, finding, numberOption, si } from "./support.js";

const ID = "gate-protection";

const ESD =
  "MOSFET gates are damaged by static: handle the part as its datasheet instructs (antistatic precautions) when fitting and testing.";

const doc: RuleDoc = {
  what:
    "For every MOSFET gate (both gates of a dual-gate MOSFET): a DC path to a defined potential (resistors or inductors to ground, a rail, a source or another device's output) — a floating gate is an error naming the gate net and the part; where the gate can be reached from an external connector, antenna or coil input through capacitors, resistors and inductors, a clamp (diodes or a zener to ground or a rail, or gate to source, or protection built into the part, as the parts library records or, for a part it does not know, the symbol's description states) — missing, a warning; the DC gate-source voltage at the operating point within the gate rating (VGS max, or the built-in diodes' breakdown) — beyond it, an error; and where the gate reaches a rail, the rail alone against the rating. For every junction FET, a gate junction forward-biased at the operating point (VGS above +0.5 V for an n-channel device unless set) is a warning.",
  why:
    "An insulated gate is a few picofarads with nothing to bleed its charge: floating, it drifts with leakage and static and takes the drain current with it, and a few tens of volts — less than a touch delivers — punch through the oxide. A gate wired to an antenna or an input socket meets exactly those charges. A forward-biased JFET gate draws current from the source, loads it and rectifies the signal.",
  fix:
    "Give a floating gate a resistor to its bias point (ground, or the divider that sets it). Clamp a gate that can be reached from outside with a pair of small-signal diodes or a low-voltage zener to ground, close to the gate, with a series resistor ahead of it if the source can deliver current; or use a part with built-in gate protection. Keep the gate-source voltage inside the datasheet's rating, and keep a JFET gate at or below its source.",
  references: [
    "Gate ratings and handling: device datasheets (2N7000: VGSS ±20 V continuous, no gate protection diode; BF998: integrated back-to-back gate protection diodes, V(BR)G1SS/G2SS ±8 to ±12 V, antistatic handling still required), as compiled in the project's reference notes §4.3, §4.4",
    "JFET gate forward-biased above about +0.5 V: common practice (J310 datasheet: VGS(f) ≤ 1.0 V at IG 1 mA), reference notes §4.2",
    "Antistatic handling of MOS parts and unprotected gates on external connections: common practice, reference notes §7",
  ],
  example:
    "A 2N7000 common-source stage fed from a BNC input through 100 nF, 1 MΩ from gate to ground: a DC path exists, but no clamp and no built-in protection — a warning. A BF998 stage fed the same way passes; with gate 1's resistor left off, gate 1 floats — an error.",
};

const options = {
  jfetForwardVolts: {
    type: "number" as const,
    default: 0.5,
    unit: "V",
    description: "Gate-source voltage (n-channel sense) above which a JFET's gate junction counts as forward-biased.",
  },
};

interface Gate {
  part: Part;
  role: "G" | "G1" | "G2";
  net: string;
  /** "the gate", "gate 1", "gate 2". */
  name: string;
  sourceNet?: string;
}

const INSULATED = new Set(["nmos", "pmos", "dual-gate-mosfet"]);
const DRIVEN_ROLES = new Set(["C", "E", "D", "S"]);
const PASSING_KINDS = new Set(["resistor", "capacitor", "polarized-capacitor", "inductor"]);
/** How far from the gate the search for an entry point goes: nets visited. Our bound. */
const SEARCH_LIMIT = 400;

function gatesOf(ctx: Context): Gate[] {
  const out: Gate[] = [];
  for (const part of ctx.devices()) {
    if (!INSULATED.has(part.kind)) continue;
    const roles: Array<Gate["role"]> = part.kind === "dual-gate-mosfet" ? ["G1", "G2"] : ["G"];
    const sourceNet = ctx.netOf(part.ref, "S");
    for (const role of roles) {
      const net = ctx.netOf(part.ref, role);
      if (net === undefined) continue;
      const name = role === "G" ? "the gate" : role === "G1" ? "gate 1" : "gate 2";
      out.push({ part, role, net, name, ...(sourceNet !== undefined ? { sourceNet } : {}) });
    }
  }
  return out;
}

/** What gives a net its DC potential: a supply reached through resistors/inductors, a source or
 * battery, another device's output terminal, or a part the checker does not model (an IC's pin). */
function definedBy(ctx: Context, gate: Gate): string | undefined {
  if (ctx.isSupply(gate.net)) return gate.net;
  const network = ctx.dcNetwork(gate.net);
  const supply = network.nets.find((n) => ctx.isSupply(n));
  if (supply !== undefined) return supply;
  for (const net of network.nets) {
    for (const { part, role } of ctx.partsOn(net)) {
      if (part.ref === gate.part.ref && (role === gate.role)) continue;
      if (part.kind === "voltage-source" || part.kind === "battery" || part.kind === "current-source") return part.ref;
      if (part.kind === "other") return part.ref;
      const active = ["npn", "pnp", "njfet", "pjfet", "nmos", "pmos", "dual-gate-mosfet"].includes(part.kind);
      if (active && DRIVEN_ROLES.has(role)) return part.ref;
    }
  }
  return undefined;
}

/** A part through which charge and signal come from off the board. */
function isEntry(part: Part): boolean {
  if (part.kind === "connector") return true;
  const text = `${part.libId} ${part.value}`;
  if (/antenna/i.test(text) || /^(AE|ANT)\d/i.test(part.ref)) return true;
  return part.kind === "other" && (/transformer|balun/i.test(text) || /^T\d/i.test(part.ref));
}

interface Reach {
  entry: Part;
  /** Nets from the gate to the entry, gate first. */
  nets: string[];
  /** Parts crossed on the way, gate side first. */
  parts: Part[];
}

/** The nearest entry point reachable from the gate through capacitors, resistors and inductors,
 * not crossing a supply net (breadth first, bounded). */
function reachFromOutside(ctx: Context, gateNet: string): Reach | undefined {
  const previous = new Map<string, { net: string; part: Part } | null>([[gateNet, null]]);
  const queue = [gateNet];
  while (queue.length > 0 && previous.size < SEARCH_LIMIT) {
    const net = queue.shift();
    if (net === undefined) break;
    const entry = ctx.partsOn(net).find(({ part }) => isEntry(part));
    if (entry) {
      const nets: string[] = [];
      const parts: Part[] = [];
      for (let cursor: string | undefined = net; cursor !== undefined;) {
        nets.unshift(cursor);
        const step: { net: string; part: Part } | null | undefined = previous.get(cursor);
        if (!step) break;
        parts.unshift(step.part);
        cursor = step.net;
      }
      return { entry: entry.part, nets, parts };
    }
    if (ctx.isSupply(net)) continue;
    for (const { part } of ctx.partsOn(net)) {
      if (!PASSING_KINDS.has(part.kind)) continue;
      const next = otherNet(part, net);
      if (next === undefined || previous.has(next) || ctx.isSupply(next)) continue;
      previous.set(next, { net, part });
      queue.push(next);
    }
  }
  return undefined;
}

/** Diodes or zeners that clamp one of the nets: to ground or a rail, or from the gate to the source.
 * A diode pair in one package (a series pair with its common pin on the net) counts by any other pin. */
function clampsOn(ctx: Context, nets: readonly string[], gate: Gate): Part[] {
  const found = new Map<string, Part>();
  for (const net of nets) {
    for (const { part } of ctx.partsOn(net)) {
      if (part.kind !== "diode" && part.kind !== "zener") continue;
      const others = Object.values(part.pins).filter((n) => n !== net);
      if (others.some((other) => ctx.isSupply(other) || (net === gate.net && other === gate.sourceNet))) found.set(part.ref, part);
    }
  }
  return [...found.values()].sort(byRef);
}

/** Built-in gate protection: the parts library's word first; for a part it does not know, the
 * symbol's own description ("gate protection diodes inside"). */
function builtInProtection(part: Part, ratings: PartRatings | undefined): { protected: boolean; basis: string } {
  if (ratings?.gateProtection !== undefined) {
    return { protected: ratings.gateProtection, basis: ratings.gateProtection ? "the parts library" : `the ${part.value || "part"} has no built-in gate protection` };
  }
  const said = Object.entries(part.fields).some(([k, v]) => /^(description|ki_description)$/i.test(k) && /gate[- ]?protect|protection diode/i.test(v));
  return said ? { protected: true, basis: "the symbol's description" } : { protected: false, basis: "the part is not known to have built-in gate protection" };
}

/** The gate-source limit and what it is: the continuous VGS rating, else the breakdown of built-in
 * protection diodes (their lower figure). */
function gateLimit(ratings: PartRatings | undefined): { volts: number; basis: string } | undefined {
  if (ratings?.vgsMax !== undefined) return { volts: ratings.vgsMax, basis: `the ±${ratings.vgsMax} V gate-source rating` };
  const breakdown = ratings?.vgsBreakdown?.min;
  if (breakdown !== undefined) return { volts: breakdown, basis: `the ${breakdown} V minimum breakdown of its gate protection diodes` };
  return undefined;
}

function resistanceOf(parts: readonly Part[]): number {
  return parts.reduce((sum, p) => sum + (p.kind === "resistor" ? p.parsed.number ?? 0 : 0), 0);
}

export const gateProtection: Rule<Context> = {
  id: ID,
  title: "MOSFET gates are defined, clamped where exposed, and within rating; JFET gates are not forward-biased",
  severity: "warning",
  doc,
  options,
  tags: ["protection", "esd"],
  check(ctx, opts) {
    const forwardVolts = numberOption(opts, "jfetForwardVolts", 0.5);
    const findings: Finding[] = [];
    const point = ctx.operatingPoint();
    const gates = gatesOf(ctx);

    for (const gate of gates) {
      const ref = gate.part.ref;
      const what = `${ref}'s ${gate.name === "the gate" ? "gate" : gate.name} (net ${gate.net})`;
      const defined = definedBy(ctx, gate);
      if (defined === undefined) {
        findings.push(finding(ctx, ID, {
          at: gate.part,
          severity: "error",
          message: `${capitalise(what)} has no DC path to a defined potential: nothing but capacitors and open ends on it, so it floats with leakage and static charge and the drain current with it. Add a resistor from ${gate.net} to its bias point (ground or the divider that should set it). ${ESD}`,
          parts: [ref],
          nets: [gate.net],
          data: { gateNet: gate.net, role: gate.role, floating: true },
        }));
        continue;
      }

      const ratings = ctx.rating(ref);
      const protection = builtInProtection(gate.part, ratings);
      const builtIn = protection.protected;
      const reach = reachFromOutside(ctx, gate.net);
      if (reach && !builtIn) {
        const clamps = clampsOn(ctx, reach.nets, gate);
        if (clamps.length === 0) {
          const route = reach.parts.length > 0 ? ` through ${reach.parts.map((p) => p.ref).join(", ")}` : " directly";
          const known = protection.basis;
          findings.push(finding(ctx, ID, {
            at: gate.part,
            severity: "warning",
            message: `${capitalise(what)} can be reached from ${reach.entry.ref} (${reach.entry.value || reach.entry.kind})${route}, with no clamp on the way, and ${known}. Fit two small-signal diodes (or a low-voltage zener) from ${gate.net} to ground, close to the gate. ${ESD}`,
            parts: [ref, reach.entry.ref, ...reach.parts.map((p) => p.ref)],
            nets: reach.nets,
            data: { gateNet: gate.net, role: gate.role, entry: reach.entry.ref, path: reach.parts.map((p) => p.ref), builtInProtection: false },
          }));
        }
      }

      const limit = gateLimit(ratings);
      if (!limit) continue;
      const vg = ctx.voltage(gate.net);
      const vs = gate.sourceNet !== undefined ? ctx.voltage(gate.sourceNet) : undefined;
      if (point && vg !== undefined && vs !== undefined && Math.abs(vg - vs) > limit.volts) {
        findings.push(finding(ctx, ID, {
          at: gate.part,
          severity: "error",
          message: `${capitalise(what)} sits at ${si(vg - vs, "V")} from the source at the operating point, beyond ${limit.basis}. Change the gate bias so |VGS| stays inside it. ${ESD}`,
          parts: [ref],
          nets: [gate.net, ...(gate.sourceNet !== undefined ? [gate.sourceNet] : [])],
          data: { gateNet: gate.net, role: gate.role, vgs: vg - vs, limitVolts: limit.volts },
        }));
        continue;
      }
      // The rail alone: what a fault (an open lower bias resistor) or switch-on could put on the gate.
      const path = ctx.supplyPath(gate.net);
      const rail = path ? ctx.rail(path.rail) : undefined;
      if (!path || !rail || Math.abs(rail.volts) <= limit.volts) continue;
      const clamped = builtIn || clampsOn(ctx, [gate.net], gate).length > 0;
      const seriesOhms = resistanceOf(path.parts);
      const igMax = ratings?.igMax;
      if (clamped) {
        if (igMax === undefined || !(seriesOhms > 0)) continue;
        const current = (Math.abs(rail.volts) - limit.volts) / seriesOhms;
        if (current <= igMax) continue;
        findings.push(finding(ctx, ID, {
          at: gate.part,
          severity: "warning",
          message: `${capitalise(what)} reaches ${rail.net} (${si(rail.volts, "V")}) through only ${si(seriesOhms, "Ω")} (${path.parts.map((p) => p.ref).join(", ")}): should the gate's bias fail, the clamp would take about ${si(current, "A")}, over the ${si(igMax, "A")} gate current rating. Raise the series resistance.`,
          parts: [ref, ...path.parts.map((p) => p.ref)],
          nets: [gate.net, rail.net],
          data: { gateNet: gate.net, role: gate.role, railVolts: rail.volts, seriesOhms, clampAmps: current, igMaxAmps: igMax },
        }));
        continue;
      }
      findings.push(finding(ctx, ID, {
        at: gate.part,
        severity: "warning",
        message: `${capitalise(what)} reaches ${rail.net} (${si(rail.volts, "V")}) through ${path.parts.map((p) => p.ref).join(", ")}, and that rail alone exceeds ${limit.basis}: an open bias resistor or the switch-on transient would put it on the gate. Add a zener from ${gate.net} to the source or ground below the rating. ${ESD}`,
        parts: [ref, ...path.parts.map((p) => p.ref)],
        nets: [gate.net, rail.net],
        data: { gateNet: gate.net, role: gate.role, railVolts: rail.volts, limitVolts: limit.volts },
      }));
    }

    // Junction FETs: a forward-biased gate at the operating point.
    const jfets = ctx.devices().filter((p) => p.kind === "njfet" || p.kind === "pjfet");
    if (jfets.length > 0 && !point) {
      ctx.noteLimited(ID, `no operating point (${ctx.operatingPointProblem() ?? "not solved"}): JFET gate bias not checked`, jfets.map((p) => p.ref));
    }
    if (gates.some((g) => gateLimit(ctx.rating(g.part.ref)) !== undefined) && !point) {
      ctx.noteLimited(ID, "no operating point: MOSFET gate voltages not checked against their ratings", gates.map((g) => g.part.ref));
    }
    for (const part of jfets) {
      const device = ctx.device(part.ref);
      if (!device || device.kind !== "jfet") continue;
      if (device.vgs <= forwardVolts) continue;
      const gateNet = ctx.netOf(part.ref, "G") ?? "";
      findings.push(finding(ctx, ID, {
        at: part,
        severity: "warning",
        message: `${part.ref}'s gate junction is forward-biased at the operating point: VGS ${si(device.vgs, "V")} (${part.kind === "pjfet" ? "p-channel, sign as for n-channel" : "n-channel"}), above +${si(forwardVolts, "V")}, and it draws ${si(device.ig, "A")} of gate current. Bias the gate at or below the source (self-bias with a source resistor, or a divider that leaves VGS negative).`,
        parts: [part.ref],
        nets: [gateNet],
        data: { vgs: device.vgs, gateAmps: device.ig, thresholdVolts: forwardVolts },
      }));
    }
    return findings;
  },
};

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
