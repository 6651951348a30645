// Model libraries named by simulator fields (`Sim.Library` in KiCad 7+, `Spice_Lib_File` in 6) are
// read at read time so nothing downstream touches files. Paths are confined to the project folder:
// a design from an untrusted pull request must not make the checker read files elsewhere. A refused
// or missing library is a note; the part is then simulated without its model (or not at all).
import { isAbsolute, join } from "node:path";
import type { ModelLibrary, Part, ReadNote } from "../circuit/types.js";
import type { FileSource } from "./file-source.js";
import { isInside } from "./kicad-sch/hierarchy.js";
import { MAX_FILE_BYTES } from "./sexpr.js";

const LIBRARY_FIELDS = ["Sim.Library", "Spice_Lib_File"];

export function loadModelLibraries(parts: Part[], fs: FileSource, projectRoot: string, notes: ReadNote[]): ModelLibrary[] {
  const out: ModelLibrary[] = [];
  const done = new Set<string>();
  const rootReal = fs.realpath(projectRoot);
  for (const part of parts) {
    for (const field of LIBRARY_FIELDS) {
      const written = part.fields[field]?.trim();
      if (!written || done.has(written)) continue;
      done.add(written);
      const note = (message: string): void => {
        notes.push({ file: part.origin.file, line: part.origin.line, column: part.origin.column, ref: part.ref, message });
      };
      if (typeof rootReal !== "string") { note(`model library "${written}" not read: the project folder cannot be opened (${rootReal.error})`); continue; }
      const expanded = written.replace(/\$\{KIPRJMOD\}|\$\(KIPRJMOD\)/g, projectRoot).replace(/\\/g, "/");
      if (/\$\{|\$\(/.test(expanded)) { note(`model library "${written}" not read: path variables other than KIPRJMOD are not resolved`); continue; }
      const path = isAbsolute(expanded) ? expanded : join(projectRoot, expanded);
      const real = fs.realpath(path);
      if (typeof real !== "string") { note(`model library "${written}" not read: ${real.error}`); continue; }
      if (!isInside(rootReal, real)) { note(`model library "${written}" lies outside the project folder; not read`); continue; }
      const size = fs.size?.(real);
      if (typeof size === "object") { note(`model library "${written}" not read: ${size.error}`); continue; }
      if (size !== undefined && size > MAX_FILE_BYTES) { note(`model library "${written}" is ${size} bytes, over the ${MAX_FILE_BYTES}-byte limit; not read`); continue; }
      const data = fs.read(real);
      if (!Buffer.isBuffer(data)) { note(`model library "${written}" not read: ${data.error}`); continue; }
      if (data.length > MAX_FILE_BYTES) { note(`model library "${written}" is over the ${MAX_FILE_BYTES}-byte limit; not read`); continue; }
      out.push({ path: written, text: data.toString("utf8") });
    }
  }
  return out;
}
