// Junction FET, Shichman–Hodges model as in Berkeley SPICE: ID = BETA·(VGS − VTO)²·(1 + λ·VDS)
// in saturation (so IDSS = BETA·VTO²), the triode parabola below VDS = VGS − VTO, source/drain
// exchange for VDS < 0, gate-source and gate-drain junction diodes (IS, N), ohmic RD/RS, and
// depletion capacitances CGS/CGD with PB, M and FC.
// Not modelled: ngspice's doping-tail parameter B (taken at its default 1, i.e. pure
// Shichman–Hodges), recombination current ISR/NR, temperature coefficients.
// N and M are honoured as cards written for other SPICE dialects use them; ngspice's level-1 JFET has neither
// (ideal gate diodes, grading fixed at 0.5), so they match ngspice when left at their defaults.

import { currentSettled, type Device, type ElaborationMemo } from "../device.js";
import type { UnknownMap } from "../mna.js";
import type { JfetElement } from "../netlist.js";
import { voltageOf, type Unknown } from "../stamp.js";
import type { FetRegion, JfetOperatingPoint } from "../types.js";
import {
  THERMAL_VOLTAGE,
  criticalVoltage,
  depletionCapacitance,
  fetlim,
  junctionCurrent,
  pnjlim,
  type CurrentAndSlope,
} from "./junction.js";
import { param, resolveParams, type ParamSpec } from "./params.js";

export const JFET_PARAMS: readonly ParamSpec[] = [
  { name: "VTO", default: -2, unit: "V", description: "threshold (pinch-off) voltage" },
  { name: "BETA", default: 1e-4, unit: "A/V²", description: "transconductance parameter (IDSS = BETA·VTO²)" },
  { name: "LAMBDA", default: 0, unit: "1/V", description: "channel-length modulation" },
  { name: "RD", default: 0, unit: "Ω", description: "drain ohmic resistance" },
  { name: "RS", default: 0, unit: "Ω", description: "source ohmic resistance" },
  { name: "CGS", default: 0, unit: "F", description: "zero-bias gate-source junction capacitance" },
  { name: "CGD", default: 0, unit: "F", description: "zero-bias gate-drain junction capacitance" },
  { name: "PB", default: 1, unit: "V", description: "gate junction potential" },
  { name: "IS", default: 1e-14, unit: "A", description: "gate junction saturation current" },
  { name: "N", default: 1, unit: "", description: "gate junction emission coefficient" },
  { name: "FC", default: 0.5, unit: "", description: "forward-bias depletion capacitance coefficient" },
  { name: "M", default: 0.5, unit: "", description: "gate junction grading coefficient" },
];

export const JFET_IGNORED = ["B", "ISR", "NR", "ALPHA", "VK", "VTOTC", "BETATCE", "XTI", "KF", "AF", "TNOM"];

interface JfetConstants {
  polarity: 1 | -1;
  vto: number;
  beta: number;
  lambda: number;
  gd: number;
  gs: number;
  isat: number;
  vtGate: number;
  vcrit: number;
  cgs: number;
  cgd: number;
  pb: number;
  m: number;
  fc: number;
}

export function jfetConstants(el: JfetElement): JfetConstants {
  const p = resolveParams(el.model, JFET_PARAMS);
  const area = el.area ?? 1;
  const rd = param(p, "RD") / area;
  const rs = param(p, "RS") / area;
  const isat = param(p, "IS") * area;
  const vtGate = param(p, "N") * THERMAL_VOLTAGE;
  return {
    polarity: el.model.type === "PJF" ? -1 : 1,
    vto: param(p, "VTO"),
    beta: param(p, "BETA") * area,
    lambda: param(p, "LAMBDA"),
    gd: rd > 0 ? 1 / rd : 0,
    gs: rs > 0 ? 1 / rs : 0,
    isat,
    vtGate,
    vcrit: criticalVoltage(isat, THERMAL_VOLTAGE),
    cgs: param(p, "CGS") * area,
    cgd: param(p, "CGD") * area,
    pb: param(p, "PB"),
    m: param(p, "M"),
    fc: param(p, "FC"),
  };
}

