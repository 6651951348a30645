// One-sheet schematics: pin placement, the editor's connection rules, labels, power symbols, parts.
// Check values come from "KiCad format notes" (shared/notes/kicad-schematic-format.md), whose pin
// transform and connection rules were checked against the editor's own demo projects and its
// exported netlists (notes §0). Circuits and values are invented.
import { describe, expect, it } from "vitest";
import { pinOffset, toGrid } from "../src/read/kicad-sch/geometry.js";
import {
  LIB_ALT, LIB_DUAL_OPAMP, LIB_GATE, LIB_GND, LIB_PROBE, LIB_PWR_FLAG, LIB_R, junction, label, libSupply, place, schematic, wire,
} from "./helpers/kicad-snippets.js";
import { net, netLines, netOf, readMemory } from "./helpers/read-design.js";

const FILE = "board/amp.kicad_sch";
const read = (text: string) => readMemory({ [FILE]: text }, FILE);

describe("pin transform (KiCad format notes §6.3, checked against the editor's own demo projects)", () => {
  const mm = (v: number) => toGrid(v);
  it("worked example: at (100.33, 50.8), 90°, mirror x, pin (−3.81, 1.27) → (99.06, 46.99)", () => {
    const [dx, dy] = pinOffset(mm(-3.81), mm(1.27), 90, "x");
    expect([mm(100.33) + dx, mm(50.8) + dy]).toEqual([mm(99.06), mm(46.99)]);
  });
  it("worked example: at (63.5, 88.9), 270°, pins (0, ±3.81) → (67.31, 88.9) and (59.69, 88.9)", () => {
    const [ax, ay] = pinOffset(0, mm(3.81), 270, undefined);
    const [bx, by] = pinOffset(0, mm(-3.81), 270, undefined);
    expect([mm(63.5) + ax, mm(88.9) + ay]).toEqual([mm(67.31), mm(88.9)]);
    expect([mm(63.5) + bx, mm(88.9) + by]).toEqual([mm(59.69), mm(88.9)]);
  });
  it("worked example: at (40.64, 30.48), 180°, mirror y, pin (−5.08, 2.54) → (35.56, 33.02)", () => {
    const [dx, dy] = pinOffset(mm(-5.08), mm(2.54), 180, "y");
    expect([mm(40.64) + dx, mm(30.48) + dy]).toEqual([mm(35.56), mm(33.02)]);
  });

  // Table §6.3: offset added to the symbol position for a library pin (px, py).
  const px = 2.54, py = 5.08;
  const table: [number, "x" | "y" | undefined, number, number][] = [
    [0, undefined, px, -py], [0, "x", px, py], [0, "y", -px, -py],
    [90, undefined, -py, -px], [90, "x", -py, px], [90, "y", py, -px],
    [180, undefined, -px, py], [180, "x", -px, -py], [180, "y", px, py],
    [270, undefined, py, px], [270, "x", py, -px], [270, "y", -py, px],
  ];
  for (const [angle, mirror, dx, dy] of table) {
    it(`${angle}°${mirror ? ` mirror ${mirror}` : ""}: a placed pin lands at offset (${dx}, ${dy}) and meets a label there`, () => {
      const x = 101.6, y = 101.6;
      const c = read(schematic([
        place({ lib: "Test:Probe", ref: "TP1", x, y, angle, ...(mirror ? { mirror } : {}) }),
        label("HIT", Math.round((x + dx) * 1e4) / 1e4, Math.round((y + dy) * 1e4) / 1e4),
      ], { libs: [LIB_PROBE] }));
      expect(netOf(c, "TP1", "1")).toBe("/HIT");
    });
  }
});

