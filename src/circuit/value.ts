// Value fields as practitioners write them: `4k7`, `4.7k`, `4.7 kΩ`, `100nF 25V`, `22uF/25V`, `2u2,25V,10%`,
// `4,7K`, `R47`, `0R1`. A value is read, or it is flagged with the reason; it is never guessed.
// Schematic Value fields are case-sensitive where it matters: `m` is milli, `M` mega (SPICE text is
// different; see spice-number.ts). Multiplier letters and the RKM code follow IEC 60062.
import type { ParsedValue, PartKind } from "./types.js";
import { parseSourceSpec } from "./source-spec.js";

interface Quantity {
  unit: string;
  noun: string;
}

const QUANTITY_OF_KIND: Partial<Record<PartKind, Quantity>> = {
  resistor: { unit: "Ω", noun: "resistance" },
  capacitor: { unit: "F", noun: "capacitance" },
  "polarized-capacitor": { unit: "F", noun: "capacitance" },
  inductor: { unit: "H", noun: "inductance" },
  "voltage-source": { unit: "V", noun: "voltage" },
  battery: { unit: "V", noun: "voltage" },
  "current-source": { unit: "A", noun: "current" },
};

const NOUN_OF_UNIT: Record<string, string> = {
  "Ω": "resistance",
  F: "capacitance",
  H: "inductance",
  V: "voltage",
  A: "current",
  Hz: "frequency",
  W: "power",
};

/** Value-field multipliers. KiCad's own value inference also takes upper-case P, N, U and Meg. */
const MULTIPLIERS: Record<string, number> = {
  f: 1e-15,
  p: 1e-12,
  P: 1e-12,
  n: 1e-9,
  N: 1e-9,
  u: 1e-6,
  U: 1e-6,
  m: 1e-3,
  k: 1e3,
  K: 1e3,
  M: 1e6,
  meg: 1e6,
  Meg: 1e6,
  MEG: 1e6,
  G: 1e9,
  T: 1e12,
};
/** Longest first so `meg` wins over `m`. */
const MULTIPLIER_KEYS = Object.keys(MULTIPLIERS).sort((a, b) => b.length - a.length);

interface UnitSpelling {
  text: string;
  unit: string;
  /** Lower-case `f`/`h` read as a unit only after a multiplier (`100nf`); alone `f` is femto. */
  afterMultiplierOnly?: boolean;
}

const UNIT_SPELLINGS: readonly UnitSpelling[] = [
  { text: "Ω", unit: "Ω" },
  { text: "ohms", unit: "Ω" },
  { text: "ohm", unit: "Ω" },
  { text: "Ohms", unit: "Ω" },
  { text: "Ohm", unit: "Ω" },
  { text: "OHMS", unit: "Ω" },
  { text: "OHM", unit: "Ω" },
  { text: "R", unit: "Ω" },
  { text: "E", unit: "Ω" },
  { text: "F", unit: "F" },
  { text: "f", unit: "F", afterMultiplierOnly: true },
  { text: "H", unit: "H" },
  { text: "h", unit: "H", afterMultiplierOnly: true },
  { text: "V", unit: "V" },
  { text: "v", unit: "V" },
  { text: "A", unit: "A" },
  { text: "Hz", unit: "Hz" },
  { text: "HZ", unit: "Hz" },
  { text: "hz", unit: "Hz" },
  { text: "W", unit: "W" },
];

/** One-to-one character replacements, so offsets in the normalised text are offsets in the original. */
function normalise(text: string): string {
  return text
    .replace(/[\u00B5\u03BC]/g, "u")
    .replace(/\u2126/g, "Ω")
    .replace(/\u2212/g, "-");
}

interface Token {
  text: string;
  start: number;
  end: number;
}

