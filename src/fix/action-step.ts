// The Action's `fix: true` step: run the same fixes as `loadline fix`, leave the changed files in
// the workspace (a later workflow step can commit them or open a suggestion), and say what happened
// as log lines and warning annotations. Returns lines instead of printing, so it is testable.
import { annotationLine } from "../report/github.js";
import { fixExitCode, runFix, type FixRequest } from "./run.js";

export interface FixStepResult {
  /** Workflow-log lines, in order: plain lines and `::warning` / `::error` commands. */
  lines: string[];
  /** Changed files relative to the workspace, `/`-separated. */
  changedFiles: string[];
  /** 0, 1 or 2 as for `loadline fix`. */
  code: 0 | 1 | 2;
}

export function runFixStep(request: FixRequest & { cwd: string }): FixStepResult {
  const report = runFix({ ...request, dryRun: false });
  const lines: string[] = [];
  for (const e of report.errors) {
    lines.push(annotationLine("error", `fix: ${e.message}`, { title: "loadline fix", ...(e.file !== "" ? { file: e.file, line: e.line, col: e.column } : {}) }));
  }
  for (const file of report.files) {
    for (const edit of file.edits) lines.push(`loadline fix: ${file.display}: ${edit.description}`);
  }
  for (const r of report.refused) lines.push(annotationLine("warning", `fix not made: ${r.reason}`, { title: "loadline fix", file: r.display }));
  const values = report.files.reduce((n, f) => n + f.edits.length, 0);
  if (report.errors.length === 0) {
    lines.push(
      values === 0 && report.refused.length === 0
        ? "loadline fix: nothing to fix"
        : `loadline fix: ${values} value(s) changed in ${report.files.length} file(s), left in the workspace; ${report.refused.length} refused`,
    );
  }
  return { lines, changedFiles: report.files.map((f) => f.display), code: fixExitCode(report) };
}
