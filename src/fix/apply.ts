// Turning fix edits into new file contents, and nothing else: pure functions over strings and bytes.
// An edit replaces one quoted KiCad string token (quotes included) with another; every other
// character of the file (formatting, float spelling, order, CRLF, a BOM) stays as it was.

/** The part of a fix edit this module needs: a character range (JS string offsets, end exclusive,
 * quotes included) and the new value as plain, unquoted text. */
export interface ValueEdit {
  span: { start: number; end: number };
  replacement: string;
}

/** Writes `value` as a KiCad quoted string. KiCad's own writer escapes exactly these four
 * characters, so a value we write reads back as the text we meant. */
export function quoteKicadString(value: string): string {
  let out = '"';
  for (const ch of value) {
    if (ch === "\\") out += "\\\\";
    else if (ch === '"') out += '\\"';
    else if (ch === "\n") out += "\\n";
    else if (ch === "\r") out += "\\r";
    else out += ch;
  }
  return out + '"';
}

/** Where the quoted string token that opens at `start` ends (index after its closing quote), or
 * undefined when there is no complete token there. */
export function quotedTokenEnd(text: string, start: number): number | undefined {
  if (text[start] !== '"') return undefined;
  for (let i = start + 1; i < text.length; i++) {
    const ch = text[i];
    if (ch === "\\") i++;
    else if (ch === '"') return i + 1;
  }
  return undefined;
}

/** Why these edits cannot be applied to `text`, or undefined when they can: every span must lie in
 * the text, cover exactly one whole quoted string token, and no two spans may overlap. A problem here
 * means the text is not the one the spans were taken from. */
export function editProblem(text: string, edits: readonly ValueEdit[]): string | undefined {
  const sorted = sortEdits(edits);
  let previousEnd = -1;
  for (const { span } of sorted) {
    if (!Number.isInteger(span.start) || !Number.isInteger(span.end) || span.start < 0 || span.end > text.length) {
      return `characters ${span.start}-${span.end} lie outside the file (${text.length} characters)`;
    }
    if (span.start < previousEnd) return `edits at characters ${span.start} and before ${previousEnd} overlap`;
    if (quotedTokenEnd(text, span.start) !== span.end) {
      return `characters ${span.start}-${span.end} are not one quoted string (found ${JSON.stringify(text.slice(span.start, Math.min(span.end, span.start + 40)))})`;
    }
    previousEnd = span.end;
  }
  return undefined;
}

/** The text with each span replaced by its quoted replacement. Throws on invalid edits: callers
 * check `editProblem` first, so an invalid edit here is a bug. */
export function applyEdits(text: string, edits: readonly ValueEdit[]): string {
  const problem = editProblem(text, edits);
  if (problem !== undefined) throw new RangeError(`applyEdits: ${problem}`);
  let out = "";
  let cursor = 0;
  for (const edit of sortEdits(edits)) {
    out += text.slice(cursor, edit.span.start) + quoteKicadString(edit.replacement);
    cursor = edit.span.end;
  }
  return out + text.slice(cursor);
}

/** Decodes file bytes the way the reader does (UTF-8, a BOM kept as U+FEFF at offset 0), or says
 * why the bytes cannot be edited as text without changing bytes we do not mean to change. */
export function decodeForEditing(bytes: Uint8Array): { ok: true; text: string } | { ok: false; problem: string } {
  const buffer = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const text = buffer.toString("utf8");
  // Invalid UTF-8 decodes to U+FFFD and would not survive re-encoding: refuse rather than damage it.
  if (!Buffer.from(text, "utf8").equals(buffer)) {
    return { ok: false, problem: "the file is not valid UTF-8, so it cannot be edited without changing other bytes" };
  }
  return { ok: true, text };
}

/** The file bytes with exactly the bytes of each span replaced by the UTF-8 bytes of its quoted
 * replacement; character offsets are converted to byte offsets (the file may hold non-ASCII text
 * before a span). Returns a problem instead when the bytes or the spans do not fit. */
export function applyEditsToBytes(
  bytes: Uint8Array,
  edits: readonly ValueEdit[],
): { ok: true; bytes: Buffer } | { ok: false; problem: string } {
  const decoded = decodeForEditing(bytes);
  if (!decoded.ok) return decoded;
  const { text } = decoded;
  const problem = editProblem(text, edits);
  if (problem !== undefined) return { ok: false, problem };
  const source = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const pieces: Buffer[] = [];
  let charCursor = 0;
  let byteCursor = 0;
  for (const edit of sortEdits(edits)) {
    const byteStart = byteCursor + Buffer.byteLength(text.slice(charCursor, edit.span.start), "utf8");
    const byteEnd = byteStart + Buffer.byteLength(text.slice(edit.span.start, edit.span.end), "utf8");
    pieces.push(source.subarray(byteCursor, byteStart), Buffer.from(quoteKicadString(edit.replacement), "utf8"));
    charCursor = edit.span.end;
    byteCursor = byteEnd;
  }
  pieces.push(source.subarray(byteCursor));
  return { ok: true, bytes: Buffer.concat(pieces) };
}

function sortEdits<T extends ValueEdit>(edits: readonly T[]): T[] {
  return [...edits].sort((a, b) => a.span.start - b.span.start || a.span.end - b.span.end);
}
