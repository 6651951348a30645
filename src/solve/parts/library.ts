// The built-in generic parts: a SPICE model card and the absolute ratings for each, with where every
// figure comes from (shared/notes/reference-data.md §4; tags as there: [DOC] read in a published
// document, [MEM] from memory of one, [CALC] our arithmetic). Estimates are labelled as ours.
// Ratings are magnitudes (a PNP's VCEO of −40 V is stored as 40) in SI units.
import type { PartKind } from "../../circuit/types.js";
import type { ModelCard } from "../netlist.js";
import { DEFAULT_CHANNEL_SIZE } from "../models/mosfet.js";

export interface RatingRange {
  min?: number;
  typ?: number;
  max?: number;
}

export interface PartRatings {
  // Bipolar.
  vceo?: number;
  vcbo?: number;
  vebo?: number;
  icMax?: number;
  /** Saturation voltage at the datasheet's small-signal test point (`vceSatAt`). */
  vceSat?: number;
  vceSatAt?: string;
  hfe?: RatingRange;
  ft?: number;
  // Field-effect.
  vds?: number;
  vdg?: number;
  /** Continuous gate-source limit (or gate-source breakdown for a JFET). */
  vgsMax?: number;
  /** Non-repetitive gate-source limit (short pulses). */
  vgsMaxPulse?: number;
  idMax?: number;
  igMax?: number;
  idss?: RatingRange;
  /** Gate-source cut-off (JFET, depletion MOSFET), volts with their sign. */
  vgsOff?: RatingRange;
  /** Gate threshold (enhancement MOSFET). */
  vgsTh?: RatingRange;
  /** Breakdown of integrated gate protection diodes. */
  vgsBreakdown?: RatingRange;
  /** True when the gates carry integrated protection diodes; false when the datasheet has none. */
  gateProtection?: boolean;
  // Diodes.
  vrrm?: number;
  ifMax?: number;
  vz?: number;
  // All.
  ptot?: number;
  /** Where the figures come from. */
  source: string;
}

export interface LibraryPart {
  /** Canonical part number. */
  name: string;
  aliases: readonly string[];
  kind: PartKind;
  /** For a dual-gate MOSFET: the card of each of its two channels (of the gate-1 channel when
   * `gate2Model` is given). */
  model: ModelCard;
  /** For a dual-gate MOSFET whose gate-2 channel differs (its capacitances): that channel's card. */
  gate2Model?: ModelCard;
  ratings: PartRatings;
  /** For parts with integrated gate protection: the card of each diode of a back-to-back pair. */
  gateProtectionDiode?: ModelCard;
}

// --- Bipolar (reference-data §4.1, §4.5) -----------------------------------------------------------

const GP_SOURCE =
  "Gummel–Poon card dated 1988 in a semiconductor vendor's library, carried identically by many public repositories (the majority card; corrupted copies avoided) [DOC, reference-data §4.1]";

const Q2N3904: ModelCard = {
  name: "2N3904",
  type: "NPN",
  params: {
    IS: 6.734e-15, XTI: 3, EG: 1.11, VAF: 74.03, BF: 416.4, NE: 1.259, ISE: 6.734e-15, IKF: 66.78e-3, XTB: 1.5,
    BR: 0.7371, NC: 2, ISC: 0, IKR: 0, RC: 1, CJC: 3.638e-12, MJC: 0.3085, VJC: 0.75, FC: 0.5, CJE: 4.493e-12,
    MJE: 0.2593, VJE: 0.75, TR: 239.5e-9, TF: 301.2e-12, ITF: 0.4, VTF: 4, XTF: 2, RB: 10, NF: 1, RE: 0,
  },
  source: GP_SOURCE,
};

const Q2N2222A: ModelCard = {
  name: "2N2222A",
  type: "NPN",
  params: {
    IS: 14.34e-15, XTI: 3, EG: 1.11, VAF: 74.03, BF: 255.9, NE: 1.307, ISE: 14.34e-15, IKF: 0.2847, XTB: 1.5,
    BR: 6.092, NC: 2, ISC: 0, IKR: 0, RC: 1, CJC: 7.306e-12, MJC: 0.3416, VJC: 0.75, FC: 0.5, CJE: 22.01e-12,
    MJE: 0.377, VJE: 0.75, TR: 46.91e-9, TF: 411.1e-12, ITF: 0.6, VTF: 1.7, XTF: 3, RB: 10, NF: 1, RE: 0,
  },
  source: GP_SOURCE,
};

