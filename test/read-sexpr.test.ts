// The s-expression layer: both tokenizers agree, KiCad's lexical rules (KiCad format notes §1, §14)
// are followed, and every malformed input becomes a ReadError with the right position.
import { describe, expect, it } from "vitest";
import {
  MAX_FILE_BYTES, MAX_NESTING_DEPTH, argNumber, argText, childOf, flagOf, keywordOf, parseSexpr, tokenEnd, where,
  type SList, type SNode,
} from "../src/read/sexpr.js";

function tree(text: string | Buffer, tokenizer: "auto" | "own" = "auto"): SNode[] {
  const r = parseSexpr(text, "t.kicad_sch", { tokenizer });
  if (!r.ok) throw new Error(`unexpected error: ${r.error.message}`);
  return r.nodes;
}

function firstList(text: string, tokenizer: "auto" | "own" = "auto"): SList {
  const n = tree(text, tokenizer)[0];
  if (n?.type !== "list") throw new Error("expected a list");
  return n;
}

function errorOf(text: string | Buffer): { line: number; column: number; message: string; file: string } {
  const r = parseSexpr(text, "bad.kicad_sch");
  if (r.ok) throw new Error("expected an error");
  return r.error;
}

// Shaped like KiCad 6 output (invented content): strings with the writer's escapes, bare UUIDs,
// numbers, nested lists over several lines.
const SAMPLE = `(kicad_sch (version 20211123) (generator eeschema)
  (uuid 6a1f0c2e-0000-4000-8000-000000000001)
  (symbol (lib_id "Device:R") (at 120.65 63.5 90) (unit 1)
    (property "Reference" "R7" (id 0) (at 120.65 58.42 90))
    (property "Value" "4k7" (id 1) (at 1 2 0) (effects (font (size 1.27 1.27)) hide))
    (property "Note" "say \\"hi\\"\\nC:\\\\bias" (id 4) (at 0 0 0)))
  (text "two\\nlines" (at 10 10 0))
)
`;

describe("tokenizers", () => {
  it("sexpr-plus and our tokenizer give identical trees, locations included", () => {
    const a = parseSexpr(SAMPLE, "s");
    const b = parseSexpr(SAMPLE, "s", { tokenizer: "own" });
    expect(a.ok && a.tokenizer).toBe("sexpr-plus");
    expect(b.ok && b.tokenizer).toBe("own");
    if (!a.ok || !b.ok) return;
    const shape = (nodes: SNode[]): unknown => nodes.map((n) => ({
      type: n.type, start: n.location.start, end: tokenEnd(n, SAMPLE),
      content: n.type === "list" ? shape(n.content) : n.content,
    }));
    expect(shape(b.nodes)).toEqual(shape(a.nodes));
    expect(JSON.stringify(shape(a.nodes)).length).toBeGreaterThan(3000);
  });

  it("decodes the writer's escapes \\\" \\\\ \\n (KiCad format notes §1)", () => {
    const sym = childOf(firstList(SAMPLE), "symbol") as SList;
    const note = sym.content.filter((c) => keywordOf(c) === "property")[2] as SList;
    expect(argText(note, 2)).toBe('say "hi"\nC:\\bias');
  });

  it("a string token's range covers exactly its quotes", () => {
    const sym = childOf(firstList(SAMPLE), "symbol") as SList;
    const value = sym.content.filter((c) => keywordOf(c) === "property")[1] as SList;
    const node = value.content[2] as SNode;
    expect(SAMPLE.slice(node.location.start.offset, tokenEnd(node, SAMPLE))).toBe('"4k7"');
    expect(where(node)).toEqual({ line: 5, column: 23, offset: SAMPLE.indexOf('"4k7"') });
  });

  it("treats a bare comma, quote or semicolon as token text, as KiCad's lexer does (§14)", () => {
    // Version-D netlist values are bare: 4,7K must stay one token, not `4` plus (unquote 7K).
    const r = parseSexpr(`(comp (value 4,7K) (ref R'1) (x a;b))`, "d.net");
    expect(r.ok && r.tokenizer).toBe("own");
    const list = firstList(`(comp (value 4,7K) (ref R'1) (x a;b))`);
    expect(argText(childOf(list, "value"), 1)).toBe("4,7K");
    expect(argText(childOf(list, "ref"), 1)).toBe("R'1");
    expect(argText(childOf(list, "x"), 1)).toBe("a;b");
  });

  it("accepts the escapes KiCad's lexer accepts and sexpr-plus rejects (§1, §14)", () => {
    const list = firstList(String.raw`(p "C:\Users\Max" "\x41\102\a" "\101x")`);
    expect(argText(list, 1)).toBe("C:\\Users\\Max"); // unknown escape keeps the backslash
    expect(argText(list, 2)).toBe("AB\x07");
    expect(argText(list, 3)).toBe("Ax");
  });

  it("strips a byte-order mark but keeps offsets relative to the text with it", () => {
    const text = "\uFEFF(kicad_sch (version 20231120))";
    const r = parseSexpr(Buffer.from(text, "utf8"), "bom.kicad_sch");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const root = r.nodes[0] as SList;
    expect(keywordOf(root)).toBe("kicad_sch");
    expect(where(root)).toEqual({ line: 1, column: 1, offset: 1 });
    expect(r.text.charCodeAt(0)).toBe(0xfeff);
  });
});

