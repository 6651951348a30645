// Test support: runs ngspice on a reference deck (batch mode, ASCII rawfile) and reads the
// rawfile; loads and writes the committed recordings `test/reference/ngspice/NAME.raw.json` so
// the reference checks also run where ngspice is not installed.

import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";

/** Beside this file in the source tree; from the working directory when run as a bundled script. */
export const REFERENCE_DIR = [
  resolve(dirname(fileURLToPath(import.meta.url)), "../reference/ngspice"),
  resolve(process.cwd(), "test/reference/ngspice"),
].find((dir) => existsSync(dir)) ?? resolve(process.cwd(), "test/reference/ngspice");

export interface RawPlot {
  plotname: string;
  flags: string;
  variables: string[];
  /** Real part per variable (the frequency column's real part for AC). */
  real: Record<string, number[]>;
  /** Imaginary part per variable, for complex plots (device parameters in an AC plot are real: 0). */
  imag?: Record<string, number[]>;
}

export interface Recording {
  deck: string;
  /** ngspice banner line, e.g. "ngspice-39". */
  ngspice: string;
  plots: RawPlot[];
}

/** Parses an ASCII rawfile with one or more plots. */
export function parseRawfile(text: string): RawPlot[] {
  const lines = text.split(/\r?\n/);
  const plots: RawPlot[] = [];
  let i = 0;
  while (i < lines.length) {
    const line = lines[i] ?? "";
    if (!line.startsWith("Plotname:")) { i++; continue; }
    const plotname = line.slice("Plotname:".length).trim();
    let flags = "", nvars = 0, npoints = 0;
    i++;
    for (; i < lines.length && !(lines[i] ?? "").startsWith("Variables:"); i++) {
      const l = lines[i] ?? "";
      if (l.startsWith("Flags:")) flags = l.slice(6).trim();
      else if (l.startsWith("No. Variables:")) nvars = Number(l.slice(14));
      else if (l.startsWith("No. Points:")) npoints = Number(l.slice(11));
    }
    i++;
    const variables: string[] = [];
    for (let v = 0; v < nvars; v++, i++) {
      const parts = (lines[i] ?? "").trim().split(/\s+/);
      variables.push(parts[1] ?? `var${v}`);
    }
    if (!(lines[i] ?? "").startsWith("Values:")) throw new Error(`rawfile: expected "Values:" in plot ${plotname}`);
    i++;
    const complex = flags.includes("complex");
    const real: Record<string, number[]> = {};
    const imag: Record<string, number[]> = {};
    for (const v of variables) { real[v] = []; imag[v] = []; }
    const tokens: string[] = [];
    while (tokens.length < npoints * (nvars + 1) && i < lines.length) {
      const l = (lines[i] ?? "").trim();
      if (l.startsWith("Title:") || l.startsWith("Plotname:")) break;
      if (l) tokens.push(...l.split(/\s+/));
      i++;
    }
    for (let p = 0; p < npoints; p++) {
      const base = p * (nvars + 1);
      for (let v = 0; v < nvars; v++) {
        const token = tokens[base + 1 + v] ?? "NaN";
        const [re, im] = token.split(",");
        const name = variables[v] ?? "";
        real[name]?.push(Number(re));
        imag[name]?.push(im === undefined ? 0 : Number(im));
      }
    }
    plots.push(complex ? { plotname, flags, variables, real, imag } : { plotname, flags, variables, real });
  }
  return plots;
}

let cachedVersion: string | null | undefined;

/** "ngspice-39" when ngspice is on the PATH, else null. */
export function ngspiceVersion(): string | null {
  if (cachedVersion !== undefined) return cachedVersion;
  const run = spawnSync("ngspice", ["-v"], { encoding: "utf8", timeout: 10_000 });
  const banner = /\*\*\s*(ngspice-[\w.+-]+)/.exec(run.stdout ?? "");
  cachedVersion = run.status === 0 && banner ? (banner[1] ?? null) : null;
  return cachedVersion;
}

export function deckPath(name: string): string {
  return join(REFERENCE_DIR, `${name}.cir`);
}

export function readDeck(name: string): string {
  return readFileSync(deckPath(name), "utf8");
}

/** Runs ngspice live on the named deck; throws with the log if it reports an error. */
export function runNgspice(name: string): Recording {
  const version = ngspiceVersion();
  if (!version) throw new Error("ngspice is not installed");
  const dir = mkdtempSync(join(tmpdir(), "loadline-ngspice-"));
  try {
    const raw = join(dir, "out.raw");
    const run = spawnSync("ngspice", ["-n", "-b", "-r", raw, deckPath(name)], { cwd: dir, encoding: "utf8", timeout: 60_000 });
    const log = `${run.stdout ?? ""}${run.stderr ?? ""}`;
    if (run.status !== 0 || /\berror\b/i.test(log) || !existsSync(raw)) {
      throw new Error(`ngspice failed on ${name}.cir (exit ${run.status}):\n${log}`);
    }
    return { deck: `${name}.cir`, ngspice: version, plots: parseRawfile(readFileSync(raw, "utf8")) };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export function recordingPath(name: string): string {
  return join(REFERENCE_DIR, `${name}.raw.json`);
}

export function loadRecording(name: string): Recording {
  return JSON.parse(readFileSync(recordingPath(name), "utf8")) as Recording;
}

/** The recorded reference, plus a live run when ngspice is installed. */
export function referenceRuns(name: string): Array<{ label: string; data: Recording }> {
  const runs = [{ label: `recorded ${name}.raw.json`, data: loadRecording(name) }];
  if (ngspiceVersion()) runs.push({ label: `live ${ngspiceVersion() ?? ""}`, data: runNgspice(name) });
  return runs;
}

export function plot(rec: Recording, plotname: "Operating Point" | "AC Analysis"): RawPlot {
  const found = rec.plots.find((p) => p.plotname === plotname);
  if (!found) throw new Error(`${rec.deck}: no "${plotname}" plot in the ngspice output`);
  return found;
}

/** Operating-point value of a vector, e.g. "v(b)", "i(vcc)", "i(@q1[ic])", "@q1[gm]". */
export function opValue(rec: Recording, vector: string): number {
  const values = plot(rec, "Operating Point").real[vector];
  const v = values?.[0];
  if (v === undefined) throw new Error(`${rec.deck}: no vector ${vector} in the operating point`);
  return v;
}

/** AC sweep frequencies (real part of the scale; the rawfile's imaginary part there is junk). */
export function acFrequencies(rec: Recording): number[] {
  const f = plot(rec, "AC Analysis").real["frequency"];
  if (!f) throw new Error(`${rec.deck}: AC plot has no frequency vector`);
  return f;
}

export function acVector(rec: Recording, vector: string): { re: number[]; im: number[] } {
  const p = plot(rec, "AC Analysis");
  const re = p.real[vector], im = p.imag?.[vector];
  if (!re || !im) throw new Error(`${rec.deck}: no vector ${vector} in the AC plot`);
  return { re, im };
}
