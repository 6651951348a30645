// Numbers as SPICE writes them: case-insensitive scale letters, anything after the scale ignored.
// Used for model cards, Sim.Params, Spice_Model source specs: text written for a simulator, where
// `m` is milli and `meg` is mega whatever the case (unlike a schematic Value field).

const SCALES: readonly (readonly [string, number])[] = [
  // Order matters: `meg` and `mil` before `m`.
  ["meg", 1e6],
  ["mil", 25.4e-6],
  ["t", 1e12],
  ["g", 1e9],
  ["k", 1e3],
  ["m", 1e-3],
  ["u", 1e-6],
  ["µ", 1e-6],
  ["μ", 1e-6],
  ["n", 1e-9],
  ["p", 1e-12],
  ["f", 1e-15],
];

const MANTISSA = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?/i;

/** `6.734f` → 6.734e-15, `1meg` → 1e6, `10mil` → 254e-6, `4.7kohm` → 4700, `1e-15`. Returns undefined
 * when the text does not start with a number. */
export function parseSpiceNumber(text: string): number | undefined {
  const t = text.trim();
  const m = MANTISSA.exec(t);
  if (!m) return undefined;
  const base = Number(m[0]);
  if (!Number.isFinite(base)) return undefined;
  const rest = t.slice(m[0].length).toLowerCase();
  if (rest === "") return base;
  // A trailing unit must be letters only; `1k5` or `3,3` is not SPICE syntax.
  if (!/^[a-zµμΩ]+$/i.test(rest)) return undefined;
  for (const [letter, scale] of SCALES) {
    if (rest.startsWith(letter)) return base * scale;
  }
  return base;
}
