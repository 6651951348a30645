import { describe, expect, it } from "vitest";
import { formatQuantity, parseQuantity } from "../src/circuit/units.js";

// SI prefixes and unit symbols: the SI Brochure (BIPM, 9th ed. 2019), Table 7 (prefixes) — facts of
// the trade; the value figures are plain arithmetic.
describe("formatQuantity", () => {
  const cases: [number, string, number | undefined, string][] = [
    [4700, "Ω", undefined, "4.7 kΩ"],
    [14.2e6, "Hz", undefined, "14.2 MHz"],
    [330e-9, "F", undefined, "330 nF"],
    [-0.9, "V", undefined, "-0.9 V"],
    [0.3, "Ω", undefined, "0.3 Ω"],
    [0.0296, "Ω", undefined, "29.6 mΩ"],
    [16.8e6, "Hz", undefined, "16.8 MHz"],
    [999.7, "Hz", undefined, "1 kHz"],
    [2.2e-6, "F", undefined, "2.2 µF"],
    [0, "V", undefined, "0 V"],
    [1.0764e-3, "A", 4, "1.076 mA"],
    [52.71e6, "Hz", 4, "52.71 MHz"],
    [1e9, "Hz", undefined, "1 GHz"],
  ];
  it.each(cases)("%d %s", (value, unit, digits, expected) => {
    expect(formatQuantity(value, unit, digits)).toBe(expected);
  });
});

describe("parseQuantity", () => {
  const cases: [string, "Hz" | "Ω" | "V" | "A" | "F" | "H", number][] = [
    ["1.8MHz", "Hz", 1.8e6],
    ["30 MHz", "Hz", 30e6],
    ["10 kHz", "Hz", 10e3],
    ["2.5 ohm", "Ω", 2.5],
    ["2.5Ω", "Ω", 2.5],
    ["100k", "Ω", 100e3],
    ["50mV", "V", 0.05],
    ["9", "V", 9],
    ["20 mA", "A", 0.02],
    ["100nF", "F", 100e-9],
    ["10 uH", "H", 10e-6],
    ["10µH", "H", 10e-6],
    ["1Meg", "Ω", 1e6],
    ["1e-3", "A", 1e-3],
  ];
  it.each(cases)("%s", (text, unit, expected) => {
    const v = parseQuantity(text, unit);
    expect(typeof v).toBe("number");
    expect(Math.abs((v as number) - expected)).toBeLessThanOrEqual(Math.abs(expected) * 1e-12);
  });
  it("says what was expected when the text is not a quantity of that kind", () => {
    expect(parseQuantity("30 MHz", "V")).toEqual({ error: "expected a voltage such as '50 mV', got '30 MHz'" });
    expect(parseQuantity("fast", "Hz")).toEqual({ error: "expected a frequency such as '1.8 MHz', got 'fast'" });
    expect(parseQuantity("1.8 xHz", "Hz")).toHaveProperty("error");
  });
});
