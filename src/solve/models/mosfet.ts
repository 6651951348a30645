// MOSFET, Shichman–Hodges level 1 as in Berkeley SPICE: ID = (KP/2)(W/Leff)(VGS − VTH)²(1 + λ·VDS)
// in saturation, triode below VDS = VGS − VTH, body effect VTH = VTO + γ(√(φ − VBS) − √φ), source/
// drain exchange for VDS < 0, bulk junction diodes (IS), ohmic RD/RS, overlap capacitances
// CGSO/CGDO (per metre of W) and CGBO (per metre of L), zero-bias bulk junction capacitances
// CBD/CBS with PB/MJ/FC, and Meyer's gate capacitances when TOX is given.
// W and L default to 100 µm each, as in ngspice, so W/L = 1 unless given. Not modelled: area/
// perimeter junction capacitances (CJ, CJSW need AD/AS/PD/PS), RSH, process-derived parameters
// (KP from UO/TOX, VTO from NSUB), temperature coefficients.

import { currentSettled, type Device, type ElaborationMemo } from "../device.js";
import type { UnknownMap } from "../mna.js";
import type { MosfetElement } from "../netlist.js";
import { voltageOf, type Unknown } from "../stamp.js";
import type { FetRegion, MosfetOperatingPoint } from "../types.js";
import { THERMAL_VOLTAGE, criticalVoltage, depletionCapacitance, fetlim, limvds, pnjlim } from "./junction.js";
import { isGiven, param, resolveParams, type ParamSpec } from "./params.js";

export const MOSFET_PARAMS: readonly ParamSpec[] = [
  { name: "VTO", default: 0, unit: "V", description: "zero-bias threshold voltage" },
  { name: "KP", default: 2e-5, unit: "A/V²", description: "transconductance parameter" },
  { name: "GAMMA", default: 0, unit: "√V", description: "body-effect coefficient" },
  { name: "PHI", default: 0.6, unit: "V", description: "surface potential" },
  { name: "LAMBDA", default: 0, unit: "1/V", description: "channel-length modulation" },
  { name: "RD", default: 0, unit: "Ω", description: "drain ohmic resistance" },
  { name: "RS", default: 0, unit: "Ω", description: "source ohmic resistance" },
  { name: "CBD", default: 0, unit: "F", description: "zero-bias bulk-drain junction capacitance" },
  { name: "CBS", default: 0, unit: "F", description: "zero-bias bulk-source junction capacitance" },
  { name: "IS", default: 1e-14, unit: "A", description: "bulk junction saturation current" },
  { name: "PB", default: 0.8, unit: "V", description: "bulk junction potential" },
  { name: "MJ", default: 0.5, unit: "", description: "bulk junction grading coefficient" },
  { name: "FC", default: 0.5, unit: "", description: "forward-bias depletion capacitance coefficient" },
  { name: "CGSO", default: 0, unit: "F/m", description: "gate-source overlap capacitance per metre of W" },
  { name: "CGDO", default: 0, unit: "F/m", description: "gate-drain overlap capacitance per metre of W" },
  { name: "CGBO", default: 0, unit: "F/m", description: "gate-bulk overlap capacitance per metre of L" },
  { name: "TOX", default: NaN, unit: "m", description: "oxide thickness (enables Meyer gate capacitance)" },
  { name: "LD", default: 0, unit: "m", description: "lateral diffusion" },
];

export const MOSFET_IGNORED = ["RSH", "CJ", "CJSW", "MJSW", "JS", "UO", "NSUB", "NSS", "TPG", "KF", "AF", "TNOM", "XJ"];

/** ngspice's default channel width and length (`.options defw defl`). */
export const DEFAULT_CHANNEL_SIZE = 100e-6;
const OXIDE_PERMITTIVITY = 3.9 * 8.854214871e-12;

interface MosConstants {
  polarity: 1 | -1;
  vto: number;
  beta: number;
  gamma: number;
  phi: number;
  lambda: number;
  gd: number;
  gs: number;
  isat: number;
  vcrit: number;
  cbd: number;
  cbs: number;
  pb: number;
  mj: number;
  fc: number;
  overlapGs: number;
  overlapGd: number;
  overlapGb: number;
  oxideCap: number;
}