const Q2N3906: ModelCard = {
  name: "2N3906",
  type: "PNP",
  params: {
    IS: 1.41e-15, XTI: 3, EG: 1.11, VAF: 18.7, BF: 180.7, NE: 1.5, ISE: 0, IKF: 80e-3, XTB: 1.5, BR: 4.977, NC: 2,
    ISC: 0, IKR: 0, RC: 2.5, CJC: 9.728e-12, MJC: 0.5776, VJC: 0.75, FC: 0.5, CJE: 8.063e-12, MJE: 0.3677, VJE: 0.75,
    TR: 33.42e-9, TF: 179.3e-12, ITF: 0.4, VTF: 4, XTF: 6, RB: 10, NF: 1, RE: 0,
  },
  source: GP_SOURCE,
};

const Q2N918_ESTIMATE: ModelCard = {
  name: "2N918",
  type: "NPN",
  params: { IS: 1e-15, BF: 60, VAF: 50, CJE: 2.4e-12, VJE: 0.75, MJE: 0.33, CJC: 3e-12, VJC: 0.75, MJC: 0.21, TF: 155e-12, RB: 50 },
  source:
    "ESTIMATE, not a published model: derived by the notes' author from 2N918 datasheet limits (hFE ≥ 20, fT ≥ 600 MHz, Cobo ≤ 3 pF; TF from 1/(2π·900 MHz) less junction charging) [reference-data §4.1]",
};

// --- JFETs (reference-data §4.2) ---------------------------------------------------------------------

const J310: ModelCard = {
  name: "J310",
  type: "NJF",
  params: {
    BETA: 3.384e-3, VTO: -3.409, LAMBDA: 17e-3, IS: 193.9e-15, ISR: 1881e-15, N: 1, NR: 2, RD: 1, RS: 1,
    CGD: 6.2e-12, CGS: 6.2e-12, PB: 1, M: 0.465, FC: 0.5,
  },
  source: "card in a simulator's default JFET library, reproduced in several repositories [DOC, reference-data §4.2]; implies IDSS 39.3 mA [CALC], inside the 24–60 mA limits",
};

const J2N3819: ModelCard = {
  name: "2N3819",
  type: "NJF",
  params: {
    BETA: 1.304e-3, VTO: -3, LAMBDA: 2.25e-3, IS: 33.57e-15, ISR: 322.4e-15, RD: 1, RS: 1, CGD: 1.6e-12,
    CGS: 2.414e-12, M: 0.3622, PB: 1,
  },
  source: "2N3819 card in a simulator's default JFET library [DOC, reference-data §4.2]; implies IDSS 11.7 mA, |VP| 3 V [CALC]",
};

const MPF102_STANDIN: ModelCard = {
  ...J2N3819,
  name: "MPF102",
  source:
    "STAND-IN: the 2N3819 card of a simulator's default JFET library [DOC], used for the MPF102 class because no trustworthy MPF102 card was found; it implies IDSS 11.7 mA and |VP| 3 V, inside the MPF102 limits (2–20 mA, |VGS(off)| ≤ 8 V) [reference-data §4.2]",
};

const J2N5484_ESTIMATE: ModelCard = {
  name: "2N5484",
  type: "NJF",
  params: { VTO: -1.5, BETA: 1.333e-3, LAMBDA: 10e-3, RD: 10, RS: 10, CGS: 4e-12, CGD: 4e-12 },
  source:
    "ESTIMATE, not a published model: mid-range of the 2N5484 datasheet (IDSS 3 mA at VP −1.5 V, BETA = IDSS/VP²) with the circulating card's LAMBDA, RD, RS and CGS = CGD ≈ 4 pF; the circulating card itself (BETA 3m → IDSS 6.75 mA) is outside the 1–5 mA limits [reference-data §4.2]",
};

const J2N5486_ESTIMATE: ModelCard = {
  name: "2N5486",
  type: "NJF",
  params: { VTO: -4, BETA: 0.875e-3, LAMBDA: 10e-3, RD: 10, RS: 10, CGS: 4e-12, CGD: 4e-12 },
  source:
    "ESTIMATE, not a published model: mid-range of the 2N5486 datasheet (IDSS 14 mA at VP −4 V) with the circulating card's LAMBDA, RD, RS, CGS, CGD; the circulating card itself (IDSS 64 mA) is outside the 8–20 mA limits [reference-data §4.2]",
};

