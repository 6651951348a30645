// Which nets are supply rails, and at what voltage. A rail is known only from something the user
// wrote: the config, the net name ("+9V", "+3V3"), a battery or source part, or a source's field.
// Nothing is guessed: a power net with no voltage anywhere is listed as unresolved so rules can say so.
import type { Circuit, Part } from "../circuit/types.js";
import type { Rail } from "./context-types.js";
import { localNetName, voltsFromNetName } from "../circuit/net-voltage.js";

export { localNetName, voltsFromNetName };

const SOURCE_KINDS = new Set(["battery", "voltage-source"]);

/** The DC value of a source part: its Value when numeric, else a `dc=` in its simulator fields. */
export function sourceVolts(part: Part): { volts: number; from: "battery" | "field" } | undefined {
  const n = part.parsed.number;
  if (n !== undefined && Number.isFinite(n)) return { volts: n, from: "battery" };
  for (const key of ["Sim.Params", "Sim.Value", "Spice_Model", "Voltage"]) {
    const text = part.fields[key];
    if (text === undefined) continue;
    const dc = /(?:^|\s)dc\s*=?\s*([+-]?\d+(?:\.\d+)?(?:e[+-]?\d+)?)/i.exec(text) ??
      /^\s*([+-]?\d+(?:\.\d+)?(?:e[+-]?\d+)?)\s*V?\s*$/i.exec(text);
    if (dc?.[1] !== undefined) return { volts: Number(dc[1]), from: "field" };
  }
  return undefined;
}

export interface RailSurvey {
  rails: Rail[];
  /** Power nets (by symbol or pin type) whose voltage nothing states. */
  unresolved: string[];
}

/**
 * Every supply rail of the design with its volts. Precedence: the config (the user said so), the
 * net name, a battery/source between the net and ground, a source's simulator field.
 */
export function surveyRails(circuit: Circuit, configured: Record<string, number>): RailSurvey {
  const groundNets = new Set(circuit.nets.filter((n) => n.isGround).map((n) => n.name));
  const byNet = new Map<string, Rail>();
  const byAlias = new Map<string, number>();
  for (const [name, volts] of Object.entries(configured)) byAlias.set(name, volts);

  for (const net of circuit.nets) {
    if (net.isGround) continue;
    const configuredVolts = [net.name, localNetName(net.name), ...net.aliases]
      .map((alias) => byAlias.get(alias))
      .find((v) => v !== undefined);
    if (configuredVolts !== undefined) {
      byNet.set(net.name, { net: net.name, volts: configuredVolts, from: "config" });
      continue;
    }
    if (!net.isPower) continue;
    const named = [net.name, ...net.aliases].map(voltsFromNetName).find((v) => v !== undefined);
    if (named !== undefined) byNet.set(net.name, { net: net.name, volts: named, from: "name" });
  }

  // A battery or DC source with one side on ground sets the other side's rail.
  for (const part of circuit.parts) {
    if (!SOURCE_KINDS.has(part.kind) || part.dnp) continue;
    const plusPin = part.roles["+"];
    const minusPin = part.roles["-"];
    const plus = plusPin !== undefined ? part.pins[plusPin] : undefined;
    const minus = minusPin !== undefined ? part.pins[minusPin] : undefined;
    if (plus === undefined || minus === undefined) continue;
    const value = sourceVolts(part);
    if (value === undefined) continue;
    let net: string | undefined;
    let volts = value.volts;
    if (groundNets.has(minus) && !groundNets.has(plus)) net = plus;
    else if (groundNets.has(plus) && !groundNets.has(minus)) {
      net = minus;
      volts = -volts;
    }
    if (net === undefined || byNet.has(net)) continue;
    byNet.set(net, { net, volts, from: value.from });
  }

  const unresolved = circuit.nets
    .filter((n) => n.isPower && !n.isGround && !byNet.has(n.name))
    .map((n) => n.name);
  const rails = [...byNet.values()].sort((a, b) => a.net.localeCompare(b.net));
  return { rails, unresolved };
}
