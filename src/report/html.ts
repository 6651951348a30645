// A self-contained HTML report: no network, no scripts, CSS inline; readable on screen in light
// and dark schemes and on paper. Per rail a log-log |Z| plot against its target with the band
// shaded, per cascode base its |Z| against the limit, per design the operating points, and every
// finding with an anchor that the part index links to. Every piece of user text is escaped.
import type { Finding } from "../engine/types.js";
import type { DesignReport, LintResult, RunProblem } from "../engine/result.js";
import { compareByImportance, compareText, countBySeverity } from "../engine/result.js";
import { bandText, countsText, plural, si } from "./format.js";
import { escapeHtml as h } from "./sanitize.js";
import { logLogPlotSvg } from "./svg-plot.js";
import type { PathBase } from "./paths.js";
import { displayPath } from "./paths.js";

export interface HtmlOptions extends PathBase {
  title?: string;
}

const STYLE = `
:root { --fg: #1b1f24; --bg: #ffffff; --muted: #59636e; --line: #d1d9e0; --grid: #e6eaef;
  --error: #c62828; --warning: #a15c00; --note: #0b5cad; --ok: #1a7f37; --band: rgba(11, 92, 173, 0.10);
  --curve: #0b5cad; --level: #c62828; --card: #f6f8fa; }
@media (prefers-color-scheme: dark) {
  :root { --fg: #e6edf3; --bg: #0d1117; --muted: #9198a1; --line: #3d444d; --grid: #262c33;
    --error: #ff7b72; --warning: #e3b341; --note: #79c0ff; --ok: #56d364; --band: rgba(121, 192, 255, 0.14);
    --curve: #79c0ff; --level: #ff7b72; --card: #151b23; }
}
* { box-sizing: border-box; }
body { margin: 0 auto; max-width: 1100px; padding: 1.5rem; font: 15px/1.45 system-ui, -apple-system, "Segoe UI", sans-serif;
  color: var(--fg); background: var(--bg); }
h1 { font-size: 1.6rem; margin: 0 0 0.3rem; }
h2 { font-size: 1.25rem; margin: 2rem 0 0.6rem; padding-bottom: 0.2rem; border-bottom: 1px solid var(--line); overflow-wrap: anywhere; }
h3 { font-size: 1.05rem; margin: 1.4rem 0 0.5rem; }
code, .mono { font-family: ui-monospace, SFMono-Regular, Menlo, Consolas, monospace; font-size: 0.92em; }
a { color: var(--note); }
.muted { color: var(--muted); }
.summary { color: var(--muted); margin: 0 0 1rem; }
.sev { display: inline-block; min-width: 4.8em; font-weight: 600; }
.sev-error { color: var(--error); } .sev-warning { color: var(--warning); } .sev-note { color: var(--note); }
ol.findings { padding-left: 1.6rem; }
ol.findings li { margin: 0.45rem 0; overflow-wrap: anywhere; }
li.suppressed { opacity: 0.7; }
.where { color: var(--muted); font-size: 0.9em; }
table { border-collapse: collapse; margin: 0.4rem 0 1rem; font-size: 0.92em; }
th, td { border: 1px solid var(--line); padding: 0.25rem 0.55rem; text-align: left; vertical-align: top; overflow-wrap: anywhere; }
th { background: var(--card); }
td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
figure { margin: 0.6rem 0 1.2rem; padding: 0.6rem; background: var(--card); border: 1px solid var(--line); border-radius: 6px;
  break-inside: avoid; page-break-inside: avoid; max-width: 100%; overflow-x: auto; }
figcaption { font-size: 0.9em; margin-top: 0.3rem; overflow-wrap: anywhere; }
.ok { color: var(--ok); font-weight: 600; } .bad { color: var(--error); font-weight: 600; }
svg.plot { max-width: 100%; height: auto; color: var(--fg); }
svg.plot text { fill: currentColor; font: 11px system-ui, sans-serif; }
svg.plot .plot-title { font-weight: 600; font-size: 12px; }
svg.plot .plot-band { fill: var(--band); }
svg.plot .plot-grid { stroke: var(--line); stroke-width: 1; }
svg.plot .plot-grid-minor { stroke: var(--grid); stroke-width: 0.6; }
svg.plot .plot-frame { fill: none; stroke: var(--muted); stroke-width: 1; }
svg.plot .plot-curve { fill: none; stroke: var(--curve); stroke-width: 2; }
svg.plot .plot-level { stroke: var(--level); stroke-width: 1.4; stroke-dasharray: 6 4; }
svg.plot .plot-level-label { fill: var(--level); }
svg.plot .plot-curve.plot-limit { stroke: var(--level); stroke-width: 1.4; stroke-dasharray: 6 4; }
@media print {
  body { max-width: none; padding: 0; font-size: 11pt; color: #000; background: #fff; }
  nav { display: none; }
  a { color: inherit; text-decoration: none; }
  figure { background: none; }
  h2 { break-after: avoid; page-break-after: avoid; }
}
`;

