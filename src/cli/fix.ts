// `loadline fix [PATH…] [--rule ID] [--dry-run] [--config FILE]`: make the value changes the rules
// propose, in the schematic files themselves. Standard output lists what changed (or, with
// --dry-run, carries only the unified diff, so it can be piped to `git apply`); what was refused
// and why goes with the summary. Exit 0: every fix asked for was made, or nothing to fix;
// 1: some fix was refused; 2: the run failed.
import type { Command } from "commander";
import { createColors, type Colors } from "../report/colors.js";
import { fixExitCode, runFix, type FixReport, type FixRequest } from "../fix/run.js";
import type { CommandIo } from "./process-io.js";
import { processIo } from "./process-io.js";

export interface FixCommandOptions {
  rule: string[];
  dryRun: boolean;
  config?: string;
  color: boolean;
}

export type FixIo = CommandIo;

/** Runs the command; returns the exit code. `request` lets tests inject file systems and rules. */
export function runFixCommand(paths: string[], options: FixCommandOptions, io: FixIo, request: Partial<FixRequest> = {}): number {
  const report = runFix({
    paths: paths.length > 0 ? paths : ["."],
    cwd: io.cwd,
    dryRun: options.dryRun,
    ...(options.rule.length > 0 ? { rules: options.rule } : {}),
    ...(options.config !== undefined ? { configPath: options.config } : {}),
    ...request,
  });
  const colors = createColors(options.color && io.isTTY && !io.env["NO_COLOR"]);
  if (report.errors.length > 0) {
    for (const e of report.errors) io.stderr(`${place(e)}${e.message}\n`);
    io.stderr(`loadline fix: the check failed, so nothing was changed\n`);
    return 2;
  }
  if (options.dryRun) {
    for (const file of report.files) io.stdout(file.diff);
    io.stderr(describe(report, colors));
  } else {
    io.stdout(describe(report, colors));
  }
  return fixExitCode(report);
}

function place(e: { file: string; line: number; column: number }): string {
  if (e.file === "") return "loadline fix: ";
  return e.line > 0 ? `${e.file}:${e.line}:${e.column}: ` : `${e.file}: `;
}

/** What changed per file, what was refused and why, and one summary line. */
export function describe(report: FixReport, colors: Colors): string {
  const lines: string[] = [];
  const verb = report.dryRun ? "would change" : "changed";
  for (const file of report.files) {
    lines.push(colors.bold(file.display));
    for (const edit of file.edits) lines.push(`  ${colors.green(verb)} ${edit.description}`);
  }
  if (report.refused.length > 0) {
    lines.push(colors.bold("not changed"));
    for (const r of report.refused) lines.push(`  ${colors.yellow("refused")} ${r.reason}`);
  }
  const values = report.files.reduce((n, f) => n + f.edits.length, 0);
  if (values === 0 && report.refused.length === 0) lines.push("nothing to fix");
  else {
    const done = values === 0
      ? `nothing ${report.dryRun ? "would change" : "changed"}`
      : `${values} ${values === 1 ? "value" : "values"} ${verb} in ${report.files.length} ${report.files.length === 1 ? "file" : "files"}`;
    const refused = report.refused.length > 0 ? `; ${report.refused.length} ${report.refused.length === 1 ? "fix" : "fixes"} refused` : "";
    lines.push(`${done}${refused}${report.dryRun ? " (dry run: nothing written)" : ""}`);
  }
  return lines.join("\n") + "\n";
}

export function register(program: Command): void {
  program
    .command("fix")
    .description("make the value changes the checks propose, in the schematic files (atomic, verified)")
    .argument("[paths...]", "design files (.kicad_sch), folders or globs (default: the current folder)")
    .option("-r, --rule <id>", "only fixes from this rule (repeatable)", (value: string, previous: string[] | undefined) => [...(previous ?? []), value])
    .option("-n, --dry-run", "print a unified diff of the changes instead of writing them")
    .option("-c, --config <file>", "config file (default: the nearest loadline.json above each design)")
    .option("--no-color", "plain text without colours")
    .addHelpText(
      "after",
      "\nOnly Value strings change; each change is checked (same nets, the finding gone, no new finding)\n" +
        "before and after it is written. Review the diff before you build: a value the checks accept can\n" +
        "still be wrong for power, voltage or safety ratings the schematic does not state.",
    )
    .action((paths: string[] | undefined, opts: { rule?: string[]; dryRun?: boolean; config?: string; color: boolean }) => {
      const code = runFixCommand(paths ?? [], { rule: opts.rule ?? [], dryRun: opts.dryRun ?? false, color: opts.color, ...(opts.config !== undefined ? { config: opts.config } : {}) }, processIo());
      process.exitCode = code;
    });
}
