// Linear elements: resistor, capacitor (series ESR–ESL), inductor (series winding resistance),
// independent voltage source (optional series resistance) and current source.

import type { AcLoadContext, Device } from "../device.js";
import type { UnknownMap } from "../mna.js";
import type {
  CapacitorElement,
  CurrentSourceElement,
  InductorElement,
  ResistorElement,
  VoltageSourceElement,
} from "../netlist.js";
import { voltageOf, type ComplexStamp, type RealStamp, type Unknown } from "../stamp.js";

/** SPICE replaces a zero resistance by 1 mΩ; we do the same rather than reject a jumper. */
const MIN_RESISTANCE = 1e-3;
/** Floor on a series R-L-C branch impedance so a lossless part at exact resonance stays finite. */
const MIN_BRANCH_IMPEDANCE = 1e-9;

/**
 * Resistors and capacitors are most of a board's elements, so they are small class instances
 * (methods shared on the prototype) rather than objects of closures: elaborating a circuit then
 * allocates a few fields per part instead of a closure context and two functions.
 */
class Resistor implements Device {
  readonly active = false;
  readonly dcConstant = true;
  readonly acAffine = true;
  private readonly g: number;

  constructor(readonly name: string, private readonly a: Unknown, private readonly b: Unknown, ohms: number) {
    const r = Math.abs(ohms) < MIN_RESISTANCE ? Math.sign(ohms || 1) * MIN_RESISTANCE : ohms;
    this.g = 1 / r;
  }

  get nodes(): readonly Unknown[] { return [this.a, this.b]; }
  loadDc(_x: Float64Array, stamp: RealStamp): void { stamp.conductance(this.a, this.b, this.g); }
  loadAc(stamp: ComplexStamp): void { stamp.admittance(this.a, this.b, this.g, 0); }
}

export function resistorDevice(el: ResistorElement, unknowns: UnknownMap): Device {
  const a = unknowns.node(el.a);
  return new Resistor(el.name, a, unknowns.node(el.b), el.ohms);
}

/** Admittance of ESR + jωESL + 1/(jωC), written into a two-element scratch array. */
export function seriesRlcAdmittance(omega: number, farads: number, esr: number, esl: number, out: [number, number]): [number, number] {
  if (omega <= 0 || farads <= 0) {
    out[0] = 0;
    out[1] = 0;
    return out;
  }
  const zr = esr;
  let zi = omega * esl - 1 / (omega * farads);
  let mag2 = zr * zr + zi * zi;
  if (mag2 < MIN_BRANCH_IMPEDANCE * MIN_BRANCH_IMPEDANCE) {
    zi = MIN_BRANCH_IMPEDANCE;
    mag2 = zr * zr + zi * zi;
  }
  out[0] = zr / mag2;
  out[1] = -zi / mag2;
  return out;
}

/** Scratch for a capacitor's admittance, used and read straight away by one stamp at a time. */
const ADMITTANCE: [number, number] = [0, 0];

class Capacitor implements Device {
  readonly active = false;
  readonly dcConstant = true;
  /** A pure capacitance is jωC; with ESR or ESL the series branch is not affine in ω. */
  readonly acAffine: boolean;

  constructor(readonly name: string, private readonly a: Unknown, private readonly b: Unknown,
    private readonly farads: number, private readonly esr: number, private readonly esl: number) {
    this.acAffine = esr === 0 && esl === 0;
  }

  get nodes(): readonly Unknown[] { return [this.a, this.b]; }
  /** Open at DC: nothing to stamp. */
  loadDc(): void {}
  loadAc(stamp: ComplexStamp, ctx: AcLoadContext): void {
    const y = seriesRlcAdmittance(ctx.omega, this.farads, this.esr, this.esl, ADMITTANCE);
    stamp.admittance(this.a, this.b, y[0], y[1]);
  }
}

export function capacitorDevice(el: CapacitorElement, unknowns: UnknownMap): Device {
  const a = unknowns.node(el.a);
  return new Capacitor(el.name, a, unknowns.node(el.b), el.farads, el.esr ?? 0, el.esl ?? 0);
}

/**
 * Inductor as a branch equation V(a) − V(b) − (R + jωL)·I = 0, so a winding with R = 0 is an
 * exact short at DC and inductor loops show up as what they are.
 */
export function inductorDevice(el: InductorElement, unknowns: UnknownMap): Device {
  const a = unknowns.node(el.a);
  const b = unknowns.node(el.b);
  const branch = unknowns.branch(el.name);
  const r = el.series ?? 0;
  return {
    name: el.name,
    active: false,
    nodes: [a, b],
    branch,
    dcConstant: true,
    acAffine: true,
    loadDc(_x, stamp) {
      stamp.entry(a, branch, 1);
      stamp.entry(b, branch, -1);
      stamp.entry(branch, a, 1);
      stamp.entry(branch, b, -1);
      stamp.entry(branch, branch, -r);
    },
    loadAc(stamp, ctx) {
      stamp.entry(a, branch, 1, 0);
      stamp.entry(b, branch, -1, 0);
      stamp.entry(branch, a, 1, 0);
      stamp.entry(branch, b, -1, 0);
      stamp.entry(branch, branch, -r, -ctx.omega * el.henries);
    },
  };
}

/** V(pos) − V(neg) − Rs·I = E, with I flowing from pos through the source to neg. */
export function voltageSourceDevice(el: VoltageSourceElement, unknowns: UnknownMap): Device {
  const pos = unknowns.node(el.pos);
  const neg = unknowns.node(el.neg);
  const branch = unknowns.branch(el.name);
  const rs = el.series ?? 0;
  return {
    name: el.name,
    active: false,
    nodes: [pos, neg],
    branch,
    acAffine: true,
    loadDc(_x, stamp, ctx) {
      stamp.entry(pos, branch, 1);
      stamp.entry(neg, branch, -1);
      stamp.entry(branch, pos, 1);
      stamp.entry(branch, neg, -1);
      stamp.entry(branch, branch, -rs);
      stamp.rhs(branch, el.dc * ctx.srcFactor);
    },
    loadAc(stamp, ctx) {
      stamp.entry(pos, branch, 1, 0);
      stamp.entry(neg, branch, -1, 0);
      stamp.entry(branch, pos, 1, 0);
      stamp.entry(branch, neg, -1, 0);
      stamp.entry(branch, branch, -rs, 0);
      if (ctx.excitedSource === el.name) stamp.rhs(branch, 1, 0);
    },
    delivered(x) { return -voltageOf(x, branch); },
  };
}

export function currentSourceDevice(el: CurrentSourceElement, unknowns: UnknownMap): Device {
  const pos = unknowns.node(el.pos);
  const neg = unknowns.node(el.neg);
  return {
    name: el.name,
    active: false,
    nodes: [pos, neg],
    acAffine: true,
    loadDc(_x, stamp, ctx) { stamp.current(pos, neg, el.dc * ctx.srcFactor); },
    loadAc(stamp, ctx) {
      if (ctx.excitedSource === el.name) stamp.current(pos, neg, 1, 0);
    },
    delivered(_x, srcFactor) { return el.dc * srcFactor; },
  };
}
