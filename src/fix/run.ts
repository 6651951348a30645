// `loadline fix` as one call: lint, plan, check the edited design in memory, write, check again on
// disk. Every file operation goes through the injected FileSource (reading) and WriteFs (writing),
// so tests can run it on temporary folders and simulate concurrent edits and failures.
//
// The rule of the house: on any doubt, nothing is written and the reason is said. Doubts are an
// edit that does not fit the bytes that were linted, an edited design whose nets, parts or findings
// are not what the edit promised, a file that changed on disk since it was read, a failed write,
// and a re-read after writing that disagrees (then the original is put back).
import { relative, resolve, sep } from "node:path";
import type { Circuit } from "../circuit/types.js";
import type { Context } from "../engine/context.js";
import type { PathLister } from "../engine/expand.js";
import { nodePathLister } from "../engine/expand.js";
import { lint } from "../engine/lint.js";
import type { DesignReport, LintResult, RunProblem } from "../engine/result.js";
import { hasRunErrors } from "../engine/result.js";
import type { Rule } from "../engine/rule.js";
import type { FileSource } from "../read/file-source.js";
import { nodeFileSource } from "../read/file-source.js";
import { readDesign } from "../read/index.js";
import { applyEditsToBytes, decodeForEditing } from "./apply.js";
import type { PlannedEdit } from "./plan.js";
import { planFixes } from "./plan.js";
import { overlaySource, snapshotSource, type SnapshotSource } from "./sources.js";
import { unifiedDiff } from "./unified-diff.js";
import { findingDifference, netDifference, partDifference, type ExpectedGone, type ExpectedValue } from "./verify.js";
import { nodeWriteFs, replaceFileAtomically, type WriteFs } from "./write.js";

export interface FixRequest {
  /** Files, folders or globs, as for `check`. */
  paths: string[];
  configPath?: string;
  /** Only fixes from these rule ids. */
  rules?: string[];
  /** Compute and check everything, write nothing. */
  dryRun?: boolean;
  /** Where relative paths start and what messages are relative to; the process's by default. */
  cwd?: string;
  /** Where files are read from; the real file system by default. */
  source?: FileSource;
  /** How folders and globs are expanded; the real file system by default. */
  lister?: PathLister;
  /** Where files are written; the real file system by default. */
  writeFs?: WriteFs;
  /** Rules to run instead of every rule (tests). */
  lintRules?: readonly Rule<Context>[];
}

export interface FixedFile {
  /** The file as the reader named it. */
  file: string;
  /** The file as messages name it (relative to cwd, `/`-separated). */
  display: string;
  edits: PlannedEdit[];
  /** The unified diff of the change (what `--dry-run` prints). */
  diff: string;
  written: boolean;
}

export interface RefusedEdit {
  file: string;
  display: string;
  refs: string[];
  rules: string[];
  reason: string;
}

export interface FixReport {
  files: FixedFile[];
  refused: RefusedEdit[];
  /** The run itself failed (unreadable design or config): exit 2, nothing written. */
  errors: RunProblem[];
  dryRun: boolean;
}

/** 2 when the run failed, 1 when some fix was refused, 0 when every fix asked for was made (or
 * there was nothing to fix). */
export function fixExitCode(report: FixReport): 0 | 1 | 2 {
  if (report.errors.length > 0) return 2;
  return report.refused.length > 0 ? 1 : 0;
}

interface PreparedEdit extends PlannedEdit {
  file: string;
}

interface FileBytes {
  file: string;
  key: string;
  original: Buffer;
  next: Buffer;
  text: string;
  edits: PreparedEdit[];
}

interface Baseline {
  designs: DesignReport[];
  circuits: Map<string, Circuit>;
}

