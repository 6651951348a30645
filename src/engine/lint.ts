// The core call behind the CLI and the Action: paths in, a LintResult out. Files are read only
// through the given FileSource (memory in tests), nothing is printed, and one design's failure —
// unreadable file, a rule that throws — is recorded for that design while the others go on.
import { dirname, relative, resolve } from "node:path";
import type { Circuit } from "../circuit/types.js";
import type { FileSource } from "../read/file-source.js";
import { nodeFileSource } from "../read/file-source.js";
import { findRootSheets, readDesign } from "../read/index.js";
import { VERSION } from "../version.js";
import { allRules } from "../../rules/index.js";
import type { Config } from "./config.js";
import { CONFIG_FILE_NAME, defaultConfig, findConfigFile, loadConfig } from "./config.js";
import { createContext } from "./context.js";
import type { Context } from "./context.js";
import type { PathLister } from "./expand.js";
import { expandPaths, nodePathLister } from "./expand.js";
import type { DesignReport, LintResult, RunProblem } from "./result.js";
import { compareFindings } from "./result.js";
import type { Rule } from "./rule.js";
import { ruleLevel, runRules } from "./runner.js";
import { applySuppressions, matchesIgnore, suppressionProblems } from "./suppress.js";
import type { Finding } from "./types.js";

export interface LintInputs {
  /** Files, folders (searched for .kicad_sch and .net) or globs. */
  paths: string[];
  /** A config file to use for every design instead of the one found near it. */
  configPath?: string;
  /** A config already loaded (tests, the Action); wins over configPath. */
  config?: Config;
  fs?: FileSource;
  /** Lists folders to expand folder and glob arguments. Defaults to the real file system when `fs`
   * is not given, and to the keys of nothing (plain file paths only) when it is. */
  lister?: PathLister;
  /** Where relative paths and globs start; the process's working directory by default. */
  cwd?: string;
  /** Rules to run instead of every rule (tests). */
  rules?: readonly Rule<Context>[];
  /** Called with each design's Context after its rules ran: commands that report figures rather
   * than findings (`bias`) share the reading, config lookup and error handling of `lint`. */
  visit?: (ctx: Context, design: DesignReport) => void;
}

/** Plain file paths only: every path is taken as a file, and the reader reports it if it is not. */
function filesOnlyLister(): PathLister {
  return { kind: () => "file", list: () => ({ error: "folders cannot be listed here" }) };
}

function textOf(fs: FileSource, path: string): string | { error: string } {
  const data = fs.read(path);
  return Buffer.isBuffer(data) ? data.toString("utf8") : data;
}

interface ConfigChoice {
  config: Config;
  /** The folder ignore globs and the models path are relative to. */
  root: string;
}

/** Run rules so that model-coverage sees every other rule's limitations: it goes last. */
function orderForRun(rules: readonly Rule<Context>[]): Rule<Context>[] {
  return [...rules.filter((r) => r.id !== "model-coverage"), ...rules.filter((r) => r.id === "model-coverage")];
}

/** A rule that throws is a bug in loadline: turn it into an error finding naming the rule, so the
 * design's other findings stand and the report says exactly which check failed. */
function guarded(rule: Rule<Context>, circuit: Circuit): Rule<Context> {
  return {
    ...rule,
    check(ctx, options) {
      try {
        return rule.check(ctx, options);
      } catch (err) {
        const message = err instanceof Error ? err.message : String(err);
        const failure: Finding = {
          rule: rule.id,
          severity: "error",
          message: `Rule ${rule.id} stopped with an internal error, so this design was not fully checked by it (a bug in loadline; please report it with the design): ${message}`,
          parts: [],
          nets: [],
          file: circuit.file,
          line: 0,
          column: 0,
          sheetPath: "/",
          data: { internalError: true },
        };
        return [failure];
      }
    },
  };
}

