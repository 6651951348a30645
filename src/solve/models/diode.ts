// Junction diode, SPICE level 1: Shockley current IS·(exp(V/(N·VT)) − 1) with series RS, reverse
// breakdown at BV (current IBV there, for zeners), depletion capacitance CJO/VJ/M/FC and diffusion
// capacitance TT·gd. Breakdown voltage is adjusted at set-up so the current at −BV is IBV, as
// SPICE does.

import { currentSettled, type DcLoadContext, type Device, type ElaborationMemo } from "../device.js";
import type { UnknownMap } from "../mna.js";
import type { DiodeElement } from "../netlist.js";
import { voltageOf, type Unknown } from "../stamp.js";
import type { DiodeOperatingPoint } from "../types.js";
import {
  THERMAL_VOLTAGE,
  criticalVoltage,
  depletionCapacitance,
  junctionCurrent,
  pnjlim,
  type CurrentAndSlope,
} from "./junction.js";
import { isGiven, param, resolveParams, type ParamSpec } from "./params.js";

export const DIODE_PARAMS: readonly ParamSpec[] = [
  { name: "IS", default: 1e-14, unit: "A", description: "saturation current" },
  { name: "N", default: 1, unit: "", description: "emission coefficient" },
  { name: "RS", default: 0, unit: "Ω", description: "series resistance" },
  { name: "BV", default: Infinity, unit: "V", description: "reverse breakdown voltage" },
  { name: "IBV", default: 1e-3, unit: "A", description: "current at the breakdown voltage" },
  { name: "NBV", default: NaN, unit: "", description: "breakdown emission coefficient (defaults to N)" },
  { name: "CJO", default: 0, unit: "F", description: "zero-bias junction capacitance" },
  { name: "VJ", default: 1, unit: "V", description: "junction potential" },
  { name: "M", default: 0.5, unit: "", description: "grading coefficient" },
  { name: "FC", default: 0.5, unit: "", description: "forward-bias depletion capacitance coefficient" },
  { name: "TT", default: 0, unit: "s", description: "transit time" },
];

/** Temperature-only and noise parameters: harmless at 27 °C small-signal, accepted silently. */
export const DIODE_IGNORED = ["EG", "XTI", "KF", "AF", "TNOM", "IKF", "ISR", "NR"];

interface DiodeConstants {
  isat: number;
  vte: number;
  vteBreakdown: number;
  vcrit: number;
  /** Effective breakdown voltage (positive), Infinity when BV is not given. */
  bv: number;
  gs: number;
  cj0: number;
  vj: number;
  m: number;
  fc: number;
  tt: number;
}

/** SPICE's breakdown knee fit: find xbv so the reverse current at −BV equals IBV. */
function effectiveBreakdown(bv: number, ibv: number, isat: number, vtb: number): number {
  if (ibv < (isat * bv) / vtb) return bv;
  const tol = 1e-3 * ibv;
  let xbv = bv - vtb * Math.log(1 + ibv / isat);
  for (let iter = 0; iter < 25; iter++) {
    xbv = bv - vtb * Math.log(ibv / isat + 1 - xbv / vtb);
    const xcbv = isat * (Math.exp((bv - xbv) / vtb) - 1 + xbv / vtb);
    if (Math.abs(xcbv - ibv) <= tol) break;
  }
  return xbv;
}

export function diodeConstants(el: DiodeElement): DiodeConstants {
  const p = resolveParams(el.model, DIODE_PARAMS);
  const area = el.area ?? 1;
  const isat = param(p, "IS") * area;
  const vte = param(p, "N") * THERMAL_VOLTAGE;
  const nbv = Number.isFinite(param(p, "NBV")) ? param(p, "NBV") : param(p, "N");
  const vteBreakdown = nbv * THERMAL_VOLTAGE;
  const rs = param(p, "RS") / area;
  const bvGiven = isGiven(el.model, "BV") && param(p, "BV") > 0;
  return {
    isat,
    vte,
    vteBreakdown,
    vcrit: criticalVoltage(isat, vte),
    bv: bvGiven ? effectiveBreakdown(param(p, "BV"), param(p, "IBV") * area, isat, vteBreakdown) : Infinity,
    gs: rs > 0 ? 1 / rs : 0,
    cj0: param(p, "CJO") * area,
    vj: param(p, "VJ"),
    m: param(p, "M"),
    fc: param(p, "FC"),
    tt: param(p, "TT"),
  };
}

