// `loadline bias FILE…`: the DC operating point of each design — rails with the current they supply,
// active devices with region, Q-point and dissipation. `--json` prints one object per design.
import { relative } from "node:path";
import type { Command } from "commander";
import type { BiasReport, DeviceBias } from "../engine/bias.js";
import { biasReport } from "../engine/bias.js";
import { lint } from "../engine/lint.js";
import { formatQuantity } from "../circuit/units.js";
import type { CommandIo } from "./process-io.js";
import { processIo } from "./process-io.js";

type Io = Pick<CommandIo, "stdout" | "stderr" | "cwd">;

function pad(cells: string[][]): string[] {
  const widths: number[] = [];
  for (const row of cells) row.forEach((c, i) => { widths[i] = Math.max(widths[i] ?? 0, c.length); });
  return cells.map((row) => row.map((c, i) => (i === row.length - 1 ? c : c.padEnd(widths[i] ?? 0))).join("  ").trimEnd());
}

function deviceCells(d: DeviceBias): string[] {
  const name = d.channel ? `${d.ref}.${d.channel}` : d.ref;
  const q = (v: number, unit: string) => formatQuantity(v, unit);
  if ("vbe" in d) return [name, d.type, d.region, `VBE ${q(d.vbe, "V")}`, `VCE ${q(d.vce, "V")}`, `IC ${q(d.ic, "A")}`, `P ${q(d.power, "W")}`];
  return [name, d.type, d.region, `VGS ${q(d.vgs, "V")}`, `VDS ${q(d.vds, "V")}`, `ID ${q(d.id, "A")}`, `P ${q(d.power, "W")}`];
}

export function formatBiasText(report: BiasReport, cwd: string): string {
  const lines: string[] = [];
  const state = report.converged ? `DC solution converged (${report.method ?? "newton"})` : `no DC solution: ${report.problem ?? "the solver did not converge"}`;
  lines.push(`${relative(cwd, report.file) || report.file}  —  ${state}`);
  if (report.rails.length > 0) {
    lines.push("  Rails");
    const rows = report.rails.map((r) => [r.net, formatQuantity(r.volts, "V"), r.amps === null ? "—" : formatQuantity(r.amps, "A"), `(voltage from ${r.from})`]);
    for (const l of pad(rows)) lines.push(`    ${l}`);
  }
  if (report.devices.length > 0) {
    lines.push("  Devices");
    for (const l of pad(report.devices.map(deviceCells))) lines.push(`    ${l}`);
  }
  if (report.unmodelled.length > 0) {
    lines.push("  Not simulated");
    for (const u of report.unmodelled) lines.push(`    ${u.ref}: ${u.reason}`);
  }
  return lines.join("\n") + "\n";
}

/** Returns the exit code: 2 when a design could not be read or the run itself failed, else 0. */
export function runBias(paths: string[], options: { json: boolean; config?: string }, io: Io): number {
  const reports: BiasReport[] = [];
  const result = lint({
    paths,
    rules: [],
    cwd: io.cwd,
    ...(options.config !== undefined ? { configPath: options.config } : {}),
    visit: (ctx, design) => reports.push(biasReport(ctx, design.file)),
  });
  let failed = (result.errors?.length ?? 0) > 0;
  for (const e of result.errors ?? []) io.stderr(`${relative(io.cwd, e.file) || e.file}:${e.line}:${e.column}: error: ${e.message}\n`);
  for (const design of result.designs) {
    if (reports.some((r) => r.file === design.file)) continue;
    failed = true;
    for (const e of design.errors) io.stderr(`${relative(io.cwd, e.file) || e.file}:${e.line}:${e.column}: error: ${e.message}\n`);
  }
  if (options.json) for (const r of reports) io.stdout(JSON.stringify(r) + "\n");
  else io.stdout(reports.map((r) => formatBiasText(r, io.cwd)).join("\n"));
  return failed ? 2 : 0;
}

export function register(program: Command): void {
  program
    .command("bias")
    .description("print the DC operating point of each design: rails and their current, devices with region and Q-point")
    .argument("<files...>", "design files (.kicad_sch, .net), folders or globs")
    .option("--json", "one JSON object per design (SI units)")
    .option("-c, --config <file>", "config file (default: the nearest loadline.json above each design)")
    .action((files: string[], opts: { json?: boolean; config?: string }) => {
      process.exitCode = runBias(files, { json: opts.json === true, ...(opts.config !== undefined ? { config: opts.config } : {}) }, processIo());
    });
}
