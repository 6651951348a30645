// Self-check of the committed fixture boards, independent of src/read:
// - every .kicad_sch / .net parses with sexpr-plus and has the expected top-level list;
// - every netlist node names a component, and expected-nets.json agrees with the .net;
// - the files are what the generator writes today (deterministic, not stale);
// - the pin geometry: pin points computed here with the 12-case offset table of
//   shared/notes/kicad-schematic-format.md §6.3 (a table checked against KiCad's own demo projects,
//   where it placed 5,290 of 5,497 pins on a wire end, label, junction, flag or pin; the rest were
//   hidden power_in pins) equal the points the writer reports, and each lands on a wire end, label,
//   junction, no-connect flag or another pin — the validation the notes' §0 describes.
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, relative } from "node:path";
import sexpr, { type Node } from "sexpr-plus";
import { describe, expect, it } from "vitest";
import { buildBenchDesign, generateProject, planStages } from "../bench/gen-project.js";
import { BOARDS } from "../fixtures/gen/boards/index.js";
import { render } from "../fixtures/gen/render.js";
import { pinPoint } from "../fixtures/gen/transform.js";
import { mm } from "../fixtures/gen/units.js";

const FIXTURES = join(import.meta.dirname, "..", "fixtures");

function walk(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) out.push(...walk(p));
    else out.push(p);
  }
  return out.sort();
}

// Only the boards the generator owns; other folders under fixtures/ belong to rule tests.
const files = BOARDS.flatMap((b) => walk(join(FIXTURES, b.dir)));
const schematics = files.filter((f) => f.endsWith(".kicad_sch"));
const netlists = files.filter((f) => f.endsWith(".net"));

// --- small typed access to sexpr-plus trees -------------------------------------------------

type List = Node & { type: "list" };

function isList(n: Node | undefined): n is List {
  return n !== undefined && n.type === "list";
}

function text(n: Node | undefined): string {
  if (n === undefined || n.type === "list") return "";
  return n.content;
}

function head(n: Node): string {
  return isList(n) ? text(n.content[0]) : "";
}

function children(n: Node, key: string): List[] {
  return isList(n) ? n.content.filter((c): c is List => isList(c) && head(c) === key) : [];
}

function child(n: Node, key: string): List | undefined {
  return children(n, key)[0];
}

function descend(n: Node, ...keys: string[]): List | undefined {
  let cur: List | undefined = isList(n) ? n : undefined;
  for (const k of keys) cur = cur ? child(cur, k) : undefined;
  return cur;
}

function arg(n: List | undefined, i: number): string {
  return n ? text(n.content[i + 1]) : "";
}

function parseFile(path: string): List {
  const nodes = sexpr.parse(readFileSync(path, "utf8"));
  expect(nodes.length, `${path}: one top-level list`).toBe(1);
  const top = nodes[0];
  if (!isList(top)) throw new Error(`${path}: top level is not a list`);
  return top;
}

// --- §6.3 offset table (angle × mirror), library pin (px, py) in library space ---------------

type Offset = (px: number, py: number) => [number, number];
const TABLE: Record<string, Offset> = {
  "0": (px, py) => [px, -py], "0x": (px, py) => [px, py], "0y": (px, py) => [-px, -py],
  "90": (px, py) => [-py, -px], "90x": (px, py) => [-py, px], "90y": (px, py) => [py, -px],
  "180": (px, py) => [-px, py], "180x": (px, py) => [-px, -py], "180y": (px, py) => [px, py],
  "270": (px, py) => [py, px], "270x": (px, py) => [py, -px], "270y": (px, py) => [-py, px],
};

const q = (v: string): number => Math.round(parseFloat(v) * 1e4);
const key = (x: number, y: number): string => `${x},${y}`;

interface LibPinInfo { x: number; y: number; unit: number; style: number; hidden: boolean; type: string }

