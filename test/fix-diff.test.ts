// The dry-run diff, checked against GNU diffutils' `diff -u` (an independent implementation of the
// unified format) on the same old and new files, and against one hand-written hunk.
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { applyEdits, quoteKicadString } from "../src/fix/apply.js";
import { unifiedDiff } from "../src/fix/unified-diff.js";

const work = mkdtempSync(join(tmpdir(), "loadline-diff-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));

function hasGnuDiff(): boolean {
  try {
    return execFileSync("diff", ["--version"], { encoding: "utf8" }).includes("GNU diffutils");
  } catch {
    return false;
  }
}

/** `diff -u` of the two texts with our header names (exit status 1 means "differ"). */
function gnuDiff(oldText: string, newText: string, name: string): string {
  const a = join(work, "old");
  const b = join(work, "new");
  writeFileSync(a, oldText);
  writeFileSync(b, newText);
  try {
    return execFileSync("diff", ["-u", "--label", `a/${name}`, "--label", `b/${name}`, a, b], { encoding: "utf8" });
  } catch (err) {
    const out = (err as { stdout?: string }).stdout;
    if (typeof out === "string") return out;
    throw err;
  }
}

function valueLines(count: number, eol: string): { text: string; tokens: { start: number; end: number }[] } {
  let text = "(kicad_sch (version 20231120)" + eol;
  const tokens: { start: number; end: number }[] = [];
  for (let i = 1; i <= count; i++) {
    text += `  (symbol (lib_id "Device:R") (at ${i * 2.54} 50.8 0)` + eol;
    text += `    (property "Reference" "R${i}" (at 0 0 0))` + eol;
    const token = quoteKicadString(`${i}k`);
    const start = text.length + '    (property "Value" '.length;
    text += `    (property "Value" ${token} (at 0 0 0))` + eol;
    tokens.push({ start, end: start + token.length });
    text += "  )" + eol;
  }
  return { text: text + ")" + eol, tokens };
}

describe("unifiedDiff", () => {
  it("writes one hunk with three lines of context (format per diff -u)", () => {
    const { text, tokens } = valueLines(3, "\n");
    const r2 = tokens[1];
    if (r2 === undefined) throw new Error("setup");
    const diff = unifiedDiff("hw/amp.kicad_sch", text, [{ span: r2, replacement: "2k2" }]);
    expect(diff).toBe(
      [
        "--- a/hw/amp.kicad_sch",
        "+++ b/hw/amp.kicad_sch",
        "@@ -5,7 +5,7 @@",
        "   )",
        '   (symbol (lib_id "Device:R") (at 5.08 50.8 0)',
        '     (property "Reference" "R2" (at 0 0 0))',
        '-    (property "Value" "2k" (at 0 0 0))',
        '+    (property "Value" "2k2" (at 0 0 0))',
        "   )",
        '   (symbol (lib_id "Device:R") (at 7.62 50.8 0)',
        '     (property "Reference" "R3" (at 0 0 0))',
        "",
      ].join("\n"),
    );
  });

  it("returns nothing when nothing changes", () => {
    const { text, tokens } = valueLines(2, "\n");
    expect(unifiedDiff("x", text, [])).toBe("");
    expect(unifiedDiff("x", text, [{ span: tokens[0] ?? { start: 0, end: 0 }, replacement: "1k" }])).toBe("");
  });

  it.runIf(hasGnuDiff())("matches diff -u byte for byte on random edits, LF and CRLF, with and without a final newline", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 12 }),
        fc.constantFrom("\n", "\r\n"),
        fc.boolean(),
        fc.array(fc.tuple(fc.nat(), fc.stringMatching(/^[0-9]{1,3}[kRM]?[0-9]?$/)), { minLength: 1, maxLength: 6 }),
        (count, eol, trimFinalNewline, picks) => {
          const board = valueLines(count, eol);
          const text = trimFinalNewline ? board.text.slice(0, -eol.length) : board.text;
          const chosen = new Map<number, string>();
          for (const [index, value] of picks) chosen.set(index % count, value);
          const edits = [...chosen].map(([index, replacement]) => ({ span: board.tokens[index] ?? { start: 0, end: 0 }, replacement }));
          const ours = unifiedDiff("amp.kicad_sch", text, edits);
          const theirs = gnuDiff(text, applyEdits(text, edits), "amp.kicad_sch");
          expect(ours).toBe(theirs);
        },
      ),
      { numRuns: 60 },
    );
  });
});
