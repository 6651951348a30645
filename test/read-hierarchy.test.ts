// Hierarchical designs: one sheet file used by several instances (v6 root table and v7+ per-symbol
// instance data), sheet pins to hierarchical labels over several levels, buses across sheets, and
// finding root sheets. Rules from KiCad format notes §8.4, §9, §10 (reproduced there against the
// editor's exported netlists of its demo projects); boards and values invented.
import { describe, expect, it } from "vitest";
import { findRootSheets, memoryFileSource } from "../src/read/index.js";
import { LIB_DUAL_OPAMP, LIB_R, label, place, schematic, sheet, wire } from "./helpers/kicad-snippets.js";
import { net, netLines, netOf, readMemory } from "./helpers/read-design.js";

const ROOT_UUID = "10000000-0000-4000-8000-000000000000";
const S1 = "51000000-0000-4000-8000-000000000001";
const S2 = "52000000-0000-4000-8000-000000000002";
const R_UUID = "7e000000-0000-4000-8000-0000000000aa";

/** The shared stage: one resistor between hierarchical label IN and local label MID. */
function stage(version: number, symbolExtra = ""): string {
  return schematic([
    place({ lib: "Device:R", ref: "R1", value: "22k", x: 50.8, y: 50.8, uuid: R_UUID, extra: symbolExtra }),
    label("IN", 50.8, 46.99, "hierarchical_label"),
    label("MID", 50.8, 54.61),
  ], { version, uuid: "5a000000-0000-4000-8000-00000000000f" });
}

/** Root: R1 wired to the IN pin of the first stage instance; the second instance's pin is open. */
function root(version: number, tail = ""): string {
  return schematic([
    place({ lib: "Device:R", ref: "R1", value: "1k", x: 50.8, y: 50.8, uuid: "0e000000-0000-4000-8000-000000000001" }),
    wire(50.8, 46.99, 76.2, 46.99),
    sheet("amp1", "stage.kicad_sch", S1, 76.2, 40.64, [{ name: "IN", x: 76.2, y: 46.99 }]),
    sheet("amp2", "stage.kicad_sch", S2, 127, 40.64, [{ name: "IN", x: 127, y: 46.99 }]),
  ], { version, uuid: ROOT_UUID, tail });
}

const expectedTwoInstances = [
  "/amp1/IN: R1.1 R11.1",
  "/amp1/MID: R11.2",
  "/amp2/IN: R21.1",
  "/amp2/MID: R21.2",
  "Net-(R1-Pad2): R1.2",
];

describe("one sheet file, two instances", () => {
  it("v6: references come from the root's symbol_instances, keyed /sheet/symbol", () => {
    const tail = `(symbol_instances
    (path "/0e000000-0000-4000-8000-000000000001" (reference "R1") (unit 1) (value "1k") (footprint ""))
    (path "/${S1}/${R_UUID}" (reference "R11") (unit 1) (value "22k") (footprint ""))
    (path "/${S2}/${R_UUID}" (reference "R21") (unit 1) (value "27k") (footprint "")))`;
    const files = { "p/amp.kicad_sch": root(20211123, tail), "p/stage.kicad_sch": stage(20211123) };
    const c = readMemory(files, "p/amp.kicad_sch");
    expect(netLines(c)).toEqual(expectedTwoInstances);
    const r21 = c.parts.find((p) => p.ref === "R21");
    expect(r21?.origin).toMatchObject({ file: "p/stage.kicad_sch", sheetPath: "/amp2/" });
    // The per-instance value wins, and its span points into the root's table, where a fix must edit.
    expect(r21?.value).toBe("27k");
    expect(r21?.valueSpan?.file).toBe("p/amp.kicad_sch");
    const text = files["p/amp.kicad_sch"];
    expect(text.slice(r21?.valueSpan?.start, r21?.valueSpan?.end)).toBe('"27k"');
    expect(c.sheets).toEqual([
      { path: "/", file: "p/amp.kicad_sch" },
      { path: "/amp1/", file: "p/stage.kicad_sch" },
      { path: "/amp2/", file: "p/stage.kicad_sch" },
    ]);
  });

  it("v7+: references come from each symbol's instances, keyed by /root/sheet; stale paths are ignored", () => {
    const instances = `
    (instances (project "amp"
      (path "/${ROOT_UUID}/${S1}" (reference "R11") (unit 1))
      (path "/${ROOT_UUID}/${S2}" (reference "R21") (unit 1)))
      (project "old-board" (path "/99999999-0000-4000-8000-000000000000/${S1}" (reference "R99") (unit 1))))`;
    const rootText = root(20231120).replace(`(property "Reference" "R1"`, `(instances (project "amp" (path "/${ROOT_UUID}" (reference "R1") (unit 1))))
    (property "Reference" "R1"`);
    const c = readMemory({ "p/amp.kicad_sch": rootText, "p/stage.kicad_sch": stage(20231120, instances) }, "p/amp.kicad_sch");
    expect(netLines(c)).toEqual(expectedTwoInstances);
  });
});

