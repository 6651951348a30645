// Runs one rule over a board through the real lint() core (reader, config lookup, Context, runner),
// from the fixture folder or from files held in memory, and returns its findings.
import { lint } from "../../src/engine/lint.js";
import { memoryPathLister } from "../../src/engine/expand.js";
import type { Context } from "../../src/engine/context.js";
import type { Rule } from "../../src/engine/rule.js";
import type { Finding } from "../../src/engine/types.js";
import { memoryFileSource } from "../../src/read/index.js";

function only(result: ReturnType<typeof lint>, what: string): Finding[] {
  const problems = [...(result.errors ?? []), ...result.designs.flatMap((d) => d.errors)];
  if (problems.length > 0) throw new Error(`${what}: ${JSON.stringify(problems)}`);
  const design = result.designs[0];
  if (!design || result.designs.length !== 1) throw new Error(`${what}: expected one design, got ${result.designs.length}`);
  return design.findings;
}

/** The rule's findings on a board file on disk (its loadline.json, if any, found beside it). */
export function ruleFindings(rule: Rule<Context>, board: string): Finding[] {
  return only(lint({ paths: [board], rules: [rule] }), board);
}

/** The rule's findings on a design held in memory: `files` maps absolute paths to text. */
export function ruleFindingsInMemory(rule: Rule<Context>, files: Record<string, string>, board: string): Finding[] {
  return only(lint({ paths: [board], fs: memoryFileSource(files), lister: memoryPathLister(Object.keys(files)), rules: [rule] }), board);
}

/** Relative difference |a − b| / |b|. */
export function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

/** A number figure of a finding's data, or a thrown error saying what was there instead. */
export function num(f: Finding | undefined, key: string): number {
  const v = f?.data[key];
  if (typeof v !== "number") throw new Error(`data.${key} is not a number: ${JSON.stringify(v)}`);
  return v;
}

/** A list-of-numbers figure of a finding's data. */
export function numbers(f: Finding | undefined, key: string): number[] {
  const v = f?.data[key];
  if (!Array.isArray(v) || !v.every((x) => typeof x === "number")) throw new Error(`data.${key} is not a number list: ${JSON.stringify(v)}`);
  return v as number[];
}
