// Bipolar transistor, Gummel–Poon model as in Berkeley SPICE (level 1): transport current
// (IS, NF, NR) divided by the normalised base charge qb (Early voltages VAF/VAR, knee currents
// IKF/IKR), ideal base currents through BF/BR plus non-ideal leakage (ISE/NE, ISC/NC), ohmic
// RB/RC/RE, depletion capacitances CJE/CJC with the FC linearisation, diffusion charge TF/TR
// including the XTF/VTF/ITF bias dependence of TF.
// Not modelled: the current dependence of RB (IRB/RBM), excess phase (PTF), substrate junction
// (CJS), quasi-saturation; temperature is 27 °C = TNOM so XTI/EG/XTB have no effect.

import { currentSettled, type DcLoadContext, type Device, type ElaborationMemo } from "../device.js";
import type { UnknownMap } from "../mna.js";
import type { BjtElement } from "../netlist.js";
import { voltageOf, type ComplexStamp, type RealStamp, type Unknown } from "../stamp.js";
import type { BjtOperatingPoint, BjtRegion } from "../types.js";
import {
  THERMAL_VOLTAGE,
  criticalVoltage,
  depletionCapacitance,
  junctionCurrent,
  pnjlim,
  type CurrentAndSlope,
} from "./junction.js";
import { inverseOrZero, param, resolveParams, type ParamSpec } from "./params.js";

export const BJT_PARAMS: readonly ParamSpec[] = [
  { name: "IS", default: 1e-16, unit: "A", description: "transport saturation current" },
  { name: "BF", default: 100, unit: "", description: "ideal maximum forward beta" },
  { name: "NF", default: 1, unit: "", description: "forward emission coefficient" },
  { name: "VAF", default: Infinity, unit: "V", description: "forward Early voltage" },
  { name: "IKF", default: Infinity, unit: "A", description: "forward beta high-current roll-off knee" },
  { name: "ISE", default: 0, unit: "A", description: "base-emitter leakage saturation current" },
  { name: "NE", default: 1.5, unit: "", description: "base-emitter leakage emission coefficient" },
  { name: "BR", default: 1, unit: "", description: "ideal maximum reverse beta" },
  { name: "NR", default: 1, unit: "", description: "reverse emission coefficient" },
  { name: "VAR", default: Infinity, unit: "V", description: "reverse Early voltage" },
  { name: "IKR", default: Infinity, unit: "A", description: "reverse beta roll-off knee" },
  { name: "ISC", default: 0, unit: "A", description: "base-collector leakage saturation current" },
  { name: "NC", default: 2, unit: "", description: "base-collector leakage emission coefficient" },
  { name: "RB", default: 0, unit: "Ω", description: "base resistance" },
  { name: "RE", default: 0, unit: "Ω", description: "emitter resistance" },
  { name: "RC", default: 0, unit: "Ω", description: "collector resistance" },
  { name: "CJE", default: 0, unit: "F", description: "base-emitter zero-bias depletion capacitance" },
  { name: "VJE", default: 0.75, unit: "V", description: "base-emitter built-in potential" },
  { name: "MJE", default: 0.33, unit: "", description: "base-emitter junction grading" },
  { name: "CJC", default: 0, unit: "F", description: "base-collector zero-bias depletion capacitance" },
  { name: "VJC", default: 0.75, unit: "V", description: "base-collector built-in potential" },
  { name: "MJC", default: 0.33, unit: "", description: "base-collector junction grading" },
  { name: "XCJC", default: 1, unit: "", description: "fraction of CJC at the internal base" },
  { name: "FC", default: 0.5, unit: "", description: "forward-bias depletion capacitance coefficient" },
  { name: "TF", default: 0, unit: "s", description: "ideal forward transit time" },
  { name: "XTF", default: 0, unit: "", description: "TF bias-dependence coefficient" },
  { name: "VTF", default: Infinity, unit: "V", description: "TF dependence on VBC" },
  { name: "ITF", default: 0, unit: "A", description: "TF high-current parameter" },
  { name: "TR", default: 0, unit: "s", description: "ideal reverse transit time" },
];

/** Accepted and without effect here (temperature at TNOM, noise, unsupported refinements). */
export const BJT_IGNORED = ["XTI", "EG", "XTB", "TNOM", "KF", "AF", "PTF", "IRB", "RBM", "CJS", "VJS", "MJS", "ISS", "NS", "NK"];

