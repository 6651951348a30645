// A log-log line plot as a self-contained SVG fragment (no scripts, no external references), for
// |Z| versus frequency. Colours come from CSS classes the host page defines, so the same markup
// follows light, dark and print styles. Output is well-formed XML.
import { si } from "./format.js";
import { escapeHtml } from "./sanitize.js";

export interface PlotCurve {
  /** [x, y] in SI units; points with a non-positive or non-finite coordinate break the line. */
  points: readonly (readonly [number, number])[];
  label: string;
  className?: string;
}

export interface PlotLevel {
  y: number;
  label: string;
  className?: string;
}

export interface LogLogPlot {
  title: string;
  xUnit: string;
  yUnit: string;
  /** Axis names; default "frequency" and "|Z|". */
  xLabel?: string;
  yLabel?: string;
  curves: PlotCurve[];
  /** Horizontal reference lines (targets, limits). */
  levels?: PlotLevel[];
  /** A shaded x-range (the band of operation). */
  band?: { low: number; high: number };
  width?: number;
  height?: number;
}

const MAX_DECADES = 24;

function usable(v: number): boolean {
  return Number.isFinite(v) && v > 0;
}

/** Whole decades covering every value, at least one decade wide, at most MAX_DECADES. */
function decadeRange(values: number[]): [number, number] {
  const logs = values.filter(usable).map(Math.log10);
  if (logs.length === 0) return [0, 1];
  let lo = Math.floor(Math.min(...logs));
  let hi = Math.ceil(Math.max(...logs));
  if (hi <= lo) hi = lo + 1;
  if (hi - lo > MAX_DECADES) lo = hi - MAX_DECADES;
  return [lo, hi];
}

const r1 = (v: number): string => (Math.round(v * 10) / 10).toString();

export function logLogPlotSvg(plot: LogLogPlot): string {
  const width = plot.width ?? 560;
  const height = plot.height ?? 300;
  // Room on the right for the last decade's label, centred on the frame's edge.
  const m = { left: 64, right: 36, top: 28, bottom: 44 };
  const pw = width - m.left - m.right;
  const ph = height - m.top - m.bottom;

  const xs = plot.curves.flatMap((c) => c.points.map((p) => p[0]));
  const ys = plot.curves.flatMap((c) => c.points.map((p) => p[1]));
  if (plot.band) xs.push(plot.band.low, plot.band.high);
  for (const l of plot.levels ?? []) ys.push(l.y);
  const [x0, x1] = decadeRange(xs);
  const [y0, y1] = decadeRange(ys);
  const sx = (x: number): number => m.left + ((Math.log10(x) - x0) / (x1 - x0)) * pw;
  const sy = (y: number): number => m.top + ph - ((Math.log10(y) - y0) / (y1 - y0)) * ph;
  const inX = (x: number): boolean => usable(x) && Math.log10(x) >= x0 && Math.log10(x) <= x1;
  const inY = (y: number): boolean => usable(y) && Math.log10(y) >= y0 && Math.log10(y) <= y1;

  const out: string[] = [];
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" class="plot" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${escapeHtml(plot.title)}">`);
  out.push(`<title>${escapeHtml(plot.title)}</title>`);

  if (plot.band && usable(plot.band.low) && usable(plot.band.high)) {
    const a = sx(plot.band.low);
    const b = sx(plot.band.high);
    out.push(`<rect class="plot-band" x="${r1(a)}" y="${m.top}" width="${r1(Math.max(0, b - a))}" height="${ph}"><title>band ${escapeHtml(si(plot.band.low, plot.xUnit))} – ${escapeHtml(si(plot.band.high, plot.xUnit))}</title></rect>`);
  }

  // Grid: decades solid, 2…9 faint.
  for (let k = x0; k <= x1; k++) {
    const x = sx(10 ** k);
    out.push(`<line class="plot-grid" x1="${r1(x)}" y1="${m.top}" x2="${r1(x)}" y2="${m.top + ph}" />`);
    out.push(`<text class="plot-tick" x="${r1(x)}" y="${m.top + ph + 16}" text-anchor="middle">${escapeHtml(si(10 ** k, plot.xUnit))}</text>`);
    if (k < x1) {
      for (let n = 2; n <= 9; n++) {
        const xm = sx(n * 10 ** k);
        out.push(`<line class="plot-grid-minor" x1="${r1(xm)}" y1="${m.top}" x2="${r1(xm)}" y2="${m.top + ph}" />`);
      }
    }
  }
  for (let k = y0; k <= y1; k++) {
    const y = sy(10 ** k);
    out.push(`<line class="plot-grid" x1="${m.left}" y1="${r1(y)}" x2="${m.left + pw}" y2="${r1(y)}" />`);
    out.push(`<text class="plot-tick" x="${m.left - 6}" y="${r1(y + 4)}" text-anchor="end">${escapeHtml(si(10 ** k, plot.yUnit))}</text>`);
    if (k < y1) {
      for (let n = 2; n <= 9; n++) {
        const ym = sy(n * 10 ** k);
        out.push(`<line class="plot-grid-minor" x1="${m.left}" y1="${r1(ym)}" x2="${m.left + pw}" y2="${r1(ym)}" />`);
      }
    }
  }
  out.push(`<rect class="plot-frame" x="${m.left}" y="${m.top}" width="${pw}" height="${ph}" />`);

  for (const level of plot.levels ?? []) {
    if (!inY(level.y)) continue;
    const y = r1(sy(level.y));
    const cls = `plot-level${level.className ? ` ${escapeHtml(level.className)}` : ""}`;
    out.push(`<line class="${cls}" x1="${m.left}" y1="${y}" x2="${m.left + pw}" y2="${y}"><title>${escapeHtml(level.label)}</title></line>`);
    out.push(`<text class="plot-level-label" x="${m.left + pw - 4}" y="${r1(sy(level.y) - 4)}" text-anchor="end">${escapeHtml(level.label)}</text>`);
  }

  for (const curve of plot.curves) {
    const segments: string[] = [];
    let pen = false;
    for (const [x, y] of curve.points) {
      if (!inX(x) || !inY(y)) {
        pen = false;
        continue;
      }
      segments.push(`${pen ? "L" : "M"}${r1(sx(x))} ${r1(sy(y))}`);
      pen = true;
    }
    if (segments.length === 0) continue;
    const cls = `plot-curve${curve.className ? ` ${escapeHtml(curve.className)}` : ""}`;
    out.push(`<path class="${cls}" d="${segments.join(" ")}"><title>${escapeHtml(curve.label)}</title></path>`);
  }

  out.push(`<text class="plot-axis" x="${m.left + pw / 2}" y="${height - 6}" text-anchor="middle">${escapeHtml(plot.xLabel ?? "frequency")}</text>`);
  out.push(`<text class="plot-axis" x="12" y="${m.top + ph / 2}" text-anchor="middle" transform="rotate(-90 12 ${m.top + ph / 2})">${escapeHtml(plot.yLabel ?? "|Z|")}</text>`);
  out.push(`<text class="plot-title" x="${m.left}" y="18">${escapeHtml(plot.title)}</text>`);
  out.push("</svg>");
  return out.join("\n");
}
