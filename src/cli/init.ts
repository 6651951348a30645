// `loadline init`: write a starter loadline.json beside the design in the current folder — the
// default band written out so it can be edited, and every supply net whose voltage nothing states
// listed under "rails" with a placeholder the next run will insist on. Never overwrites a file.
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import type { Command } from "commander";
import { CONFIG_FILE_NAME, DEFAULTS, defaultConfig } from "../engine/config.js";
import { createContext } from "../engine/context.js";
import { expandPaths, nodePathLister } from "../engine/expand.js";
import { findRootSheets, nodeFileSource, readDesign } from "../read/index.js";
import { si } from "../report/format.js";

export const RAIL_PLACEHOLDER = "set me, e.g. 12V";

/** The starter file's text. `rails` are net names needing a voltage. */
export function starterConfig(rails: readonly string[]): string {
  const config: Record<string, unknown> = {
    band: { low: si(DEFAULTS.band.low, "Hz").replace(" ", ""), high: si(DEFAULTS.band.high, "Hz").replace(" ", "") },
    rails: Object.fromEntries([...new Set(rails)].sort().map((r) => [r, RAIL_PLACEHOLDER])),
    swing: `${DEFAULTS.swingVolts}V`,
    rules: {},
    ignore: [],
    series: { ...DEFAULTS.series },
  };
  return `${JSON.stringify(config, null, 2)}\n`;
}

/** Supply nets of the designs under `cwd` whose voltage is neither in the name nor anywhere else. */
export function railsNeedingVoltage(cwd: string): { rails: string[]; designs: string[]; problems: string[] } {
  const fs = nodeFileSource();
  const { files, problems } = expandPaths(["."], nodePathLister(), cwd);
  const schematics = files.map((f) => join(cwd, f.path)).filter((p) => p.endsWith(".kicad_sch"));
  const netlists = files.map((f) => join(cwd, f.path)).filter((p) => p.endsWith(".net"));
  const sheets = findRootSheets(schematics, fs);
  const roots = [...sheets.roots, ...netlists];
  const rails: string[] = [];
  const messages = [
    ...problems.map((p) => `${p.file}: ${p.message}`),
    ...sheets.errors.map((e) => `${e.file}:${e.line}:${e.column}: ${e.message}`),
  ];
  for (const root of roots) {
    const read = readDesign(root, { fs });
    if (!read.ok) {
      messages.push(`${read.error.file}:${read.error.line}:${read.error.column}: ${read.error.message}`);
      continue;
    }
    rails.push(...createContext(read.circuit, defaultConfig()).unresolvedRails());
  }
  return { rails, designs: roots, problems: messages };
}

export function register(program: Command): void {
  program
    .command("init")
    .description(`write a starter ${CONFIG_FILE_NAME} for the design in the current folder`)
    .action(() => {
      const cwd = process.cwd();
      const target = join(cwd, CONFIG_FILE_NAME);
      const found = railsNeedingVoltage(cwd);
      for (const p of found.problems) process.stderr.write(`loadline: ${p}\n`);
      try {
        // "wx": fail if it exists, checked and created in one step.
        writeFileSync(target, starterConfig(found.rails), { flag: "wx" });
      } catch (err) {
        const exists = typeof err === "object" && err !== null && "code" in err && err.code === "EEXIST";
        process.stderr.write(exists ? `loadline: ${CONFIG_FILE_NAME} already exists here; edit it, or remove it first\n` : `loadline: cannot write ${CONFIG_FILE_NAME}: ${err instanceof Error ? err.message : String(err)}\n`);
        process.exitCode = 2;
        return;
      }
      process.stdout.write(`wrote ${CONFIG_FILE_NAME} for ${found.designs.length} design(s)\n`);
      if (found.rails.length > 0) process.stdout.write(`set the voltage of ${[...new Set(found.rails)].sort().join(", ")} under "rails"\n`);
    });
}
