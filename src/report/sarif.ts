// SARIF 2.1.0 for code scanning. What GitHub reads is described in shared notes §5; the output is
// checked against the OASIS schema in test/schemas/. Design checks are not security alerts: rules
// carry `problem.severity` and never `security-severity`.
import { createHash } from "node:crypto";
import { pathToFileURL } from "node:url";
import type { Log, ReportingDescriptor, Result, Run, Notification, Location, Fix } from "sarif";
import type { Finding, Severity } from "../engine/types.js";
import type { LintResult, RunProblem } from "../engine/result.js";
import { compareFindings, hasRunErrors } from "../engine/result.js";
import type { RuleInfo } from "../engine/rule.js";
import { ruleHelpMarkdown, ruleHelpText } from "../engine/rule-doc.js";
import { clip } from "./sanitize.js";
import type { PathBase } from "./paths.js";
import { displayPath, relativeToRoot } from "./paths.js";

export const SARIF_SCHEMA_URI = "https://json.schemastore.org/sarif-2.1.0.json";
export const FINGERPRINT_KEY = "loadlineFinding/v1";
const SRCROOT = "%SRCROOT%";

export interface SarifOptions extends PathBase {
  /** `runAutomationDetails.id`: "category/run-id"; several uploads per commit need distinct categories. */
  automationId?: string;
}

const PROBLEM_SEVERITY: Record<Severity, string> = { error: "error", warning: "warning", note: "recommendation" };

/** "rail-bypass" -> "RailBypass": SARIF's rule `name` is an identifier-like label. */
function ruleName(id: string): string {
  return id.split(/[^a-zA-Z0-9]+/).filter(Boolean).map((w) => w[0]?.toUpperCase() + w.slice(1)).join("");
}

type RunRule = RuleInfo & { level?: Severity | "off" };

function descriptor(rule: RunRule): ReportingDescriptor {
  const level = rule.level ?? rule.severity;
  return {
    id: rule.id,
    name: ruleName(rule.id),
    shortDescription: { text: clip(rule.title || rule.id, 1024) },
    fullDescription: { text: clip(rule.doc.what || rule.title || rule.id, 1024) },
    help: { text: ruleHelpText(rule), markdown: ruleHelpMarkdown(rule) },
    defaultConfiguration: level === "off" ? { enabled: false, level: rule.severity } : { level },
    properties: {
      tags: ["loadline", ...(rule.tags ?? [])].slice(0, 20),
      precision: "high",
      "problem.severity": PROBLEM_SEVERITY[level === "off" ? rule.severity : level],
    },
  };
}

/** Rules a finding names but the run did not describe (should not happen; keeps the log valid). */
function placeholderRule(id: string): RunRule {
  return { id, title: id, severity: "warning", options: {}, doc: { what: id, why: "", fix: "", references: [] } };
}

/** Figures change when a value is tuned; the finding should keep its identity, so digits go. Signs
 * stay: "+12V" and "-12V" are different rails. */
export function normaliseMessage(message: string): string {
  return message.replace(/\d+(?:[.,]\d+)*(?:[eE][-+]?\d+)?/g, "#").replace(/\s+/g, " ").trim();
}

/** Identity of a finding across runs: rule, file, parts and nets (names, which the digit-free message
 * cannot tell apart: "+12V" vs "+5V"), and the message without its figures. */
export function fingerprint(finding: Pick<Finding, "rule" | "parts" | "message"> & { nets?: string[] }, file: string): string {
  const parts = [...finding.parts].sort();
  const nets = [...(finding.nets ?? [])].sort();
  const key = JSON.stringify([finding.rule, file, parts, nets, normaliseMessage(finding.message)]);
  return createHash("sha256").update(key).digest("hex").slice(0, 32);
}

/** Percent-encode per segment: a space in a folder name must not break the uri-reference format. */
function encodePath(posixPath: string): string {
  return posixPath.split("/").map(encodeURIComponent).join("/");
}