// R at (x, y), angle 0: pin 1 at (x, y − 3.81), pin 2 at (x, y + 3.81).
describe("connection rules (KiCad format notes §8.2)", () => {
  const tee = (withJunction: boolean) => read(schematic([
    place({ lib: "Device:R", ref: "R1", value: "10k", x: 50.8, y: 50.8 }),
    place({ lib: "Device:R", ref: "R2", value: "10k", x: 63.5, y: 63.5 }),
    wire(50.8, 46.99, 76.2, 46.99),
    wire(63.5, 46.99, 63.5, 59.69), // ends on the interior of the first wire
    ...(withJunction ? [junction(63.5, 46.99)] : []),
  ]));

  it("rule 2: a wire ending on another wire's interior without a junction does not connect", () => {
    const c = tee(false);
    expect(netOf(c, "R1", "1")).not.toBe(netOf(c, "R2", "1"));
  });
  it("rule 4: a junction on the interior joins the wire", () => {
    const c = tee(true);
    expect(netOf(c, "R1", "1")).toBe(netOf(c, "R2", "1"));
  });

  const cross = (withJunction: boolean) => read(schematic([
    place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
    place({ lib: "Device:R", ref: "R2", x: 63.5, y: 63.5 }),
    place({ lib: "Device:R", ref: "R3", x: 63.5, y: 36.83 }),
    wire(50.8, 46.99, 76.2, 46.99),
    wire(63.5, 40.64, 63.5, 59.69), // crosses the first wire's interior
    ...(withJunction ? [junction(63.5, 46.99)] : []),
  ]));
  it("rule 3: crossing wires without a junction stay apart", () => {
    const c = cross(false);
    expect(netOf(c, "R2", "1")).toBe(netOf(c, "R3", "2"));
    expect(netOf(c, "R1", "1")).not.toBe(netOf(c, "R2", "1"));
  });
  it("rule 3: crossing wires with a junction connect", () => {
    const c = cross(true);
    expect(new Set([netOf(c, "R1", "1"), netOf(c, "R2", "1"), netOf(c, "R3", "2")]).size).toBe(1);
  });

  it("rule 1: pins touching pins connect without a wire", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
      place({ lib: "Device:R", ref: "R2", x: 50.8, y: 58.42 }), // its pin 1 sits on R1's pin 2
    ]));
    expect(netOf(c, "R1", "2")).toBe(netOf(c, "R2", "1"));
  });

  it("rule 5: a label on a wire's interior names that wire's net; one off the wire does not", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
      place({ lib: "Device:R", ref: "R2", x: 76.2, y: 50.8 }),
      wire(50.8, 46.99, 76.2, 46.99),
      label("VBIAS", 60.96, 46.99),
      label("STRAY", 60.96, 45.72),
    ]));
    expect(netOf(c, "R1", "1")).toBe("/VBIAS");
    expect(netOf(c, "R2", "1")).toBe("/VBIAS");
    expect(c.nets.some((n) => n.aliases.includes("/STRAY"))).toBe(false);
  });

  it("rule 6: a pin on a wire's interior without a junction does not connect", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
      place({ lib: "Device:R", ref: "R2", x: 63.5, y: 50.8 }), // pin 1 at (63.5, 46.99)
      wire(50.8, 46.99, 76.2, 46.99),
    ]));
    expect(netOf(c, "R1", "1")).not.toBe(netOf(c, "R2", "1"));
  });

  it("rule 10: the same local label text joins wires drawn apart", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
      place({ lib: "Device:R", ref: "R2", x: 101.6, y: 50.8 }),
      label("OUT", 50.8, 46.99),
      label("OUT", 101.6, 46.99),
    ]));
    expect(net(c, "/OUT")?.pins).toEqual([{ ref: "R1", pin: "1" }, { ref: "R2", pin: "1" }]);
  });

  it("a no-connect flag marks the net and gives it an unconnected- name (§8.4, 6.x form)", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
      "(no_connect (at 50.8 54.61))",
    ]));
    const n = net(c, "unconnected-(R1-Pad2)");
    expect(n?.noConnect).toBe(true);
    expect(netOf(c, "R1", "1")).toBe("Net-(R1-Pad1)");
  });

  it("graphic polylines never connect", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
      place({ lib: "Device:R", ref: "R2", x: 76.2, y: 50.8 }),
      "(polyline (pts (xy 50.8 46.99) (xy 76.2 46.99)) (stroke (width 0) (type dash)))",
    ]));
    expect(netOf(c, "R1", "1")).not.toBe(netOf(c, "R2", "1"));
  });
});

