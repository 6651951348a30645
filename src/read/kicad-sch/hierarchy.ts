// Expands the sheet tree from the root file into sheet *instances* (a file placed twice is two
// instances with their own references), resolving and vetting each `Sheetfile` (KiCad format notes
// §10): relative to the containing file's folder, inside the project folder, no cycles, bounded
// depth and size. Any refusal is an error for this design.
import { dirname, isAbsolute, join, relative } from "node:path";
import type { ReadError } from "../../circuit/types.js";
import type { FileSource } from "../file-source.js";
import { loadSheet } from "./sheet-cache.js";
import type { SheetData, SheetRef } from "./sheet-data.js";

/** Deepest sheet nesting accepted (the root is depth 0). */
export const MAX_SHEET_DEPTH = 32;
/** Most sheet instances one design may expand to (guards against a small file set that nests
 * many copies of itself into an exponential tree). */
export const MAX_SHEET_INSTANCES = 10_000;

/** Most symbols, labels and wires one design may expand to over all its sheet instances (a sheet
 * file used many times multiplies its contents; this bounds the work a small input can demand). */
export const MAX_DESIGN_ITEMS = 5_000_000;

function itemCount(s: SheetData): number {
  return s.symbols.length + s.labels.length + (s.wires.length >> 2) + (s.buses.length >> 2) + s.sheets.length;
}

export interface SheetInstance {
  index: number;
  sheet: SheetData;
  /** Human path: `/` for the root, `/preamp/`, `/preamp/bias/`. */
  namePath: string;
  /** Sheet UUIDs from the root down, excluding the root's own. */
  uuidPath: string[];
  depth: number;
  /** Parent instance index, −1 for the root. */
  parent: number;
  /** Index of this sheet's `(sheet …)` item in the parent file. */
  sheetIndex: number;
  /** Child instance index per `(sheet …)` item of this file (−1 never happens once built). */
  children: number[];
  dnp: boolean;
  excludeFromSim: boolean;
  onBoard: boolean;
}

export type HierarchyResult = { ok: true; instances: SheetInstance[] } | { ok: false; error: ReadError };

/** Sheet file name as written → path to open (KiCad accepts `\` as well as `/`). */
export function sheetPathFor(containingFile: string, fileName: string): string {
  const normal = fileName.replace(/\\/g, "/");
  return isAbsolute(normal) ? normal : join(dirname(containingFile), normal);
}

export function isInside(root: string, real: string): boolean {
  const rel = relative(root, real);
  return rel === "" || (!rel.startsWith("..") && !isAbsolute(rel));
}

export function buildHierarchy(fs: FileSource, root: SheetData, rootReal: string, projectRootReal: string): HierarchyResult {
  const instances: SheetInstance[] = [{
    index: 0, sheet: root, namePath: "/", uuidPath: [], depth: 0, parent: -1, sheetIndex: -1, children: [],
    dnp: false, excludeFromSim: false, onBoard: true,
  }];
  const openFiles: string[] = [rootReal];
  let items = itemCount(root);
  const expand = (instIndex: number): ReadError | undefined => {
    const inst = instances[instIndex];
    if (!inst) return undefined;
    for (let si = 0; si < inst.sheet.sheets.length; si++) {
      const ref = inst.sheet.sheets[si] as SheetRef;
      const at = (message: string): ReadError => ({ file: inst.sheet.file, line: ref.line, column: ref.column, message });
      const label = `sheet "${ref.name}"`;
      if (inst.depth + 1 > MAX_SHEET_DEPTH) return at(`${label}: sheets nest more than ${MAX_SHEET_DEPTH} levels deep (the reader's limit)`);
      if (instances.length >= MAX_SHEET_INSTANCES) {
        return at(`${label}: the hierarchy expands to more than ${MAX_SHEET_INSTANCES} sheet instances (the reader's limit)`);
      }
      const path = sheetPathFor(inst.sheet.file, ref.fileName);
      const real = fs.realpath(path);
      if (typeof real !== "string") return at(`${label}: cannot open its file "${ref.fileName}" (${path}): ${real.error}`);
      if (!isInside(projectRootReal, real)) {
        return at(`${label}: its file "${ref.fileName}" lies outside the project folder; refused (sheets must come from inside the project)`);
      }
      const cycleAt = openFiles.indexOf(real);
      if (cycleAt >= 0) {
        const chain = [...openFiles.slice(cycleAt), real].map((p) => relative(projectRootReal, p) || p).join(" → ");
        return at(`${label}: its file "${ref.fileName}" already contains this sheet (${chain}); a sheet cannot include itself`);
      }
      const loaded = loadSheet(fs, path);
      if (!loaded.ok) return loaded.error;
      items += itemCount(loaded.sheet);
      if (items > MAX_DESIGN_ITEMS) {
        return at(`${label}: the hierarchy expands to more than ${MAX_DESIGN_ITEMS} symbols, labels and wires over its sheet instances (the reader's limit)`);
      }
      const child: SheetInstance = {
        index: instances.length,
        sheet: loaded.sheet,
        namePath: `${inst.namePath}${ref.name}/`,
        uuidPath: [...inst.uuidPath, ref.uuid],
        depth: inst.depth + 1,
        parent: instIndex,
        sheetIndex: si,
        children: [],
        dnp: inst.dnp || ref.dnp,
        excludeFromSim: inst.excludeFromSim || ref.excludeFromSim,
        onBoard: inst.onBoard && ref.onBoard,
      };
      instances.push(child);
      inst.children[si] = child.index;
      openFiles.push(real);
      const err = expand(child.index);
      openFiles.pop();
      if (err) return err;
    }
    return undefined;
  };
  const err = expand(0);
  return err ? { ok: false, error: err } : { ok: true, instances };
}
