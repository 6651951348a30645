// Synthetic hierarchical projects for the reader benchmark, written with the fixture writer
// (fixtures/gen). Each sheet holds copies of a realistic common-emitter stage (divider bias,
// emitter bypass, coupling capacitors, local power symbols, labels chaining stage to stage).
// The hierarchy is three levels deep: root → level-1 sheets → leaf sheets; a few level-1 files are
// placed twice and leaf files are shared by several parents, so per-instance references matter.
// Deterministic: the same options give the same bytes.
import { mkdirSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { Design, type NetKey, type SheetFile } from "../fixtures/gen/board.js";
import { KICAD8 } from "../fixtures/gen/format.js";
import { render, type Rendered } from "../fixtures/gen/render.js";
import { CAPACITOR_POLARIZED, NPN, RESISTOR } from "../fixtures/gen/symbols.js";
import { g, type Pt } from "../fixtures/gen/units.js";
import { UuidSource } from "../fixtures/gen/uuid.js";

export interface ProjectOptions {
  /** Number of sheet files besides the root (hierarchical mode). */
  sheets: number;
  /** Minimum total size of the written files, in bytes. */
  targetBytes: number;
  /** Write one flat file of about targetBytes instead of a hierarchy. */
  singleSheet?: boolean;
}

const CELL_W = 44;
const CELL_H = 40;
const COLS = 8;
const MAX_ROUNDS = 6;

type End = { kind: "local" | "hier"; text: string };

/** One common-emitter stage (values of reference-data §6.5) with its top-left corner at `o`. */
function stage(f: SheetFile, o: Pt, k: number, input: End, output: End): void {
  const at = (x: number, y: number): Pt => [o[0] + g(x, y)[0], o[1] + g(x, y)[1]];
  const n = (name: string): NetKey => `s${k}_${name}`;
  const V = "+9V";
  const GND = "GND";
  const r = (i: number): string => `R${4 * k + i}`;
  const c = (i: number): string => `C${3 * k + i}`;
  const inNet = input.text;
  const outNet = output.text;

  const c1 = f.part(c(1), CAPACITOR_POLARIZED, { at: at(6, 20), rot: 270, value: "10uF 16V", footprint: "Capacitor_THT:CP_Radial_D5.0mm_P2.00mm", nets: { "1": n("b"), "2": inNet } });
  f.wire(inNet, [at(0, 20), c1.p(2)]);
  if (input.kind === "hier") f.hierLabel(inNet, at(0, 20), { angle: 180 });
  else f.label(inNet, at(0, 20));
  const q = f.part(`Q${k + 1}`, NPN, { at: at(18, 20), value: "2N3904", footprint: "Package_TO_SOT_SMD:SOT-23", nets: { "1": n("b"), "2": n("c"), "3": n("e") } });
  f.wire(n("b"), [c1.p(1), q.p(1)]);
  const r1 = f.part(r(1), RESISTOR, { at: at(11, 10), value: "56k", footprint: "Resistor_SMD:R_0603_1608Metric", nets: { "1": V, "2": n("b") } });
  f.wire(V, [r1.p(1), at(11, 2)]);
  f.power(V, at(11, 2));
  f.wire(n("b"), [r1.p(2), at(11, 20)]);
  const r2 = f.part(r(2), RESISTOR, { at: at(11, 30), value: "10k", footprint: "Resistor_SMD:R_0603_1608Metric", nets: { "1": n("b"), "2": GND } });
  f.wire(n("b"), [r2.p(1), at(11, 20)]);
  f.wire(GND, [r2.p(2), at(11, 36)]);
  f.power(GND, at(11, 36));
  const r3 = f.part(r(3), RESISTOR, { at: at(20, 8), value: "3k9", footprint: "Resistor_SMD:R_0603_1608Metric", nets: { "1": V, "2": n("c") } });
  f.wire(V, [r3.p(1), at(20, 2)]);
  f.power(V, at(20, 2));
  f.wire(n("c"), [r3.p(2), q.p(2)]);
  const r4 = f.part(r(4), RESISTOR, { at: at(20, 30), value: "680", footprint: "Resistor_SMD:R_0603_1608Metric", nets: { "1": n("e"), "2": GND } });
  f.wire(n("e"), [q.p(3), r4.p(1)]);
  f.wire(GND, [r4.p(2), at(20, 36)]);
  f.power(GND, at(20, 36));
  const c2 = f.part(c(2), CAPACITOR_POLARIZED, { at: at(26, 30), value: "100uF 16V", footprint: "Capacitor_THT:CP_Radial_D6.3mm_P2.50mm", nets: { "1": n("e"), "2": GND } });
  f.wire(n("e"), [c2.p(1), at(26, 25), at(20, 25)]);
  f.wire(GND, [c2.p(2), at(26, 36)]);
  f.power(GND, at(26, 36));
  const c3 = f.part(c(3), CAPACITOR_POLARIZED, { at: at(29, 13), rot: 90, value: "10uF 16V", footprint: "Capacitor_THT:CP_Radial_D5.0mm_P2.00mm", nets: { "1": n("c"), "2": outNet } });
  f.wire(n("c"), [at(20, 13), c3.p(1)]);
  f.wire(outNet, [c3.p(2), at(40, 13)]);
  if (output.kind === "hier") f.hierLabel(outNet, at(40, 13), { shape: "output" });
  else f.label(outNet, at(40, 13));
}

/** A chain of `count` stages; the first input and last output are hierarchical labels IN/OUT when
 * `ports` is set, local labels otherwise. */
function stages(f: SheetFile, count: number, ports: boolean): void {
  for (let k = 0; k < count; k++) {
    const o = g((k % COLS) * CELL_W + 4, Math.floor(k / COLS) * CELL_H + 4);
    const input: End = k === 0 ? { kind: ports ? "hier" : "local", text: "IN" } : { kind: "local", text: `L${k - 1}` };
    const output: End = k === count - 1 ? { kind: ports ? "hier" : "local", text: "OUT" } : { kind: "local", text: `L${k}` };
    stage(f, o, k, input, output);
  }
}

/** Child sheets chained X0 → sheet → X1 → sheet → …, placed right of the stage grid. */
function placeSheets(parent: SheetFile, children: { name: string; file: SheetFile; refOffset: number }[]): void {
  const x = COLS * CELL_W + 12;
  children.forEach((ch, i) => {
    const y = 6 + i * 14;
    const inNet = `X${i}`;
    const outNet = `X${i + 1}`;
    parent.sheet(ch.name, ch.file, g(x, y), g(16, 8), ch.refOffset, [
      { name: "IN", side: "left", dy: 2, net: inNet },
      { name: "OUT", shape: "output", side: "right", dy: 2, net: outNet },
    ]);
    parent.wire(inNet, [g(x - 4, y + 2), g(x, y + 2)]);
    parent.label(inNet, g(x - 4, y + 2));
    parent.wire(outNet, [g(x + 16, y + 2), g(x + 20, y + 2)]);
    parent.label(outNet, g(x + 20, y + 2));
  });
}

function refModulus(maxStages: number): number {
  return 10 ** String(4 * maxStages + 10).length;
}

/** The design for a stage distribution: `perFile[0]` stages on the root, `perFile[i]` on sheet i. */
export function buildBenchDesign(opts: ProjectOptions, perFile: number[]): Design {
  const d = new Design("bench-project", KICAD8, new UuidSource(`bench:${opts.sheets}:${opts.targetBytes}:${opts.singleSheet === true}`), {
    title: "Synthetic benchmark project", rev: "1", date: "2025-01-01", company: "loadline benchmark (generated)",
  }, "A0");
  if (opts.singleSheet) {
    stages(d.root, Math.max(1, perFile[0] ?? 1), false);
    return d;
  }
  const n = Math.max(1, opts.sheets);
  const leafCount = n >= 3 ? Math.max(1, Math.floor(n / 3)) : n === 2 ? 1 : 0;
  const levelOne = n - leafCount;
  const files: SheetFile[] = [];
  for (let i = 0; i < n; i++) files.push(d.file(`sheet_${String(i + 1).padStart(3, "0")}.kicad_sch`, `Stage block ${i + 1}`, "A0"));
  const m = refModulus(Math.max(...perFile, 1));
  // Leaf files are the last `leafCount`; level-1 file j nests leaf (j mod leafCount).
  files.forEach((f, i) => stages(f, Math.max(1, perFile[i + 1] ?? 1), true));
  for (let j = 0; j < levelOne && leafCount > 0; j++) {
    const leaf = files[levelOne + (j % leafCount)] as SheetFile;
    placeSheets(files[j] as SheetFile, [{ name: "detail", file: leaf, refOffset: m }]);
  }
  const top: { name: string; file: SheetFile; refOffset: number }[] = [];
  const roots = levelOne > 0 ? files.slice(0, levelOne) : files;
  roots.forEach((f, j) => top.push({ name: `block${j + 1}`, file: f, refOffset: 2 * m * (j + 1) }));
  for (let j = 0; j < Math.min(2, roots.length); j++) {
    top.push({ name: `block${j + 1}b`, file: roots[j] as SheetFile, refOffset: 2 * m * (roots.length + j + 1) });
  }
  placeSheets(d.root, top);
  return d;
}

function totalBytes(r: Rendered): number {
  let b = 0;
  for (const t of r.files.values()) b += Buffer.byteLength(t, "utf8");
  return b;
}

function renderSchematics(d: Design): Rendered {
  return render(d, { skipCheck: true, schematicOnly: true });
}

/** Stage counts per file (root first) whose rendered project reaches `targetBytes`. */
export function planStages(opts: ProjectOptions): { perFile: number[]; rendered: Rendered } {
  const fileCount = opts.singleSheet ? 1 : Math.max(1, opts.sheets);
  const probe = (k: number): number => totalBytes(renderSchematics(buildBenchDesign({ ...opts, singleSheet: true }, [k])));
  const one = probe(1);
  const perStage = Math.max(1, (probe(3) - one) / 2);
  const perFile = opts.singleSheet ? [0] : [0, ...new Array<number>(fileCount).fill(0)];
  const firstSheet = opts.singleSheet ? 0 : 1;
  const want = Math.max(fileCount, Math.ceil((opts.targetBytes - fileCount * (one - perStage)) / perStage));
  for (let i = 0; i < want; i++) {
    const idx = firstSheet + (i % fileCount);
    perFile[idx] = (perFile[idx] ?? 0) + 1;
  }
  let rendered = renderSchematics(buildBenchDesign(opts, perFile));
  // A few corrective rounds: instance data and hierarchy make the estimate slightly off.
  for (let round = 0; round < MAX_ROUNDS && totalBytes(rendered) < opts.targetBytes; round++) {
    const extra = Math.ceil((opts.targetBytes - totalBytes(rendered)) / perStage) + 1;
    for (let i = 0; i < extra; i++) {
      const idx = firstSheet + (i % fileCount);
      perFile[idx] = (perFile[idx] ?? 0) + 1;
    }
    rendered = renderSchematics(buildBenchDesign(opts, perFile));
  }
  return { perFile, rendered };
}

/** Write the project into `dir`; returns the root file's path and the bytes written. */
export function generateProject(dir: string, opts: ProjectOptions): { root: string; bytes: number } {
  const { rendered } = planStages(opts);
  const out = resolve(dir);
  mkdirSync(out, { recursive: true });
  let bytes = 0;
  for (const [name, textOut] of rendered.files) {
    writeFileSync(join(out, name), textOut);
    bytes += Buffer.byteLength(textOut, "utf8");
  }
  return { root: join(out, "bench-project.kicad_sch"), bytes };
}
