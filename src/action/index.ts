// The GitHub Action: inputs from @actions/core, then the same `lint` the CLI runs. Annotations are
// printed as our own escaped workflow-command lines (src/report/github.ts); the job summary, outputs
// and report files follow. Exit code as design.md states: 0 clean, 1 findings at/over fail-on, 2 the
// run failed.
import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, resolve } from "node:path";
import * as core from "@actions/core";
import { lint } from "../engine/lint.js";
import type { FailOn } from "../engine/result.js";
import { countBySeverity, exitCodeFor } from "../engine/result.js";
import { annotationLine, formatAnnotations } from "../report/github.js";
import { formatHtml } from "../report/html.js";
import { formatMarkdown } from "../report/markdown.js";
import { formatSarif } from "../report/sarif.js";
import { runFixStep } from "../fix/action-step.js";

const FAIL_ON: readonly FailOn[] = ["error", "warning", "note", "never"];

class InputError extends Error {}

function write(path: string, text: string): void {
  mkdirSync(dirname(path), { recursive: true });
  writeFileSync(path, text);
}

function booleanInput(name: string): boolean {
  // getBooleanInput throws on anything but the YAML 1.2 core booleans; say which input and why.
  try {
    return core.getBooleanInput(name);
  } catch {
    throw new InputError(`input '${name}' must be true or false, got '${core.getInput(name)}'`);
  }
}

async function run(): Promise<number> {
  const workspace = process.env["GITHUB_WORKSPACE"] || process.cwd();
  const paths = core.getMultilineInput("paths");
  const configInput = core.getInput("config");
  const failOnInput = core.getInput("fail-on") || "error";
  const failOn = FAIL_ON.find((f) => f === failOnInput);
  if (failOn === undefined) throw new InputError(`input 'fail-on' must be one of ${FAIL_ON.join(", ")}, got '${failOnInput}'`);
  const sarifInput = core.getInput("sarif-file");
  const htmlInput = core.getInput("html-file");
  const annotate = booleanInput("annotations");
  const summarize = booleanInput("summary");
  // `fix: true` makes the proposed value changes first, so the report below describes the fixed files.
  const fixAsked = core.getInput("fix") !== "" && booleanInput("fix");
  let fixFailed = false;
  if (fixAsked) {
    const step = runFixStep({ paths: paths.length > 0 ? paths : ["."], cwd: workspace, ...(configInput !== "" ? { configPath: configInput } : {}) });
    for (const line of step.lines) process.stdout.write(`${line}\n`);
    core.setOutput("fixed-files", step.changedFiles.join("\n"));
    fixFailed = step.code === 2;
  } else {
    core.setOutput("fixed-files", "");
  }

  const result = lint({
    paths: paths.length > 0 ? paths : ["."],
    cwd: workspace,
    ...(configInput !== "" ? { configPath: resolve(workspace, configInput) } : {}),
  });
  const base = { cwd: workspace, root: workspace };
  const counts = countBySeverity(result);

  const annotations = formatAnnotations(result, { ...base, overflowPlace: summarize ? "the job summary" : "the SARIF report" });
  if (annotate) for (const line of annotations.lines) process.stdout.write(`${line}\n`);

  if (summarize && process.env["GITHUB_STEP_SUMMARY"]) {
    await core.summary.addRaw(formatMarkdown(result, { ...base, overflow: annotations.overflow }), true).write();
  }

  if (sarifInput !== "") {
    const path = resolve(workspace, sarifInput);
    write(path, formatSarif(result, base));
    core.setOutput("sarif-file", sarifInput);
  } else {
    core.setOutput("sarif-file", "");
  }
  if (htmlInput !== "") write(resolve(workspace, htmlInput), formatHtml(result, base));

  core.setOutput("errors", String(counts.error));
  core.setOutput("warnings", String(counts.warning));
  core.setOutput("notes", String(counts.note));

  const code = fixFailed ? 2 : exitCodeFor(result, failOn);
  const tally = `${counts.error} error(s), ${counts.warning} warning(s), ${counts.note} note(s), ${counts.suppressed} suppressed`;
  if (code === 2) core.info(`loadline: the run failed (see the errors above); ${tally}`);
  else if (code === 1) core.info(`loadline: findings at or above '${failOn}': ${tally}`);
  else core.info(`loadline: ${tally}`);
  return code;
}

run().then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    const message = err instanceof Error ? err.message : String(err);
    // Bad inputs are the user's to fix; anything else is a bug in loadline.
    process.stdout.write(`${annotationLine("error", err instanceof InputError ? message : `internal error: ${message}`, { title: "loadline" })}\n`);
    process.exitCode = 2;
  },
);