export function mosfetConstants(el: MosfetElement): MosConstants {
  const p = resolveParams(el.model, MOSFET_PARAMS);
  const w = el.w ?? DEFAULT_CHANNEL_SIZE;
  const l = el.l ?? DEFAULT_CHANNEL_SIZE;
  const leff = l - 2 * param(p, "LD");
  const rd = param(p, "RD");
  const rs = param(p, "RS");
  const isat = param(p, "IS");
  const tox = param(p, "TOX");
  const polarity = el.model.type === "PMOS" ? -1 : 1;
  return {
    polarity,
    // Polarity-normalised: a PMOS card's VTO = −2 V means it turns on 2 V "forward".
    vto: polarity * param(p, "VTO"),
    beta: (param(p, "KP") * w) / leff,
    gamma: param(p, "GAMMA"),
    phi: param(p, "PHI"),
    lambda: param(p, "LAMBDA"),
    gd: rd > 0 ? 1 / rd : 0,
    gs: rs > 0 ? 1 / rs : 0,
    isat,
    vcrit: criticalVoltage(isat, THERMAL_VOLTAGE),
    cbd: param(p, "CBD"),
    cbs: param(p, "CBS"),
    pb: param(p, "PB"),
    mj: param(p, "MJ"),
    fc: param(p, "FC"),
    overlapGs: param(p, "CGSO") * w,
    overlapGd: param(p, "CGDO") * w,
    overlapGb: param(p, "CGBO") * leff,
    oxideCap: isGiven(el.model, "TOX") && tox > 0 ? (OXIDE_PERMITTIVITY / tox) * w * leff : 0,
  };
}

interface MosState {
  vgs: number;
  vds: number;
  vbs: number;
  /** +1 normal, −1 when drain and source have exchanged roles (vds < 0). */
  mode: 1 | -1;
  von: number;
  vdsat: number;
  cdrain: number;
  gm: number;
  gds: number;
  gmbs: number;
  cbs: number;
  gbs: number;
  cbd: number;
  gbd: number;
}

/** Bulk junction: SPICE level 1 uses a plain linear leakage in reverse bias. */
function bulkJunction(v: number, isat: number, gmin: number): [number, number] {
  if (v <= 0) {
    const g = isat / THERMAL_VOLTAGE;
    return [g * v + gmin * v, g + gmin];
  }
  const e = Math.exp(Math.min(v / THERMAL_VOLTAGE, 700));
  return [isat * (e - 1) + gmin * v, (isat * e) / THERMAL_VOLTAGE + gmin];
}

function drainCurrent(k: MosConstants, s: MosState): void {
  const normal = s.mode === 1;
  const vbsx = normal ? s.vbs : s.vbs - s.vds; // vbd in reverse mode
  const vgsx = normal ? s.vgs : s.vgs - s.vds; // vgd in reverse mode
  const vdsx = s.vds * s.mode;
  let sarg: number;
  if (vbsx <= 0) {
    sarg = Math.sqrt(k.phi - vbsx);
  } else {
    sarg = Math.sqrt(k.phi);
    sarg = Math.max(0, sarg - vbsx / (sarg + sarg));
  }
  const von = k.vto + k.gamma * (sarg - Math.sqrt(k.phi));
  const vgst = vgsx - von;
  s.von = von;
  s.vdsat = Math.max(vgst, 0);
  const arg = sarg <= 0 ? 0 : k.gamma / (sarg + sarg);
  if (vgst <= 0) {
    s.cdrain = 0; s.gm = 0; s.gds = 0; s.gmbs = 0;
    return;
  }
  const betap = k.beta * (1 + k.lambda * vdsx);
  if (vgst <= vdsx) {
    s.cdrain = betap * vgst * vgst * 0.5;
    s.gm = betap * vgst;
    s.gds = k.lambda * k.beta * vgst * vgst * 0.5;
  } else {
    s.cdrain = betap * vdsx * (vgst - 0.5 * vdsx);
    s.gm = betap * vdsx;
    s.gds = betap * (vgst - vdsx) + k.lambda * k.beta * vdsx * (vgst - 0.5 * vdsx);
  }
  s.gmbs = s.gm * arg;
}

interface MeyerCaps { cgs: number; cgd: number; cgb: number }

/** Meyer's gate capacitances (full values, i.e. twice SPICE's stored halves) plus overlaps. */
function gateCapacitances(k: MosConstants, s: MosState): MeyerCaps {
  let cgs = 0, cgd = 0, cgb = 0;
  if (k.oxideCap > 0) {
    const cox = k.oxideCap;
    const normal = s.mode === 1;
    const vgsx = normal ? s.vgs : s.vgs - s.vds;
    const vdsx = s.vds * s.mode;
    const vgst = vgsx - s.von;
    const vdsat = Math.max(s.vdsat, 1e-12);
    const phi = k.phi;
    if (vgst <= -phi) {
      cgb = cox / 2;
    } else if (vgst <= -phi / 2) {
      cgb = (-vgst * cox) / (2 * phi);
    } else if (vgst <= 0) {
      cgb = (-vgst * cox) / (2 * phi);
      cgs = (vgst * cox) / (1.5 * phi) + cox / 3;
    } else if (vdsat <= vdsx) {
      cgs = cox / 3;
    } else {
      const vddif = 2 * vdsat - vdsx;
      const vddif1 = vdsat - vdsx;
      const vddif2 = vddif * vddif;
      cgd = (cox * (1 - (vdsat * vdsat) / vddif2)) / 3;
      cgs = (cox * (1 - (vddif1 * vddif1) / vddif2)) / 3;
    }
    cgs *= 2; cgd *= 2; cgb *= 2;
    if (!normal) [cgs, cgd] = [cgd, cgs];
  }
  return { cgs: cgs + k.overlapGs, cgd: cgd + k.overlapGd, cgb: cgb + k.overlapGb };
}