interface JfetState {
  vgs: number;
  vgd: number;
  /** Channel current d'→s' (polarity-normalised) and its partials in vgs and vds. */
  ids: number;
  gm: number;
  gds: number;
  cgsDiode: number;
  ggs: number;
  cgdDiode: number;
  ggd: number;
}

function channel(k: JfetConstants, vgs: number, vgd: number, s: JfetState): void {
  const vds = vgs - vgd;
  if (vds >= 0) {
    const vgst = vgs - k.vto;
    if (vgst <= 0) {
      s.ids = 0; s.gm = 0; s.gds = 0;
    } else {
      const betap = k.beta * (1 + k.lambda * vds);
      const twob = betap + betap;
      if (vgst <= vds) {
        s.ids = betap * vgst * vgst;
        s.gm = twob * vgst;
        s.gds = k.lambda * k.beta * vgst * vgst;
      } else {
        s.ids = betap * vds * (vgst + vgst - vds);
        s.gm = twob * vds;
        s.gds = twob * (vgst - vds) + k.lambda * k.beta * vds * (vgst + vgst - vds);
      }
    }
  } else {
    // Drain and source exchange roles; partials stay with respect to vgs and vds.
    const vgdt = vgd - k.vto;
    if (vgdt <= 0) {
      s.ids = 0; s.gm = 0; s.gds = 0;
    } else {
      const betap = k.beta * (1 - k.lambda * vds);
      const twob = betap + betap;
      if (vgdt <= -vds) {
        s.ids = -betap * vgdt * vgdt;
        s.gm = -twob * vgdt;
        s.gds = k.beta * k.lambda * vgdt * vgdt - s.gm;
      } else {
        s.ids = betap * vds * (vgdt + vgdt + vds);
        s.gm = twob * vds;
        s.gds = twob * vgdt - k.beta * k.lambda * vds * (vgdt + vgdt + vds);
      }
    }
  }
}

function jfetRegion(k: JfetConstants, vgs: number, vgd: number): FetRegion {
  const vds = vgs - vgd;
  const vgst = (vds >= 0 ? vgs : vgd) - k.vto;
  if (vgst <= 0) return "cut-off";
  return vgst <= Math.abs(vds) ? "saturation" : "triode";
}

