// The s-expression layer shared by the schematic and netlist readers: decoding, limits, syntax
// errors with positions, and typed access to the tree. sexpr-plus does the parsing for ordinary
// KiCad-written files; an iterative tokenizer of ours (same node shape) takes the files sexpr-plus
// would misread — Lisp reader macros and comments in bare tokens, escapes it rejects, line breaks it
// counts differently — so both yield identical trees and identical line/column numbers.
import sexprPlus from "sexpr-plus";
import type { AtomNode, ListNode, Node, StringNode } from "sexpr-plus";
import type { ReadError } from "../circuit/types.js";

/** Largest file the readers accept, in bytes. Real schematics are well under 10 MB. */
export const MAX_FILE_BYTES = 64 * 1024 * 1024;
/** Deepest list nesting accepted. KiCad files nest about a dozen levels; the cap keeps the
 * recursive parser (and every tree walk after it) far from the call-stack limit. */
export const MAX_NESTING_DEPTH = 256;

/** A node of either tokenizer. `location.start` is exact; sexpr-plus lets `location.end` of a
 * list or string run on over the whitespace after it, so use `tokenEnd` for an exact end
 * (correcting every node up front costs about 6 % of a whole read). */
export type SNode = Node;
export type SList = ListNode;
export type SAtom = AtomNode | StringNode;

export interface SourcePoint {
  line: number;
  column: number;
  offset: number;
}

export type DecodeResult = { ok: true; text: string } | { ok: false; error: ReadError };

export interface SexprTree {
  ok: true;
  /** Top-level forms (a KiCad file has exactly one list). */
  nodes: SNode[];
  /** The decoded text; node offsets index into it (a byte-order mark, if any, is kept at 0). */
  text: string;
  /** Which tokenizer produced the tree, for the benchmark and for tests. */
  tokenizer: "sexpr-plus" | "own";
}

export type SexprResult = SexprTree | { ok: false; error: ReadError };

export interface ParseOptions {
  /** "auto" (default): sexpr-plus unless the pre-scan finds something it would misread. */
  tokenizer?: "auto" | "own";
}

const BOM = 0xfeff;

function failure(file: string, line: number, column: number, message: string): { ok: false; error: ReadError } {
  return { ok: false, error: { file, line, column, message } };
}

/** Decodes file bytes as strict UTF-8 and applies the size cap. The BOM is kept in the text (so
 * offsets match the file as other tools decode it); the tokenizers skip it. */
export function decodeSource(data: Buffer | string, file: string): DecodeResult {
  const bytes = typeof data === "string" ? Buffer.byteLength(data, "utf8") : data.length;
  if (bytes > MAX_FILE_BYTES) {
    return failure(file, 0, 0, `file is ${bytes} bytes; the reader accepts at most ${MAX_FILE_BYTES} bytes`);
  }
  if (typeof data === "string") return { ok: true, text: data };
  try {
    return { ok: true, text: new TextDecoder("utf-8", { fatal: true, ignoreBOM: true }).decode(data) };
  } catch {
    const bad = firstInvalidUtf8(data);
    const lineStart = bad === 0 ? 0 : data.lastIndexOf(0x0a, bad - 1) + 1;
    let line = 1;
    for (let i = 0; i < lineStart; i++) if (data[i] === 0x0a) line++;
    const column = data.subarray(lineStart, bad).toString("utf8").length + 1;
    const byte = data[bad] ?? 0;
    return failure(file, line, column,
      `invalid UTF-8: byte 0x${byte.toString(16).padStart(2, "0")} at offset ${bad} is not part of a valid character; KiCad files are UTF-8`);
  }
}