function artifactLocation(file: string, base: PathBase): { uri: string; uriBaseId?: string } {
  const rel = relativeToRoot(file, base);
  if (rel !== undefined) return { uri: encodePath(rel), uriBaseId: SRCROOT };
  return { uri: pathToFileURL(displayPath(file, base)).href };
}

function location(file: string, line: number, column: number, base: PathBase): Location {
  const physical: NonNullable<Location["physicalLocation"]> = { artifactLocation: artifactLocation(file, base) };
  if (line >= 1) physical.region = column >= 1 ? { startLine: line, startColumn: column } : { startLine: line };
  return { physicalLocation: physical };
}

function fixOf(finding: Finding, base: PathBase): Fix[] | undefined {
  if (!finding.fix) return undefined;
  const { span, replacement, description } = finding.fix;
  return [{
    description: { text: description },
    artifactChanges: [{
      artifactLocation: artifactLocation(span.file, base),
      replacements: [{ deletedRegion: { charOffset: span.start, charLength: span.end - span.start }, insertedContent: { text: replacement } }],
    }],
  }];
}

function notification(problem: RunProblem, base: PathBase): Notification {
  return { level: "error", message: { text: problem.message || "unknown problem" }, locations: [location(problem.file, problem.line, problem.column, base)] };
}

export function formatSarif(result: LintResult, options: SarifOptions): string {
  const rules: RunRule[] = [...(result.rules ?? [])];
  const index = new Map<string, number>(rules.map((r, i) => [r.id, i]));
  const findings = result.designs.flatMap((d) => d.findings).sort(compareFindings);
  for (const f of findings) {
    if (!index.has(f.rule)) {
      index.set(f.rule, rules.length);
      rules.push(placeholderRule(f.rule));
    }
  }

  const seen = new Map<string, number>();
  const results: Result[] = findings.map((f) => {
    const file = relativeToRoot(f.file, options) ?? displayPath(f.file, options);
    const hash = fingerprint(f, file);
    const occurrence = (seen.get(hash) ?? 0) + 1;
    seen.set(hash, occurrence);
    const r: Result = {
      ruleId: f.rule,
      ruleIndex: index.get(f.rule) ?? 0,
      level: f.severity,
      message: { text: f.message || f.rule },
      locations: [location(f.file, f.line, f.column, options)],
      partialFingerprints: { [FINGERPRINT_KEY]: `${hash}:${occurrence}` },
      properties: { parts: f.parts, nets: f.nets, sheetPath: f.sheetPath, data: f.data },
    };
    const fixes = fixOf(f, options);
    if (fixes) r.fixes = fixes;
    if (f.suppressed) r.suppressions = [{ kind: "inSource", status: "accepted", justification: f.suppressed.reason }];
    return r;
  });

  const problems = [...(result.errors ?? []), ...result.designs.flatMap((d) => d.errors)];
  const root = pathToFileURL(options.root).href.replace(/\/*$/, "/");
  const run: Run = {
    tool: { driver: { name: "loadline", semanticVersion: result.toolVersion, version: result.toolVersion, rules: rules.map(descriptor) } },
    automationDetails: { id: options.automationId ?? "loadline/" },
    originalUriBaseIds: { [SRCROOT]: { uri: root } },
    columnKind: "utf16CodeUnits",
    invocations: [{ executionSuccessful: !hasRunErrors(result), toolExecutionNotifications: problems.map((p) => notification(p, options)) }],
    results,
  };
  const log: Log = { $schema: SARIF_SCHEMA_URI, version: "2.1.0", runs: [run] };
  return `${JSON.stringify(log, finiteOrNull, 2)}\n`;
}

/** JSON has no Infinity or NaN; an open circuit's impedance is reported as null rather than dropped. */
export function finiteOrNull(_key: string, value: unknown): unknown {
  return typeof value === "number" && !Number.isFinite(value) ? null : value;
}