// --- MOSFETs (reference-data §4.3, §4.4) ---------------------------------------------------------------

const M2N7000: ModelCard = {
  name: "2N7000",
  type: "NMOS",
  params: {
    LEVEL: 1, VTO: 2.094, KP: 0.2628, LAMBDA: 0.01147, GAMMA: 0, PHI: 0.6, RD: 1.083, RS: 0.5333, CBD: 37.35e-12,
    CBS: 34.79e-12, CGSO: 51.17e-12, CGDO: 19.7e-12, CGBO: 95.82e-12, IS: 4.375e-14, PB: 0.8, MJ: 0.46, FC: 0.5,
    RSH: 27.94,
  },
  source:
    "level-1 card circulating for the 2N7000 (repository copy, origin not identified) [DOC, reference-data §4.3]; KP agrees with the datasheet's typical gfs 320 mS at 200 mA (KP = gfs²/2ID ≈ 0.256) [CALC]",
};

/** Each channel of a BF998-class tetrode: VTO ≈ −0.8 V (typical gate pinch-off), KP = gfs²/(2·ID) with the
 * typical gfs 24 mS at 10 mA → 0.0288 A/V²; the same card gives IDSS ≈ 9 mA with VG1S = 0, the typical
 * figure of one datasheet revision. */
const DUAL_GATE_DC = { LEVEL: 1, VTO: -0.8, KP: 0.0288, LAMBDA: 0.01, GAMMA: 0, PHI: 0.6 };
const DUAL_GATE_DC_SOURCE =
  "ESTIMATE, not a published model: each of the two channels of a BF998-class dual-gate depletion MOSFET as a level-1 card, VTO −0.8 V (typical pinch-off) and KP 0.0288 A/V² from gfs 24 mS at 10 mA [CALC from datasheet typicals, reference-data §4.4]; LAMBDA is a guess";

/** A datasheet gate capacitance as a level-1 overlap capacitance per metre of channel width. Level 1
 * without TOX has no Meyer (channel) part, so the channel's C_gs at any operating point is exactly
 * CGSO·W: with the solver's default W the figure comes back unchanged. */
function perMetreOfWidth(farads: number): number {
  return farads / DEFAULT_CHANNEL_SIZE;
}

const W_UM = Number((DEFAULT_CHANNEL_SIZE * 1e6).toPrecision(6));

/** `21` for 2.1 pF over 100 µm: the per-metre figure in nF/m, for the source texts. */
function nanofaradsPerMetre(farads: number): string {
  return String(Number((perMetreOfWidth(farads) * 1e9).toPrecision(4)));
}

/** BF998 typicals at VDS 8 V, VG2S 4 V (reference-data §4.4 [DOC]). */
const BF998_CG1SS = 2.1e-12;
const BF998_CG2SS = 1.2e-12;
const BF998_CDG1 = 25e-15;

/** Gate-1 channel: C_gs from Cg1ss, C_gd (to the internal node between the channels) from Cdg1. The
 * datasheet's drain-to-gate-1 feedback is what gate 2's screening leaves; the two-channel model has no
 * direct drain–gate-1 path, so Cdg1 is placed on gate 1's own channel, the nearest it has. */
const DUAL_GATE_CHANNEL: ModelCard = {
  name: "BF998",
  type: "NMOS",
  params: { ...DUAL_GATE_DC, CGSO: perMetreOfWidth(BF998_CG1SS), CGDO: perMetreOfWidth(BF998_CDG1) },
  source:
    `${DUAL_GATE_DC_SOURCE}; gate-1 channel capacitances ESTIMATED from the datasheet typicals Cg1ss 2.1 pF and Cdg1 25 fF [DOC, reference-data §4.4] as level-1 overlaps per metre of the default channel width W = ${W_UM} µm [CALC]: CGSO = 2.1 pF / ${W_UM} µm = ${nanofaradsPerMetre(BF998_CG1SS)} nF/m, CGDO = 25 fF / ${W_UM} µm = ${nanofaradsPerMetre(BF998_CDG1)} nF/m (C_gd to the node between the channels)`,
};

