import { describe, expect, it } from "vitest";
import { formatValueLike, parseValue, rewriteValueText } from "../src/circuit/value.js";
import type { PartKind } from "../src/circuit/types.js";

function expectRel(actual: number | undefined, expected: number, relTol = 1e-12): void {
  expect(actual).toBeDefined();
  const a = actual ?? Number.NaN;
  expect(Math.abs(a - expected)).toBeLessThanOrEqual(Math.abs(expected) * relTol + 1e-300);
}

// Source: IEC 60062:2016 §4 (RKM code) — the letter of the multiplier stands in place of the decimal
// point; R (E in some regions) marks ×1. Example values from memory of the standard's table, not re-read.
describe("RKM code, IEC 60062:2016 §4 (examples from memory of the standard's table)", () => {
  const cases: [string, PartKind, number][] = [
    ["R47", "resistor", 0.47],
    ["4R7", "resistor", 4.7],
    ["47R", "resistor", 47],
    ["4k7", "resistor", 4700],
    ["47k", "resistor", 47e3],
    ["4M7", "resistor", 4.7e6],
    ["1M5", "resistor", 1.5e6],
    ["0R1", "resistor", 0.1],
    ["2R2", "resistor", 2.2],
    ["4E7", "resistor", 4.7],
    ["2n2", "capacitor", 2.2e-9],
    ["4n7", "capacitor", 4.7e-9],
    ["4p7", "capacitor", 4.7e-12],
    ["3p3", "capacitor", 3.3e-12],
    ["2u2", "capacitor", 2.2e-6],
    ["p68", "capacitor", 0.68e-12],
  ];
  it.each(cases)("%s on a %s is %d", (text, kind, expected) => {
    const v = parseValue(text, kind, {});
    expect(v.problem).toBeUndefined();
    expectRel(v.number, expected);
    // `47k` is both RKM and plain prefix notation; only a letter in place of the point is unambiguous.
    if (/[A-Za-z]\d/.test(text) || text.endsWith("R")) expect(v.style).toBe("rkm");
  });
});

// Source: IEC 60062:2016 multiplier letters (p n µ m k M G, from memory) plus the spellings seen in
// real KiCad files, shared/notes/kicad-schematic-format.md §13.1 [DEMO] and §13.2.
describe("value spellings seen in real KiCad files (notes §13.1)", () => {
  const cases: [string, PartKind, number, string | undefined][] = [
    ["100nF", "capacitor", 100e-9, "prefix-unit"],
    ["0.1uF", "capacitor", 0.1e-6, "prefix-unit"],
    ["10K", "resistor", 10e3, "prefix"],
    ["10k", "resistor", 10e3, "prefix"],
    ["4,7K", "resistor", 4.7e3, "prefix"],
    ["4.7uF", "capacitor", 4.7e-6, "prefix-unit"],
    ["4K7", "resistor", 4.7e3, "rkm"],
    ["22uF 10V", "polarized-capacitor", 22e-6, "prefix-unit"],
    ["0.1uF 100V", "capacitor", 0.1e-6, "prefix-unit"],
    ["22uF/25V", "polarized-capacitor", 22e-6, "prefix-unit"],
    ["47uF/63V", "polarized-capacitor", 47e-6, "prefix-unit"],
    ["100\u00B5F", "capacitor", 100e-6, "prefix-unit"],
    ["100\u03BCF", "capacitor", 100e-6, "prefix-unit"],
    ["2.2K", "resistor", 2.2e3, "prefix"],
    ["0", "resistor", 0, "plain"],
    ["2u2,25V,10%", "capacitor", 2.2e-6, "rkm"],
    ["1p5,50V,10%", "capacitor", 1.5e-12, "rkm"],
    ["1k5,1%", "resistor", 1.5e3, "rkm"],
    ["5n1,5%,Unshld", "inductor", 5.1e-9, "rkm"],
    ["0.005u", "capacitor", 5e-9, "prefix"],
    ["10Meg", "resistor", 10e6, "prefix"],
    ["10MEG", "resistor", 10e6, "prefix"],
    ["1 ohm", "resistor", 1, "prefix-unit"],
    ["4.7 u", "capacitor", 4.7e-6, "prefix"],
    ["4.7 k\u03A9", "resistor", 4.7e3, "prefix-unit"],
    ["4.7k\u2126", "resistor", 4.7e3, "prefix-unit"],
    ["100R", "resistor", 100, "rkm"],
    ["1F", "capacitor", 1, "prefix-unit"],
    ["1mF", "capacitor", 1e-3, "prefix-unit"],
    ["1m", "resistor", 1e-3, "prefix"],
    ["1M", "resistor", 1e6, "prefix"],
    ["10uH", "inductor", 10e-6, "prefix-unit"],
    ["9V", "battery", 9, "prefix-unit"],
    ["DC 10", "voltage-source", 10, "plain"],
    ["dc 2.345", "voltage-source", 2.345, "plain"],
  ];
  it.each(cases)("%s on a %s reads %d", (text, kind, expected, style) => {
    const v = parseValue(text, kind, {});
    expect(v.problem).toBeUndefined();
    expectRel(v.number, expected);
    expect(v.style).toBe(style);
  });

  it("picks up ratings and tolerance written in the value", () => {
    expect(parseValue("22uF 10V", "polarized-capacitor", {}).voltageRating).toBe(10);
    expect(parseValue("22uF/25V", "polarized-capacitor", {}).voltageRating).toBe(25);
    const attrs = parseValue("2u2,25V,10%", "capacitor", {});
    expect(attrs.voltageRating).toBe(25);
    expectRel(attrs.tolerance, 0.1);
    expectRel(parseValue("10k 1%", "resistor", {}).tolerance, 0.01);
    expectRel(parseValue("10k 1/4W", "resistor", {}).powerRating, 0.25);
    expectRel(parseValue("10k 0.25W", "resistor", {}).powerRating, 0.25);
    expectRel(parseValue("100uF 6V3", "polarized-capacitor", {}).voltageRating, 6.3);
  });

  it("picks up ratings from fields, any case (notes §13.2: Voltage/Tolerance/Power, synonyms)", () => {
    const v = parseValue("100nF", "capacitor", { voltage: "16V", TOL: "10%" });
    expect(v.voltageRating).toBe(16);
    expectRel(v.tolerance, 0.1);
    expect(parseValue("47uF", "polarized-capacitor", { Rating: "35" }).voltageRating).toBe(35);
    expect(parseValue("47uF", "polarized-capacitor", { V: "63V" }).voltageRating).toBe(63);
    expectRel(parseValue("1k", "resistor", { Power: "1/4W" }).powerRating, 0.25);
    expectRel(parseValue("1k", "resistor", { Tolerance: "5" }).tolerance, 0.05);
  });

  it("warns, but reads, an ambiguous comma (notes §13.2: `3,300uF`)", () => {
    const v = parseValue("3,300uF", "capacitor", {});
    expectRel(v.number, 3.3e-6);
    expect(v.warning).toMatch(/decimal comma or a thousands separator/);
    expect(parseValue("4,7K", "resistor", {}).warning).toBeUndefined();
  });

  it("warns when a capacitor's bare number reads as whole farads (`0.1` meant 0.1 µF on older drawings [CP])", () => {
    const v = parseValue("0.1", "capacitor", {});
    expect(v.number).toBe(0.1);
    expect(v.warning).toMatch(/reads as 0.1 F; write 0.1uF/);
    expect(parseValue("100n", "capacitor", {}).warning).toBeUndefined();
    expect(parseValue("470", "resistor", {}).warning).toBeUndefined();
  });
});

