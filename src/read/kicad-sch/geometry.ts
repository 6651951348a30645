// Sheet geometry on KiCad's own integer grid: 1 unit = 1e-4 mm (100 nm), the resolution KiCad keeps
// internally. Comparing integers makes "same point" exact, as it is in the editor (KiCad format
// notes §4); floating-point noise in library files disappears at the rounding.

export const GRID_UNITS_PER_MM = 10_000;
/** Largest coordinate magnitude accepted, in grid units (about 3.35 m): far beyond any paper size,
 * and small enough for a point to be packed exactly into one number. */
export const MAX_COORDINATE = 2 ** 25 - 1;

/** Millimetres to grid units, halves away from zero as KiCad rounds. */
export function toGrid(mm: number): number {
  const scaled = mm * GRID_UNITS_PER_MM;
  return scaled < 0 ? -Math.round(-scaled) : Math.round(scaled);
}

export function inRange(v: number): boolean {
  return Number.isFinite(v) && Math.abs(v) <= MAX_COORDINATE;
}

/** One number per point: x * 2^26 + y is exact and unique while |x|, |y| <= MAX_COORDINATE. */
export function pointKey(x: number, y: number): number {
  return x * 67_108_864 + y;
}

export type Mirror = "x" | "y" | undefined;

/**
 * Offset of a library pin from the symbol anchor on the sheet (KiCad format notes §6.3): flip the
 * library Y axis (library Y points up, sheet Y down), rotate counter-clockwise as seen on screen,
 * then mirror (`x` negates Y, `y` negates X). `angle` is 0, 90, 180 or 270.
 */
export function pinOffset(px: number, py: number, angle: number, mirror: Mirror): [number, number] {
  const u = px;
  const v = -py;
  let x: number;
  let y: number;
  switch (angle) {
    case 90: x = v; y = -u; break;
    case 180: x = -u; y = -v; break;
    case 270: x = -v; y = u; break;
    default: x = u; y = v; break;
  }
  if (mirror === "x") y = -y;
  else if (mirror === "y") x = -x;
  // `+ 0` turns -0 into 0 so keys and comparisons never see a negative zero.
  return [x + 0, y + 0];
}

/** Snaps an angle in degrees to 0/90/180/270; `exact` is false when it was not a quarter turn. */
export function quarterTurn(angle: number): { angle: number; exact: boolean } {
  const norm = ((angle % 360) + 360) % 360;
  const snapped = (Math.round(norm / 90) * 90) % 360;
  return { angle: snapped, exact: Math.abs(norm - snapped) < 1e-9 };
}