export function runFix(request: FixRequest): FixReport {
  const cwd = request.cwd ?? process.cwd();
  const inner = request.source ?? nodeFileSource();
  const writeFs = request.writeFs ?? nodeWriteFs();
  const display = (file: string) => displayPath(cwd, file);
  const dryRun = request.dryRun ?? false;
  const report: FixReport = { files: [], refused: [], errors: [], dryRun };
  const refuse = (edits: readonly PreparedEdit[], reason: string) => {
    for (const e of edits) report.refused.push({ file: e.file, display: display(e.file), refs: e.refs, rules: e.rules, reason });
  };

  const snapshot = snapshotSource(inner);
  // lint and the reader open relative paths from the process's folder, and name files relative to
  // it; so lint is given absolute paths, and `display` makes names relative to `cwd` for messages.
  const lintWith = (fs: FileSource, paths: string[], lister?: PathLister): LintResult =>
    lint({
      paths: paths.map((p) => resolve(p)),
      fs,
      lister: lister ?? filesOnly,
      ...(request.configPath !== undefined ? { configPath: request.configPath } : {}),
      ...(request.lintRules !== undefined ? { rules: request.lintRules } : {}),
    });

  const before = lintWith(snapshot.source, request.paths.map((p) => resolve(cwd, p)), request.lister ?? (request.source === undefined ? nodePathLister() : undefined));
  if (hasRunErrors(before)) {
    report.errors.push(...[...(before.errors ?? []), ...before.designs.flatMap((d) => d.errors)].map((e) => ({ ...e, file: display(e.file) })));
    return report;
  }
  const known = new Set((before.rules ?? []).map((r) => r.id));
  const unknown = (request.rules ?? []).filter((id) => !known.has(id));
  if (unknown.length > 0) {
    const list = [...known].sort().join(", ");
    report.errors.push({ file: "", line: 0, column: 0, message: `--rule ${unknown.join(", ")}: no such rule (rules: ${list})` });
    return report;
  }
  const baseline: Baseline = { designs: before.designs, circuits: new Map() };
  const planDesigns = [];
  for (const design of before.designs) {
    const read = readDesign(design.file, { fs: snapshot.source });
    if (!read.ok) {
      report.errors.push({ file: display(read.error.file), line: read.error.line, column: read.error.column, message: read.error.message });
      continue;
    }
    baseline.circuits.set(design.file, read.circuit);
    planDesigns.push({ parts: read.circuit.parts, findings: design.findings });
  }
  if (report.errors.length > 0) return report;

  const plan = planFixes(planDesigns, { ...(request.rules !== undefined ? { rules: request.rules } : {}), displayPath: display });
  for (const r of plan.refused) report.refused.push({ file: r.span.file, display: display(r.span.file), refs: r.refs, rules: r.rules, reason: r.reason });

  // Edits whose bytes do not fit are refused file by file before the design-level checks.
  let candidates: PreparedEdit[] = [];
  for (const filePlan of plan.files) {
    const edits = filePlan.edits.map((e) => ({ ...e, file: filePlan.file }));
    const bytes = bytesFor(snapshot, edits);
    if (typeof bytes === "string") refuse(edits, `${display(filePlan.file)}: ${bytes}; not changed`);
    else candidates.push(...edits);
  }
  if (candidates.length === 0) return finish(report);

  const checkInMemory = (edits: readonly PreparedEdit[]): string | undefined => {
    const files = filesFor(snapshot, edits);
    if (typeof files === "string") return files;
    const replaced = new Map(files.map((f) => [f.key, f.next]));
    return checkDesign(overlaySource(snapshot.source, replaced), edits, files, baseline, snapshot, lintWith);
  };
  candidates = isolate(candidates, checkInMemory, refuse);
  if (candidates.length === 0) return finish(report);

  const files = filesFor(snapshot, candidates);
  if (typeof files === "string") {
    refuse(candidates, files); // cannot happen: each was prepared above
    return finish(report);
  }
  if (dryRun) {
    for (const f of files) report.files.push({ file: f.file, display: display(f.file), edits: f.edits, diff: unifiedDiff(display(f.file), f.text, f.edits), written: false });
    return finish(report);
  }

  const written: FileBytes[] = [];
  for (const f of files) {
    const outcome = replaceFileAtomically(f.file, f.original, f.next, writeFs, display(f.file));
    if (outcome.ok) {
      written.push(f);
      continue;
    }
    refuse(f.edits, outcome.reason);
    // The edits were checked as one set; a part of it on disk is a design nobody checked.
    for (const done of written) refuse(done.edits, `${display(done.file)}: undone, because writing ${display(f.file)} failed (${restore(done, writeFs, display)})`);
    for (const rest of files.slice(files.indexOf(f) + 1)) refuse(rest.edits, `${display(rest.file)}: not written, because writing ${display(f.file)} failed`);
    return finish(report);
  }

  // Read the result back from the disk, as a fresh run would, and check it the same way.
  const fresh = snapshotSource(inner);
  const onDisk = files.filter((f) => {
    const data = fresh.source.read(f.file);
    return Buffer.isBuffer(data) && data.equals(f.next);
  });
  let doubt = onDisk.length === files.length ? checkDesign(fresh.source, candidates, files, baseline, fresh, lintWith) : undefined;
  if (onDisk.length !== files.length) {
    const changed = files.filter((f) => !onDisk.includes(f)).map((f) => display(f.file));
    doubt = `after writing, ${changed.join(", ")} did not read back as written (changed by someone else?)`;
  }
  if (doubt !== undefined) {
    for (const f of files) {
      const undo = onDisk.includes(f) ? restore(f, writeFs, display) : "left as it is now";
      refuse(f.edits, `${display(f.file)}: written, but re-reading it showed ${doubt}; ${undo}`);
    }
    return finish(report);
  }
  for (const f of files) report.files.push({ file: f.file, display: display(f.file), edits: f.edits, diff: unifiedDiff(display(f.file), f.text, f.edits), written: true });
  return finish(report);
}

const filesOnly: PathLister = { kind: () => "file", list: () => ({ error: "folders cannot be listed here" }) };

function finish(report: FixReport): FixReport {
  report.refused.sort((a, b) => (a.display < b.display ? -1 : a.display > b.display ? 1 : 0));
  return report;
}

/** Keeps the edits that pass `check` together. When the whole set fails, each edit is checked on
 * its own (so one bad edit does not block the rest), then the survivors together once more:
 * at most n + 2 checks. */
