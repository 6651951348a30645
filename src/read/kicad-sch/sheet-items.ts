// The connectable items of a sheet other than symbols: wires, buses, bus entries, junctions,
// no-connect flags, labels, hierarchical sheets and the v6 root instance table (KiCad format
// notes §3, §8.1, §10).
import type { ReadNote } from "../../circuit/types.js";
import { argNumber, argText, childOf, childrenOf, flagOf, keywordOf, where, type SList } from "../sexpr.js";
import { unescapeKicad } from "./escapes.js";
import { inRange, toGrid } from "./geometry.js";
import { readInstanceData } from "./placed-symbols.js";
import { readProperty } from "./properties.js";
import type { InstanceData, LabelKind, SheetLabel, SheetPin, SheetRef } from "./sheet-data.js";

type Note = (list: SList, message: string) => void;

export function noteAt(file: string, notes: ReadNote[]): Note {
  return (list, message) => {
    const p = where(list);
    notes.push({ file, line: p.line, column: p.column, message });
  };
}

/** `(at x y …)` as grid units, or undefined when missing or out of range. */
export function readAt(list: SList): { x: number; y: number; angle: number } | undefined {
  const at = childOf(list, "at");
  const x = argNumber(at, 1);
  const y = argNumber(at, 2);
  if (x === undefined || y === undefined) return undefined;
  const gx = toGrid(x);
  const gy = toGrid(y);
  if (!inRange(gx) || !inRange(gy)) return undefined;
  return { x: gx, y: gy, angle: argNumber(at, 3) ?? 0 };
}

/** Appends the segments of a `(wire (pts (xy …) (xy …)))` (or bus) to `out`. */
export function readSegments(item: SList, out: number[], note: Note): void {
  const pts = childOf(item, "pts");
  const xy = pts ? childrenOf(pts, "xy") : [];
  const coords: number[] = [];
  for (const p of xy) {
    const x = argNumber(p, 1);
    const y = argNumber(p, 2);
    if (x === undefined || y === undefined || !inRange(toGrid(x)) || !inRange(toGrid(y))) {
      note(item, `${keywordOf(item) ?? "wire"} with an unreadable point; ignored`);
      return;
    }
    coords.push(toGrid(x), toGrid(y));
  }
  if (coords.length < 4) { note(item, `${keywordOf(item) ?? "wire"} with fewer than two points; ignored`); return; }
  // KiCad writes exactly two points; a hand-made polyline of more is read as consecutive segments.
  for (let i = 0; i + 3 < coords.length; i += 2) {
    out.push(coords[i] ?? 0, coords[i + 1] ?? 0, coords[i + 2] ?? 0, coords[i + 3] ?? 0);
  }
}

export function readBusEntry(item: SList, out: number[], note: Note): void {
  const at = readAt(item);
  const size = childOf(item, "size");
  const dx = argNumber(size, 1);
  const dy = argNumber(size, 2);
  if (!at || dx === undefined || dy === undefined) { note(item, "bus_entry without (at …) and (size …); ignored"); return; }
  out.push(at.x, at.y, at.x + toGrid(dx), at.y + toGrid(dy));
}

export function readPoint(item: SList, out: number[], note: Note): void {
  const at = readAt(item);
  if (!at) { note(item, `${keywordOf(item) ?? "item"} without a readable (at x y); ignored`); return; }
  out.push(at.x, at.y);
}

const LABEL_KINDS: Record<string, LabelKind> = {
  label: "local",
  global_label: "global",
  hierarchical_label: "hierarchical",
};

export function readLabel(item: SList, note: Note): SheetLabel | undefined {
  const kind = LABEL_KINDS[keywordOf(item) ?? ""];
  const text = argText(item, 1);
  const at = readAt(item);
  if (kind === undefined || text === undefined || !at) { note(item, `${keywordOf(item) ?? "label"} without text or position; ignored`); return undefined; }
  const p = where(item);
  return { kind, text: unescapeKicad(text), x: at.x, y: at.y, shape: argText(childOf(item, "shape"), 1) ?? "", line: p.line, column: p.column };
}

/** A hierarchical sheet box and its pins. Field names changed over time: "Sheetname"/"Sheetfile"
 * (7+), "Sheet name"/"Sheet file" (6), and the first two properties in the oldest files. */
export function readSheet(item: SList, note: Note): SheetRef | undefined {
  let name: string | undefined;
  let fileName: string | undefined;
  const props = childrenOf(item, "property").map(readProperty);
  for (const prop of props) {
    if (!prop) continue;
    const key = prop.name.toLowerCase().replace(/\s+/g, "");
    if (key === "sheetname") name = prop.value;
    else if (key === "sheetfile") fileName = prop.value;
  }
  name ??= props[0]?.value;
  fileName ??= props[1]?.value;
  if (fileName === undefined || fileName === "") { note(item, "sheet without a Sheetfile property; ignored"); return undefined; }
  const pins: SheetPin[] = [];
  for (const pin of childrenOf(item, "pin")) {
    const pinName = argText(pin, 1);
    const at = readAt(pin);
    if (pinName === undefined || !at) { note(pin, "sheet pin without name or position; ignored"); continue; }
    const p = where(pin);
    pins.push({ name: unescapeKicad(pinName), shape: argText(pin, 2) ?? "", x: at.x, y: at.y, line: p.line, column: p.column });
  }
  const p = where(item);
  return {
    name: name ?? "",
    fileName,
    uuid: (argText(childOf(item, "uuid"), 1) ?? "").toLowerCase(),
    pins,
    dnp: flagOf(item, "dnp") === true,
    excludeFromSim: flagOf(item, "exclude_from_sim") === true,
    onBoard: flagOf(item, "on_board") !== false,
    line: p.line,
    column: p.column,
  };
}

/** v6 root `(symbol_instances (path "/…/uuid" (reference …) (unit …) (value …) (footprint …)) …)`. */
export function readSymbolInstances(item: SList, version: number, text: string, out: Map<string, InstanceData>): void {
  for (const path of childrenOf(item, "path")) {
    const p = argText(path, 1);
    if (p !== undefined) out.set(p.toLowerCase(), readInstanceData(path, version, text));
  }
}

/** `(bus_alias "NAME" (members "A" "B" …))`. */
export function readBusAlias(item: SList, out: Map<string, string[]>): void {
  const name = argText(item, 1);
  const members = childOf(item, "members");
  if (name === undefined || !members) return;
  const list: string[] = [];
  for (let i = 1; i < members.content.length; i++) {
    const t = argText(members, i);
    if (t !== undefined) list.push(t);
  }
  out.set(name, list);
}
