// pn-junction physics shared by the diode, BJT, JFET gate and MOSFET bulk junctions, and the
// Newton step limiters of the Berkeley SPICE tradition (pnjlim for junctions, fetlim/limvds for
// FET gate and drain voltages). Temperature is fixed at 27 °C (= TNOM), as in ngspice's default
// run, so no temperature scaling of IS, VJ or CJ is needed.

/** Boltzmann constant and elementary charge as ngspice 39 defines them (const.h). */
const BOLTZMANN = 1.38064852e-23;
const ELEMENTARY_CHARGE = 1.6021766208e-19;
/** 27 °C in kelvin: the temperature of every analysis here (SPICE TEMP = TNOM default). */
export const ANALYSIS_TEMPERATURE = 300.15;
/** kT/q at 27 °C ≈ 25.864 mV. */
export const THERMAL_VOLTAGE = (BOLTZMANN * ANALYSIS_TEMPERATURE) / ELEMENTARY_CHARGE;

/** Mutable holder a limiter reports into, so no object is allocated per call. */
export interface LimitFlag {
  limited: boolean;
}

/** Value and slope of a junction current; reused scratch object to avoid allocation. */
export interface CurrentAndSlope {
  i: number;
  g: number;
}

/**
 * Ideal junction current IS·(exp(v/vte) − 1) and its slope. Below −3·vte SPICE replaces the
 * exponential with a cubic that tends to −IS smoothly and keeps the slope positive.
 */
export function junctionCurrent(v: number, isat: number, vte: number, out: CurrentAndSlope): CurrentAndSlope {
  if (isat === 0) {
    out.i = 0;
    out.g = 0;
  } else if (v >= -3 * vte) {
    const e = Math.exp(Math.min(v / vte, 700));
    out.i = isat * (e - 1);
    out.g = (isat * e) / vte;
  } else {
    let arg = (3 * vte) / (v * Math.E);
    arg = arg * arg * arg;
    out.i = -isat * (1 + arg);
    out.g = (isat * 3 * arg) / v;
  }
  return out;
}

/**
 * Depletion capacitance of a junction with zero-bias capacitance cj0, built-in potential vj and
 * grading m; linearly extrapolated above fc·vj as SPICE does, so forward bias stays finite.
 */
export function depletionCapacitance(v: number, cj0: number, vj: number, m: number, fc: number): number {
  if (cj0 === 0) return 0;
  if (v < fc * vj) return cj0 * Math.pow(1 - v / vj, -m);
  const f2 = Math.pow(1 - fc, 1 + m);
  const f3 = 1 - fc * (1 + m);
  return (cj0 / f2) * (f3 + (m * v) / vj);
}

/** Voltage above which a junction's current grows too fast to take a full Newton step. */
export function criticalVoltage(isat: number, vte: number): number {
  if (isat <= 0) return Infinity;
  return vte * Math.log(vte / (Math.SQRT2 * isat));
}

/** SPICE's pnjlim: keeps a junction voltage step within the range where exp() stays tractable. */
export function pnjlim(vnew: number, vold: number, vt: number, vcrit: number, flag: LimitFlag): number {
  if (vnew > vcrit && Math.abs(vnew - vold) > vt + vt) {
    flag.limited = true;
    if (vold > 0) {
      const arg = 1 + (vnew - vold) / vt;
      return arg > 0 ? vold + vt * Math.log(arg) : vcrit;
    }
    return vt * Math.log(vnew / vt);
  }
  if (vnew < 0) {
    const floor = vold > 0 ? -1 - vold : 2 * vold - 1;
    if (vnew < floor) {
      flag.limited = true;
      return floor;
    }
  }
  return vnew;
}

/** SPICE's fetlim: limits a gate-source step relative to the threshold vto. */
export function fetlim(vnew: number, vold: number, vto: number): number {
  const vtsthi = Math.abs(2 * (vold - vto)) + 2;
  const vtstlo = vtsthi / 2 + 2;
  const vtox = vto + 3.5;
  const delv = vnew - vold;
  if (vold >= vto) {
    if (vold >= vtox) {
      if (delv <= 0) {
        if (vnew >= vtox) {
          if (-delv > vtstlo) return vold - vtstlo;
        } else {
          return Math.max(vnew, vto + 2);
        }
      } else if (delv >= vtsthi) {
        return vold + vtsthi;
      }
    } else if (delv <= 0) {
      return Math.max(vnew, vto - 0.5);
    } else {
      return Math.min(vnew, vto + 4);
    }
  } else if (delv <= 0) {
    if (-delv > vtsthi) return vold - vtsthi;
  } else {
    const vtemp = vto + 0.5;
    if (vnew <= vtemp) {
      if (delv > vtstlo) return vold + vtstlo;
    } else {
      return vtemp;
    }
  }
  return vnew;
}

/** SPICE's limvds: limits a drain-source step. */
export function limvds(vnew: number, vold: number): number {
  if (vold >= 3.5) {
    if (vnew > vold) return Math.min(vnew, 3 * vold + 2);
    if (vnew < 3.5) return Math.max(vnew, 2);
    return vnew;
  }
  if (vnew > vold) return Math.min(vnew, 4);
  return Math.max(vnew, -0.5);
}