/** Index of the first byte that does not start or continue a well-formed UTF-8 sequence. */
function firstInvalidUtf8(b: Buffer): number {
  let i = 0;
  while (i < b.length) {
    const c = b[i] ?? 0;
    if (c < 0x80) { i++; continue; }
    let need: number;
    let min: number;
    if (c >= 0xc2 && c <= 0xdf) { need = 1; min = 0x80; }
    else if (c >= 0xe0 && c <= 0xef) { need = 2; min = 0x800; }
    else if (c >= 0xf0 && c <= 0xf4) { need = 3; min = 0x10000; }
    else return i;
    let cp = c & (0x3f >> need);
    for (let k = 1; k <= need; k++) {
      const d = b[i + k];
      if (d === undefined || (d & 0xc0) !== 0x80) return i;
      cp = (cp << 6) | (d & 0x3f);
    }
    if (cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return i;
    i += need + 1;
  }
  return b.length;
}

/** Parses decoded text or raw bytes into a tree, or a ReadError with the position of the problem. */
export function parseSexpr(data: Buffer | string, file: string, opts: ParseOptions = {}): SexprResult {
  const decoded = decodeSource(data, file);
  if (!decoded.ok) return decoded;
  const text = decoded.text;
  if (opts.tokenizer === "own") return ownTree(text, file);
  const pre = scan(text, file, false);
  if (!pre.ok) return pre;
  if (pre.needsOwn) return ownTree(text, file);
  try {
    return { ok: true, nodes: sexprPlus.parse(text), text, tokenizer: "sexpr-plus" };
  } catch (err) {
    // The pre-scan checked the syntax, so this is unexpected; still, bad input never escapes as a throw.
    if (err instanceof RangeError) return failure(file, 1, 1, "the file nests too deeply to parse");
    if (err instanceof sexprPlus.SyntaxError) {
      return failure(file, err.location.start.line, err.location.start.column, `syntax error: ${err.message}`);
    }
    throw err;
  }
}

function ownTree(text: string, file: string): SexprResult {
  const r = scan(text, file, true);
  if (!r.ok) return r;
  return { ok: true, nodes: r.nodes, text, tokenizer: "own" };
}

type ScanResult = { ok: true; needsOwn: boolean; nodes: SNode[] } | { ok: false; error: ReadError };

// Character codes the scanner tests.
const LF = 10, CR = 13, TAB = 9, VT = 11, FF = 12, SPACE = 32, QUOTE = 34, BACKSLASH = 92;
const OPEN = 40, CLOSE = 41, APOS = 39, BACKTICK = 96, COMMA = 44, SEMI = 59, LS = 0x2028, PS = 0x2029;

function isSpace(c: number): boolean {
  return c === SPACE || c === LF || c === TAB || c === CR || c === VT || c === FF;
}

/** Escapes sexpr-plus decodes the way KiCad does. */
function sexprPlusEscape(c: number): boolean {
  // " \ b f n r t v
  return c === QUOTE || c === BACKSLASH || c === 98 || c === 102 || c === 110 || c === 114 || c === 116 || c === 118;
}

function isOctal(c: number): boolean {
  return c >= 48 && c <= 55;
}

function hexValue(c: number): number {
  if (c >= 48 && c <= 57) return c - 48;
  if (c >= 97 && c <= 102) return c - 87;
  if (c >= 65 && c <= 70) return c - 55;
  return -1;
}

/**
 * One iterative pass over the text. With `build` false it only checks syntax and limits and says
 * whether sexpr-plus can be trusted with the file; with `build` true it also builds the tree,
 * decoding string escapes as KiCad's lexer does. Lines are counted at LF only (as editors and
 * annotations count them).
 */
function scan(text: string, file: string, build: boolean): ScanResult {
  const n = text.length;
  let i = 0;
  let line = 1;
  let lineStart = 0;
  let needsOwn = false;
  if (n > 0 && text.charCodeAt(0) === BOM) { i = 1; lineStart = 1; needsOwn = true; }
  if (text.startsWith("#!", i)) needsOwn = true; // sexpr-plus would skip a shebang line
  const top: SNode[] = [];
  const open: { list: ListNode | null; line: number; column: number; offset: number }[] = [];
  const here = (): { offset: number; line: number; column: number } => ({ offset: i, line, column: i - lineStart + 1 });

  while (i < n) {
    const c = text.charCodeAt(i);
    if (c === LF) { i++; line++; lineStart = i; continue; }
    if (c === SPACE || c === TAB) { i++; continue; }
    if (c === CR || c === VT || c === FF) {
      // sexpr-plus counts a lone CR as a line break and treats VT/FF as token characters.
      if (c !== CR || text.charCodeAt(i + 1) !== LF) needsOwn = true;
      i++;
      continue;
    }
    if (c === OPEN) {
      const column = i - lineStart + 1;
      if (open.length >= MAX_NESTING_DEPTH) {
        return failure(file, line, column, `lists nest more than ${MAX_NESTING_DEPTH} levels deep (the reader's limit); the file is malformed`);
      }
      const list: ListNode | null = build
        ? { type: "list", content: [], location: { start: here(), end: here() } }
        : null;
      open.push({ list, line, column, offset: i });
      i++;
      continue;
    }
    if (c === CLOSE) {
      const frame = open.pop();
      if (!frame) return failure(file, line, i - lineStart + 1, "unexpected ')': no list is open here");
      i++;
      if (build && frame.list) {
        frame.list.location.end = here();
        const parent = open[open.length - 1];
        (parent?.list ? parent.list.content : top).push(frame.list);
      }
      continue;
    }
    if (c === QUOTE) {
      const start = here();
      let j = i + 1;
      let out = "";
      let chunk = j;
      let closed = false;
      while (j < n) {
        const d = text.charCodeAt(j);
        if (d === QUOTE) { closed = true; break; }
        if (d === LF) { line++; lineStart = j + 1; j++; continue; }
        if (d === CR || d === LS || d === PS) { if (d !== CR || text.charCodeAt(j + 1) !== LF) needsOwn = true; j++; continue; }
        if (d === BACKSLASH) {
          const e = text.charCodeAt(j + 1);
          if (!sexprPlusEscape(e)) needsOwn = true;
          if (build) out += text.slice(chunk, j);
          const consumed = build ? decodeEscape(text, j, (s) => { out += s; }) : 2;
          if (j + 1 < n && text.charCodeAt(j + 1) === LF) { line++; lineStart = j + 2; }
          j += consumed;
          chunk = j;
          continue;
        }
        j++;
      }
      if (!closed) {
        i = n;
        const end = here();
        return failure(file, end.line, end.column,
          `expected '"' to close the string that starts at line ${start.line}, column ${start.column} (the file ends first)`);
      }
      if (build) out += text.slice(chunk, j);
      i = j + 1;
      if (build) {
        const node: StringNode = { type: "string", content: detach(out), location: { start, end: here() } };
        const parent = open[open.length - 1];
        (parent?.list ? parent.list.content : top).push(node);
      }
      continue;
    }
    // A bare token runs to whitespace, a parenthesis or a quote.
    const start = i;
    let j = i;
    while (j < n) {
      const d = text.charCodeAt(j);
      if (isSpace(d) || d === OPEN || d === CLOSE || d === QUOTE) break;
      if (d === APOS || d === BACKTICK || d === COMMA || d === SEMI || d === BACKSLASH || d === LS || d === PS) needsOwn = true;
      j++;
    }
    const column = start - lineStart + 1;
    i = j;
    if (build) {
      const node: AtomNode = {
        type: "atom",
        content: detach(text.slice(start, j)),
        location: { start: { offset: start, line, column }, end: here() },
      };
      const parent = open[open.length - 1];
      (parent?.list ? parent.list.content : top).push(node);
    }
  }
  const unclosed = open[open.length - 1];
  if (unclosed) {
    const end = here();
    return failure(file, end.line, end.column,
      `expected ')' to close the list opened at line ${unclosed.line}, column ${unclosed.column} (the file ends first)`);
  }
  return { ok: true, needsOwn, nodes: top };
}

/** A copy of a token's text that does not keep the whole file's text alive: V8 represents longer
 * substrings as views into their parent, and the extracted sheet data outlives the file text. */
function detach(s: string): string {
  return s.length < 13 ? s : (" " + s).slice(1);
}

/** Decodes the escape at `text[j] === '\\'` as KiCad's lexer does; returns characters consumed. */
function decodeEscape(text: string, j: number, emit: (s: string) => void): number {
  const e = text.charCodeAt(j + 1);
  switch (e) {
    case QUOTE: emit("\""); return 2;
    case BACKSLASH: emit("\\"); return 2;
    case 110: emit("\n"); return 2; // n
    case 114: emit("\r"); return 2; // r
    case 116: emit("\t"); return 2; // t
    case 97: emit("\x07"); return 2; // a
    case 98: emit("\b"); return 2; // b
    case 102: emit("\f"); return 2; // f
    case 118: emit("\v"); return 2; // v
    case 120: { // x: one or two hex digits
      const h1 = hexValue(text.charCodeAt(j + 2));
      if (h1 < 0) { emit("\\x"); return 2; }
      const h2 = hexValue(text.charCodeAt(j + 3));
      if (h2 < 0) { emit(String.fromCharCode(h1)); return 3; }
      emit(String.fromCharCode(h1 * 16 + h2));
      return 4;
    }
    default:
      if (isOctal(e)) {
        let k = 1;
        let v = 0;
        while (k <= 3 && isOctal(text.charCodeAt(j + k))) { v = v * 8 + (text.charCodeAt(j + k) - 48); k++; }
        emit(String.fromCharCode(v));
        return k;
      }
      if (Number.isNaN(e)) { emit("\\"); return 1; }
      // Unknown escape: KiCad keeps the backslash and the character.
      emit("\\" + text.charAt(j + 1));
      return 2;
  }
}

// ---- typed access --------------------------------------------------------------------------

export function isList(n: SNode | undefined): n is ListNode {
  return n !== undefined && n.type === "list";
}

/** Text of an atom or a string (KiCad writes the same value both ways across versions). */
export function textOf(n: SNode | undefined): string | undefined {
  return n !== undefined && n.type !== "list" ? n.content : undefined;
}

/** The list's keyword (its first element when that is a bare atom). */
export function keywordOf(n: SNode | undefined): string | undefined {
  if (!isList(n)) return undefined;
  const first = n.content[0];
  return first !== undefined && first.type === "atom" ? first.content : undefined;
}

/** Child lists with the given keyword, in order. */
export function childrenOf(list: ListNode, keyword: string): ListNode[] {
  const out: ListNode[] = [];
  for (const c of list.content) if (keywordOf(c) === keyword) out.push(c as ListNode);
  return out;
}

export function childOf(list: ListNode, keyword: string): ListNode | undefined {
  for (const c of list.content) if (keywordOf(c) === keyword) return c as ListNode;
  return undefined;
}

/** Positional argument `index` (1 = the element after the keyword). */
export function argAt(list: ListNode | undefined, index: number): SNode | undefined {
  return list?.content[index];
}

export function argText(list: ListNode | undefined, index: number): string | undefined {
  return textOf(argAt(list, index));
}

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** A numeric positional argument; undefined when absent or not a plain decimal number. */
export function argNumber(list: ListNode | undefined, index: number): number | undefined {
  const t = argText(list, index);
  return t !== undefined && NUMBER.test(t) ? Number(t) : undefined;
}

/** `(keyword "text")` → text. */
export function childText(list: ListNode, keyword: string, index = 1): string | undefined {
  return argText(childOf(list, keyword), index);
}

const TRUE_WORDS = new Set(["yes", "true", "1"]);
const FALSE_WORDS = new Set(["no", "false", "0"]);

/**
 * A yes/no flag in every spelling KiCad has written: a bare keyword among the list's elements
 * (`hide`), an empty list `(hide)`, or `(hide yes)` / `(hide no)`. Undefined when absent or unreadable.
 */
export function flagOf(list: ListNode, keyword: string): boolean | undefined {
  for (let k = 1; k < list.content.length; k++) {
    const c = list.content[k];
    if (c === undefined) continue;
    if (c.type === "atom" && c.content === keyword) return true;
    if (keywordOf(c) === keyword) {
      const v = argText(c as ListNode, 1);
      if (v === undefined) return true;
      if (TRUE_WORDS.has(v.toLowerCase())) return true;
      if (FALSE_WORDS.has(v.toLowerCase())) return false;
      return undefined;
    }
  }
  return undefined;
}

/** Offset just past the node's last character (closing quote or parenthesis). */
export function tokenEnd(n: SNode, text: string): number {
  let e = n.location.end.offset;
  const floor = n.location.start.offset + 1;
  while (e > floor) {
    const c = text.charCodeAt(e - 1);
    if (c !== SPACE && c !== LF && c !== TAB && c !== CR) break;
    e--;
  }
  return e;
}

/** 1-based line and column and the character offset where the node starts. */
export function where(n: SNode): SourcePoint {
  const s = n.location.start;
  return { line: s.line, column: s.column, offset: s.offset };
}
