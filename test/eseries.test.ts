import { describe, expect, it } from "vitest";
import { E_SERIES, E_SERIES_NAMES, isInSeries, nearestInSeries, neighbours, seriesForTolerance } from "../src/solve/eseries.js";

const approx = (a: number, b: number): boolean => Math.abs(a - b) <= 1e-9 * Math.abs(b);

// Structural facts of IEC 60063:2015 (Tables 1 and 2) as set out in shared/notes/reference-data.md
// §1.1–1.2 [DOC + CALC]: N = 3·2^i members per decade, approximating 10^(n/N).
describe("IEC 60063 series: structure (reference-data §1.1–1.2)", () => {
  it("has 3, 6, 12, 24, 48, 96, 192 members per decade", () => {
    expect(E_SERIES_NAMES.map((n) => E_SERIES[n].length)).toEqual([3, 6, 12, 24, 48, 96, 192]);
  });
  it("each series is strictly increasing within [1, 10)", () => {
    for (const n of E_SERIES_NAMES) {
      const s = E_SERIES[n];
      s.forEach((v, i) => {
        expect(v).toBeGreaterThanOrEqual(1);
        expect(v).toBeLessThan(10);
        if (i > 0) expect(v).toBeGreaterThan(s[i - 1] ?? 0);
      });
    }
  });
  it("E3 ⊂ E6 ⊂ E12 ⊂ E24 as every 2nd member; E96 = even-index E192; E48 = every 4th E192", () => {
    const everyNth = (xs: readonly number[], n: number): number[] => xs.filter((_, i) => i % n === 0);
    expect(everyNth(E_SERIES.E12, 2)).toEqual([...E_SERIES.E6]);
    expect(everyNth(E_SERIES.E24, 2)).toEqual([...E_SERIES.E12]);
    expect(everyNth(E_SERIES.E6, 2)).toEqual([...E_SERIES.E3]);
    expect(everyNth(E_SERIES.E192, 2)).toEqual([...E_SERIES.E96]);
    expect(everyNth(E_SERIES.E192, 4)).toEqual([...E_SERIES.E48]);
  });
  it("E48–E192 are 10^(n/N) rounded to 3 figures, except 9.20 in E192 (formula 9.19)", () => {
    for (const [name, n] of [["E48", 48], ["E96", 96], ["E192", 192]] as const) {
      E_SERIES[name].forEach((v, i) => {
        const formula = Number((10 ** (i / n)).toPrecision(3));
        if (name === "E192" && i === 185) {
          expect(v).toBe(9.2);
          expect(formula).toBe(9.19);
        } else expect(v).toBe(formula);
      });
    }
  });
  it("E24 members that differ from 2-figure rounding are exactly the ones listed (§1.2)", () => {
    const differ = E_SERIES.E24.filter((v, i) => Number((10 ** (i / 24)).toPrecision(2)) !== v);
    expect(differ).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]);
  });
  it("E24 is not a subset of E96: only 1.0 1.1 1.3 1.5 2.0 7.5 are shared; E192 adds 1.2 1.6 1.8 2.4 4.7", () => {
    expect(E_SERIES.E24.filter((v) => isInSeries(v, "E96"))).toEqual([1.0, 1.1, 1.3, 1.5, 2.0, 7.5]);
    expect(E_SERIES.E24.filter((v) => isInSeries(v, "E192"))).toEqual([1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.4, 4.7, 7.5]);
  });
  it("worst adjacent ratio in E24 is 1.154 (1.3→1.5), in E12 1.25 (§1.3, CALC)", () => {
    const worst = (xs: readonly number[]): number => Math.max(...[...xs, 10].slice(1).map((v, i) => v / (xs[i] ?? 1)));
    expect(worst(E_SERIES.E24)).toBeCloseTo(1.1538, 3);
    expect(worst(E_SERIES.E12)).toBeCloseTo(1.25, 6);
  });
});

