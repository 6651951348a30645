// `loadline nets`: JSON shape, sub-sheets not listed as designs, one stderr line per bad file with
// its position, exit status 2 when any file failed while the others are still read.
import { describe, expect, it } from "vitest";
import { runNets } from "../src/cli/nets.js";
import { memoryFileSource } from "../src/read/index.js";
import { LIB_GND, LIB_R, label, place, schematic, sheet } from "./helpers/kicad-snippets.js";

function run(files: Record<string, string>, args: string[], json: boolean): { status: number; out: string; err: string } {
  let out = "";
  let err = "";
  const status = runNets(args, { json }, { fs: memoryFileSource(files), out: (t) => { out += t; }, err: (t) => { err += t; } });
  return { status, out, err };
}

const root = schematic([
  place({ lib: "Device:R", ref: "R1", value: "4k7", x: 50.8, y: 50.8 }),
  label("VBIAS", 50.8, 46.99),
  place({ lib: "power:GND", ref: "#PWR01", value: "GND", x: 50.8, y: 54.61 }),
  sheet("bias", "bias.kicad_sch", "e0000000-0000-4000-8000-000000000001", 101.6, 40.64),
], { libs: [LIB_R, LIB_GND] });
const bias = schematic([place({ lib: "Device:R", ref: "R2", value: "10k", x: 50.8, y: 50.8 }), label("VBIAS", 50.8, 46.99, "global_label")]);

describe("loadline nets", () => {
  it("--json prints one object per design in the documented shape; the sub-sheet is not a design", () => {
    const r = run({ "c/amp.kicad_sch": root, "c/bias.kicad_sch": bias }, ["c/bias.kicad_sch", "c/amp.kicad_sch"], true);
    expect(r.status).toBe(0);
    const lines = r.out.trim().split("\n");
    expect(lines).toHaveLength(1);
    expect(JSON.parse(lines[0] ?? "")).toEqual({
      file: "c/amp.kicad_sch",
      parts: [
        { ref: "R1", value: "4k7", kind: "resistor", pins: { "1": "/VBIAS", "2": "GND" } },
        { ref: "R2", value: "10k", kind: "resistor", pins: { "1": "VBIAS", "2": "Net-(R2-Pad2)" } },
      ],
      nets: [
        { name: "/VBIAS", pins: ["R1.1"] },
        { name: "GND", pins: ["R1.2"] },
        { name: "Net-(R2-Pad2)", pins: ["R2.2"] },
        { name: "VBIAS", pins: ["R2.1"] },
      ],
    });
  });

  it("the table lists parts and nets", () => {
    const r = run({ "c/amp.kicad_sch": root, "c/bias.kicad_sch": bias }, ["c/amp.kicad_sch"], false);
    expect(r.out).toContain("R1   4k7    resistor  1=/VBIAS  2=GND");
    expect(r.out).toMatch(/\nGND +R1\.2\n/);
  });

  it("bad files give one positioned error line each, good files are still read, exit status 2", () => {
    const lost = schematic([sheet("gone", "gone.kicad_sch", "e0000000-0000-4000-8000-000000000009", 10, 10)]);
    const sheetLine = lost.slice(0, lost.indexOf("(sheet ")).split("\n").length;
    const r = run({
      "c/amp.kicad_sch": root, "c/bias.kicad_sch": bias,
      "c/cut.kicad_sch": "(kicad_sch (version 20211123)\n  (wire",
      "c/lost.kicad_sch": lost,
    }, ["c/cut.kicad_sch", "c/amp.kicad_sch", "c/lost.kicad_sch", "c/missing.net"], true);
    expect(r.status).toBe(2);
    expect(r.err.trim().split("\n")).toEqual([
      "c/cut.kicad_sch:2:8: error: expected ')' to close the list opened at line 2, column 3 (the file ends first)",
      "c/missing.net:0:0: error: cannot open: no such file",
      `c/lost.kicad_sch:${sheetLine}:3: error: sheet "gone": cannot open its file "gone.kicad_sch" (c/gone.kicad_sch): no such file`,
    ]);
    expect(r.out.trim().split("\n")).toHaveLength(1);
  });
});
