// `loadline nets FILE…`: what the reader made of each design — parts with their pins' nets, and
// nets with their pins — as a table, or with --json one JSON object per design per line. Useful to
// see why a rule saw what it saw, and to compare a schematic with an exported netlist.
import type { Command } from "commander";
import type { Circuit, ReadError } from "../circuit/types.js";
import { findRootSheets, nodeFileSource, readDesign, type FileSource } from "../read/index.js";
import type { Colors } from "../report/colors.js";
import { createColors, noColors } from "../report/colors.js";

export interface NetsOptions {
  json: boolean;
  projectRoot?: string;
}

export interface NetsIo {
  fs: FileSource;
  out(text: string): void;
  err(text: string): void;
  colors?: Colors;
}

export interface NetsJson {
  file: string;
  parts: { ref: string; value: string; kind: string; pins: Record<string, string> }[];
  nets: { name: string; pins: string[] }[];
}

export function netsJson(c: Circuit): NetsJson {
  return {
    file: c.file,
    parts: c.parts.map((p) => ({ ref: p.ref, value: p.value, kind: p.kind, pins: p.pins })),
    nets: c.nets.map((n) => ({ name: n.name, pins: n.pins.map((p) => `${p.ref}.${p.pin}`) })),
  };
}

function table(header: string[], rows: string[][], c: Colors): string[] {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? "").length)));
  const line = (cells: string[]) => cells.map((cell, i) => (i === cells.length - 1 ? cell : cell.padEnd(widths[i] ?? 0))).join("  ").trimEnd();
  return [c.bold(line(header)), ...rows.map(line)];
}

export function formatNetsText(circuit: Circuit, c: Colors = noColors): string {
  const kind = circuit.format === "kicad_sch" ? "KiCad schematic" : "KiCad netlist";
  const sheets = circuit.sheets.length > 1 ? `, ${circuit.sheets.length} sheet instances` : "";
  const lines = [
    c.bold(`${circuit.file}`) + `  (${kind}, version ${circuit.version}${sheets}; ${circuit.parts.length} parts, ${circuit.nets.length} nets)`,
    "",
    ...table(["ref", "value", "kind", "pins → nets"], circuit.parts.map((p) => [
      p.ref + (p.dnp ? " (DNP)" : ""),
      p.value === "" ? "-" : p.value,
      p.kind,
      Object.entries(p.pins).map(([pin, net]) => `${pin}=${net}`).join("  "),
    ]), c),
    "",
    ...table(["net", "pins"], circuit.nets.map((n) => [
      n.name + (n.noConnect ? " (no-connect)" : ""),
      n.pins.map((p) => `${p.ref}.${p.pin}`).join(" "),
    ]), c),
    "",
  ];
  return lines.join("\n");
}

export function formatReadError(e: ReadError): string {
  return `${e.file}:${e.line}:${e.column}: error: ${e.message}`;
}

/** Reads every design among `files` and prints it; returns the exit status (2 if any file failed). */
export function runNets(files: string[], opts: NetsOptions, io: NetsIo): number {
  const colors = io.colors ?? noColors;
  let failed = false;
  const { roots, errors } = findRootSheets(files, io.fs);
  for (const e of errors) { io.err(`${formatReadError(e)}\n`); failed = true; }
  for (const file of roots) {
    const result = readDesign(file, opts.projectRoot !== undefined ? { fs: io.fs, projectRoot: opts.projectRoot } : { fs: io.fs });
    if (!result.ok) { io.err(`${formatReadError(result.error)}\n`); failed = true; continue; }
    const circuit = result.circuit;
    for (const n of circuit.notes) io.err(`${n.file}:${n.line}:${n.column}: note: ${n.message}\n`);
    io.out(opts.json ? `${JSON.stringify(netsJson(circuit))}\n` : formatNetsText(circuit, colors));
  }
  return failed ? 2 : 0;
}

export function register(program: Command): void {
  program
    .command("nets")
    .description("show the parts and nets read from schematics or exported netlists")
    .argument("<files...>", ".kicad_sch root sheets or .net netlists (sub-sheets of a given root are not listed twice)")
    .option("--json", "one JSON object per design, one per line")
    .option("--project-root <dir>", "folder that sheets and model libraries must stay inside (default: each root file's folder)")
    .option("--no-color", "plain text without colours")
    .action((files: string[], opts: { json?: boolean; projectRoot?: string; color: boolean }) => {
      const colors = createColors(!opts.json && opts.color && process.stdout.isTTY === true && !process.env["NO_COLOR"]);
      let status: number;
      try {
        status = runNets(files, { json: opts.json === true, ...(opts.projectRoot !== undefined ? { projectRoot: opts.projectRoot } : {}) }, {
          fs: nodeFileSource(),
          out: (t) => { process.stdout.write(t); },
          err: (t) => { process.stderr.write(t); },
          colors,
        });
      } catch (err) {
        // Stack exhaustion on hostile input is bad input, never a stack trace.
        if (!(err instanceof RangeError)) throw err;
        process.stderr.write(`loadline: error: input too large or too deeply nested to read (${err.message})\n`);
        status = 2;
      }
      process.exitCode = status;
    });
}