interface BjtConstants {
  polarity: 1 | -1;
  isat: number;
  bf: number;
  br: number;
  vtf: number; // NF·VT
  vtr: number; // NR·VT
  invVaf: number;
  invVar: number;
  invIkf: number;
  invIkr: number;
  ise: number;
  vte: number;
  isc: number;
  vtc: number;
  gx: number;
  gc: number;
  ge: number;
  vcrit: number;
  cje: number; vje: number; mje: number;
  cjcInternal: number; cjcExternal: number; vjc: number; mjc: number;
  fc: number;
  tf: number; xtf: number; invVtf144: number; itf: number;
  tr: number;
}

export function bjtConstants(el: BjtElement): BjtConstants {
  const p = resolveParams(el.model, BJT_PARAMS);
  const area = el.area ?? 1;
  const isat = param(p, "IS") * area;
  const rb = param(p, "RB") / area;
  const rc = param(p, "RC") / area;
  const re = param(p, "RE") / area;
  const cjc = param(p, "CJC") * area;
  const xcjc = Math.min(1, Math.max(0, param(p, "XCJC")));
  const vtfParam = param(p, "VTF");
  return {
    polarity: el.model.type === "PNP" ? -1 : 1,
    isat,
    bf: param(p, "BF"),
    br: param(p, "BR"),
    vtf: param(p, "NF") * THERMAL_VOLTAGE,
    vtr: param(p, "NR") * THERMAL_VOLTAGE,
    invVaf: inverseOrZero(param(p, "VAF")),
    invVar: inverseOrZero(param(p, "VAR")),
    invIkf: inverseOrZero(param(p, "IKF") * area),
    invIkr: inverseOrZero(param(p, "IKR") * area),
    ise: param(p, "ISE") * area,
    vte: param(p, "NE") * THERMAL_VOLTAGE,
    isc: param(p, "ISC") * area,
    vtc: param(p, "NC") * THERMAL_VOLTAGE,
    gx: rb > 0 ? 1 / rb : 0,
    gc: rc > 0 ? 1 / rc : 0,
    ge: re > 0 ? 1 / re : 0,
    vcrit: criticalVoltage(isat, THERMAL_VOLTAGE),
    cje: param(p, "CJE") * area,
    vje: param(p, "VJE"),
    mje: param(p, "MJE"),
    cjcInternal: cjc * xcjc,
    cjcExternal: cjc * (1 - xcjc),
    vjc: param(p, "VJC"),
    mjc: param(p, "MJC"),
    fc: param(p, "FC"),
    tf: param(p, "TF"),
    xtf: param(p, "XTF"),
    invVtf144: vtfParam === 0 || !Number.isFinite(vtfParam) ? 0 : 1 / (1.44 * vtfParam),
    itf: param(p, "ITF") * area,
    tr: param(p, "TR"),
  };
}

/** Everything the load computed, kept for the AC stamp and the report. */
interface BjtState {
  vbe: number;
  vbc: number;
  /** External base to internal collector, for the part of CJC outside RB. */
  vbx: number;
  cc: number;
  cb: number;
  gpi: number;
  gmu: number;
  gm: number;
  go: number;
  /** Forward transport current and its derivatives, for the charge terms. */
  cbeIdeal: number;
  gbeIdeal: number;
  cbcIdeal: number;
  gbcIdeal: number;
  qb: number;
  dqbdve: number;
  dqbdvc: number;
}

interface BjtCapacitances { capbe: number; capbc: number; capbx: number; geqcb: number }

function evaluate(k: BjtConstants, vbe: number, vbc: number, gmin: number, s: BjtState, j: CurrentAndSlope): void {
  junctionCurrent(vbe, k.isat, k.vtf, j);
  const cbe = j.i, gbe = j.g;
  junctionCurrent(vbe, k.ise, k.vte, j);
  const cben = j.i + gmin * vbe, gben = j.g + gmin;
  junctionCurrent(vbc, k.isat, k.vtr, j);
  const cbc = j.i, gbc = j.g;
  junctionCurrent(vbc, k.isc, k.vtc, j);
  const cbcn = j.i + gmin * vbc, gbcn = j.g + gmin;

  // Normalised base charge: Early effect through q1, high injection through q2.
  const q1 = 1 / (1 - k.invVaf * vbc - k.invVar * vbe);
  let qb: number, dqbdve: number, dqbdvc: number;
  if (k.invIkf === 0 && k.invIkr === 0) {
    qb = q1;
    dqbdve = q1 * qb * k.invVar;
    dqbdvc = q1 * qb * k.invVaf;
  } else {
    const q2 = k.invIkf * cbe + k.invIkr * cbc;
    const arg = Math.max(0, 1 + 4 * q2);
    const sqarg = arg !== 0 ? Math.sqrt(arg) : 1;
    qb = (q1 * (1 + sqarg)) / 2;
    dqbdve = q1 * (qb * k.invVar + (k.invIkf * gbe) / sqarg);
    dqbdvc = q1 * (qb * k.invVaf + (k.invIkr * gbc) / sqarg);
  }

  s.vbe = vbe;
  s.vbc = vbc;
  s.cc = (cbe - cbc) / qb - cbc / k.br - cbcn;
  s.cb = cbe / k.bf + cben + cbc / k.br + cbcn;
  s.gpi = gbe / k.bf + gben;
  s.gmu = gbc / k.br + gbcn;
  s.go = (gbc + ((cbe - cbc) * dqbdvc) / qb) / qb;
  s.gm = (gbe - ((cbe - cbc) * dqbdve) / qb) / qb - s.go;
  s.cbeIdeal = cbe;
  s.gbeIdeal = gbe;
  s.cbcIdeal = cbc;
  s.gbcIdeal = gbc;
  s.qb = qb;
  s.dqbdve = dqbdve;
  s.dqbdvc = dqbdvc;
}