/** Splits a value into its number and attribute tokens. Blanks and `;` always separate; `/` separates
 * unless it sits between digits (`1/4W`, `5/30pF`); `,` separates unless it is a decimal comma, i.e. the
 * token so far is a bare digit group and a digit follows (`4,7K` vs `2u2,25V`, `1k5,1%`). */
function tokenise(s: string): Token[] {
  const out: Token[] = [];
  let cur = "";
  let start = 0;
  const flush = (end: number): void => {
    if (cur !== "") out.push({ text: cur, start, end });
    cur = "";
  };
  for (let i = 0; i < s.length; i++) {
    const ch = s[i] ?? "";
    const prev = s[i - 1] ?? "";
    const next = s[i + 1] ?? "";
    let separates = false;
    if (/\s/.test(ch) || ch === ";") separates = true;
    else if (ch === "/") separates = !(/\d/.test(prev) && /\d/.test(next));
    else if (ch === ",") separates = !(/^[+-]?\d+$/.test(cur) && /\d/.test(next));
    if (separates) {
      flush(i);
      start = i + 1;
      continue;
    }
    if (cur === "") start = i;
    cur += ch;
  }
  flush(s.length);
  return out;
}

/** Decimal mantissa × 10^exp10 read in one step, so `100n` is the double nearest 1e-7 (not 100 × 1e-9). */
function decimal(sign: string, mantissa: string, exp10: number): number {
  const m = mantissa.startsWith(".") ? `0${mantissa}` : mantissa.endsWith(".") ? `${mantissa}0` : mantissa;
  return Number(`${sign === "-" ? "-" : ""}${m}e${exp10}`);
}

function withArticle(noun: string): string {
  return /^[aeiou]/.test(noun) ? `an ${noun}` : `a ${noun}`;
}

/** What a number token says and how it was written. */
interface Reading {
  number: number;
  unit?: string;
  style: NonNullable<ParsedValue["style"]>;
  /** As written: mantissa digits, multiplier letter, unit text. */
  mantissaText: string;
  multiplierText: string;
  unitText: string;
  /** RKM written with the letter first (`R47`) or with a leading zero (`0R1`). */
  leadingZero: boolean;
  letterFirst: boolean;
}

type ReadOutcome = { ok: true; reading: Reading } | { ok: false; reason?: string };

interface Suffix {
  multiplier: string;
  unitText: string;
  unit?: string;
}

/** All readings of a suffix as multiplier + unit; `mF` is milli-farad, `F` farad, `f` femto. */
function suffixReadings(suffix: string): Suffix[] {
  const out: Suffix[] = [];
  for (const mult of ["", ...MULTIPLIER_KEYS]) {
    if (!suffix.startsWith(mult)) continue;
    const rest = suffix.slice(mult.length);
    if (rest === "") {
      if (mult !== "") out.push({ multiplier: mult, unitText: "" });
      continue;
    }
    for (const sp of UNIT_SPELLINGS) {
      if (sp.text !== rest) continue;
      if (sp.afterMultiplierOnly && mult === "") continue;
      out.push({ multiplier: mult, unitText: sp.text, unit: sp.unit });
    }
  }
  if (suffix === "") out.push({ multiplier: "", unitText: "" });
  return out;
}

function pickSuffix(suffix: string, expected: Quantity): Suffix | { wrongUnit: string } | undefined {
  const readings = suffixReadings(suffix);
  const fits = readings.find((r) => r.unit === expected.unit) ?? readings.find((r) => r.unit === undefined);
  if (fits) return fits;
  const other = readings.find((r) => r.unit !== undefined);
  return other?.unit !== undefined ? { wrongUnit: other.unit } : undefined;
}

const RKM_INFIX = /^([+-]?)(\d+)(meg|Meg|MEG|[fpnumkKMGTPNURE])(\d+)(.*)$/;
const RKM_LEADING = /^(R|E|[pnumkKMG])(\d+)(.*)$/;
const PREFIXED = /^([+-]?)(\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE]([+-]?\d+))?(.*)$/;

