// The design's shape as an RF builder reads it: which parts touch a net, which nets are AC grounds,
// how each transistor is used (common emitter/base/collector, common source/gate/drain) and which
// devices are stacked in series from a rail to ground. Structure only; figures come from the solver.
import type { Circuit, Part, PartKind } from "../circuit/types.js";
import type { Configuration, Stack, Stage } from "./context-types.js";

export interface PartOnNet {
  part: Part;
  /** Pin number. */
  pin: string;
  /** Pin role ("B", "C", "1", "+" …); the pin number when the part declares no role for it. */
  role: string;
}

export const ACTIVE_KINDS: ReadonlySet<PartKind> = new Set<PartKind>([
  "npn", "pnp", "njfet", "pjfet", "nmos", "pmos", "dual-gate-mosfet",
]);
const CAPACITOR_KINDS: ReadonlySet<PartKind> = new Set<PartKind>(["capacitor", "polarized-capacitor"]);
/** Parts that carry DC between their two pins (a load, a decoupling resistor, a choke). */
const SERIES_DC_KINDS: ReadonlySet<PartKind> = new Set<PartKind>(["resistor", "inductor"]);

export function isActive(part: Part): boolean {
  return ACTIVE_KINDS.has(part.kind);
}

export function isCapacitor(part: Part): boolean {
  return CAPACITOR_KINDS.has(part.kind);
}

export function roleOfPin(part: Part, pin: string): string {
  for (const [role, number] of Object.entries(part.roles)) if (number === pin) return role;
  return pin;
}

export function netOfRole(part: Part, role: string): string | undefined {
  const pin = part.roles[role];
  return pin === undefined ? undefined : part.pins[pin];
}

/** For a two-terminal part touching `net`, the net on its other pin (undefined if both or neither). */
export function otherNet(part: Part, net: string): string | undefined {
  const nets = Object.values(part.pins);
  if (nets.length !== 2) return undefined;
  const [a, b] = nets;
  if (a === net && b !== net) return b;
  if (b === net && a !== net) return a;
  return undefined;
}

/** Which terminals of a device carry its main current, and which one controls it. */
export interface DeviceTerminals {
  /** Toward the positive rail in normal use: C (npn), E (pnp), D (n-channel), S (p-channel). */
  top: string;
  bottom: string;
  control: string;
  /** The output-side terminal a load hangs on: C or D. */
  output: string;
  /** The common-terminal candidates: E or S. */
  common: string;
}

export function terminalsOf(kind: PartKind): DeviceTerminals | undefined {
  switch (kind) {
    case "npn": return { top: "C", bottom: "E", control: "B", output: "C", common: "E" };
    case "pnp": return { top: "E", bottom: "C", control: "B", output: "C", common: "E" };
    case "njfet":
    case "nmos": return { top: "D", bottom: "S", control: "G", output: "D", common: "S" };
    case "dual-gate-mosfet": return { top: "D", bottom: "S", control: "G1", output: "D", common: "S" };
    case "pjfet":
    case "pmos": return { top: "S", bottom: "D", control: "G", output: "D", common: "S" };
    default: return undefined;
  }
}

export interface NetIndex {
  partsOn(net: string): PartOnNet[];
  part(ref: string): Part | undefined;
}

/** Fitted parts only: a DNP part is not on the board, so it neither loads nor grounds anything. */
export function indexCircuit(circuit: Circuit): NetIndex {
  const byRef = new Map<string, Part>();
  const byNet = new Map<string, PartOnNet[]>();
  for (const part of circuit.parts) {
    byRef.set(part.ref, part);
    if (part.dnp) continue;
    for (const [pin, net] of Object.entries(part.pins)) {
      const list = byNet.get(net) ?? [];
      list.push({ part, pin, role: roleOfPin(part, pin) });
      byNet.set(net, list);
    }
  }
  return {
    partsOn: (net) => byNet.get(net) ?? [],
    part: (ref) => byRef.get(ref),
  };
}

