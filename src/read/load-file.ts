// Opens one file through a FileSource and parses it, turning every failure into a ReadError that
// names the file — including a blown call stack, which must never surface as a stack trace.
import type { ReadError } from "../circuit/types.js";
import type { FileSource } from "./file-source.js";
import { MAX_FILE_BYTES, parseSexpr, type ParseOptions, type SexprTree } from "./sexpr.js";

export type LoadResult = { ok: true; tree: SexprTree; real: string } | { ok: false; error: ReadError };

export function wholeFileError(file: string, message: string): { ok: false; error: ReadError } {
  return { ok: false, error: { file, line: 0, column: 0, message } };
}

export function loadTree(fs: FileSource, file: string, opts: ParseOptions = {}): LoadResult {
  const real = fs.realpath(file);
  if (typeof real !== "string") return wholeFileError(file, `cannot open: ${real.error}`);
  const size = fs.size?.(real);
  if (size !== undefined) {
    if (typeof size !== "number") return wholeFileError(file, `cannot open: ${size.error}`);
    if (size > MAX_FILE_BYTES) {
      return wholeFileError(file, `file is ${size} bytes; the reader accepts at most ${MAX_FILE_BYTES} bytes`);
    }
  }
  const data = fs.read(real);
  if (!Buffer.isBuffer(data)) return wholeFileError(file, `cannot read: ${data.error}`);
  try {
    const tree = parseSexpr(data, file, opts);
    return tree.ok ? { ok: true, tree, real } : tree;
  } catch (err) {
    if (err instanceof RangeError) return wholeFileError(file, "the file is too deeply nested or too large to parse");
    throw err;
  }
}