function readNumberToken(token: string, expected: Quantity): ReadOutcome {
  const isResistor = expected.unit === "Ω";
  const rkm = RKM_INFIX.exec(token);
  const lead = rkm ? null : RKM_LEADING.exec(token);
  if (rkm || lead) {
    const sign = rkm ? (rkm[1] ?? "") : "";
    const whole = rkm ? (rkm[2] ?? "") : "0";
    const letter = rkm ? (rkm[3] ?? "") : (lead?.[1] ?? "");
    const frac = rkm ? (rkm[4] ?? "") : (lead?.[2] ?? "");
    const unitText = rkm ? (rkm[5] ?? "") : (lead?.[3] ?? "");
    const ohmLetter = letter === "R" || letter === "E";
    if (ohmLetter && !isResistor) {
      const asPrefixed = readPrefixed(token, expected);
      if (asPrefixed.ok) return asPrefixed;
      return { ok: false, reason: `'${letter}' in place of the decimal point is the resistor code` };
    }
    const scale = ohmLetter ? 1 : MULTIPLIERS[letter];
    if (scale === undefined) return { ok: false };
    let unit: string | undefined = ohmLetter ? "Ω" : undefined;
    if (unitText !== "") {
      const sp = UNIT_SPELLINGS.find((u) => u.text === unitText);
      if (!sp) return { ok: false };
      if (sp.unit !== expected.unit) return { ok: false, reason: `the unit ${sp.unit} is for ${withArticle(NOUN_OF_UNIT[sp.unit] ?? sp.unit)}` };
      unit = sp.unit;
    }
    return {
      ok: true,
      reading: {
        number: decimal(sign, `${whole}.${frac}`, Math.round(Math.log10(scale))),
        ...(unit !== undefined ? { unit } : {}),
        style: "rkm",
        mantissaText: `${whole}.${frac}`,
        multiplierText: letter,
        unitText,
        leadingZero: rkm !== null && whole === "0",
        letterFirst: lead !== null,
      },
    };
  }
  return readPrefixed(token, expected);
}

function readPrefixed(token: string, expected: Quantity): ReadOutcome {
  const pre = PREFIXED.exec(token);
  if (!pre) return { ok: false };
  const sign = pre[1] ?? "";
  const mantissaText = pre[2] ?? "";
  const exponent = pre[3];
  const suffix = pre[4] ?? "";
  const picked = pickSuffix(suffix, expected);
  if (picked === undefined) return { ok: false };
  if ("wrongUnit" in picked) {
    return { ok: false, reason: `the unit ${picked.wrongUnit} is for ${withArticle(NOUN_OF_UNIT[picked.wrongUnit] ?? picked.wrongUnit)}` };
  }
  const scale = picked.multiplier === "" ? 1 : (MULTIPLIERS[picked.multiplier] ?? 1);
  const number = decimal(sign, mantissaText.replace(",", "."), Number(exponent ?? 0) + Math.round(Math.log10(scale)));
  // `100R` / `100E` use the resistor code's ×1 letter; writing a new value the same way gives `47R`, `4R7`.
  const style: Reading["style"] =
    picked.unitText === "R" || picked.unitText === "E"
      ? "rkm"
      : picked.unit !== undefined
        ? "prefix-unit"
        : picked.multiplier !== ""
          ? "prefix"
          : "plain";
  return {
    ok: true,
    reading: {
      number,
      ...(picked.unit !== undefined ? { unit: picked.unit } : {}),
      style,
      mantissaText,
      multiplierText: picked.multiplier,
      unitText: picked.unitText,
      leadingZero: false,
      letterFirst: false,
    },
  };
}

/** A number token possibly followed by a detached multiplier/unit token: `4.7 kΩ`, `4.7 u`, `1 ohm`. */
interface MainValue {
  reading: Reading;
  start: number;
  end: number;
  spaced: boolean;
  consumed: number;
}

