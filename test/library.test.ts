import { describe, expect, it } from "vitest";
import { LIBRARY_PARTS, findModel, zenerFromValue, zenerVoltageFromName, zenerVoltageFromValue } from "../src/solve/parts/library.js";
import { DEFAULT_CHANNEL_SIZE } from "../src/solve/models/mosfet.js";

const rel = (a: number | undefined, b: number, tol: number): void => {
  expect(a).toBeDefined();
  expect(Math.abs((a ?? Number.NaN) - b) / Math.abs(b)).toBeLessThanOrEqual(tol);
};

describe("lookup by name and alias", () => {
  it("finds parts by name, alias, SPICE model name and packaging suffix, any case", () => {
    expect(findModel("2N3904")?.name).toBe("2N3904");
    expect(findModel("2n3904")?.name).toBe("2N3904");
    expect(findModel("Q2N3904")?.name).toBe("2N3904");
    expect(findModel("2N3904BU")?.name).toBe("2N3904");
    expect(findModel("PN2222A")?.name).toBe("2N2222A");
    expect(findModel("2N2222A-AP")?.name).toBe("2N2222A");
    expect(findModel("1N914")?.name).toBe("1N4148");
    expect(findModel("D1N4148")?.name).toBe("1N4148");
    expect(findModel("BF998R")?.kind).toBe("dual-gate-mosfet");
    expect(findModel("NOPE123")).toBeUndefined();
    expect(findModel("")).toBeUndefined();
  });
  it("does not alias the 2N2222 to the 2N2222A (VCEO 30 vs 40 V, VEBO 5 vs 6 V; reference-data §4.5 [DOC])", () => {
    expect(findModel("2N2222")?.ratings.vceo).toBe(30);
    expect(findModel("2N2222")?.ratings.vebo).toBe(5);
    expect(findModel("2N2222A")?.ratings.vceo).toBe(40);
    expect(findModel("2N2222A")?.ratings.vebo).toBe(6);
  });
  it("keeps SOT-23 dissipation apart from TO-92 (MMBT3904 350 mW [MEM] vs 2N3904 625 mW [DOC])", () => {
    expect(findModel("MMBT3904")?.ratings.ptot).toBe(0.35);
    expect(findModel("2N3904")?.ratings.ptot).toBe(0.625);
  });
});

// Card values against the tables of reference-data §4 (each [DOC] unless the notes say otherwise).
describe("model cards match the published cards (reference-data §4.1–4.3)", () => {
  it("2N3904 / 2N2222A / 2N3906 Gummel–Poon cards [DOC §4.1]", () => {
    const q3904 = findModel("2N3904")?.model.params;
    rel(q3904?.IS, 6.734e-15, 1e-12);
    rel(q3904?.BF, 416.4, 1e-12);
    rel(q3904?.VAF, 74.03, 1e-12);
    rel(q3904?.CJE, 4.493e-12, 1e-12);
    rel(q3904?.CJC, 3.638e-12, 1e-12);
    const q2222 = findModel("2N2222A")?.model.params;
    rel(q2222?.IKF, 0.2847, 1e-12);
    rel(q2222?.VAF, 74.03, 1e-12);
    const q3906 = findModel("2N3906")?.model;
    expect(q3906?.type).toBe("PNP");
    rel(q3906?.params.BF, 180.7, 1e-12);
    rel(q3906?.params.VAF, 18.7, 1e-12);
    rel(q3906?.params.CJC, 9.728e-12, 1e-12);
  });
  it("JFET cards imply the IDSS the notes compute (IDSS = BETA·VTO², §4.2 [CALC])", () => {
    const idss = (name: string): number => {
      const p = findModel(name)?.model.params ?? {};
      return (p.BETA ?? 0) * (p.VTO ?? 0) ** 2;
    };
    rel(idss("J310"), 39.3e-3, 0.002);
    rel(idss("2N3819"), 11.7e-3, 0.005);
    rel(idss("MPF102"), 11.7e-3, 0.005);
    rel(idss("2N5484"), 3e-3, 0.002);
    rel(idss("2N5486"), 14e-3, 0.002);
    for (const name of ["J310", "MPF102", "2N5484", "2N5486"]) {
      const r = findModel(name)?.ratings.idss;
      expect(idss(name)).toBeGreaterThanOrEqual(r?.min ?? 0);
      expect(idss(name)).toBeLessThanOrEqual(r?.max ?? Number.POSITIVE_INFINITY);
    }
  });
  it("2N7000 level-1 KP agrees with the datasheet's typical gfs 320 mS at 200 mA (gm = √(2·KP·ID), §4.3)", () => {
    const m = findModel("2N7000")?.model;
    expect(m?.params.LEVEL).toBe(1);
    rel(Math.sqrt(2 * (m?.params.KP ?? 0) * 0.2), 0.32, 0.02);
    expect(findModel("2N7000")?.ratings.gateProtection).toBe(false);
    expect(findModel("2N7000")?.ratings.vgsMax).toBe(20);
  });
  it("the dual-gate estimate reproduces BF998 typicals: gfs 24 mS at 10 mA; IDSS inside 2–18 mA (§4.4 [DOC])", () => {
    const bf = findModel("BF998");
    const p = bf?.model.params ?? {};
    rel(Math.sqrt(2 * (p.KP ?? 0) * 10e-3), 24e-3, 0.01);
    const idss = ((p.KP ?? 0) / 2) * (p.VTO ?? 0) ** 2;
    expect(idss).toBeGreaterThanOrEqual(2e-3);
    expect(idss).toBeLessThanOrEqual(18e-3);
    expect(bf?.ratings.gateProtection).toBe(true);
    // Back-to-back pair: forward drop + BV ≈ 10 V, inside the ±8 to ±12 V breakdown at 10 mA.
    const bv = bf?.gateProtectionDiode?.params.BV ?? 0;
    expect(bv + 0.7).toBeGreaterThanOrEqual(8);
    expect(bv + 0.7).toBeLessThanOrEqual(12);
  });
});

