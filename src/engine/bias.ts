// The bias table of a design: each rail with the current it supplies, each active device with its
// region and Q-point. Figures come from the Context's operating point; nothing is computed here
// beyond picking the supply element of each rail and its sign.
import type { Rail } from "./context-types.js";
import type { Context, DeviceOperatingPoint } from "./context.js";

export interface BiasRail {
  net: string;
  volts: number;
  /** Current the rail delivers into the circuit (positive when it powers it); null without a solution. */
  amps: number | null;
  from: Rail["from"];
}

interface DeviceBase {
  ref: string;
  /** A dual-gate MOSFET reports its two channels: "g1" at the source, "g2" at the drain. */
  channel?: "g1" | "g2";
  region: string;
  power: number;
}
export interface BipolarBias extends DeviceBase { type: "npn" | "pnp"; vbe: number; vce: number; ic: number }
export interface FetBias extends DeviceBase { type: "njfet" | "pjfet" | "nmos" | "pmos"; vgs: number; vds: number; id: number }
export type DeviceBias = BipolarBias | FetBias;

export interface BiasReport {
  file: string;
  converged: boolean;
  method?: string;
  problem?: string;
  rails: BiasRail[];
  devices: DeviceBias[];
  /** Parts the solver could not model (so the table may be incomplete). */
  unmodelled: { ref: string; reason: string }[];
}

function deviceBias(ref: string, op: DeviceOperatingPoint, channel?: "g1" | "g2"): DeviceBias | undefined {
  const at = channel ? { channel } : {};
  switch (op.kind) {
    case "bjt":
      return { ref, ...at, type: op.type, region: op.region, vbe: op.vbe, vce: op.vce, ic: op.ic, power: op.power };
    case "jfet":
    case "mosfet":
      return { ref, ...at, type: op.type, region: op.region, vgs: op.vgs, vds: op.vds, id: op.id, power: op.power };
    case "diode":
      return undefined;
  }
}

/** The supply element feeding a rail: the voltage source between the rail's node and ground. */
function railCurrent(ctx: Context, rail: Rail): number | null {
  const build = ctx.solver();
  const op = ctx.operatingPoint();
  if (!build || !op) return null;
  const node = build.nodeOfNet[rail.net];
  if (node === undefined) return null;
  for (const el of build.solver.elements) {
    if (el.kind !== "V") continue;
    const delivered = op.deliveredCurrents[el.name];
    if (delivered === undefined) continue;
    // A source from rail to ground delivers into the rail; one from ground to the rail (a negative
    // supply written the other way round) delivers the opposite way.
    if (el.pos === node && el.neg === "0") return rail.volts < 0 ? -delivered : delivered;
    if (el.neg === node && el.pos === "0") return rail.volts < 0 ? delivered : -delivered;
  }
  return null;
}

export function biasReport(ctx: Context, file: string): BiasReport {
  const op = ctx.operatingPoint();
  const devices: DeviceBias[] = [];
  if (op) {
    for (const part of ctx.devices()) {
      if (part.kind === "dual-gate-mosfet") {
        for (const channel of ["g1", "g2"] as const) {
          const d = ctx.device(part.ref, channel);
          const row = d && deviceBias(part.ref, d, channel);
          if (row) devices.push(row);
        }
        continue;
      }
      const d = ctx.device(part.ref);
      const row = d && deviceBias(part.ref, d);
      if (row) devices.push(row);
    }
  }
  const problem = op ? op.problem : ctx.operatingPointProblem() ?? ctx.solverProblem();
  return {
    file,
    converged: op?.converged ?? false,
    ...(op ? { method: op.method } : {}),
    ...(problem ? { problem } : {}),
    rails: ctx.rails().map((rail) => ({ net: rail.net, volts: rail.volts, amps: railCurrent(ctx, rail), from: rail.from })),
    devices,
    unmodelled: ctx.unmodelled().map((u) => ({ ref: u.ref, reason: u.reason })),
  };
}
