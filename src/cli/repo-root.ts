// The repository root (the nearest folder above holding `.git`), which SARIF paths are relative to.
import { existsSync } from "node:fs";
import { dirname, join, resolve } from "node:path";

export function findRepositoryRoot(start: string, exists: (path: string) => boolean = existsSync): string | undefined {
  let dir = resolve(start);
  for (let depth = 0; depth < 256; depth++) {
    if (exists(join(dir, ".git"))) return dir;
    const parent = dirname(dir);
    if (parent === dir) return undefined;
    dir = parent;
  }
  return undefined;
}
