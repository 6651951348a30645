// Series ESR and ESL of a capacitor, for the series R-L-C model (Z = ESR + j(ωL − 1/ωC)).
// `ESR` / `ESL` fields on the part win; otherwise an estimate by construction (electrolytic, tantalum,
// MLCC by case size, leaded ceramic disc, film) from the tables of shared/notes/reference-data.md §2.
// Every row names its source as the notes do: [DOC] read in a published document, [MEM] from memory of
// one, [CP] common practice. Figures are for the part alone; pads and vias add 1–2 nH mounted [CP].
import type { Part } from "../circuit/types.js";
import { formatQuantity, parseQuantity } from "../circuit/units.js";

export interface CapacitorParasitics {
  /** Ohms. */
  esr: number;
  /** Henries. */
  esl: number;
  /** Where each figure came from, for messages ("ESR 1.6 Ω: general-purpose electrolytic table …"). */
  basis: string;
}

type Construction = "electrolytic" | "tantalum" | "mlcc" | "disc" | "film-box" | "film-axial" | "unknown";

interface PackageRow {
  pattern: RegExp;
  construction: Construction;
  esl: number;
  basis: string;
}

/** Footprint → construction and ESL (reference-data §2.2). First match wins. */
const PACKAGE_ROWS: readonly PackageRow[] = [
  { pattern: /CP_EIA|Tantalum/i, construction: "tantalum", esl: 10e-9, basis: "moulded tantalum, taken as ≈10 nH like a small electrolytic [MEM]" },
  { pattern: /CP_Radial|CP_Elec|CP_Axial|(^|:)CP_/i, construction: "electrolytic", esl: 10e-9, basis: "radial aluminium electrolytic ≈10 nH (5–20 nH) [MEM]" },
  { pattern: /C_0201(_|$)/, construction: "mlcc", esl: 0.7e-9, basis: "MLCC 0201: the 0402 figure 0.7 nH used, no 0201 row in the table [DOC for 0402]" },
  { pattern: /C_0402(_|$)/, construction: "mlcc", esl: 0.7e-9, basis: "MLCC 0402 ≈0.7 nH [DOC: Q&A answer on MLCC self-resonance]" },
  { pattern: /C_0603(_|$)/, construction: "mlcc", esl: 0.9e-9, basis: "MLCC 0603 ≈0.9 nH [DOC: Q&A answer on MLCC self-resonance]" },
  { pattern: /C_0805(_|$)/, construction: "mlcc", esl: 1.1e-9, basis: "MLCC 0805 ≈1.1 nH [DOC: Q&A answer on MLCC self-resonance]" },
  { pattern: /C_1206(_|$)/, construction: "mlcc", esl: 1.4e-9, basis: "MLCC 1206 ≈1.4 nH [DOC: Q&A answer on MLCC self-resonance]" },
  { pattern: /C_(1210|1812|1825|2220|2225)(_|$)/, construction: "mlcc", esl: 1.4e-9, basis: "MLCC larger than 1206: the 1206 figure 1.4 nH used, larger cases are not in the table [DOC for 1206]" },
  { pattern: /C_Disc/i, construction: "disc", esl: 5e-9, basis: "leaded ceramic disc, short leads: 5 nH, the top of the quoted 2–5 nH; add ≈1 nH per mm of lead [DOC; the per-mm figure CP]" },
  { pattern: /C_Rect/i, construction: "film-box", esl: 10e-9, basis: "film box capacitor ≈10 nH (5–15 nH) [MEM]" },
  { pattern: /C_Axial/i, construction: "film-axial", esl: 15e-9, basis: "axial film capacitor 15 nH, the top of 5–15 nH (axial higher) [MEM]" },
];

/** Aluminium electrolytic ESR, general purpose, new, room temperature, 100 kHz-class ESR-meter readings:
 * the first figure of reference-data §2.3 — the "typical values for standard-grade electrolytics" table
 * of a handheld ESR-meter user guide (rev. 8, 2012) [DOC]. The other published table there reads up to
 * ~4× lower; the first is the conservative default. Rows µF, columns V; `undefined` = not tabulated. */
