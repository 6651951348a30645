// Figures for people, at the edge: one adapter over the shared SI formatter so every reporter writes
// "4.7 kΩ" and "14.2 MHz" the same way, and non-finite figures read as words, not "NaN".
import { formatQuantity } from "../circuit/units.js";
import type { LintResult } from "../engine/result.js";

export function si(value: number, unit: string): string {
  if (Number.isNaN(value)) return "n/a";
  if (value === Infinity) return `∞ ${unit}`;
  if (value === -Infinity) return `−∞ ${unit}`;
  return formatQuantity(value, unit);
}

/** "0.5 MHz – 30 MHz (default band)" */
export function bandText(band: LintResult["band"]): string {
  return `${si(band.low, "Hz")} – ${si(band.high, "Hz")}${band.isDefault ? " (default band)" : ""}`;
}

export function plural(count: number, singular: string, pluralForm = `${singular}s`): string {
  return `${count} ${count === 1 ? singular : pluralForm}`;
}

export function countsText(counts: { error: number; warning: number; note: number; suppressed: number }): string {
  return `${plural(counts.error, "error")}, ${plural(counts.warning, "warning")}, ${plural(counts.note, "note")}, ${counts.suppressed} suppressed`;
}