describe("per-instance units (KiCad format notes §6.1, §10.3)", () => {
  it("v6: the unit in the root's symbol_instances wins over a stale (unit 1) in the shared sheet", () => {
    // Both op-amp sections are written (unit 1) in the sub-sheet; the root says unit 1 for one
    // instance and unit 2 for the other, and only that reproduces the editor's netlist.
    const opamp = "6a000000-0000-4000-8000-0000000000a1";
    const half = schematic([
      place({ lib: "Amp:Dual", ref: "U1", value: "TL072", x: 101.6, y: 50.8, unit: 1, uuid: opamp }),
      label("OUT", 109.22, 50.8, "hierarchical_label"),
    ], { libs: [LIB_DUAL_OPAMP] });
    const top = schematic([
      sheet("left", "half.kicad_sch", S1, 76.2, 40.64, [{ name: "OUT", x: 76.2, y: 46.99 }]),
      sheet("right", "half.kicad_sch", S2, 127, 40.64, [{ name: "OUT", x: 127, y: 46.99 }]),
      label("LEFT", 76.2, 46.99),
      label("RIGHT", 127, 46.99),
    ], { uuid: ROOT_UUID, tail: `(symbol_instances
    (path "/${S1}/${opamp}" (reference "U1") (unit 1) (value "TL072") (footprint ""))
    (path "/${S2}/${opamp}" (reference "U1") (unit 2) (value "TL072") (footprint "")))` });
    const c = readMemory({ "u/top.kicad_sch": top, "u/half.kicad_sch": half }, "u/top.kicad_sch");
    expect(c.parts).toHaveLength(1);
    expect(c.parts[0]?.pins["1"]).toBe("/LEFT");
    expect(c.parts[0]?.pins["7"]).toBe("/RIGHT");
  });
});

describe("sheet pins and hierarchical labels", () => {
  it("connect through three levels; at equal priority the shallower label names the net", () => {
    const leaf = schematic([
      place({ lib: "Device:R", ref: "R3", x: 50.8, y: 50.8 }),
      label("X", 50.8, 46.99, "hierarchical_label"),
      label("LEAFNAME", 50.8, 46.99),
    ]);
    const mid = schematic([
      sheet("leaf", "sub/leaf.kicad_sch", "c2000000-0000-4000-8000-000000000002", 76.2, 40.64, [{ name: "X", x: 76.2, y: 46.99 }]),
      wire(50.8, 46.99, 76.2, 46.99),
      label("X", 50.8, 46.99, "hierarchical_label"),
      label("MIDNAME", 60.96, 46.99),
    ]);
    const top = schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
      wire(50.8, 46.99, 76.2, 46.99),
      sheet("mid", "mid.kicad_sch", "c1000000-0000-4000-8000-000000000001", 76.2, 40.64, [{ name: "X", x: 76.2, y: 46.99 }]),
    ]);
    const c = readMemory({ "q/top.kicad_sch": top, "q/mid.kicad_sch": mid, "q/sub/leaf.kicad_sch": leaf }, "q/top.kicad_sch");
    expect(netOf(c, "R1", "1")).toBe("/mid/MIDNAME");
    expect(netOf(c, "R3", "1")).toBe("/mid/MIDNAME");
    expect(net(c, "/mid/MIDNAME")?.aliases).toEqual(["/mid/MIDNAME", "/mid/X", "/mid/leaf/LEAFNAME", "/mid/leaf/X"]);
    expect(c.parts.find((p) => p.ref === "R3")?.origin.sheetPath).toBe("/mid/leaf/");
  });

  it("a hierarchical label outranks the parent's sheet pin (priority 3 over 2)", () => {
    const c = readMemory({ "p/amp.kicad_sch": root(20211123), "p/stage.kicad_sch": stage(20211123) }, "p/amp.kicad_sch");
    expect(netOf(c, "R1", "1")).toMatch(/^\/amp1\/IN$/);
  });
});