/** Gate-2 channel: C_gs from Cg2ss; the datasheet gives no gate-2-to-drain figure, so CGDO stays 0. */
const DUAL_GATE_CHANNEL_G2: ModelCard = {
  name: "BF998_G2",
  type: "NMOS",
  params: { ...DUAL_GATE_DC, CGSO: perMetreOfWidth(BF998_CG2SS) },
  source:
    `${DUAL_GATE_DC_SOURCE}; gate-2 channel capacitance ESTIMATED from the datasheet typical Cg2ss 1.2 pF [DOC, reference-data §4.4] as a level-1 overlap per metre of the default channel width W = ${W_UM} µm [CALC]: CGSO = 1.2 pF / ${W_UM} µm = ${nanofaradsPerMetre(BF998_CG2SS)} nF/m; no gate-2–drain figure in our notes, CGDO 0`,
};

/** BF992 (VHF type) figures: Cig1-s 4 pF, Crs 30 fF (reference-data §4.4 [DOC]). */
const BF992_CG1SS = 4e-12;
const BF992_CRS = 30e-15;
const BF992_DC_SOURCE = `${DUAL_GATE_DC_SOURCE}; used for the BF992 (|yfs| 25 mS at 15 mA, similar)`;

const BF992_CHANNEL: ModelCard = {
  name: "BF992",
  type: "NMOS",
  params: { ...DUAL_GATE_DC, CGSO: perMetreOfWidth(BF992_CG1SS), CGDO: perMetreOfWidth(BF992_CRS) },
  source:
    `${BF992_DC_SOURCE}; gate-1 channel capacitances ESTIMATED from the BF992's Cig1-s 4 pF and Crs 30 fF [DOC, reference-data §4.4] per metre of W = ${W_UM} µm [CALC]: CGSO = ${nanofaradsPerMetre(BF992_CG1SS)} nF/m, CGDO = ${nanofaradsPerMetre(BF992_CRS)} nF/m`,
};

const BF992_CHANNEL_G2: ModelCard = {
  ...DUAL_GATE_CHANNEL_G2,
  name: "BF992_G2",
  source: `${BF992_DC_SOURCE}; gate-2 channel capacitance STAND-IN: the BF998's Cg2ss 1.2 pF (no BF992 gate-2 figure in our notes) as CGSO = ${nanofaradsPerMetre(BF998_CG2SS)} nF/m at W = ${W_UM} µm [CALC]`,
};

const DUAL_GATE_PROTECTION: ModelCard = {
  name: "BF998-GATE-DIODE",
  type: "D",
  params: { IS: 1e-14, N: 1, BV: 9.3, IBV: 10e-3 },
  source:
    "ESTIMATE: one diode of the integrated back-to-back gate protection pair; the pair breaks down at ≈0.7 V + 9.3 V = 10 V at 10 mA, the middle of the datasheet's V(BR)G1SS/G2SS ±8 to ±12 V [DOC for the range, reference-data §4.4]",
};

// --- Diodes ---------------------------------------------------------------------------------------------

const D1N4148: ModelCard = {
  name: "1N4148",
  type: "D",
  params: { IS: 4.352e-9, N: 1.906, BV: 110, IBV: 1e-4, RS: 0.6458, CJO: 0.7048e-12, VJ: 0.869, M: 0.03, FC: 0.5, TT: 3.48e-9 },
  source:
    "the 1N4148 PSPICE model file of a semiconductor vendor (VRRM 100 V, IFRM 450 mA in its header), reproduced in public repositories [DOC]; another vendor's card groups the 1N914 and 1N4448 with the 1N4148 [DOC]",
};

// --- Assembly ----------------------------------------------------------------------------------------------

