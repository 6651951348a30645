// Workflow-command annotations. Expected escapes are those of @actions/core 3.0.1 lib/command.js
// (message: % CR LF; properties also : and ,), seen on this machine (shared notes §2); the per-level
// limit of 10 annotations per step is GitHub's documented display limit (notes §3).
import { describe, expect, it } from "vitest";
import { annotationLine, escapeData, escapeProperty, formatAnnotations } from "../src/report/github.js";
import type { Finding } from "../src/engine/types.js";
import type { LintResult } from "../src/engine/result.js";
import { BASE, HOSTILE, demoResult } from "./helpers/demo-lint-result.js";

describe("escaping", () => {
  it("matches @actions/core's command escaping exactly", () => {
    expect(escapeData("Bad 100%\nsecond line\r")).toBe("Bad 100%25%0Asecond line%0D");
    expect(escapeProperty("T: a, b")).toBe("T%3A a%2C b");
    expect(annotationLine("error", "Bad 100%\nsecond line\r", { title: "T: a, b", file: "hw/a,b:c.sch", line: 3, col: 2 })).toBe(
      "::error title=T%3A a%2C b,file=hw/a%2Cb%3Ac.sch,line=3,col=2::Bad 100%25%0Asecond line%0D",
    );
  });

  it("leaves no way for field text to start a new command", () => {
    const line = annotationLine("warning", HOSTILE, { title: `x::${HOSTILE}`, file: "a::b.sch", line: 1 });
    expect(line).toBe(
      "::warning title=x%3A%3A<script>alert(1)</script> 100%25 %250A %3A%3Aerror%3A%3Ax%2C a%3Ab%0D%0Anext line & µΩ–€," +
        "file=a%3A%3Ab.sch,line=1::<script>alert(1)</script> 100%25 %250A ::error::x, a:b%0D%0Anext line & µΩ–€",
    );
    expect(line).not.toMatch(/[\r\n]/);
  });

  it("drops line and column below 1, as the runner would", () => {
    expect(annotationLine("notice", "m", { file: "a.sch", line: 0, col: 4 })).toBe("::notice file=a.sch::m");
  });
});

describe("formatAnnotations", () => {
  it("annotates read errors and standing findings with workspace-relative paths; suppressed ones are not annotated", () => {
    const { lines, overflow } = formatAnnotations(demoResult(), BASE);
    expect(overflow).toEqual([]);
    expect(lines[0]).toBe("::error title=loadline could not check this file,file=hw/broken.kicad_sch,line=7,col=12::expected ')' but the file ended");
    expect(lines[1]?.startsWith("::error title=loadline rail-bypass (C12%2C C13),file=hw/rf board/preamp.kicad_sch,line=120,col=5::+12V_RF")).toBe(true);
    expect(lines[2]?.startsWith("::warning title=loadline cascode-base (Q2),file=hw/rf board/preamp.kicad_sch,line=88,col=3::")).toBe(true);
    expect(lines[3]?.startsWith("::notice title=loadline e-series (R9),file=hw/rf board/front-end.kicad_sch,line=52,col=7::")).toBe(true);
    expect(lines).toHaveLength(4);
  });

  it("shows at most 10 per level, then one notice counting the rest (GitHub: 10 per level per step)", () => {
    const make = (severity: Finding["severity"], n: number): Finding[] =>
      Array.from({ length: n }, (_, i) => ({
        rule: "demo", severity, message: `${severity} ${i}`, parts: [`R${i}`], nets: [], file: "/work/demo-repo/hw/x.kicad_sch",
        line: i + 1, column: 1, sheetPath: "/", data: {},
      }));
    const result: LintResult = {
      toolVersion: "0.1.0", band: { low: 5e5, high: 3e7, isDefault: true },
      designs: [{ file: "hw/x.kicad_sch", sheetFiles: [], findings: [...make("note", 15), ...make("error", 25), ...make("warning", 3)], rails: [], bases: [], devices: [], errors: [] }],
    };
    const { lines, overflow } = formatAnnotations(result, BASE);
    const count = (prefix: string): number => lines.filter((l) => l.startsWith(prefix)).length;
    expect(count("::error ")).toBe(10);
    expect(count("::warning ")).toBe(3);
    expect(count("::notice ")).toBe(10); // 9 findings + the closing notice
    expect(overflow).toHaveLength(15 + 6);
    expect(lines.at(-1)).toBe("::notice title=loadline::21 more findings are in the job summary");
    expect(lines[0]).toContain("file=hw/x.kicad_sch,line=1,col=1::error 0");
  });
});