const ELECTROLYTIC_VOLTS = [10, 16, 25, 35, 63] as const;
const ELECTROLYTIC_ESR: readonly (readonly [number, readonly number[]])[] = [
  [10e-6, [20, 16, 14, 11, 9.3]],
  [22e-6, [9.0, 7.5, 6.2, 5.1, 4.2]],
  [47e-6, [4.2, 3.5, 2.9, 2.4, 2.0]],
  [100e-6, [2.0, 1.6, 1.4, 1.1, 0.93]],
  [220e-6, [0.9, 0.75, 0.62, 0.51, 0.42]],
  [470e-6, [0.42, 0.35, 0.29, 0.24, 0.2]],
  [1000e-6, [0.2, 0.16, 0.14, 0.11, 0.09]],
];
const ELECTROLYTIC_SOURCE = "general-purpose electrolytic table of an ESR-meter user guide (reference-data §2.3, first figure) [DOC]";

interface CeramicEsrRow {
  /** Applies up to and including this capacitance. */
  maxFarads: number;
  esr: number;
  basis: string;
}

/** MLCC / disc ESR defaults by capacitance (reference-data §2.3, "Defaults we suggest" [CP]); the
 * middle of each range is used. */
const CERAMIC_ESR: readonly CeramicEsrRow[] = [
  { maxFarads: 1e-9, esr: 0.2, basis: "C0G-class ≤1 nF: 0.2 Ω, middle of 0.1–0.3 Ω [CP]" },
  { maxFarads: 10e-9, esr: 0.1, basis: "1–10 nF: 0.1 Ω, between the ≤1 nF (0.1–0.3 Ω) and 10–100 nF (20–50 mΩ) rows [CP]" },
  { maxFarads: 0.999e-6, esr: 0.03, basis: "X7R-class 10 nF–1 µF: 30 mΩ, middle of 20–50 mΩ [CP]" },
  { maxFarads: Number.POSITIVE_INFINITY, esr: 0.007, basis: "X7R-class ≥1 µF: 7 mΩ, middle of 5–10 mΩ [CP]" },
];
const FILM_ESR = { esr: 0.03, basis: "film: 30 mΩ, middle of 10–50 mΩ [CP]" };
const NO_FOOTPRINT: PackageRow = {
  pattern: /$^/,
  construction: "unknown",
  esl: 1.1e-9,
  basis: "no recognised capacitor footprint: taken as an 0805 MLCC, 1.1 nH [DOC for 0805]",
};

function fieldValue(part: Part, name: string): string | undefined {
  const want = name.toLowerCase();
  for (const [k, v] of Object.entries(part.fields)) {
    if (k.toLowerCase() === want && v.trim() !== "" && v.trim() !== "~") return v.trim();
  }
  return undefined;
}

function packageRow(part: Part): PackageRow {
  const fp = part.footprint;
  const row = PACKAGE_ROWS.find((r) => r.pattern.test(fp));
  if (row) return row;
  if (part.kind === "polarized-capacitor") {
    const electrolytic = PACKAGE_ROWS.find((r) => r.construction === "electrolytic");
    if (electrolytic) return { ...electrolytic, basis: `polarized capacitor taken as an ${electrolytic.basis}` };
  }
  return NO_FOOTPRINT;
}