/** Junction and diffusion capacitances at the stored operating point (SPICE's charge model). */
function capacitances(k: BjtConstants, s: BjtState, vbx: number): BjtCapacitances {
  let diffBe = 0;
  let geqcb = 0;
  if (k.tf !== 0 && s.vbe > 0) {
    let argtf = 0, arg2 = 0, arg3 = 0;
    if (k.xtf !== 0) {
      argtf = k.xtf;
      if (k.invVtf144 !== 0) argtf *= Math.exp(s.vbc * k.invVtf144);
      arg2 = argtf;
      if (k.itf !== 0) {
        const temp = s.cbeIdeal / (s.cbeIdeal + k.itf);
        argtf *= temp * temp;
        arg2 = argtf * (3 - temp - temp);
      }
      arg3 = s.cbeIdeal * argtf * k.invVtf144;
    }
    const cbeq = (s.cbeIdeal * (1 + argtf)) / s.qb;
    const gbeq = (s.gbeIdeal * (1 + arg2) - cbeq * s.dqbdve) / s.qb;
    geqcb = (k.tf * (arg3 - cbeq * s.dqbdvc)) / s.qb;
    diffBe = k.tf * gbeq;
  } else {
    diffBe = k.tf * s.gbeIdeal;
  }
  return {
    capbe: diffBe + depletionCapacitance(s.vbe, k.cje, k.vje, k.mje, k.fc),
    capbc: k.tr * s.gbcIdeal + depletionCapacitance(s.vbc, k.cjcInternal, k.vjc, k.mjc, k.fc),
    capbx: depletionCapacitance(vbx, k.cjcExternal, k.vjc, k.mjc, k.fc),
    geqcb,
  };
}

/** Junction forward bias that counts as "conducting" for the region label. */
const ON_CURRENT = 100e-9;
/** Saturation: forward B-C transport current above this fraction of the B-E one (VCE ≲ 0.24 V). */
const SATURATION_RATIO = 1e-4;

function region(s: BjtState, area: number): BjtRegion {
  const beOn = s.cbeIdeal > ON_CURRENT * area;
  const bcOn = s.cbcIdeal > ON_CURRENT * area;
  if (beOn && s.cbcIdeal > SATURATION_RATIO * s.cbeIdeal && s.vbc > 0) return "saturation";
  if (beOn) return "active";
  if (bcOn) return "reverse";
  return "cut-off";
}