describe("typed access", () => {
  it("reads yes/no flags in every spelling (§1)", () => {
    const pins = ["(pin passive line hide)", "(pin passive line (hide))", "(pin passive line (hide yes))", "(pin passive line (hide no))", "(pin passive line)"];
    expect(pins.map((p) => flagOf(firstList(p), "hide"))).toEqual([true, true, true, false, undefined]);
  });

  it("reads positional numbers and treats atom and string alike", () => {
    const at = firstList(`(at 120.65 -63.5 "90")`);
    expect([argNumber(at, 1), argNumber(at, 2), argNumber(at, 3), argNumber(at, 4)]).toEqual([120.65, -63.5, 90, undefined]);
    expect(argText(firstList(`(uuid 1b2c)`), 1)).toBe(argText(firstList(`(uuid "1b2c")`), 1));
    expect(argNumber(firstList(`(at 12abc)`), 1)).toBeUndefined();
  });
});

describe("bad input", () => {
  it("a truncated file names the list left open", () => {
    const e = errorOf("(kicad_sch (version 20231120)\n  (wire (pts (xy 1 2) (xy 3 4))\n");
    expect(e).toEqual({ file: "bad.kicad_sch", line: 3, column: 1,
      message: "expected ')' to close the list opened at line 2, column 3 (the file ends first)" });
  });

  it("an extra ')' is reported where it stands", () => {
    const e = errorOf("(kicad_sch (version 1)))\n");
    expect([e.line, e.column, e.message]).toEqual([1, 24, "unexpected ')': no list is open here"]);
  });

  it("an unterminated string names where it starts", () => {
    const e = errorOf('(kicad_sch\n  (property "Value" "4k7\n)\n');
    expect(e.message).toBe(`expected '"' to close the string that starts at line 2, column 21 (the file ends first)`);
    expect([e.line, e.column]).toEqual([4, 1]);
  });

  it("100,000 levels of nesting stop at the depth cap, with its position, and nothing overflows", () => {
    const deep = "(".repeat(100_000) + ")".repeat(100_000);
    const e = errorOf(deep);
    expect(e.line).toBe(1);
    expect(e.column).toBe(MAX_NESTING_DEPTH + 1);
    expect(e.message).toContain(`more than ${MAX_NESTING_DEPTH} levels`);
  });

  it("invalid UTF-8 is refused at the first bad byte", () => {
    const bytes = Buffer.concat([Buffer.from("(kicad_sch\n  (label \"µA\"\n  (x \"ab", "utf8"), Buffer.from([0xc3, 0x28]), Buffer.from("\"))")]);
    const e = errorOf(bytes);
    expect([e.line, e.column]).toEqual([3, 9]);
    expect(e.message).toMatch(/^invalid UTF-8: byte 0xc3 at offset 34/);
  });

  it("a file over the size cap is refused before parsing", () => {
    const e = errorOf(Buffer.alloc(MAX_FILE_BYTES + 1, 0x20));
    expect([e.line, e.column]).toEqual([0, 0]);
    expect(e.message).toBe(`file is ${MAX_FILE_BYTES + 1} bytes; the reader accepts at most ${MAX_FILE_BYTES} bytes`);
  });
});
