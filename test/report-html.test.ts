// The HTML report and its log-log plot. Well-formedness is checked by a strict little tag-balance
// reader (every tag closed or self-closed, attributes double-quoted, only the five XML entities);
// plot coordinates follow from the definition of a log scale: x = left + width · (log10 f − log10 f0) / decades.
import { describe, expect, it } from "vitest";
import { formatHtml } from "../src/report/html.js";
import { logLogPlotSvg } from "../src/report/svg-plot.js";
import { BASE, LONG_VALUE, demoResult } from "./helpers/demo-lint-result.js";

/** Problems that would make the document not well-formed XML (empty when it is). */
function wellFormedProblems(doc: string): string[] {
  const problems: string[] = [];
  const body = doc.replace(/^<!DOCTYPE html>\n/, "").replace(/<style>[^<]*<\/style>/g, "<style></style>");
  const stack: string[] = [];
  const tag = /<(\/?)([a-zA-Z][a-zA-Z0-9-]*)((?:\s+[a-zA-Z_:][-a-zA-Z0-9_:.]*="[^"<>]*")*)\s*(\/?)>/y;
  let i = 0;
  while (i < body.length) {
    const lt = body.indexOf("<", i);
    const text = body.slice(i, lt < 0 ? body.length : lt);
    if (text.includes(">")) problems.push(`stray '>' in text near ${JSON.stringify(text.slice(0, 40))}`);
    const amp = /&(?!(?:amp|lt|gt|quot|#39);)/.exec(text);
    if (amp) problems.push(`bare '&' near ${JSON.stringify(text.slice(Math.max(0, amp.index - 20), amp.index + 20))}`);
    if (lt < 0) break;
    tag.lastIndex = lt;
    const m = tag.exec(body);
    if (!m) {
      problems.push(`malformed tag at ${JSON.stringify(body.slice(lt, lt + 60))}`);
      break;
    }
    const [, closing, name, , selfClosing] = m;
    if (closing) {
      const open = stack.pop();
      if (open !== name) problems.push(`</${name}> closes <${open ?? "nothing"}>`);
    } else if (!selfClosing) {
      stack.push(name ?? "");
    }
    i = tag.lastIndex;
  }
  if (stack.length > 0) problems.push(`unclosed: ${stack.join(" > ")}`);
  return problems;
}

describe("the tag-balance reader itself", () => {
  it("catches what it is there to catch", () => {
    expect(wellFormedProblems("<p><b>x</p>")).not.toEqual([]);
    expect(wellFormedProblems("<p>a & b</p>")).not.toEqual([]);
    expect(wellFormedProblems("<p class=x>a</p>")).not.toEqual([]);
    expect(wellFormedProblems("<br>")).not.toEqual([]);
    expect(wellFormedProblems('<p class="x">a &amp; b<br /></p>')).toEqual([]);
  });
});

describe("formatHtml", () => {
  const html = formatHtml(demoResult(), BASE);

  it("is well-formed, self-contained and script-free", () => {
    expect(wellFormedProblems(html)).toEqual([]);
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/\s(src|srcset)=/i);
    expect(html).not.toMatch(/url\(|@import/i);
    const urls = html.match(/https?:\/\/[^\s"'<>]+/g) ?? [];
    expect(new Set(urls)).toEqual(new Set(["http://www.w3.org/2000/svg"])); // a namespace name, never fetched
  });

  it("escapes every piece of user text and keeps it whole", () => {
    expect(html).toContain("Q2 base: &lt;script&gt;alert(1)&lt;/script&gt; 100% %0A ::error::x, a:b\r\nnext line &amp; µΩ–€");
    expect(html).toContain(LONG_VALUE);
    expect(html).toContain("matched pair, select on test &lt;b&gt;");
    expect(html).toContain("demo basis &lt;i&gt;");
  });

  it("draws one plot per rail and per cascode base, with the target line and the band", () => {
    expect(html.match(/<figure class="rail">/g)).toHaveLength(2);
    expect(html.match(/<figure class="base">/g)).toHaveLength(1);
    expect(html.match(/<svg /g)).toHaveLength(3);
    expect(html.match(/class="plot-band"/g)).toHaveLength(3);
    expect(html).toContain("<title>target 1.2 Ω</title>");
  });

  it("lists every finding with an anchor, and every in-page link lands", () => {
    const ids = new Set([...html.matchAll(/ id="([^"]+)"/g)].map((m) => m[1]));
    const findings = [...html.matchAll(/<li id="(d\d+-f\d+)" class="finding/g)].map((m) => m[1]);
    expect(findings).toHaveLength(4);
    for (const m of html.matchAll(/href="#([^"]+)"/g)) expect(ids.has(m[1])).toBe(true);
    // The parts index links Q2 to its finding, and the operating-point table links Q2 to the index.
    expect(html).toMatch(/<tr id="d2-p\d+"><td class="mono">Q2<\/td><td><a href="#d2-f\d+">cascode-base<\/a><\/td><\/tr>/);
    expect(html).toMatch(/<td class="mono"><a href="#d2-p\d+">Q2<\/a><\/td><td>npn<\/td><td>active<\/td>/);
  });

  it("carries the dark-scheme and print styles", () => {
    expect(html).toContain("@media (prefers-color-scheme: dark)");
    expect(html).toContain("@media print");
  });
});

describe("logLogPlotSvg", () => {
  const svg = logLogPlotSvg({
    title: "demo", xUnit: "Hz", yUnit: "Ω",
    curves: [{ points: [[1e6, 1], [1e7, 0.05], [3e7, Infinity], [5e7, 2]], label: "demo <curve>" }],
    levels: [{ y: 0.5, label: "target" }],
    band: { low: 1e5, high: 1e8 },
  });

  it("maps points on log scales (x: 1e5…1e8 over 460 px from 64; y: 0.01…10 over 228 px)", () => {
    // x(1e6) = 64 + 460·(6−5)/3 = 217.3; y(1) = 28 + 228 − 228·(0−(−2))/3 = 104
    expect(svg).toContain('d="M217.3 104');
    // The infinite point breaks the line: a new M starts at 5e7.
    const x = 64 + (460 * (Math.log10(5e7) - 5)) / 3;
    const y = 28 + 228 - (228 * (Math.log10(2) + 2)) / 3;
    expect(svg).toContain(`M${Math.round(x * 10) / 10} ${Math.round(y * 10) / 10}`);
  });

  it("labels the decades with SI prefixes", () => {
    for (const label of ["100 kHz", "1 MHz", "10 MHz", "100 MHz", "10 mΩ", "1 Ω", "10 Ω"]) {
      expect(svg).toContain(`>${label}</text>`);
    }
    expect(svg).toContain("<title>demo &lt;curve&gt;</title>");
    expect(wellFormedProblems(svg)).toEqual([]);
  });

  it("survives a curve with nothing to draw", () => {
    const empty = logLogPlotSvg({ title: "empty", xUnit: "Hz", yUnit: "Ω", curves: [{ points: [[0, NaN]], label: "none" }] });
    expect(wellFormedProblems(empty)).toEqual([]);
    expect(empty).not.toContain("<path");
  });
});
