// Each main fixture board states, in expected-findings.json beside it, what lint must report on it
// (rule, severity, parts, and figures with a tolerance and a named source) and what it must not.
// The figures are checked twice: against the finding's `data`, and against an independent
// recomputation here (closed-form formulas, IEC 60063 Table 1, recorded ngspice decks — and a
// live ngspice run when it is installed), so a value in the JSON cannot drift from its source.
// The rules' own test boards are held to one board-wide fact too: no electrolytic is reversed
// except on the board that is reversed on purpose.
import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { lint } from "../src/engine/lint.js";
import type { Finding, Severity } from "../src/engine/types.js";
import { allRules } from "../rules/index.js";
import { ratings } from "../rules/ratings.js";
import type { Recording } from "./support/ngspice.js";
import { acVector, loadRecording, ngspiceVersion, opValue, runNgspice } from "./support/ngspice.js";

interface Figure {
  value: number;
  /** Relative tolerance (0.02 = 2 %). */
  tolerance: number;
  source: string;
}

interface MustFinding {
  rule: string;
  severity: Severity;
  /** Exactly these parts, in any order. */
  parts: string[];
  why: string;
  /** Data keys of the finding; `key[i]` picks an element of an array. */
  figures?: Record<string, Figure>;
}

interface MustNotFinding {
  /** A rule id, or "*" for any rule. */
  rule: string;
  /** Only findings naming at least one of these parts; absent: any finding of the rule. */
  parts?: string[];
  /** Only these severities; absent: any severity. */
  severity?: Severity[];
  why: string;
}

interface ExpectedFindings {
  board: string;
  band: string;
  must: MustFinding[];
  mustNot: MustNotFinding[];
}

const FIXTURES = resolve("fixtures");
const BOARDS = ["ce-follower-9v", "dual-gate-cascode", "bjt-cascode-stack", "jfet-cascode", "hier-two-channel", "demo", "clean"];

function expectedFor(dir: string): ExpectedFindings {
  return JSON.parse(readFileSync(join(FIXTURES, dir, "expected-findings.json"), "utf8")) as ExpectedFindings;
}

function sameParts(a: readonly string[], b: readonly string[]): boolean {
  return [...a].sort().join(",") === [...b].sort().join(",");
}

type Judged = Pick<Finding, "rule" | "severity" | "parts">;

function isMatch(f: Judged, m: MustFinding): boolean {
  return f.rule === m.rule && f.severity === m.severity && sameParts(f.parts, m.parts);
}

function isForbidden(f: Judged, n: MustNotFinding): boolean {
  if (n.rule !== "*" && f.rule !== n.rule) return false;
  if (n.severity !== undefined && !n.severity.includes(f.severity)) return false;
  if (n.parts !== undefined && !f.parts.some((p) => n.parts?.includes(p))) return false;
  return true;
}

/** `seenOhms` or `beforeVolts[1]`. */
function dataValue(f: Finding, key: string): unknown {
  const m = /^(\w+)\[(\d+)\]$/.exec(key);
  if (!m) return f.data[key];
  const list = f.data[m[1] ?? ""];
  return Array.isArray(list) ? list[Number(m[2])] : undefined;
}

function describeFinding(f: Finding): string {
  return `${f.rule}/${f.severity} [${f.parts.join(", ")}]: ${f.message}`;
}

function lintBoard(dir: string, file: string): Finding[] {
  const result = lint({ paths: [join(FIXTURES, dir, file)] });
  expect(result.errors ?? [], `run errors for ${dir}`).toEqual([]);
  expect(result.designs).toHaveLength(1);
  const design = result.designs[0];
  expect(design?.errors ?? [], `design errors for ${dir}`).toEqual([]);
  return design?.findings ?? [];
}

// --- Independent figures -------------------------------------------------------------------------

/** IEC 60063:2015 Table 1, E24, one decade (as listed in shared/notes/reference-data.md §1.1). */
const E24 = [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];

