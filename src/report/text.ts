// The terminal report: findings grouped by design and sheet, one line each —
//   file:line:column  severity  rule-id  parts  message
// Colours come in as a picocolors `Colors` object decided at the edge (TTY, NO_COLOR, --no-color);
// this module never looks at the environment.
import type { Colors } from "./colors.js";
import { noColors } from "./colors.js";
import type { Finding, Severity } from "../engine/types.js";
import type { DesignReport, LintResult, RunProblem } from "../engine/result.js";
import { compareFindings, compareText, countBySeverity } from "../engine/result.js";
import { bandText, countsText, plural } from "./format.js";
import { printable } from "./sanitize.js";
import type { PathBase } from "./paths.js";
import { displayPath } from "./paths.js";

export interface TextOptions extends PathBase {
  colors: Colors;
  /** List suppressed findings one per line (default: only count them per design). */
  showSuppressed?: boolean;
}

function severityLabel(severity: Severity, c: Colors): string {
  const padded = severity.padEnd(7);
  if (severity === "error") return c.red(c.bold(padded));
  if (severity === "warning") return c.yellow(padded);
  return c.cyan(padded);
}

function where(file: string, line: number, column: number, o: TextOptions): string {
  const path = printable(displayPath(file, o));
  return line >= 1 ? `${path}:${line}:${Math.max(1, column)}` : path;
}

function findingLine(f: Finding, o: TextOptions): string {
  const c = o.colors;
  const parts = f.parts.length > 0 ? ` ${c.bold(printable(f.parts.join(", ")))}` : "";
  const head = `${c.dim(where(f.file, f.line, f.column, o))}  ${severityLabel(f.severity, c)} ${c.magenta(f.rule)}${parts}`;
  return `    ${head}  ${printable(f.message)}`;
}

function problemLine(p: RunProblem, label: string, o: TextOptions, paint: (s: string) => string): string {
  return `    ${o.colors.dim(where(p.file, p.line, p.column, o))}  ${paint(label)} ${printable(p.message)}`;
}

function designSection(d: DesignReport, o: TextOptions): string[] {
  const c = o.colors;
  const lines = [c.bold(c.underline(printable(displayPath(d.file, o))))];
  for (const p of d.errors) lines.push(problemLine(p, "could not check:", o, (s) => c.red(c.bold(s))));
  const standing = d.findings.filter((f) => !f.suppressed);
  const sheets = new Map<string, Finding[]>();
  for (const f of standing) {
    const key = `${f.sheetPath}\u0000${f.file}`;
    const list = sheets.get(key) ?? [];
    list.push(f);
    sheets.set(key, list);
  }
  for (const key of [...sheets.keys()].sort(compareText)) {
    const list = (sheets.get(key) ?? []).sort(compareFindings);
    const first = list[0];
    if (!first) continue;
    lines.push(`  ${c.bold(`sheet ${printable(first.sheetPath || "/")}`)} ${c.dim(`(${printable(displayPath(first.file, o))})`)}`);
    for (const f of list) lines.push(findingLine(f, o));
  }
  const suppressed = d.findings.filter((f) => f.suppressed).sort(compareFindings);
  if (suppressed.length > 0) {
    if (o.showSuppressed) {
      lines.push(`  ${c.dim("suppressed")}`);
      for (const f of suppressed) lines.push(c.dim(`${findingLine(f, { ...o, colors: noColors } /* inner colours would end the dim early */)}  [suppressed: ${printable(f.suppressed?.reason ?? "")}]`));
    } else {
      lines.push(`  ${c.dim(`${plural(suppressed.length, "suppressed finding")} (loadline-ignore fields)`)}`);
    }
  }
  for (const p of d.notes ?? []) lines.push(problemLine(p, "note:", o, c.dim));
  if (standing.length === 0 && d.errors.length === 0) lines.push(`  ${c.green("no findings")}`);
  return lines;
}

export function formatText(result: LintResult, options: TextOptions): string {
  const c = options.colors;
  const lines: string[] = [];
  for (const p of result.errors ?? []) lines.push(problemLine(p, "error:", options, (s) => c.red(c.bold(s))).trimStart());
  const designs = [...result.designs].sort((a, b) => compareText(a.file, b.file));
  for (const d of designs) {
    lines.push(...designSection(d, options), "");
  }
  const counts = countBySeverity(result);
  const failed = result.designs.filter((d) => d.errors.length > 0).length;
  const mark = counts.error > 0 || failed > 0 ? c.red("✖") : counts.warning > 0 ? c.yellow("⚠") : c.green("✔");
  const unread = failed > 0 ? `, ${plural(failed, "design")} could not be checked` : "";
  lines.push(`${mark} ${countsText(counts)} in ${plural(designs.length, "design")}${unread} · band ${bandText(result.band)}`);
  return `${lines.join("\n")}\n`;
}