function where(file: string, line: number, column: number, o: HtmlOptions): string {
  const path = displayPath(file, o);
  return line >= 1 ? `${path}:${line}:${Math.max(1, column)}` : path;
}

/** A figure key's unit by its first letter (vce → V, ic → A, gm → S, rpi → Ω): our naming convention. */
export function figureUnit(key: string): string {
  const k = key.toLowerCase();
  if (k.startsWith("g")) return "S";
  if (k.startsWith("v")) return "V";
  if (k.startsWith("i")) return "A";
  if (k.startsWith("r") || k.startsWith("z")) return "Ω";
  if (k.startsWith("p")) return "W";
  if (k.startsWith("f")) return "Hz";
  if (k.startsWith("c")) return "F";
  return "";
}

function figureText(key: string, value: number): string {
  const unit = figureUnit(key);
  return unit ? si(value, unit) : Number.isFinite(value) ? String(Number(value.toPrecision(4))) : "n/a";
}

function problemList(problems: RunProblem[], o: HtmlOptions, heading: string): string[] {
  if (problems.length === 0) return [];
  const out = [`<h3>${h(heading)}</h3>`, `<ul class="problems">`];
  for (const p of problems) out.push(`<li><span class="mono where">${h(where(p.file, p.line, p.column, o))}</span> ${h(p.message)}</li>`);
  out.push("</ul>");
  return out;
}

function findingItem(f: Finding, id: string, o: HtmlOptions): string {
  const parts = f.parts.length > 0 ? ` <strong>${h(f.parts.join(", "))}</strong>` : "";
  const suppressed = f.suppressed ? ` <span class="muted">(suppressed: ${h(f.suppressed.reason)})</span>` : "";
  return `<li id="${id}" class="finding${f.suppressed ? " suppressed" : ""}"><span class="sev sev-${f.severity}">${f.severity}</span> <code>${h(f.rule)}</code>${parts} — ${h(f.message)}${suppressed}<br /><span class="mono where">${h(where(f.file, f.line, f.column, o))}${f.sheetPath ? ` · sheet ${h(f.sheetPath)}` : ""}</span></li>`;
}

