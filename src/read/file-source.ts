// Every file the readers open goes through a FileSource, so the whole read (and `lint()`) can run
// on in-memory strings in tests and nothing below this layer touches the disk directly.
import { readFileSync, realpathSync, statSync } from "node:fs";
import { resolve, sep } from "node:path";

export interface FileSource {
  read(path: string): Buffer | { error: string };
  realpath(path: string): string | { error: string };
  /** Size in bytes without reading the file; an error for anything that is not a regular file. */
  size?(path: string): number | { error: string };
}

function describeFsError(err: unknown): string {
  const code = typeof err === "object" && err !== null && "code" in err ? String((err as { code: unknown }).code) : "";
  switch (code) {
    case "ENOENT": return "no such file";
    case "EACCES":
    case "EPERM": return "permission denied";
    case "EISDIR": return "is a directory, not a file";
    case "ELOOP": return "too many symbolic links";
    case "ENAMETOOLONG": return "path too long";
    default: return err instanceof Error ? err.message : String(err);
  }
}

/** The real file system. */
export function nodeFileSource(): FileSource {
  return {
    read(path) {
      try { return readFileSync(path); } catch (err) { return { error: describeFsError(err) }; }
    },
    realpath(path) {
      try { return realpathSync(path); } catch (err) { return { error: describeFsError(err) }; }
    },
    size(path) {
      try {
        const st = statSync(path);
        if (!st.isFile()) return { error: st.isDirectory() ? "is a directory, not a file" : "not a regular file" };
        return st.size;
      } catch (err) { return { error: describeFsError(err) }; }
    },
  };
}

/** Files held in memory, keyed by path (relative paths are taken from the current directory).
 * Directories exist implicitly as prefixes of the keys. */
export function memoryFileSource(files: Record<string, string | Buffer>): FileSource {
  const map = new Map<string, Buffer>();
  const dirs = new Set<string>();
  for (const [name, content] of Object.entries(files)) {
    const abs = resolve(name);
    map.set(abs, typeof content === "string" ? Buffer.from(content, "utf8") : content);
    let d = abs;
    for (;;) {
      const i = d.lastIndexOf(sep);
      if (i <= 0) { dirs.add(sep); break; }
      d = d.slice(0, i);
      if (dirs.has(d)) break;
      dirs.add(d);
    }
  }
  return {
    read(path) {
      const abs = resolve(path);
      const b = map.get(abs);
      if (b) return b;
      return { error: dirs.has(abs) ? "is a directory, not a file" : "no such file" };
    },
    realpath(path) {
      const abs = resolve(path);
      return map.has(abs) || dirs.has(abs) ? abs : { error: "no such file" };
    },
    size(path) {
      const abs = resolve(path);
      const b = map.get(abs);
      if (b) return b.length;
      return { error: dirs.has(abs) ? "is a directory, not a file" : "no such file" };
    },
  };
}