const PARTS: LibraryPart[] = [
  {
    name: "2N3904",
    aliases: ["PN3904", "Q2N3904", "2N3904BU", "2N3904TA"],
    kind: "npn",
    model: Q2N3904,
    ratings: {
      vceo: 40, vcbo: 60, vebo: 6, icMax: 0.2, ptot: 0.625, vceSat: 0.2, vceSatAt: "IC 10 mA, IB 1 mA",
      hfe: { min: 100, max: 300 }, ft: 300e6,
      source: "2N3904 datasheet: VCEO 40 V, VCBO 60 V, VEBO 6 V, IC 200 mA, Ptot 625 mW (TO-92), VCE(sat) ≤ 0.2 V at 10/1 mA, hFE 100–300 at 10 mA [DOC, reference-data §4.5]",
    },
  },
  {
    name: "MMBT3904",
    aliases: ["SMBT3904"],
    kind: "npn",
    model: { ...Q2N3904, name: "MMBT3904" },
    ratings: {
      vceo: 40, vcbo: 60, vebo: 6, icMax: 0.2, ptot: 0.35, vceSat: 0.2, vceSatAt: "IC 10 mA, IB 1 mA",
      source: "SOT-23 version of the 2N3904: same die ratings [DOC for the 2N3904]; Ptot 350 mW for SOT-23 [MEM]",
    },
  },
  {
    name: "2N2222A",
    aliases: ["PN2222A", "P2N2222A", "Q2N2222A", "MPS2222A"],
    kind: "npn",
    model: Q2N2222A,
    ratings: {
      vceo: 40, vcbo: 75, vebo: 6, icMax: 0.6, ptot: 0.625, vceSat: 0.3, vceSatAt: "IC 150 mA, IB 15 mA",
      hfe: { min: 100, max: 300 }, ft: 300e6,
      source: "2N2222A datasheet: VCEO 40 V, VCBO 75 V, VEBO 6 V, IC 600 mA, Ptot 625 mW (TO-92) [DOC]; VCE(sat), hFE and fT [MEM] (reference-data §4.5)",
    },
  },
  {
    name: "MMBT2222A",
    aliases: [],
    kind: "npn",
    model: { ...Q2N2222A, name: "MMBT2222A" },
    ratings: {
      vceo: 40, vcbo: 75, vebo: 6, icMax: 0.6, ptot: 0.35, vceSat: 0.3, vceSatAt: "IC 150 mA, IB 15 mA",
      source: "SOT-23 version of the 2N2222A: die ratings as the 2N2222A [DOC]; Ptot 350 mW for SOT-23 [MEM]",
    },
  },
  {
    // Not an alias of the 2N2222A: lower VCEO and VEBO (reference-data §4.5).
    name: "2N2222",
    aliases: ["PN2222", "Q2N2222"],
    kind: "npn",
    model: { ...Q2N2222A, name: "2N2222", source: `${GP_SOURCE}; the 2N2222A card, used for the non-A part (same die family, lower ratings)` },
    ratings: {
      vceo: 30, vcbo: 60, vebo: 5, icMax: 0.8, ptot: 0.5, vceSat: 0.4, vceSatAt: "IC 150 mA, IB 15 mA",
      hfe: { min: 100, max: 300 },
      source: "2N2222 (non-A, TO-18) datasheet: VCEO 30 V, VCBO 60 V, VEBO 5 V, IC 800 mA, Ptot 500 mW, VCE(sat) ≤ 0.4 V at 150/15 mA [DOC, reference-data §4.5]",
    },
  },
  {
    name: "2N3906",
    aliases: ["PN3906", "Q2N3906", "2N3906BU", "2N3906TA"],
    kind: "pnp",
    model: Q2N3906,
    ratings: {
      vceo: 40, vcbo: 40, vebo: 5, icMax: 0.2, ptot: 0.625, vceSat: 0.25, vceSatAt: "IC 10 mA, IB 1 mA",
      hfe: { min: 100, max: 300 }, ft: 250e6,
      source: "2N3906 ratings from memory of the datasheet: VCEO/VCBO −40 V, VEBO −5 V, IC −200 mA, Ptot 625 mW, VCE(sat) ≤ −0.25 V at 10/1 mA [MEM, reference-data §4.5]",
    },
  },
  {
    name: "MMBT3906",
    aliases: ["SMBT3906"],
    kind: "pnp",
    model: { ...Q2N3906, name: "MMBT3906" },
    ratings: {
      vceo: 40, vcbo: 40, vebo: 5, icMax: 0.2, ptot: 0.35, vceSat: 0.25, vceSatAt: "IC 10 mA, IB 1 mA",
      source: "SOT-23 version of the 2N3906 [MEM for all figures]",
    },
  },
  {
    name: "2N918",
    aliases: ["Q2N918"],
    kind: "npn",
    model: Q2N918_ESTIMATE,
    ratings: {
      vceo: 15, vcbo: 30, vebo: 3, icMax: 0.05, ptot: 0.2, vceSat: 0.4, vceSatAt: "IC 10 mA, IB 1 mA",
      hfe: { min: 20 }, ft: 600e6,
      source: "2N918 datasheets: VCEO(sus) 15 V, BVCBO 30 V, BVEBO 3 V, VCE(sat) ≤ 0.4 V, fT ≥ 600 MHz [DOC]; IC 50 mA and Ptot 200 mW [MEM] (reference-data §4.1, §4.5)",
    },
  },
  {
    name: "J310",
    aliases: ["J-310"],
    kind: "njfet",
    model: J310,
    ratings: {
      vds: 25, vgsMax: 25, igMax: 10e-3, ptot: 0.35, idss: { min: 24e-3, max: 60e-3 }, vgsOff: { min: -6.5, max: -2 },
      source: "J310 datasheet: V(BR)GSS −25 V, VDS 25 V, IG(f) 10 mA, PD 350 mW (TO-92), IDSS 24–60 mA, VGS(off) −2.0 to −6.5 V [DOC, reference-data §4.2]",
    },
  },
  {
    name: "MMBFJ310",
    aliases: [],
    kind: "njfet",
    model: { ...J310, name: "MMBFJ310" },
    ratings: {
      vds: 25, vgsMax: 25, igMax: 10e-3, idss: { min: 24e-3, max: 60e-3 }, vgsOff: { min: -6.5, max: -2 },
      source: "SOT-23 version of the J310: die ratings as the J310 [DOC]; its package dissipation is lower than the TO-92 350 mW and is not compiled here",
    },
  },
  {
    name: "2N3819",
    aliases: [],
    kind: "njfet",
    model: J2N3819,
    ratings: { source: "no 2N3819 ratings compiled in reference-data; only the model card" },
  },
  {
    name: "MPF102",
    aliases: [],
    kind: "njfet",
    model: MPF102_STANDIN,
    ratings: {
      vds: 25, vdg: 25, vgsMax: 25, igMax: 10e-3, ptot: 0.35, idss: { min: 2e-3, max: 20e-3 }, vgsOff: { min: -8 },
      source: "MPF102 datasheet: VDS, VDG 25 V, V(BR)GSS −25 V, IG(f) 10 mA, PD 350 mW, IDSS 2–20 mA, VGS(off) to −8 V [DOC, reference-data §4.2]",
    },
  },
  {
    name: "2N5484",
    aliases: [],
    kind: "njfet",
    model: J2N5484_ESTIMATE,
    ratings: {
      vgsMax: 25, igMax: 10e-3, ptot: 0.35, idss: { min: 1e-3, max: 5e-3 }, vgsOff: { min: -3, max: -0.3 },
      source: "2N5484: IDSS 1–5 mA, VGS(off) −0.3 to −3 V, V(BR)GSS −25 V [MEM]; IG(f) 10 mA, PD 350 mW [DOC] (reference-data §4.2)",
    },
  },
  {
    name: "2N5486",
    aliases: [],
    kind: "njfet",
    model: J2N5486_ESTIMATE,
    ratings: {
      vdg: 25, vgsMax: 25, idMax: 30e-3, igMax: 10e-3, ptot: 0.35, idss: { min: 8e-3, max: 20e-3 }, vgsOff: { min: -6, max: -2 },
      source: "2N5486 datasheet: IDSS 8–20 mA, VGS(off) −2 to −6 V, V(BR)GSS −25 V, VDG 25 V, ID 30 mA, IG(f) 10 mA, PD 350 mW [DOC, reference-data §4.2]",
    },
  },
  {
    name: "2N7000",
    aliases: ["2N7000BU", "2N7000TA", "2N7000G"],
    kind: "nmos",
    model: M2N7000,
    ratings: {
      vds: 60, vdg: 60, vgsMax: 20, vgsMaxPulse: 40, idMax: 0.2, ptot: 0.4, vgsTh: { min: 0.8, typ: 2.1, max: 3.0 },
      gateProtection: false,
      source: "2N7000 datasheet: VDSS 60 V, VDGR 60 V, VGSS ±20 V (±40 V non-repetitive, tp ≤ 50 µs), ID 200 mA, PD 400 mW (350 mW in an older datasheet), VGS(th) 0.8/2.1/3.0 V, no gate protection diode [DOC, reference-data §4.3]",
    },
  },
  {
    name: "BF998",
    aliases: ["BF998R", "BF998W", "BF998RW"],
    kind: "dual-gate-mosfet",
    model: DUAL_GATE_CHANNEL,
    gate2Model: DUAL_GATE_CHANNEL_G2,
    gateProtectionDiode: DUAL_GATE_PROTECTION,
    ratings: {
      vds: 12, idMax: 30e-3, igMax: 10e-3, ptot: 0.2, idss: { min: 2e-3, max: 18e-3 }, vgsOff: { min: -2.5, typ: -0.8 },
      vgsBreakdown: { min: 8, max: 12 }, gateProtection: true,
      source: "BF998 datasheets (two agree): VDS 12 V, ID 30 mA, gate peak current ±10 mA, Ptot 200 mW, IDSS 2–18 mA, −VG1S(p) ≤ 2.5 V (0.8 typ), V(BR)G1SS/G2SS ±8 to ±12 V, integrated back-to-back gate protection diodes [DOC, reference-data §4.4]",
    },
  },
  {
    name: "BF992",
    aliases: [],
    kind: "dual-gate-mosfet",
    model: BF992_CHANNEL,
    gate2Model: BF992_CHANNEL_G2,
    gateProtectionDiode: DUAL_GATE_PROTECTION,
    ratings: {
      vds: 20, idMax: 40e-3, ptot: 0.2, gateProtection: true,
      source: "BF992 datasheet: VDS 20 V, ID 40 mA, Ptot 200 mW, same protection-diode construction as the BF998 [DOC, reference-data §4.4]",
    },
  },
  {
    name: "1N4148",
    aliases: ["1N914", "1N4448", "LL4148", "D1N4148", "1N914B", "1N4148W", "1N4148WS", "1N4148WT"],
    kind: "diode",
    model: D1N4148,
    ratings: {
      vrrm: 100, ifMax: 0.2, ptot: 0.5,
      source: "VRRM 100 V from the vendor model file's header [DOC]; IF(AV) 200 mA and Ptot 500 mW from memory of the datasheets [MEM]",
    },
  },
];