describe("power symbols and implicit power pins (KiCad format notes §7)", () => {
  it("a v6 power symbol names its net by its hidden pin name, not its Value", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
      place({ lib: "power:+3,3V", ref: "#PWR01", value: "+3,3V", x: 50.8, y: 46.99 }),
    ], { version: 20211123, libs: [LIB_R, libSupply("+3,3V", "+3.3V")] }));
    expect(netOf(c, "R1", "1")).toBe("+3.3V");
    expect(net(c, "+3.3V")?.isPower).toBe(true);
  });

  it("from file version 20230221 a power symbol names its net by Value", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
      place({ lib: "power:+3,3V", ref: "#PWR01", value: "+3,3V", x: 50.8, y: 46.99 }),
    ], { version: 20231120, libs: [LIB_R, libSupply("+3,3V", "+3.3V")] }));
    expect(netOf(c, "R1", "1")).toBe("+3,3V");
  });

  it("power symbols of one name join across the sheet, are ground when named GND, and are not parts", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
      place({ lib: "Device:R", ref: "R2", x: 101.6, y: 50.8 }),
      place({ lib: "power:GND", ref: "#PWR01", value: "GND", x: 50.8, y: 54.61 }),
      place({ lib: "power:GND", ref: "#PWR02", value: "GND", x: 101.6, y: 54.61 }),
    ], { libs: [LIB_R, LIB_GND] }));
    expect(net(c, "GND")).toMatchObject({ isGround: true, isPower: true, pins: [{ ref: "R1", pin: "2" }, { ref: "R2", pin: "2" }] });
    expect(c.parts.map((p) => p.ref)).toEqual(["R1", "R2"]);
  });

  it("a power flag marks its net as powered but neither names nor joins nets", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
      place({ lib: "Device:R", ref: "R2", x: 101.6, y: 50.8 }),
      place({ lib: "power:PWR_FLAG", ref: "#FLG01", value: "PWR_FLAG", x: 50.8, y: 46.99 }),
      place({ lib: "power:PWR_FLAG", ref: "#FLG02", value: "PWR_FLAG", x: 101.6, y: 46.99 }),
    ], { libs: [LIB_R, LIB_PWR_FLAG] }));
    expect(netOf(c, "R1", "1")).toBe("Net-(R1-Pad1)");
    expect(netOf(c, "R2", "1")).toBe("Net-(R2-Pad1)");
    expect(net(c, "Net-(R1-Pad1)")?.isPower).toBe(true);
  });

  it("hidden power_in pins on an ordinary symbol join the global net of their pin name", () => {
    const c = read(schematic([
      place({ lib: "Logic:Inverter", ref: "U1", value: "74HC04", x: 127, y: 50.8 }),
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
      label("VCC", 50.8, 46.99, "global_label"),
      place({ lib: "power:GND", ref: "#PWR01", value: "GND", x: 50.8, y: 54.61 }),
    ], { libs: [LIB_R, LIB_GATE, LIB_GND] }));
    expect(net(c, "VCC")?.pins).toEqual([{ ref: "R1", pin: "1" }, { ref: "U1", pin: "14" }]);
    expect(net(c, "GND")?.pins).toEqual([{ ref: "R1", pin: "2" }, { ref: "U1", pin: "7" }]);
  });
});

describe("net names (KiCad format notes §8.4)", () => {
  const twoLabels = (a: string, kindA: "label" | "global_label", b: string, kindB: "label" | "global_label") => read(schematic([
    place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }),
    wire(50.8, 46.99, 76.2, 46.99),
    label(a, 55.88, 46.99, kindA),
    label(b, 66.04, 46.99, kindB),
  ]));
  it("a global label outranks a local label, and both stay as aliases", () => {
    const c = twoLabels("LOCALNAME", "label", "RAIL", "global_label");
    expect(netOf(c, "R1", "1")).toBe("RAIL");
    expect(net(c, "RAIL")?.aliases).toEqual(["/LOCALNAME", "RAIL"]);
  });
  it("between two local labels the lower code-point string wins (C12 before C3)", () => {
    const c = twoLabels("C3", "label", "C12", "label");
    expect(netOf(c, "R1", "1")).toBe("/C12");
  });
  it("a / inside a label is kept in the display name", () => {
    const c = twoLabels("A/B", "label", "Z", "label");
    expect(netOf(c, "R1", "1")).toBe("/A/B");
  });
  it("7+ default names use the pin name with the unit letter, and -Pad names lose", () => {
    const c = read(schematic([
      place({ lib: "Amp:Dual", ref: "U1", value: "Dual", x: 101.6, y: 50.8, unit: 1 }),
      place({ lib: "Device:R", ref: "R1", x: 93.98, y: 52.07 }), // pin 1 at (93.98, 48.26) = U1 pin 3 ("+")
    ], { version: 20231120, libs: [LIB_R, LIB_DUAL_OPAMP] }));
    expect(netOf(c, "R1", "1")).toBe("Net-(U1A-+)");
    expect(netOf(c, "U1", "3")).toBe("Net-(U1A-+)");
  });
});