describe("ratings (reference-data §4.5, §4.2)", () => {
  it("2N3904: VCEO 40 V, VCBO 60 V, VEBO 6 V, IC 200 mA, VCE(sat) 0.2 V [DOC]", () => {
    const r = findModel("2N3904")?.ratings;
    expect([r?.vceo, r?.vcbo, r?.vebo, r?.icMax, r?.vceSat]).toEqual([40, 60, 6, 0.2, 0.2]);
  });
  it("2N918: VCEO 15 V, VCBO 30 V, VEBO 3 V [DOC]; J310 V(BR)GSS 25 V, IG 10 mA [DOC]", () => {
    const q = findModel("2N918")?.ratings;
    expect([q?.vceo, q?.vcbo, q?.vebo]).toEqual([15, 30, 3]);
    const j = findModel("J310")?.ratings;
    expect([j?.vgsMax, j?.igMax]).toEqual([25, 10e-3]);
  });
});

describe("zeners by the voltage their name states", () => {
  const cases: [string, number][] = [
    ["BZX55C5V6", 5.6], ["BZX79-C10", 10], ["BZX84C5V6LT1", 5.6], ["BZT52C3V3", 3.3], ["ZENER 6.2V", 6.2],
    ["5V6", 5.6], ["BZX55", Number.NaN], ["BZX55C12", 12],
  ];
  it.each(cases)("%s → %d V", (name, volts) => {
    const v = zenerVoltageFromName(name);
    if (Number.isNaN(volts)) expect(v).toBeUndefined();
    else rel(v, volts, 1e-12);
  });
  it("1N47xx series from memory of the datasheet table: 1N4733A 5.1 V, 1N4742A 12 V [MEM]", () => {
    rel(zenerVoltageFromName("1N4733A"), 5.1, 1e-12);
    rel(zenerVoltageFromName("1N4742A"), 12, 1e-12);
  });
  it("findModel gives a zener card whose terminal voltage at IBV is the stated one: BV = VZ − IBV·RS (SPICE's IBV is the junction current at −BV)", () => {
    const z = findModel("BZX55C5V6");
    expect(z?.kind).toBe("zener");
    expect(z?.model.type).toBe("D");
    const p = z?.model.params ?? {};
    rel((p.BV ?? 0) + (p.IBV ?? 0) * (p.RS ?? 0), 5.6, 1e-12);
    // IZT 5 mA: the small glass zeners' test current [MEM].
    rel(p.IBV, 5e-3, 1e-12);
    expect(z?.model.source).toMatch(/^ESTIMATE: generic zener card by voltage/);
    expect(z?.model.source).toMatch(/BV = VZ − IBV·RS = 5.6 V − 5 mA × 5 Ω = 5.575 V/);
  });
});

