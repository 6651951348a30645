// Per-part suppression. A designer writes a symbol field `loadline-ignore` on the part a finding is
// about: rule ids separated by commas or spaces (or `all`), then optionally `:` and a reason —
//   loadline-ignore = "e-series: matched pair, select on test"
// Suppressed findings stay in the result, marked, so every report counts them: a suppression is a
// decision someone can review, never a finding that silently vanished.
import type { Part } from "../circuit/types.js";
import type { Finding } from "./types.js";
import { matchesGlob } from "./glob.js";

export const SUPPRESS_FIELD = "loadline-ignore";

export interface PartSuppression {
  ref: string;
  /** Rule ids, or "all". */
  rules: string[] | "all";
  /** The text after ":" (trimmed), "" when none was given. */
  reason: string;
}

export interface SuppressionProblem {
  file: string;
  line: number;
  column: number;
  message: string;
}

function fieldValue(part: Part): string | undefined {
  for (const [name, value] of Object.entries(part.fields)) {
    // KiCad keeps field names as typed; accept any capitalisation of ours.
    if (name.trim().toLowerCase() === SUPPRESS_FIELD) return value;
  }
  return undefined;
}

/** The part's suppression, if it has a non-empty `loadline-ignore` field. */
export function readSuppression(part: Part): PartSuppression | undefined {
  const raw = fieldValue(part);
  if (raw === undefined || raw.trim() === "") return undefined;
  const colon = raw.indexOf(":");
  const list = colon < 0 ? raw : raw.slice(0, colon);
  const reason = colon < 0 ? "" : raw.slice(colon + 1).trim();
  const ids = list.split(/[\s,;]+/).map((s) => s.trim().toLowerCase()).filter((s) => s !== "");
  return { ref: part.ref, rules: ids.includes("all") ? "all" : ids, reason };
}

/**
 * Marks every finding covered by a suppression on one of its parts (`finding.suppressed = { reason }`).
 * Returns new finding objects; the input is not changed. Findings that name no parts cannot be
 * suppressed per part (configure the rule's severity instead).
 */
export function applySuppressions(findings: readonly Finding[], parts: readonly Part[]): Finding[] {
  const byRef = new Map<string, PartSuppression>();
  for (const part of parts) {
    const suppression = readSuppression(part);
    if (suppression) byRef.set(part.ref, suppression);
  }
  return findings.map((finding) => {
    if (finding.suppressed) return { ...finding };
    for (const ref of finding.parts) {
      const s = byRef.get(ref);
      if (s && (s.rules === "all" || s.rules.includes(finding.rule))) {
        const reason = s.reason !== "" ? s.reason : `${SUPPRESS_FIELD} on ${ref}, no reason given`;
        return { ...finding, suppressed: { reason } };
      }
    }
    return { ...finding };
  });
}

/** Suppression fields that name no known rule: probably a typo that leaves a finding unsuppressed. */
export function suppressionProblems(parts: readonly Part[], knownRuleIds: readonly string[]): SuppressionProblem[] {
  const problems: SuppressionProblem[] = [];
  for (const part of parts) {
    const s = readSuppression(part);
    if (!s || s.rules === "all") continue;
    for (const id of s.rules) {
      if (!knownRuleIds.includes(id)) {
        problems.push({
          file: part.origin.file,
          line: part.origin.line,
          column: part.origin.column,
          message: `${part.ref}: field '${SUPPRESS_FIELD}' names unknown rule '${id}' (\`loadline rules\` lists them; write the ids, then ':' and a reason)`,
        });
      }
    }
    if (s.rules.length === 0) {
      problems.push({
        file: part.origin.file,
        line: part.origin.line,
        column: part.origin.column,
        message: `${part.ref}: field '${SUPPRESS_FIELD}' names no rule; write rule ids or 'all', then ':' and a reason`,
      });
    }
  }
  return problems;
}

/** Whether a path (relative to the config's folder) is covered by one of the config's `ignore` globs. */
export function matchesIgnore(path: string, globs: readonly string[]): boolean {
  return globs.some((glob) => matchesGlob(path, glob));
}
