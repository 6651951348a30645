// GitHub workflow-command annotations (`::error file=…,line=…::message`). The escaping follows
// @actions/core's command.js (shared notes §2) but lives here as a pure function, so what a hostile
// field value does to the log can be tested as plain strings. GitHub shows at most 10 annotations per
// level per step (notes §3); the rest are counted in one closing notice and listed in the job summary.
import type { Finding, Severity } from "../engine/types.js";
import type { LintResult, RunProblem } from "../engine/result.js";
import { compareByImportance } from "../engine/result.js";
import type { PathBase } from "./paths.js";
import { displayPath } from "./paths.js";

export type AnnotationLevel = "error" | "warning" | "notice";

const LEVEL: Record<Severity, AnnotationLevel> = { error: "error", warning: "warning", note: "notice" };

/** Message text: `%`, CR and LF escaped, so the text cannot end the command or start another. */
export function escapeData(text: string): string {
  return text.replace(/%/g, "%25").replace(/\r/g, "%0D").replace(/\n/g, "%0A");
}

/** Property values additionally escape `:` and `,`, which delimit properties and the message. */
export function escapeProperty(text: string): string {
  return escapeData(text).replace(/:/g, "%3A").replace(/,/g, "%2C");
}

export interface AnnotationProps {
  title?: string;
  file?: string;
  line?: number;
  col?: number;
}

/** One workflow command line. Lines and columns below 1 are left out, as the runner drops them. */
export function annotationLine(level: AnnotationLevel, message: string, props: AnnotationProps = {}): string {
  const fields: string[] = [];
  if (props.title) fields.push(`title=${escapeProperty(props.title)}`);
  if (props.file) {
    fields.push(`file=${escapeProperty(props.file)}`);
    if (props.line !== undefined && props.line >= 1) {
      fields.push(`line=${props.line}`);
      if (props.col !== undefined && props.col >= 1) fields.push(`col=${props.col}`);
    }
  }
  return `::${level}${fields.length > 0 ? ` ${fields.join(",")}` : ""}::${escapeData(message)}`;
}

export interface AnnotationOptions extends PathBase {
  /** Per level; GitHub displays 10 per step. */
  maxPerLevel?: number;
  /** Where the findings that did not fit are listed, for the closing notice. */
  overflowPlace?: string;
}

export interface Annotations {
  lines: string[];
  /** Findings (standing, not suppressed) that got no annotation, most important first. */
  overflow: Finding[];
}

function findingTitle(f: Finding): string {
  return f.parts.length > 0 ? `loadline ${f.rule} (${f.parts.join(", ")})` : `loadline ${f.rule}`;
}

/**
 * Annotations for a run: run and read errors first (they take error slots), then findings by
 * importance; suppressed findings are not annotated. Paths are relative to the workspace root.
 */
export function formatAnnotations(result: LintResult, options: AnnotationOptions): Annotations {
  const max = options.maxPerLevel ?? 10;
  const problems: RunProblem[] = [...(result.errors ?? []), ...result.designs.flatMap((d) => d.errors)];
  const findings = result.designs.flatMap((d) => d.findings).filter((f) => !f.suppressed).sort(compareByImportance);

  const plan = (noticeCap: number): { shownProblems: RunProblem[]; shown: Finding[]; overflow: Finding[]; hiddenProblems: number } => {
    const caps: Record<AnnotationLevel, number> = { error: max, warning: max, notice: noticeCap };
    const shownProblems = problems.slice(0, caps.error);
    caps.error -= shownProblems.length;
    const shown: Finding[] = [];
    const overflow: Finding[] = [];
    for (const f of findings) {
      const level = LEVEL[f.severity];
      if (caps[level] > 0) {
        caps[level]--;
        shown.push(f);
      } else overflow.push(f);
    }
    return { shownProblems, shown, overflow, hiddenProblems: problems.length - shownProblems.length };
  };

  let chosen = plan(max);
  // The closing notice is itself a notice: make room for it when anything overflows.
  if (chosen.overflow.length + chosen.hiddenProblems > 0) chosen = plan(Math.max(0, max - 1));

  const lines: string[] = [];
  for (const p of chosen.shownProblems) {
    lines.push(annotationLine("error", p.message, { title: "loadline could not check this file", file: displayPath(p.file, options), line: p.line, col: p.column }));
  }
  for (const f of chosen.shown) {
    lines.push(annotationLine(LEVEL[f.severity], f.message, { title: findingTitle(f), file: displayPath(f.file, options), line: f.line, col: f.column }));
  }
  const hidden = chosen.overflow.length + chosen.hiddenProblems;
  if (hidden > 0) {
    const noun = hidden === 1 ? "finding is" : "findings are";
    lines.push(annotationLine("notice", `${hidden} more ${noun} in ${options.overflowPlace ?? "the job summary"}`, { title: "loadline" }));
  }
  return { lines, overflow: chosen.overflow };
}