function readMain(toks: Token[], expected: Quantity): MainValue | { reason: string | undefined } {
  const first = toks[0];
  if (!first) return { reason: undefined };
  const second = toks[1];
  if (second && /^[+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)$/.test(first.text) && !/\d/.test(second.text)) {
    const joined = readNumberToken(first.text + second.text, expected);
    if (joined.ok && joined.reading.style !== "plain") {
      return { reading: joined.reading, start: first.start, end: second.end, spaced: true, consumed: 2 };
    }
    // `100 V` on a capacitor: the detached word is a unit, and the wrong one.
    if (!joined.ok && joined.reason !== undefined) return { reason: joined.reason };
  }
  const single = readNumberToken(first.text, expected);
  if (single.ok) return { reading: single.reading, start: first.start, end: first.end, spaced: false, consumed: 1 };
  if (single.reason === undefined && toks.length === 1 && /^[RCL]$/.test(first.text)) {
    return { reason: "that is the symbol's placeholder, not a value" };
  }
  return { reason: single.reason };
}

interface Attributes {
  voltageRating?: number;
  tolerance?: number;
  powerRating?: number;
}

/** Reads one attribute token: `25V`, `6V3`, `1kV`, `10%`, `±5%`, `0.25W`, `1/4W`, `250mW`. */
function readAttribute(token: string, bareAs?: "V" | "%" | "W"): Attributes {
  const t = normalise(token).trim().replace(/^±/, "");
  const dec = (x: string): number => Number(x.replace(",", "."));
  let m = /^(\d+(?:[.,]\d+)?)\s*%$/.exec(t);
  if (m) return { tolerance: dec(m[1] ?? "") / 100 };
  m = /^(\d+)\s*\/\s*(\d+)\s*W$/.exec(t);
  if (m && Number(m[2]) !== 0) return { powerRating: Number(m[1]) / Number(m[2]) };
  m = /^(\d+(?:[.,]\d+)?)\s*(m|k)?W$/.exec(t);
  if (m) return { powerRating: dec(m[1] ?? "") * (m[2] === "m" ? 1e-3 : m[2] === "k" ? 1e3 : 1) };
  m = /^(\d+(?:[.,]\d+)?)\s*(m|k)?V(?:DC|dc|AC|ac)?$/.exec(t);
  if (m) return { voltageRating: dec(m[1] ?? "") * (m[2] === "m" ? 1e-3 : m[2] === "k" ? 1e3 : 1) };
  m = /^(\d+)V(\d+)$/.exec(t);
  if (m) return { voltageRating: Number(`${m[1]}.${m[2]}`) };
  m = /^(\d+(?:[.,]\d+)?)$/.exec(t);
  if (m && bareAs) {
    const v = dec(m[1] ?? "");
    if (bareAs === "%") return { tolerance: v / 100 };
    if (bareAs === "W") return { powerRating: v };
    return { voltageRating: v };
  }
  return {};
}

/** Rating fields, matched case-insensitively; what a bare number in each means. */
const RATING_FIELDS: Record<string, "V" | "%" | "W"> = {
  voltage: "V",
  "voltage rating": "V",
  "rated voltage": "V",
  rating: "V",
  v: "V",
  tolerance: "%",
  tol: "%",
  power: "W",
  "power rating": "W",
};

function attributesFromFields(fields: Record<string, string>): Attributes {
  const out: Attributes = {};
  for (const [name, raw] of Object.entries(fields)) {
    const bareAs = RATING_FIELDS[name.trim().toLowerCase()];
    if (!bareAs || raw.trim() === "" || raw.trim() === "~") continue;
    const a = readAttribute(raw, bareAs);
    if (a.voltageRating !== undefined && out.voltageRating === undefined) out.voltageRating = a.voltageRating;
    if (a.tolerance !== undefined && out.tolerance === undefined) out.tolerance = a.tolerance;
    if (a.powerRating !== undefined && out.powerRating === undefined) out.powerRating = a.powerRating;
  }
  return out;
}