function electrolyticEsr(farads: number | undefined, volts: number | undefined): { esr: number; basis: string } {
  // Conservative reading: the tabulated row at or below C and the column at or below the rating
  // (smaller and lower-voltage parts have the higher ESR); off-table parts take the edge row/column.
  const c = farads ?? 0;
  let row = ELECTROLYTIC_ESR[0];
  for (const r of ELECTROLYTIC_ESR) if (c >= r[0] * (1 - 1e-9)) row = r;
  let col = 0;
  ELECTROLYTIC_VOLTS.forEach((v, i) => {
    if (volts !== undefined && volts >= v * (1 - 1e-9)) col = i;
  });
  const esr = row?.[1][col] ?? 20;
  const rowText = formatQuantity(row?.[0] ?? 10e-6, "F");
  const colText = `${ELECTROLYTIC_VOLTS[col] ?? 10} V`;
  const notes: string[] = [];
  if (farads === undefined) notes.push("capacitance unknown");
  else if (farads < (ELECTROLYTIC_ESR[0]?.[0] ?? 10e-6) * (1 - 1e-9)) notes.push("below the table, its smallest row used");
  if (volts === undefined) notes.push("no voltage rating given, lowest column used");
  else if (volts < 10) notes.push("rated below the table's 10 V column");
  const extra = notes.length > 0 ? `; ${notes.join("; ")}` : "";
  return { esr, basis: `ESR ${formatQuantity(esr, "Ω")} from the ${rowText} / ${colText} entry of the ${ELECTROLYTIC_SOURCE}${extra}` };
}

function ceramicEsr(farads: number | undefined): { esr: number; basis: string } {
  const c = farads ?? 100e-9;
  const row = CERAMIC_ESR.find((r) => c <= r.maxFarads) ?? CERAMIC_ESR[CERAMIC_ESR.length - 1];
  const esr = row?.esr ?? 0.03;
  const unknown = farads === undefined ? " (capacitance unknown, 100 nF assumed)" : "";
  return { esr, basis: `ESR ${formatQuantity(esr, "Ω")}: ${row?.basis ?? ""}${unknown}` };
}

/** ESR and ESL for a capacitor part: fields first, else an estimate by construction and value. */
export function estimateCapacitorParasitics(part: Part): CapacitorParasitics {
  const farads = part.parsed.number;
  const volts = part.parsed.voltageRating;
  const pkg = packageRow(part);

  let esrPart: { esr: number; basis: string };
  switch (pkg.construction) {
    case "electrolytic":
      esrPart = electrolyticEsr(farads, volts);
      break;
    case "tantalum": {
      const e = electrolyticEsr(farads, volts);
      esrPart = { esr: e.esr, basis: `${e.basis}; tantalum read from the aluminium table, which overstates a tantalum's ESR [CP]` };
      break;
    }
    case "film-box":
    case "film-axial":
      esrPart = { esr: FILM_ESR.esr, basis: `ESR ${formatQuantity(FILM_ESR.esr, "Ω")}: ${FILM_ESR.basis}` };
      break;
    default:
      esrPart = ceramicEsr(farads);
  }
  let eslPart = { esl: pkg.esl, basis: `ESL ${formatQuantity(pkg.esl, "H")}: ${pkg.basis}` };

  const esrField = fieldValue(part, "ESR");
  if (esrField !== undefined) {
    const v = parseQuantity(esrField, "Ω");
    if (typeof v === "number") esrPart = { esr: v, basis: `ESR ${formatQuantity(v, "Ω")} from the part's ESR field` };
    else esrPart = { ...esrPart, basis: `${esrPart.basis} (ESR field '${esrField}' not read: ${v.error})` };
  }
  const eslField = fieldValue(part, "ESL");
  if (eslField !== undefined) {
    const v = parseQuantity(eslField, "H");
    if (typeof v === "number") eslPart = { esl: v, basis: `ESL ${formatQuantity(v, "H")} from the part's ESL field` };
    else eslPart = { ...eslPart, basis: `${eslPart.basis} (ESL field '${eslField}' not read: ${v.error})` };
  }
  return { esr: esrPart.esr, esl: eslPart.esl, basis: `${esrPart.basis}. ${eslPart.basis}` };
}

/** Self-resonant frequency of the series R-L-C model, f = 1/(2π√(LC)) (reference-data §2.1). */
export function selfResonantFrequency(farads: number, henries: number): number {
  return 1 / (2 * Math.PI * Math.sqrt(farads * henries));
}
