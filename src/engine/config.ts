// The `loadline.json` config: defaults, validation with file:line:column for every mistake, and the
// lookup that finds the file next to a design. Every default is recorded in `defaulted`, so a
// message can say "(default band)" and users know which figures they never chose.
import { dirname, join, resolve } from "node:path";
import type { Severity } from "./types.js";
import type { RuleInfo } from "./rule.js";
import { checkRuleOption } from "./rule.js";
import { parseJsonWithPositions, plainValue } from "./json-positions.js";
import type { JsonEntry, JsonNode, Position } from "./json-positions.js";
import { parseQuantity } from "../circuit/units.js";

export const CONFIG_FILE_NAME = "loadline.json";

export const E_SERIES = ["E3", "E6", "E12", "E24", "E48", "E96", "E192"] as const;
export type ESeriesName = (typeof E_SERIES)[number];

export type RuleLevel = Severity | "off";
const RULE_LEVELS: readonly RuleLevel[] = ["off", "error", "warning", "note"];

export interface RuleConfig {
  /** Absent: the rule's own default severity. */
  severity?: RuleLevel;
  options: Record<string, unknown>;
}

export interface Config {
  /** The file it was read from; absent when every value is a default. */
  file?: string;
  /** Band of operation in hertz. */
  band: { low: number; high: number; isDefault: boolean };
  /** Net name -> volts, for rails whose names carry no voltage ("VCC", "VBIAS"). */
  rails: Record<string, number>;
  /** Expected signal swing, peak volts, used by headroom checks. */
  swing: { volts: number; isDefault: boolean };
  rules: Record<string, RuleConfig>;
  /** Globs of paths to skip, relative to the config file's folder. */
  ignore: string[];
  /** A SPICE model library (path relative to the config file's folder). */
  models?: string;
  series: { resistor: ESeriesName; capacitor: ESeriesName; inductor: ESeriesName; capacitorCheck: boolean };
  /** Dotted keys that took their defaults: "band", "swing", "series.resistor" … */
  defaulted: string[];
}

export interface ConfigError {
  file: string;
  line: number;
  column: number;
  message: string;
}

/** Defaults, in one place. The band is a typical HF small-signal board (common practice: a
 * general-coverage receiver front end spans roughly 0.5–30 MHz). */
export const DEFAULTS = {
  band: { low: 0.5e6, high: 30e6 },
  swingVolts: 1,
  series: { resistor: "E24", capacitor: "E12", inductor: "E12", capacitorCheck: false },
} as const;

const TOP_KEYS = ["band", "rails", "swing", "rules", "ignore", "models", "series"] as const;
const SERIES_KEYS = ["resistor", "capacitor", "inductor", "capacitorCheck"] as const;

export function defaultConfig(): Config {
  return {
    band: { low: DEFAULTS.band.low, high: DEFAULTS.band.high, isDefault: true },
    rails: {},
    swing: { volts: DEFAULTS.swingVolts, isDefault: true },
    rules: {},
    ignore: [],
    series: { ...DEFAULTS.series },
    defaulted: ["band", "swing", "series.resistor", "series.capacitor", "series.inductor", "series.capacitorCheck"],
  };
}

/** `loadline.json:3:5: unknown key 'bnad'; known keys: …` */
export function formatConfigError(error: ConfigError): string {
  return error.line > 0 ? `${error.file}:${error.line}:${error.column}: ${error.message}` : `${error.file}: ${error.message}`;
}

/**
 * Reads and validates a config. Returns the config with every valid value applied and defaults for
 * the rest, plus every error found (not just the first), each with the position of the bad key or value.
 */
