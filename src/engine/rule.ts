// The rule contract: what a rule file exports and how its options are resolved before `check` runs.
// The runner (src/engine/runner.ts) is the only caller of `check`; config validation, `loadline rules`
// and the SARIF driver all read the same `doc` and `options`, so documentation cannot drift.
import type { Finding, RuleDoc, RuleOption, Severity } from "./types.js";
import { parseQuantity } from "../circuit/units.js";
import type { QuantityUnit } from "../circuit/units.js";

export interface Rule<Ctx = unknown> {
  /** Kebab-case, stable across releases: it appears in configs, suppressions and SARIF. */
  id: string;
  /** One line, sentence case, no full stop. */
  title: string;
  /** Default severity when the config says nothing. */
  severity: Severity;
  doc: RuleDoc;
  options: Record<string, RuleOption>;
  /** Free words for filtering in code scanning ("rf", "bias", "values"). */
  tags?: string[];
  check(ctx: Ctx, options: Record<string, unknown>): Finding[];
}

/** The parts of a rule that describe it, without the check: what reporters and docs need. */
export type RuleInfo = Pick<Rule, "id" | "title" | "severity" | "doc" | "options" | "tags">;

export type { QuantityUnit };

/** Unit spellings a rule author may write in `RuleOption.unit`, mapped to what parseQuantity takes. */
const UNIT_ALIASES: Record<string, QuantityUnit> = {
  hz: "Hz", hertz: "Hz",
  "ω": "Ω", ohm: "Ω", ohms: "Ω",
  v: "V", volt: "V", volts: "V",
  a: "A", amp: "A", ampere: "A", amperes: "A",
  f: "F", farad: "F", farads: "F",
  h: "H", henry: "H", henries: "H",
};

export function quantityUnit(unit: string | undefined): QuantityUnit | undefined {
  if (unit === undefined) return undefined;
  return UNIT_ALIASES[unit.trim().toLowerCase()];
}

const UNIT_NOUN: Record<QuantityUnit, string> = {
  Hz: "a frequency", "Ω": "a resistance", V: "a voltage", A: "a current", F: "a capacitance", H: "an inductance",
};

export function unitNoun(unit: QuantityUnit): string {
  return UNIT_NOUN[unit];
}

export type OptionCheck = { ok: true; value: unknown } | { ok: false; expected: string };

/**
 * Checks one configured option value against its description and converts quantities written with
 * units ("2.5 ohm", "10MHz") to SI numbers. A bare number for a quantity is taken as SI already.
 */
export function checkRuleOption(option: RuleOption, value: unknown): OptionCheck {
  switch (option.type) {
    case "number": {
      const unit = quantityUnit(option.unit);
      if (typeof value === "number" && Number.isFinite(value)) return { ok: true, value };
      if (typeof value === "string" && unit !== undefined) {
        const parsed = parseQuantity(value, unit);
        if (typeof parsed === "number") return { ok: true, value: parsed };
        return { ok: false, expected: `${unitNoun(unit)} such as ${exampleOf(option)}` };
      }
      return { ok: false, expected: unit ? `${unitNoun(unit)} such as ${exampleOf(option)}` : "a number" };
    }
    case "string":
      if (typeof value !== "string") return { ok: false, expected: expectedString(option) };
      if (option.enum && !option.enum.includes(value)) return { ok: false, expected: expectedString(option) };
      return { ok: true, value };
    case "boolean":
      return typeof value === "boolean" ? { ok: true, value } : { ok: false, expected: "true or false" };
    case "string[]":
      if (!Array.isArray(value) || !value.every((item) => typeof item === "string")) {
        return { ok: false, expected: "a list of strings" };
      }
      if (option.enum) {
        const allowed = option.enum;
        if (!value.every((item: string) => allowed.includes(item))) {
          return { ok: false, expected: `a list of ${allowed.map((e) => `'${e}'`).join(", ")}` };
        }
      }
      return { ok: true, value: [...value] };
  }
}

function expectedString(option: RuleOption): string {
  return option.enum ? `one of ${option.enum.map((e) => `'${e}'`).join(", ")}` : "a string";
}

function exampleOf(option: RuleOption): string {
  if (typeof option.default === "string") return `'${option.default}'`;
  return option.unit ? `'${String(option.default)} ${option.unit}'` : `'${String(option.default)}'`;
}

/**
 * The options a rule's `check` receives: every declared option present, defaults applied, configured
 * values validated and converted. Values that fail validation fall back to the default — config
 * loading has already reported them, so the run can go on with the other rules.
 */
export function resolveRuleOptions(
  rule: Pick<Rule, "options">,
  configured: Record<string, unknown> = {},
): Record<string, unknown> {
  const resolved: Record<string, unknown> = {};
  for (const [name, option] of Object.entries(rule.options)) {
    const fallback = checkRuleOption(option, option.default);
    const defaultValue = fallback.ok ? fallback.value : option.default;
    if (Object.hasOwn(configured, name)) {
      const checked = checkRuleOption(option, configured[name]);
      resolved[name] = checked.ok ? checked.value : defaultValue;
    } else {
      resolved[name] = defaultValue;
    }
  }
  return resolved;
}