export function lint(inputs: LintInputs): LintResult {
  const fs = inputs.fs ?? nodeFileSource();
  const lister = inputs.lister ?? (inputs.fs ? filesOnlyLister() : nodePathLister());
  const cwd = inputs.cwd ?? process.cwd();
  const rules = orderForRun(inputs.rules ?? allRules);
  const runErrors: RunProblem[] = [];

  const configCache = new Map<string, ConfigChoice | undefined>();
  const loadConfigFile = (path: string): ConfigChoice | undefined => {
    if (configCache.has(path)) return configCache.get(path);
    const text = textOf(fs, path);
    let choice: ConfigChoice | undefined;
    if (typeof text !== "string") {
      runErrors.push({ file: path, line: 0, column: 0, message: `cannot read the config: ${text.error}` });
    } else {
      const { config, errors } = loadConfig(text, path, rules);
      for (const e of errors) runErrors.push({ file: e.file, line: e.line, column: e.column, message: e.message });
      choice = errors.length === 0 ? { config, root: dirname(resolve(path)) } : undefined;
    }
    configCache.set(path, choice);
    return choice;
  };

  let fixed: ConfigChoice | undefined;
  if (inputs.config) fixed = { config: inputs.config, root: inputs.config.file ? dirname(resolve(inputs.config.file)) : resolve(".") };
  else if (inputs.configPath !== undefined) {
    fixed = loadConfigFile(resolve(cwd, inputs.configPath));
    if (!fixed) return emptyResult(rules, runErrors, defaultConfig());
  }
  const configFor = (design: string): ConfigChoice | undefined => {
    if (fixed) return fixed;
    const found = findConfigFile(design, fs);
    if (found === undefined) return { config: defaultConfig(), root: dirname(resolve(design)) };
    return loadConfigFile(found);
  };

  const expanded = expandPaths(inputs.paths, lister, cwd);
  runErrors.push(...expanded.problems);
  // Absolute from here on: the reader resolves relative paths against the process's folder, which
  // need not be `cwd`; reporters show paths relative to the repository again.
  const absolute = expanded.files.map((f) => ({ path: resolve(cwd, f.path), explicit: f.explicit }));
  const explicit = new Set(absolute.filter((f) => f.explicit).map((f) => f.path));
  // Ignore globs skip what a folder or glob found; a file named on the command line is always read.
  const candidates = absolute.map((f) => f.path).filter((file) => {
    if (explicit.has(file)) return true;
    const choice = configFor(file);
    return !choice || !matchesIgnore(relative(choice.root, file), choice.config.ignore);
  });
  const roots = rootsOf(candidates, explicit, fs);

  const designs: DesignReport[] = [];
  let bandConfig: Config | undefined = fixed?.config;
  for (const file of roots) {
    const choice = configFor(file);
    if (!choice) {
      designs.push(failedDesign(file, `not checked: its config (${CONFIG_FILE_NAME}) has errors, listed above`));
      continue;
    }
    bandConfig ??= choice.config;
    designs.push(checkDesign(file, choice, fs, rules, inputs.visit));
  }
  return {
    designs,
    band: { ...(bandConfig ?? defaultConfig()).band },
    toolVersion: VERSION,
    rules: rules.map((r) => ({ id: r.id, title: r.title, severity: r.severity, doc: r.doc, options: r.options, ...(r.tags ? { tags: r.tags } : {}), level: ruleLevel(r, (bandConfig ?? defaultConfig())) })),
    ...(runErrors.length > 0 ? { errors: runErrors } : {}),
  };
}

function rootsOf(files: string[], explicit: Set<string>, fs: FileSource): string[] {
  const sheets = files.filter((f) => f.endsWith(".kicad_sch"));
  if (sheets.length <= 1) return files;
  // Unreadable files stay in the list: reading them again reports the error for that design.
  const found = findRootSheets(sheets, fs);
  const unreadable = new Set(found.errors.map((e) => e.file));
  const roots = new Set([...found.roots, ...unreadable]);
  return files.filter((f) => !f.endsWith(".kicad_sch") || explicit.has(f) || roots.has(f));
}

function emptyResult(rules: readonly Rule<Context>[], errors: RunProblem[], config: Config): LintResult {
  return {
    designs: [],
    band: { ...config.band },
    toolVersion: VERSION,
    rules: rules.map((r) => ({ id: r.id, title: r.title, severity: r.severity, doc: r.doc, options: r.options, level: ruleLevel(r, config) })),
    errors,
  };
}

function failedDesign(file: string, message: string, line = 0, column = 0): DesignReport {
  return { file, sheetFiles: [file], findings: [], rails: [], bases: [], devices: [], errors: [{ file, line, column, message }] };
}

function checkDesign(file: string, choice: ConfigChoice, fs: FileSource, rules: readonly Rule<Context>[], visit?: LintInputs["visit"]): DesignReport {
  const read = readDesign(file, { fs });
  if (!read.ok) return failedDesign(read.error.file, read.error.message, read.error.line, read.error.column);
  const circuit = read.circuit;
  const notes: RunProblem[] = circuit.notes.map((n) => ({ file: n.file, line: n.line, column: n.column, message: n.message }));

  let modelsText: string | undefined;
  if (choice.config.models !== undefined) {
    const path = resolve(choice.root, choice.config.models);
    const text = textOf(fs, path);
    if (typeof text === "string") modelsText = text;
    else notes.push({ file: choice.config.file ?? path, line: 0, column: 0, message: `models: cannot read ${choice.config.models} (${text.error}); built-in models used` });
  }
  const ctx = createContext(circuit, choice.config, modelsText === undefined ? {} : { modelsText });
  const outcome = runRules(rules.map((r) => guarded(r, circuit)), ctx, choice.config, file);
  const findings = applySuppressions(outcome.findings, circuit.parts).sort(compareFindings);
  for (const p of suppressionProblems(circuit.parts, rules.map((r) => r.id))) notes.push(p);
  const sheetFiles = [...new Set([circuit.file, ...circuit.sheets.map((s) => s.file)])];
  const design: DesignReport = {
    file,
    sheetFiles,
    findings,
    rails: ctx.report.rails,
    bases: ctx.report.bases,
    devices: ctx.report.devices(),
    errors: outcome.problems,
    ...(notes.length > 0 ? { notes } : {}),
  };
  visit?.(ctx, design);
  return design;
}

