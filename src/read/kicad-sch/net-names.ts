// Net names by the editor's precedence (KiCad format notes §8.4): every label, power symbol, sheet
// pin and pin that could name a net is a "driver" with a priority; the best driver names the net.
// Nets with no label get a generated name from one of their pins.
import { KICAD6_RELEASE_VERSION } from "./versions.js";

/** Driver priorities of KiCad 6–9, low → high. */
export const PRIORITY = {
  pin: 1,
  sheetPin: 2,
  hierarchicalLabel: 3,
  localLabel: 4,
  powerPin: 5,
  globalLabel: 6,
} as const;

export interface Driver {
  /** Union-find node the driver sits on. */
  node: number;
  priority: number;
  /** Sheet depth of the driver (root 0): at equal priority the shallower one wins. */
  depth: number;
  /** Tie-break within a priority, higher wins: global power 2 > local power 1; output sheet pins 1. */
  rank: number;
  /** Full net name in KiCad's escaped form (`/preamp/BIAS`, `GND`). */
  name: string;
  /** Whether the name is a label or power name a user gave (kept as an alias of the net). */
  alias: boolean;
}

/** Best first. From KiCad 7 a name containing `-Pad` loses to one without. */
export function compareDrivers(a: Driver, b: Driver, version: number): number {
  if (a.priority !== b.priority) return b.priority - a.priority;
  if (a.depth !== b.depth) return a.depth - b.depth;
  if (a.rank !== b.rank) return b.rank - a.rank;
  if (version > KICAD6_RELEASE_VERSION) {
    const pa = a.name.includes("-Pad") ? 1 : 0;
    const pb = b.name.includes("-Pad") ? 1 : 0;
    if (pa !== pb) return pa - pb;
  }
  return a.name < b.name ? -1 : a.name > b.name ? 1 : 0;
}

/** Unit letter as KiCad appends it to references: 1 → A … 26 → Z, 27 → AA. */
export function unitLetters(unit: number): string {
  let n = Math.max(1, Math.trunc(unit));
  let s = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

export interface PinForName {
  /** Reference, or the symbol UUID for an unannotated symbol. */
  ref: string;
  /** Reference with unit letter for multi-unit symbols (`U3A`). */
  refWithUnit: string;
  number: string;
  name: string;
  /** Another pin of the same unit has the same name. */
  nameRepeats: boolean;
}

/**
 * The generated name of a net without labels: `Net-(R1-Pad2)` (6.x), `Net-(U3A-IN+)` (7+, pins
 * with a name), `unconnected-(…)` for a no-connect net, which in 7+ always ends in `-PadN`.
 * Cosmetic and version-dependent; nothing should key on it.
 */
export function defaultNetName(pin: PinForName, noConnect: boolean, version: number): string {
  const prefix = noConnect ? "unconnected-(" : "Net-(";
  if (version <= KICAD6_RELEASE_VERSION) return `${prefix}${pin.ref}-Pad${pin.number})`;
  if (pin.name !== "" && pin.name !== pin.number) {
    const pad = noConnect || pin.nameRepeats ? `-Pad${pin.number}` : "";
    return `${prefix}${pin.refWithUnit}-${pin.name}${pad})`;
  }
  return `${prefix}${pin.ref}-Pad${pin.number})`;
}

/** Names that mean ground by common practice (GND, AGND, GNDA, GNDPWR, VSS, 0, Earth, Chassis). */
const GROUND_NAME = /^(?:[ADPSC]?GND[A-Z0-9_]*|VSS[A-Z0-9_]*|0|EARTH|CHASSIS)$/i;

/** Ground by name: the last path segment of a net name, or a power symbol's library name. */
export function isGroundName(name: string): boolean {
  const last = name.slice(name.lastIndexOf("/") + 1);
  const bare = last.slice(last.lastIndexOf(":") + 1);
  return GROUND_NAME.test(bare);
}
