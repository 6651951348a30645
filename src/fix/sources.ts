// FileSource wrappers for `fix`: one that keeps the exact bytes every file had when it was linted
// (so what we edit and what we compare against is what was checked, even if the disk changes
// meanwhile), and one that shows edited bytes in place of some files (so the edited design can be
// read and linted before anything is written).
import type { FileSource } from "../read/file-source.js";

export interface SnapshotSource {
  source: FileSource;
  /** The bytes the file had when first read through `source`, or undefined if it never was. */
  bytesOf(path: string): Buffer | undefined;
  /** The real path the snapshot is keyed by (symlinks resolved), or undefined if it cannot be resolved. */
  keyOf(path: string): string | undefined;
}

export function snapshotSource(inner: FileSource): SnapshotSource {
  const seen = new Map<string, Buffer>();
  const keyOf = (path: string): string | undefined => {
    const real = inner.realpath(path);
    return typeof real === "string" ? real : undefined;
  };
  const source: FileSource = {
    read(path) {
      const key = keyOf(path) ?? path;
      const known = seen.get(key);
      if (known !== undefined) return known;
      const data = inner.read(path);
      if (Buffer.isBuffer(data)) seen.set(key, Buffer.from(data));
      return data;
    },
    realpath: (path) => inner.realpath(path),
    size(path) {
      const known = seen.get(keyOf(path) ?? path);
      if (known !== undefined) return known.length;
      return inner.size ? inner.size(path) : sizeByReading(inner, path);
    },
  };
  return {
    source,
    keyOf,
    bytesOf(path) {
      const key = keyOf(path);
      return key === undefined ? undefined : seen.get(key);
    },
  };
}

/** `base` with the files of `replaced` (keyed by real path) showing other bytes. */
export function overlaySource(base: FileSource, replaced: ReadonlyMap<string, Buffer>): FileSource {
  const keyOf = (path: string): string => {
    const real = base.realpath(path);
    return typeof real === "string" ? real : path;
  };
  return {
    read(path) {
      return replaced.get(keyOf(path)) ?? base.read(path);
    },
    realpath: (path) => base.realpath(path),
    size(path) {
      const bytes = replaced.get(keyOf(path));
      if (bytes !== undefined) return bytes.length;
      return base.size ? base.size(path) : sizeByReading(base, path);
    },
  };
}

function sizeByReading(source: FileSource, path: string): number | { error: string } {
  const data = source.read(path);
  return Buffer.isBuffer(data) ? data.length : data;
}