function libPins(sym: List): LibPinInfo[] {
  const name = text(sym.content[1]);
  const base = name.includes(":") ? name.slice(name.indexOf(":") + 1) : name;
  const out: LibPinInfo[] = [];
  for (const sub of children(sym, "symbol")) {
    const m = /_(\d+)_(\d+)$/.exec(text(sub.content[1]));
    if (!m || !text(sub.content[1]).startsWith(`${base}_`)) throw new Error(`sub-symbol name ${text(sub.content[1])}`);
    for (const p of children(sub, "pin")) {
      const at = child(p, "at");
      const hide = p.content.some((c) => text(c) === "hide" || (isList(c) && head(c) === "hide" && arg(c, 0) === "yes"));
      out.push({ x: q(arg(at, 0)), y: q(arg(at, 1)), unit: Number(m[1]), style: Number(m[2]), hidden: hide, type: arg(p, 0) });
    }
  }
  return out;
}

interface SheetGeometry {
  pinPoints: { at: string; landsRequired: boolean }[];
  targets: Set<string>;
  orientations: string[];
}

function sheetGeometry(top: List): SheetGeometry {
  const libs = new Map<string, LibPinInfo[]>();
  for (const s of children(child(top, "lib_symbols") as List, "symbol")) libs.set(text(s.content[1]), libPins(s));
  const targets = new Set<string>();
  for (const w of children(top, "wire")) for (const xy of children(child(w, "pts") as List, "xy")) targets.add(key(q(arg(xy, 0)), q(arg(xy, 1))));
  for (const k of ["junction", "no_connect", "label", "global_label", "hierarchical_label"]) {
    for (const item of children(top, k)) { const at = child(item, "at"); targets.add(key(q(arg(at, 0)), q(arg(at, 1)))); }
  }
  const pinPoints: { at: string; landsRequired: boolean }[] = [];
  const orientations: string[] = [];
  for (const s of children(top, "symbol")) {
    const lib = libs.get(arg(child(s, "lib_name"), 0) || arg(child(s, "lib_id"), 0));
    if (!lib) throw new Error(`symbol ${arg(child(s, "lib_id"), 0)} has no embedded library symbol`);
    const at = child(s, "at");
    const mirror = arg(child(s, "mirror"), 0);
    const orient = `${arg(at, 2) || "0"}${mirror}`;
    orientations.push(orient);
    const offset = TABLE[orient];
    if (!offset) throw new Error(`orientation ${orient}`);
    // Per-instance unit (v7+ instances) when present, else the symbol's own.
    const unit = Number(arg(descend(s, "instances", "project", "path", "unit") ?? child(s, "unit"), 0) || "1");
    const x0 = q(arg(at, 0));
    const y0 = q(arg(at, 1));
    for (const p of lib) {
      if (!(p.unit === 0 || p.unit === unit) || !(p.style === 0 || p.style === 1)) continue;
      const [dx, dy] = offset(p.x, p.y);
      pinPoints.push({ at: key(x0 + dx, y0 + dy), landsRequired: !(p.hidden && p.type === "power_in") });
    }
  }
  return { pinPoints, targets, orientations };
}

// --- tests -----------------------------------------------------------------------------------

