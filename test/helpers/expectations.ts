// Reads a rule fixture's expected.json and checks a lint result against it. Each expectation
// names where its figures come from (a handbook, a standard, an ngspice run, our arithmetic);
// the test files add closed-form recomputations of the same figures beside these checks.
import { readFileSync, readdirSync, statSync } from "node:fs";
import { dirname, join } from "node:path";
import { expect } from "vitest";
import type { Finding } from "../../src/engine/types.js";

export interface FigureCheck {
  value: number;
  /** Relative tolerance (0.01 = 1 %). */
  relTol: number;
  source: string;
}

export interface FindingMatch {
  rule: string;
  severity?: "error" | "warning" | "note";
  /** Exactly these parts (order ignored). */
  parts?: string[];
  /** A phrase that tells this finding from the rule's others ("anti-resonate", "no bulk"). */
  messageIncludes?: string;
}

export interface MustFinding extends FindingMatch {
  why: string;
  data?: Record<string, FigureCheck | string | boolean>;
}

export interface Expected {
  board: string;
  why: string;
  must: MustFinding[];
  mustNot: (FindingMatch & { why: string })[];
}

export interface ExpectedBoard {
  expected: Expected;
  /** Absolute path of the board file. */
  board: string;
  file: string;
}

/** Every expected.json under a rule's fixture folder. */
export function expectedBoards(folder: string): ExpectedBoard[] {
  const out: ExpectedBoard[] = [];
  const walk = (dir: string): void => {
    for (const name of readdirSync(dir).sort()) {
      const path = join(dir, name);
      if (statSync(path).isDirectory()) walk(path);
      else if (name.endsWith(".expected.json") || name === "expected.json") {
        const expected = JSON.parse(readFileSync(path, "utf8")) as Expected;
        out.push({ expected, board: join(dirname(path), expected.board), file: path });
      }
    }
  };
  walk(folder);
  return out;
}

export function matches(f: Finding, m: FindingMatch): boolean {
  if (f.rule !== m.rule) return false;
  if (m.severity !== undefined && f.severity !== m.severity) return false;
  if (m.parts !== undefined && [...f.parts].sort().join(",") !== [...m.parts].sort().join(",")) return false;
  if (m.messageIncludes !== undefined && !f.message.includes(m.messageIncludes)) return false;
  return true;
}

/** Asserts the must and must-not lists, and every figure within its tolerance. */
export function checkExpected(findings: Finding[], expected: Expected): void {
  for (const must of expected.must) {
    const found = findings.filter((f) => matches(f, must));
    expect(found, `${expected.board}: expected a finding ${JSON.stringify(must)}; got ${findings.map((f) => `${f.rule}/${f.severity}: ${f.message}`).join(" | ")}`).toHaveLength(1);
    const data = found[0]?.data ?? {};
    for (const [key, check] of Object.entries(must.data ?? {})) {
      const actual = data[key];
      if (typeof check === "object") {
        expect(typeof actual, `${expected.board}: data.${key}`).toBe("number");
        // A zero figure is checked absolutely (it is a count or an exact zero).
        const rel = check.value === 0 ? Math.abs(actual as number) : Math.abs((actual as number) - check.value) / Math.abs(check.value);
        expect(rel, `${expected.board}: data.${key} = ${String(actual)}, expected ${check.value} ± ${check.relTol * 100} % (${check.source})`).toBeLessThanOrEqual(check.relTol);
      } else {
        expect(actual, `${expected.board}: data.${key}`).toEqual(check);
      }
    }
  }
  for (const not of expected.mustNot) {
    const found = findings.filter((f) => matches(f, not));
    expect(found.map((f) => f.message), `${expected.board}: must not report ${JSON.stringify(not)} (${not.why})`).toEqual([]);
  }
}
