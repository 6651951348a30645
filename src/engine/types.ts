// Findings and rules: the contract between the rule files, the runner and the reporters.
import type { TextSpan } from "../circuit/types.js";

export type Severity = "error" | "warning" | "note";

/** A precise text edit: replace the characters of `span` in `span.file` with `replacement`. */
export interface FixEdit {
  span: TextSpan;
  /** The new value as plain text (`6k8`), not quoted: `span` covers a whole quoted string token and
   * `loadline fix` writes the replacement as a quoted KiCad string, escaping `"` and `\`. */
  replacement: string;
  /** One line for people: "R7 7.5k -> 6.8k". */
  description: string;
}

/** Computed figures, in SI base units, keyed by a name that says what they are
 * (`worstOhms`, `atHertz`, `targetOhms`, `vce`, `headroomVolts` …). Curves are arrays of [hertz, ohms]. */
export type FindingData = Record<string, number | string | boolean | number[] | [number, number][] | string[]>;

export interface Finding {
  rule: string;
  severity: Severity;
  message: string;
  parts: string[];
  nets: string[];
  file: string;
  line: number;
  column: number;
  sheetPath: string;
  data: FindingData;
  fix?: FixEdit;
  /** Set by the runner when a part's `loadline-ignore` field covers this rule. */
  suppressed?: { reason: string };
}

/** A rule option, described once so config validation, `loadline rules ID` and the SARIF help share it. */
export interface RuleOption {
  type: "number" | "string" | "boolean" | "string[]";
  default: number | string | boolean | string[];
  description: string;
  /** For quantities written with units in the config ("2.5 ohm", "10MHz"). */
  unit?: string;
  enum?: string[];
}

export interface RuleDoc {
  /** What it checks, one paragraph. */
  what: string;
  /** Why it matters, in the trade's words. */
  why: string;
  /** What to do about a finding. */
  fix: string;
  /** Published sources and common practice the rule rests on. */
  references: string[];
  /** A short worked case: a board, the figure the rule computes, and the finding (or its absence). */
  example?: string;
}
