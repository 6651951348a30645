// The terminal report and the Markdown job summary, on the invented demo project. The 1 MiB figure
// is GitHub's documented per-step summary limit (workflow commands docs, "Step isolation and limits").
import { describe, expect, it } from "vitest";
import { formatText } from "../src/report/text.js";
import { formatMarkdown, escapeCell, SUMMARY_BYTE_LIMIT } from "../src/report/markdown.js";
import { createColors, noColors } from "../src/report/colors.js";
import type { Finding } from "../src/engine/types.js";
import type { LintResult } from "../src/engine/result.js";
import { BASE, demoResult } from "./helpers/demo-lint-result.js";

describe("formatText", () => {
  const text = formatText(demoResult(), { ...BASE, colors: noColors });
  const lines = text.split("\n");

  it("lists each finding as file:line:column, severity, rule, parts, message, grouped by design and sheet", () => {
    expect(lines).toContain(
      "    hw/rf board/preamp.kicad_sch:120:5  error   rail-bypass C12, C13  +12V_RF: |Z| reaches 4.2 Ω at 28 MHz, over the 1.2 Ω target; add a 10 nF capacitor beside C12",
    );
    expect(lines).toContain("  sheet /preamp/ (hw/rf board/preamp.kicad_sch)");
    expect(lines).toContain("    hw/broken.kicad_sch:7:12  could not check: expected ')' but the file ended");
    expect(lines.indexOf("hw/broken.kicad_sch")).toBeLessThan(lines.indexOf("hw/rf board/front-end.kicad_sch"));
  });

  it("keeps hostile text on its own line and shows control characters as escapes", () => {
    const hostile = lines.filter((l) => l.includes("cascode-base"));
    expect(hostile).toHaveLength(1);
    expect(hostile[0]).toContain("a:b\\r\\nnext line & µΩ–€");
  });

  it("ends with the counts, suppressed included, and the band marked as the default", () => {
    expect(lines.at(-2)).toBe("✖ 1 error, 1 warning, 1 note, 1 suppressed in 2 designs, 1 design could not be checked · band 500 kHz – 30 MHz (default band)");
    expect(text).toContain("1 suppressed finding (loadline-ignore fields)");
  });

  it("colours only when asked", () => {
    expect(text).not.toContain("\u001b[");
    expect(formatText(demoResult(), { ...BASE, colors: createColors(true) })).toContain("\u001b[31m");
  });

  it("lists suppressed findings with their reasons on request", () => {
    const verbose = formatText(demoResult(), { ...BASE, colors: noColors, showSuppressed: true });
    expect(verbose).toContain("[suppressed: matched pair, select on test <b>]");
  });
});

describe("formatMarkdown", () => {
  it("escapes what could end a cell or open a tag", () => {
    expect(escapeCell("a|b <script>&amp;\nc")).toBe("a\\|b &lt;script&gt;&amp;amp;<br>c");
  });

  it("holds counts, a findings table, the rails' worst figures and the suppressed list", () => {
    const md = formatMarkdown(demoResult(), BASE);
    expect(md).toContain("**1 error, 1 warning, 1 note, 1 suppressed** in 2 designs");
    expect(md).toContain("| 🔴 error | `rail-bypass` | C12, C13 | hw/rf board/preamp.kicad\\_sch:120:5 |");
    expect(md).toContain("| hw/rf board/front-end.kicad\\_sch | +12V\\_RF | 12 V | 1.2 Ω | 4.2 Ω | 28 MHz | ❌ |");
    expect(md).toContain("<summary>1 suppressed finding</summary>");
    expect(md).not.toContain("<script>");
    // Every table row has exactly as many unescaped pipes as its header.
    for (const row of md.split("\n").filter((l) => l.startsWith("| 🔴") || l.startsWith("| 🟠") || l.startsWith("| 🔵"))) {
      expect(row.replace(/\\\|/g, "").split("|").length).toBe(7);
    }
  });

  it("stays under 1 MiB by dropping rows and saying so", () => {
    const big: Finding[] = Array.from({ length: 3000 }, (_, i) => ({
      rule: "demo", severity: "warning", message: `R${i} ${"x".repeat(10_000)}`, parts: [`R${i}`], nets: [],
      file: "hw/big.kicad_sch", line: i + 1, column: 1, sheetPath: "/", data: {},
    }));
    const result: LintResult = { ...demoResult(), designs: [{ file: "hw/big.kicad_sch", sheetFiles: [], findings: big, rails: [], bases: [], devices: [], errors: [] }] };
    const md = formatMarkdown(result, { ...BASE, maxCellChars: 5000 });
    const bytes = Buffer.byteLength(md, "utf8");
    expect(bytes).toBeLessThanOrEqual(SUMMARY_BYTE_LIMIT);
    expect(bytes).toBeGreaterThan(SUMMARY_BYTE_LIMIT * 0.9);
    expect(md).toMatch(/Showing \d+ of 3000 findings \(cut to stay under GitHub's 1 MiB job-summary limit\)/);
  });

  it("lists at most maxRows findings by default (500) and says how many there were", () => {
    const many: Finding[] = Array.from({ length: 700 }, (_, i) => ({
      rule: "demo", severity: "note", message: `n${i}`, parts: [], nets: [], file: "a.kicad_sch", line: i + 1, column: 1, sheetPath: "/", data: {},
    }));
    const result: LintResult = { ...demoResult(), designs: [{ file: "a.kicad_sch", sheetFiles: [], findings: many, rails: [], bases: [], devices: [], errors: [] }] };
    const md = formatMarkdown(result, BASE);
    expect(md.split("\n").filter((l) => l.startsWith("| 🔵")).length).toBe(500);
    expect(md).toContain("Showing 500 of 700 findings; the JSON and SARIF reports hold them all.");
  });
});
