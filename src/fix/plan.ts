// Deciding which fix edits to make, per file, before anything is written. Pure.
//
// One span of text can stand for several parts: a sheet file used by several sheet instances holds
// one Value for all of them. Changing it changes every instance, so such an edit is made only when
// every instance that shares the text asks for the same new value; otherwise it is refused with the
// instances and their wishes named. Overlapping edits are refused too: we never guess an order.
import type { Part, TextSpan } from "../circuit/types.js";
import type { Finding } from "../engine/types.js";

/** One design as linted: its parts (with their value spans) and its findings. */
export interface PlanDesign {
  parts: readonly Part[];
  findings: readonly Finding[];
}

export interface PlanOptions {
  /** Only fixes from these rule ids; all rules when absent or empty. */
  rules?: readonly string[];
  /** How a file is named in messages (the CLI passes a cwd-relative path); as given by default. */
  displayPath?: (file: string) => string;
}

/** One instance's request: which part, on which sheet, wants what. */
export interface FixWish {
  design: number;
  ref: string;
  sheetPath: string;
  rule: string;
  replacement: string;
  finding: Finding;
}

export interface PlannedEdit {
  span: TextSpan;
  replacement: string;
  /** The value as it is now ("" when no part was found holding the span). */
  oldValue: string;
  /** Every part instance the edit changes, natural order. */
  refs: string[];
  sheetPaths: string[];
  rules: string[];
  /** One line for people; says so when the edit covers several instances. */
  description: string;
  wishes: FixWish[];
}

export interface RefusedFix {
  span: TextSpan;
  refs: string[];
  rules: string[];
  reason: string;
  wishes: FixWish[];
}

export interface FilePlan {
  file: string;
  /** Sorted by position, never overlapping. */
  edits: PlannedEdit[];
}

export interface FixPlan {
  files: FilePlan[];
  refused: RefusedFix[];
}

interface Holder {
  design: number;
  part: Part;
}

interface SpanGroup {
  span: TextSpan;
  wishes: FixWish[];
  /** Suppressed findings that also asked for this span, so a refusal can say why an instance is silent. */
  suppressed: FixWish[];
}

const naturalOrder = new Intl.Collator("en", { numeric: true }).compare;

export function spanKey(span: TextSpan): string {
  return `${span.file}\u0000${span.start}\u0000${span.end}`;
}

/** Builds the per-file plan from the fix edits the findings carry. */
export function planFixes(designs: readonly PlanDesign[], options: PlanOptions = {}): FixPlan {
  const show = options.displayPath ?? ((file: string) => file);
  const ruleFilter = options.rules !== undefined && options.rules.length > 0 ? new Set(options.rules) : undefined;

  const holders = new Map<string, Holder[]>();
  designs.forEach((design, index) => {
    for (const part of design.parts) {
      if (part.valueSpan === undefined) continue;
      const key = spanKey(part.valueSpan);
      const list = holders.get(key) ?? [];
      list.push({ design: index, part });
      holders.set(key, list);
    }
  });

  const groups = new Map<string, SpanGroup>();
  designs.forEach((design, index) => {
    for (const finding of design.findings) {
      const fix = finding.fix;
      if (fix === undefined || (ruleFilter !== undefined && !ruleFilter.has(finding.rule))) continue;
      const key = spanKey(fix.span);
      const group = groups.get(key) ?? { span: fix.span, wishes: [], suppressed: [] };
      groups.set(key, group);
      const holder = holderOf(holders.get(key) ?? [], index, finding);
      const wish: FixWish = {
        design: index,
        ref: holder?.part.ref ?? finding.parts[0] ?? "(unnamed part)",
        sheetPath: holder?.part.origin.sheetPath ?? finding.sheetPath,
        rule: finding.rule,
        replacement: fix.replacement,
        finding,
      };
      (finding.suppressed === undefined ? group.wishes : group.suppressed).push(wish);
    }
  });

  const accepted: PlannedEdit[] = [];
  const refused: RefusedFix[] = [];
  for (const [key, group] of groups) {
    if (group.wishes.length === 0) continue; // only suppressed findings asked: nothing was asked
    const decision = decide(group, holders.get(key) ?? [], show);
    if ("reason" in decision) refused.push(decision);
    else accepted.push(decision);
  }

  const byFile = new Map<string, PlannedEdit[]>();
  for (const edit of accepted) {
    const list = byFile.get(edit.span.file) ?? [];
    list.push(edit);
    byFile.set(edit.span.file, list);
  }
  const files: FilePlan[] = [];
  for (const [file, edits] of [...byFile].sort(([a], [b]) => naturalOrder(a, b))) {
    edits.sort((a, b) => a.span.start - b.span.start || a.span.end - b.span.end);
    const overlapping = new Set<PlannedEdit>();
    for (let i = 1; i < edits.length; i++) {
      const previous = edits[i - 1];
      const current = edits[i];
      if (previous !== undefined && current !== undefined && current.span.start < previous.span.end) {
        overlapping.add(previous).add(current);
      }
    }
    for (const edit of overlapping) {
      const others = [...overlapping].filter((o) => o !== edit).flatMap((o) => o.refs);
      refused.push({
        span: edit.span,
        refs: edit.refs,
        rules: edit.rules,
        wishes: edit.wishes,
        reason: `${edit.refs.join("/")}: the edit overlaps another edit in ${show(file)} (${others.join("/")}); neither is made`,
      });
    }
    const kept = edits.filter((e) => !overlapping.has(e));
    if (kept.length > 0) files.push({ file, edits: kept });
  }
  refused.sort((a, b) => naturalOrder(a.span.file, b.span.file) || a.span.start - b.span.start);
  return { files, refused };
}