function e24Neighbours(ohms: number): { below: number; above: number } {
  const decade = 10 ** Math.floor(Math.log10(ohms));
  const values = [...E24, 10].map((m) => Math.round(m * decade * 1e6) / 1e6);
  const above = values.find((v) => v > ohms) ?? Number.NaN;
  const below = [...values].reverse().find((v) => v < ohms) ?? Number.NaN;
  return { below, above };
}

/** kT/q at 27 °C (300.15 K) with the exact SI values of k and q (2019 SI). */
const VT = (1.380649e-23 * 300.15) / 1.602176634e-19;

const cornerHertz = (ohms: number, farads: number): number => 1 / (2 * Math.PI * ohms * farads);
const srfHertz = (henries: number, farads: number): number => 1 / (2 * Math.PI * Math.sqrt(henries * farads));
const parallelRc = (ohms: number, farads: number, hertz: number): number => 1 / Math.hypot(1 / ohms, 2 * Math.PI * hertz * farads);

/** |V(a) − V(b)| at the single AC point of a deck that drives 1 A between the two nodes. */
function acOhms(rec: Recording, a: string, b?: string): number {
  const va = acVector(rec, a);
  const vb = b === undefined ? { re: [0], im: [0] } : acVector(rec, b);
  return Math.hypot((va.re[0] ?? Number.NaN) - (vb.re[0] ?? Number.NaN), (va.im[0] ?? Number.NaN) - (vb.im[0] ?? Number.NaN));
}

/** Q1 VCE, Q2 VCE, Q1 IC, Q2 IC of the demo board with the given R2 (ngspice). */
function demoFigures(rec: Recording): number[] {
  const v = (name: string): number => opValue(rec, name);
  return [v("v(mid)") - v("v(e1)"), v("v(c2)") - v("v(mid)"), v("i(@q1[ic])"), v("i(@q2[ic])")];
}

/** The e-series rule's measure of an operating-point shift: the largest relative VCE or IC change. */
function largestShift(before: number[], after: number[]): number {
  return Math.max(...before.map((b, i) => Math.abs((after[i] ?? Number.NaN) - b) / Math.abs(b)));
}

const DECKS = [
  "board_ce_follower_c1", "board_ce_follower_c2", "board_bjt_cascode_c3", "board_dual_gate_c3",
  "board_demo_preamp_r2_8k5", "board_demo_preamp_r2_8k2", "board_demo_preamp_r2_9k1",
];

