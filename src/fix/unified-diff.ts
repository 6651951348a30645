// A unified diff of planned value edits, for `loadline fix --dry-run`. We know exactly which
// characters change, so hunks are computed from the edit positions instead of by a general diff:
// the changed lines are the lines the spans touch, with `context` unchanged lines around them.
// Lines are split on "\n" only and printed byte for byte (a CRLF file keeps its "\r"), which is what
// `diff -u` prints and what `patch`/`git apply` expect.
import { applyEdits, type ValueEdit } from "./apply.js";

export interface UnifiedDiffOptions {
  /** Unchanged lines shown around each change; 3 like `diff -u`. */
  context?: number;
}

interface ChangeBlock {
  /** First and last old line (0-based) the block replaces. */
  first: number;
  last: number;
  newLines: string[];
}

/** The unified diff (`--- a/PATH`, `+++ b/PATH`, hunks) that `edits` make to `oldText`; "" when the
 * edits change nothing. `path` is printed as given (use a relative, `/`-separated path). */
export function unifiedDiff(path: string, oldText: string, edits: readonly ValueEdit[], options: UnifiedDiffOptions = {}): string {
  const context = options.context ?? 3;
  const lineStarts = lineStartOffsets(oldText);
  const lineCount = lineStarts.length - 1;
  const blocks = changeBlocks(oldText, lineStarts, edits);
  if (blocks.length === 0) return "";

  let out = `--- a/${path}\n+++ b/${path}\n`;
  let lineDelta = 0;
  let index = 0;
  while (index < blocks.length) {
    // Blocks closer than two contexts share one hunk, as in `diff -u`.
    let end = index;
    while (end + 1 < blocks.length && blockAt(blocks, end + 1).first - blockAt(blocks, end).last - 1 <= 2 * context) end++;
    const firstBlock = blockAt(blocks, index);
    const lastBlock = blockAt(blocks, end);
    const hunkFirst = Math.max(0, firstBlock.first - context);
    const hunkLast = Math.min(lineCount - 1, lastBlock.last + context);

    const body: string[] = [];
    let oldCount = 0;
    let newCount = 0;
    let line = hunkFirst;
    let hunkDelta = 0;
    for (let b = index; b <= end; b++) {
      const block = blockAt(blocks, b);
      for (; line < block.first; line++, oldCount++, newCount++) body.push(diffLine(" ", lineText(oldText, lineStarts, line)));
      for (; line <= block.last; line++, oldCount++) body.push(diffLine("-", lineText(oldText, lineStarts, line)));
      for (const added of block.newLines) body.push(diffLine("+", added));
      newCount += block.newLines.length;
      hunkDelta += block.newLines.length - (block.last - block.first + 1);
    }
    for (; line <= hunkLast; line++, oldCount++, newCount++) body.push(diffLine(" ", lineText(oldText, lineStarts, line)));

    const newFirst = hunkFirst + lineDelta;
    out += `@@ -${rangeText(hunkFirst, oldCount)} +${rangeText(newFirst, newCount)} @@\n${body.join("")}`;
    lineDelta += hunkDelta;
    index = end + 1;
  }
  return out;
}

/** Offsets where each line starts, plus a final entry at the text's end. A final line without "\n"
 * counts as a line; an empty text has none. */
function lineStartOffsets(text: string): number[] {
  const starts = [0];
  for (let i = text.indexOf("\n"); i !== -1; i = text.indexOf("\n", i + 1)) starts.push(i + 1);
  if (starts[starts.length - 1] !== text.length) starts.push(text.length);
  return starts;
}

function changeBlocks(text: string, lineStarts: readonly number[], edits: readonly ValueEdit[]): ChangeBlock[] {
  const sorted = [...edits].sort((a, b) => a.span.start - b.span.start);
  const groups: { first: number; last: number; edits: ValueEdit[] }[] = [];
  for (const edit of sorted) {
    const first = lineIndexOf(lineStarts, edit.span.start);
    const last = lineIndexOf(lineStarts, Math.max(edit.span.start, edit.span.end - 1));
    const previous = groups[groups.length - 1];
    if (previous !== undefined && first <= previous.last) {
      previous.last = Math.max(previous.last, last);
      previous.edits.push(edit);
    } else {
      groups.push({ first, last, edits: [edit] });
    }
  }
  const blocks: ChangeBlock[] = [];
  for (const group of groups) {
    const from = lineStarts[group.first] ?? 0;
    const to = lineStarts[group.last + 1] ?? text.length;
    const oldBlock = text.slice(from, to);
    const shifted = group.edits.map((e) => ({ span: { start: e.span.start - from, end: e.span.end - from }, replacement: e.replacement }));
    const newBlock = applyEdits(oldBlock, shifted);
    if (newBlock !== oldBlock) blocks.push({ first: group.first, last: group.last, newLines: splitKeepingNewlines(newBlock) });
  }
  return blocks;
}

function lineIndexOf(lineStarts: readonly number[], offset: number): number {
  let low = 0;
  let high = lineStarts.length - 2;
  while (low < high) {
    const mid = (low + high + 1) >> 1;
    if ((lineStarts[mid] ?? 0) <= offset) low = mid;
    else high = mid - 1;
  }
  return Math.max(0, low);
}

function lineText(text: string, lineStarts: readonly number[], line: number): string {
  return text.slice(lineStarts[line] ?? text.length, lineStarts[line + 1] ?? text.length);
}

function splitKeepingNewlines(text: string): string[] {
  const lines: string[] = [];
  let start = 0;
  for (let i = text.indexOf("\n"); i !== -1; i = text.indexOf("\n", i + 1)) {
    lines.push(text.slice(start, i + 1));
    start = i + 1;
  }
  if (start < text.length) lines.push(text.slice(start));
  return lines;
}

function diffLine(prefix: " " | "-" | "+", line: string): string {
  return line.endsWith("\n") ? prefix + line : `${prefix}${line}\n\\ No newline at end of file\n`;
}

/** `start,count` in 1-based lines; `diff -u` leaves out a count of 1 and names the line before an
 * empty range. */
function rangeText(firstIndex: number, count: number): string {
  if (count === 0) return `${firstIndex},0`;
  return count === 1 ? `${firstIndex + 1}` : `${firstIndex + 1},${count}`;
}

function blockAt(blocks: readonly ChangeBlock[], index: number): ChangeBlock {
  const block = blocks[index];
  if (block === undefined) throw new RangeError(`unifiedDiff: no change block ${index}`);
  return block;
}