// --- Zeners: a generic card at the nominal voltage read from the part name -----------------------------------

/** 1N4728…1N4764 (1 W): nominal voltages continue the E24 series from 3.3 V to 100 V [MEM]. */
const ZENER_1N47: readonly number[] = [
  3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1, 10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33,
  36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91, 100,
];

/** Nominal zener voltage from a part name: `BZX55C5V6` → 5.6, `BZX79-C10` → 10, `ZENER 6.2V` → 6.2,
 * `5V6` → 5.6, `1N4733A` → 5.1. */
export function zenerVoltageFromName(name: string): number | undefined {
  const n = name.trim().toUpperCase();
  const series = /^1N47(\d\d)/.exec(n);
  if (series) {
    const v = ZENER_1N47[Number(series[1]) - 28];
    return v;
  }
  const code = /(?:^|[A-Z-])(\d{1,3})V(\d{1,2})?(?!\d)/.exec(n.replace(/^(BZX|BZT|BZV|BZD)\d+/, ""));
  if (code) return Number(`${code[1]}.${code[2] ?? "0"}`);
  const plain = /(\d+(?:[.,]\d+)?)\s*V\b/.exec(n);
  if (plain && /ZENER|^\d/.test(n)) return Number((plain[1] ?? "").replace(",", "."));
  const trailing = /^(BZX|BZT|BZV|BZD)\d*-?[A-F](\d{1,3})$/.exec(n);
  if (trailing) return Number(trailing[2]);
  return undefined;
}