describe("membership across decades", () => {
  it("knows 4.7 Ω, 4.7 k, 470 k, 4.7 µF and 0.47 as E12 members; 7.5 k is E24 not E12", () => {
    for (const v of [4.7, 4700, 470e3, 4.7e-6, 0.47, 10, 1e6]) expect(isInSeries(v, "E12")).toBe(true);
    expect(isInSeries(7500, "E12")).toBe(false);
    expect(isInSeries(7500, "E24")).toBe(true);
    expect(isInSeries(16900, "E96")).toBe(true);
    expect(isInSeries(16834.2, "E96")).toBe(false);
    expect(isInSeries(0, "E12")).toBe(false);
  });
});

// Snapping oracles, reference-data §1.4.
describe("snapping (reference-data §1.4)", () => {
  it("nearest E24 to 319 is 330 [DOC: documentation of a published Python E-series package]", () => {
    expect(nearestInSeries(319, "E24")).toBe(330);
  });
  it("smallest E96 ≥ 184 is 187; E24 values around 5000 are 4700, 5100, 5600 [DOC: same package]", () => {
    expect(neighbours(184, "E96").above).toBe(187);
    expect(neighbours(5000, "E24")).toEqual({ below: 4700, above: 5100 });
    expect(neighbours(5100 * 1.0001, "E24").above).toBe(5600);
    expect(neighbours(4700, "E24")).toEqual({ below: 4700, above: 4700 });
  });
  it("16 834.2 Ω → 16.9 kΩ in E96 [DOC: help text of an open-source EDA calculator]", () => {
    expect(nearestInSeries(16834.2, "E96")).toBe(16900);
  });
  it("log-scale nearest [CP] with the CALC examples: 5.0k→4.7k, 25k→27k/24k, 14k→15k, 51k→47k/51k, 700→680", () => {
    expect(nearestInSeries(5000, "E12")).toBe(4700);
    expect(nearestInSeries(25e3, "E12")).toBe(27e3);
    expect(nearestInSeries(25e3, "E24")).toBe(24e3);
    expect(nearestInSeries(14e3, "E12")).toBe(15e3);
    expect(nearestInSeries(51e3, "E12")).toBe(47e3);
    expect(nearestInSeries(51e3, "E24")).toBe(51e3);
    expect(nearestInSeries(700, "E12")).toBe(680);
  });
  it("E12 geometric mid-points decide the rounding (10.95 13.42 … 90.55, CALC)", () => {
    const mids = [10.95, 13.42, 16.43, 19.9, 24.37, 29.85, 35.87, 42.81, 51.3, 61.71, 74.67, 90.55];
    const e12 = [...E_SERIES.E12.map((v) => v * 10), 100];
    mids.forEach((mid, i) => {
      expect(approx(nearestInSeries(mid * 0.999, "E12"), e12[i] ?? 0)).toBe(true);
      expect(approx(nearestInSeries(mid * 1.001, "E12"), e12[i + 1] ?? 0)).toBe(true);
    });
  });
  it("works at decade edges: 9.7 k → 10 k (E12), 0.99 → 1.0", () => {
    expect(nearestInSeries(9700, "E12")).toBe(10000);
    expect(nearestInSeries(0.99, "E24")).toBe(1);
  });
});

describe("tolerance pairing (reference-data §1.3, several tables agree [DOC])", () => {
  it("20 % E6, 10 % E12, 5 % E24, 2 % E48, 1 % E96, 0.5 % and tighter E192", () => {
    expect(seriesForTolerance(0.2)).toBe("E6");
    expect(seriesForTolerance(0.1)).toBe("E12");
    expect(seriesForTolerance(0.05)).toBe("E24");
    expect(seriesForTolerance(0.02)).toBe("E48");
    expect(seriesForTolerance(0.01)).toBe("E96");
    expect(seriesForTolerance(0.005)).toBe("E192");
    expect(seriesForTolerance(0.001)).toBe("E192");
    expect(seriesForTolerance(0.5)).toBe("E3");
  });
});
