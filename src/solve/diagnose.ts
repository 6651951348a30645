// Topology checks run before any matrix is built, so a singular matrix is explained in the
// trade's words instead of "pivot 17 is zero": nodes with no DC path to ground, and loops made
// only of voltage sources and/or ideal inductors (no defined DC current).

import { nodeNumbering, validateElements, type NodeNumbering } from "./elaborate.js";
import type { Element, SolverCircuit } from "./netlist.js";

export type TopologyProblemKind = "no-dc-path" | "source-loop" | "invalid-value";

export interface TopologyProblem {
  kind: TopologyProblemKind;
  nodes: string[];
  elements: string[];
  message: string;
}

class DisjointSets {
  private readonly parent = new Map<string, string>();
  find(x: string): string {
    let root = x;
    for (;;) {
      const up = this.parent.get(root);
      if (up === undefined) { this.parent.set(root, root); break; }
      if (up === root) break;
      root = up;
    }
    // Path compression.
    for (let node = x; node !== root; ) {
      const next = this.parent.get(node) ?? root;
      this.parent.set(node, root);
      node = next;
    }
    return root;
  }
  union(a: string, b: string): boolean {
    const ra = this.find(a), rb = this.find(b);
    if (ra === rb) return false;
    this.parent.set(ra, rb);
    return true;
  }
}

function list(names: string[]): string {
  if (names.length <= 1) return names.join("");
  return `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`;
}

function plural(word: string, count: number): string {
  return count === 1 ? word : `${word}s`;
}

/** "capacitors C3, C4 and current source I1" — what touches a floating group without conducting. */
function describeBlockers(group: Set<string>, elements: readonly Element[]): { phrase: string; names: string[] } {
  const caps: string[] = [], currents: string[] = [], gates: string[] = [];
  for (const el of elements) {
    if (el.kind === "C" && (group.has(el.a) || group.has(el.b))) caps.push(el.name);
    else if (el.kind === "I" && (group.has(el.pos) || group.has(el.neg))) currents.push(el.name);
    else if (el.kind === "M" && group.has(el.g) && !group.has(el.d)) gates.push(el.name);
  }
  const parts: string[] = [];
  if (caps.length) parts.push(`${plural("capacitor", caps.length)} ${caps.join(", ")}`);
  if (currents.length) parts.push(`${plural("current source", currents.length)} ${currents.join(", ")}`);
  if (gates.length) parts.push(`the insulated ${plural("gate", gates.length)} of ${gates.join(", ")}`);
  return { phrase: list(parts), names: [...caps, ...currents, ...gates] };
}

/** Union–find over node numbers; ground is the extra element `size`. */
function unionFind(size: number): { find: (x: number) => number; union: (a: number, b: number) => void } {
  const parent = new Int32Array(size + 1);
  for (let i = 0; i <= size; i++) parent[i] = i;
  const find = (x: number): number => {
    let root = x;
    while ((parent[root] as number) !== root) root = parent[root] as number;
    for (let node = x; node !== root; ) {
      const next = parent[node] as number;
      parent[node] = root;
      node = next;
    }
    return root;
  };
  return { find, union: (a, b) => { const ra = find(a), rb = find(b); if (ra !== rb) parent[ra] = rb; } };
}

function floatingNodeProblems(circuit: SolverCircuit, numbering: NodeNumbering): TopologyProblem[] {
  const { names, index } = numbering;
  const ground = names.length;
  const id = (name: string): number => (name === "0" ? ground : (index.get(name) as number));
  const sets = unionFind(names.length);
  for (const el of circuit.elements) {
    // Pairs of nodes an element connects with a DC current path (junctions included, gates not).
    switch (el.kind) {
      case "R": case "L": sets.union(id(el.a), id(el.b)); break;
      case "V": sets.union(id(el.pos), id(el.neg)); break;
      case "C": case "I": break;
      case "D": sets.union(id(el.anode), id(el.cathode)); break;
      case "Q": sets.union(id(el.b), id(el.e)); sets.union(id(el.b), id(el.c)); break;
      case "J": sets.union(id(el.g), id(el.s)); sets.union(id(el.g), id(el.d)); sets.union(id(el.d), id(el.s)); break;
      case "M": sets.union(id(el.d), id(el.s)); sets.union(id(el.d), id(el.b)); sets.union(id(el.s), id(el.b)); break;
    }
  }
  const groundRoot = sets.find(ground);
  let groups: Map<number, Set<string>> | null = null;
  for (let i = 0; i < names.length; i++) {
    const root = sets.find(i);
    if (root === groundRoot) continue;
    groups ??= new Map();
    let group = groups.get(root);
    if (!group) groups.set(root, (group = new Set<string>()));
    group.add(names[i] as string);
  }
  if (!groups) return [];
  const problems: TopologyProblem[] = [];
  for (const group of groups.values()) {
    const nodes = [...group].sort();
    const { phrase, names: blockers } = describeBlockers(group, circuit.elements);
    const subject = nodes.length === 1 ? `node ${nodes[0]} has` : `nodes ${nodes.join(", ")} have`;
    let why: string;
    if (!phrase) why = nodes.length === 1 ? "nothing else connects to it" : "nothing connects them to the rest of the circuit";
    else if (nodes.length === 1) why = `only ${phrase} touch it`;
    else why = `they reach the rest of the circuit only through ${phrase}`;
    const fix = "add a resistor to ground or to a bias node so its DC voltage is defined";
    problems.push({
      kind: "no-dc-path",
      nodes,
      elements: blockers,
      message: `${subject} no DC path to ground (${why}); ${fix}`,
    });
  }
  return problems;
}

