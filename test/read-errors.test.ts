// Bad input never crashes and never hangs: each case is a ReadError (or a note) naming the file,
// the line and column, and what was expected. The limits asserted are the reader's own constants.
import { describe, expect, it } from "vitest";
import { MAX_FILE_BYTES, MAX_NESTING_DEPTH, MAX_SHEET_DEPTH } from "../src/read/index.js";
import { place, schematic, sheet } from "./helpers/kicad-snippets.js";
import { readError, readMemory } from "./helpers/read-design.js";

const sheetLine = (text: string, needle = "(sheet ") => text.slice(0, text.indexOf(needle)).split("\n").length;

describe("malformed files", () => {
  it("an extra ')' ", () => {
    expect(readError({ "e/a.kicad_sch": "(kicad_sch (version 20211123))\n)\n" }, "e/a.kicad_sch"))
      .toEqual({ file: "e/a.kicad_sch", line: 2, column: 1, message: "unexpected ')': no list is open here" });
  });

  it("a truncated file", () => {
    const text = schematic([place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 })]);
    const cut = text.slice(0, text.lastIndexOf("(property \"Value\""));
    const e = readError({ "e/a.kicad_sch": cut }, "e/a.kicad_sch");
    const openLine = sheetLine(cut, "(symbol (lib_id");
    expect(e).toEqual({ file: "e/a.kicad_sch", line: cut.split("\n").length, column: cut.length - cut.lastIndexOf("\n"),
      message: `expected ')' to close the list opened at line ${openLine}, column 3 (the file ends first)` });
  });

  it("a file that is not a schematic", () => {
    expect(readError({ "e/board.kicad_sch": "(kicad_pcb (version 20221018) (generator pcbnew))" }, "e/board.kicad_sch")).toEqual({
      file: "e/board.kicad_sch", line: 1, column: 1,
      message: 'not a KiCad schematic or netlist: expected "(kicad_sch" or "(export" at the start, found "(kicad_pcb"',
    });
  });

  it("a KiCad 5 schematic gets a hint", () => {
    const e = readError({ "e/old.sch": "EESchema Schematic File Version 4\nEELAYER 30 0\n" }, "e/old.sch");
    expect([e.line, e.column]).toEqual([1, 1]);
    expect(e.message).toContain("a KiCad 5 schematic");
  });

  it("an unknown (newer) file version is read with a note at the version", () => {
    const c = readMemory({ "e/new.kicad_sch": "(kicad_sch\n  (version 20991231) (generator eeschema))" }, "e/new.kicad_sch");
    expect(c.notes).toContainEqual({ file: "e/new.kicad_sch", line: 2, column: 3,
      message: "file version 20991231 is newer than this reader knows (20260101); reading it anyway — check the results" });
  });

  it(`100,000 levels of nesting stop at the depth cap (${MAX_NESTING_DEPTH}) without overflowing the stack`, () => {
    const e = readError({ "e/deep.kicad_sch": "(kicad_sch " + "(a ".repeat(100_000) + ")".repeat(100_001) }, "e/deep.kicad_sch");
    expect(e).toEqual({ file: "e/deep.kicad_sch", line: 1, column: 12 + 3 * (MAX_NESTING_DEPTH - 1),
      message: `lists nest more than ${MAX_NESTING_DEPTH} levels deep (the reader's limit); the file is malformed` });
  });

  it("invalid UTF-8", () => {
    const bytes = Buffer.concat([Buffer.from("(kicad_sch (version 20211123)\n  (label \"V", "utf8"), Buffer.from([0xff]), Buffer.from("\"))")]);
    const e = readError({ "e/bin.kicad_sch": bytes }, "e/bin.kicad_sch");
    expect([e.file, e.line, e.column]).toEqual(["e/bin.kicad_sch", 2, 12]);
    expect(e.message).toMatch(/^invalid UTF-8: byte 0xff/);
  });

  it("a file over the size cap, refused from its size alone", () => {
    const e = readError({ "e/huge.kicad_sch": Buffer.alloc(MAX_FILE_BYTES + 10, 0x20) }, "e/huge.kicad_sch");
    expect(e).toEqual({ file: "e/huge.kicad_sch", line: 0, column: 0,
      message: `file is ${MAX_FILE_BYTES + 10} bytes; the reader accepts at most ${MAX_FILE_BYTES} bytes` });
  });

  it("a file that does not exist", () => {
    expect(readError({}, "e/none.kicad_sch")).toEqual({ file: "e/none.kicad_sch", line: 0, column: 0, message: "cannot open: no such file" });
  });
});