export interface AcGroundTest {
  /** Ground or a rail: an AC ground by definition (a rail's own bypass is judged by rail-bypass). */
  isSupply(net: string): boolean;
  isGround(net: string): boolean;
  /** Smallest capacitance that counts as a signal short for telling configurations apart. */
  minimumFarads: number;
}

/**
 * Capacitors that tie `net` to ground or a rail, leaving out tank capacitors (a capacitor in parallel
 * with an inductor across the same two nets is a tuned circuit, not a bypass) and capacitors too small
 * to be a signal short in the band.
 */
export function groundingCapacitors(net: string, index: NetIndex, test: AcGroundTest, minimumFarads = 0): Part[] {
  const found: Part[] = [];
  for (const { part } of index.partsOn(net)) {
    if (!isCapacitor(part)) continue;
    const other = otherNet(part, net);
    if (other === undefined || !test.isSupply(other)) continue;
    const farads = part.parsed.number;
    if (farads !== undefined && farads < minimumFarads) continue;
    const tank = index.partsOn(net).some(({ part: p }) => p.kind === "inductor" && otherNet(p, net) === other);
    if (tank) continue;
    found.push(part);
  }
  return found;
}

export function isAcGround(net: string | undefined, index: NetIndex, test: AcGroundTest): boolean {
  if (net === undefined) return false;
  if (test.isSupply(net)) return true;
  return groundingCapacitors(net, index, test, test.minimumFarads).length > 0;
}

/** Another active device's collector or drain on this net: the net is driven by a device output. */
export function outputsOn(net: string | undefined, index: NetIndex, except: string): Part[] {
  if (net === undefined) return [];
  return index.partsOn(net)
    .filter(({ part, role }) => part.ref !== except && isActive(part) && role === terminalsOf(part.kind)?.output)
    .map(({ part }) => part);
}

/**
 * How a device is used, from the AC topology. A device whose emitter/source is fed by another
 * device's collector/drain is the upper half of a cascode (common base/gate) whatever its base
 * network looks like — that is exactly the case where a missing base bypass must be reported.
 */
export function classifyStage(part: Part, index: NetIndex, test: AcGroundTest): Stage | undefined {
  const terminals = terminalsOf(part.kind);
  if (!terminals) return undefined;
  const nets: Record<string, string> = {};
  for (const role of Object.keys(part.roles)) {
    const net = netOfRole(part, role);
    if (net !== undefined) nets[role] = net;
  }
  const control = nets[terminals.control];
  const output = nets[terminals.output];
  const common = nets[terminals.common];
  const acControl = isAcGround(control, index, test);
  const acOutput = isAcGround(output, index, test);
  const acCommon = isAcGround(common, index, test);
  const fedByDevice = outputsOn(common, index, part.ref).length > 0;
  const bipolar = part.kind === "npn" || part.kind === "pnp";

  let kind: "ce" | "cb" | "cc" | "unknown";
  if (fedByDevice && !acCommon && !acOutput) kind = "cb";
  else if (acOutput && !acControl && !acCommon) kind = "cc";
  else if (!acControl && !acOutput) kind = "ce"; // common terminal grounded, bypassed, or degenerated
  else if (acControl && !acCommon && !acOutput) kind = "cb";
  else kind = "unknown";

  const names: Record<typeof kind, Configuration> = bipolar
    ? { ce: "common-emitter", cb: "common-base", cc: "common-collector", unknown: "unknown" }
    : { ce: "common-source", cb: "common-gate", cc: "common-drain", unknown: "unknown" };
  return { ref: part.ref, part, type: part.kind, configuration: names[kind], nets };
}

/**
 * Series chains of devices from a rail to ground, bottom first: device A sits under device B when
 * A's top terminal and B's bottom terminal share a net that is neither ground nor a rail. Only
 * chains of two or more devices are stacks; a lone stage is in `stages()`.
 */
