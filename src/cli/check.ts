// `loadline check [PATH…]`: lint the designs and write one or more reports in one run —
//   loadline check hw --format text --sarif out.sarif --html report.html --json out.json
// `--format F --output FILE` pairs also work and may repeat; at most one format goes to stdout.
import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, resolve } from "node:path";
import type { Command } from "commander";
import { InvalidArgumentError, Option } from "commander";
import { lint } from "../engine/lint.js";
import type { FailOn } from "../engine/result.js";
import { exitCodeFor } from "../engine/result.js";
import { createColors } from "../report/colors.js";
import type { Format } from "../report/index.js";
import { FORMATS, isFormat, render } from "../report/index.js";
import { findRepositoryRoot } from "./repo-root.js";
import type { CommandIo } from "./process-io.js";
import { processIo } from "./process-io.js";

interface Output {
  format: Format;
  /** Absent: standard output. */
  file?: string;
}

export interface CheckOptions {
  format: Output[];
  failOn: FailOn;
  config?: string;
  color: boolean;
  showSuppressed?: boolean;
}

/** Builds the output list in argument order: each --output binds to the --format before it. */
function outputCollector(): { format(value: string): Output[]; output(value: string): Output[]; shorthand(format: Format): (value: string) => Output[]; list: Output[] } {
  const list: Output[] = [];
  return {
    list,
    format(value) {
      if (!isFormat(value)) throw new InvalidArgumentError(`choose one of ${FORMATS.join(", ")}`);
      list.push({ format: value });
      return list;
    },
    output(value) {
      const last = list.at(-1);
      if (!last || last.file !== undefined) throw new InvalidArgumentError("--output FILE goes right after the --format it is for");
      last.file = value;
      return list;
    },
    shorthand(format) {
      return (value) => {
        list.push({ format, file: value });
        return list;
      };
    },
  };
}

function writeReport(file: string, text: string): string | undefined {
  try {
    mkdirSync(dirname(resolve(file)), { recursive: true });
    writeFileSync(file, text);
    return undefined;
  } catch (err) {
    return `cannot write ${file}: ${err instanceof Error ? err.message : String(err)}`;
  }
}

/** Runs a check and writes its reports; returns the exit code (0, 1, 2 as design.md states). */
export function runCheck(paths: string[], options: CheckOptions, io: CommandIo): number {
  const outputs = options.format.length > 0 ? options.format : [{ format: "text" as const }];
  const toStdout = outputs.filter((o) => o.file === undefined);
  if (toStdout.length > 1) {
    io.stderr(`loadline: only one format can go to standard output (${toStdout.map((o) => o.format).join(", ")}); give the others --output FILE\n`);
    return 2;
  }
  const result = lint({ paths, ...(options.config !== undefined ? { configPath: options.config } : {}), cwd: io.cwd });
  const root = io.env["GITHUB_WORKSPACE"] || findRepositoryRoot(io.cwd) || io.cwd;
  // Colour only for people at a terminal, and never when NO_COLOR is set (no-color.org).
  const colorful = options.color && io.isTTY && !io.env["NO_COLOR"];
  let code: number = exitCodeFor(result, options.failOn);
  for (const output of outputs) {
    const text = render(output.format, result, {
      cwd: io.cwd, root, colors: createColors(colorful && output.file === undefined), showSuppressed: options.showSuppressed ?? false,
    });
    if (output.file === undefined) io.stdout(text);
    else {
      const problem = writeReport(resolve(io.cwd, output.file), text);
      if (problem) {
        io.stderr(`loadline: ${problem}\n`);
        code = 2;
      }
    }
  }
  return code;
}

export function register(program: Command): void {
  const collect = outputCollector();
  program
    .command("check")
    .description("check designs (files, folders or globs; default: the current folder)")
    .argument("[paths...]", "design files (.kicad_sch, .net), folders or globs (default: .)")
    .addOption(new Option("-f, --format <format>", `report format: ${FORMATS.join(", ")} (repeatable)`).argParser((v: string) => collect.format(v)).default([], "text"))
    .option("-o, --output <file>", "write the preceding --format to FILE instead of standard output", (v) => collect.output(v))
    .option("--json <file>", "also write the JSON report to FILE", collect.shorthand("json"))
    .option("--sarif <file>", "also write SARIF 2.1.0 to FILE (for code scanning)", collect.shorthand("sarif"))
    .option("--html <file>", "also write the HTML report to FILE", collect.shorthand("html"))
    .option("--markdown <file>", "also write the Markdown summary to FILE", collect.shorthand("markdown"))
    .addOption(new Option("--fail-on <severity>", "exit 1 when a finding is at or above this severity").choices(["error", "warning", "note", "never"]).default("error"))
    .option("-c, --config <file>", "config file (default: the nearest loadline.json above each design)")
    .option("--no-color", "plain text without colours")
    .option("--show-suppressed", "list suppressed findings in the text report, not just their count")
    .action((paths: string[] | undefined, opts: { failOn: FailOn; config?: string; color: boolean; showSuppressed?: boolean }) => {
      const code = runCheck(paths ?? [], { format: collect.list, failOn: opts.failOn, color: opts.color, ...(opts.config !== undefined ? { config: opts.config } : {}), ...(opts.showSuppressed ? { showSuppressed: true } : {}) }, processIo());
      process.exitCode = code;
    });
}