describe("bad hierarchies", () => {
  const withSheet = (file: string, uuid = "f0000000-0000-4000-8000-000000000001") =>
    schematic([sheet("sub", file, uuid, 76.2, 40.64)]);

  it("a missing sheet file is an error at the (sheet item", () => {
    const top = withSheet("stage.kicad_sch");
    expect(readError({ "h/top.kicad_sch": top }, "h/top.kicad_sch")).toEqual({
      file: "h/top.kicad_sch", line: sheetLine(top), column: 3,
      message: 'sheet "sub": cannot open its file "stage.kicad_sch" (h/stage.kicad_sch): no such file',
    });
  });

  it("a sheet that includes its own file", () => {
    const top = withSheet("top.kicad_sch");
    const e = readError({ "h/top.kicad_sch": top }, "h/top.kicad_sch");
    expect([e.file, e.line, e.column]).toEqual(["h/top.kicad_sch", sheetLine(top), 3]);
    expect(e.message).toBe('sheet "sub": its file "top.kicad_sch" already contains this sheet (top.kicad_sch → top.kicad_sch); a sheet cannot include itself');
  });

  it("a cycle through two sheets is reported in the sheet that closes it", () => {
    const b = withSheet("a.kicad_sch");
    const e = readError({ "h/a.kicad_sch": withSheet("b.kicad_sch"), "h/b.kicad_sch": b }, "h/a.kicad_sch");
    expect([e.file, e.line, e.column]).toEqual(["h/b.kicad_sch", sheetLine(b), 3]);
    expect(e.message).toBe('sheet "sub": its file "a.kicad_sch" already contains this sheet (a.kicad_sch → b.kicad_sch → a.kicad_sch); a sheet cannot include itself');
  });

  it("a sheet file outside the project folder is refused even when it exists", () => {
    const top = withSheet("../secret/keys.kicad_sch");
    const e = readError({ "h/top.kicad_sch": top, "secret/keys.kicad_sch": schematic([]) }, "h/top.kicad_sch");
    expect(e).toEqual({ file: "h/top.kicad_sch", line: sheetLine(top), column: 3,
      message: 'sheet "sub": its file "../secret/keys.kicad_sch" lies outside the project folder; refused (sheets must come from inside the project)' });
  });

  it("an explicit project root admits a sibling folder", () => {
    const c = readMemory({ "h/top.kicad_sch": withSheet("../lib/stage.kicad_sch"), "lib/stage.kicad_sch": schematic([]) }, "h/top.kicad_sch", ".");
    expect(c.sheets.map((s) => s.path)).toEqual(["/", "/sub/"]);
  });

  it(`sheets nested deeper than ${MAX_SHEET_DEPTH} levels`, () => {
    const files: Record<string, string> = {};
    for (let i = 0; i <= MAX_SHEET_DEPTH + 1; i++) files[`d/s${i}.kicad_sch`] = withSheet(`s${i + 1}.kicad_sch`, `f0000000-0000-4000-8000-${String(i).padStart(12, "0")}`);
    const e = readError(files, "d/s0.kicad_sch");
    expect(e.file).toBe(`d/s${MAX_SHEET_DEPTH}.kicad_sch`);
    expect(e.message).toBe(`sheet "sub": sheets nest more than ${MAX_SHEET_DEPTH} levels deep (the reader's limit)`);
  });

  it("a syntax error inside a sub-sheet names the sub-sheet", () => {
    const e = readError({ "h/top.kicad_sch": withSheet("bad.kicad_sch"), "h/bad.kicad_sch": "(kicad_sch (version 20211123)\n (wire (pts (xy 1 2)))))" }, "h/top.kicad_sch");
    expect(e).toEqual({ file: "h/bad.kicad_sch", line: 2, column: 24, message: "unexpected ')': no list is open here" });
  });
});