function mosRegion(s: MosState): FetRegion {
  const vgsx = s.mode === 1 ? s.vgs : s.vgs - s.vds;
  const vgst = vgsx - s.von;
  if (vgst <= 0) return "cut-off";
  return vgst <= s.vds * s.mode ? "saturation" : "triode";
}

export function mosfetDevice(el: MosfetElement, unknowns: UnknownMap, memo?: ElaborationMemo): Device {
  const k = memo ? memo.derived(MOSFET_PARAMS, el.model, `${el.w ?? DEFAULT_CHANNEL_SIZE}:${el.l ?? DEFAULT_CHANNEL_SIZE}`, () => mosfetConstants(el)) : mosfetConstants(el);
  const d = unknowns.node(el.d);
  const g = unknowns.node(el.g);
  const src = unknowns.node(el.s);
  const b = unknowns.node(el.b);
  const dp: Unknown = k.gd > 0 ? unknowns.internalNode(el.name, "drain") : d;
  const sp: Unknown = k.gs > 0 ? unknowns.internalNode(el.name, "source") : src;
  const t = k.polarity;
  const s: MosState = {
    vgs: 0, vds: 0, vbs: 0, mode: 1, von: k.vto, vdsat: 0,
    cdrain: 0, gm: 0, gds: 0, gmbs: 0, cbs: 0, gbs: 0, cbd: 0, gbd: 0,
  };
  // Capacitances at the operating point, computed once per AC sweep.
  let caps: (MeyerCaps & { cbs: number; cbd: number }) | null = null;
  const capacitances = (): MeyerCaps & { cbs: number; cbd: number } =>
    (caps ??= {
      ...gateCapacitances(k, s),
      cbs: depletionCapacitance(s.vbs, k.cbs, k.pb, k.mj, k.fc),
      cbd: depletionCapacitance(s.vbs - s.vds, k.cbd, k.pb, k.mj, k.fc),
    });

  return {
    name: el.name,
    active: true,
    nodes: [d, g, src, b],
    acAffine: true,
    loadDc(x, stamp, ctx) {
      let vgs: number, vds: number, vbs: number;
      if (ctx.mode === "init-junction") {
        vbs = -1;
        vgs = k.vto;
        vds = 0;
      } else {
        vgs = t * (voltageOf(x, g) - voltageOf(x, sp));
        vds = t * (voltageOf(x, dp) - voltageOf(x, sp));
        vbs = t * (voltageOf(x, b) - voltageOf(x, sp));
        if (ctx.mode === "normal") {
          // Limit the gate step on whichever terminal acts as source, then the drain step.
          // Compare each limiter's own input and output: recombining vgs = vgd + vds would
          // differ by rounding and look like a limited step forever.
          const vgd = vgs - vds;
          const vgdOld = s.vgs - s.vds;
          let changed = false;
          if (s.vds >= 0) {
            const g1 = fetlim(vgs, s.vgs, s.von);
            const d0 = g1 - vgd;
            const d1 = limvds(d0, s.vds);
            if (g1 !== vgs || d1 !== d0) {
              changed = true;
              vgs = g1;
              vds = d1;
            }
          } else {
            const g1 = fetlim(vgd, vgdOld, s.von);
            const d0 = -(vgs - g1);
            const d1 = limvds(d0, -s.vds);
            if (g1 !== vgd || d1 !== d0) {
              changed = true;
              vds = -d1;
              vgs = g1 + vds;
            }
          }
          if (changed) ctx.limited = true;
          if (vds >= 0) {
            vbs = pnjlim(vbs, s.vbs, THERMAL_VOLTAGE, k.vcrit, ctx);
          } else {
            const vbd = vbs - vds;
            const limited = pnjlim(vbd, s.vbs - s.vds, THERMAL_VOLTAGE, k.vcrit, ctx);
            if (limited !== vbd) vbs = limited + vds;
          }
        }
      }
      s.vgs = vgs;
      s.vds = vds;
      s.vbs = vbs;
      s.mode = vds >= 0 ? 1 : -1;
      caps = null;
      const vbd = vbs - vds;
      [s.cbs, s.gbs] = bulkJunction(vbs, k.isat, ctx.gmin);
      [s.cbd, s.gbd] = bulkJunction(vbd, k.isat, ctx.gmin);
      drainCurrent(k, s);

      if (k.gd > 0) stamp.conductance(d, dp, k.gd);
      if (k.gs > 0) stamp.conductance(src, sp, k.gs);
      // Bulk diodes b→s' and b→d'.
      stamp.conductance(b, sp, s.gbs);
      stamp.current(b, sp, t * (s.cbs - s.gbs * vbs));
      stamp.conductance(b, dp, s.gbd);
      stamp.current(b, dp, t * (s.cbd - s.gbd * vbd));
      // Channel: current from the effective drain to the effective source, controlled by the
      // gate, drain and bulk voltages relative to the effective source.
      if (s.mode === 1) {
        stamp.transconductance(dp, sp, g, sp, s.gm);
        stamp.transconductance(dp, sp, dp, sp, s.gds);
        stamp.transconductance(dp, sp, b, sp, s.gmbs);
        stamp.current(dp, sp, t * (s.cdrain - s.gm * vgs - s.gds * vds - s.gmbs * vbs));
      } else {
        const vgd = vgs - vds;
        stamp.transconductance(sp, dp, g, dp, s.gm);
        stamp.transconductance(sp, dp, sp, dp, s.gds);
        stamp.transconductance(sp, dp, b, dp, s.gmbs);
        stamp.current(sp, dp, t * (s.cdrain - s.gm * vgd - s.gds * -vds - s.gmbs * vbd));
      }
    },
    converged(x) {
      const vgs = t * (voltageOf(x, g) - voltageOf(x, sp));
      const vds = t * (voltageOf(x, dp) - voltageOf(x, sp));
      const vbs = t * (voltageOf(x, b) - voltageOf(x, sp));
      const dvgs = vgs - s.vgs, dvds = vds - s.vds, dvbs = vbs - s.vbs;
      const dvbd = dvbs - dvds, dvgd = dvgs - dvds;
      const cd = s.mode * s.cdrain - s.cbd;
      const cdHat = s.mode === 1
        ? cd - s.gbd * dvbd + s.gmbs * dvbs + s.gm * dvgs + s.gds * dvds
        : cd - (s.gbd - s.gmbs) * dvbd - s.gm * dvgd + s.gds * dvds;
      const cb = s.cbs + s.cbd;
      const cbHat = cb + s.gbd * dvbd + s.gbs * dvbs;
      return currentSettled(cdHat, cd) && currentSettled(cbHat, cb);
    },
    loadAc(stamp, ctx) {
      const w = ctx.omega;
      const c = capacitances();
      if (k.gd > 0) stamp.admittance(d, dp, k.gd, 0);
      if (k.gs > 0) stamp.admittance(src, sp, k.gs, 0);
      stamp.admittance(b, sp, s.gbs, w * c.cbs);
      stamp.admittance(b, dp, s.gbd, w * c.cbd);
      stamp.admittance(g, sp, 0, w * c.cgs);
      stamp.admittance(g, dp, 0, w * c.cgd);
      stamp.admittance(g, b, 0, w * c.cgb);
      if (s.mode === 1) {
        stamp.transadmittance(dp, sp, g, sp, s.gm, 0);
        stamp.transadmittance(dp, sp, dp, sp, s.gds, 0);
        stamp.transadmittance(dp, sp, b, sp, s.gmbs, 0);
      } else {
        stamp.transadmittance(sp, dp, g, dp, s.gm, 0);
        stamp.transadmittance(sp, dp, sp, dp, s.gds, 0);
        stamp.transadmittance(sp, dp, b, dp, s.gmbs, 0);
      }
    },
    report(x): MosfetOperatingPoint {
      const vd = voltageOf(x, d), vg = voltageOf(x, g), vs = voltageOf(x, src), vb = voltageOf(x, b);
      // Drain pin current (n-channel sense): channel current minus what the bulk-drain diode takes.
      const id = s.mode * s.cdrain - s.cbd;
      const ib = s.cbs + s.cbd;
      const c = capacitances();
      return {
        kind: "mosfet",
        type: t === 1 ? "nmos" : "pmos",
        region: mosRegion(s),
        vgs: t * (vg - vs),
        vds: t * (vd - vs),
        vbs: t * (vb - vs),
        id,
        vth: s.von,
        power: t * (vd * id + vb * ib - vs * (id + ib)),
        gm: s.gm,
        gds: s.gds,
        gmbs: s.gmbs,
        cgs: c.cgs,
        cgd: c.cgd,
        cgb: c.cgb,
      };
    },
  };
}
