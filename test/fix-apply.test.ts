// Applying value edits: only the value bytes change. Expected outputs are built independently of the
// code under test: the original bytes cut at the byte position of the old token (found with a byte
// search, not with character offsets) and joined around the new token's bytes.
import { describe, expect, it } from "vitest";
import { applyEdits, applyEditsToBytes, decodeForEditing, editProblem, quoteKicadString, quotedTokenEnd } from "../src/fix/apply.js";

/** The span of the first occurrence of `token` in `text`, as the reader would report it. */
function spanOf(text: string, token: string, from = 0): { start: number; end: number } {
  const start = text.indexOf(token, from);
  if (start < 0) throw new Error(`test setup: ${token} not in text`);
  return { start, end: start + token.length };
}

/** Original bytes with the bytes of `oldToken` (first occurrence at or after byte `fromByte`) replaced. */
function replaceBytes(original: Buffer, oldToken: string, newToken: string, fromByte = 0): Buffer {
  const at = original.indexOf(Buffer.from(oldToken, "utf8"), fromByte);
  if (at < 0) throw new Error(`test setup: ${oldToken} not in bytes`);
  return Buffer.concat([original.subarray(0, at), Buffer.from(newToken, "utf8"), original.subarray(at + Buffer.byteLength(oldToken))]);
}

// Shaped like KiCad 8 output (invented board): a description with non-ASCII text before the value.
const crlfBoard = [
  '\uFEFF(kicad_sch (version 20231120) (generator "eeschema") (generator_version "8.0")',
  '  (title_block (title "Ferrite-tuned 7 MHz preamp — Ω µ ±"))',
  '  (symbol (lib_id "Device:R") (at 120.65 63.500 90) (unit 1)',
  '    (property "Reference" "R7" (at 120.65 58.42 90) (effects (font (size 1.27 1.27))))',
  '    (property "Value" "7k5" (at 120.65 68.58 90) (effects (font (size 1.27 1.27))))',
  '    (property "Tolerance" "±5 %" (at 120.65 68.58 90) (effects (font (size 1.27 1.27)) hide))',
  "  )",
  "  (symbol (lib_id \"Device:C\") (at 100 50 0) (unit 1)",
  '    (property "Reference" "C3" (at 102 48 0) (effects (font (size 1.27 1.27))))',
  '    (property "Value" "100n" (at 102 52 0) (effects (font (size 1.27 1.27))))',
  "  )",
  ")",
  "",
].join("\r\n");

describe("quoteKicadString", () => {
  it("escapes the four characters KiCad's writer escapes (notes: kicad-schematic-format §1, [SRC])", () => {
    expect(quoteKicadString("6k8")).toBe('"6k8"');
    expect(quoteKicadString('say "hi"')).toBe('"say \\"hi\\""');
    expect(quoteKicadString("a\\b")).toBe('"a\\\\b"');
    expect(quoteKicadString("two\nlines\r")).toBe('"two\\nlines\\r"');
    expect(quoteKicadString("6.8 kΩ")).toBe('"6.8 kΩ"');
  });

  it("writes tokens that end where the lexer says they end", () => {
    for (const value of ['x"', "\\", '\\"', "", "6k8", 'a\\"b"c']) {
      const token = quoteKicadString(value);
      expect(quotedTokenEnd(`${token} rest`, 0)).toBe(token.length);
    }
  });
});

describe("applyEditsToBytes", () => {
  it("changes only the value bytes of a CRLF file with a BOM and non-ASCII text before the span", () => {
    const original = Buffer.from(crlfBoard, "utf8");
    const r7 = spanOf(crlfBoard, '"7k5"');
    const result = applyEditsToBytes(original, [{ span: r7, replacement: "6k8" }]);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const expected = replaceBytes(original, '"7k5"', '"6k8"');
    expect(result.bytes.equals(expected)).toBe(true);
    // The BOM and every CRLF survive.
    expect(result.bytes.subarray(0, 3).equals(Buffer.from([0xef, 0xbb, 0xbf]))).toBe(true);
    expect(result.bytes.toString("latin1").split("\r\n").length).toBe(original.toString("latin1").split("\r\n").length);
  });

  it("applies several edits, a longer and a non-ASCII replacement, in any given order", () => {
    const original = Buffer.from(crlfBoard, "utf8");
    const r7 = spanOf(crlfBoard, '"7k5"');
    const c3 = spanOf(crlfBoard, '"100n"');
    const result = applyEditsToBytes(original, [
      { span: c3, replacement: "100 nF" },
      { span: r7, replacement: "6.8 kΩ" },
    ]);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const expected = replaceBytes(replaceBytes(original, '"7k5"', '"6.8 kΩ"'), '"100n"', '"100 nF"');
    expect(result.bytes.equals(expected)).toBe(true);
    expect(result.bytes.length).toBe(original.length + Buffer.byteLength("6.8 kΩ") - "7k5".length + "100 nF".length - "100n".length);
  });

  it("escapes a quote in the replacement so the file still parses as one token", () => {
    const text = '(property "Value" "10k" (at 0 0 0))\n';
    const result = applyEditsToBytes(Buffer.from(text), [{ span: spanOf(text, '"10k"'), replacement: '10k "trim"' }]);
    expect(result.ok && result.bytes.toString()).toBe('(property "Value" "10k \\"trim\\"" (at 0 0 0))\n');
  });

  it("refuses invalid UTF-8 rather than re-encoding it", () => {
    const bytes = Buffer.concat([Buffer.from('(title "'), Buffer.from([0xff, 0xfe]), Buffer.from('") (property "Value" "1k")\n')]);
    expect(decodeForEditing(bytes).ok).toBe(false);
    const result = applyEditsToBytes(bytes, [{ span: { start: 0, end: 1 }, replacement: "x" }]);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problem).toMatch(/not valid UTF-8/);
  });

  it("refuses spans that are not one whole quoted token", () => {
    const text = '(property "Value" "4k7" (at 0 0 0))';
    const token = spanOf(text, '"4k7"');
    expect(editProblem(text, [{ span: token, replacement: "x" }])).toBeUndefined();
    expect(editProblem(text, [{ span: { start: token.start + 1, end: token.end }, replacement: "x" }])).toMatch(/not one quoted string/);
    expect(editProblem(text, [{ span: { start: token.start, end: token.end + 1 }, replacement: "x" }])).toMatch(/not one quoted string/);
    expect(editProblem(text, [{ span: { start: token.start, end: 999 }, replacement: "x" }])).toMatch(/outside the file/);
    expect(
      editProblem(text, [
        { span: token, replacement: "x" },
        { span: token, replacement: "y" },
      ]),
    ).toMatch(/overlap/);
  });
});

describe("applyEdits (text)", () => {
  it("agrees with the byte path on the CRLF board", () => {
    const r7 = spanOf(crlfBoard, '"7k5"');
    const text = applyEdits(crlfBoard, [{ span: r7, replacement: "6k8" }]);
    const bytes = applyEditsToBytes(Buffer.from(crlfBoard, "utf8"), [{ span: r7, replacement: "6k8" }]);
    expect(bytes.ok && bytes.bytes.equals(Buffer.from(text, "utf8"))).toBe(true);
  });

  it("throws on an invalid edit (a caller bug)", () => {
    expect(() => applyEdits("abc", [{ span: { start: 0, end: 2 }, replacement: "x" }])).toThrow(RangeError);
  });
});