/** An ideal voltage-type branch at DC: a source without series resistance or a lossless inductor. */
function isIdealVoltageBranch(el: Element): el is Extract<Element, { kind: "V" | "L" }> {
  if (el.kind === "V") return !(el.series && el.series > 0);
  if (el.kind === "L") return !(el.series && el.series > 0);
  return false;
}

function describeLoopMember(el: Element): string {
  return el.kind === "V" ? `voltage source ${el.name}` : `inductor ${el.name}`;
}

function sourceLoopProblems(circuit: SolverCircuit): TopologyProblem[] {
  const sets = new DisjointSets();
  // Spanning forest of the ideal branches so a closing branch can name the loop it closes.
  const forest = new Map<string, Array<{ to: string; el: Element }>>();
  const addEdge = (a: string, b: string, el: Element): void => {
    if (!forest.has(a)) forest.set(a, []);
    if (!forest.has(b)) forest.set(b, []);
    forest.get(a)?.push({ to: b, el });
    forest.get(b)?.push({ to: a, el });
  };
  const pathBetween = (from: string, to: string): Element[] => {
    const back = new Map<string, { prev: string; el: Element }>();
    const queue = [from];
    const visited = new Set([from]);
    while (queue.length) {
      const node = queue.shift() as string;
      if (node === to) break;
      for (const edge of forest.get(node) ?? []) {
        if (visited.has(edge.to)) continue;
        visited.add(edge.to);
        back.set(edge.to, { prev: node, el: edge.el });
        queue.push(edge.to);
      }
    }
    const path: Element[] = [];
    for (let node = to; node !== from; ) {
      const step = back.get(node);
      if (!step) break;
      path.push(step.el);
      node = step.prev;
    }
    return path;
  };

  const problems: TopologyProblem[] = [];
  for (const el of circuit.elements) {
    if (!isIdealVoltageBranch(el)) continue;
    const [a, b] = el.kind === "V" ? [el.pos, el.neg] : [el.a, el.b];
    if (a === b) {
      problems.push({
        kind: "source-loop",
        nodes: [a],
        elements: [el.name],
        message: `${describeLoopMember(el)} has both ends on node ${a}; at DC its current is undefined (remove it or connect its other end)`,
      });
      continue;
    }
    if (sets.union(a, b)) {
      addEdge(a, b, el);
      continue;
    }
    const loop = [el, ...pathBetween(a, b)];
    const loopNodes = new Set<string>();
    for (const member of loop) {
      for (const n of member.kind === "V" ? [member.pos, member.neg] : member.kind === "L" ? [member.a, member.b] : []) loopNodes.add(n);
    }
    const onlySources = loop.every((m) => m.kind === "V");
    const advice = onlySources
      ? "two ideal sources cannot both set the same voltage; remove one or give it a series resistance"
      : "at DC this loop has no defined current; give the inductor its winding resistance or break the loop";
    problems.push({
      kind: "source-loop",
      nodes: [...loopNodes].sort(),
      elements: loop.map((m) => m.name),
      message: `${list(loop.map(describeLoopMember))} form a loop with no resistance (nodes ${[...loopNodes].sort().join(", ")}); ${advice}`,
    });
  }
  return problems;
}

/**
 * Everything that would make the MNA matrix singular or the input unusable, worded for a
 * designer. Empty when the circuit can be solved. `numbering` may be passed when the caller has
 * already numbered the nodes (the solver, which elaborates with the same numbering).
 */
export function diagnoseTopology(circuit: SolverCircuit, numbering?: NodeNumbering): TopologyProblem[] {
  const invalid = validateElements(circuit).map<TopologyProblem>((message) => ({
    kind: "invalid-value",
    nodes: [],
    elements: [],
    message,
  }));
  if (invalid.length) return invalid;
  if (circuit.elements.length === 0) {
    return [{ kind: "no-dc-path", nodes: [], elements: [], message: "the circuit has no elements" }];
  }
  const nodes = numbering ?? nodeNumbering(circuit);
  if (!nodes.touchesGround) {
    return [{ kind: "no-dc-path", nodes: [], elements: [], message: "no element connects to ground (node 0); every voltage is undefined" }];
  }
  const loops = sourceLoopProblems(circuit);
  const floating = floatingNodeProblems(circuit, nodes);
  return loops.length === 0 ? floating : floating.length === 0 ? loops : [...loops, ...floating];
}
