// The stamping interface handed to device models. A model speaks in circuit terms — "a
// conductance between these two nodes", "this current flows from node p through me to node n",
// "a current from p to n controlled by the voltage between cp and cn" — and never sees the
// matrix layout. Branch equations (sources, inductors) use the raw entry/rhs calls.
//
// Sign convention throughout: a current "from p to n" leaves node p, passes through the
// element, and enters node n (the SPICE convention for sources and device currents).

import { GROUND, type ComplexSystem, type RealSystem, type Unknown } from "./mna.js";

export { GROUND, type Unknown };

export interface RealStamp {
  /** Conductance g (siemens) between nodes a and b. */
  conductance(a: Unknown, b: Unknown, g: number): void;
  /** Current g·(V(cp) − V(cn)) flowing from p to n through the element. */
  transconductance(p: Unknown, n: Unknown, cp: Unknown, cn: Unknown, g: number): void;
  /** Constant current (amperes) flowing from p to n through the element. */
  current(p: Unknown, n: Unknown, amps: number): void;
  /** Raw matrix entry, for branch equations. */
  entry(row: Unknown, col: Unknown, value: number): void;
  /** Raw right-hand-side entry, for branch equations. */
  rhs(row: Unknown, value: number): void;
}

export interface ComplexStamp {
  /** Admittance re + j·im (siemens) between nodes a and b. */
  admittance(a: Unknown, b: Unknown, re: number, im: number): void;
  /** Current Y·(V(cp) − V(cn)) flowing from p to n through the element. */
  transadmittance(p: Unknown, n: Unknown, cp: Unknown, cn: Unknown, re: number, im: number): void;
  /** Constant phasor current flowing from p to n through the element. */
  current(p: Unknown, n: Unknown, re: number, im: number): void;
  entry(row: Unknown, col: Unknown, re: number, im: number): void;
  rhs(row: Unknown, re: number, im: number): void;
}

export class RealStamper implements RealStamp {
  constructor(private readonly system: RealSystem) {}

  conductance(a: Unknown, b: Unknown, g: number): void {
    const s = this.system;
    s.add(a, a, g);
    s.add(b, b, g);
    s.add(a, b, -g);
    s.add(b, a, -g);
  }

  transconductance(p: Unknown, n: Unknown, cp: Unknown, cn: Unknown, g: number): void {
    const s = this.system;
    s.add(p, cp, g);
    s.add(p, cn, -g);
    s.add(n, cp, -g);
    s.add(n, cn, g);
  }

  current(p: Unknown, n: Unknown, amps: number): void {
    this.system.addRhs(p, -amps);
    this.system.addRhs(n, amps);
  }

  entry(row: Unknown, col: Unknown, value: number): void { this.system.add(row, col, value); }
  rhs(row: Unknown, value: number): void { this.system.addRhs(row, value); }
}

export class ComplexStamper implements ComplexStamp {
  constructor(private readonly system: ComplexSystem) {}

  admittance(a: Unknown, b: Unknown, re: number, im: number): void {
    const s = this.system;
    s.add(a, a, re, im);
    s.add(b, b, re, im);
    s.add(a, b, -re, -im);
    s.add(b, a, -re, -im);
  }

  transadmittance(p: Unknown, n: Unknown, cp: Unknown, cn: Unknown, re: number, im: number): void {
    const s = this.system;
    s.add(p, cp, re, im);
    s.add(p, cn, -re, -im);
    s.add(n, cp, -re, -im);
    s.add(n, cn, re, im);
  }

  current(p: Unknown, n: Unknown, re: number, im: number): void {
    this.system.addRhs(p, -re, -im);
    this.system.addRhs(n, re, im);
  }

  entry(row: Unknown, col: Unknown, re: number, im: number): void { this.system.add(row, col, re, im); }
  rhs(row: Unknown, re: number, im: number): void { this.system.addRhs(row, re, im); }
}

/** Voltage of an unknown in a solution vector (0 for ground). */
export function voltageOf(x: Float64Array, node: Unknown): number {
  return node < 0 ? 0 : (x[node] as number);
}
