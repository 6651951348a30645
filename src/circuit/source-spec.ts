// Independent-source specifications as written in a Value or Spice_Model field (`DC 10`, `dc 2.345`,
// `AC 1`, `sin(0 1 1k)`, `PULSE(0 5 1u)`) and KiCad 7+ `Sim.Params` / `Sim.Pins` strings.
// SPICE text: numbers follow SPICE rules (case-insensitive, `m` = milli, `meg` = mega).
import { parseSpiceNumber } from "./spice-number.js";

export interface SourceSpec {
  /** The DC value; for a waveform without an explicit DC term, its value at time zero (what a SPICE
   * operating point uses). */
  dc?: number;
  ac?: number;
  /** Phase of the AC term in degrees. */
  acPhase?: number;
  /** Lower-case waveform name when one is given: "sin", "pulse", "pwl", "exp", "sffm", "am". */
  waveform?: string;
}

const WAVEFORMS = new Set(["sin", "sine", "pulse", "pwl", "exp", "sffm", "am"]);

/** Splits on blanks and commas outside parentheses; a parenthesised group stays with its name. */
function tokens(text: string): string[] {
  const out: string[] = [];
  let cur = "";
  let depth = 0;
  for (const ch of text) {
    if (ch === "(") depth++;
    if (ch === ")") depth = Math.max(0, depth - 1);
    if (depth === 0 && (ch === " " || ch === "\t" || ch === ",")) {
      if (cur !== "") out.push(cur);
      cur = "";
      continue;
    }
    cur += ch;
  }
  if (cur !== "") out.push(cur);
  return out;
}

/** Reads `DC 10`, `10`, `dc 1 ac 1 0`, `AC 1`, `sin(0 1 1k)`. */
export function parseSourceSpec(text: string): SourceSpec | { error: string } {
  const toks = tokens(text.trim());
  if (toks.length === 0) return { error: "empty source specification" };
  const spec: SourceSpec = {};
  for (let i = 0; i < toks.length; i++) {
    const tok = toks[i] ?? "";
    const lower = tok.toLowerCase();
    const fn = /^([a-z]+)\s*\((.*)\)$/s.exec(lower);
    if (fn && WAVEFORMS.has(fn[1] ?? "")) {
      const name = fn[1] === "sine" ? "sin" : (fn[1] ?? "");
      spec.waveform = name;
      const args = (fn[2] ?? "").split(/[\s,]+/).filter((a) => a !== "").map(parseSpiceNumber);
      if (args.some((a) => a === undefined)) return { error: `cannot read the arguments of '${tok}'` };
      // Value at t = 0: offset for sin/sffm/am, initial value for pulse/exp, first point's value for pwl.
      const t0 = name === "pwl" ? args[1] : name === "am" ? args[2] : args[0];
      if (spec.dc === undefined && t0 !== undefined) spec.dc = t0;
      continue;
    }
    if (lower === "dc" || lower === "ac") {
      const v = parseSpiceNumber(toks[i + 1] ?? "");
      if (v === undefined) return { error: `expected a number after '${tok}'` };
      i++;
      if (lower === "dc") spec.dc = v;
      else {
        spec.ac = v;
        const ph = parseSpiceNumber(toks[i + 1] ?? "");
        if (ph !== undefined) {
          spec.acPhase = ph;
          i++;
        }
      }
      continue;
    }
    const v = parseSpiceNumber(tok);
    if (v !== undefined && i === 0) {
      spec.dc = v;
      continue;
    }
    return { error: `unexpected '${tok}' in a source specification` };
  }
  return spec;
}

/** `dc=1 ac=1`, `r=10k`, `bf="200" is=1e-14` → lower-case keys, raw value strings. */
export function parseSimParams(text: string): Record<string, string> {
  const out: Record<string, string> = {};
  const re = /([A-Za-z_][\w.]*)\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s"']+))/g;
  for (const m of text.matchAll(re)) {
    const key = (m[1] ?? "").toLowerCase();
    out[key] = m[2] ?? m[3] ?? m[4] ?? "";
  }
  return out;
}

/** `1=K 2=A` → { "1": "K", "2": "A" } (symbol pin number → model pin name). */
export function parseSimPins(text: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const pair of text.trim().split(/\s+/)) {
    const m = /^([^=]+)=(.+)$/.exec(pair);
    if (m) out[m[1] ?? ""] = m[2] ?? "";
  }
  return out;
}