function attributesFromTokens(toks: Token[]): Attributes {
  const out: Attributes = {};
  for (const tok of toks) {
    const a = readAttribute(tok.text);
    if (a.voltageRating !== undefined) out.voltageRating ??= a.voltageRating;
    if (a.tolerance !== undefined) out.tolerance ??= a.tolerance;
    if (a.powerRating !== undefined) out.powerRating ??= a.powerRating;
  }
  return out;
}

function mergeAttributes(target: ParsedValue, fromValue: Attributes, fromFields: Attributes): void {
  // Dedicated fields are the structured record (BOM data); they win over words in the Value.
  const v = fromFields.voltageRating ?? fromValue.voltageRating;
  const t = fromFields.tolerance ?? fromValue.tolerance;
  const p = fromFields.powerRating ?? fromValue.powerRating;
  if (v !== undefined) target.voltageRating = v;
  if (t !== undefined) target.tolerance = t;
  if (p !== undefined) target.powerRating = p;
}

function isEmptyValue(text: string): boolean {
  const t = text.trim();
  return t === "" || t === "~";
}

function ambiguousCommaWarning(reading: Reading, text: string): string | undefined {
  if (!/^\d{1,3},\d{3}$/.test(reading.mantissaText)) return undefined;
  const asDecimal = reading.mantissaText.replace(",", ".");
  const asThousands = reading.mantissaText.replace(",", "");
  return `'${text}' has a comma that may be a decimal comma or a thousands separator: read as ${asDecimal}, not ${asThousands}; write ${asDecimal.replace(/0+$/, "")} or ${asThousands} with no comma to make it plain`;
}

/** `0.1` or `47` on a capacitor is 0.1 F or 47 F to a simulator; older drawings meant microfarads. */
function bareNumberWarning(reading: Reading, quantity: Quantity, text: string): string | undefined {
  if (reading.style !== "plain" || reading.number < 1e-3) return undefined;
  if (quantity.unit !== "F" && quantity.unit !== "H") return undefined;
  const micro = quantity.unit === "F" ? "uF" : "uH";
  return `'${text}' has no multiplier and reads as ${reading.number} ${quantity.unit}; write ${text}${micro} if micro${quantity.unit === "F" ? "farads" : "henries"} were meant`;
}

/** Reads a Value field for a part of the given kind. Fields supply ratings and tolerance
 * (`Voltage`, `Rating`, `V`, `Tolerance`, `Tol`, `Power`, any case). */
export function parseValue(text: string, kind: PartKind, fields: Record<string, string>): ParsedValue {
  const quantity = QUANTITY_OF_KIND[kind];
  const out: ParsedValue = { text };
  const fromFields = attributesFromFields(fields);
  if (!quantity) {
    // Semiconductors, connectors and the rest: the value names a part, it is not a number.
    mergeAttributes(out, {}, fromFields);
    return out;
  }
  if (isEmptyValue(text)) {
    if (kind !== "voltage-source" && kind !== "current-source") out.problem = `the value is empty: expected ${withArticle(quantity.noun)}`;
    mergeAttributes(out, {}, fromFields);
    return out;
  }
  if (kind === "voltage-source" || kind === "current-source") {
    const sourced = readSourceValue(text, quantity);
    if (sourced) {
      Object.assign(out, sourced);
      mergeAttributes(out, {}, fromFields);
      return out;
    }
  }
  const s = normalise(text.trim());
  const toks = tokenise(s);
  const main = readMain(toks, quantity);
  if ("reason" in main) {
    const why = main.reason ? `: ${main.reason}` : "";
    out.problem = `cannot read '${text.trim()}' as ${withArticle(quantity.noun)}${why}`;
    mergeAttributes(out, {}, fromFields);
    return out;
  }
  const { reading } = main;
  const isPassive = quantity.unit === "Ω" || quantity.unit === "F" || quantity.unit === "H";
  if (isPassive && reading.number < 0) {
    out.problem = `'${text.trim()}' is negative: ${withArticle(quantity.noun)} must be zero or more`;
    return out;
  }
  out.number = reading.number;
  out.unit = quantity.unit;
  out.style = reading.style;
  const warning = ambiguousCommaWarning(reading, text.trim()) ?? bareNumberWarning(reading, quantity, text.trim());
  if (warning) out.warning = warning;
  mergeAttributes(out, attributesFromTokens(toks.slice(main.consumed)), fromFields);
  return out;
}