export function loadConfig(text: string, file: string, knownRules: readonly RuleInfo[]): { config: Config; errors: ConfigError[] } {
  const config = defaultConfig();
  config.file = file;
  const errors: ConfigError[] = [];
  const report = (pos: Position, message: string): void => {
    errors.push({ file, line: pos.line, column: pos.column, message });
  };

  const parsed = parseJsonWithPositions(text);
  if (!parsed.ok) {
    errors.push({ file, line: parsed.error.line, column: parsed.error.column, message: `not valid JSON: ${parsed.error.message}` });
    return { config, errors };
  }
  const root = parsed.node;
  if (root.kind !== "object") {
    report(root.pos, `expected an object ({ … }) at the top, found ${kindNoun(root)}`);
    return { config, errors };
  }

  const defaulted = new Set(config.defaulted);
  for (const entry of root.entries) {
    const { key, value } = entry;
    switch (key) {
      case "$schema":
        if (value.kind !== "string") report(value.pos, `'$schema' must be a string, found ${kindNoun(value)}`);
        break;
      case "band":
        if (readBand(value, config, report)) defaulted.delete("band");
        break;
      case "rails":
        readRails(value, config, report);
        break;
      case "swing": {
        const volts = readQuantity(value, "V", "swing", report);
        if (volts !== undefined) {
          if (volts <= 0) report(value.pos, `swing: must be above 0 V (it is the peak signal swing)`);
          else {
            config.swing = { volts, isDefault: false };
            defaulted.delete("swing");
          }
        }
        break;
      }
      case "rules":
        readRules(value, config, knownRules, report);
        break;
      case "ignore":
        if (value.kind !== "array" || !value.items.every((item) => item.kind === "string")) {
          report(value.pos, `ignore: expected a list of path globs such as ["legacy/**", "*-old.kicad_sch"]`);
        } else {
          config.ignore = value.items.map((item) => String(plainValue(item)));
        }
        break;
      case "models":
        if (value.kind !== "string" || value.value.trim() === "") {
          report(value.pos, `models: expected the path of a SPICE model library such as "models/front-end.lib"`);
        } else {
          config.models = value.value;
        }
        break;
      case "series":
        readSeries(value, config, defaulted, report);
        break;
      default:
        report(entry.keyPos, `unknown key '${key}'${suggest(key, TOP_KEYS)}; known keys: ${TOP_KEYS.join(", ")}`);
    }
  }
  config.defaulted = [...defaulted];
  return { config, errors };
}

type Report = (pos: Position, message: string) => void;

function kindNoun(node: JsonNode): string {
  switch (node.kind) {
    case "object": return "an object";
    case "array": return "a list";
    case "string": return `the string '${node.value}'`;
    case "number": return `the number ${node.value}`;
    case "boolean": return String(node.value);
    case "null": return "null";
  }
}

const UNIT_NOUN = { Hz: "frequency", V: "voltage" } as const;
const UNIT_EXAMPLE = { Hz: '"1.8MHz"', V: '"12V"' } as const;

/** A quantity written as a string with units ("1.8MHz", "12 V") or as a bare SI number. */
function readQuantity(node: JsonNode, unit: "Hz" | "V", key: string, report: Report): number | undefined {
  if (node.kind === "number") return node.value;
  if (node.kind !== "string") {
    report(node.pos, `${key}: expected a ${UNIT_NOUN[unit]} such as ${UNIT_EXAMPLE[unit]}, found ${kindNoun(node)}`);
    return undefined;
  }
  const parsed = parseQuantity(node.value, unit);
  if (typeof parsed === "number") return parsed;
  report(node.pos, `${key}: '${node.value}' is not a ${UNIT_NOUN[unit]}; write it like ${UNIT_EXAMPLE[unit]}`);
  return undefined;
}

function readBand(node: JsonNode, config: Config, report: Report): boolean {
  if (node.kind !== "object") {
    report(node.pos, `band: expected { "low": "1.8MHz", "high": "30MHz" }, found ${kindNoun(node)}`);
    return false;
  }
  let low: number | undefined;
  let high: number | undefined;
  let lowPos = node.pos;
  let highPos = node.pos;
  for (const entry of node.entries) {
    if (entry.key === "low") {
      low = readQuantity(entry.value, "Hz", "band.low", report);
      lowPos = entry.value.pos;
    } else if (entry.key === "high") {
      high = readQuantity(entry.value, "Hz", "band.high", report);
      highPos = entry.value.pos;
    } else {
      report(entry.keyPos, `unknown key 'band.${entry.key}'${suggest(entry.key, ["low", "high"])}; known keys: low, high`);
    }
  }
  const has = (key: string): boolean => node.entries.some((e) => e.key === key);
  if (!has("low") || !has("high")) {
    report(node.pos, `band: give both "low" and "high", e.g. { "low": "1.8MHz", "high": "30MHz" }`);
    return false;
  }
  if (low === undefined || high === undefined) return false;
  if (low <= 0) {
    report(lowPos, "band.low: must be above 0 Hz (the sweep is logarithmic)");
    return false;
  }
  if (high <= low) {
    report(highPos, "band.high: must be above band.low");
    return false;
  }
  config.band = { low, high, isDefault: false };
  return true;
}

