// Turns one parsed `.kicad_sch` tree into its compact SheetData; the tree can be dropped afterwards.
import type { ReadError, ReadNote } from "../../circuit/types.js";
import { argNumber, argText, childOf, keywordOf, textOf, where, type SNode } from "../sexpr.js";
import { extractLibSymbols } from "./lib-symbols.js";
import { readPlacedSymbol } from "./placed-symbols.js";
import type { SheetData } from "./sheet-data.js";
import {
  noteAt, readBusAlias, readBusEntry, readLabel, readPoint, readSegments, readSheet, readSymbolInstances,
} from "./sheet-items.js";
import { NEWEST_KNOWN_VERSION, OLDEST_KNOWN_VERSION } from "./versions.js";

export type ExtractResult = { ok: true; sheet: SheetData } | { ok: false; error: ReadError };

/** Describes the first form of a file for "not a schematic" messages. */
export function describeFirstForm(nodes: SNode[]): string {
  const first = nodes[0];
  if (first === undefined) return "an empty file";
  const kw = keywordOf(first);
  if (kw !== undefined) return `"(${kw}"`;
  const t = textOf(first);
  return t !== undefined ? `"${t.slice(0, 40)}"` : "a list without a keyword";
}

export function extractSheet(nodes: SNode[], text: string, file: string): ExtractResult {
  const root = nodes[0];
  if (root === undefined || keywordOf(root) !== "kicad_sch" || root.type !== "list") {
    const p = root ? where(root) : { line: 1, column: 1 };
    const hint = keywordOf(root) === "export" ? " (this is a KiCad netlist; give it a .net name)"
      : keywordOf(root) === undefined && textOf(root)?.startsWith("EESchema") ? " (KiCad 5 .sch files are not read; open and save the design in KiCad 6 or later)"
      : "";
    return { ok: false, error: { file, line: p.line, column: p.column,
      message: `not a KiCad schematic: expected "(kicad_sch" at the start, found ${describeFirstForm(nodes)}${hint}` } };
  }
  const notes: ReadNote[] = [];
  const note = noteAt(file, notes);
  const extra = nodes[1];
  if (extra !== undefined) {
    const p = where(extra);
    notes.push({ file, line: p.line, column: p.column, message: "text after the end of the schematic list; ignored" });
  }
  const versionList = childOf(root, "version");
  let version = argNumber(versionList, 1);
  if (version === undefined) {
    note(root, `no readable (version …) in the schematic header; read as version ${NEWEST_KNOWN_VERSION}`);
    version = NEWEST_KNOWN_VERSION;
  } else if (version > NEWEST_KNOWN_VERSION) {
    note(versionList ?? root, `file version ${version} is newer than this reader knows (${NEWEST_KNOWN_VERSION}); reading it anyway — check the results`);
  } else if (version < OLDEST_KNOWN_VERSION) {
    note(versionList ?? root, `file version ${version} is older than the KiCad 6 schematic format this reader knows (${OLDEST_KNOWN_VERSION}); reading it anyway`);
  }

  const sheet: SheetData = {
    file,
    version,
    uuid: (argText(childOf(root, "uuid"), 1) ?? "").toLowerCase(),
    lib: new Map(),
    symbols: [],
    wires: [],
    buses: [],
    busEntries: [],
    junctions: [],
    noConnects: [],
    labels: [],
    sheets: [],
    symbolInstances: new Map(),
    busAliases: new Map(),
    notes,
  };
  for (let i = 1; i < root.content.length; i++) {
    const item = root.content[i];
    if (item === undefined || item.type !== "list") continue;
    switch (keywordOf(item)) {
      case "lib_symbols": sheet.lib = extractLibSymbols(item, version, file, notes); break;
      case "symbol": { const s = readPlacedSymbol(item, version, file, text, notes); if (s) sheet.symbols.push(s); break; }
      case "wire": readSegments(item, sheet.wires, note); break;
      case "bus": readSegments(item, sheet.buses, note); break;
      case "bus_entry": readBusEntry(item, sheet.busEntries, note); break;
      case "junction": readPoint(item, sheet.junctions, note); break;
      case "no_connect": readPoint(item, sheet.noConnects, note); break;
      case "label":
      case "global_label":
      case "hierarchical_label": { const l = readLabel(item, note); if (l) sheet.labels.push(l); break; }
      case "sheet": { const s = readSheet(item, note); if (s) sheet.sheets.push(s); break; }
      case "symbol_instances": readSymbolInstances(item, version, text, sheet.symbolInstances); break;
      case "bus_alias": readBusAlias(item, sheet.busAliases); break;
      default: break; // graphics, text, title block, embedded files: nothing to connect
    }
  }
  return { ok: true, sheet };
}