export function findStacks(devices: Part[], index: NetIndex, test: AcGroundTest): Stack[] {
  const above = new Map<string, Part>();
  const hasBelow = new Set<string>();
  for (const lower of devices) {
    const lowerTop = netOfRole(lower, terminalsOf(lower.kind)?.top ?? "");
    if (lowerTop === undefined || test.isSupply(lowerTop)) continue;
    const upper = devices.find((d) => d.ref !== lower.ref && netOfRole(d, terminalsOf(d.kind)?.bottom ?? "") === lowerTop);
    if (upper && !hasBelow.has(upper.ref)) {
      above.set(lower.ref, upper);
      hasBelow.add(upper.ref);
    }
  }
  const stacks: Stack[] = [];
  for (const bottom of devices) {
    if (hasBelow.has(bottom.ref) || !above.has(bottom.ref)) continue;
    const chain: Part[] = [bottom];
    const seen = new Set([bottom.ref]);
    // Bounded by the device count; `seen` also guards against a drawing that loops back on itself.
    for (let next = above.get(bottom.ref); next && !seen.has(next.ref); next = above.get(next.ref)) {
      chain.push(next);
      seen.add(next.ref);
    }
    const top = chain[chain.length - 1] ?? bottom;
    const topNet = netOfRole(top, terminalsOf(top.kind)?.top ?? "");
    const path = topNet === undefined ? undefined : pathToSupply(topNet, index, test);
    stacks.push({ refs: chain.map((p) => p.ref), rail: path?.rail ?? "", loads: path?.parts.map((p) => p.ref) ?? [] });
  }
  return stacks;
}

export interface SupplyPath {
  rail: string;
  /** The resistors/inductors from the start net to the rail, nearest first. */
  parts: Part[];
}

/**
 * The shortest DC path through resistors and inductors from `start` to a rail (not ground), at most
 * `maxParts` long: how a collector or drain is fed (load resistor, choke, RC decoupling).
 */
export function pathToSupply(start: string, index: NetIndex, test: AcGroundTest, maxParts = 4): SupplyPath | undefined {
  if (test.isSupply(start) && !test.isGround(start)) return { rail: start, parts: [] };
  const visited = new Set([start]);
  let frontier: { net: string; parts: Part[] }[] = [{ net: start, parts: [] }];
  for (let depth = 0; depth < maxParts && frontier.length > 0; depth++) {
    const next: { net: string; parts: Part[] }[] = [];
    for (const { net, parts } of frontier) {
      for (const { part } of index.partsOn(net)) {
        if (!SERIES_DC_KINDS.has(part.kind)) continue;
        const other = otherNet(part, net);
        if (other === undefined || visited.has(other) || test.isGround(other)) continue;
        visited.add(other);
        const path = [...parts, part];
        if (test.isSupply(other)) return { rail: other, parts: path };
        next.push({ net: other, parts: path });
      }
    }
    frontier = next;
  }
  return undefined;
}

/** Nets reachable from `start` through resistors and inductors without crossing a supply net or a
 * device, with the parts crossed: the DC network hanging on a base or gate. */
export function dcNeighbourhood(start: string, index: NetIndex, isSupply: (net: string) => boolean, limit = 200): { nets: string[]; parts: Part[] } {
  const nets = new Set([start]);
  const parts = new Map<string, Part>();
  const queue = [start];
  while (queue.length > 0 && nets.size < limit) {
    const net = queue.shift();
    if (net === undefined) break;
    for (const { part } of index.partsOn(net)) {
      if (!SERIES_DC_KINDS.has(part.kind)) continue;
      parts.set(part.ref, part);
      const other = otherNet(part, net);
      if (other === undefined || nets.has(other)) continue;
      nets.add(other);
      if (!isSupply(other)) queue.push(other);
    }
  }
  return { nets: [...nets], parts: [...parts.values()] };
}