/** Test current of the generic card: 5 mA, the IZT of the small glass zeners (BZX55/BZX79 class) [MEM]. */
export const GENERIC_ZENER_TEST_CURRENT = 5e-3;
/** Series resistance of the generic card [CP: a default, not a datasheet figure]. */
const GENERIC_ZENER_RS = 5;

/** The generic card at `volts` (VZ at the test current IZT = IBV, terminal voltage). SPICE's IBV is the
 * junction current at −BV; RS adds IBV·RS at the terminals, so BV = VZ − IBV·RS puts VZ where it is
 * stated. `basis` says where the voltage was read ("the part name 'BZX55C5V6'"). */
function genericZenerCard(volts: number, basis: string): ModelCard {
  const bv = volts - GENERIC_ZENER_TEST_CURRENT * GENERIC_ZENER_RS;
  return {
    name: `ZENER_${volts}V`,
    type: "D",
    params: { IS: 1e-14, N: 1, RS: GENERIC_ZENER_RS, BV: bv, IBV: GENERIC_ZENER_TEST_CURRENT, CJO: 50e-12 },
    source:
      `ESTIMATE: generic zener card by voltage, VZ ${volts} V read from ${basis}, reached at IZT = IBV 5 mA [MEM: the small glass zeners' test current] ` +
      `with BV = VZ − IBV·RS = ${volts} V − 5 mA × 5 Ω = ${Number(bv.toPrecision(6))} V; knee and slope a common-practice default [CP], not the part's: ` +
      "breakdown current falls e-fold per N·VT = 25.9 mV below IZT (5 mA → 0.5 mA in 60 mV, sharper than a real zener below about 6 V), " +
      "dynamic resistance RS + N·VT/IZT = 5 Ω + 5.2 Ω ≈ 10 Ω at IZT (datasheets give 5–100 Ω); IS 10 fA, N 1, CJO 50 pF generic",
  };
}

