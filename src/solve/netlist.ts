// The solver's input: a flat list of circuit elements between named nodes, SPICE-style.
// `src/solve/from-circuit.ts` builds it from a Circuit; tests build it by hand to mirror an
// ngspice deck line for line. Node "0" is ground. SI base units throughout.

export type ModelType = "D" | "NPN" | "PNP" | "NJF" | "PJF" | "NMOS" | "PMOS";

/** A `.model` card: parameter names upper-case as SPICE spells them (IS, BF, VAF, VTO, BETA …). */
export interface ModelCard {
  name: string;
  type: ModelType;
  params: Record<string, number>;
  /** Where the parameters come from (datasheet, published card, estimate), shown to users. */
  source: string;
}

export interface ResistorElement { kind: "R"; name: string; a: string; b: string; ohms: number }
/** An ideal capacitor in series with `esr` and `esl` (the series R-L-C model); open at DC. */
export interface CapacitorElement { kind: "C"; name: string; a: string; b: string; farads: number; esr?: number; esl?: number }
/** An inductor with optional series (winding) resistance; a short (through `series`) at DC. */
export interface InductorElement { kind: "L"; name: string; a: string; b: string; henries: number; series?: number }
/** Independent voltage source, `pos` − `neg` = dc; optional internal series resistance (battery). */
export interface VoltageSourceElement { kind: "V"; name: string; pos: string; neg: string; dc: number; ac?: number; series?: number }
/** Independent current source: `dc` amperes flow from `pos` through the source to `neg` (SPICE sign). */
export interface CurrentSourceElement { kind: "I"; name: string; pos: string; neg: string; dc: number; ac?: number }
export interface DiodeElement { kind: "D"; name: string; anode: string; cathode: string; model: ModelCard; area?: number }
export interface BjtElement { kind: "Q"; name: string; c: string; b: string; e: string; model: ModelCard; area?: number }
export interface JfetElement { kind: "J"; name: string; d: string; g: string; s: string; model: ModelCard; area?: number }
export interface MosfetElement { kind: "M"; name: string; d: string; g: string; s: string; b: string; model: ModelCard; w?: number; l?: number }

export type Element =
  | ResistorElement
  | CapacitorElement
  | InductorElement
  | VoltageSourceElement
  | CurrentSourceElement
  | DiodeElement
  | BjtElement
  | JfetElement
  | MosfetElement;

export interface SolverCircuit {
  /** Title for messages ("demo-preamp.kicad_sch"). */
  title: string;
  elements: Element[];
}
