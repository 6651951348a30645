// Each schematic file is parsed once per FileSource and kept only as its compact SheetData, so a
// file used by many sheet instances (or reached from several roots) costs one parse, and the
// s-expression tree is garbage as soon as extraction ends.
import type { ReadError } from "../../circuit/types.js";
import type { FileSource } from "../file-source.js";
import { loadTree } from "../load-file.js";
import type { SexprTree } from "../sexpr.js";
import { extractSheet } from "./extract-sheet.js";
import type { SheetData } from "./sheet-data.js";

export type SheetResult = { ok: true; sheet: SheetData; real: string } | { ok: false; error: ReadError };

const caches = new WeakMap<FileSource, Map<string, SheetResult>>();

function cacheFor(fs: FileSource): Map<string, SheetResult> {
  let c = caches.get(fs);
  if (!c) { c = new Map(); caches.set(fs, c); }
  return c;
}

/** Loads (or returns the cached) SheetData of a schematic file. */
export function loadSheet(fs: FileSource, file: string): SheetResult {
  const real = fs.realpath(file);
  const cache = cacheFor(fs);
  if (typeof real === "string") {
    const hit = cache.get(real);
    if (hit) return hit;
  }
  const loaded = loadTree(fs, file);
  const result = loaded.ok ? fromTree(loaded.tree, file, loaded.real) : loaded;
  if (typeof real === "string") cache.set(real, result);
  return result;
}

/** Extracts from an already parsed tree and caches the result under `real`. */
export function sheetFromTree(fs: FileSource, tree: SexprTree, file: string, real: string): SheetResult {
  const cache = cacheFor(fs);
  const hit = cache.get(real);
  if (hit) return hit;
  const result = fromTree(tree, file, real);
  cache.set(real, result);
  return result;
}

function fromTree(tree: SexprTree, file: string, real: string): SheetResult {
  const extracted = extractSheet(tree.nodes, tree.text, file);
  return extracted.ok ? { ok: true, sheet: extracted.sheet, real } : extracted;
}
