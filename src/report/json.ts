// The machine-readable report. Versioned (`schemaVersion`) and described by schema/report.schema.json;
// a change that removes or renames a field bumps the version. Order is stable (designs by file,
// findings by file/line/column/rule) so two runs over the same files give identical bytes.
import type { Finding } from "../engine/types.js";
import type { DesignReport, LintResult, RunProblem } from "../engine/result.js";
import { compareFindings, compareText, countBySeverity } from "../engine/result.js";
import { finiteOrNull } from "./sarif.js";
import type { PathBase } from "./paths.js";
import { displayPath } from "./paths.js";

export const REPORT_SCHEMA_VERSION = 1;

type PathOf = (path: string) => string;

function posix(path: string): string {
  return path.replace(/\\/g, "/");
}

function problem(p: RunProblem, pathOf: PathOf): RunProblem {
  return { file: pathOf(p.file), line: p.line, column: p.column, message: p.message };
}

function finding(f: Finding, design: string, pathOf: PathOf): Record<string, unknown> {
  return {
    rule: f.rule,
    severity: f.severity,
    message: f.message,
    parts: f.parts,
    nets: f.nets,
    file: pathOf(f.file),
    line: f.line,
    column: f.column,
    sheetPath: f.sheetPath,
    design: pathOf(design),
    data: f.data,
    suppressed: f.suppressed ? { reason: f.suppressed.reason } : null,
    fix: f.fix
      ? { file: pathOf(f.fix.span.file), start: f.fix.span.start, end: f.fix.span.end, replacement: f.fix.replacement, description: f.fix.description }
      : null,
  };
}

function design(d: DesignReport, pathOf: PathOf): Record<string, unknown> {
  return {
    file: pathOf(d.file),
    sheetFiles: d.sheetFiles.map(pathOf),
    // Fields copied by name: the schema is the contract, whatever else the objects carry.
    rails: [...d.rails]
      .sort((a, b) => compareText(a.net, b.net))
      .map((r) => ({
        net: r.net, volts: r.volts, targetOhms: r.targetOhms, targetBasis: r.targetBasis, curve: r.curve,
        ...(r.worst ? { worst: { ohms: r.worst.ohms, hertz: r.worst.hertz } } : {}),
      })),
    bases: [...d.bases]
      .sort((a, b) => compareText(a.ref, b.ref))
      .map((b) => ({ ref: b.ref, net: b.net, curve: b.curve, limitOhms: b.limitOhms, ...(b.limitCurve ? { limitCurve: b.limitCurve } : {}) })),
    devices: [...d.devices]
      .sort((a, b) => compareText(a.ref, b.ref))
      .map((v) => ({ ref: v.ref, type: v.type, region: v.region, figures: v.figures })),
    errors: d.errors.map((p) => problem(p, pathOf)),
    notes: (d.notes ?? []).map((p) => problem(p, pathOf)),
  };
}

/** With `base`, file paths are relative to its root (POSIX, as in SARIF and annotations), so a report
 * made in CI reads the same on any machine; without it they are as the run named them. */
export function formatJson(result: LintResult, base?: PathBase): string {
  const pathOf: PathOf = base ? (p) => displayPath(p, base) : posix;
  const designs = [...result.designs].sort((a, b) => compareText(a.file, b.file));
  const findings = designs
    .flatMap((d) => d.findings.map((f) => ({ f, design: d.file })))
    .sort((a, b) => compareFindings(a.f, b.f) || compareText(a.design, b.design))
    .map(({ f, design: file }) => finding(f, file, pathOf));
  const report = {
    schemaVersion: REPORT_SCHEMA_VERSION,
    tool: { name: "loadline", version: result.toolVersion },
    band: result.band,
    summary: { ...countBySeverity(result), designs: designs.length },
    findings,
    designs: designs.map((d) => design(d, pathOf)),
    errors: (result.errors ?? []).map((p) => problem(p, pathOf)),
  };
  return `${JSON.stringify(report, finiteOrNull, 2)}\n`;
}
