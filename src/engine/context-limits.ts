// Device and part limits the Context offers rules: where a transistor's saturation edge lies at its
// operating point (the floor its headroom is measured from), what a part dissipates, and the power a
// resistor is rated for when its Value and fields do not say. Pure functions over the operating
// point, the model card and the part; context.ts wires them in as Context methods.
import type { Part } from "../circuit/types.js";
import type { Element, ModelCard } from "../solve/netlist.js";
import type { PartRatings } from "../solve/parts/library.js";
import type { DeviceOperatingPoint, OperatingPoint } from "../solve/types.js";

/** The floor of a device's headroom: VCE(sat) of a bipolar transistor, VDS(sat) of a FET. */
export interface SaturationEdge {
  volts: number;
  /** Where the figure comes from, for messages ("datasheet VCE(sat) …", "VGS − VTO …"). */
  basis: string;
}

/** VCE(sat) when neither the library nor the part gives one: the usual small-signal datasheet figure
 * (0.2 V at IC 10 mA, IB 1 mA for the 2N3904 class, reference-data §4.5) [CP]. */
export const DEFAULT_VCE_SAT = 0.2;

/** SPICE's default VTO of a junction FET card that states none (NJF −2.0 V) [MEM: SPICE 2G6 / ngspice manual]. */
const SPICE_DEFAULT_JFET_VTO = -2;

/**
 * Where a device leaves its amplifying region at this operating point. Bipolar: VCE(sat) from the
 * ratings, else 0.2 V [CP]. JFET: VDS(sat) = VGS − VTO (Shichman–Hodges pinch-off edge), VTO from the
 * card. MOSFET: VDS(sat) = VGS − VTH with VTH as solved (body effect included). Practitioner signs, as
 * the operating point reports them (a p-channel device's figures are positive too).
 */
export function saturationEdge(device: DeviceOperatingPoint, card: ModelCard | undefined, ratings: PartRatings | undefined): SaturationEdge | undefined {
  switch (device.kind) {
    case "bjt": {
      if (ratings?.vceSat !== undefined) {
        const at = ratings.vceSatAt ? ` at ${ratings.vceSatAt}` : "";
        return { volts: ratings.vceSat, basis: `datasheet VCE(sat) ${trim(ratings.vceSat)} V${at}` };
      }
      return { volts: DEFAULT_VCE_SAT, basis: `VCE(sat) ${DEFAULT_VCE_SAT} V assumed (the usual small-signal datasheet figure; no rating known for this part)` };
    }
    case "jfet": {
      const vto = card?.params.VTO ?? SPICE_DEFAULT_JFET_VTO;
      // Reported figures of a p-channel device are sign-flipped; flip VTO the same way.
      const vtoReported = device.type === "pjfet" ? -vto : vto;
      const volts = Math.max(0, device.vgs - vtoReported);
      const from = card?.params.VTO !== undefined ? `VTO ${trim(vtoReported)} V of card ${card.name}` : `SPICE's default VTO ${trim(vtoReported)} V (the card gives none)`;
      return { volts, basis: `VDS(sat) = VGS − VTO = ${signed(device.vgs)} − ${signed(vtoReported)} V, ${from}` };
    }
    case "mosfet": {
      const volts = Math.max(0, device.vgs - device.vth);
      return { volts, basis: `VDS(sat) = VGS − VTH = ${signed(device.vgs)} − ${signed(device.vth)} V at the operating point` };
    }
    case "diode":
      return undefined;
  }
}

function trim(v: number): string {
  return String(Number(v.toPrecision(3)));
}

/** A figure inside a formula: negatives in brackets with a true minus, "(−0.8)". */
function signed(v: number): string {
  const t = trim(Math.abs(v));
  return v < 0 ? `(−${t})` : t;
}

/** The model card of a solver element by name (a transistor's card, for VTO and friends). */
export function cardOf(elements: readonly Element[], name: string): ModelCard | undefined {
  const e = elements.find((x) => x.name === name);
  if (!e) return undefined;
  return e.kind === "Q" || e.kind === "J" || e.kind === "M" || e.kind === "D" ? e.model : undefined;
}

/**
 * DC power a part takes at the operating point, watts: a resistor V²/R from its pin voltages
 * (Joule/Ohm); a transistor or diode as the solver reports it (a dual-gate MOSFET: both channels).
 * Undefined when the part is not in the solution.
 */
export function partDissipation(part: Part, op: OperatingPoint, voltageOf: (net: string) => number | undefined): number | undefined {
  if (part.kind === "resistor") {
    const ohms = part.parsed.number;
    const [a, b] = Object.values(part.pins);
    if (ohms === undefined || !(ohms > 0) || a === undefined || b === undefined) return undefined;
    const va = voltageOf(a);
    const vb = voltageOf(b);
    if (va === undefined || vb === undefined) return undefined;
    return (va - vb) ** 2 / ohms;
  }
  const own = op.devices[part.ref];
  if (own) return own.power;
  const channels = [op.devices[`${part.ref}.g1`], op.devices[`${part.ref}.g2`]].filter((d): d is DeviceOperatingPoint => d !== undefined);
  return channels.length > 0 ? channels.reduce((sum, d) => sum + d.power, 0) : undefined;
}

export interface PowerRating {
  watts: number;
  /** "the part's own rating, from its Value or Power field", "0603 chip resistor, 1/10 W: …". */
  basis: string;
  /** True when the figure is the default for an unknown package, not the part's own. */
  assumed: boolean;
}

/** Chip resistor power by case size (imperial code in the footprint name) [CP: the usual thick-film
 * ratings at 70 °C; a given maker's figure may be higher]. */
const CHIP_RESISTOR_WATTS: readonly (readonly [string, number, string])[] = [
  ["01005", 1 / 32, "1/32 W"],
  ["0201", 1 / 20, "1/20 W"],
  ["0402", 1 / 16, "1/16 W"],
  ["0603", 1 / 10, "1/10 W"],
  ["0805", 1 / 8, "1/8 W"],
  ["1206", 1 / 4, "1/4 W"],
  ["1210", 1 / 2, "1/2 W"],
  ["2010", 3 / 4, "3/4 W"],
  ["2512", 1, "1 W"],
];

/** A through-hole resistor whose footprint names no larger body: the common 1/4 W part [CP]. */
const THT_WATTS = 1 / 4;

/**
 * The power a resistor is rated for: the Value's or a Power field's rating when given (ParsedValue
 * already read them), else by footprint — chip case size from the table above, a DIN 0207 or other
 * through-hole body 1/4 W — else `fallbackWatts`, marked as assumed.
 */
export function resistorPowerRating(part: Part, fallbackWatts: number): PowerRating {
  if (part.parsed.powerRating !== undefined) {
    return { watts: part.parsed.powerRating, basis: "the part's own rating, from its Value or Power field", assumed: false };
  }
  const fp = part.footprint;
  for (const [code, watts, text] of CHIP_RESISTOR_WATTS) {
    if (new RegExp(`(^|[^0-9])${code}([^0-9]|$)`).test(fp)) {
      return { watts, basis: `${code} chip resistor, ${text}: the usual rating for the size, common practice`, assumed: false };
    }
  }
  if (/THT|Axial|DIN0\d{3}/i.test(fp)) {
    return { watts: THT_WATTS, basis: "through-hole resistor, 1/4 W: the common size, common practice", assumed: false };
  }
  return { watts: fallbackWatts, basis: `no power rating or recognised footprint: ${fallbackWatts} W assumed`, assumed: true };
}