/** A generic zener at `volts` read from a part name (BZX…, 1N47xx), with its series' dissipation. */
export function zenerPart(volts: number, name: string): LibraryPart {
  const oneWatt = /^1N47/i.test(name.trim());
  return {
    name,
    aliases: [],
    kind: "zener",
    model: genericZenerCard(volts, `the part name '${name}'`),
    ratings: {
      vz: volts,
      ptot: oneWatt ? 1 : 0.5,
      source: oneWatt ? "1N47xx series: 1 W [MEM]" : "small glass zener (BZX55/BZX79 class): 500 mW [MEM]",
    },
  };
}

/** Zener voltage a Value states: `15V`, `6.2V`, `6,2 V`, `5V6`, `ZENER 6.2V`, `15V 500mW`, or a part name
 * that encodes it (`BZX55C15`). */
export function zenerVoltageFromValue(value: string): number | undefined {
  const t = value.trim().toUpperCase();
  const rkm = /(?:^|[\s_-])(\d{1,3})V(\d{1,2})(?=$|[\s_/,])/.exec(t);
  if (rkm) return Number(`${rkm[1]}.${rkm[2]}`);
  const plain = /(?:^|[\s_-])(\d{1,3}(?:[.,]\d{1,2})?)\s?V(?=$|[\s_/,])/.exec(t);
  if (plain) return Number((plain[1] ?? "").replace(",", "."));
  return zenerVoltageFromName(t);
}

/** A zener part whose Value states its voltage: the generic card at it. No dissipation rating: the
 * type (and so its package) is unknown. */
export function zenerFromValue(value: string): LibraryPart | undefined {
  const volts = zenerVoltageFromValue(value);
  if (volts === undefined || !(volts > 0) || !Number.isFinite(volts)) return undefined;
  return {
    name: value.trim(),
    aliases: [],
    kind: "zener",
    model: genericZenerCard(volts, `the Value '${value.trim()}'`),
    ratings: { vz: volts, source: `zener voltage from the Value '${value.trim()}'; dissipation unknown (no part number)` },
  };
}

// --- Lookup -------------------------------------------------------------------------------------------------

const BY_NAME = new Map<string, LibraryPart>();
for (const p of PARTS) {
  for (const n of [p.name, ...p.aliases]) BY_NAME.set(n.toUpperCase(), p);
}

/** Packaging and lead-free suffixes of distributor part numbers (`2N3904BU`, `2N7000-AP`, `1N4148TR`). */
const PACKAGING_SUFFIX = /^(?:-[A-Z0-9]+|BU|TA|TAR|TF|TFR|G|RLRA|RLRAG|RLRM|TR|T\/R|LT1|LT1G)$/;

/** All built-in parts (one entry per part number; aliases inside). */
export const LIBRARY_PARTS: readonly LibraryPart[] = PARTS;

/** The built-in part a value or symbol name refers to: exact name or alias (case-insensitive), a SPICE
 * model name (`Q2N3904`), a name with a packaging suffix, or a zener whose voltage the name states. */
export function findModel(name: string): LibraryPart | undefined {
  const n = name.trim().toUpperCase();
  if (n === "") return undefined;
  const exact = BY_NAME.get(n) ?? BY_NAME.get(n.replace(/^[QDJM](?=\d)/, ""));
  if (exact) return exact;
  for (const [key, part] of BY_NAME) {
    if (n.startsWith(key) && PACKAGING_SUFFIX.test(n.slice(key.length))) return part;
  }
  if (/^(BZX|BZT|BZV|BZD|ZPD|ZMM|ZMY|TZMC|1N47[2-6]\d|ZENER|\d+V\d+$)/.test(n)) {
    const v = zenerVoltageFromName(n);
    if (v !== undefined && v > 0) return zenerPart(v, name.trim());
  }
  return undefined;
}
