// From the design graph to the Circuit: union-find classes with at least one pin of a real part
// become nets, named by their best driver; placed units merge into parts by reference.
import type { Net, NetPin, Part, ReadNote } from "../../circuit/types.js";
import { buildPart, sortCircuit } from "../part-builder.js";
import { unescapeKicad } from "./escapes.js";
import { FLAG_GROUND, FLAG_NO_CONNECT, FLAG_POWER, type DesignGraph, type PartRecord, type PinRecord } from "./design-graph.js";
import { compareDrivers, defaultNetName, isGroundName, PRIORITY, unitLetters, type Driver } from "./net-names.js";

interface NetClass {
  members: PinRecord[];
  drivers: Driver[];
  flags: number;
}

export function assemble(graph: DesignGraph, version: number): { parts: Part[]; nets: Net[]; notes: ReadNote[] } {
  const { uf } = graph;
  const notes: ReadNote[] = [];
  const classes = new Map<number, NetClass>();
  for (const part of graph.parts) {
    if (!part.resolved.onBoard) continue; // left out of the netlist, as KiCad's exporter does
    for (const pin of part.pins) {
      const root = uf.find(pin.node);
      let c = classes.get(root);
      if (!c) { c = { members: [], drivers: [], flags: 0 }; classes.set(root, c); }
      c.members.push(pin);
    }
  }
  const flags = graph.flags;
  for (let node = 0; node < flags.length; node++) {
    const f = flags[node] ?? 0;
    if (f === 0) continue;
    const c = classes.get(uf.find(node));
    if (c) c.flags |= f;
  }
  for (const d of graph.drivers) classes.get(uf.find(d.node))?.drivers.push(d);

  // Name every class; classes that end up with the same name are one net, as KiCad numbers nets by
  // name (inference from its net-code assignment; a named net split in two is a drawing mistake).
  const byName = new Map<string, NetClass[]>();
  for (const c of classes.values()) {
    const name = chooseName(c, version);
    const list = byName.get(name);
    if (list) list.push(c);
    else byName.set(name, [c]);
  }

  const nets: Net[] = [];
  const netOfPin = new Map<PinRecord, string>();
  const displayTaken = new Set<string>();
  for (const [escaped, group] of byName) {
    let display = unescapeKicad(escaped);
    if (displayTaken.has(display)) display = escaped;
    displayTaken.add(display);
    const pins: NetPin[] = [];
    const seen = new Set<string>();
    const aliases = new Set<string>([display]);
    let f = 0;
    for (const c of group) {
      f |= c.flags;
      for (const d of c.drivers) if (d.alias) aliases.add(unescapeKicad(d.name));
      for (const p of c.members) {
        netOfPin.set(p, display);
        const key = `${p.part.ref}\u0000${p.number}`;
        if (seen.has(key)) continue;
        seen.add(key);
        pins.push({ ref: p.part.ref, pin: p.number });
      }
    }
    const globalNames = [...aliases].filter((a) => !a.includes("/"));
    nets.push({
      name: display,
      aliases: [...aliases].sort(),
      pins,
      isGround: (f & FLAG_GROUND) !== 0 || globalNames.some(isGroundName),
      isPower: (f & FLAG_POWER) !== 0,
      noConnect: (f & FLAG_NO_CONNECT) !== 0,
    });
  }

  const parts = mergeParts(graph.parts, netOfPin, notes);
  sortCircuit(parts, nets);
  return { parts, nets, notes };
}

function chooseName(c: NetClass, version: number): string {
  let best: Driver | undefined;
  for (const d of c.drivers) if (!best || compareDrivers(d, best, version) < 0) best = d;
  if (best) return best.name;
  const noConnect = (c.flags & FLAG_NO_CONNECT) !== 0;
  const candidates: Driver[] = [];
  for (const p of c.members) {
    const annotated = p.part.annotated;
    const ref = annotated ? p.part.ref : p.part.resolved.sym.uuid || p.part.ref;
    const refWithUnit = p.part.lib.unitCount > 1 && annotated ? ref + unitLetters(p.part.resolved.unit) : ref;
    candidates.push({
      node: p.node, priority: annotated ? PRIORITY.pin : 0, depth: p.part.inst.depth, rank: 0, alias: false,
      name: defaultNetName({ ref, refWithUnit, number: p.number, name: p.name, nameRepeats: p.nameRepeats }, noConnect, version),
    });
  }
  // Pins name nets regardless of sheet depth; only the name order decides between them.
  for (const d of candidates) d.depth = 0;
  let bestPin: Driver | undefined;
  for (const d of candidates) if (!bestPin || compareDrivers(d, bestPin, version) < 0) bestPin = d;
  return bestPin?.name ?? "Net-(unnamed)";
}

/** Units of one reference become one part; the lowest unit gives value, origin and span. */
function mergeParts(records: PartRecord[], netOfPin: Map<PinRecord, string>, notes: ReadNote[]): Part[] {
  const byRef = new Map<string, PartRecord[]>();
  for (const r of records) {
    if (!r.resolved.onBoard) continue;
    const list = byRef.get(r.ref);
    if (list) list.push(r);
    else byRef.set(r.ref, [r]);
  }
  const parts: Part[] = [];
  for (const [ref, units] of byRef) {
    units.sort((a, b) => a.resolved.unit - b.resolved.unit);
    const seenUnits = new Set<number>();
    for (const u of units) {
      if (seenUnits.has(u.resolved.unit)) {
        notes.push({ file: u.inst.sheet.file, line: u.resolved.sym.line, column: u.resolved.sym.column, ref,
          message: `reference ${ref} (unit ${u.resolved.unit}) is placed more than once; the copies are merged — re-annotate the schematic` });
      }
      seenUnits.add(u.resolved.unit);
    }
    const first = units[0] as PartRecord;
    const fields: Record<string, string> = {};
    for (const u of units) {
      for (const [k, v] of Object.entries(u.resolved.sym.fields)) if (fields[k] === undefined || (fields[k] === "" && v !== "")) fields[k] = v;
    }
    const pins: Record<string, string> = {};
    const pinNames: Record<string, string> = {};
    const pinTypes: Record<string, string> = {};
    for (const u of units) {
      for (const p of u.pins) {
        const net = netOfPin.get(p);
        if (net === undefined) continue;
        const earlier = pins[p.number];
        if (earlier === undefined) {
          pins[p.number] = net;
          pinNames[p.number] = p.name;
          pinTypes[p.number] = p.type;
        } else if (earlier !== net) {
          notes.push({ file: u.inst.sheet.file, line: u.resolved.sym.line, column: u.resolved.sym.column, ref,
            message: `pin ${p.number} of ${ref} is drawn more than once and touches two nets (${earlier}, ${net}); the first is kept` });
        }
      }
    }
    const value = units.find((u) => u.resolved.value !== "")?.resolved ?? first.resolved;
    const input = {
      ref,
      value: value.value,
      libId: first.resolved.sym.libId,
      footprint: units.find((u) => u.resolved.footprint !== "")?.resolved.footprint ?? "",
      pins,
      pinNames,
      pinTypes,
      fields,
      dnp: units.some((u) => u.resolved.dnp),
      excludedFromSim: units.some((u) => u.resolved.excludeFromSim),
      origin: { file: first.inst.sheet.file, line: first.resolved.sym.line, column: first.resolved.sym.column, sheetPath: first.inst.namePath },
    };
    parts.push(buildPart(value.valueSpan ? { ...input, valueSpan: value.valueSpan } : input));
  }
  return parts;
}
