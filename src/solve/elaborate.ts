// Turns a SolverCircuit into devices over numbered unknowns. The only place that maps element
// kinds to model modules; the engines downstream see `Device`s only.

import { ElaborationMemo, type Device } from "./device.js";
import { UnknownMap } from "./mna.js";
import { bjtDevice } from "./models/bjt.js";
import { diodeDevice } from "./models/diode.js";
import { jfetDevice } from "./models/jfet.js";
import { mosfetDevice } from "./models/mosfet.js";
import {
  capacitorDevice,
  currentSourceDevice,
  inductorDevice,
  resistorDevice,
  voltageSourceDevice,
} from "./models/passive.js";
import type { Element, ModelCard, SolverCircuit } from "./netlist.js";

export interface ElaboratedCircuit {
  circuit: SolverCircuit;
  unknowns: UnknownMap;
  devices: Device[];
}

function deviceFor(el: Element, unknowns: UnknownMap, memo: ElaborationMemo): Device {
  switch (el.kind) {
    case "R": return resistorDevice(el, unknowns);
    case "C": return capacitorDevice(el, unknowns);
    case "L": return inductorDevice(el, unknowns);
    case "V": return voltageSourceDevice(el, unknowns);
    case "I": return currentSourceDevice(el, unknowns);
    case "D": return diodeDevice(el, unknowns, memo);
    case "Q": return bjtDevice(el, unknowns, memo);
    case "J": return jfetDevice(el, unknowns, memo);
    case "M": return mosfetDevice(el, unknowns, memo);
  }
}

/** Calls `check(label, value)` for every numeric field of the element. */
function forEachNumericField(el: Element, check: (label: string, value: number | undefined) => void): void {
  switch (el.kind) {
    case "R": check("resistance", el.ohms); return;
    case "C": check("capacitance", el.farads); check("ESR", el.esr); check("ESL", el.esl); return;
    case "L": check("inductance", el.henries); check("series resistance", el.series); return;
    case "V": check("voltage", el.dc); check("AC amplitude", el.ac); check("series resistance", el.series); return;
    case "I": check("current", el.dc); check("AC amplitude", el.ac); return;
    case "D": case "Q": case "J": check("area", el.area); return;
    case "M": check("W", el.w); check("L", el.l); return;
  }
}

function elementNodes(el: Element): string[] {
  switch (el.kind) {
    case "R": case "C": case "L": return [el.a, el.b];
    case "V": case "I": return [el.pos, el.neg];
    case "D": return [el.anode, el.cathode];
    case "Q": return [el.c, el.b, el.e];
    case "J": return [el.d, el.g, el.s];
    case "M": return [el.d, el.g, el.s, el.b];
  }
}

/** Number of nodes an element touches; with pinNode, the allocation-free form of elementNodes. */
export function pinCount(el: Element): number {
  switch (el.kind) {
    case "R": case "C": case "L": case "V": case "I": case "D": return 2;
    case "Q": case "J": return 3;
    case "M": return 4;
  }
}

/** The element's `i`-th node, in elementNodes order. */
export function pinNode(el: Element, i: number): string {
  switch (el.kind) {
    case "R": case "C": case "L": return i === 0 ? el.a : el.b;
    case "V": case "I": return i === 0 ? el.pos : el.neg;
    case "D": return i === 0 ? el.anode : el.cathode;
    case "Q": return i === 0 ? el.c : i === 1 ? el.b : el.e;
    case "J": return i === 0 ? el.d : i === 1 ? el.g : el.s;
    case "M": return i === 0 ? el.d : i === 1 ? el.g : i === 2 ? el.s : el.b;
  }
}

/** Whether a node name has a character other than white space (what /\S/ tests). */
function hasVisibleCharacter(name: string): boolean {
  for (let i = 0; i < name.length; i++) {
    const c = name.charCodeAt(i);
    const space = (c >= 9 && c <= 13) || c === 32 || c === 0xa0 || c === 0x1680 || (c >= 0x2000 && c <= 0x200a) ||
      c === 0x2028 || c === 0x2029 || c === 0x202f || c === 0x205f || c === 0x3000 || c === 0xfeff;
    if (!space) return true;
  }
  return false;
}

/**
 * Every named node except ground, numbered in the order the elements first mention them — the
 * order the unknowns get — shared by the topology checks and the elaboration so a solve looks
 * each pin's name up once.
 */
export interface NodeNumbering {
  readonly names: readonly string[];
  readonly index: ReadonlyMap<string, number>;
  /** Some element has a pin on node 0. */
  readonly touchesGround: boolean;
  /** Every element's pins in order (pinNode order), and each one's node number (−1: ground). */
  readonly pinNames: readonly string[];
  readonly pinNodes: Int32Array;
}