/** `DC 10`, `dc 2.345`, `AC 1`, `sin(0 1 1k)` on a source symbol; undefined when it is not that form. */
function readSourceValue(text: string, quantity: Quantity): Partial<ParsedValue> | undefined {
  const t = text.trim();
  if (!/^(dc|ac|sin|sine|pulse|pwl|exp|sffm|am)\b/i.test(t)) return undefined;
  const spec = parseSourceSpec(t);
  if ("error" in spec) return { problem: `cannot read '${t}' as a source: ${spec.error}` };
  return spec.dc !== undefined ? { number: spec.dc, unit: quantity.unit, style: "plain" } : { unit: quantity.unit };
}

// ---------------------------------------------------------------------------------------------------
// Writing a value the way the board already writes them.

interface Spelling {
  style: NonNullable<ParsedValue["style"]>;
  spaced: boolean;
  decimalComma: boolean;
  unitText: string;
  /** Multiplier value → the letter the example used for it (`K` for kilo, `µ` for micro, `Meg`). */
  letters: Map<number, string>;
  kiloUpper: boolean;
  microChar: string;
  megText: string;
  ohmLetter: string;
  leadingZero: boolean;
  start: number;
  end: number;
}

function spellingOf(example: ParsedValue, quantity: Quantity): Spelling | undefined {
  const original = example.text.trim();
  const offset = example.text.indexOf(original);
  const s = normalise(original);
  const toks = tokenise(s);
  const main = readMain(toks, quantity);
  if ("reason" in main) return undefined;
  const r = main.reading;
  const letter = r.multiplierText;
  const writtenLetter = original.slice(0, main.end).match(/[\u00B5\u03BCuU]/)?.[0];
  const letters = new Map<number, string>();
  const scale = MULTIPLIERS[letter];
  if (scale !== undefined) letters.set(scale, letter === "u" || letter === "U" ? (writtenLetter ?? letter) : letter);
  return {
    style: r.style,
    spaced: main.spaced,
    decimalComma: r.mantissaText.includes(","),
    unitText: r.unitText,
    letters,
    kiloUpper: letter === "K",
    microChar: letter === "u" || letter === "U" ? (writtenLetter ?? "u") : "u",
    megText: /^(meg|Meg|MEG)$/.test(letter) ? letter : "M",
    ohmLetter: letter === "E" || r.unitText === "E" ? "E" : "R",
    leadingZero: r.leadingZero,
    start: offset + main.start,
    end: offset + main.end,
  };
}

/** Multipliers offered per quantity, in increasing order. Capacitors stay in p/n/µ (`2200uF`, not `2.2mF`). */
const SCALE_LADDER: Record<string, readonly number[]> = {
  "Ω": [1, 1e3, 1e6, 1e9],
  F: [1e-12, 1e-9, 1e-6],
  H: [1e-9, 1e-6, 1e-3, 1],
  V: [1e-3, 1, 1e3],
  A: [1e-9, 1e-6, 1e-3, 1],
};

function trimNumber(x: number): string {
  return String(Number(x.toPrecision(4)));
}

