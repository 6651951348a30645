// IEC 60063 preferred-number series (E3 … E192) and snapping a value to them.
// Source: IEC 60063:2015, Tables 1 (E3–E24, two figures) and 2 (E48–E192, three figures), values as
// compiled in shared/notes/reference-data.md §1.1 (from a published package's source, cross-checked
// against an HTML copy of the tables and the geometric series). The standard itself was not read.
// Nearest is decided on a log scale (ratio), as the series are geometric [CP].

export type ESeriesName = "E3" | "E6" | "E12" | "E24" | "E48" | "E96" | "E192";

const E24 = [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];

/** E192 in hundredths, one decade (note 920, where the rounding formula gives 919). */
const E192_HUNDREDTHS = [
  100, 101, 102, 104, 105, 106, 107, 109, 110, 111, 113, 114, 115, 117, 118, 120, 121, 123, 124, 126, 127, 129,
  130, 132, 133, 135, 137, 138, 140, 142, 143, 145, 147, 149, 150, 152, 154, 156, 158, 160, 162, 164, 165, 167,
  169, 172, 174, 176, 178, 180, 182, 184, 187, 189, 191, 193, 196, 198, 200, 203, 205, 208, 210, 213, 215, 218,
  221, 223, 226, 229, 232, 234, 237, 240, 243, 246, 249, 252, 255, 258, 261, 264, 267, 271, 274, 277, 280, 284,
  287, 291, 294, 298, 301, 305, 309, 312, 316, 320, 324, 328, 332, 336, 340, 344, 348, 352, 357, 361, 365, 370,
  374, 379, 383, 388, 392, 397, 402, 407, 412, 417, 422, 427, 432, 437, 442, 448, 453, 459, 464, 470, 475, 481,
  487, 493, 499, 505, 511, 517, 523, 530, 536, 542, 549, 556, 562, 569, 576, 583, 590, 597, 604, 612, 619, 626,
  634, 642, 649, 657, 665, 673, 681, 690, 698, 706, 715, 723, 732, 741, 750, 759, 768, 777, 787, 796, 806, 816,
  825, 835, 845, 856, 866, 876, 887, 898, 909, 920, 931, 942, 953, 965, 976, 988,
];

/** E96 in hundredths, as tabulated (not derived, so a test can check it equals every 2nd E192). */
const E96_HUNDREDTHS = [
  100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143, 147, 150, 154, 158, 162, 165,
  169, 174, 178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232, 237, 243, 249, 255, 261, 267, 274, 280,
  287, 294, 301, 309, 316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412, 422, 432, 442, 453, 464, 475,
  487, 499, 511, 523, 536, 549, 562, 576, 590, 604, 619, 634, 649, 665, 681, 698, 715, 732, 750, 768, 787, 806,
  825, 845, 866, 887, 909, 931, 953, 976,
];

const E48_HUNDREDTHS = [
  100, 105, 110, 115, 121, 127, 133, 140, 147, 154, 162, 169, 178, 187, 196, 205, 215, 226, 237, 249, 261, 274,
  287, 301, 316, 332, 348, 365, 383, 402, 422, 442, 464, 487, 511, 536, 562, 590, 619, 649, 681, 715, 750, 787,
  825, 866, 909, 953,
];

const fromHundredths = (xs: readonly number[]): readonly number[] => xs.map((x) => Number(`${x}e-2`));

/** One decade of each series, as mantissas in [1, 10). */
export const E_SERIES: Readonly<Record<ESeriesName, readonly number[]>> = {
  E3: [1.0, 2.2, 4.7],
  E6: [1.0, 1.5, 2.2, 3.3, 4.7, 6.8],
  E12: [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2],
  E24,
  E48: fromHundredths(E48_HUNDREDTHS),
  E96: fromHundredths(E96_HUNDREDTHS),
  E192: fromHundredths(E192_HUNDREDTHS),
};

/** Tolerance each series was made for (reference-data §1.3, several tables agree [DOC]); E3 is
 * listed as >20 % (40–50 %, obsolete). E192 also serves 0.25 %, 0.1 % and tighter. */
export const SERIES_TOLERANCE: Readonly<Record<ESeriesName, number>> = {
  E3: 0.4,
  E6: 0.2,
  E12: 0.1,
  E24: 0.05,
  E48: 0.02,
  E96: 0.01,
  E192: 0.005,
};

const FINEST_FIRST: readonly ESeriesName[] = ["E192", "E96", "E48", "E24", "E12", "E6", "E3"];

/** Members of `series` in the decades around `value`, exact decimals (4.7e3 is 4700). */
function candidates(value: number, series: ESeriesName): number[] {
  if (!(value > 0) || !Number.isFinite(value)) {
    throw new RangeError(`E-series lookup needs a positive finite value, got ${value}`);
  }
  const decade = Math.floor(Math.log10(value));
  const out: number[] = [];
  for (let d = decade - 1; d <= decade + 1; d++) {
    for (const m of E_SERIES[series]) out.push(Number(`${m}e${d}`));
  }
  return out;
}

/** True when `value` is a member of `series` in some decade, within a relative tolerance. */
export function isInSeries(value: number, series: ESeriesName, relTol = 1e-9): boolean {
  if (!(value > 0) || !Number.isFinite(value)) return false;
  return candidates(value, series).some((c) => Math.abs(value - c) <= relTol * c);
}

/** The member nearest to `value` by ratio: 319 → 330 (E24), 16 834.2 → 16 900 (E96). */
export function nearestInSeries(value: number, series: ESeriesName): number {
  let best = Number.NaN;
  let bestDistance = Number.POSITIVE_INFINITY;
  for (const c of candidates(value, series)) {
    const distance = Math.abs(Math.log(value / c));
    if (distance < bestDistance) {
      best = c;
      bestDistance = distance;
    }
  }
  return best;
}

/** The members either side of `value`: `below` ≤ value ≤ `above`; both equal `value`'s member when it is
 * one (within `relTol`). 5000 in E24 → 4700 and 5100; 184 in E96 → above 187. */
export function neighbours(value: number, series: ESeriesName, relTol = 1e-9): { below: number; above: number } {
  const cs = candidates(value, series);
  let below = Number.NEGATIVE_INFINITY;
  let above = Number.POSITIVE_INFINITY;
  for (const c of cs) {
    if (c <= value * (1 + relTol) && c > below) below = c;
    if (c >= value * (1 - relTol) && c < above) above = c;
  }
  return { below, above };
}

/** The series made for parts of this tolerance — the coarsest whose own tolerance is no wider than
 * `tol`: 10 % → E12, 5 % → E24, 1 % → E96, 0.1 % → E192 (reference-data §1.3). Tighter parts are also
 * sold in coarser series' values [CP]. */
export function seriesForTolerance(tol: number): ESeriesName {
  const coarsest = [...FINEST_FIRST].reverse();
  for (const name of coarsest) {
    if (tol >= SERIES_TOLERANCE[name] * (1 - 1e-9)) return name;
  }
  return "E192";
}

/** Series names from coarse to fine. */
export const E_SERIES_NAMES: readonly ESeriesName[] = ["E3", "E6", "E12", "E24", "E48", "E96", "E192"];
