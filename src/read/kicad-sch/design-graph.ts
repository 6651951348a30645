// Connectivity of a whole design (KiCad format notes §8.3): one union-find over every sheet
// instance's geometry classes, pins and name nodes. Names join nets — local and hierarchical labels
// within an instance, global labels, global power names and hidden power_in pin names across the
// design — sheet pins join the child instance's hierarchical labels, and buses join member nets.
import type { ReadNote } from "../../circuit/types.js";
import type { BusName } from "./buses.js";
import { escapeNetText } from "./escapes.js";
import { pointKey, pinOffset } from "./geometry.js";
import type { SheetInstance } from "./hierarchy.js";
import { resolveSymbol, type ResolvedSymbol } from "./instance-symbols.js";
import { localGraphOf } from "./local-graph.js";
import { isGroundName, PRIORITY, type Driver } from "./net-names.js";
import type { LibSymbol, SheetData } from "./sheet-data.js";
import { UnionFind } from "./union-find.js";
import { POWER_NAME_FROM_VALUE } from "./versions.js";

/** Bus members expanded over a whole design (each bus label of width w costs w); further bus
 * names are read as plain names once the budget is spent. */
export const MAX_BUS_MEMBERS_PER_DESIGN = 1_000_000;

export const FLAG_NO_CONNECT = 1;
export const FLAG_POWER = 2;
export const FLAG_GROUND = 4;

export interface PinRecord {
  node: number;
  part: PartRecord;
  number: string;
  name: string;
  type: string;
  nameRepeats: boolean;
}

/** One placed symbol (one unit) of an ordinary part in one sheet instance. */
export interface PartRecord {
  ref: string;
  /** False for unannotated references (`R?`), which never name nets. */
  annotated: boolean;
  resolved: ResolvedSymbol;
  lib: LibSymbol;
  inst: SheetInstance;
  pins: PinRecord[];
}

export interface DesignGraph {
  uf: UnionFind;
  /** FLAG_* bits per node. */
  flags: Uint8Array;
  parts: PartRecord[];
  drivers: Driver[];
  notes: ReadNote[];
}

interface BusItem {
  bus: BusName;
  /** Name namespace of the members: "L<instance>" (local) or "G" (global). */
  space: string;
  priority: number;
  depth: number;
  rank: number;
  /** Prefix of member net names: the sheet path for local kinds, "" for global. */
  prefix: string;
  alias: boolean;
}

