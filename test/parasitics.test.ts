import { describe, expect, it } from "vitest";
import { estimateCapacitorParasitics, selfResonantFrequency } from "../src/solve/parasitics.js";
import { parseValue } from "../src/circuit/value.js";
import type { Part, PartKind } from "../src/circuit/types.js";

function cap(value: string, footprint: string, kind: PartKind = "capacitor", fields: Record<string, string> = {}): Part {
  return {
    ref: "C1", value, parsed: parseValue(value, kind, fields), kind, libId: kind === "capacitor" ? "Device:C" : "Device:C_Polarized",
    footprint, pins: { "1": "A", "2": "B" }, pinNames: {}, roles: {}, fields, dnp: false, excludedFromSim: false,
    origin: { file: "t.kicad_sch", line: 1, column: 1, sheetPath: "/" },
  };
}
const rel = (a: number, b: number, tol: number): void => expect(Math.abs(a - b) / b).toBeLessThanOrEqual(tol);

// SRF check values: reference-data §2.1 [CALC], f = 1/(2π√(LC)), stated to 3–4 figures.
describe("self-resonance with the estimated ESL (reference-data §2.1 check values)", () => {
  const cases: [string, string, number][] = [
    ["100nF", "Capacitor_SMD:C_0603_1608Metric", 16.8e6],
    ["100nF", "Capacitor_SMD:C_0402_1005Metric", 19.0e6],
    ["100nF", "Capacitor_SMD:C_0805_2012Metric", 15.2e6],
    ["100nF", "Capacitor_SMD:C_1206_3216Metric", 13.45e6],
    ["100nF", "Capacitor_THT:C_Disc_D5.0mm_W2.5mm_P5.00mm", 7.1e6],
    ["15nF", "Capacitor_SMD:C_0603_1608Metric", 43.3e6],
  ];
  it.each(cases)("%s in %s", (value, footprint, srf) => {
    const part = cap(value, footprint);
    const { esl } = estimateCapacitorParasitics(part);
    rel(selfResonantFrequency(part.parsed.number ?? 0, esl), srf, 0.005);
  });
  it("100 µF radial electrolytic with the ≈10 nH estimate [MEM] → 159 kHz", () => {
    const part = cap("100uF 25V", "Capacitor_THT:CP_Radial_D6.3mm_P2.50mm", "polarized-capacitor");
    const p = estimateCapacitorParasitics(part);
    rel(selfResonantFrequency(100e-6, p.esl), 159e3, 0.005);
    expect(p.basis).toMatch(/\[MEM\]/);
  });
});

// ESR: reference-data §2.3 first-figure table [DOC: ESR-meter user guide], read conservatively
// (row at or below C, column at or below the rating).
describe("electrolytic ESR from the reference-data §2.3 table", () => {
  const cases: [string, number, string][] = [
    ["100uF 25V", 1.4, "on the table"],
    ["100uF/16V", 1.6, "on the table"],
    ["220uF 20V", 0.75, "20 V reads the 16 V column"],
    ["47uF 63V", 2.0, "on the table"],
    ["2200uF 35V", 0.11, "above the table: 1000 µF row"],
    ["4.7uF 50V", 11, "below the table: 10 µF row, 35 V column"],
    ["100uF", 2.0, "no rating: 10 V column"],
  ];
  it.each(cases)("%s → %d Ω (%s)", (value, esr) => {
    const p = estimateCapacitorParasitics(cap(value, "Capacitor_THT:CP_Radial_D8.0mm_P3.50mm", "polarized-capacitor"));
    rel(p.esr, esr, 1e-9);
  });
  it("a rating from the Voltage field is used", () => {
    const p = estimateCapacitorParasitics(cap("470uF", "Capacitor_SMD:CP_Elec_8x10", "polarized-capacitor", { Voltage: "35V" }));
    rel(p.esr, 0.24, 1e-9);
  });
});

describe("ceramic and film defaults, and fields", () => {
  it("100 nF 0603 MLCC: 30 mΩ, the middle of the 20–50 mΩ default [CP]", () => {
    const p = estimateCapacitorParasitics(cap("100nF", "Capacitor_SMD:C_0603_1608Metric"));
    rel(p.esr, 0.03, 1e-9);
    expect(p.basis).toMatch(/0603/);
  });
  it("100 pF C0G: 0.2 Ω within 0.1–0.3 Ω [CP]; 4.7 µF: 7 mΩ within 5–10 mΩ [CP]", () => {
    const small = estimateCapacitorParasitics(cap("100pF", "Capacitor_SMD:C_0402_1005Metric")).esr;
    expect(small).toBeGreaterThanOrEqual(0.1);
    expect(small).toBeLessThanOrEqual(0.3);
    const big = estimateCapacitorParasitics(cap("4.7uF", "Capacitor_SMD:C_0805_2012Metric")).esr;
    expect(big).toBeGreaterThanOrEqual(0.005);
    expect(big).toBeLessThanOrEqual(0.01);
  });
  it("film box (C_Rect): ESL 10 nH [MEM], ESR within 10–50 mΩ [CP]", () => {
    const p = estimateCapacitorParasitics(cap("1uF", "Capacitor_THT:C_Rect_L7.2mm_W4.5mm_P5.00mm_FKS2_FKP2_MKS2_MKP2"));
    rel(p.esl, 10e-9, 1e-9);
    expect(p.esr).toBeGreaterThanOrEqual(0.01);
    expect(p.esr).toBeLessThanOrEqual(0.05);
  });
  it("ESR and ESL fields win over the estimate", () => {
    const p = estimateCapacitorParasitics(cap("100uF", "Capacitor_THT:CP_Radial_D6.3mm_P2.50mm", "polarized-capacitor", { ESR: "0.3", esl: "8nH" }));
    rel(p.esr, 0.3, 1e-12);
    rel(p.esl, 8e-9, 1e-12);
    expect(p.basis).toMatch(/ESR field/);
    expect(p.basis).toMatch(/ESL field/);
  });
  it("no footprint: says it assumed an 0805 MLCC", () => {
    const p = estimateCapacitorParasitics(cap("10nF", ""));
    rel(p.esl, 1.1e-9, 1e-9);
    expect(p.basis).toMatch(/no recognised capacitor footprint/);
  });
});