function isolate(
  edits: PreparedEdit[],
  check: (edits: readonly PreparedEdit[]) => string | undefined,
  refuse: (edits: readonly PreparedEdit[], reason: string) => void,
): PreparedEdit[] {
  const together = check(edits);
  if (together === undefined) return edits;
  if (edits.length === 1) {
    refuse(edits, `${edits[0]?.refs.join("/")}: not changed, because with the change ${together}`);
    return [];
  }
  const survivors: PreparedEdit[] = [];
  for (const edit of edits) {
    const alone = check([edit]);
    if (alone === undefined) survivors.push(edit);
    else refuse([edit], `${edit.refs.join("/")}: not changed, because with the change ${alone}`);
  }
  if (survivors.length === 0) return [];
  const rest = survivors.length === edits.length ? together : check(survivors);
  if (rest === undefined) return survivors;
  refuse(survivors, `${survivors.flatMap((e) => e.refs).join(", ")}: each change passes alone, but together ${rest}; none of them made`);
  return [];
}

function bytesFor(snapshot: SnapshotSource, edits: readonly PreparedEdit[]): FileBytes | string {
  const first = edits[0];
  if (first === undefined) return "no edits";
  const key = snapshot.keyOf(first.file);
  const original = snapshot.bytesOf(first.file);
  if (key === undefined || original === undefined) return "the file was not read during the check";
  const decoded = decodeForEditing(original);
  if (!decoded.ok) return decoded.problem;
  const applied = applyEditsToBytes(original, edits);
  if (!applied.ok) return `the edits do not fit the file as it was read (${applied.problem})`;
  return { file: first.file, key, original, next: applied.bytes, text: decoded.text, edits: [...edits] };
}

function filesFor(snapshot: SnapshotSource, edits: readonly PreparedEdit[]): FileBytes[] | string {
  const byFile = new Map<string, PreparedEdit[]>();
  for (const e of edits) byFile.set(e.file, [...(byFile.get(e.file) ?? []), e]);
  const out: FileBytes[] = [];
  for (const group of byFile.values()) {
    const bytes = bytesFor(snapshot, group);
    if (typeof bytes === "string") return bytes;
    out.push(bytes);
  }
  return out;
}

/** Reads and lints every design that includes a changed file through `source` (which shows the
 * edited bytes) and compares with the baseline; returns the first doubt, or undefined. */
function checkDesign(
  source: FileSource,
  edits: readonly PreparedEdit[],
  files: readonly FileBytes[],
  baseline: Baseline,
  keys: Pick<SnapshotSource, "keyOf">,
  lintWith: (fs: FileSource, paths: string[]) => LintResult,
): string | undefined {
  const changedKeys = new Set(files.map((f) => f.key));
  const touched = baseline.designs
    .map((design, index) => ({ design, index }))
    .filter(({ design }) => design.sheetFiles.some((f) => changedKeys.has(keys.keyOf(f) ?? f)));
  for (const { design, index } of touched) {
    const before = baseline.circuits.get(design.file);
    if (before === undefined) return `${design.file} has no baseline to compare with`;
    const read = readDesign(design.file, { fs: source });
    if (!read.ok) return `${read.error.file} no longer reads (${read.error.message})`;
    const expected: ExpectedValue[] = edits.flatMap((e) => e.wishes.filter((w) => w.design === index).map((w) => ({ ref: w.ref, value: e.replacement })));
    const problem = netDifference(before, read.circuit) ?? partDifference(before, read.circuit, expected);
    if (problem !== undefined) return problem;
  }
  const after = lintWith(source, touched.map((t) => t.design.file));
  if (hasRunErrors(after)) {
    const first = after.errors?.[0] ?? after.designs.flatMap((d) => d.errors)[0];
    return `the check fails on the edited design (${first?.message ?? "unknown error"})`;
  }
  for (const { design, index } of touched) {
    const now = after.designs.find((d) => resolve(d.file) === resolve(design.file));
    if (now === undefined) return `${design.file} was not checked again`;
    const gone: ExpectedGone[] = edits.flatMap((e) => e.wishes.filter((w) => w.design === index).map((w) => ({ rule: w.rule, ref: w.ref })));
    const problem = findingDifference(design.findings, now.findings, gone);
    if (problem !== undefined) return problem;
  }
  return undefined;
}

/** Puts the original bytes back (only if the file still holds what we wrote) and says how it went. */
function restore(file: FileBytes, writeFs: WriteFs, display: (file: string) => string): string {
  const outcome = replaceFileAtomically(file.file, file.next, file.original, writeFs, display(file.file));
  return outcome.ok ? "the original was restored" : `the original could NOT be restored (${outcome.reason}); check ${display(file.file)} by hand`;
}

/** A path for messages: relative to `cwd` when inside it, `/`-separated. `file` is as the reader
 * names it (absolute, or relative to the process's folder). */
export function displayPath(cwd: string, file: string): string {
  const absolute = resolve(file);
  const rel = relative(cwd, absolute);
  const shown = rel === "" || rel === ".." || rel.startsWith(`..${sep}`) ? absolute : rel;
  return sep === "/" ? shown : shown.split(sep).join("/");
}