export function bjtDevice(el: BjtElement, unknowns: UnknownMap, memo?: ElaborationMemo): Device {
  const k = memo ? memo.derived(BJT_PARAMS, el.model, el.area ?? 1, () => bjtConstants(el)) : bjtConstants(el);
  const c = unknowns.node(el.c);
  const b = unknowns.node(el.b);
  const e = unknowns.node(el.e);
  const cp: Unknown = k.gc > 0 ? unknowns.internalNode(el.name, "collector") : c;
  const bp: Unknown = k.gx > 0 ? unknowns.internalNode(el.name, "base") : b;
  const ep: Unknown = k.ge > 0 ? unknowns.internalNode(el.name, "emitter") : e;
  const t = k.polarity;
  const scratch: CurrentAndSlope = { i: 0, g: 0 };
  const s: BjtState = {
    vbe: 0, vbc: 0, vbx: 0, cc: 0, cb: 0, gpi: 0, gmu: 0, gm: 0, go: 0,
    cbeIdeal: 0, gbeIdeal: 0, cbcIdeal: 0, gbcIdeal: 0, qb: 1, dqbdve: 0, dqbdvc: 0,
  };
  // Capacitances depend only on the operating point: computed once per AC sweep, not per frequency.
  let caps: BjtCapacitances | null = null;

  const stampOhmic = (stamp: RealStamp): void => {
    if (k.gc > 0) stamp.conductance(c, cp, k.gc);
    if (k.gx > 0) stamp.conductance(b, bp, k.gx);
    if (k.ge > 0) stamp.conductance(e, ep, k.ge);
  };
  const stampOhmicAc = (stamp: ComplexStamp): void => {
    if (k.gc > 0) stamp.admittance(c, cp, k.gc, 0);
    if (k.gx > 0) stamp.admittance(b, bp, k.gx, 0);
    if (k.ge > 0) stamp.admittance(e, ep, k.ge, 0);
  };

  return {
    name: el.name,
    active: true,
    nodes: [c, b, e],
    acAffine: true,
    loadDc(x, stamp, ctx: DcLoadContext) {
      let vbe: number, vbc: number;
      if (ctx.mode === "init-junction") {
        vbe = k.vcrit;
        vbc = 0;
      } else {
        vbe = t * (voltageOf(x, bp) - voltageOf(x, ep));
        vbc = t * (voltageOf(x, bp) - voltageOf(x, cp));
        if (ctx.mode === "normal") {
          vbe = pnjlim(vbe, s.vbe, THERMAL_VOLTAGE, k.vcrit, ctx);
          vbc = pnjlim(vbc, s.vbc, THERMAL_VOLTAGE, k.vcrit, ctx);
        }
      }
      s.vbx = t * (voltageOf(x, b) - voltageOf(x, cp));
      evaluate(k, vbe, vbc, ctx.gmin, s, scratch);
      caps = null;
      stampOhmic(stamp);
      // Collector transport current c'→e' and base current b'→e', each linearised in the
      // internal junction voltages (real node differences are polarity × vbe, polarity × vbc).
      const dccDvbe = s.gm + s.go;
      const dccDvbc = -(s.go + s.gmu);
      stamp.transconductance(cp, ep, bp, ep, dccDvbe);
      stamp.transconductance(cp, ep, bp, cp, dccDvbc);
      stamp.current(cp, ep, t * (s.cc - dccDvbe * vbe - dccDvbc * vbc));
      stamp.transconductance(bp, ep, bp, ep, s.gpi);
      stamp.transconductance(bp, ep, bp, cp, s.gmu);
      stamp.current(bp, ep, t * (s.cb - s.gpi * vbe - s.gmu * vbc));
    },
    converged(x) {
      const dvbe = t * (voltageOf(x, bp) - voltageOf(x, ep)) - s.vbe;
      const dvbc = t * (voltageOf(x, bp) - voltageOf(x, cp)) - s.vbc;
      const ccHat = s.cc + (s.gm + s.go) * dvbe - (s.go + s.gmu) * dvbc;
      const cbHat = s.cb + s.gpi * dvbe + s.gmu * dvbc;
      return currentSettled(ccHat, s.cc) && currentSettled(cbHat, s.cb);
    },
    loadAc(stamp, ctx) {
      const w = ctx.omega;
      const cap = (caps ??= capacitances(k, s, s.vbx));
      stampOhmicAc(stamp);
      stamp.transadmittance(cp, ep, bp, ep, s.gm + s.go, 0);
      stamp.transadmittance(cp, ep, bp, cp, -(s.go + s.gmu), 0);
      stamp.transadmittance(bp, ep, bp, ep, s.gpi, 0);
      stamp.transadmittance(bp, ep, bp, cp, s.gmu, 0);
      stamp.admittance(bp, ep, 0, w * cap.capbe);
      stamp.admittance(bp, cp, 0, w * cap.capbc);
      if (cap.capbx !== 0) stamp.admittance(b, cp, 0, w * cap.capbx);
      // TF's dependence on VBC: a B'-E' charge controlled by V(B') − V(C').
      if (cap.geqcb !== 0) stamp.transadmittance(bp, ep, bp, cp, 0, w * cap.geqcb);
    },
    report(x): BjtOperatingPoint {
      const vc = voltageOf(x, c), vb = voltageOf(x, b), ve = voltageOf(x, e);
      const icIn = t * s.cc;
      const ibIn = t * s.cb;
      const cap = (caps ??= capacitances(k, s, s.vbx));
      return {
        kind: "bjt",
        type: t === 1 ? "npn" : "pnp",
        region: region(s, el.area ?? 1),
        vbe: t * (vb - ve),
        vce: t * (vc - ve),
        vcb: t * (vc - vb),
        ic: s.cc,
        ib: s.cb,
        ie: s.cc + s.cb,
        power: vc * icIn + vb * ibIn - ve * (icIn + ibIn),
        gm: s.gm,
        gpi: s.gpi,
        gmu: s.gmu,
        go: s.go,
        gx: k.gx,
        cpi: cap.capbe,
        cmu: cap.capbc,
        vbeInternal: s.vbe,
        vbcInternal: s.vbc,
      };
    },
  };
}
