// Turns the paths a user gives (files, folders, globs) into the design files to read. Folder walks
// are bounded (depth and entry count) and skip what is never a design: version-control folders,
// node_modules, hidden folders, KiCad backups and autosaves.
import { readdirSync, statSync } from "node:fs";
import { basename, dirname, extname, isAbsolute, join, relative, resolve, sep } from "node:path";
import { isGlob, matchesGlob, normalizePath } from "./glob.js";
import type { RunProblem } from "./result.js";

export const DESIGN_EXTENSIONS = [".kicad_sch", ".net"] as const;

export type PathKind = "file" | "directory" | "missing";

export interface PathLister {
  kind(path: string): PathKind;
  /** Names in a folder (not paths), or why it cannot be listed. */
  list(dir: string): string[] | { error: string };
}

export function nodePathLister(): PathLister {
  return {
    kind(path) {
      try {
        const st = statSync(path);
        return st.isDirectory() ? "directory" : st.isFile() ? "file" : "missing";
      } catch {
        return "missing";
      }
    },
    list(dir) {
      try {
        return readdirSync(dir);
      } catch (err) {
        return { error: err instanceof Error ? err.message : String(err) };
      }
    },
  };
}

/** A lister over a fixed set of file paths (folders exist as their prefixes), for tests. */
export function memoryPathLister(files: readonly string[]): PathLister {
  const fileSet = new Set(files.map((f) => resolve(f)));
  const children = new Map<string, Set<string>>();
  for (const file of fileSet) {
    let child = file;
    for (let dir = dirname(file); ; dir = dirname(dir)) {
      const set = children.get(dir) ?? new Set<string>();
      set.add(basename(child));
      children.set(dir, set);
      if (dirname(dir) === dir) break;
      child = dir;
    }
  }
  return {
    kind(path) {
      const abs = resolve(path);
      return fileSet.has(abs) ? "file" : children.has(abs) ? "directory" : "missing";
    },
    list(dir) {
      const set = children.get(resolve(dir));
      return set ? [...set].sort() : { error: "no such folder" };
    },
  };
}

const MAX_DEPTH = 32;
const MAX_ENTRIES = 200_000;

function isDesignFile(name: string): boolean {
  if (name.startsWith("_autosave-") || name.startsWith("~")) return false;
  return (DESIGN_EXTENSIONS as readonly string[]).includes(extname(name));
}

function skipFolder(name: string): boolean {
  return name.startsWith(".") || name === "node_modules" || name.endsWith("-backups") || name === "dist";
}

export interface Expanded {
  /** Design files, explicit ones first in argument order, then walked ones sorted. */
  files: { path: string; explicit: boolean }[];
  problems: RunProblem[];
}

/** `path` as shown to users: relative to cwd when inside it. */
function shown(path: string, cwd: string): string {
  const rel = relative(cwd, path);
  return rel !== "" && rel !== ".." && !rel.startsWith(`..${sep}`) && !isAbsolute(rel) ? rel : path;
}

/**
 * Expands path arguments. A folder yields every design file beneath it (a `.net` export is skipped
 * when the schematic of the same name sits beside it: the same design, read twice). A glob is
 * matched against paths relative to the working directory.
 */
export function expandPaths(inputs: readonly string[], lister: PathLister, cwd: string): Expanded {
  const problems: RunProblem[] = [];
  const out: { path: string; explicit: boolean }[] = [];
  const seen = new Set<string>();
  let entries = 0;
  const add = (abs: string, explicit: boolean): void => {
    if (seen.has(abs)) return;
    seen.add(abs);
    out.push({ path: shown(abs, cwd), explicit });
  };

  const walk = (dir: string, depth: number, accept: (abs: string) => boolean, found: string[]): void => {
    if (depth > MAX_DEPTH || entries > MAX_ENTRIES) return;
    const names = lister.list(dir);
    if (!Array.isArray(names)) {
      problems.push({ file: shown(dir, cwd), line: 0, column: 0, message: `cannot list folder: ${names.error}` });
      return;
    }
    const sorted = [...names].sort();
    const stems = new Set(sorted.filter((n) => n.endsWith(".kicad_sch")).map((n) => n.slice(0, -".kicad_sch".length)));
    for (const name of sorted) {
      entries++;
      if (entries > MAX_ENTRIES) {
        problems.push({ file: shown(dir, cwd), line: 0, column: 0, message: `stopped after ${MAX_ENTRIES} entries; name the design folders instead` });
        return;
      }
      const abs = join(dir, name);
      const kind = lister.kind(abs);
      if (kind === "directory") {
        if (!skipFolder(name)) walk(abs, depth + 1, accept, found);
      } else if (kind === "file" && isDesignFile(name)) {
        if (name.endsWith(".net") && stems.has(name.slice(0, -".net".length))) continue;
        if (accept(abs)) found.push(abs);
      }
    }
  };

  for (const input of inputs) {
    if (isGlob(input)) {
      const pattern = normalizePath(input);
      const segments = pattern.split("/");
      const firstGlob = segments.findIndex(isGlob);
      const base = resolve(cwd, segments.slice(0, Math.max(0, firstGlob)).join("/") || ".");
      const found: string[] = [];
      if (lister.kind(base) === "directory") {
        const absPattern = normalizePath(resolve(cwd, pattern));
        walk(base, 0, (abs) => matchesGlob(normalizePath(abs), absPattern, { anchored: true }), found);
      }
      if (found.length === 0) problems.push({ file: input, line: 0, column: 0, message: "no .kicad_sch or .net file matches this pattern" });
      for (const f of found.sort()) add(f, false);
      continue;
    }
    const abs = resolve(cwd, input);
    const kind = lister.kind(abs);
    if (kind === "file") add(abs, true);
    else if (kind === "directory") {
      const found: string[] = [];
      walk(abs, 0, () => true, found);
      if (found.length === 0) problems.push({ file: input, line: 0, column: 0, message: "no .kicad_sch or .net file in this folder" });
      for (const f of found.sort()) add(f, false);
    } else {
      problems.push({ file: input, line: 0, column: 0, message: "no such file or folder" });
    }
  }
  return { files: out, problems };
}
