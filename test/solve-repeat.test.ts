// Solving the same circuit object again re-uses what the first solve worked out (topology check,
// symbolic analysis, the first factorisation's structure); the answers must not change, even when
// an element was edited in place between the solves. Reference: ngspice's recordings of the
// e-series cascode decks (test/reference/ngspice/eseries_cascode_r2_24k and _r2_27k, made with
// the ngspice version named in each recording), which differ only in R2. Tolerances as in the
// ngspice reference checks: node voltages within 1 mV or 0.5 %, collector currents within 1 %.

import { describe, expect, it } from "vitest";
import { solveOperatingPoint } from "../src/solve/index.js";
import type { OperatingPoint } from "../src/solve/index.js";
import { parseDeck } from "./support/deck.js";
import { loadRecording, opValue, readDeck } from "./support/ngspice.js";

const NODES = ["vcc", "b2", "b1", "c1", "e1", "c2"];

function expectMatchesNgspice(op: OperatingPoint, deck: string): void {
  const rec = loadRecording(deck);
  for (const node of NODES) {
    const ref = opValue(rec, `v(${node})`);
    const ours = op.nodeVoltages[node] ?? NaN;
    const err = Math.abs(ours - ref);
    expect(err <= 1e-3 || err <= 5e-3 * Math.abs(ref), `${deck}: v(${node}) ours ${ours} vs ngspice ${ref}`).toBe(true);
  }
  for (const q of ["q1", "q2"]) {
    const ref = opValue(rec, `i(@${q}[ic])`);
    const dev = op.devices[q];
    const ours = dev?.kind === "bjt" ? dev.ic : NaN;
    expect(Math.abs(ours - ref), `${deck}: ${q} ic ours ${ours} vs ngspice ${ref}`).toBeLessThanOrEqual(1e-2 * Math.abs(ref));
  }
}

describe("solving a circuit object again", () => {
  it("gives the same operating point as the first solve (vs ngspice, eseries_cascode_r2_24k)", () => {
    const { circuit } = parseDeck(readDeck("eseries_cascode_r2_24k"), "eseries_cascode_r2_24k.cir");
    const first = solveOperatingPoint(circuit);
    const again = solveOperatingPoint(circuit);
    expect(again.converged).toBe(true);
    expect(again).toEqual(first);
    expectMatchesNgspice(again, "eseries_cascode_r2_24k");
  });

  it("follows an element edited in place: R2 24k → 27k matches ngspice's 27k deck and a new circuit object", () => {
    const { circuit } = parseDeck(readDeck("eseries_cascode_r2_24k"), "eseries_cascode_r2_24k.cir");
    solveOperatingPoint(circuit);
    const r2 = circuit.elements.find((el) => el.name === "r2");
    if (r2?.kind !== "R") throw new Error("deck has no resistor r2");
    r2.ohms = 27e3;
    const edited = solveOperatingPoint(circuit);
    expectMatchesNgspice(edited, "eseries_cascode_r2_27k");
    const fresh = solveOperatingPoint(parseDeck(readDeck("eseries_cascode_r2_27k"), "eseries_cascode_r2_27k.cir").circuit);
    expect(edited).toEqual(fresh);
  });
});
