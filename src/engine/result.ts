// What a lint run produces and every reporter consumes. Plain data, SI units, no methods: the
// reporters are pure functions of this, so the CLI, the Action and the tests see the same thing.
import type { Finding, Severity } from "./types.js";
import type { RuleInfo } from "./rule.js";

/** A problem with the run or a file, at a place: 1-based line/column, 0 when it is the whole file. */
export interface RunProblem {
  file: string;
  line: number;
  column: number;
  message: string;
}

export interface RailReport {
  net: string;
  volts: number;
  /** The impedance the rail should stay under across the band. */
  targetOhms: number;
  /** How the target was chosen, for people ("swing 1 V / 10 mA load current, 1 % ripple"). */
  targetBasis: string;
  /** [hertz, ohms] of |Z| from the rail to ground, ascending frequency. */
  curve: [number, number][];
  /** The highest |Z| inside the band and where it occurs. */
  worst?: { ohms: number; hertz: number };
}

export interface BaseReport {
  /** The common-base/common-gate device. */
  ref: string;
  net: string;
  /** [hertz, ohms] of |Z| from the base (gate) node to ground. */
  curve: [number, number][];
  /** The lowest in-band limit (the strictest point). */
  limitOhms: number;
  /** [hertz, ohms] of the limit across the band: it falls with frequency where the device's input
   * capacitance (Cπ, Cgs) takes over, so one number cannot show where grounding fails. */
  limitCurve?: [number, number][];
}

export interface DeviceReport {
  ref: string;
  /** npn, pnp, njfet, … */
  type: string;
  /** "active", "saturation", "cut-off", … */
  region: string;
  /** Operating-point figures in SI units keyed by what they are: vce, ic, vgs, id, gm, … */
  figures: Record<string, number>;
}

export interface DesignReport {
  /** The root file of the design, as given. */
  file: string;
  /** Every file the design was read from (root first). */
  sheetFiles: string[];
  findings: Finding[];
  rails: RailReport[];
  bases: BaseReport[];
  devices: DeviceReport[];
  /** Reasons the design could not be read or analysed; any entry makes the run exit 2. */
  errors: RunProblem[];
  /** Non-fatal observations: read notes, suppressions naming unknown rules. */
  notes?: RunProblem[];
}

export interface LintResult {
  designs: DesignReport[];
  band: { low: number; high: number; isDefault: boolean };
  toolVersion: string;
  /** Every rule known to this run, with the severity it ran at ("off" when disabled). */
  rules?: (RuleInfo & { level: Severity | "off" })[];
  /** Problems with the run itself (unreadable config, a path that matched nothing); exit 2. */
  errors?: RunProblem[];
}

export type FailOn = "error" | "warning" | "note" | "never";

const RANK: Record<Severity, number> = { error: 3, warning: 2, note: 1 };

export function severityRank(severity: Severity): number {
  return RANK[severity];
}

export function allFindings(result: LintResult): Finding[] {
  return result.designs.flatMap((d) => d.findings);
}

/** Counts of findings that stand, by severity; suppressed findings are counted apart. */
export function countBySeverity(result: LintResult): { error: number; warning: number; note: number; suppressed: number } {
  const counts = { error: 0, warning: 0, note: 0, suppressed: 0 };
  for (const finding of allFindings(result)) {
    if (finding.suppressed) counts.suppressed++;
    else counts[finding.severity]++;
  }
  return counts;
}

export function hasRunErrors(result: LintResult): boolean {
  return (result.errors?.length ?? 0) > 0 || result.designs.some((d) => d.errors.length > 0);
}

/** 2 when the run or any design failed; 1 when a finding that stands is at or over `failOn`; else 0. */
export function exitCodeFor(result: LintResult, failOn: FailOn): 0 | 1 | 2 {
  if (hasRunErrors(result)) return 2;
  if (failOn === "never") return 0;
  const threshold = RANK[failOn];
  return allFindings(result).some((f) => !f.suppressed && RANK[f.severity] >= threshold) ? 1 : 0;
}

/** The order every reporter lists findings in: file, line, column, rule, then message. */
export function compareFindings(a: Finding, b: Finding): number {
  return (
    compareText(a.file, b.file) ||
    a.line - b.line ||
    a.column - b.column ||
    compareText(a.rule, b.rule) ||
    compareText(a.message, b.message)
  );
}

/** Most important first: severity, then the stable order. */
export function compareByImportance(a: Finding, b: Finding): number {
  return RANK[b.severity] - RANK[a.severity] || compareFindings(a, b);
}

/** Code-unit order, independent of the machine's locale, so outputs are byte-stable. */
export function compareText(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
