// Closed-form reactance relations the rules quote (reference-data §2.1 and §3). They live with the
// solver so no rule re-derives circuit math.

/** Capacitance whose reactance is `ohms` at `hertz`: C = 1/(2πfX). */
export function faradsForReactance(ohms: number, hertz: number): number {
  return 1 / (2 * Math.PI * hertz * ohms);
}

/** Capacitance that self-resonates at `hertz` with series inductance `esl`: C = 1/((2πf)²·ESL). */
export function faradsForSelfResonance(hertz: number, esl: number): number {
  return 1 / ((2 * Math.PI * hertz) ** 2 * esl);
}

/** First-order high-pass corner of C working into R: f = 1/(2πRC). */
export function highPassCorner(ohms: number, farads: number): number {
  return 1 / (2 * Math.PI * ohms * farads);
}

/** Loss of a first-order high-pass at `hertz` below or above its corner, in dB (positive = lost). */
export function highPassLossDb(hertz: number, corner: number): number {
  return 10 * Math.log10(1 + (corner / hertz) ** 2);
}
