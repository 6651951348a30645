// Turns a SolverCircuit into devices over numbered unknowns. The only place that maps element
// kinds to model modules; the engines downstream see `Device`s only.

import type { Device } from "./device.js";
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

function deviceFor(el: Element, unknowns: UnknownMap): Device {
  switch (el.kind) {
    case "R": return resistorDevice(el, unknowns);
    case "C": return capacitorDevice(el, unknowns);
    case "L": return inductorDevice(el, unknowns);
    case "V": return voltageSourceDevice(el, unknowns);
    case "I": return currentSourceDevice(el, unknowns);
    case "D": return diodeDevice(el, unknowns);
    case "Q": return bjtDevice(el, unknowns);
    case "J": return jfetDevice(el, unknowns);
    case "M": return mosfetDevice(el, unknowns);
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
    for (const n of elementNodes(el)) {
      if (!/\S/.test(n)) problems.push(`${el.name} has a pin that is not connected to any node`);
    }
    if (el.kind === "M" && ((el.w !== undefined && el.w <= 0) || (el.l !== undefined && el.l <= 0))) {
      problems.push(`${el.name} needs a positive channel W and L`);
    }
  }
  return problems;
}

export { elementNodes };

export function elaborate(circuit: SolverCircuit): ElaboratedCircuit {
  const unknowns = new UnknownMap();
  // Name every external node first so node unknowns come before internal nodes and branches.
  for (const el of circuit.elements) for (const n of elementNodes(el)) unknowns.node(n);
  const devices = circuit.elements.map((el) => deviceFor(el, unknowns));
  return { circuit, unknowns, devices };
}
