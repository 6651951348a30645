// Results of the solver: DC operating point with per-device reports, and AC sweeps.
//
// Device reports use practitioner signs: every voltage and current of a P-type device (PNP,
// p-channel JFET, PMOS) is multiplied by −1, so an N and a P device in the same bias situation
// report the same numbers. A forward-active PNP therefore shows positive vbe (really VEB),
// vce (really VEC) and ic (really the current flowing out of its collector).

export type BjtRegion = "active" | "saturation" | "cut-off" | "reverse";
export type FetRegion = "saturation" | "triode" | "cut-off";

export interface BjtOperatingPoint {
  kind: "bjt";
  type: "npn" | "pnp";
  region: BjtRegion;
  /** Terminal voltages (external pins, volts), practitioner signs. */
  vbe: number;
  vce: number;
  vcb: number;
  /** Terminal currents (amperes): ic into the collector, ib into the base, ie out of the emitter (NPN sense). */
  ic: number;
  ib: number;
  ie: number;
  /** Total dissipation in the device including its RB, RC, RE (watts). */
  power: number;
  /** Small-signal hybrid-π values at the internal nodes, as SPICE reports them (S, F). */
  gm: number;
  gpi: number;
  gmu: number;
  go: number;
  /** Base spreading conductance 1/RB (0 when RB = 0). */
  gx: number;
  cpi: number;
  cmu: number;
  /** Junction voltages at the internal nodes (practitioner signs). */
  vbeInternal: number;
  vbcInternal: number;
}

export interface JfetOperatingPoint {
  kind: "jfet";
  type: "njfet" | "pjfet";
  region: FetRegion;
  vgs: number;
  vds: number;
  /** Drain current into the drain pin (n-channel sense). */
  id: number;
  /** Gate current into the gate pin (n-channel sense; positive when the gate junction conducts forward). */
  ig: number;
  power: number;
  gm: number;
  gds: number;
  cgs: number;
  cgd: number;
}

export interface MosfetOperatingPoint {
  kind: "mosfet";
  type: "nmos" | "pmos";
  region: FetRegion;
  vgs: number;
  vds: number;
  vbs: number;
  /** Drain current into the drain pin (n-channel sense). */
  id: number;
  /** Threshold voltage including body effect at this vbs (n-channel sense). */
  vth: number;
  power: number;
  gm: number;
  gds: number;
  gmbs: number;
  /** Gate capacitances including overlap (farads). */
  cgs: number;
  cgd: number;
  cgb: number;
}

export interface DiodeOperatingPoint {
  kind: "diode";
  region: "forward" | "reverse" | "breakdown";
  /** Anode − cathode at the pins (volts). */
  vd: number;
  /** Current anode → cathode (amperes). */
  id: number;
  power: number;
  /** Small-signal conductance and capacitance of the junction. */
  gd: number;
  cd: number;
}

export type DeviceOperatingPoint = BjtOperatingPoint | JfetOperatingPoint | MosfetOperatingPoint | DiodeOperatingPoint;

export type SolveMethod = "newton" | "gmin-stepping" | "source-stepping";

export interface OperatingPoint {
  converged: boolean;
  method: SolveMethod;
  /** Newton iterations spent in total, across every attempt. */
  iterations: number;
  /** Voltage of every named node (ground "0" excluded), volts. */
  nodeVoltages: Record<string, number>;
  /** Branch current of every V and L element in SPICE sign: flowing from its first node through it to the second. */
  branchCurrents: Record<string, number>;
  /**
   * Current each independent source delivers into the circuit, amperes: for a V source the current
   * leaving its + terminal (positive when a supply powers the circuit, = −branch current); for an
   * I source its value, the current it pushes out of its `neg` terminal.
   */
  deliveredCurrents: Record<string, number>;
  devices: Record<string, DeviceOperatingPoint>;
  /** Why the solution is missing or suspect, in the trade's words. */
  problem?: string;
}

export interface ComplexSeries {
  re: Float64Array;
  im: Float64Array;
}

/**
 * What drives an AC sweep: one independent source at unit amplitude, or a 1 A test current
 * into `node` (returning through `returnNode`, ground when omitted).
 */
export type AcExcitation = { kind: "source"; name: string } | { kind: "current"; node: string; returnNode?: string };

export interface AcResult {
  frequencies: number[];
  /** Phasor voltage of every named node per frequency (volts per unit excitation). */
  nodeVoltages: Record<string, ComplexSeries>;
  /** Phasor branch current of every V and L element (SPICE sign). */
  branchCurrents: Record<string, ComplexSeries>;
  problem?: string;
}

export interface TransferPoint {
  f: number;
  gainDb: number;
  /** Principal value, −180° < phase ≤ 180°. */
  phaseDeg: number;
  re: number;
  im: number;
}

export interface ImpedancePoint {
  f: number;
  /** |Z| in ohms. */
  mag: number;
  phaseDeg: number;
  re: number;
  im: number;
}
