#!/usr/bin/env node
// The command-line shell: commander wiring only. Each command lives in its own file and exports
// `register(program)`; the work itself happens in the pure core they call.
import { Command } from "commander";
import { registerCommands } from "./commands.js";
import { VERSION } from "../version.js";

const program = new Command("loadline")
  .description("Design-rule checks for small-signal amplifier schematics (KiCad .kicad_sch / .net)")
  .version(VERSION)
  .showHelpAfterError()
  .exitOverride((err) => {
    // commander's own errors (unknown option, missing argument) are a failed run: exit 2.
    process.exit(err.exitCode === 0 ? 0 : 2);
  });

registerCommands(program);
program.parseAsync(process.argv).catch((err: unknown) => {
  // A bug, not bad input: say so plainly without a stack trace, and exit 2.
  const message = err instanceof Error ? err.message : String(err);
  process.stderr.write(`loadline: internal error: ${message}\n`);
  process.exit(2);
});