describe("buses (KiCad format notes §9)", () => {
  it("a vector bus maps members by index across a sheet pin, and the root's bus label names them", () => {
    const child = schematic([
      "(bus (pts (xy 40.64 30.48) (xy 40.64 60.96)))",
      label("DATA[0..3]", 40.64, 30.48, "hierarchical_label"),
      "(bus_entry (at 40.64 43.18) (size 2.54 2.54))",
      wire(43.18, 45.72, 50.8, 45.72),
      label("DATA2", 46, 45.72),
      place({ lib: "Device:R", ref: "R2", x: 50.8, y: 49.53 }), // pin 1 at (50.8, 45.72)
    ]);
    const top = schematic([
      "(bus (pts (xy 60.96 30.48) (xy 76.2 30.48)))",
      "(bus (pts (xy 60.96 30.48) (xy 60.96 60.96)))",
      label("D[0..3]", 66, 30.48),
      "(bus_entry (at 60.96 43.18) (size -2.54 2.54))",
      wire(58.42, 45.72, 50.8, 45.72),
      label("D2", 55, 45.72),
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 49.53 }),
      place({ lib: "Device:R", ref: "R3", x: 30, y: 49.53 }),
      label("D3", 30, 45.72),
      sheet("io", "io.kicad_sch", "b0000000-0000-4000-8000-000000000001", 76.2, 20.32, [{ name: "DATA[0..3]", x: 76.2, y: 30.48 }]),
    ]);
    const c = readMemory({ "b/top.kicad_sch": top, "b/io.kicad_sch": child }, "b/top.kicad_sch");
    expect(net(c, "/D2")?.pins).toEqual([{ ref: "R1", pin: "1" }, { ref: "R2", pin: "1" }]);
    expect(net(c, "/D3")?.pins).toEqual([{ ref: "R3", pin: "1" }]);
  });

  it("a group bus maps members by name across a sheet pin", () => {
    const child = schematic([
      label("{SDA SCL}", 40.64, 30.48, "hierarchical_label"),
      "(bus (pts (xy 40.64 30.48) (xy 40.64 60.96)))",
      place({ lib: "Device:R", ref: "R2", x: 50.8, y: 49.53 }),
      label("SCL", 50.8, 45.72),
    ]);
    const top = schematic([
      "(bus (pts (xy 60.96 30.48) (xy 76.2 30.48)))",
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 49.53 }),
      label("SCL", 50.8, 45.72),
      sheet("i2c", "i2c.kicad_sch", "b0000000-0000-4000-8000-000000000002", 76.2, 20.32, [{ name: "{SDA SCL}", x: 76.2, y: 30.48 }]),
    ]);
    const c = readMemory({ "g/top.kicad_sch": top, "g/i2c.kicad_sch": child }, "g/top.kicad_sch");
    expect(net(c, "/SCL")?.pins).toEqual([{ ref: "R1", pin: "1" }, { ref: "R2", pin: "1" }]);
  });

  it("a wire end on a bus does not connect to it (§8.2 rule 8)", () => {
    const c = readMemory({ "w/top.kicad_sch": schematic([
      "(bus (pts (xy 40.64 45.72) (xy 80 45.72)))",
      label("D[0..1]", 60, 45.72),
      place({ lib: "Device:R", ref: "R1", x: 40.64, y: 49.53 }), // pin 1 on the bus end
      place({ lib: "Device:R", ref: "R2", x: 80, y: 49.53 }),
    ]) }, "w/top.kicad_sch");
    expect(netOf(c, "R1", "1")).not.toBe(netOf(c, "R2", "1"));
  });
});

describe("findRootSheets", () => {
  it("drops files reached as sub-sheets, even through a file not given, and keeps other roots", () => {
    const fs = memoryFileSource({
      "m/top.kicad_sch": schematic([sheet("mid", "mid.kicad_sch", "d1000000-0000-4000-8000-000000000001", 76.2, 40.64)]),
      "m/mid.kicad_sch": schematic([sheet("leaf", "leaf.kicad_sch", "d2000000-0000-4000-8000-000000000001", 76.2, 40.64)]),
      "m/leaf.kicad_sch": schematic([]),
      "m/other.kicad_sch": schematic([]),
      "m/broken.kicad_sch": "(kicad_sch (version 20211123)",
    });
    const r = findRootSheets(["m/leaf.kicad_sch", "m/top.kicad_sch", "m/other.kicad_sch", "m/broken.kicad_sch"], fs);
    expect(r.roots).toEqual(["m/top.kicad_sch", "m/other.kicad_sch"]);
    expect(r.errors.map((e) => [e.file, e.line, e.column])).toEqual([["m/broken.kicad_sch", 1, 30]]);
  });
});