export function jfetDevice(el: JfetElement, unknowns: UnknownMap, memo?: ElaborationMemo): Device {
  const k = memo ? memo.derived(JFET_PARAMS, el.model, el.area ?? 1, () => jfetConstants(el)) : jfetConstants(el);
  const d = unknowns.node(el.d);
  const g = unknowns.node(el.g);
  const src = unknowns.node(el.s);
  const dp: Unknown = k.gd > 0 ? unknowns.internalNode(el.name, "drain") : d;
  const sp: Unknown = k.gs > 0 ? unknowns.internalNode(el.name, "source") : src;
  const t = k.polarity;
  const j: CurrentAndSlope = { i: 0, g: 0 };
  const s: JfetState = { vgs: 0, vgd: 0, ids: 0, gm: 0, gds: 0, cgsDiode: 0, ggs: 0, cgdDiode: 0, ggd: 0 };
  // Gate capacitances at the operating point, computed once per AC sweep.
  let caps: { cgs: number; cgd: number } | null = null;
  const capacitances = (): { cgs: number; cgd: number } =>
    (caps ??= { cgs: depletionCapacitance(s.vgs, k.cgs, k.pb, k.m, k.fc), cgd: depletionCapacitance(s.vgd, k.cgd, k.pb, k.m, k.fc) });

  return {
    name: el.name,
    active: true,
    nodes: [d, g, src],
    acAffine: true,
    loadDc(x, stamp, ctx) {
      let vgs: number, vgd: number;
      if (ctx.mode === "init-junction") {
        vgs = -1;
        vgd = -1;
      } else {
        vgs = t * (voltageOf(x, g) - voltageOf(x, sp));
        vgd = t * (voltageOf(x, g) - voltageOf(x, dp));
        if (ctx.mode === "normal") {
          vgs = pnjlim(vgs, s.vgs, THERMAL_VOLTAGE, k.vcrit, ctx);
          vgd = pnjlim(vgd, s.vgd, THERMAL_VOLTAGE, k.vcrit, ctx);
          const vgsLimited = fetlim(vgs, s.vgs, k.vto);
          const vgdLimited = fetlim(vgd, s.vgd, k.vto);
          if (vgsLimited !== vgs || vgdLimited !== vgd) ctx.limited = true;
          vgs = vgsLimited;
          vgd = vgdLimited;
        }
      }
      s.vgs = vgs;
      s.vgd = vgd;
      caps = null;
      junctionCurrent(vgs, k.isat, k.vtGate, j);
      s.cgsDiode = j.i + ctx.gmin * vgs;
      s.ggs = j.g + ctx.gmin;
      junctionCurrent(vgd, k.isat, k.vtGate, j);
      s.cgdDiode = j.i + ctx.gmin * vgd;
      s.ggd = j.g + ctx.gmin;
      channel(k, vgs, vgd, s);
      const vds = vgs - vgd;

      if (k.gd > 0) stamp.conductance(d, dp, k.gd);
      if (k.gs > 0) stamp.conductance(src, sp, k.gs);
      // Gate diodes g→s' and g→d'.
      stamp.conductance(g, sp, s.ggs);
      stamp.current(g, sp, t * (s.cgsDiode - s.ggs * vgs));
      stamp.conductance(g, dp, s.ggd);
      stamp.current(g, dp, t * (s.cgdDiode - s.ggd * vgd));
      // Channel d'→s' as a function of vgs and vds.
      stamp.transconductance(dp, sp, g, sp, s.gm);
      stamp.transconductance(dp, sp, dp, sp, s.gds);
      stamp.current(dp, sp, t * (s.ids - s.gm * vgs - s.gds * vds));
    },
    converged(x) {
      const dvgs = t * (voltageOf(x, g) - voltageOf(x, sp)) - s.vgs;
      const dvgd = t * (voltageOf(x, g) - voltageOf(x, dp)) - s.vgd;
      const cg = s.cgsDiode + s.cgdDiode;
      const cd = s.ids - s.cgdDiode;
      const cgHat = cg + s.ggs * dvgs + s.ggd * dvgd;
      const cdHat = cd + s.gm * dvgs + s.gds * (dvgs - dvgd) - s.ggd * dvgd;
      return currentSettled(cgHat, cg) && currentSettled(cdHat, cd);
    },
    loadAc(stamp, ctx) {
      const w = ctx.omega;
      if (k.gd > 0) stamp.admittance(d, dp, k.gd, 0);
      if (k.gs > 0) stamp.admittance(src, sp, k.gs, 0);
      const c = capacitances();
      stamp.admittance(g, sp, s.ggs, w * c.cgs);
      stamp.admittance(g, dp, s.ggd, w * c.cgd);
      stamp.transadmittance(dp, sp, g, sp, s.gm, 0);
      stamp.transadmittance(dp, sp, dp, sp, s.gds, 0);
    },
    report(x): JfetOperatingPoint {
      const vd = voltageOf(x, d), vg = voltageOf(x, g), vs = voltageOf(x, src);
      // Practitioner-sign terminal currents (n-channel sense).
      const id = s.ids - s.cgdDiode;
      const ig = s.cgsDiode + s.cgdDiode;
      return {
        kind: "jfet",
        type: t === 1 ? "njfet" : "pjfet",
        region: jfetRegion(k, s.vgs, s.vgd),
        vgs: t * (vg - vs),
        vds: t * (vd - vs),
        id,
        ig,
        power: t * (vd * id + vg * ig - vs * (id + ig)),
        gm: s.gm,
        gds: s.gds,
        cgs: capacitances().cgs,
        cgd: capacitances().cgd,
      };
    },
  };
}
