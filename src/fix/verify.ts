// Checks that an edited design is the design we meant: the same nets (same partition of pins, same
// names), the same parts with only the intended values changed, the fixed findings gone and no new
// finding brought in. Pure comparisons over what `read` and `lint` produced before and after.
import type { Circuit, Part } from "../circuit/types.js";
import type { Finding } from "../engine/types.js";

/** A value the edit is meant to give a part. */
export interface ExpectedValue {
  ref: string;
  value: string;
}

/** A finding the edit is meant to clear. */
export interface ExpectedGone {
  rule: string;
  ref: string;
}

const MAX_LISTED = 3;

/** Why the nets of `after` differ from those of `before`, or undefined when they are the same. */
export function netDifference(before: Circuit, after: Circuit): string | undefined {
  const beforeNets = netMembership(before);
  const afterNets = netMembership(after);
  const problems: string[] = [];
  for (const [name, pins] of beforeNets) {
    const now = afterNets.get(name);
    if (now === undefined) problems.push(`net ${name} is gone`);
    else if (now !== pins) problems.push(`net ${name} has other pins (${pins || "none"} before, ${now || "none"} after)`);
  }
  for (const name of afterNets.keys()) if (!beforeNets.has(name)) problems.push(`net ${name} is new`);
  return summarise(problems);
}

/** Why the parts of `after` are not those of `before` with exactly the expected values changed. */
export function partDifference(before: Circuit, after: Circuit, expected: readonly ExpectedValue[]): string | undefined {
  const wanted = new Map(expected.map((e) => [e.ref, e.value]));
  const afterParts = new Map(after.parts.map((p) => [p.ref, p]));
  const problems: string[] = [];
  for (const part of before.parts) {
    const now = afterParts.get(part.ref);
    if (now === undefined) {
      problems.push(`${part.ref} is gone`);
      continue;
    }
    const value = wanted.get(part.ref) ?? part.value;
    if (now.value !== value) problems.push(`${part.ref} reads back as ${JSON.stringify(now.value)}, not ${JSON.stringify(value)}`);
    const changed = changedAspect(part, now);
    if (changed !== undefined) problems.push(`${part.ref}'s ${changed} changed`);
  }
  const beforeRefs = new Set(before.parts.map((p) => p.ref));
  for (const part of after.parts) if (!beforeRefs.has(part.ref)) problems.push(`${part.ref} is new`);
  return summarise(problems);
}

/** Findings of `after` that say the edit did not do its job or did harm: an expected-gone finding
 * still there, or a finding (rule and parts) that was not there before. Suppressed findings count
 * on neither side. */
export function findingDifference(
  before: readonly Finding[],
  after: readonly Finding[],
  gone: readonly ExpectedGone[],
): string | undefined {
  const standing = (list: readonly Finding[]) => list.filter((f) => f.suppressed === undefined);
  const beforeKeys = new Set(standing(before).map(findingKey));
  const problems: string[] = [];
  for (const finding of standing(after)) {
    const remaining = gone.find((g) => g.rule === finding.rule && finding.parts.includes(g.ref));
    if (remaining !== undefined) problems.push(`${finding.rule} still reports ${remaining.ref}: ${finding.message}`);
    else if (!beforeKeys.has(findingKey(finding))) problems.push(`the change brings a new ${finding.severity} (${finding.rule}): ${finding.message}`);
  }
  return summarise(problems);
}

/** Net name -> its pins as one sorted string, so two partitions compare with `===`. */
function netMembership(circuit: Circuit): Map<string, string> {
  const nets = new Map<string, string>();
  for (const net of circuit.nets) {
    const pins = net.pins.map((p) => `${p.ref}.${p.pin}`).sort();
    nets.set(net.name, pins.join(" "));
  }
  return nets;
}

/** What else about a part differs, beyond its value (an edit in the wrong place shows up here). */
function changedAspect(before: Part, after: Part): string | undefined {
  if (before.kind !== after.kind) return "kind";
  if (before.libId !== after.libId) return "library symbol";
  if (before.footprint !== after.footprint) return "footprint";
  if (before.dnp !== after.dnp || before.excludedFromSim !== after.excludedFromSim) return "flags";
  if (!sameRecord(before.pins, after.pins)) return "pin connections";
  if (!sameRecord(before.fields, after.fields)) return "fields";
  return undefined;
}

function sameRecord(a: Record<string, string>, b: Record<string, string>): boolean {
  const keys = Object.keys(a);
  return keys.length === Object.keys(b).length && keys.every((k) => Object.hasOwn(b, k) && a[k] === b[k]);
}

function findingKey(finding: Finding): string {
  return `${finding.rule}\u0000${finding.sheetPath}\u0000${[...finding.parts].sort().join(",")}`;
}

function summarise(problems: readonly string[]): string | undefined {
  if (problems.length === 0) return undefined;
  const shown = problems.slice(0, MAX_LISTED).join("; ");
  return problems.length > MAX_LISTED ? `${shown}; and ${problems.length - MAX_LISTED} more` : shown;
}