describe("fixture files are well-formed", () => {
  it("there is a fixture set to check (7 boards, 9 schematics, 7 netlists)", () => {
    expect(schematics.length).toBe(9);
    expect(netlists.length).toBe(7);
  });

  it.each(schematics.map((f) => [relative(FIXTURES, f), f]))("%s parses and starts with kicad_sch", (_name, f) => {
    const top = parseFile(f);
    expect(head(top)).toBe("kicad_sch");
    expect(Number(arg(child(top, "version"), 0))).toBeGreaterThanOrEqual(20211123);
    expect(child(top, "lib_symbols")).toBeDefined();
  });

  it.each(netlists.map((f) => [relative(FIXTURES, f), f]))("%s parses, every node names a component, expected-nets.json agrees", (_name, f) => {
    const top = parseFile(f);
    expect(head(top)).toBe("export");
    expect(arg(child(top, "version"), 0)).toBe("E");
    const comps = new Set(children(child(top, "components") as List, "comp").map((c) => arg(child(c, "ref"), 0)));
    const fromNet = new Map<string, string[]>();
    for (const n of children(child(top, "nets") as List, "net")) {
      const pins: string[] = [];
      for (const nd of children(n, "node")) {
        const ref = arg(child(nd, "ref"), 0);
        expect(comps.has(ref), `${ref} in components`).toBe(true);
        pins.push(`${ref}.${arg(child(nd, "pin"), 0)}`);
      }
      fromNet.set(arg(child(n, "name"), 0), pins);
    }
    const expected = JSON.parse(readFileSync(join(f, "..", "expected-nets.json"), "utf8")) as { nets: { name: string; named: boolean; pins: string[] }[] };
    expect(new Map(expected.nets.map((n) => [n.name, n.pins]))).toEqual(fromNet);
  });
});

describe("fixture geometry (independent of the writer's transform)", () => {
  it("the writer's transform reproduces the worked examples of the format notes §6.3", () => {
    // Notes §6.3: symbol at (100.33, 50.8), 90° + mirror x, pin (−3.81, 1.27) → (99.06, 46.99).
    expect(pinPoint([mm(-3.81), mm(1.27)], [mm(100.33), mm(50.8)], { rot: 90, mirror: "x" })).toEqual([mm(99.06), mm(46.99)]);
    // 270°, pins (0, ±3.81) at (63.5, 88.9) → pin 1 (67.31, 88.9), pin 2 (59.69, 88.9).
    expect(pinPoint([0, mm(3.81)], [mm(63.5), mm(88.9)], { rot: 270 })).toEqual([mm(67.31), mm(88.9)]);
    expect(pinPoint([0, mm(-3.81)], [mm(63.5), mm(88.9)], { rot: 270 })).toEqual([mm(59.69), mm(88.9)]);
    // 180° + mirror y at (40.64, 30.48), pin (−5.08, 2.54) → (35.56, 33.02).
    expect(pinPoint([mm(-5.08), mm(2.54)], [mm(40.64), mm(30.48)], { rot: 180, mirror: "y" })).toEqual([mm(35.56), mm(33.02)]);
  });

  it("the writer's transform agrees with the notes' 12-case table for an asymmetric pin", () => {
    for (const [name, offset] of Object.entries(TABLE)) {
      const rot = Number(/^\d+/.exec(name)?.[0]) as 0 | 90 | 180 | 270;
      const mirror = name.endsWith("x") ? "x" : name.endsWith("y") ? "y" : undefined;
      const [dx, dy] = offset(mm(2.54), mm(5.08));
      expect(pinPoint([mm(2.54), mm(5.08)], [0, 0], { rot, mirror }), name).toEqual([dx + 0, dy + 0]);
    }
  });

  // Rendered inside the tests so a generator failure reports as a failing test, not a load error.
  const cache = new Map<string, ReturnType<typeof render>>();
  const renderBoard = (b: (typeof BOARDS)[number]): ReturnType<typeof render> => {
    const hit = cache.get(b.dir);
    if (hit) return hit;
    const out = render(b.build());
    cache.set(b.dir, out);
    return out;
  };

  it.each(BOARDS.map((b) => [b.dir, b] as const))("%s: committed files equal the generator's output", (_dir, b) => {
    const out = renderBoard(b);
    for (const [rel, textOut] of out.files) {
      const target = join(FIXTURES, b.dir, rel);
      expect(readFileSync(target, "utf8"), `${b.dir}/${rel} is stale: run node scripts/run-ts.mjs fixtures/gen/index.ts`).toBe(textOut);
    }
  });

  it.each(BOARDS.map((b) => [b.dir, b] as const))("%s: every pin lands on a wire end, label, junction, flag or pin", (_dir, b) => {
    const out = renderBoard(b);
    for (const fileName of new Set(out.pins.map((p) => p.file))) {
      const geo = sheetGeometry(parseFile(join(FIXTURES, b.dir, fileName)));
      const reported = out.pins.filter((p) => p.file === fileName).map((p) => key(p.at[0], p.at[1])).sort();
      expect(geo.pinPoints.map((p) => p.at).sort(), `${fileName}: pin points`).toEqual(reported);
      const counts = new Map<string, number>();
      for (const p of geo.pinPoints) counts.set(p.at, (counts.get(p.at) ?? 0) + 1);
      for (const p of geo.pinPoints) {
        if (!p.landsRequired) continue;
        const lands = geo.targets.has(p.at) || (counts.get(p.at) ?? 0) > 1;
        expect(lands, `${fileName}: pin at ${p.at} lands on nothing`).toBe(true);
      }
    }
  });

  it("the fixtures use all twelve rotation/mirror cases", () => {
    const seen = new Set<string>();
    for (const f of schematics) for (const o of sheetGeometry(parseFile(f)).orientations) seen.add(o);
    expect([...seen].sort()).toEqual(Object.keys(TABLE).sort());
  });

  it("the fixtures cover KiCad 6, 7, 8 and 9 file versions", () => {
    const versions = new Set(schematics.map((f) => arg(child(parseFile(f), "version"), 0)));
    expect([...versions].sort()).toEqual(["20211123", "20230121", "20231120", "20250114"]);
  });
});