/** Junction current and slope including breakdown, gmin excluded. */
function diodeCurrent(vd: number, k: DiodeConstants, out: CurrentAndSlope): CurrentAndSlope {
  if (vd >= -3 * k.vte || vd >= -k.bv) return junctionCurrent(vd, k.isat, k.vte, out);
  const e = Math.exp(Math.min(-(k.bv + vd) / k.vteBreakdown, 700));
  out.i = -k.isat * e;
  out.g = (k.isat * e) / k.vteBreakdown;
  return out;
}

export function diodeDevice(el: DiodeElement, unknowns: UnknownMap, memo?: ElaborationMemo): Device {
  const k = memo ? memo.derived(DIODE_PARAMS, el.model, el.area ?? 1, () => diodeConstants(el)) : diodeConstants(el);
  const anode = unknowns.node(el.anode);
  const cathode = unknowns.node(el.cathode);
  const junctionAnode: Unknown = k.gs > 0 ? unknowns.internalNode(el.name, "anode") : anode;
  const scratch: CurrentAndSlope = { i: 0, g: 0 };
  const state = { vd: 0, id: 0, gd: 0 };
  // Junction plus diffusion capacitance at the operating point, computed once per AC sweep.
  let cap: number | null = null;
  const capacitance = (): number => (cap ??= depletionCapacitance(state.vd, k.cj0, k.vj, k.m, k.fc) + k.tt * state.gd);

  const limitedVoltage = (vd: number, ctx: DcLoadContext): number => {
    if (ctx.mode !== "normal") return vd;
    if (Number.isFinite(k.bv) && vd < Math.min(0, -k.bv + 10 * k.vteBreakdown)) {
      // In breakdown the reverse knee is the junction to protect: limit the mirrored voltage.
      const mirrored = pnjlim(-(vd + k.bv), -(state.vd + k.bv), k.vteBreakdown, k.vcrit, ctx);
      return -(mirrored + k.bv);
    }
    return pnjlim(vd, state.vd, k.vte, k.vcrit, ctx);
  };

  return {
    name: el.name,
    active: true,
    nodes: [anode, cathode],
    acAffine: true,
    loadDc(x, stamp, ctx) {
      let vd = ctx.mode === "init-junction" ? k.vcrit : voltageOf(x, junctionAnode) - voltageOf(x, cathode);
      if (!Number.isFinite(vd)) vd = 0;
      vd = limitedVoltage(vd, ctx);
      diodeCurrent(vd, k, scratch);
      const gd = scratch.g + ctx.gmin;
      const id = scratch.i + ctx.gmin * vd;
      state.vd = vd;
      state.id = id;
      state.gd = gd;
      cap = null;
      if (k.gs > 0) stamp.conductance(anode, junctionAnode, k.gs);
      stamp.conductance(junctionAnode, cathode, gd);
      stamp.current(junctionAnode, cathode, id - gd * vd);
    },
    converged(x) {
      const vd = voltageOf(x, junctionAnode) - voltageOf(x, cathode);
      return currentSettled(state.id + state.gd * (vd - state.vd), state.id);
    },
    loadAc(stamp, ctx) {
      if (k.gs > 0) stamp.admittance(anode, junctionAnode, k.gs, 0);
      stamp.admittance(junctionAnode, cathode, state.gd, ctx.omega * capacitance());
    },
    report(x): DiodeOperatingPoint {
      const vd = voltageOf(x, anode) - voltageOf(x, cathode);
      const region = state.vd >= 0 ? "forward" : Number.isFinite(k.bv) && state.vd < -k.bv + 3 * k.vteBreakdown ? "breakdown" : "reverse";
      return {
        kind: "diode",
        region,
        vd,
        id: state.id,
        power: vd * state.id,
        gd: state.gd,
        cd: capacitance(),
      };
    },
  };
}