/** The part of this design that holds the span and that the finding is about. */
function holderOf(holders: readonly Holder[], design: number, finding: Finding): Holder | undefined {
  const inDesign = holders.filter((h) => h.design === design);
  return (
    inDesign.find((h) => finding.parts.includes(h.part.ref)) ??
    inDesign.find((h) => h.part.origin.sheetPath === finding.sheetPath) ??
    (inDesign.length === 1 ? inDesign[0] : undefined)
  );
}

function instanceKey(design: number, ref: string): string {
  return `${design}\u0000${ref}`;
}

function decide(group: SpanGroup, holders: readonly Holder[], show: (file: string) => string): PlannedEdit | RefusedFix {
  const file = show(group.span.file);
  const wishes = group.wishes;
  const rules = unique(wishes.map((w) => w.rule));
  const asking = new Set(wishes.map((w) => instanceKey(w.design, w.ref)));
  // Every instance that holds the text is changed by the edit; the askers may also be parts we could
  // not match to a holder (a span no part carries), so take the union.
  const instances = new Map<string, { ref: string; sheetPath: string; design: number }>();
  for (const h of holders) instances.set(instanceKey(h.design, h.part.ref), { ref: h.part.ref, sheetPath: h.part.origin.sheetPath, design: h.design });
  for (const w of wishes) if (!instances.has(instanceKey(w.design, w.ref))) instances.set(instanceKey(w.design, w.ref), { ref: w.ref, sheetPath: w.sheetPath, design: w.design });
  const sortedInstances = [...instances.values()].sort((a, b) => naturalOrder(a.ref, b.ref) || naturalOrder(a.sheetPath, b.sheetPath));
  const refs = unique(sortedInstances.map((i) => i.ref));
  const sheetPaths = unique(sortedInstances.map((i) => i.sheetPath));
  const shared = sortedInstances.length > 1;
  const oldValue = holders[0]?.part.value ?? "";
  const refuse = (reason: string): RefusedFix => ({ span: group.span, refs, rules, wishes, reason });
  const sharePrefix = `${refs.join("/")} share one value in ${file}`;
  const wishText = (w: FixWish) => `${w.ref} (${w.sheetPath}) wants ${w.replacement}` + (rules.length > 1 ? ` [${w.rule}]` : "");

  const silent = sortedInstances.filter((i) => !asking.has(instanceKey(i.design, i.ref)));
  if (silent.length > 0) {
    const why = silent.map((i) => {
      const muted = group.suppressed.some((s) => s.design === i.design && s.ref === i.ref);
      return `${i.ref} (${i.sheetPath}) ${muted ? "has its finding suppressed" : "has no fix for it"}`;
    });
    return refuse(`${sharePrefix}; ${wishes.map(wishText).join(", ")}, but ${why.join(", ")}: not changed`);
  }

  const replacements = unique(wishes.map((w) => w.replacement));
  if (replacements.length > 1) {
    const lead = shared ? sharePrefix : `${refs.join("/")} in ${file}`;
    return refuse(`${lead}; ${wishes.map(wishText).join(", ")}: not changed`);
  }
  const replacement = replacements[0] ?? "";
  if (holders.length > 0 && holders.every((h) => h.part.value === replacement)) {
    return refuse(`${refs.join("/")} in ${file}: the fix would write the value it already has (${replacement}); not changed`);
  }

  const first = wishes[0];
  const description = shared
    ? `${refs.join("/")} ${oldValue} -> ${replacement} (one value in ${file}, shared by ${sheetPaths.join(", ")}; right for every instance)`
    : (first?.finding.fix?.description ?? `${refs.join("/")} ${oldValue} -> ${replacement}`);
  return { span: group.span, replacement, oldValue, refs, sheetPaths, rules, description, wishes };
}

function unique<T>(values: readonly T[]): T[] {
  return [...new Set(values)];
}
