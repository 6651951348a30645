// The job summary (GITHUB_STEP_SUMMARY) as GitHub-flavoured Markdown: counts, a findings table,
// the rails' worst impedance, problems. GitHub refuses a step summary over 1 MiB (shared notes §3),
// so the table is capped and the whole text measured in bytes, rows dropped until it fits.
import type { Finding } from "../engine/types.js";
import type { LintResult } from "../engine/result.js";
import { compareByImportance, compareText, countBySeverity } from "../engine/result.js";
import { bandText, countsText, plural, si } from "./format.js";
import { clip } from "./sanitize.js";
import type { PathBase } from "./paths.js";
import { displayPath } from "./paths.js";

export const SUMMARY_BYTE_LIMIT = 1024 * 1024;

export interface MarkdownOptions extends PathBase {
  /** Findings that got no annotation (from formatAnnotations), called out above the table. */
  overflow?: Finding[];
  maxRows?: number;
  /** Default: 1 MiB less a margin for whatever else the step writes. */
  maxBytes?: number;
  /** Longest message shown in a cell; the JSON and SARIF reports carry the full text. */
  maxCellChars?: number;
}

/** Text for a table cell: nothing in it can end the cell, open a tag or an entity, or break the row. */
export function escapeCell(text: string): string {
  return text
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/([\\`*_[\]|~])/g, "\\$1")
    .replace(/\r\n|\r|\n/g, "<br>")
    .replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/g, "\ufffd");
}

const ICON: Record<Finding["severity"], string> = { error: "🔴 error", warning: "🟠 warning", note: "🔵 note" };

function findingRow(f: Finding, o: MarkdownOptions): string {
  const path = displayPath(f.file, o);
  const where = f.line >= 1 ? `${path}:${f.line}:${Math.max(1, f.column)}` : path;
  const cells = [
    ICON[f.severity],
    `\`${f.rule}\``,
    escapeCell(f.parts.join(", ")) || "-",
    escapeCell(where),
    escapeCell(clip(f.message, o.maxCellChars ?? 600)) || "-",
  ];
  return `| ${cells.join(" | ")} |`;
}

function render(result: LintResult, o: MarkdownOptions, rowLimit: number, cutNote: string): string {
  const counts = countBySeverity(result);
  const designs = [...result.designs].sort((a, b) => compareText(a.file, b.file));
  const out: string[] = ["## loadline", ""];
  out.push(`**${countsText(counts)}** in ${plural(designs.length, "design")} · band ${escapeCell(bandText(result.band))}`, "");

  const problems = [...(result.errors ?? []), ...designs.flatMap((d) => d.errors)];
  if (problems.length > 0) {
    out.push("### Could not check", "");
    for (const p of problems.slice(0, 100)) {
      const where = p.line >= 1 ? `${displayPath(p.file, o)}:${p.line}:${Math.max(1, p.column)}` : displayPath(p.file, o);
      out.push(`- ${escapeCell(where)}: ${escapeCell(clip(p.message, 600))}`);
    }
    if (problems.length > 100) out.push(`- … and ${problems.length - 100} more`);
    out.push("");
  }

  const standing = designs.flatMap((d) => d.findings).filter((f) => !f.suppressed).sort(compareByImportance);
  if (standing.length > 0) {
    out.push("### Findings", "");
    const overflow = o.overflow?.length ?? 0;
    if (overflow > 0) out.push(`${plural(overflow, "finding")} did not fit in the annotations; all are in this table.`, "");
    out.push("| severity | rule | parts | where | message |", "|---|---|---|---|---|");
    for (const f of standing.slice(0, rowLimit)) out.push(findingRow(f, o));
    if (standing.length > rowLimit) {
      out.push("", `Showing ${rowLimit} of ${standing.length} findings${cutNote}; the JSON and SARIF reports hold them all.`);
    }
    out.push("");
  }

  const rails = designs.flatMap((d) => d.rails.map((r) => ({ design: d.file, r })));
  if (rails.length > 0) {
    out.push("### Rail impedance in band", "", "| design | rail | volts | target | worst \\|Z\\| | at | |", "|---|---|---|---|---|---|---|");
    for (const { design, r } of rails.slice(0, 200)) {
      const worst = r.worst ? si(r.worst.ohms, "Ω") : "-";
      const at = r.worst ? si(r.worst.hertz, "Hz") : "-";
      const ok = r.worst === undefined ? "-" : r.worst.ohms <= r.targetOhms ? "✅" : "❌";
      out.push(`| ${escapeCell(displayPath(design, o))} | ${escapeCell(r.net)} | ${si(r.volts, "V")} | ${si(r.targetOhms, "Ω")} | ${worst} | ${at} | ${ok} |`);
    }
    if (rails.length > 200) out.push("", `Showing 200 of ${rails.length} rails.`);
    out.push("");
  }

  const suppressed = designs.flatMap((d) => d.findings).filter((f) => f.suppressed);
  if (suppressed.length > 0) {
    out.push(`<details><summary>${plural(suppressed.length, "suppressed finding")}</summary>`, "");
    out.push("| rule | parts | reason |", "|---|---|---|");
    for (const f of suppressed.slice(0, Math.min(rowLimit, 200))) {
      out.push(`| \`${f.rule}\` | ${escapeCell(f.parts.join(", ")) || "-"} | ${escapeCell(clip(f.suppressed?.reason ?? "", 300)) || "-"} |`);
    }
    out.push("", "</details>", "");
  }
  if (standing.length === 0 && problems.length === 0) out.push("No findings.", "");
  return out.join("\n");
}

export function formatMarkdown(result: LintResult, options: MarkdownOptions): string {
  const maxBytes = options.maxBytes ?? SUMMARY_BYTE_LIMIT - 16 * 1024;
  const total = result.designs.reduce((n, d) => n + d.findings.length, 0);
  let rows = Math.min(options.maxRows ?? 500, total);
  let text = render(result, options, rows, "");
  if (Buffer.byteLength(text, "utf8") <= maxBytes) return text;
  // Too big: find the most rows that fit (bounded binary search), and say the table was cut.
  const note = " (cut to stay under GitHub's 1 MiB job-summary limit)";
  let lo = 0;
  let hi = rows;
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (Buffer.byteLength(render(result, options, mid, note), "utf8") <= maxBytes) lo = mid;
    else hi = mid - 1;
  }
  rows = lo;
  text = render(result, options, rows, note);
  if (Buffer.byteLength(text, "utf8") <= maxBytes) return text;
  // Even with no rows it does not fit (enormous file names): keep the counts only.
  const counts = countBySeverity(result);
  return `## loadline\n\n**${countsText(counts)}**. The summary was too large for GitHub's 1 MiB limit; see the JSON or SARIF report.\n`;
}
