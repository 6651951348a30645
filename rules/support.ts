// Small helpers every rule file shares: building a Finding that points at a part's line, writing
// figures for people, and the band phrase that says when a default was used.
import type { Part } from "../src/circuit/types.js";
import type { Finding, FindingData, FixEdit, Severity } from "../src/engine/types.js";
import type { Context } from "../src/engine/context.js";
import { formatQuantity } from "../src/circuit/units.js";

export interface FindingInit {
  /** The part the finding is anchored to (its file and line); the design's root file when absent. */
  at?: Part;
  severity: Severity;
  message: string;
  parts: string[];
  nets: string[];
  data: FindingData;
  fix?: FixEdit;
}

export function finding(ctx: Context, rule: string, init: FindingInit): Finding {
  const origin = init.at?.origin;
  const out: Finding = {
    rule,
    severity: init.severity,
    message: init.message,
    parts: init.parts,
    nets: init.nets,
    file: origin?.file ?? ctx.circuit.file,
    line: origin?.line ?? 0,
    column: origin?.column ?? 0,
    sheetPath: origin?.sheetPath ?? "/",
    data: init.data,
  };
  if (init.fix) out.fix = init.fix;
  return out;
}

/** `si(0.8894, "Ω")` → "0.889 Ω"; `si(52.71e6, "Hz")` → "52.7 MHz". Three significant figures. */
export const si = formatQuantity;

/** "0.5–30 MHz (default band; set `band` in loadline.json)" or "1.8–30 MHz". */
export function bandText(ctx: Context): string {
  const { low, high, isDefault } = ctx.band;
  const range = `${si(low, "Hz")} to ${si(high, "Hz")}`;
  return isDefault ? `${range} (default band; set "band" in loadline.json)` : range;
}

/** Finite positive number option, or the fallback. */
export function numberOption(options: Record<string, unknown>, name: string, fallback: number): number {
  const value = options[name];
  return typeof value === "number" && Number.isFinite(value) ? value : fallback;
}

/** Parts in reference order (R2 before R10). */
export function byRef(a: { ref: string }, b: { ref: string }): number {
  return a.ref.localeCompare(b.ref, "en", { numeric: true });
}