describe("zeners by the voltage their Value states", () => {
  const cases: [string, number][] = [
    ["15V", 15], ["15 V", 15], ["6.2V", 6.2], ["6,2V", 6.2], ["5V6", 5.6], ["ZENER 6.2V", 6.2], ["ZENER_5V6", 5.6],
    ["12V 500mW", 12], ["BZX55C15", 15], ["D_Zener", Number.NaN], ["1N4148", Number.NaN], ["", Number.NaN],
  ];
  it.each(cases)("'%s' → %d V", (value, volts) => {
    const v = zenerVoltageFromValue(value);
    if (Number.isNaN(volts)) expect(v).toBeUndefined();
    else rel(v, volts, 1e-12);
  });
  it("the generic part says it is generic by voltage and claims no dissipation it cannot know", () => {
    const z = zenerFromValue("15V");
    expect(z?.model.source).toMatch(/generic zener card by voltage, VZ 15 V read from the Value '15V'/);
    expect(z?.ratings.vz).toBe(15);
    expect(z?.ratings.ptot).toBeUndefined();
  });
});

describe("dual-gate gate capacitances (BF998 typicals Cg1ss 2.1 pF, Cg2ss 1.2 pF, Cdg1 25 fF, §4.4 [DOC])", () => {
  it("are level-1 overlaps per metre of the solver's default W, so CGSO·W gives the datasheet figure back (±0.1 %)", () => {
    const bf = findModel("BF998");
    rel((bf?.model.params.CGSO ?? 0) * DEFAULT_CHANNEL_SIZE, 2.1e-12, 1e-3);
    rel((bf?.model.params.CGDO ?? 0) * DEFAULT_CHANNEL_SIZE, 25e-15, 1e-3);
    rel((bf?.gate2Model?.params.CGSO ?? 0) * DEFAULT_CHANNEL_SIZE, 1.2e-12, 1e-3);
    // No TOX: level 1 then has no Meyer (channel) capacitance to add to the overlaps.
    expect(bf?.model.params.TOX).toBeUndefined();
    expect(bf?.gate2Model?.params.TOX).toBeUndefined();
    // The d.c. figures are those of the gate-1 card (the channels differ only in capacitance).
    for (const k of ["VTO", "KP", "LAMBDA"]) expect(bf?.gate2Model?.params[k]).toBe(bf?.model.params[k]);
    expect(bf?.model.source).toMatch(/CGSO = 2\.1 pF \/ 100 µm = 21 nF\/m, CGDO = 25 fF \/ 100 µm = 0\.25 nF\/m/);
  });
  it("BF992: Cig1-s 4 pF and Crs 30 fF on gate 1 (§4.4 [DOC]); its gate 2 borrows the BF998's 1.2 pF and says so", () => {
    const bf = findModel("BF992");
    rel((bf?.model.params.CGSO ?? 0) * DEFAULT_CHANNEL_SIZE, 4e-12, 1e-3);
    rel((bf?.model.params.CGDO ?? 0) * DEFAULT_CHANNEL_SIZE, 30e-15, 1e-3);
    expect(bf?.gate2Model?.source).toMatch(/STAND-IN: the BF998's Cg2ss 1\.2 pF/);
  });
});

describe("every part says where its figures come from", () => {
  it("has a source on each card and ratings; estimates say so", () => {
    for (const p of LIBRARY_PARTS) {
      expect(p.model.source.length).toBeGreaterThan(20);
      expect(p.ratings.source.length).toBeGreaterThan(20);
    }
    for (const name of ["2N918", "2N5484", "2N5486", "BF998"]) expect(findModel(name)?.model.source).toMatch(/^ESTIMATE/);
    expect(findModel("MPF102")?.model.source).toMatch(/^STAND-IN/);
  });
  it("names are unique across parts and aliases", () => {
    const all = LIBRARY_PARTS.flatMap((p) => [p.name, ...p.aliases].map((n) => n.toUpperCase()));
    expect(new Set(all).size).toBe(all.length);
  });
});