function designSection(d: DesignReport, index: number, band: LintResult["band"], o: HtmlOptions): string[] {
  const out: string[] = [`<section id="d${index}">`, `<h2>${h(displayPath(d.file, o))}</h2>`];
  if (d.sheetFiles.length > 1) {
    out.push(`<p class="muted">Sheets: ${d.sheetFiles.map((s) => `<span class="mono">${h(displayPath(s, o))}</span>`).join(", ")}</p>`);
  }
  out.push(...problemList(d.errors, o, "Could not check"));

  // Most important first; suppressed ones last, still listed.
  const findings = [...d.findings].sort((a, b) => Number(Boolean(a.suppressed)) - Number(Boolean(b.suppressed)) || compareByImportance(a, b));
  const idOf = new Map<Finding, string>(findings.map((f, j) => [f, `d${index}-f${j + 1}`]));
  out.push(`<h3>Findings</h3>`);
  if (findings.length === 0) out.push(`<p class="ok">No findings.</p>`);
  else {
    out.push(`<ol class="findings">`);
    for (const f of findings) out.push(findingItem(f, idOf.get(f) ?? "", o));
    out.push("</ol>");
  }

  // Parts → the findings that name them.
  const byPart = new Map<string, Finding[]>();
  for (const f of findings) for (const ref of f.parts) byPart.set(ref, [...(byPart.get(ref) ?? []), f]);
  const refs = [...byPart.keys()].sort(compareText);
  const partAnchor = new Map<string, string>(refs.map((ref, k) => [ref, `d${index}-p${k + 1}`]));
  const findingLinks = (ref: string): string =>
    (byPart.get(ref) ?? []).map((f) => `<a href="#${idOf.get(f) ?? ""}">${h(f.rule)}</a>`).join(", ");
  if (refs.length > 0) {
    out.push(`<h3>Parts with findings</h3>`, `<table><thead><tr><th>part</th><th>findings</th></tr></thead><tbody>`);
    for (const ref of refs) out.push(`<tr id="${partAnchor.get(ref) ?? ""}"><td class="mono">${h(ref)}</td><td>${findingLinks(ref)}</td></tr>`);
    out.push("</tbody></table>");
  }

  if (d.rails.length > 0) {
    out.push(`<h3>Rail impedance</h3>`);
    for (const r of [...d.rails].sort((a, b) => compareText(a.net, b.net))) {
      const svg = logLogPlotSvg({
        title: `${r.net} (${si(r.volts, "V")}): |Z| to ground`,
        xUnit: "Hz", yUnit: "Ω",
        curves: [{ points: r.curve, label: `|Z| of ${r.net}` }],
        levels: [{ y: r.targetOhms, label: `target ${si(r.targetOhms, "Ω")}` }],
        band,
      });
      const verdict = r.worst
        ? r.worst.ohms <= r.targetOhms
          ? `<span class="ok">within target</span>: worst ${h(si(r.worst.ohms, "Ω"))} at ${h(si(r.worst.hertz, "Hz"))}`
          : `<span class="bad">over target</span>: worst ${h(si(r.worst.ohms, "Ω"))} at ${h(si(r.worst.hertz, "Hz"))}`
        : "no figure in band";
      out.push(`<figure class="rail">${svg}<figcaption><strong>${h(r.net)}</strong> — target ${h(si(r.targetOhms, "Ω"))} (${h(r.targetBasis)}); ${verdict}.</figcaption></figure>`);
    }
  }

  if (d.bases.length > 0) {
    out.push(`<h3>Cascode base grounding</h3>`);
    for (const b of [...d.bases].sort((x, y) => compareText(x.ref, y.ref))) {
      const svg = logLogPlotSvg({
        title: `${b.ref} base (${b.net}): |Z| to ground`,
        xUnit: "Hz", yUnit: "Ω",
        curves: [
          { points: b.curve, label: `|Z| of ${b.net}` },
          // The limit varies across the band; draw it as a dashed curve where it is known.
          ...(b.limitCurve && b.limitCurve.length > 1 ? [{ points: b.limitCurve, label: "limit across the band", className: "plot-limit" }] : []),
        ],
        levels: b.limitCurve && b.limitCurve.length > 1 ? [] : [{ y: b.limitOhms, label: `limit ${si(b.limitOhms, "Ω")}` }],
        band,
      });
      const link = partAnchor.has(b.ref) ? ` · <a href="#${partAnchor.get(b.ref) ?? ""}">findings</a>` : "";
      out.push(`<figure class="base">${svg}<figcaption><strong>${h(b.ref)}</strong> on ${h(b.net)} — limit (dashed) down to ${h(si(b.limitOhms, "Ω"))} in band${link}.</figcaption></figure>`);
    }
  }

  if (d.devices.length > 0) {
    const keys = [...new Set(d.devices.flatMap((v) => Object.keys(v.figures)))].sort(compareText);
    out.push(`<h3>Operating point</h3>`, `<table><thead><tr><th>part</th><th>type</th><th>region</th>${keys.map((k) => `<th>${h(k)}</th>`).join("")}</tr></thead><tbody>`);
    for (const v of [...d.devices].sort((a, b) => compareText(a.ref, b.ref))) {
      const ref = partAnchor.has(v.ref) ? `<a href="#${partAnchor.get(v.ref) ?? ""}">${h(v.ref)}</a>` : h(v.ref);
      const cells = keys.map((k) => {
        const value = v.figures[k];
        return `<td class="num">${value === undefined ? "–" : h(figureText(k, value))}</td>`;
      });
      out.push(`<tr><td class="mono">${ref}</td><td>${h(v.type)}</td><td>${h(v.region)}</td>${cells.join("")}</tr>`);
    }
    out.push("</tbody></table>");
  }
  out.push(...problemList(d.notes ?? [], o, "Notes"));
  out.push("</section>");
  return out;
}

export function formatHtml(result: LintResult, options: HtmlOptions): string {
  const title = options.title ?? "loadline report";
  const designs = [...result.designs].sort((a, b) => compareText(a.file, b.file));
  const counts = countBySeverity(result);
  const out: string[] = [
    "<!DOCTYPE html>",
    `<html lang="en">`,
    "<head>",
    `<meta charset="utf-8" />`,
    `<meta name="viewport" content="width=device-width, initial-scale=1" />`,
    `<meta name="color-scheme" content="light dark" />`,
    `<title>${h(title)}</title>`,
    `<style>${STYLE}</style>`,
    "</head>",
    "<body>",
    `<header><h1>${h(title)}</h1>`,
    `<p class="summary">${h(countsText(counts))} in ${h(plural(designs.length, "design"))} · band ${h(bandText(result.band))} · loadline ${h(result.toolVersion)}</p></header>`,
  ];
  out.push(...problemList(result.errors ?? [], options, "Could not run"));
  if (designs.length > 1) {
    out.push(`<nav><ul>`);
    designs.forEach((d, i) => out.push(`<li><a href="#d${i + 1}">${h(displayPath(d.file, options))}</a></li>`));
    out.push(`</ul></nav>`);
  }
  designs.forEach((d, i) => out.push(...designSection(d, i + 1, result.band, options)));
  out.push(
    `<footer><p class="muted">Figures come from loadline's own small-signal model of the schematic, not from measurement. Check them on the bench before relying on them.</p></footer>`,
    "</body>",
    "</html>",
  );
  return `${out.join("\n")}\n`;
}