describe("values that cannot be read are flagged, never guessed", () => {
  const cases: [string, PartKind, RegExp][] = [
    ["4k7k", "resistor", /cannot read '4k7k' as a resistance/],
    ["8x10K", "resistor", /cannot read '8x10K' as a resistance/],
    ["5/30pF", "capacitor", /cannot read '5\/30pF' as a capacitance/],
    ["10uF", "resistor", /the unit F is for a capacitance/],
    ["100 V", "capacitor", /the unit V is for a voltage/],
    ["R", "resistor", /placeholder/],
    ["~", "resistor", /empty/],
    ["", "capacitor", /empty/],
    ["4R7", "inductor", /resistor code/],
    ["-10k", "resistor", /negative/],
    ["Battery", "battery", /cannot read 'Battery' as a voltage/],
  ];
  it.each(cases)("%s on a %s", (text, kind, why) => {
    const v = parseValue(text, kind, {});
    expect(v.number).toBeUndefined();
    expect(v.text).toBe(text);
    expect(v.problem).toMatch(why);
  });

  it("treats a semiconductor's value as a part name, with no problem", () => {
    for (const [text, kind] of [["2N3904", "npn"], ["1N4148", "diode"], ["Conn_01x02", "connector"]] as const) {
      const v = parseValue(text, kind, {});
      expect(v.number).toBeUndefined();
      expect(v.problem).toBeUndefined();
    }
  });
});

describe("formatValueLike writes a new value the way the board writes them", () => {
  const cases: [number, PartKind, string, string][] = [
    [6800, "resistor", "4k7", "6k8"],
    [6800, "resistor", "4K7", "6K8"],
    [6800, "resistor", "4.7k", "6.8k"],
    [6800, "resistor", "4.7 k\u03A9", "6.8 k\u03A9"],
    [6800, "resistor", "4,7K", "6,8K"],
    [68e-9, "capacitor", "100nF", "68nF"],
    [2.2e-6, "capacitor", "100\u00B5F", "2.2\u00B5F"],
    [2.2e-6, "capacitor", "4n7", "2u2"],
    [4.7, "resistor", "100R", "4R7"],
    [0.47, "resistor", "2R2", "R47"],
    [0.47, "resistor", "0R1", "0R47"],
    [47e3, "resistor", "4k7", "47k"],
    [1e6, "resistor", "470k", "1M"],
    [999.97e3, "resistor", "470k", "1M"],
    [16.9e3, "resistor", "10.2k", "16.9k"],
    [330, "resistor", "470", "330"],
  ];
  it.each(cases)("%d like %s", (value, kind, example, expected) => {
    expect(formatValueLike(value, kind, parseValue(example, kind, {}))).toBe(expected);
  });

  it("round-trips: what it writes reads back as the same number", () => {
    for (const example of ["4k7", "4.7k", "4.7 kΩ", "10K", "100R", "4,7K"]) {
      const ex = parseValue(example, "resistor", {});
      for (const v of [0.47, 4.7, 68, 820, 1.5e3, 16.9e3, 330e3, 2.2e6]) {
        expectRel(parseValue(formatValueLike(v, "resistor", ex), "resistor", {}).number, v, 1e-9);
      }
    }
  });

  it("rewriteValueText keeps the words after the number", () => {
    expect(rewriteValueText(47e-9, "capacitor", parseValue("100nF 25V", "capacitor", {}))).toBe("47nF 25V");
    expect(rewriteValueText(6800, "resistor", parseValue("4k7,1%", "resistor", {}))).toBe("6k8,1%");
  });
});