describe("benchmark project generator", () => {
  const opts = { sheets: 6, targetBytes: 250_000 };

  it("draws its stages correctly (the generator's geometric self-check passes)", () => {
    const { perFile } = planStages(opts);
    expect(() => render(buildBenchDesign(opts, perFile))).not.toThrow();
  });

  it("writes a parseable three-level project of at least the target size, the same bytes every time", () => {
    const dir = mkdtempSync(join(tmpdir(), "loadline-bench-"));
    try {
      const a = generateProject(join(dir, "a"), opts);
      const b = generateProject(join(dir, "b"), opts);
      expect(a.bytes).toBeGreaterThanOrEqual(opts.targetBytes);
      expect(b.bytes).toBe(a.bytes);
      const names = readdirSync(join(dir, "a")).sort();
      expect(names.length).toBe(opts.sheets + 1);
      let maxDepth = 0;
      for (const name of names) {
        const textA = readFileSync(join(dir, "a", name), "utf8");
        expect(readFileSync(join(dir, "b", name), "utf8")).toBe(textA);
        const top = parseFile(join(dir, "a", name));
        expect(head(top)).toBe("kicad_sch");
        const geo = sheetGeometry(top);
        const counts = new Map<string, number>();
        for (const p of geo.pinPoints) counts.set(p.at, (counts.get(p.at) ?? 0) + 1);
        for (const p of geo.pinPoints) if (p.landsRequired) expect(geo.targets.has(p.at) || (counts.get(p.at) ?? 0) > 1).toBe(true);
        for (const sym of children(top, "symbol")) {
          for (const path of children(descend(sym, "instances", "project") as List, "path")) {
            maxDepth = Math.max(maxDepth, arg(path, 0).split("/").length - 1);
          }
        }
      }
      // Root UUID + level-1 sheet + leaf sheet: symbols on leaf sheets carry three-element paths.
      expect(maxDepth).toBe(3);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it("writes one flat file with singleSheet", () => {
    const dir = mkdtempSync(join(tmpdir(), "loadline-bench-"));
    try {
      const r = generateProject(dir, { sheets: 1, targetBytes: 120_000, singleSheet: true });
      expect(readdirSync(dir)).toEqual(["bench-project.kicad_sch"]);
      expect(r.bytes).toBeGreaterThanOrEqual(120_000);
      expect(children(parseFile(r.root), "sheet").length).toBe(0);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
