// Common small-signal part numbers: what kind of device each is, and (for a few) the pin order of its
// usual package, used only when a symbol's pins are unnamed and nothing else tells the roles.
// Pin orders are from memory of the manufacturers' package drawings [MEM]; every symbol in KiCad's
// own libraries names its pins, so this is a last resort.
import type { PartKind } from "./types.js";

export interface KnownPartName {
  pattern: RegExp;
  kind: PartKind;
  /** Role of pin 1, 2, 3 … of the usual package. */
  pinOrder?: readonly string[];
  pinOrderSource?: string;
}

const TO92_EBC = { pinOrder: ["E", "B", "C"], pinOrderSource: "TO-92 E-B-C, from memory of the datasheets [MEM]" };
const TO92_CBE = { pinOrder: ["C", "B", "E"], pinOrderSource: "TO-92 C-B-E (European types), from memory of the datasheets [MEM]" };
const SOT23_BJT = { pinOrder: ["B", "E", "C"], pinOrderSource: "SOT-23 B-E-C, from memory of the datasheets [MEM]" };
const TO92_DSG = { pinOrder: ["D", "S", "G"], pinOrderSource: "TO-92 D-S-G, from memory of the datasheets [MEM]" };

/** Matched against the upper-cased value and symbol name, first match wins. */
export const KNOWN_PART_NAMES: readonly KnownPartName[] = [
  // Dual-gate (tetrode) depletion MOSFETs, BF998 class; SOT-143 pin order S-D-G2-G1 [MEM].
  { pattern: /^BF99[0-8]/, kind: "dual-gate-mosfet", pinOrder: ["S", "D", "G2", "G1"], pinOrderSource: "SOT-143 S-D-G2-G1, from memory of the BF998 datasheet [MEM]" },
  { pattern: /^(BF9(0[4-9]|6\d|8\d)|BF1\d{3}|3SK\d+)/, kind: "dual-gate-mosfet" },
  // Bipolar, NPN.
  { pattern: /^(2N3904|PN3904|MPS3904)/, kind: "npn", ...TO92_EBC },
  { pattern: /^(2N2222A?|PN2222A?|P2N2222A?|MPS2222A?)/, kind: "npn", ...TO92_EBC },
  { pattern: /^(2N4401|2N4124|2N5088|2N5089|2N4123)/, kind: "npn", ...TO92_EBC },
  { pattern: /^(MMBT3904|MMBT2222A?|MMBT4401|MMBT5089)/, kind: "npn", ...SOT23_BJT },
  { pattern: /^(BC54[6-9]|BC550|BC337|BC338|BC23[7-9]|BC10[7-9]|BC182|BC184)/, kind: "npn", ...TO92_CBE },
  { pattern: /^(BC81[78]|BC84[6-9]|BC850|BFR9[23]|BFR106|BFS17|BF199|BF240|BF494|BF959|2N918|2N5179|2N5770|MPSH10|MPSH11|2SC\d+|BFY90)/, kind: "npn" },
  // Bipolar, PNP.
  { pattern: /^(2N3906|PN3906|MPS3906|2N2907A?|PN2907A?|2N4403|2N4126|2N5087|2N4125)/, kind: "pnp", ...TO92_EBC },
  { pattern: /^(MMBT3906|MMBT2907A?|MMBT4403)/, kind: "pnp", ...SOT23_BJT },
  { pattern: /^(BC55[6-9]|BC560|BC327|BC328|BC30[7-9]|BC17[7-9]|BC212|BC214)/, kind: "pnp", ...TO92_CBE },
  { pattern: /^(BC80[78]|BC85[6-9]|BC860|MPSH81|2SA\d+|BF450)/, kind: "pnp" },
  // JFETs.
  { pattern: /^(2N548[4-6]|2N545[7-9]|MPF102)/, kind: "njfet", ...TO92_DSG },
  { pattern: /^(J30[89]|J310|J11[1-3]|2N3819|2N4416A?|BF24[45]|BF256|2SK\d+|MMBFJ3\d\d|MMBF4416|MMBF5484|U310)/, kind: "njfet" },
  { pattern: /^(J17[4-7]|J27[01]|2N546[0-2]|MMBFJ17[5-7]|2SJ\d+)/, kind: "pjfet" },
  // Enhancement MOSFETs.
  { pattern: /^2N7000/, kind: "nmos", pinOrder: ["S", "G", "D"], pinOrderSource: "TO-92 S-G-D, from memory of the 2N7000 datasheet [MEM]" },
  { pattern: /^BS170/, kind: "nmos", pinOrder: ["D", "G", "S"], pinOrderSource: "TO-92 D-G-S, from memory of the BS170 datasheet [MEM]" },
  { pattern: /^(2N7002|BSS138|BSS123)/, kind: "nmos", pinOrder: ["G", "S", "D"], pinOrderSource: "SOT-23 G-S-D, from memory of the datasheets [MEM]" },
  { pattern: /^(BS108|BS107|VN10K|VN2222|IRLML2502|IRLZ44N?|IRF5[1-4]0N?)/, kind: "nmos" },
  { pattern: /^(BS250|BSS84|TP0610|IRLML6402|IRF9[0-9]+)/, kind: "pmos" },
  // Zeners (before plain diodes; `1N47xx` would otherwise look like a rectifier).
  { pattern: /^(BZX\d+|BZT52|BZV55|BZV85|BZD27|1N47[2-6]\d|1N52[2-5]\d|1N53[3-8]\d|ZPD|ZMM|ZMY|MMSZ|TZMC|ZENER)/, kind: "zener" },
  { pattern: /^\d+V\d+$/, kind: "zener" },
  // Signal and rectifier diodes.
  { pattern: /^(1N4148|1N914|1N4448|LL4148|1N4150|BAS16|BAS21|BAV2[01]|BAW62|1N400[1-7]|1N581[7-9]|BAT4[1-9]|BAT54|BAT8[1-6]|1N5711|1N60|OA9[01])/, kind: "diode" },
];

export function lookupPartName(name: string): KnownPartName | undefined {
  const n = name.trim().toUpperCase();
  if (n === "") return undefined;
  return KNOWN_PART_NAMES.find((k) => k.pattern.test(n));
}
