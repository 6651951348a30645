// Quantities at the edges: writing figures for people (`4.7 kΩ`, `14.2 MHz`) and reading the ones
// people write in a config (`1.8MHz`, `2.5 ohm`, `50mV`). SI prefixes, case-sensitive (`m` milli,
// `M` mega), `meg` accepted for mega as SPICE users write it.

const PREFIXES: readonly (readonly [number, string])[] = [
  [1e12, "T"],
  [1e9, "G"],
  [1e6, "M"],
  [1e3, "k"],
  [1, ""],
  [1e-3, "m"],
  [1e-6, "µ"],
  [1e-9, "n"],
  [1e-12, "p"],
  [1e-15, "f"],
];

/** `formatQuantity(4700, "Ω")` → `4.7 kΩ`; `14.2e6, "Hz"` → `14.2 MHz`; `-0.9, "V"` → `-0.9 V`.
 * `digits` significant figures, trailing zeros dropped. */
export function formatQuantity(value: number, unit: string, digits = 3): string {
  const space = unit === "" ? "" : " ";
  if (Number.isNaN(value)) return `NaN${space}${unit}`;
  if (!Number.isFinite(value)) return `${value < 0 ? "-" : ""}∞${space}${unit}`;
  if (value === 0) return `0${space}${unit}`;
  const rounded = Number(value.toPrecision(digits));
  const abs = Math.abs(rounded);
  let chosen: readonly [number, string] = PREFIXES[PREFIXES.length - 1] ?? [1, ""];
  for (const p of PREFIXES) {
    if (abs >= p[0] * (1 - 1e-12)) {
      chosen = p;
      break;
    }
  }
  // Tenths of the base unit read better plain: `-0.9 V`, `0.3 Ω`, not `-900 mV`, `300 mΩ`.
  if (abs >= 0.1 && abs < 1) chosen = [1, ""];
  const mantissa = Number((rounded / chosen[0]).toPrecision(digits));
  const text = `${mantissa}`;
  return `${text}${space}${chosen[1]}${unit}`;
}

export type QuantityUnit = "Hz" | "Ω" | "V" | "A" | "F" | "H";

const UNIT_WORDS: Record<QuantityUnit, { spellings: readonly string[]; noun: string; example: string }> = {
  Hz: { spellings: ["Hz", "hz", "HZ"], noun: "frequency", example: "1.8 MHz" },
  "Ω": { spellings: ["Ω", "\u2126", "ohms", "ohm", "Ohms", "Ohm", "OHM", "R"], noun: "resistance", example: "2.5 ohm" },
  V: { spellings: ["V", "v"], noun: "voltage", example: "50 mV" },
  A: { spellings: ["A"], noun: "current", example: "20 mA" },
  F: { spellings: ["F"], noun: "capacitance", example: "100 nF" },
  H: { spellings: ["H"], noun: "inductance", example: "10 uH" },
};

const PREFIX_OF: Record<string, number> = {
  T: 12, G: 9, M: 6, meg: 6, Meg: 6, MEG: 6, k: 3, K: 3, m: -3, u: -6, "µ": -6, "μ": -6, n: -9, p: -12, f: -15,
};
const PREFIX_KEYS = Object.keys(PREFIX_OF).sort((a, b) => b.length - a.length);

/** Reads a config quantity: `1.8MHz`, `2.5 ohm`, `30 MHz`, `50mV`, `0.5` (bare number, base unit). */
export function parseQuantity(text: string, unit: QuantityUnit): number | { error: string } {
  const words = UNIT_WORDS[unit];
  const t = text.trim();
  const fail = { error: `expected a ${words.noun} such as '${words.example}', got '${text}'` };
  const m = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/.exec(t);
  if (!m) return fail;
  const mantissa = m[1] ?? "";
  let rest = (m[2] ?? "").trim();
  for (const sp of [...words.spellings].sort((a, b) => b.length - a.length)) {
    if (rest.endsWith(sp)) {
      rest = rest.slice(0, rest.length - sp.length).trim();
      break;
    }
  }
  let exp = 0;
  if (rest !== "") {
    const prefix = PREFIX_KEYS.find((p) => p === rest);
    if (prefix === undefined) return fail;
    exp = PREFIX_OF[prefix] ?? 0;
  }
  const value = /e/i.test(mantissa) ? Number(mantissa) * 10 ** exp : Number(`${mantissa}e${exp}`);
  return Number.isFinite(value) ? value : fail;
}

/** The prefix multiplier `formatQuantity` would choose, for tables that align a column. */
export function siPrefixFor(value: number): { factor: number; prefix: string } {
  const abs = Math.abs(value);
  for (const [factor, prefix] of PREFIXES) if (abs >= factor * (1 - 1e-12)) return { factor, prefix };
  return { factor: 1e-15, prefix: "f" };
}
