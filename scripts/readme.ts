// Regenerates the README's generated sections from the code itself — the rule table from each
// rule's own documentation, the command list from the commander program, the limits from the
// reader's and solver's constants, and the demo output from a real run — so the README cannot drift.
// `node scripts/run-ts.mjs scripts/readme.ts` rewrites README.md; test/readme.test.ts checks it is current.
import { readFileSync, writeFileSync } from "node:fs";
import { Command } from "commander";
import { allRules } from "../rules/index.js";
import { registerCommands } from "../src/cli/commands.js";
import { lint } from "../src/engine/lint.js";
import { biasReport, type BiasReport } from "../src/engine/bias.js";
import { formatBiasText } from "../src/cli/bias.js";
import { render } from "../src/report/index.js";
import { noColors } from "../src/report/colors.js";
import * as readLimits from "../src/read/index.js";
import { formatQuantity } from "../src/circuit/units.js";

export const DEMO_BOARD = "fixtures/demo/demo-preamp.kicad_sch";

function rulesTable(): string {
  const rows = allRules.map((r) => `| \`${r.id}\` | ${r.severity} | ${r.title} | ${r.doc.what.replace(/\s+/g, " ").replace(/\|/g, "\\|")} |`);
  return [
    "Run `loadline rules ID` for the full rationale, options and references of a rule.",
    "",
    "| rule | default | title | what it checks |",
    "|---|---|---|---|",
    ...rows,
  ].join("\n");
}

function commandsHelp(): string {
  const program = new Command("loadline").description("Design-rule checks for small-signal amplifier schematics (KiCad .kicad_sch / .net)");
  registerCommands(program);
  const lines = ["```text", program.helpInformation().trimEnd(), "```"];
  return lines.join("\n");
}

function limits(): string {
  const mib = (n: number) => `${n / (1024 * 1024)} MiB`;
  return [
    "Every input is bounded, so a hostile or broken file gives an error naming the file, line and column, never a hang or a crash:",
    "",
    "| limit | value |",
    "|---|---|",
    `| file size | ${mib(readLimits.MAX_FILE_BYTES)} |`,
    `| s-expression nesting depth | ${readLimits.MAX_NESTING_DEPTH} |`,
    `| sheet hierarchy depth | ${readLimits.MAX_SHEET_DEPTH} |`,
    `| sheet instances per design | ${readLimits.MAX_SHEET_INSTANCES.toLocaleString("en")} |`,
    `| items per design (all sheet instances) | ${readLimits.MAX_DESIGN_ITEMS.toLocaleString("en")} |`,
    `| members of one bus | ${readLimits.MAX_BUS_MEMBERS.toLocaleString("en")} |`,
    `| sheet files | must stay inside the project folder (the root sheet's folder); cycles are refused |`,
    `| DC solution | Newton–Raphson, then gmin stepping, then source stepping, capped in iterations and time |`,
  ].join("\n");
}

function demoOutput(): string {
  const biases: BiasReport[] = [];
  const result = lint({ paths: [DEMO_BOARD], visit: (ctx, d) => biases.push(biasReport(ctx, d.file)) });
  const cwd = process.cwd();
  const text = render("text", result, { cwd, root: cwd, colors: noColors, showSuppressed: false });
  const bias = biases.map((b) => formatBiasText(b, cwd)).join("\n");
  return [
    "`npm run demo` checks an invented 12 V HF receiver preamplifier (a 2N3904 cascode; what is wrong",
    "with it on purpose is in `fixtures/demo/README.md`):",
    "",
    "```text",
    `$ loadline check ${DEMO_BOARD}`,
    text.trimEnd(),
    "```",
    "",
    "Its DC operating point (`loadline bias`), solved by loadline's own modified-nodal-analysis engine:",
    "",
    "```text",
    `$ loadline bias ${DEMO_BOARD}`,
    bias.trimEnd(),
    "```",
    "",
    `The same run as a self-contained HTML report (\`loadline check --html report.html\`), rail impedance plotted from ${formatQuantity(result.band.low / 10, "Hz")} to ${formatQuantity(result.band.high * 10, "Hz")} with the band shaded:`,
    "",
    "![HTML report of the demo board](docs/demo-report.png)",
  ].join("\n");
}

function fenced(file: string, lang: string): () => string {
  return () => ["```" + lang, readFileSync(file, "utf8").trimEnd(), "```"].join("\n");
}

const SECTIONS: Record<string, () => string> = {
  "config-example": fenced("examples/loadline.json", "json"),
  "action-example": fenced("examples/pull-request.yml", "yaml"),
  "demo-output": demoOutput,
  commands: commandsHelp,
  "rules-table": rulesTable,
  limits,
};

/** Replaces the text between `<!-- name -->` and `<!-- /name -->` (inserting the end marker the first time). */
export function renderReadme(current: string): string {
  let out = current;
  for (const [name, make] of Object.entries(SECTIONS)) {
    const open = `<!-- ${name} -->`;
    const close = `<!-- /${name} -->`;
    const start = out.indexOf(open);
    if (start < 0) throw new Error(`README has no ${open} marker`);
    const end = out.indexOf(close, start);
    const body = `${open}\n${make()}\n${close}`;
    out = end < 0 ? out.slice(0, start) + body + out.slice(start + open.length) : out.slice(0, start) + body + out.slice(end + close.length);
  }
  return out;
}

if (process.argv[1]?.endsWith("readme.ts")) {
  const current = readFileSync("README.md", "utf8");
  writeFileSync("README.md", renderReadme(current));
  console.log("README.md regenerated");
}