describe("parts", () => {
  it("units of one reference merge into one part; unplaced units' pins are absent", () => {
    const c = read(schematic([
      place({ lib: "Amp:Dual", ref: "U1", value: "TL072", x: 101.6, y: 50.8, unit: 1 }),
      place({ lib: "Amp:Dual", ref: "U1", value: "TL072", x: 152.4, y: 50.8, unit: 2 }),
    ], { libs: [LIB_DUAL_OPAMP] }));
    expect(c.parts).toHaveLength(1);
    expect(Object.keys(c.parts[0]?.pins ?? {})).toEqual(["1", "2", "3", "5", "6", "7"]);
    expect(c.parts[0]?.pinNames["2"]).toBe("-");
  });

  it("records the origin and the exact character range of the Value string", () => {
    const text = schematic([place({ lib: "Device:R", ref: "R7", value: "4k7", x: 50.8, y: 50.8 })]);
    const c = read(text);
    const r7 = c.parts[0];
    expect(r7?.origin).toEqual({ file: FILE, line: text.slice(0, text.indexOf("(symbol (lib_id")).split("\n").length, column: 3, sheetPath: "/" });
    expect(r7?.valueSpan?.file).toBe(FILE);
    expect(text.slice(r7?.valueSpan?.start, r7?.valueSpan?.end)).toBe('"4k7"');
    expect(r7?.kind).toBe("resistor");
    expect(r7?.parsed.number).toBeCloseTo(4700, 6);
  });

  it("keeps DNP and excluded-from-simulation in flag and field forms; leaves off-board parts out", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8, extra: " (dnp yes) (exclude_from_sim yes)" }),
      place({ lib: "Device:R", ref: "R2", x: 63.5, y: 50.8, extra: `\n    (property "DNP" "1" (at 0 0 0)) (property "Sim.Enable" "0" (at 0 0 0))` }),
      place({ lib: "Device:R", ref: "R3", x: 76.2, y: 50.8, extra: `\n    (property "Spice_Netlist_Enabled" "N" (at 0 0 0))` }),
      place({ lib: "Device:R", ref: "R4", x: 88.9, y: 50.8, onBoard: false }),
      place({ lib: "Device:R", ref: "R5", x: 101.6, y: 50.8 }),
    ], { version: 20231120 }));
    const flags = Object.fromEntries(c.parts.map((p) => [p.ref, [p.dnp, p.excludedFromSim]]));
    expect(flags).toEqual({ R1: [true, true], R2: [true, true], R3: [false, true], R5: [false, false] });
  });

  it("a placed symbol's alternate replaces the pin name", () => {
    const c = read(schematic([
      place({ lib: "Test:Alt", ref: "U1", x: 50.8, y: 50.8, extra: `\n    (pin "1" (uuid 0c000000-0000-4000-8000-000000000001) (alternate "SDA"))` }),
    ], { libs: [LIB_ALT] }));
    expect(c.parts[0]?.pinNames["1"]).toBe("SDA");
  });

  it("lists nets by name and pins by natural reference order", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R10", x: 76.2, y: 50.8 }),
      place({ lib: "Device:R", ref: "R2", x: 50.8, y: 50.8 }),
      wire(50.8, 46.99, 76.2, 46.99),
      label("B", 60, 46.99),
      label("A", 50.8, 54.61),
    ]));
    expect(netLines(c)).toEqual(["/A: R2.2", "/B: R2.1 R10.1", "Net-(R10-Pad2): R10.2"]);
    expect(c.parts.map((p) => p.ref)).toEqual(["R2", "R10"]);
  });
});

