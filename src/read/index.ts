// The reader's public face: one call turns a file (schematic root or exported netlist) into a
// Circuit or a ReadError. The format is told by the file's first keyword, not its name.
import { dirname } from "node:path";
import type { ReadError, ReadResult } from "../circuit/types.js";
import { memoryFileSource, nodeFileSource, type FileSource } from "./file-source.js";
import { readNetlistTree } from "./kicad-net.js";
import { describeFirstForm } from "./kicad-sch/extract-sheet.js";
import { sheetPathFor } from "./kicad-sch/hierarchy.js";
import { readSchematic } from "./kicad-sch/read-schematic.js";
import { loadSheet, sheetFromTree, type SheetResult } from "./kicad-sch/sheet-cache.js";
import { loadTree, wholeFileError } from "./load-file.js";
import { keywordOf, textOf, where } from "./sexpr.js";

export { memoryFileSource, nodeFileSource, type FileSource };
export { MAX_FILE_BYTES, MAX_NESTING_DEPTH } from "./sexpr.js";
export { MAX_DESIGN_ITEMS, MAX_SHEET_DEPTH, MAX_SHEET_INSTANCES } from "./kicad-sch/hierarchy.js";
export { MAX_BUS_MEMBERS_PER_DESIGN } from "./kicad-sch/design-graph.js";
export { MAX_FREE_ANGLE_SEGMENTS } from "./kicad-sch/segment-index.js";
export { MAX_BUS_MEMBERS } from "./kicad-sch/buses.js";
export { MAX_COORDINATE } from "./kicad-sch/geometry.js";

export interface ReadOptions {
  fs?: FileSource;
  /** Sheets and model libraries must stay inside this folder; default: the root file's folder. */
  projectRoot?: string;
}

export function readDesign(path: string, opts: ReadOptions = {}): ReadResult {
  const fs = opts.fs ?? nodeFileSource();
  try {
    const opened = openRoot(fs, path, opts.projectRoot ?? dirname(path));
    if (opened.kind === "done") return opened.result;
    return readSchematic(path, opts.projectRoot !== undefined ? { fs, root: opened.root, projectRoot: opts.projectRoot } : { fs, root: opened.root });
  } catch (err) {
    // Deep recursion anywhere below is bad input, not a bug worth a stack trace.
    if (err instanceof RangeError) return wholeFileError(path, `the design is too large or too deeply nested to read (${err.message})`);
    throw err;
  }
}

/** Parses the root file and either finishes (netlist, error) or hands back the extracted root
 * sheet. Kept separate so the root's s-expression tree dies with this frame, before the rest of
 * the hierarchy is read: peak memory then follows the largest sheet. */
function openRoot(fs: FileSource, path: string, projectRoot: string): { kind: "done"; result: ReadResult } | { kind: "schematic"; root: SheetResult } {
  const loaded = loadTree(fs, path);
  if (!loaded.ok) return { kind: "done", result: loaded };
  const first = loaded.tree.nodes[0];
  const kw = keywordOf(first);
  if (kw === "kicad_sch") return { kind: "schematic", root: sheetFromTree(fs, loaded.tree, path, loaded.real) };
  if (kw === "export") return { kind: "done", result: readNetlistTree(loaded.tree, path, fs, projectRoot) };
  const p = first ? where(first) : { line: 1, column: 1 };
  const legacy = textOf(first) === "EESchema" ? " (a KiCad 5 schematic: open and save it in KiCad 6 or later, or export a netlist)" : "";
  return { kind: "done", result: { ok: false, error: { file: path, line: p.line, column: p.column,
    message: `not a KiCad schematic or netlist: expected "(kicad_sch" or "(export" at the start, found ${describeFirstForm(loaded.tree.nodes)}${legacy}` } } };
}

/**
 * Of the files given, those that are not sub-sheets reached from another given file. Files that
 * cannot be read are reported in `errors` and left out of `roots`. Two files that reach each
 * other (a cycle) both stay roots, so reading them reports the cycle.
 */
export function findRootSheets(paths: string[], fs: FileSource = nodeFileSource()): { roots: string[]; errors: ReadError[] } {
  const errors: ReadError[] = [];
  const given: { path: string; real: string }[] = [];
  for (const path of paths) {
    try {
      const loaded = loadTree(fs, path);
      if (!loaded.ok) { errors.push(loaded.error); continue; }
      const kw = keywordOf(loaded.tree.nodes[0]);
      if (kw === "kicad_sch") {
        const s = sheetFromTree(fs, loaded.tree, path, loaded.real);
        if (!s.ok) { errors.push(s.error); continue; }
      }
      given.push({ path, real: loaded.real });
    } catch (err) {
      if (err instanceof RangeError) { errors.push({ file: path, line: 0, column: 0, message: "the file is too deeply nested to read" }); continue; }
      throw err;
    }
  }
  const reach = new Map<string, Set<string>>();
  for (const g of given) reach.set(g.real, reachableSheets(fs, g.path));
  const roots = given.filter((x) => !given.some((y) =>
    y.real !== x.real && (reach.get(y.real)?.has(x.real) ?? false) && !(reach.get(x.real)?.has(y.real) ?? false)));
  // The same file given twice is one design.
  const seen = new Set<string>();
  return { roots: roots.filter((r) => (seen.has(r.real) ? false : (seen.add(r.real), true))).map((r) => r.path), errors };
}

/** Real paths of every sheet file below `path` (not including itself unless through a cycle). */
function reachableSheets(fs: FileSource, path: string): Set<string> {
  const out = new Set<string>();
  const queue: string[] = [path];
  while (queue.length > 0) {
    const file = queue.shift() as string;
    const s = loadSheet(fs, file);
    if (!s.ok) continue;
    for (const ref of s.sheet.sheets) {
      const child = sheetPathFor(s.sheet.file, ref.fileName);
      const real = fs.realpath(child);
      if (typeof real !== "string" || out.has(real)) continue;
      out.add(real);
      queue.push(child);
    }
  }
  return out;
}