function readRails(node: JsonNode, config: Config, report: Report): void {
  if (node.kind !== "object") {
    report(node.pos, `rails: expected { "VCC": "12V" } (net name -> voltage), found ${kindNoun(node)}`);
    return;
  }
  for (const entry of node.entries) {
    if (entry.key.trim() === "") {
      report(entry.keyPos, "rails: a net name cannot be empty");
      continue;
    }
    const volts = readQuantity(entry.value, "V", `rails.${entry.key}`, report);
    if (volts !== undefined) config.rails[entry.key] = volts;
  }
}

function readSeries(node: JsonNode, config: Config, defaulted: Set<string>, report: Report): void {
  if (node.kind !== "object") {
    report(node.pos, `series: expected { "resistor": "E24", "capacitor": "E12", … }, found ${kindNoun(node)}`);
    return;
  }
  for (const entry of node.entries) {
    const key = entry.key;
    const value = entry.value;
    if (key === "capacitorCheck") {
      if (value.kind !== "boolean") report(value.pos, `series.capacitorCheck: expected true or false, found ${kindNoun(value)}`);
      else {
        config.series.capacitorCheck = value.value;
        defaulted.delete("series.capacitorCheck");
      }
    } else if (key === "resistor" || key === "capacitor" || key === "inductor") {
      const name = value.kind === "string" ? value.value.toUpperCase() : undefined;
      const series = E_SERIES.find((s) => s === name);
      if (series === undefined) {
        report(value.pos, `series.${key}: expected one of ${E_SERIES.join(", ")} (IEC 60063), found ${kindNoun(value)}`);
      } else {
        config.series[key] = series;
        defaulted.delete(`series.${key}`);
      }
    } else {
      report(entry.keyPos, `unknown key 'series.${key}'${suggest(key, SERIES_KEYS)}; known keys: ${SERIES_KEYS.join(", ")}`);
    }
  }
}

function readRules(node: JsonNode, config: Config, knownRules: readonly RuleInfo[], report: Report): void {
  if (node.kind !== "object") {
    report(node.pos, `rules: expected { "<rule-id>": "off" | "error" | "warning" | "note" | { … } }, found ${kindNoun(node)}`);
    return;
  }
  const ids = knownRules.map((r) => r.id);
  for (const entry of node.entries) {
    const rule = knownRules.find((r) => r.id === entry.key);
    if (!rule) {
      report(entry.keyPos, `unknown rule '${entry.key}'${suggest(entry.key, ids)}; \`loadline rules\` lists them`);
      continue;
    }
    const setting = readRuleSetting(entry, rule, report);
    if (setting) config.rules[rule.id] = setting;
  }
}

function readLevel(node: JsonNode, where: string, report: Report): RuleLevel | undefined {
  const level = node.kind === "string" ? RULE_LEVELS.find((l) => l === node.value) : undefined;
  if (level === undefined) {
    report(node.pos, `${where}: expected one of ${RULE_LEVELS.map((l) => `"${l}"`).join(", ")}, found ${kindNoun(node)}`);
  }
  return level;
}

function readRuleSetting(entry: JsonEntry, rule: RuleInfo, report: Report): RuleConfig | undefined {
  const where = `rules.${rule.id}`;
  const node = entry.value;
  if (node.kind === "string") {
    const severity = readLevel(node, where, report);
    return severity === undefined ? undefined : { severity, options: {} };
  }
  if (node.kind !== "object") {
    report(node.pos, `${where}: expected a severity ("off", "error", "warning", "note") or { "severity": …, "options": { … } }, found ${kindNoun(node)}`);
    return undefined;
  }
  const setting: RuleConfig = { options: {} };
  for (const inner of node.entries) {
    if (inner.key === "severity") {
      const severity = readLevel(inner.value, `${where}.severity`, report);
      if (severity !== undefined) setting.severity = severity;
    } else if (inner.key === "options") {
      readRuleOptions(inner.value, rule, setting, report);
    } else {
      report(inner.keyPos, `unknown key '${where}.${inner.key}'${suggest(inner.key, ["severity", "options"])}; known keys: severity, options`);
    }
  }
  return setting;
}

