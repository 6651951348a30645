// The connectivity of one sheet file's drawn geometry — wires, bus entries, junctions, labels,
// no-connect flags, sheet pins — which is the same in every instance of the file, so it is worked
// out once per file (KiCad format notes §8.2–§8.3). Symbol pins depend on the instance (units are
// per instance) and are attached later by looking their points up here.
import { parseBusName, type BusName } from "./buses.js";
import { pointKey } from "./geometry.js";
import { MAX_FREE_ANGLE_SEGMENTS, SegmentIndex } from "./segment-index.js";
import type { SheetData } from "./sheet-data.js";
import { UnionFind } from "./union-find.js";

export interface LocalGraph {
  /** Number of wire-layer classes (0…classCount−1). */
  classCount: number;
  /** Wire-layer connection points → class. Pins landing elsewhere touch no geometry. */
  pointClass: Map<number, number>;
  /** Per label: its wire-layer class, or −1 for a bus label (see `busClassOfLabel`). */
  labelClass: Int32Array;
  /** Per sheet, per pin: wire-layer class, or −1 for a bus pin. */
  sheetPinClass: Int32Array[];
  /** Classes touched by a no-connect flag. */
  noConnect: Uint8Array;
  /** Bus layer: bus labels and bus sheet pins grouped by the bus they sit on. */
  busClassOfLabel: Int32Array;
  busClassOfSheetPin: Int32Array[];
  busClassCount: number;
  /** Parsed bus names of labels / sheet pins (undefined for ordinary names). */
  labelBus: (BusName | undefined)[];
  sheetPinBus: (BusName | undefined)[][];
  /** Texts of the hierarchical labels in this file (what a parent's sheet pins can reach). */
  hierarchicalTexts: Set<string>;
}

const cache = new WeakMap<SheetData, LocalGraph>();

export function localGraphOf(sheet: SheetData): LocalGraph {
  let g = cache.get(sheet);
  if (!g) { g = buildLocalGraph(sheet); cache.set(sheet, g); }
  return g;
}

function buildLocalGraph(sheet: SheetData): LocalGraph {
  const uf = new UnionFind(1024);
  // Wire-layer segments: wires then bus entries (an entry is a short wire on the net side).
  const segs = sheet.wires.concat(sheet.busEntries);
  const segCount = segs.length >> 2;
  for (let i = 0; i < segCount; i++) uf.add();
  const index = new SegmentIndex(segs, (a, b) => { uf.union(a, b); });
  if (index.overflow > 0) {
    sheet.notes.push({ file: sheet.file, line: 0, column: 0,
      message: `${index.overflow} wires at angles other than 0/45/90° beyond the first ${MAX_FREE_ANGLE_SEGMENTS} connect only at their ends (labels and junctions on their interior are not checked)` });
  }
  const points = new Map<number, number>();
  const attach = (id: number, x: number, y: number): void => {
    const key = pointKey(x, y);
    const other = points.get(key);
    if (other === undefined) points.set(key, id);
    else uf.union(id, other);
  };
  const attachThrough = (id: number, x: number, y: number): void => {
    index.forEachAt(x, y, (seg) => { uf.union(id, seg); });
  };
  for (let i = 0; i < segCount; i++) {
    attach(i, segs[4 * i] ?? 0, segs[4 * i + 1] ?? 0);
    attach(i, segs[4 * i + 2] ?? 0, segs[4 * i + 3] ?? 0);
  }
  // Bus-entry ends split the wires they sit on (§8.2 rule 4).
  for (let i = sheet.wires.length >> 2; i < segCount; i++) {
    attachThrough(i, segs[4 * i] ?? 0, segs[4 * i + 1] ?? 0);
    attachThrough(i, segs[4 * i + 2] ?? 0, segs[4 * i + 3] ?? 0);
  }
  // Junctions join everything at their point and every wire passing through it.
  const junctionIds: number[] = [];
  for (let k = 0; k < sheet.junctions.length; k += 2) {
    const id = uf.add();
    const x = sheet.junctions[k] ?? 0, y = sheet.junctions[k + 1] ?? 0;
    attach(id, x, y);
    attachThrough(id, x, y);
    junctionIds.push(id);
  }
  const ncIds: number[] = [];
  for (let k = 0; k < sheet.noConnects.length; k += 2) {
    const id = uf.add();
    attach(id, sheet.noConnects[k] ?? 0, sheet.noConnects[k + 1] ?? 0);
    ncIds.push(id);
  }
  // Labels attach at their anchor and anywhere along a wire (§8.2 rule 5).
  const labelBus = sheet.labels.map((l) => parseBusName(l.text, sheet.busAliases));
  const labelIds = sheet.labels.map((l, i) => {
    if (labelBus[i]) return -1;
    const id = uf.add();
    attach(id, l.x, l.y);
    attachThrough(id, l.x, l.y);
    return id;
  });
  const sheetPinBus = sheet.sheets.map((s) => s.pins.map((p) => parseBusName(p.name, sheet.busAliases)));
  const sheetPinIds = sheet.sheets.map((s, si) => s.pins.map((p, pi) => {
    if (sheetPinBus[si]?.[pi]) return -1;
    const id = uf.add();
    attach(id, p.x, p.y);
    return id;
  }));

  // Compress roots to dense class numbers.
  const classOfRoot = new Map<number, number>();
  const classOf = (id: number): number => {
    const r = uf.find(id);
    let c = classOfRoot.get(r);
    if (c === undefined) { c = classOfRoot.size; classOfRoot.set(r, c); }
    return c;
  };
  const pointClass = new Map<number, number>();
  for (const [key, id] of points) pointClass.set(key, classOf(id));
  const labelClass = Int32Array.from(labelIds, (id) => (id < 0 ? -1 : classOf(id)));
  const sheetPinClass = sheetPinIds.map((ids) => Int32Array.from(ids, (id) => (id < 0 ? -1 : classOf(id))));
  for (const id of junctionIds) classOf(id);
  const ncClasses = ncIds.map(classOf);
  const classCount = classOfRoot.size;
  const noConnect = new Uint8Array(classCount);
  for (const c of ncClasses) noConnect[c] = 1;

  const bus = buildBusLayer(sheet, labelBus, sheetPinBus);
  const hierarchicalTexts = new Set<string>();
  for (const l of sheet.labels) if (l.kind === "hierarchical") hierarchicalTexts.add(l.text);
  return {
    classCount, pointClass, labelClass, sheetPinClass, noConnect,
    busClassOfLabel: bus.ofLabel, busClassOfSheetPin: bus.ofSheetPin, busClassCount: bus.count,
    labelBus, sheetPinBus, hierarchicalTexts,
  };
}

