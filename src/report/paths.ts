// File paths as reports show them: POSIX, relative to a root (the repository, GITHUB_WORKSPACE or the
// working directory), never with a "./" prefix. Pure string work: nothing touches the disk.
import { isAbsolute, relative, resolve } from "node:path";

export interface PathBase {
  /** Where relative finding paths are relative to (the process's working directory). */
  cwd: string;
  /** The folder reports are relative to (repository root, workspace). */
  root: string;
}

function toPosix(path: string): string {
  return path.replace(/\\/g, "/");
}

/** The path relative to `root`, or undefined when the file lies outside it. */
export function relativeToRoot(file: string, base: PathBase): string | undefined {
  const absolute = isAbsolute(file) ? file : resolve(base.cwd, file);
  const rel = relative(resolve(base.root), absolute);
  if (rel === "" || isAbsolute(rel)) return undefined;
  const posix = toPosix(rel);
  if (posix === ".." || posix.startsWith("../")) return undefined;
  return posix.replace(/^(\.\/)+/, "");
}

/** Relative to the root when inside it, else the absolute POSIX path. */
export function displayPath(file: string, base: PathBase): string {
  return relativeToRoot(file, base) ?? toPosix(isAbsolute(file) ? file : resolve(base.cwd, file));
}
