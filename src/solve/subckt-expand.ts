// Expands a subcircuit instance into solver elements, as SPICE flattens `X` lines: the block's pins
// become the nodes it is connected to, its other nodes and its element names get the instance's
// prefix (`Q1:MID`, `Q1:M1`; nested `Q1:XDIE:B`), node 0 (and GND, as ngspice reads it) stays global
// ground. Models are looked up in the block first, then at the top level of the same library.
// Bounded: nesting deeper than MAX_SUBCKT_DEPTH or more than MAX_SUBCKT_ELEMENTS elements is a problem,
// so a recursive or runaway library cannot hang the build.
import type { Element, ModelCard, ModelType } from "./netlist.js";
import { findSubcircuit, type SubcircuitDef, type SubcktDevice, type SubcktStatement } from "./subckt-syntax.js";

export const MAX_SUBCKT_DEPTH = 8;
export const MAX_SUBCKT_ELEMENTS = 5000;
/** A zero-ohm resistor becomes 1 mΩ (as from-circuit does for links) so the matrix stays regular. */
const ZERO_OHMS_AS = 1e-3;

export interface SubcktLibrary {
  subcircuits: readonly SubcircuitDef[];
  /** Cards at the top level of the library text. */
  models: readonly ModelCard[];
}

export type Expansion =
  | { ok: true; elements: Element[]; notes: string[] }
  | { ok: false; problem: string };

const MODEL_TYPES: Record<SubcktDevice["kind"], readonly ModelType[]> = {
  D: ["D"], Q: ["NPN", "PNP"], J: ["NJF", "PJF"], M: ["NMOS", "PMOS"],
};

class Expander {
  readonly elements: Element[] = [];
  readonly notes: string[] = [];

  constructor(private readonly library: SubcktLibrary) {}

  /** Expands `def` with its pins on `pinNodes`; a string is the problem that stopped it. */
  expand(def: SubcircuitDef, pinNodes: ReadonlyMap<string, string>, prefix: string, stack: readonly string[]): string | undefined {
    const where = `${def.source}, subcircuit ${def.name}`;
    const first = def.problems[0];
    if (first) return `${def.source}, line ${first.line}: ${first.message}`;
    if (stack.length >= MAX_SUBCKT_DEPTH) return `${where}: subcircuits nested deeper than ${MAX_SUBCKT_DEPTH} levels (${[...stack, def.name].join(" → ")})`;
    if (stack.some((n) => n.toUpperCase() === def.name.toUpperCase())) return `${where} contains itself (${[...stack, def.name].join(" → ")})`;
    for (const ig of def.ignored) this.notes.push(`${def.source}, line ${ig.line}: ${ig.message}`);
    const node = (n: string): string => {
      if (n === "0" || n === "GND") return "0";
      return pinNodes.get(n) ?? `${prefix}:${n}`;
    };
    for (const st of def.statements) {
      if (this.elements.length >= MAX_SUBCKT_ELEMENTS) return `${where}: more than ${MAX_SUBCKT_ELEMENTS} elements once expanded`;
      const problem = this.add(st, def, node, prefix, [...stack, def.name]);
      if (problem !== undefined) return problem;
    }
    return undefined;
  }

  private model(st: SubcktDevice, def: SubcircuitDef): ModelCard | string {
    const want = st.model.toUpperCase();
    const card = def.models.find((m) => m.name.toUpperCase() === want) ?? this.library.models.find((m) => m.name.toUpperCase() === want);
    if (!card) return `${def.source}, line ${st.line}: ${st.name} uses model ${st.model}, which is neither in subcircuit ${def.name} nor at the top level of the library (or could not be read: see the notes on that library)`;
    const fits = MODEL_TYPES[st.kind];
    if (!fits.includes(card.type)) return `${def.source}, line ${st.line}: ${st.name} is a ${st.kind} element but model ${card.name} is type ${card.type}`;
    return card;
  }

  private add(st: SubcktStatement, def: SubcircuitDef, node: (n: string) => string, prefix: string, stack: string[]): string | undefined {
    const name = `${prefix}:${st.name}`;
    switch (st.kind) {
      case "R": {
        const [a, b] = st.nodes;
        let ohms = st.value;
        if (ohms === 0) {
          ohms = ZERO_OHMS_AS;
          this.notes.push(`${def.source}, line ${st.line}: ${st.name} of 0 Ω simulated as 1 mΩ`);
        }
        this.elements.push({ kind: "R", name, a: node(a), b: node(b), ohms });
        return undefined;
      }
      case "C":
        this.elements.push({ kind: "C", name, a: node(st.nodes[0]), b: node(st.nodes[1]), farads: st.value });
        return undefined;
      case "L":
        this.elements.push({ kind: "L", name, a: node(st.nodes[0]), b: node(st.nodes[1]), henries: st.value });
        return undefined;
      case "V": case "I": {
        const ac = st.ac !== undefined ? { ac: st.ac } : {};
        this.elements.push({ kind: st.kind, name, pos: node(st.nodes[0]), neg: node(st.nodes[1]), dc: st.dc, ...ac });
        return undefined;
      }
      case "D": case "Q": case "J": case "M": {
        const model = this.model(st, def);
        if (typeof model === "string") return model;
        const n = st.nodes.map(node);
        const at = (i: number): string => n[i] ?? "0";
        const area = st.area !== undefined ? { area: st.area } : {};
        if (st.kind === "D") this.elements.push({ kind: "D", name, anode: at(0), cathode: at(1), model, ...area });
        else if (st.kind === "Q") this.elements.push({ kind: "Q", name, c: at(0), b: at(1), e: at(2), model, ...area });
        else if (st.kind === "J") this.elements.push({ kind: "J", name, d: at(0), g: at(1), s: at(2), model, ...area });
        else this.elements.push({ kind: "M", name, d: at(0), g: at(1), s: at(2), b: at(3), model, ...(st.w !== undefined ? { w: st.w } : {}), ...(st.l !== undefined ? { l: st.l } : {}) });
        return undefined;
      }
      case "X": {
        const inner = findSubcircuit(this.library.subcircuits, st.subckt);
        if (!inner) return `${def.source}, line ${st.line}: ${st.name} calls subcircuit ${st.subckt}, which is not in the library`;
        if (inner.pins.length !== st.nodes.length) {
          return `${def.source}, line ${st.line}: ${st.name} connects ${st.nodes.length} nodes but subcircuit ${inner.name} has ${inner.pins.length} pins (${inner.pins.join(" ")})`;
        }
        const pins = new Map(inner.pins.map((p, i) => [p, node(st.nodes[i] ?? "0")]));
        return this.expand(inner, pins, name, stack);
      }
    }
  }
}

/** Elements of one instance of `def`: `pinNodes` maps each of its pins (upper-case) to a node of the
 * enclosing circuit; `prefix` (the part's reference) names its internal nodes and elements. */
export function expandSubcircuit(def: SubcircuitDef, pinNodes: ReadonlyMap<string, string>, prefix: string, library: SubcktLibrary): Expansion {
  const missing = def.pins.filter((p) => !pinNodes.has(p));
  if (missing.length > 0) return { ok: false, problem: `subcircuit ${def.name} pin${missing.length > 1 ? "s" : ""} ${missing.join(", ")} not connected to any pin of the symbol` };
  const ex = new Expander(library);
  const problem = ex.expand(def, pinNodes, prefix, []);
  return problem === undefined ? { ok: true, elements: ex.elements, notes: [...new Set(ex.notes)] } : { ok: false, problem };
}