function chooseScale(value: number, ladder: readonly number[]): { scale: number; mantissa: number } {
  const abs = Math.abs(value);
  let scale = ladder[0] ?? 1;
  for (const s of ladder) if (abs >= s * (1 - 1e-9)) scale = s;
  let mantissa = Number((value / scale).toPrecision(4));
  const idx = ladder.indexOf(scale);
  const up = ladder[idx + 1];
  // 999.97 k rounds to 1000 k: write 1 M instead, when the ladder has a next step.
  if (up !== undefined && Math.abs(mantissa) >= up / scale) {
    scale = up;
    mantissa = Number((value / scale).toPrecision(4));
  }
  return { scale, mantissa };
}

function letterFor(scale: number, sp: Spelling | undefined, quantity: Quantity): string {
  const used = sp?.letters.get(scale);
  if (used !== undefined) return used;
  switch (scale) {
    case 1e-15: return "f";
    case 1e-12: return "p";
    case 1e-9: return "n";
    case 1e-6: return sp?.microChar ?? "u";
    case 1e-3: return "m";
    case 1: return quantity.unit === "Ω" && sp?.style === "rkm" ? sp.ohmLetter : "";
    case 1e3: return sp?.kiloUpper ? "K" : "k";
    case 1e6: return sp?.megText ?? "M";
    case 1e9: return "G";
    default: return "T";
  }
}

function formatWith(value: number, quantity: Quantity, sp: Spelling | undefined): string {
  const style = sp?.style ?? "prefix";
  const ladder = SCALE_LADDER[quantity.unit] ?? [1];
  if (style === "plain") {
    const plain = trimNumber(value);
    if (!plain.includes("e") && plain.length <= 9) return sp?.decimalComma ? plain.replace(".", ",") : plain;
  }
  const { scale, mantissa } = chooseScale(value, ladder);
  const letter = letterFor(scale, sp, quantity);
  const digits = trimNumber(mantissa);
  if (style === "rkm" && letter !== "") {
    const [whole, frac] = digits.split(".");
    const unitSuffix = sp && sp.unitText !== "R" && sp.unitText !== "E" ? sp.unitText : "";
    if (frac === undefined) return `${whole}${letter}${unitSuffix}`;
    if (whole === "0" && !sp?.leadingZero) return `${letter}${frac}${unitSuffix}`;
    return `${whole}${letter}${frac}${unitSuffix}`;
  }
  const num = sp?.decimalComma ? digits.replace(".", ",") : digits;
  const unitText = style === "prefix-unit" ? (sp?.unitText ?? quantity.unit) : "";
  const gap = sp?.spaced ? " " : "";
  const suffix = `${letter}${unitText}`;
  return suffix === "" ? num : `${num}${gap}${suffix}`;
}

/** Writes `value` (SI base units) the way `example` was written: `6k8` beside `4k7`, `6.8k` beside `4.7k`,
 * `6.8 kΩ` beside `4.7 kΩ`, `68nF` beside `100nF`. Only the number part; see `rewriteValueText`. */
export function formatValueLike(value: number, kind: PartKind, example: ParsedValue): string {
  const quantity = QUANTITY_OF_KIND[kind] ?? { unit: "", noun: "value" };
  const sp = example.number !== undefined ? spellingOf(example, quantity) : undefined;
  return formatWith(value, quantity, sp);
}

/** The whole Value text with its number replaced and any words kept: `100nF 25V` → `47nF 25V`. */
export function rewriteValueText(value: number, kind: PartKind, example: ParsedValue): string {
  const quantity = QUANTITY_OF_KIND[kind] ?? { unit: "", noun: "value" };
  const sp = example.number !== undefined ? spellingOf(example, quantity) : undefined;
  const written = formatWith(value, quantity, sp);
  if (!sp) return written;
  return example.text.slice(0, sp.start) + written + example.text.slice(sp.end);
}

/** The unit and noun a kind's value is measured in (`resistor` → Ω, resistance), if it has one. */
export function quantityOfKind(kind: PartKind): { unit: string; noun: string } | undefined {
  return QUANTITY_OF_KIND[kind];
}