function readRuleOptions(node: JsonNode, rule: RuleInfo, setting: RuleConfig, report: Report): void {
  const where = `rules.${rule.id}.options`;
  const names = Object.keys(rule.options);
  if (node.kind !== "object") {
    report(node.pos, `${where}: expected an object of option values, found ${kindNoun(node)}`);
    return;
  }
  for (const entry of node.entries) {
    const option = rule.options[entry.key];
    if (!option) {
      const known = names.length > 0 ? `known options: ${names.join(", ")}` : "this rule has no options";
      report(entry.keyPos, `unknown option '${entry.key}' for rule '${rule.id}'${suggest(entry.key, names)}; ${known}`);
      continue;
    }
    const checked = checkRuleOption(option, plainValue(entry.value));
    if (checked.ok) setting.options[entry.key] = checked.value;
    else report(entry.value.pos, `${where}.${entry.key}: expected ${checked.expected}, found ${kindNoun(entry.value)}`);
  }
}

/** " (did you mean 'band'?)" when a known word is within two edits of the typo. */
function suggest(word: string, known: readonly string[]): string {
  let best: string | undefined;
  let bestDistance = 3;
  for (const candidate of known) {
    const d = editDistance(word.toLowerCase(), candidate.toLowerCase());
    if (d < bestDistance) {
      best = candidate;
      bestDistance = d;
    }
  }
  return best === undefined ? "" : ` (did you mean '${best}'?)`;
}

/** Optimal-string-alignment distance: a swapped pair ("bnad" for "band") counts as one edit. */
export function editDistance(a: string, b: string): number {
  if (Math.abs(a.length - b.length) > 8) return 9;
  const rows = a.length + 1;
  const cols = b.length + 1;
  const d: number[] = new Array<number>(rows * cols).fill(0);
  const at = (i: number, j: number): number => d[i * cols + j] ?? 0;
  for (let i = 0; i < rows; i++) d[i * cols] = i;
  for (let j = 0; j < cols; j++) d[j] = j;
  for (let i = 1; i < rows; i++) {
    for (let j = 1; j < cols; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let v = Math.min(at(i - 1, j) + 1, at(i, j - 1) + 1, at(i - 1, j - 1) + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) v = Math.min(v, at(i - 2, j - 2) + 1);
      d[i * cols + j] = v;
    }
  }
  return at(a.length, b.length);
}

/** What the lookup needs from the file system: the reader's FileSource fits (a path exists when
 * `realpath` resolves it). */
export interface ConfigLookupFs {
  realpath(path: string): string | { error: string };
}

function exists(fs: ConfigLookupFs, path: string): boolean {
  return typeof fs.realpath(path) === "string";
}

/**
 * The config that applies to a design file: `loadline.json` next to it, else in the nearest folder
 * above, stopping at the repository root (a folder holding `.git`) or the file-system root.
 */
export function findConfigFile(designPath: string, fs: ConfigLookupFs): string | undefined {
  return findConfigFileFrom(dirname(resolve(designPath)), fs);
}

/** The same lookup starting in a folder. */
export function findConfigFileFrom(folder: string, fs: ConfigLookupFs): string | undefined {
  let dir = resolve(folder);
  // Bounded: a path has finitely many parents, and dirname of the root is the root.
  for (let depth = 0; depth < 256; depth++) {
    const candidate = join(dir, CONFIG_FILE_NAME);
    if (exists(fs, candidate)) return candidate;
    if (exists(fs, join(dir, ".git"))) return undefined;
    const parent = dirname(dir);
    if (parent === dir) return undefined;
    dir = parent;
  }
  return undefined;
}