describe("more constructs", () => {
  it("a derived library symbol (extends) takes its parent's pins (KiCad format notes §5)", () => {
    const derived = `(symbol "Device:R_Precision" (extends "R") (property "Reference" "R" (at 0 0 0)) (property "Value" "R_Precision" (at 0 0 0)))`;
    const c = read(schematic([
      place({ lib: "Device:R_Precision", ref: "R1", value: "1k", x: 50.8, y: 50.8 }),
      label("TOP", 50.8, 46.99),
    ], { libs: [LIB_R, derived] }));
    expect(c.parts[0]?.pins).toEqual({ "1": "/TOP", "2": "Net-(R1-Pad2)" });
  });

  it("a bus-entry end splits the wire it sits on (§8.2 rule 4), so a wire ending there connects", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 49.53 }), // pin 1 at (50.8, 45.72)
      place({ lib: "Device:R", ref: "R2", x: 63.5, y: 63.5 }), // pin 1 at (63.5, 59.69)
      wire(50.8, 45.72, 76.2, 45.72),
      wire(63.5, 45.72, 63.5, 59.69),
      "(bus (pts (xy 60.96 30) (xy 60.96 43.18)))",
      "(bus_entry (at 60.96 43.18) (size 2.54 2.54))",
    ]));
    expect(netOf(c, "R1", "1")).toBe(netOf(c, "R2", "1"));
  });

  it("unannotated references are numbered apart and noted", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R?", x: 50.8, y: 50.8 }),
      place({ lib: "Device:R", ref: "R?", x: 76.2, y: 50.8 }),
    ]));
    expect(c.parts.map((p) => p.ref)).toEqual(["R?1", "R?2"]);
    expect(c.notes.filter((n) => n.message.includes("not annotated"))).toHaveLength(2);
  });

  it("a Value of ~ is empty before file version 20250318 and literal from it (§5, §13.3)", () => {
    const body = [place({ lib: "Device:R", ref: "R1", value: "~", x: 50.8, y: 50.8 })];
    expect(read(schematic(body, { version: 20250114 })).parts[0]?.value).toBe("");
    expect(read(schematic(body, { version: 20250318 })).parts[0]?.value).toBe("~");
  });

  it("loads a model library named by Sim.Library inside the project; refuses one outside, notes a missing one", () => {
    const sim = (lib: string) => `\n    (property "Sim.Library" "${lib}" (at 0 0 0)) (property "Sim.Name" "QX" (at 0 0 0))`;
    const text = schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8, extra: sim("models/q.lib") }),
      place({ lib: "Device:R", ref: "R2", x: 76.2, y: 50.8, extra: sim("../elsewhere/q.lib") }),
      place({ lib: "Device:R", ref: "R3", x: 101.6, y: 50.8, extra: sim("${KIPRJMOD}/models/none.lib") }),
    ], { version: 20231120 });
    const c = readMemory({ [FILE]: text, "board/models/q.lib": ".model QX NPN(BF=200)\n", "elsewhere/q.lib": "secret" }, FILE);
    expect(c.modelLibraries).toEqual([{ path: "models/q.lib", text: ".model QX NPN(BF=200)\n" }]);
    const libNotes = c.notes.filter((n) => n.message.startsWith("model library")).map((n) => [n.ref, n.message]);
    expect(libNotes).toEqual([
      ["R2", 'model library "../elsewhere/q.lib" lies outside the project folder; not read'],
      ["R3", 'model library "${KIPRJMOD}/models/none.lib" not read: no such file'],
    ]);
  });

  it("labels attach to the interior of 45° and free-angle wires too (§8.2 rule 5)", () => {
    const c = read(schematic([
      place({ lib: "Device:R", ref: "R1", x: 50.8, y: 50.8 }), // pin 1 at (50.8, 46.99)
      wire(50.8, 46.99, 60.96, 57.15), // 45°
      label("DIAG", 55.88, 52.07),
      place({ lib: "Device:R", ref: "R2", x: 101.6, y: 50.8 }), // pin 1 at (101.6, 46.99)
      wire(101.6, 46.99, 121.92, 57.15), // slope 1/2
      label("SLANT", 111.76, 52.07),
    ]));
    expect(netOf(c, "R1", "1")).toBe("/DIAG");
    expect(netOf(c, "R2", "1")).toBe("/SLANT");
  });

  it("unit-0 and style-0 pins are common; a body-style-2 pin appears only in De Morgan placements (§5, §6.2)", () => {
    const lib = `(symbol "Test:Styled" (in_bom yes) (on_board yes)
      (property "Reference" "U" (at 0 0 0)) (property "Value" "Styled" (at 0 0 0))
      (pin passive line (at 0 5.08 270) (length 2.54) (name "COM") (number "9"))
      (symbol "Styled_1_1" (pin input line (at -5.08 0 0) (length 2.54) (name "A") (number "1")))
      (symbol "Styled_1_2" (pin input line (at -5.08 2.54 0) (length 2.54) (name "A") (number "1")))
      (symbol "Styled_0_1" (pin no_connect line (at 5.08 0 180) (length 2.54) (name "NC") (number "5"))))`;
    const c = read(schematic([
      place({ lib: "Test:Styled", ref: "U1", x: 50.8, y: 50.8 }),
      label("NORMAL", 45.72, 50.8),
      place({ lib: "Test:Styled", ref: "U2", x: 101.6, y: 50.8, extra: " (convert 2)" }),
      label("DEMORGAN", 96.52, 48.26),
    ], { libs: [lib] }));
    expect(c.parts.find((p) => p.ref === "U1")?.pins).toEqual({ "1": "/NORMAL", "5": "unconnected-(U1-Pad5)", "9": "Net-(U1-Pad9)" });
    expect(c.parts.find((p) => p.ref === "U2")?.pins["1"]).toBe("/DEMORGAN");
    expect(net(c, "unconnected-(U1-Pad5)")?.noConnect).toBe(true);
  });
});