/** Every figure of every expected-findings.json, keyed "board|rule|parts|key", recomputed. */
function oracles(deck: (name: string) => Recording): Record<string, number> {
  const ceC1 = acOhms(deck("board_ce_follower_c1"), "v(in)", "v(base)");
  const ceC2 = acOhms(deck("board_ce_follower_c2"), "v(emit)");
  const dgC3 = acOhms(deck("board_dual_gate_c3"), "v(s)");
  const bjtC3 = acOhms(deck("board_bjt_cascode_c3"), "v(e1)");
  const demo = deck("board_demo_preamp_r2_8k5");
  const before = demoFigures(demo);
  const below = demoFigures(deck("board_demo_preamp_r2_8k2"));
  const above = demoFigures(deck("board_demo_preamp_r2_9k1"));
  const belowShift = largestShift(before, below);
  const aboveShift = largestShift(before, above);
  const r2 = e24Neighbours(8.5e3);
  const ic2 = opValue(demo, "i(@q2[ic])");
  const beta2 = ic2 / opValue(demo, "i(@q2[ib])");
  const rin2 = ((beta2 + 1) * VT) / ic2;
  const cpi2 = opValue(demo, "@q2[cpi]");
  const rth = 1 / (1 / 18e3 + 1 / (8.5e3 + 6.8e3));
  return {
    "ce-follower-9v|corner-frequency|C1,Q1|seenOhms": ceC1,
    "ce-follower-9v|corner-frequency|C1,Q1|cornerHertz": cornerHertz(ceC1, 10e-6),
    "ce-follower-9v|corner-frequency|C2,Q1|seenOhms": ceC2,
    "ce-follower-9v|corner-frequency|C2,Q1|cornerHertz": cornerHertz(ceC2, 1000e-6),
    "dual-gate-cascode|corner-frequency|C3,Q1|seenOhms": dgC3,
    "dual-gate-cascode|corner-frequency|C3,Q1|cornerHertz": cornerHertz(dgC3, 10e-9),
    "bjt-cascode-stack|corner-frequency|C3,Q1|seenOhms": bjtC3,
    "bjt-cascode-stack|corner-frequency|C3,Q1|cornerHertz": cornerHertz(bjtC3, 100e-6),
    // 47 µF with the ≈10 nH of a radial electrolytic (reference-data §2.2, from memory).
    "hier-two-channel|rail-bypass|C1|highestSrfHertz": srfHertz(10e-9, 47e-6),
    "hier-two-channel|rail-bypass|C1|targetOhms": 2.2e3 / 100,
    "demo|e-series|R2|below": r2.below,
    "demo|e-series|R2|above": r2.above,
    "demo|e-series|R2|chosen": belowShift < aboveShift ? r2.below : r2.above,
    "demo|e-series|R2|beforeVolts[0]": before[0] ?? Number.NaN,
    "demo|e-series|R2|beforeVolts[1]": before[1] ?? Number.NaN,
    "demo|e-series|R2|beforeAmps[0]": before[2] ?? Number.NaN,
    "demo|e-series|R2|belowVolts[0]": below[0] ?? Number.NaN,
    "demo|e-series|R2|belowVolts[1]": below[1] ?? Number.NaN,
    "demo|e-series|R2|aboveVolts[0]": above[0] ?? Number.NaN,
    "demo|e-series|R2|belowShift": belowShift,
    "demo|e-series|R2|aboveShift": aboveShift,
    "demo|base-ac-ground|C2,Q2|worstOhms": parallelRc(rth, 100e-12, 0.5e6),
    "demo|base-ac-ground|C2,Q2|atHertz": 0.5e6,
    "demo|base-ac-ground|C2,Q2|icAmps": ic2,
    "demo|base-ac-ground|C2,Q2|beta": beta2,
    "demo|base-ac-ground|C2,Q2|lowFrequencyLimitOhms": 0.1 * rin2,
    "demo|base-ac-ground|C2,Q2|limitOhms": 0.1 * parallelRc(rin2, cpi2, 0.5e6),
    // 100 nF with the 0.9 nH typical of an 0603 MLCC (reference-data §2.2).
    "demo|rail-bypass|C5,C6|highestSrfHertz": srfHertz(0.9e-9, 100e-9),
    "demo|rail-bypass|C5,C6|targetOhms": 1.5e3 / 100,
  };
}

function oracleKey(dir: string, m: MustFinding, key: string): string {
  return `${dir}|${m.rule}|${[...m.parts].sort().join(",")}|${key}`;
}

// --- Tests ---------------------------------------------------------------------------------------