export function buildDesignGraph(instances: SheetInstance[], root: SheetData): DesignGraph {
  const uf = new UnionFind(4096);
  const flagList: number[] = [];
  const add = (flag = 0): number => { flagList.push(flag); return uf.add(); };
  const nameNodes = new Map<string, number>();
  const nameNode = (space: string, text: string): number => {
    const key = `${space}\u0000${text}`;
    let n = nameNodes.get(key);
    if (n === undefined) { n = add(); nameNodes.set(key, n); }
    return n;
  };
  const drivers: Driver[] = [];
  const parts: PartRecord[] = [];
  const notes: ReadNote[] = [];
  const missingLib = new Set<string>();
  const unannotatedCount = new Map<string, number>();
  const bases: number[] = [];
  const notedPins = new Set<string>();
  let busBudget = MAX_BUS_MEMBERS_PER_DESIGN;
  let busBudgetNoted = false;
  const spendBus = (bus: BusName, file: string, line: number, column: number): boolean => {
    if (bus.members.length <= busBudget) { busBudget -= bus.members.length; return true; }
    if (!busBudgetNoted) {
      busBudgetNoted = true;
      notes.push({ file, line, column, message: `more than ${MAX_BUS_MEMBERS_PER_DESIGN} bus members in the design; this and later bus names are not expanded` });
    }
    return false;
  };

  for (const inst of instances) {
    const sheet = inst.sheet;
    const g = localGraphOf(sheet);
    const local = `L${inst.index}`;
    const base = uf.length;
    bases[inst.index] = base;
    for (let c = 0; c < g.classCount; c++) add(g.noConnect[c] ? FLAG_NO_CONNECT : 0);

    // Labels on wires name and join nets.
    sheet.labels.forEach((label, i) => {
      const cls = g.labelClass[i] ?? -1;
      if (cls < 0) return;
      const node = base + cls;
      const global = label.kind === "global";
      uf.union(node, nameNode(global ? "G" : local, label.text));
      drivers.push({
        node,
        priority: global ? PRIORITY.globalLabel : label.kind === "local" ? PRIORITY.localLabel : PRIORITY.hierarchicalLabel,
        depth: inst.depth,
        rank: 0,
        name: global ? escapeNetText(label.text) : inst.namePath + escapeNetText(label.text),
        alias: true,
      });
    });

    // Symbols: pins at their transformed points; power names join the global namespace.
    const pinPoints = new Map<number, number>();
    for (const sym of sheet.symbols) {
      const resolved = resolveSymbol(sym, inst, root);
      const lib = sheet.lib.get(sym.libKey);
      if (!lib) {
        const key = `${sheet.file}\u0000${sym.libKey}`;
        if (!missingLib.has(key)) {
          missingLib.add(key);
          notes.push({ file: sheet.file, line: sym.line, column: sym.column, ref: resolved.reference,
            message: `symbol ${resolved.reference} uses library symbol "${sym.libKey}", which is not embedded in the file; its pins are unknown` });
        }
        continue;
      }
      const isPowerSymbol = lib.power !== undefined;
      const isPart = !isPowerSymbol && !resolved.reference.startsWith("#");
      let part: PartRecord | undefined;
      if (isPart) {
        let ref = resolved.reference;
        const annotated = ref !== "" && !ref.endsWith("?");
        if (!annotated) {
          // Unannotated symbols would all merge into one part; number them apart and say so.
          const stem = ref === "" ? "?" : ref;
          const k = (unannotatedCount.get(stem) ?? 0) + 1;
          unannotatedCount.set(stem, k);
          ref = `${stem}${k}`;
          notes.push({ file: sheet.file, line: sym.line, column: sym.column, ref,
            message: `symbol ${stem} is not annotated; listed as ${ref} — annotate the schematic so references are stable` });
        }
        part = { ref, annotated, resolved, lib, inst, pins: [] };
        parts.push(part);
      }
      const groundSymbol = isPowerSymbol && (isGroundName(lib.id) || isGroundName(resolved.value));
      for (const lp of lib.pins) {
        if (lp.unit !== 0 && lp.unit !== resolved.unit) continue;
        if (lp.style !== 0 && lp.style !== sym.bodyStyle) continue;
        const altName = sym.alternates.get(lp.number);
        const altType = altName !== undefined ? lp.alternates.get(altName) : undefined;
        const name = altType !== undefined && altName !== undefined ? altName : lp.name;
        const type = altType ?? lp.type;
        const [dx, dy] = pinOffset(lp.x, lp.y, sym.angle, sym.mirror);
        const key = pointKey(sym.x + dx, sym.y + dy);
        let flag = type === "no_connect" ? FLAG_NO_CONNECT : 0;
        if (isPowerSymbol) flag |= FLAG_POWER | (groundSymbol ? FLAG_GROUND : 0);
        const node = add(flag);
        const cls = g.pointClass.get(key);
        if (cls !== undefined) uf.union(node, base + cls);
        else {
          const other = pinPoints.get(key);
          if (other === undefined) pinPoints.set(key, node);
          else uf.union(node, other); // pin touching pin
        }
        if (isPowerSymbol) {
          if (type !== "power_in") continue; // a power flag marks the net but does not name it
          const netName = sheet.version >= POWER_NAME_FROM_VALUE
            ? (resolved.value !== "" ? resolved.value : name)
            : (name !== "" ? name : resolved.value);
          if (netName === "") continue;
          const localPower = lib.power === "local";
          uf.union(node, nameNode(localPower ? `P${inst.index}` : "G", netName));
          drivers.push({
            node, priority: PRIORITY.powerPin, depth: inst.depth, rank: localPower ? 1 : 2,
            name: localPower ? inst.namePath + escapeNetText(netName) : escapeNetText(netName), alias: true,
          });
          continue;
        }
        if (type === "power_in" && lp.hidden && name !== "") {
          // Legacy implicit supply pin: joins the global net of its name (§7, §8.3).
          flagList[node] = (flagList[node] ?? 0) | FLAG_POWER;
          uf.union(node, nameNode("G", name));
          drivers.push({ node, priority: PRIORITY.powerPin, depth: inst.depth, rank: 2, name: escapeNetText(name), alias: true });
        }
        if (part) {
          const nameRepeats = name !== "" && (pinNameCounts(lib, resolved.unit, sym.bodyStyle).get(name) ?? 0) > 1;
          part.pins.push({ node, part, number: lp.number, name, type, nameRepeats });
        }
      }
    }

    // Sheet pins: name the parent net weakly and reach the child's hierarchical labels.
    const busItems = new Map<number, BusItem[]>();
    sheet.labels.forEach((label, i) => {
      const bus = g.labelBus[i];
      const cls = g.busClassOfLabel[i] ?? -1;
      if (!bus || cls < 0 || !spendBus(bus, sheet.file, label.line, label.column)) return;
      const global = label.kind === "global";
      pushBus(busItems, cls, {
        bus, space: global ? "G" : local, depth: inst.depth, rank: 0, prefix: global ? "" : inst.namePath, alias: true,
        priority: global ? PRIORITY.globalLabel : label.kind === "local" ? PRIORITY.localLabel : PRIORITY.hierarchicalLabel,
      });
    });
    sheet.sheets.forEach((ref, si) => {
      const child = instances[inst.children[si] ?? -1];
      if (!child) return;
      const childGraph = localGraphOf(child.sheet);
      const childSpace = `L${child.index}`;
      ref.pins.forEach((pin, pi) => {
        const reaches = childGraph.hierarchicalTexts.has(pin.name);
        const noteKey = `${sheet.file}\u0000${pin.line}\u0000${pin.column}`;
        if (!reaches && !notedPins.has(noteKey)) {
          notedPins.add(noteKey);
          notes.push({ file: sheet.file, line: pin.line, column: pin.column,
            message: `sheet pin "${pin.name}" of sheet "${ref.name}" has no hierarchical label of that name in ${child.sheet.file}; it connects nothing inside` });
        }
        const bus = g.sheetPinBus[si]?.[pi];
        if (bus) {
          if (!spendBus(bus, sheet.file, pin.line, pin.column)) return;
          const cls = g.busClassOfSheetPin[si]?.[pi] ?? -1;
          if (cls >= 0) {
            pushBus(busItems, cls, { bus, space: local, priority: PRIORITY.sheetPin, depth: inst.depth,
              rank: pin.shape === "output" ? 1 : 0, prefix: inst.namePath, alias: false });
          }
          if (reaches) for (const m of bus.members) uf.union(nameNode(local, m), nameNode(childSpace, m));
          return;
        }
        const cls = g.sheetPinClass[si]?.[pi] ?? -1;
        if (cls < 0) return;
        const node = base + cls;
        drivers.push({ node, priority: PRIORITY.sheetPin, depth: inst.depth, rank: pin.shape === "output" ? 1 : 0,
          name: inst.namePath + escapeNetText(pin.name), alias: false });
        if (reaches) uf.union(node, nameNode(childSpace, pin.name));
      });
    });

    // Buses: members of every bus name on one bus are joined (vectors by index, groups by name),
    // and each member takes the bus name's priority as a candidate name.
    for (const items of busItems.values()) {
      for (const item of items) {
        for (const m of item.bus.members) {
          drivers.push({ node: nameNode(item.space, m), priority: item.priority, depth: item.depth, rank: item.rank,
            name: item.prefix + escapeNetText(m), alias: item.alias });
        }
      }
      const vectors = items.filter((it) => it.bus.kind === "vector");
      const first = vectors[0];
      if (first) {
        for (const other of vectors.slice(1)) {
          const n = Math.min(first.bus.members.length, other.bus.members.length);
          for (let k = 0; k < n; k++) {
            uf.union(nameNode(first.space, first.bus.members[k] ?? ""), nameNode(other.space, other.bus.members[k] ?? ""));
          }
        }
      }
      const byMember = new Map<string, number>();
      for (const item of items) {
        if (item.bus.kind !== "group") continue;
        for (const m of item.bus.members) {
          const node = nameNode(item.space, m);
          const seen = byMember.get(m);
          if (seen === undefined) byMember.set(m, node);
          else uf.union(seen, node);
        }
      }
    }
  }
  return { uf, flags: Uint8Array.from(flagList), parts, drivers, notes };
}

const nameCountCache = new WeakMap<LibSymbol, Map<string, Map<string, number>>>();

/** How many pins of one unit/body style carry each name (for `-PadN` in generated net names). */
function pinNameCounts(lib: LibSymbol, unit: number, style: number): Map<string, number> {
  let perUnit = nameCountCache.get(lib);
  if (!perUnit) { perUnit = new Map(); nameCountCache.set(lib, perUnit); }
  const key = `${unit}/${style}`;
  let counts = perUnit.get(key);
  if (!counts) {
    counts = new Map();
    for (const p of lib.pins) {
      if ((p.unit === 0 || p.unit === unit) && (p.style === 0 || p.style === style) && p.name !== "") {
        counts.set(p.name, (counts.get(p.name) ?? 0) + 1);
      }
    }
    perUnit.set(key, counts);
  }
  return counts;
}

function pushBus(map: Map<number, BusItem[]>, cls: number, item: BusItem): void {
  const list = map.get(cls);
  if (list) list.push(item);
  else map.set(cls, [item]);
}
