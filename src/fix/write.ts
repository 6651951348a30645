// The only code in `fix` that touches the disk. A file is replaced atomically: the new bytes go to a
// temporary file in the same folder (same file system, so the rename is atomic), are flushed with
// fsync, get the original's permission bits, and are renamed over the original — but only while the
// original still holds exactly the bytes that were checked. A symlink is followed and its target
// replaced, so the link itself survives.
import * as nodeFs from "node:fs";
import { randomBytes } from "node:crypto";
import { basename, dirname, join } from "node:path";

/** The file-system calls the writer makes, injectable so tests can simulate a file that changes
 * between read and write, a failing rename, or a full disk. Same signatures as node:fs. */
export interface WriteFs {
  readFileSync(path: string): Buffer;
  statSync(path: string): { mode: number };
  realpathSync(path: string): string;
  openSync(path: string, flags: string, mode?: number): number;
  writeSync(fd: number, buffer: Uint8Array, offset: number, length: number): number;
  fsyncSync(fd: number): void;
  fchmodSync(fd: number, mode: number): void;
  closeSync(fd: number): void;
  renameSync(from: string, to: string): void;
  unlinkSync(path: string): void;
}

export function nodeWriteFs(): WriteFs {
  return {
    readFileSync: (path) => nodeFs.readFileSync(path),
    statSync: (path) => nodeFs.statSync(path),
    realpathSync: (path) => nodeFs.realpathSync(path),
    openSync: (path, flags, mode) => nodeFs.openSync(path, flags, mode),
    writeSync: (fd, buffer, offset, length) => nodeFs.writeSync(fd, buffer, offset, length),
    fsyncSync: (fd) => nodeFs.fsyncSync(fd),
    fchmodSync: (fd, mode) => nodeFs.fchmodSync(fd, mode),
    closeSync: (fd) => nodeFs.closeSync(fd),
    renameSync: (from, to) => nodeFs.renameSync(from, to),
    unlinkSync: (path) => nodeFs.unlinkSync(path),
  };
}

export type WriteOutcome = { ok: true; path: string } | { ok: false; reason: string };

/** Bounds the write loop: a write that makes no progress this many times in a row is a failure. */
const MAX_STALLED_WRITES = 8;

/**
 * Replaces `path` with `next`, provided it still holds `expected`. Returns where the bytes went
 * (the real path) or why nothing was replaced; on failure the original is untouched and the
 * temporary file removed. `name` names the file in the reason (the path itself by default).
 */
export function replaceFileAtomically(path: string, expected: Uint8Array, next: Uint8Array, fs: WriteFs = nodeWriteFs(), name: string = path): WriteOutcome {
  let target: string;
  let mode: number;
  try {
    target = fs.realpathSync(path);
    if (!sameBytes(fs.readFileSync(target), expected)) return { ok: false, reason: `${name} changed since it was checked; not written (run fix again)` };
    mode = fs.statSync(target).mode & 0o7777;
  } catch (err) {
    return { ok: false, reason: `${name} could not be read again before writing (${errorText(err)}); not written` };
  }

  const temp = join(dirname(target), `.${basename(target)}.loadline-${process.pid}-${randomBytes(4).toString("hex")}.tmp`);
  let created = false;
  try {
    // "wx": never reuse an existing file of that name; 0o600 until the real mode is set on the fd.
    const fd = fs.openSync(temp, "wx", 0o600);
    created = true;
    try {
      writeAll(fs, fd, next);
      fs.fchmodSync(fd, mode);
      fs.fsyncSync(fd);
    } finally {
      fs.closeSync(fd);
    }
    // Look once more just before the rename, to keep the window for a concurrent edit small.
    if (!sameBytes(fs.readFileSync(target), expected)) {
      removeQuietly(fs, temp);
      return { ok: false, reason: `${name} changed while the fix was being written; not written (run fix again)` };
    }
    fs.renameSync(temp, target);
  } catch (err) {
    if (created) removeQuietly(fs, temp);
    return { ok: false, reason: `${name} could not be written (${errorText(err)}); the original is unchanged` };
  }
  syncFolderQuietly(fs, dirname(target));
  return { ok: true, path: target };
}

function writeAll(fs: WriteFs, fd: number, bytes: Uint8Array): void {
  let offset = 0;
  let stalled = 0;
  while (offset < bytes.length) {
    const written = fs.writeSync(fd, bytes, offset, bytes.length - offset);
    if (written > 0) {
      offset += written;
      stalled = 0;
    } else if (++stalled >= MAX_STALLED_WRITES) {
      throw new Error(`the write made no progress at byte ${offset} of ${bytes.length}`);
    }
  }
}

/** Flushes the folder entry so the rename itself survives a power cut; some systems cannot open a
 * folder for this, and the rename is already done, so a failure here is not an error. */
function syncFolderQuietly(fs: WriteFs, folder: string): void {
  try {
    const fd = fs.openSync(folder, "r");
    try {
      fs.fsyncSync(fd);
    } finally {
      fs.closeSync(fd);
    }
  } catch {
    // best effort, see above
  }
}

function removeQuietly(fs: WriteFs, path: string): void {
  try {
    fs.unlinkSync(path);
  } catch {
    // already gone or never created: nothing to clean up
  }
}

function sameBytes(a: Uint8Array, b: Uint8Array): boolean {
  return Buffer.from(a.buffer, a.byteOffset, a.byteLength).equals(b);
}

function errorText(err: unknown): string {
  if (err instanceof Error) {
    const code = (err as NodeJS.ErrnoException).code;
    return code !== undefined ? `${code}: ${err.message}` : err.message;
  }
  return String(err);
}