export function nodeNumbering(circuit: SolverCircuit): NodeNumbering {
  const names: string[] = [];
  const index = new Map<string, number>();
  const pinNames: string[] = [];
  let touchesGround = false;
  for (const el of circuit.elements) {
    const pins = pinCount(el);
    for (let i = 0; i < pins; i++) pinNames.push(pinNode(el, i));
  }
  const pinNodes = new Int32Array(pinNames.length);
  for (let p = 0; p < pinNames.length; p++) {
    const name = pinNames[p] as string;
    if (name === "0") { touchesGround = true; pinNodes[p] = -1; continue; }
    let node = index.get(name);
    if (node === undefined) {
      node = names.length;
      index.set(name, node);
      names.push(name);
    }
    pinNodes[p] = node;
  }
  return { names, index, touchesGround, pinNames, pinNodes };
}

/** Problems that make a circuit unusable before any matrix is built (bad values, duplicate names). */
export function validateElements(circuit: SolverCircuit): string[] {
  const problems: string[] = [];
  const seen = new Set<string>();
  const cardsChecked = new Set<ModelCard>();
  let current: Element | undefined;
  const check = (label: string, value: number | undefined): void => {
    if (value !== undefined && !Number.isFinite(value)) problems.push(`${current?.name ?? "?"} has a ${label} that is not a finite number (${value})`);
  };
  for (const el of circuit.elements) {
    current = el;
    if (seen.has(el.name)) problems.push(`two elements are both named ${el.name}`);
    seen.add(el.name);
    forEachNumericField(el, check);
    if ((el.kind === "D" || el.kind === "Q" || el.kind === "J" || el.kind === "M") && !cardsChecked.has(el.model)) {
      cardsChecked.add(el.model);
      for (const name in el.model.params) {
        if (Number.isNaN(el.model.params[name])) problems.push(`${el.name}: model ${el.model.name} parameter ${name} is not a number`);
      }
    }
    const pins = pinCount(el);
    for (let i = 0; i < pins; i++) {
      if (!hasVisibleCharacter(pinNode(el, i))) problems.push(`${el.name} has a pin that is not connected to any node`);
    }
    if (el.kind === "M" && ((el.w !== undefined && el.w <= 0) || (el.l !== undefined && el.l <= 0))) {
      problems.push(`${el.name} needs a positive channel W and L`);
    }
  }
  return problems;
}

const finiteOrAbsent = (v: number | undefined): boolean => v === undefined || Number.isFinite(v);

/**
 * Whether validateElements would pass the circuit's values (numbers, model cards, channel
 * sizes), for a circuit whose names and pins are already known to pass. Allocates nothing.
 */
export function valuesUsable(circuit: SolverCircuit): boolean {
  let lastCard: ModelCard | undefined;
  for (const el of circuit.elements) {
    switch (el.kind) {
      case "R": if (!Number.isFinite(el.ohms)) return false; continue;
      case "C": if (!Number.isFinite(el.farads) || !finiteOrAbsent(el.esr) || !finiteOrAbsent(el.esl)) return false; continue;
      case "L": if (!Number.isFinite(el.henries) || !finiteOrAbsent(el.series)) return false; continue;
      case "V": if (!Number.isFinite(el.dc) || !finiteOrAbsent(el.ac) || !finiteOrAbsent(el.series)) return false; continue;
      case "I": if (!Number.isFinite(el.dc) || !finiteOrAbsent(el.ac)) return false; continue;
      case "D": case "Q": case "J": if (!finiteOrAbsent(el.area)) return false; break;
      case "M":
        if (!finiteOrAbsent(el.w) || !finiteOrAbsent(el.l)) return false;
        if ((el.w !== undefined && el.w <= 0) || (el.l !== undefined && el.l <= 0)) return false;
        break;
    }
    if (el.model === lastCard) continue;
    lastCard = el.model;
    for (const name in el.model.params) if (Number.isNaN(el.model.params[name])) return false;
  }
  return true;
}

export { elementNodes };

export function elaborate(circuit: SolverCircuit, numbering: NodeNumbering = nodeNumbering(circuit)): ElaboratedCircuit {
  // External nodes first (numbered as the elements mention them), then internal nodes and branches.
  const unknowns = new UnknownMap(numbering);
  const elements = circuit.elements;
  const devices = new Array<Device>(elements.length);
  const memo = new ElaborationMemo();
  for (let i = 0; i < elements.length; i++) devices[i] = deviceFor(elements[i] as Element, unknowns, memo);
  return { circuit, unknowns, devices };
}
