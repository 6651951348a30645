// Reads a KiCad schematic design (root file plus its sheet hierarchy) into a Circuit.
import { dirname } from "node:path";
import type { Circuit, ReadNote, ReadResult } from "../../circuit/types.js";
import type { FileSource } from "../file-source.js";
import { wholeFileError } from "../load-file.js";
import { loadModelLibraries } from "../model-libraries.js";
import { assemble } from "./assemble.js";
import { buildDesignGraph } from "./design-graph.js";
import { buildHierarchy, isInside } from "./hierarchy.js";
import { loadSheet, type SheetResult } from "./sheet-cache.js";

export interface SchematicReadOptions {
  fs: FileSource;
  /** Folder sheets and model libraries must stay inside; default: the root file's folder. */
  projectRoot?: string;
  /** The root's extracted sheet when the caller has already read it (to tell schematic from netlist). */
  root?: SheetResult;
}

export function readSchematic(file: string, opts: SchematicReadOptions): ReadResult {
  const { fs } = opts;
  const rootResult = opts.root ?? loadSheet(fs, file);
  if (!rootResult.ok) return rootResult;
  const root = rootResult.sheet;
  const projectRoot = opts.projectRoot ?? dirname(file);
  const projectReal = fs.realpath(projectRoot);
  if (typeof projectReal !== "string") return wholeFileError(file, `cannot open the project folder ${projectRoot}: ${projectReal.error}`);
  if (!isInside(projectReal, rootResult.real)) return wholeFileError(file, `the schematic lies outside the project folder ${projectRoot}`);

  const hierarchy = buildHierarchy(fs, root, rootResult.real, projectReal);
  if (!hierarchy.ok) return hierarchy;
  const graph = buildDesignGraph(hierarchy.instances, root);
  const { parts, nets, notes: assembleNotes } = assemble(graph, root.version);

  const notes: ReadNote[] = [];
  const noted = new Set<string>();
  for (const inst of hierarchy.instances) {
    if (noted.has(inst.sheet.file)) continue;
    noted.add(inst.sheet.file);
    notes.push(...inst.sheet.notes);
  }
  notes.push(...graph.notes, ...assembleNotes);
  const modelLibraries = loadModelLibraries(parts, fs, projectRoot, notes);
  const circuit: Circuit = {
    file,
    format: "kicad_sch",
    version: String(root.version),
    parts,
    nets,
    sheets: hierarchy.instances.map((i) => ({ path: i.namePath, file: i.sheet.file })),
    notes,
    modelLibraries,
  };
  return { ok: true, circuit };
}