describe("fixture boards: expected-findings.json", () => {
  const recorded = oracles(loadRecording);

  it("every main board has one", () => {
    for (const dir of BOARDS) expect(existsSync(join(FIXTURES, dir, "expected-findings.json")), dir).toBe(true);
  });

  it("every figure in them is the independent value its source names (to 0.01 %), and every recomputed figure is used", () => {
    const used = new Set<string>();
    for (const dir of BOARDS) {
      for (const m of expectedFor(dir).must) {
        for (const [key, figure] of Object.entries(m.figures ?? {})) {
          const k = oracleKey(dir, m, key);
          const independent = recorded[k];
          expect(independent, `no independent recomputation for ${k}`).toBeDefined();
          expect(Math.abs(figure.value / (independent ?? Number.NaN) - 1), `${k}: JSON ${figure.value}, recomputed ${independent}`).toBeLessThan(1e-4);
          expect(figure.source.length, `${k} names its source`).toBeGreaterThan(10);
          expect(figure.tolerance).toBeGreaterThan(0);
          used.add(k);
        }
      }
    }
    expect(Object.keys(recorded).filter((k) => !used.has(k))).toEqual([]);
  });

  it.skipIf(ngspiceVersion() === null)("the recorded board decks are what ngspice gives now", () => {
    const live = oracles((name) => runNgspice(name));
    for (const [k, v] of Object.entries(recorded)) expect(Math.abs((live[k] ?? Number.NaN) / v - 1), k).toBeLessThan(1e-6);
    expect(DECKS.every((d) => loadRecording(d).ngspice.startsWith("ngspice-"))).toBe(true);
  });

  for (const dir of BOARDS) {
    const expected = expectedFor(dir);
    it(`${dir}: its required findings, nothing forbidden, no undeclared warning or error`, () => {
      const findings = lintBoard(dir, expected.board);
      const listing = findings.map(describeFinding).join("\n  ");

      for (const m of expected.must) {
        const found = findings.filter((f) => isMatch(f, m));
        expect(found, `${dir}: expected exactly one ${m.rule}/${m.severity} on [${m.parts.join(", ")}] (${m.why}); got:\n  ${listing}`).toHaveLength(1);
        const f = found[0];
        if (!f) continue;
        for (const [key, figure] of Object.entries(m.figures ?? {})) {
          const actual = dataValue(f, key);
          expect(typeof actual, `${dir} ${m.rule} data.${key}`).toBe("number");
          const rel = Math.abs((actual as number) / figure.value - 1);
          expect(rel, `${dir} ${m.rule} data.${key} = ${String(actual)}, expected ${figure.value} ± ${figure.tolerance * 100} % (${figure.source})`).toBeLessThanOrEqual(figure.tolerance);
        }
      }

      for (const n of expected.mustNot) {
        const clash = expected.must.filter((m) => isForbidden(m, n));
        expect(clash.map((m) => `${m.rule} [${m.parts.join(", ")}]`), `${dir}: a mustNot entry (${n.rule}) forbids a required finding`).toEqual([]);
        const found = findings.filter((f) => isForbidden(f, n));
        expect(found.map(describeFinding), `${dir}: must not report ${n.rule}${n.parts ? ` on ${n.parts.join(", ")}` : ""}${n.severity ? ` (${n.severity.join("/")})` : ""}: ${n.why}`).toEqual([]);
      }

      // A warning or error the board does not declare is a finding nobody has judged.
      const undeclared = findings.filter((f) => f.severity !== "note" && !expected.must.some((m) => isMatch(f, m)));
      expect(undeclared.map(describeFinding), `${dir}: warnings/errors not declared in expected-findings.json`).toEqual([]);
    });
  }

  it("clean-preamp: no rule reports a warning or an error, and its mustNot list says so for every rule", () => {
    const expected = expectedFor("clean");
    const findings = lintBoard("clean", expected.board);
    expect(findings.filter((f) => f.severity === "warning" || f.severity === "error").map(describeFinding)).toEqual([]);
    expect(expected.must).toEqual([]);
    for (const rule of allRules) {
      for (const severity of ["warning", "error"] as const) {
        expect(expected.mustNot.some((n) => n.rule === rule.id && n.parts === undefined && (n.severity === undefined || n.severity.includes(severity))), `clean mustNot covers ${rule.id} ${severity}`).toBe(true);
      }
    }
  });
});

/** Every netlist under a folder, depth-first, sorted. */
function netlistsUnder(dir: string): string[] {
  return readdirSync(dir).sort().flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return netlistsUnder(path);
    return name.endsWith(".net") ? [path] : [];
  });
}

describe("rule test boards (fixtures/rules)", () => {
  it("electrolytics have + toward the higher DC potential, except on the board that is reversed on purpose", () => {
    const reversed: string[] = [];
    for (const file of netlistsUnder(join(FIXTURES, "rules"))) {
      for (const design of lint({ paths: [file], rules: [ratings] }).designs) {
        for (const f of design.findings) {
          if (typeof f.data.reverseVolts === "number") reversed.push(`${relative(FIXTURES, file)} ${f.parts.join(",")}`);
        }
      }
    }
    expect(reversed).toEqual(["rules/ratings/electrolytic-reversed.net C2"]);
  });
});