/** Groups bus labels and bus sheet pins by the bus segments (and junctions) that join them.
 * Wires never join buses (§8.2 rule 8). */
function buildBusLayer(
  sheet: SheetData,
  labelBus: (BusName | undefined)[],
  sheetPinBus: (BusName | undefined)[][],
): { ofLabel: Int32Array; ofSheetPin: Int32Array[]; count: number } {
  const uf = new UnionFind(64);
  const segCount = sheet.buses.length >> 2;
  for (let i = 0; i < segCount; i++) uf.add();
  const index = new SegmentIndex(sheet.buses, (a, b) => { uf.union(a, b); });
  const points = new Map<number, number>();
  const attach = (id: number, x: number, y: number, through: boolean): void => {
    const key = pointKey(x, y);
    const other = points.get(key);
    if (other === undefined) points.set(key, id);
    else uf.union(id, other);
    if (through) index.forEachAt(x, y, (seg) => { uf.union(id, seg); });
  };
  for (let i = 0; i < segCount; i++) {
    attach(i, sheet.buses[4 * i] ?? 0, sheet.buses[4 * i + 1] ?? 0, false);
    attach(i, sheet.buses[4 * i + 2] ?? 0, sheet.buses[4 * i + 3] ?? 0, false);
  }
  for (let k = 0; k < sheet.junctions.length; k += 2) {
    attach(uf.add(), sheet.junctions[k] ?? 0, sheet.junctions[k + 1] ?? 0, true);
  }
  const labelIds = sheet.labels.map((l, i) => (labelBus[i] ? ((id) => { attach(id, l.x, l.y, true); return id; })(uf.add()) : -1));
  const pinIds = sheet.sheets.map((s, si) => s.pins.map((p, pi) =>
    sheetPinBus[si]?.[pi] ? ((id) => { attach(id, p.x, p.y, false); return id; })(uf.add()) : -1));
  const classOfRoot = new Map<number, number>();
  const classOf = (id: number): number => {
    if (id < 0) return -1;
    const r = uf.find(id);
    let c = classOfRoot.get(r);
    if (c === undefined) { c = classOfRoot.size; classOfRoot.set(r, c); }
    return c;
  };
  return {
    ofLabel: Int32Array.from(labelIds, classOf),
    ofSheetPin: pinIds.map((ids) => Int32Array.from(ids, classOf)),
    count: classOfRoot.size,
  };
}
