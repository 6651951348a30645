// What a solve can re-use from an earlier solve of the same SolverCircuit object: the node
// numbering, the topology diagnosis (which must pass before anything is solved), the DC
// matrix's symbolic analysis (its pattern and fill-reducing order, as the first Newton iteration
// found them) and the structure of the first factorisation — used only where it is checked to be
// exactly what a pivot search would choose again. So a repeat solve gives the same result to the
// last bit, only sooner.
//
// The object counts as the same circuit while its element list holds the same element objects
// with the same names and pins; the values are checked again on every solve. The facts ride on
// the circuit object under a non-enumerable symbol (invisible to equality checks, spreads and
// JSON), so they live exactly as long as the circuit does.

import { diagnoseTopology, type TopologyProblem } from "./diagnose.js";
import { nodeNumbering, valuesUsable, type NodeNumbering } from "./elaborate.js";
import type { FactorStructure, PatternSnapshot } from "./mna.js";
import type { Element, SolverCircuit } from "./netlist.js";

export interface PreparedCircuit {
  numbering: NodeNumbering;
  /** diagnoseTopology's answer; a solve stops here when it is not empty. */
  problems: TopologyProblem[];
  /** The DC system's pattern after its first analysis, once a solve has made one. */
  dcPattern: PatternSnapshot | null;
  /** The structure of that solve's first factorisation (over dcPattern). */
  dcFactors: FactorStructure | null;
}

interface Entry {
  prepared: PreparedCircuit;
  elements: readonly Element[];
  /** Every element's name, compared by identity (the pins are in the numbering). */
  names: readonly string[];
}

const PREPARED = Symbol("loadline prepared circuit");

interface CarriesPrepared {
  [PREPARED]?: Entry;
}

function stillSame(entry: Entry, elements: readonly Element[]): boolean {
  const known = entry.elements, names = entry.names, pins = entry.prepared.numbering.pinNames;
  if (known.length !== elements.length) return false;
  let k = 0;
  for (let i = 0; i < elements.length; i++) {
    const el = elements[i] as Element;
    if (el !== known[i] || el.name !== names[i]) return false;
    // The pins in pinNode order, written out per kind: this runs on every solve.
    switch (el.kind) {
      case "R": case "C": case "L": if (el.a !== pins[k] || el.b !== pins[k + 1]) return false; k += 2; break;
      case "V": case "I": if (el.pos !== pins[k] || el.neg !== pins[k + 1]) return false; k += 2; break;
      case "D": if (el.anode !== pins[k] || el.cathode !== pins[k + 1]) return false; k += 2; break;
      case "Q": if (el.c !== pins[k] || el.b !== pins[k + 1] || el.e !== pins[k + 2]) return false; k += 3; break;
      case "J": if (el.d !== pins[k] || el.g !== pins[k + 1] || el.s !== pins[k + 2]) return false; k += 3; break;
      case "M": if (el.d !== pins[k] || el.g !== pins[k + 1] || el.s !== pins[k + 2] || el.b !== pins[k + 3]) return false; k += 4; break;
    }
  }
  return true;
}

/** The circuit's prepared facts, from the circuit object when it still describes the same circuit. */
export function preparedCircuit(circuit: SolverCircuit): PreparedCircuit {
  const holder = circuit as SolverCircuit & CarriesPrepared;
  const entry = holder[PREPARED];
  if (entry && stillSame(entry, circuit.elements)) {
    // Names and pins passed before; only a value edited in place can fail now.
    if (entry.prepared.problems.length === 0 && valuesUsable(circuit)) return entry.prepared;
    return { numbering: entry.prepared.numbering, problems: diagnoseTopology(circuit, entry.prepared.numbering), dcPattern: null, dcFactors: null };
  }
  const numbering = nodeNumbering(circuit);
  const prepared: PreparedCircuit = { numbering, problems: diagnoseTopology(circuit, numbering), dcPattern: null, dcFactors: null };
  if (Object.isExtensible(circuit)) {
    const fresh: Entry = { prepared, elements: circuit.elements.slice(), names: circuit.elements.map((el) => el.name) };
    if (entry) holder[PREPARED] = fresh;
    else Object.defineProperty(circuit, PREPARED, { value: fresh, writable: true });
  }
  return prepared;
}
