// Circuit → SolverCircuit: every simulated part becomes SPICE-style elements between nodes named after
// the nets (ground nets are node "0"); supply rails become ideal sources to ground. Nothing is dropped
// silently: a part that cannot be modelled is listed in `unmodelled` with a note saying why.
//
// Model resolution, first hit wins: Sim.* fields (Sim.Library + Sim.Name, or Sim.Device with inline
// Sim.Params), KiCad 6 Spice_Model / Spice_Lib_File, the config's model text, the built-in library by
// Value and then by the symbol's name, and for a zener a generic card at the voltage its Value states.
// A name may be a `.model` card or a `.subckt` block; a subcircuit is expanded in place (internal
// nodes and elements prefixed by the part's reference, `Q1:MID`), its pins mapped by Sim.Pins (or
// KiCad 6's Spice_Node_Sequence) or, without either, by position in pin-number order. The part's own device inside (the only transistor or
// diode; a dual-gate's channels by which gate they sit on) takes the name the Context looks for:
// `Q1`, or `Q1.g1` / `Q1.g2`.
import type { Circuit, Net, Part, PartKind } from "../circuit/types.js";
import type { Element, ModelCard, ModelType, SolverCircuit } from "./netlist.js";
import { REQUIRED_ROLES } from "../circuit/classify.js";
import { parseSimParams, parseSimPins, parseSourceSpec, type SourceSpec } from "../circuit/source-spec.js";
import { parseSpiceNumber } from "../circuit/spice-number.js";
import { formatQuantity, parseQuantity } from "../circuit/units.js";
import { estimateCapacitorParasitics } from "./parasitics.js";
import { localNetName, voltsFromNetName } from "../circuit/net-voltage.js";
import { findModelCard, parseModelCards, type ParsedModels } from "./spice-card.js";
import { findModel, zenerFromValue, type LibraryPart, type PartRatings } from "./parts/library.js";
import { findSubcircuit, type SubcircuitDef } from "./subckt-syntax.js";
import { expandSubcircuit } from "./subckt-expand.js";
import { naturalCompare } from "../read/natural-order.js";

export interface BuildNote {
  ref?: string;
  message: string;
}

export interface BuildOptions {
  /** Net name → volts for rails whose names carry no voltage (`VCC`), from the config's `rails`. */
  railVolts: Record<string, number>;
  /** SPICE `.model` text from the config. */
  modelsText?: string;
  /** Extra net names to treat as ground (case-insensitive), beside nets the reader marked as ground. */
  groundNames?: string[];
}

export interface BuildResult {
  solver: SolverCircuit;
  notes: BuildNote[];
  /** References of parts that are in the design but could not be simulated (each once). */
  unmodelled: string[];
  /** Circuit net name → solver node ("0" for ground). */
  nodeOfNet: Record<string, string>;
  /** Reference → the part's ratings, where the built-in library (or its model card) knows them. */
  ratings: Record<string, PartRatings>;
}

export type { PartRatings } from "./parts/library.js";

/** Winding resistance assumed for an inductor with no DCR field: a placeholder that keeps the DC path
 * defined, not a typical figure (RF chokes run from tenths of an ohm to tens of ohms). */
const DEFAULT_INDUCTOR_DCR = 0.1;
/** A zero-ohm link becomes 1 mΩ (as ngspice does with "resistance too low") so the matrix stays regular. */
const ZERO_OHM_LINK = 1e-3;

// --- small helpers -------------------------------------------------------------------------------------

function field(part: Part, name: string): string | undefined {
  const want = name.toLowerCase();
  for (const [k, v] of Object.entries(part.fields)) {
    if (k.toLowerCase() === want && v.trim() !== "" && v.trim() !== "~") return v.trim();
  }
  return undefined;
}

function symbolName(libId: string): string {
  const i = libId.indexOf(":");
  return i < 0 ? libId : libId.slice(i + 1);
}

/** Volts a supply net's name states (`+9V`, `-5V`, `+3V3`); one reading for the Context and the builder. */
export const railVoltsFromName = voltsFromNetName;

function isExcluded(part: Part): boolean {
  if (part.dnp || part.excludedFromSim) return true;
  const enable = field(part, "Sim.Enable");
  if (enable !== undefined && /^(0|n|no|false)$/i.test(enable)) return true;
  const spice = field(part, "Spice_Netlist_Enabled");
  return spice !== undefined && /^(0|n|no|false)$/i.test(spice);
}

/** Numeric Sim.Params entries, keys upper-case (`bf=200 is=1e-14` → { BF: 200, IS: 1e-14 }). */
function numericParams(text: string): { params: Record<string, number>; unread: string[] } {
  const params: Record<string, number> = {};
  const unread: string[] = [];
  for (const [k, raw] of Object.entries(parseSimParams(text))) {
    const v = parseSpiceNumber(raw);
    if (v === undefined) unread.push(`${k}=${raw}`);
    else params[k.toUpperCase()] = v;
  }
  return { params, unread };
}

// --- model resolution ------------------------------------------------------------------------------------

const SIM_DEVICE_TYPE: Record<string, ModelType> = {
  D: "D", NPN: "NPN", PNP: "PNP", NJFET: "NJF", PJFET: "PJF", NMOS: "NMOS", PMOS: "PMOS",
};
/** Sim.Type values meaning the model flavour we implement (Gummel–Poon, Shichman–Hodges, MOS level 1). */
const SUPPORTED_SIM_TYPES = new Set(["", "GUMMELPOON", "GP", "SHICHMANHODGES", "MOS1", "LEVEL1"]);
/** Instance parameters a Sim.Params may carry that are not model parameters. */
const INSTANCE_PARAMS = new Set(["AREA", "M", "W", "L", "TEMP", "DTEMP", "OFF", "IC"]);

const WANTED_TYPES: Partial<Record<PartKind, readonly ModelType[]>> = {
  diode: ["D"],
  zener: ["D"],
  npn: ["NPN"],
  pnp: ["PNP"],
  njfet: ["NJF"],
  pjfet: ["PJF"],
  nmos: ["NMOS"],
  pmos: ["PMOS"],
  "dual-gate-mosfet": ["NMOS"],
};

interface CardChoice {
  card: ModelCard;
  /** A dual-gate's gate-2 channel when it differs from `card` (the built-in tetrodes' capacitances). */
  gate2Card?: ModelCard;
  libraryPart?: LibraryPart;
}

interface SubcircuitChoice {
  subcircuit: SubcircuitDef;
  /** The text the block was read from: its top-level cards and blocks are visible to it. */
  library: ParsedModels;
  /** "'dg-mosfet.lib'", "config models", for notes. */
  where: string;
  libraryPart?: LibraryPart;
}

type ModelChoice = CardChoice | SubcircuitChoice;

/** Kinds whose model is one device: the element that is the part, inside a subcircuit. */
const PRINCIPAL_ELEMENT: Partial<Record<PartKind, "D" | "Q" | "J" | "M">> = {
  diode: "D", zener: "D", npn: "Q", pnp: "Q", njfet: "J", pjfet: "J", nmos: "M", pmos: "M",
};

interface BuildContext {
  circuit: Circuit;
  notes: BuildNote[];
  config?: ParsedModels;
  libraries: Map<string, ParsedModels | undefined>;
}

function libraryModels(ctx: BuildContext, path: string): ParsedModels | undefined {
  if (ctx.libraries.has(path)) return ctx.libraries.get(path);
  const lib = ctx.circuit.modelLibraries.find((l) => l.path.trim() === path.trim());
  const parsed = lib ? parseModelCards(lib.text, `model library '${lib.path}'`) : undefined;
  if (parsed) for (const n of parsed.notes) ctx.notes.push({ message: `model library '${path}', line ${n.line}: ${n.message}` });
  ctx.libraries.set(path, parsed);
  return parsed;
}

function typeFits(card: ModelCard, want: readonly ModelType[], part: Part, ctx: BuildContext, where: string): boolean {
  if (want.includes(card.type)) return true;
  ctx.notes.push({ ref: part.ref, message: `${part.ref}: model ${card.name} (${where}) is type ${card.type}, but the symbol is a ${part.kind}; not used` });
  return false;
}

/** Model parameters a part's Sim.Params override (instance parameters dropped); unread ones noted once. */
function overridesOf(part: Part, ctx: BuildContext): Record<string, number> {
  const text = field(part, "Sim.Params");
  if (!text) return {};
  const { params, unread } = numericParams(text);
  for (const k of Object.keys(params)) if (INSTANCE_PARAMS.has(k)) delete params[k];
  if (unread.length > 0) ctx.notes.push({ ref: part.ref, message: `${part.ref}: Sim.Params entries not read as numbers: ${unread.join(" ")}` });
  return params;
}

function overridden(card: ModelCard, part: Part, params: Record<string, number>): ModelCard {
  if (Object.keys(params).length === 0) return card;
  return {
    ...card,
    params: { ...card.params, ...params },
    source: `${card.source}; overridden by Sim.Params of ${part.ref} (${Object.keys(params).join(", ")})`,
  };
}

function withOverrides(card: ModelCard, part: Part, ctx: BuildContext): ModelCard {
  return overridden(card, part, overridesOf(part, ctx));
}

/** A `.model` card or, failing that, a `.subckt` block named `name` in `lib`; Sim.Device SUBCKT
 * asks for the block first. */
function cardOrSubcircuit(lib: ParsedModels, name: string, part: Part): { card?: ModelCard; subcircuit?: SubcircuitDef } {
  const card = findModelCard(lib.models, name);
  const subcircuit = findSubcircuit(lib.subcircuits, name);
  const wantsSubckt = field(part, "Sim.Device")?.toUpperCase() === "SUBCKT";
  if (subcircuit && (wantsSubckt || !card)) return { subcircuit };
  return card ? { card } : {};
}

/** Names a part's model may go by, in the order they are tried. */
function modelNames(part: Part): string[] {
  const names: string[] = [];
  const spiceModel = field(part, "Spice_Model");
  if (spiceModel && !/[\s(]/.test(spiceModel)) names.push(spiceModel);
  names.push(part.value, symbolName(part.libId));
  return [...new Set(names.map((n) => n.trim()).filter((n) => n !== "" && n !== "~"))];
}

function resolveModel(part: Part, want: readonly ModelType[], ctx: BuildContext): ModelChoice | undefined {
  const simLibrary = field(part, "Sim.Library");
  const simDevice = field(part, "Sim.Device")?.toUpperCase();
  const simType = (field(part, "Sim.Type") ?? "").toUpperCase();
  const names = modelNames(part);
  const libraryPart = names.map(findModel).find((p) => p !== undefined);
  const lp = libraryPart ? { libraryPart } : {};

  // 1. Sim.* fields (KiCad 7+).
  if (simLibrary) {
    const lib = libraryModels(ctx, simLibrary);
    const name = field(part, "Sim.Name") ?? part.value;
    if (!lib) {
      ctx.notes.push({ ref: part.ref, message: `${part.ref}: model library '${simLibrary}' was not read; looking for ${name} elsewhere` });
    } else {
      const { card, subcircuit } = cardOrSubcircuit(lib, name, part);
      if (subcircuit) return { subcircuit, library: lib, where: `'${simLibrary}'`, ...lp };
      if (!card) ctx.notes.push({ ref: part.ref, message: `${part.ref}: neither a .model nor a .subckt ${name} in '${simLibrary}'; looking elsewhere` });
      else if (typeFits(card, want, part, ctx, `'${simLibrary}'`)) return { card: withOverrides(card, part, ctx), ...lp };
    }
  } else if (simDevice && SIM_DEVICE_TYPE[simDevice]) {
    const type = SIM_DEVICE_TYPE[simDevice];
    const text = field(part, "Sim.Params");
    if (!SUPPORTED_SIM_TYPES.has(simType)) {
      ctx.notes.push({ ref: part.ref, message: `${part.ref}: Sim.Type ${simType} is not supported (Gummel–Poon, Shichman–Hodges and MOS level 1 are); looking for another model` });
    } else if (type && text) {
      const { params, unread } = numericParams(text);
      for (const k of Object.keys(params)) if (INSTANCE_PARAMS.has(k)) delete params[k];
      if (unread.length > 0) ctx.notes.push({ ref: part.ref, message: `${part.ref}: Sim.Params entries not read as numbers: ${unread.join(" ")}` });
      if ((type === "NMOS" || type === "PMOS") && params.LEVEL !== undefined && params.LEVEL !== 1) {
        ctx.notes.push({ ref: part.ref, message: `${part.ref}: Sim.Params LEVEL=${params.LEVEL}: only level-1 MOSFETs are supported; looking for another model` });
      } else {
        const card: ModelCard = { name: `${part.ref}_model`, type, params, source: `Sim.Params of ${part.ref} (unlisted parameters at SPICE defaults)` };
        if (typeFits(card, want, part, ctx, "Sim.Device")) return { card, ...lp };
      }
    }
  }

  // 2. KiCad 6 fields.
  const spiceLib = field(part, "Spice_Lib_File");
  const spiceModel = field(part, "Spice_Model");
  if (spiceLib && spiceModel) {
    const lib = libraryModels(ctx, spiceLib);
    const { card, subcircuit } = lib ? cardOrSubcircuit(lib, spiceModel, part) : {};
    if (!lib) ctx.notes.push({ ref: part.ref, message: `${part.ref}: model library '${spiceLib}' was not read; looking for ${spiceModel} elsewhere` });
    else if (subcircuit) return { subcircuit, library: lib, where: `'${spiceLib}'`, ...lp };
    else if (!card) ctx.notes.push({ ref: part.ref, message: `${part.ref}: neither a .model nor a .subckt ${spiceModel} in '${spiceLib}'; looking elsewhere` });
    else if (typeFits(card, want, part, ctx, `'${spiceLib}'`)) return { card: withOverrides(card, part, ctx), ...lp };
  }

  // 3. The config's models, by the part's names.
  if (ctx.config) {
    for (const name of names) {
      const { card, subcircuit } = cardOrSubcircuit(ctx.config, name, part);
      if (subcircuit) return { subcircuit, library: ctx.config, where: "config models", ...lp };
      if (card && typeFits(card, want, part, ctx, "config models")) return { card: withOverrides(card, part, ctx), ...lp };
    }
  }

  // 4. The built-in library.
  for (const name of names) {
    const found = findModel(name);
    if (found && typeFits(found.model, want, part, ctx, "built-in library")) {
      const params = overridesOf(part, ctx);
      const gate2 = found.gate2Model ? { gate2Card: overridden(found.gate2Model, part, params) } : {};
      return { card: overridden(found.model, part, params), ...gate2, libraryPart: found };
    }
  }

  // 5. A zener whose Value states its voltage (`15V`, `5V6`, `ZENER 6.2V`): the generic card at it.
  if (part.kind === "zener") {
    const generic = zenerFromValue(part.value);
    if (generic) return { card: withOverrides(generic.model, part, ctx), libraryPart: generic };
  }
  return undefined;
}

/** Ratings a vendor card may carry (`VCEO=40 ICRATING=200m`), when the library has none. */
function ratingsFromCard(card: ModelCard): PartRatings | undefined {
  const p = card.params;
  const r: PartRatings = { source: `rating parameters of model ${card.name} (${card.source})` };
  if (p.VCEO !== undefined) r.vceo = Math.abs(p.VCEO);
  if (p.ICRATING !== undefined) r.icMax = Math.abs(p.ICRATING);
  if (p.VDS !== undefined) r.vds = Math.abs(p.VDS);
  if (p.VPK !== undefined) r.vrrm = Math.abs(p.VPK);
  if (p.IAVE !== undefined) r.ifMax = Math.abs(p.IAVE);
  return Object.keys(r).length > 1 ? r : undefined;
}

// --- the builder -------------------------------------------------------------------------------------------

class Builder {
  readonly elements: Element[] = [];
  readonly notes: BuildNote[] = [];
  readonly unmodelled: string[] = [];
  readonly ratings: Record<string, PartRatings> = {};
  readonly nodeOfNet: Record<string, string> = {};
  /** Nets driven by a source part that is simulated (no ideal rail is added on them). */
  readonly sourceDriven = new Map<string, string>();
  readonly ctx: BuildContext;

  constructor(readonly circuit: Circuit, readonly opts: BuildOptions) {
    const groundNames = new Set((opts.groundNames ?? []).map((n) => n.toLowerCase()));
    for (const net of circuit.nets) {
      const ground = net.isGround || net.name === "0" || [net.name, localNetName(net.name), ...net.aliases].some((a) => groundNames.has(a.toLowerCase()));
      this.nodeOfNet[net.name] = ground ? "0" : net.name;
    }
    this.ctx = { circuit, notes: this.notes, libraries: new Map() };
    if (opts.modelsText !== undefined && opts.modelsText.trim() !== "") {
      const parsed = parseModelCards(opts.modelsText, "config models");
      for (const n of parsed.notes) this.notes.push({ message: `config models, line ${n.line}: ${n.message}` });
      this.ctx.config = parsed;
    }
  }

  skip(part: Part, why: string): void {
    if (!this.unmodelled.includes(part.ref)) this.unmodelled.push(part.ref);
    this.notes.push({ ref: part.ref, message: `${part.ref} is not simulated: ${why}` });
  }

  note(part: Part, message: string): void {
    this.notes.push({ ref: part.ref, message: `${part.ref}: ${message}` });
  }

  /** The node on a role's pin; an unconnected pin gets a node of its own (and a note). */
  node(part: Part, role: string): string {
    const pin = part.roles[role] ?? "";
    const net = part.pins[pin];
    if (net === undefined) {
      this.note(part, `pin ${pin} (${role}) is not connected`);
      return `${part.ref}#pin${pin}`;
    }
    return this.nodeOfNet[net] ?? net;
  }

  rolesMissing(part: Part): string[] {
    return REQUIRED_ROLES[part.kind].filter((r) => part.roles[r] === undefined);
  }

  /** A value from Sim.Params (`r=10k`) when Sim.Device names the element, else the parsed Value. */
  passiveValue(part: Part, device: "R" | "C" | "L"): number | undefined {
    const simDevice = field(part, "Sim.Device")?.toUpperCase();
    const params = field(part, "Sim.Params");
    if (simDevice === device && params) {
      const raw = parseSimParams(params)[device.toLowerCase()];
      const v = raw !== undefined ? parseSpiceNumber(raw) : undefined;
      if (v !== undefined) return v;
    }
    return part.parsed.number;
  }

  add(part: Part): void {
    const missing = this.rolesMissing(part);
    if (missing.length > 0) {
      const named = Object.entries(part.pinNames).map(([n, name]) => `${n}=${name || "unnamed"}`).join(", ");
      this.skip(part, `cannot tell which pin is ${missing.join(", ")} (pins ${named || "unknown"})`);
      return;
    }
    switch (part.kind) {
      case "resistor": return this.addResistor(part);
      case "capacitor": case "polarized-capacitor": return this.addCapacitor(part);
      case "inductor": return this.addInductor(part);
      case "battery": return this.addBattery(part);
      case "voltage-source": case "current-source": return this.addSource(part);
      case "diode": case "zener": case "npn": case "pnp": case "njfet": case "pjfet": case "nmos": case "pmos": case "dual-gate-mosfet":
        return this.addDevice(part);
      case "connector": case "power-flag":
        return;
      case "other":
        this.skip(part, `no model for a '${part.value || symbolName(part.libId)}' (${part.libId || "no library id"}); only passives, diodes, BJTs, JFETs, MOSFETs and sources are simulated`);
        return;
    }
  }

  addResistor(part: Part): void {
    const ohms = this.passiveValue(part, "R");
    if (ohms === undefined) return this.skip(part, part.parsed.problem ?? `no resistance in '${part.value}'`);
    let value = ohms;
    if (ohms === 0) {
      value = ZERO_OHM_LINK;
      this.note(part, "zero-ohm link simulated as 1 mΩ");
    }
    this.elements.push({ kind: "R", name: part.ref, a: this.node(part, "1"), b: this.node(part, "2"), ohms: value });
  }

  addCapacitor(part: Part): void {
    const farads = this.passiveValue(part, "C");
    if (farads === undefined || !(farads > 0)) return this.skip(part, part.parsed.problem ?? `no capacitance in '${part.value}'`);
    const sized: Part = farads === part.parsed.number ? part : { ...part, parsed: { ...part.parsed, number: farads } };
    const { esr, esl } = estimateCapacitorParasitics(sized);
    const [a, b] = part.kind === "polarized-capacitor" ? ["+", "-"] : ["1", "2"];
    this.elements.push({ kind: "C", name: part.ref, a: this.node(part, a ?? "1"), b: this.node(part, b ?? "2"), farads, esr, esl });
  }

  addInductor(part: Part): void {
    const henries = this.passiveValue(part, "L");
    if (henries === undefined || !(henries > 0)) return this.skip(part, part.parsed.problem ?? `no inductance in '${part.value}'`);
    let series = DEFAULT_INDUCTOR_DCR;
    const written = field(part, "DCR") ?? field(part, "Rdc") ?? field(part, "R") ?? field(part, "ESR");
    const read = written !== undefined ? parseQuantity(written, "Ω") : undefined;
    if (typeof read === "number") series = read;
    else {
      const why = read ? ` (field '${written}' not read: ${read.error})` : "";
      this.note(part, `winding resistance unknown${why}; ${formatQuantity(DEFAULT_INDUCTOR_DCR, "Ω")} assumed, add a DCR field with the datasheet figure`);
    }
    this.elements.push({ kind: "L", name: part.ref, a: this.node(part, "1"), b: this.node(part, "2"), henries, series });
  }

  addBattery(part: Part): void {
    const spec = this.sourceSpec(part);
    const volts = spec?.dc;
    if (volts === undefined) return this.skip(part, part.parsed.problem ?? `no voltage in '${part.value}'`);
    let series: number | undefined;
    const written = field(part, "R_internal") ?? field(part, "Rint") ?? field(part, "ESR") ?? field(part, "R_int");
    const read = written !== undefined ? parseQuantity(written, "Ω") : undefined;
    if (typeof read === "number") series = read;
    else {
      const assumed = defaultBatteryResistance(part, volts);
      series = assumed.ohms;
      this.note(part, `internal resistance ${formatQuantity(assumed.ohms, "Ω")} assumed (${assumed.basis}); give an R_internal field to use your cell's figure`);
    }
    const pos = this.node(part, "+");
    const neg = this.node(part, "-");
    this.elements.push({ kind: "V", name: part.ref, pos, neg, dc: volts, series });
    this.sourceDriven.set(pos, part.ref);
    this.sourceDriven.set(neg, part.ref);
  }

  /** DC and AC of a source from Sim.Params, Spice_Model or the Value, in that order. */
  sourceSpec(part: Part): SourceSpec | undefined {
    const simParams = field(part, "Sim.Params");
    if (simParams) {
      const p = parseSimParams(simParams);
      const dc = p.dc !== undefined ? parseSpiceNumber(p.dc) : undefined;
      const ac = p.ac !== undefined ? parseSpiceNumber(p.ac) : undefined;
      if (dc !== undefined || ac !== undefined) return { ...(dc !== undefined ? { dc } : {}), ...(ac !== undefined ? { ac } : {}) };
    }
    const spiceModel = field(part, "Spice_Model");
    if (spiceModel) {
      const s = parseSourceSpec(spiceModel);
      if (!("error" in s)) return s;
    }
    if (part.parsed.number !== undefined) return { dc: part.parsed.number };
    const fromValue = parseSourceSpec(part.value);
    return "error" in fromValue ? undefined : fromValue;
  }

  addSource(part: Part): void {
    const spec = this.sourceSpec(part);
    if (spec === undefined || (spec.dc === undefined && spec.ac === undefined)) {
      return this.skip(part, `no DC or AC value found (Value '${part.value}', no dc= in Sim.Params)`);
    }
    const dc = spec.dc ?? 0;
    const pos = this.node(part, "+");
    const neg = this.node(part, "-");
    const ac = spec.ac !== undefined ? { ac: spec.ac } : {};
    if (part.kind === "voltage-source") {
      this.elements.push({ kind: "V", name: part.ref, pos, neg, dc, ...ac });
      this.sourceDriven.set(pos, part.ref);
      this.sourceDriven.set(neg, part.ref);
    } else this.elements.push({ kind: "I", name: part.ref, pos, neg, dc, ...ac });
  }

  addDevice(part: Part): void {
    const want = WANTED_TYPES[part.kind] ?? [];
    const choice = resolveModel(part, want, this.ctx);
    const lp = choice?.libraryPart ?? modelNames(part).map(findModel).find((p) => p !== undefined);
    const rating = lp?.ratings ?? (choice && "card" in choice ? ratingsFromCard(choice.card) : undefined);
    if (rating) this.ratings[part.ref] = rating;
    if (!choice) {
      const tried = modelNames(part).join("', '");
      const zenerHint = part.kind === "zener" ? " (or write the zener voltage in its Value, e.g. 5V6)" : "";
      return this.skip(part, `no model found for '${tried}' (Sim.* fields, model libraries, the config's models and the built-in library were searched); add a .model card under "models" in the config${zenerHint}`);
    }
    if ("subcircuit" in choice) return this.addSubcircuit(part, choice);
    const model = choice.card;
    if (part.kind === "zener" && model.params.BV === undefined) this.note(part, `zener model ${model.name} has no BV; it will not break down`);
    switch (part.kind) {
      case "diode": case "zener":
        this.elements.push({ kind: "D", name: part.ref, anode: this.node(part, "A"), cathode: this.node(part, "K"), model });
        return;
      case "npn": case "pnp":
        this.elements.push({ kind: "Q", name: part.ref, c: this.node(part, "C"), b: this.node(part, "B"), e: this.node(part, "E"), model });
        return;
      case "njfet": case "pjfet":
        this.elements.push({ kind: "J", name: part.ref, d: this.node(part, "D"), g: this.node(part, "G"), s: this.node(part, "S"), model });
        return;
      case "nmos": case "pmos": {
        const s = this.node(part, "S");
        const b = part.roles.B !== undefined ? this.node(part, "B") : s;
        this.elements.push({ kind: "M", name: part.ref, d: this.node(part, "D"), g: this.node(part, "G"), s, b, model });
        return;
      }
      case "dual-gate-mosfet":
        this.addDualGate(part, model, choice.gate2Card ?? model, lp?.gateProtectionDiode);
        return;
      default:
        return;
    }
  }

  /** A tetrode as two channels in series through an internal node (G1 channel at the source, G2 channel
   * at the drain, substrate on the source), plus back-to-back gate–source diodes when protected. */
  addDualGate(part: Part, model: ModelCard, gate2Model: ModelCard, protection: ModelCard | undefined): void {
    const d = this.node(part, "D");
    const s = this.node(part, "S");
    const g1 = this.node(part, "G1");
    const g2 = this.node(part, "G2");
    const mid = `${part.ref}#mid`;
    this.elements.push({ kind: "M", name: `${part.ref}.g1`, d: mid, g: g1, s, b: s, model });
    this.elements.push({ kind: "M", name: `${part.ref}.g2`, d, g: g2, s: mid, b: s, model: gate2Model });
    if (!protection) return;
    for (const [label, gate] of [["g1", g1], ["g2", g2]] as const) {
      const k = `${part.ref}#${label}prot`;
      this.elements.push({ kind: "D", name: `${part.ref}.${label}a`, anode: gate, cathode: k, model: protection });
      this.elements.push({ kind: "D", name: `${part.ref}.${label}b`, anode: s, cathode: k, model: protection });
    }
  }

  /** Subcircuit pin → node: by Sim.Pins (`1=S 2=D 3=G2 4=G1`, symbol pin = subcircuit pin), by KiCad 6's
   * Spice_Node_Sequence (symbol pins in the subcircuit's pin order), else by position in pin-number
   * order. A string is the reason it cannot be done. */
  subcircuitPins(part: Part, def: SubcircuitDef): Map<string, string> | string {
    const symbolPins = [...new Set([...Object.keys(part.pins), ...Object.keys(part.pinNames)])].sort(naturalCompare);
    const nodeOfPin = (pin: string): string => {
      const net = part.pins[pin];
      if (net === undefined) {
        this.note(part, `pin ${pin} is not connected`);
        return `${part.ref}#pin${pin}`;
      }
      return this.nodeOfNet[net] ?? net;
    };
    const pinNodes = new Map<string, string>();
    const simPins = field(part, "Sim.Pins");
    if (simPins) {
      const pairs = parseSimPins(simPins);
      for (const [pin, subPin] of Object.entries(pairs)) {
        const want = subPin.toUpperCase();
        if (!symbolPins.includes(pin)) return `Sim.Pins '${simPins}' names pin ${pin}, which the symbol does not have (pins ${symbolPins.join(", ")})`;
        if (!def.pins.includes(want)) return `Sim.Pins '${simPins}' maps pin ${pin} to ${subPin}, which is not a pin of subcircuit ${def.name} (${def.pins.join(" ")})`;
        if (pinNodes.has(want)) return `Sim.Pins '${simPins}' maps two symbol pins to subcircuit pin ${subPin}`;
        pinNodes.set(want, nodeOfPin(pin));
      }
      const open = symbolPins.filter((p) => !(p in pairs));
      if (open.length > 0) this.note(part, `symbol pin${open.length > 1 ? "s" : ""} ${open.join(", ")} not in Sim.Pins: left out of the subcircuit`);
      return pinNodes;
    }
    const sequence = field(part, "Spice_Node_Sequence")?.split(/[\s,]+/).filter((p) => p !== "");
    const order = sequence ?? symbolPins;
    const how = sequence ? `Spice_Node_Sequence '${sequence.join(" ")}' lists` : "the symbol has";
    if (order.length !== def.pins.length) {
      return `${how} ${order.length} pins and subcircuit ${def.name} has ${def.pins.length} (${def.pins.join(" ")}); give a Sim.Pins field (e.g. "${def.pins.map((p, i) => `${symbolPins[i] ?? i + 1}=${p}`).join(" ")}")`;
    }
    const unknown = order.find((p) => !symbolPins.includes(p));
    if (unknown !== undefined) return `${how} pin ${unknown}, which the symbol does not have (pins ${symbolPins.join(", ")})`;
    def.pins.forEach((p, i) => pinNodes.set(p, nodeOfPin(order[i] ?? "")));
    return pinNodes;
  }

  /** A part modelled by a subcircuit: its expansion, with the part's own device(s) named as the Context
   * expects. */
  addSubcircuit(part: Part, choice: SubcircuitChoice): void {
    const def = choice.subcircuit;
    const pins = this.subcircuitPins(part, def);
    if (typeof pins === "string") return this.skip(part, `subcircuit ${def.name} from ${choice.where}: ${pins}`);
    const expansion = expandSubcircuit(def, pins, part.ref, choice.library);
    if (!expansion.ok) return this.skip(part, `subcircuit ${def.name} from ${choice.where} cannot be used: ${expansion.problem}`);
    const elements = expansion.elements;
    for (const n of expansion.notes) this.note(part, n);
    const params = field(part, "Sim.Params");
    if (params) this.note(part, `Sim.Params '${params}' not passed to subcircuit ${def.name}: subcircuit parameters are not supported`);
    const named = part.kind === "dual-gate-mosfet" ? this.nameChannels(part, elements) : this.namePrincipal(part, elements);
    if (named === undefined) return;
    this.note(part, `modelled by subcircuit ${def.name} from ${choice.where} (line ${def.line}), ${elements.length} elements${named}`);
    this.elements.push(...elements);
  }

  /** The one D/Q/J/M inside that is the part gets the part's reference. Returns text for the note, or
   * undefined when the part was skipped (its device has the wrong polarity). */
  namePrincipal(part: Part, elements: Element[]): string | undefined {
    const kind = PRINCIPAL_ELEMENT[part.kind];
    if (kind === undefined) return "";
    const found = elements.filter((e) => e.kind === kind);
    const [only] = found;
    if (found.length !== 1 || only === undefined) {
      return `; ${found.length === 0 ? "no" : `${found.length}`} ${kind} elements inside, so ${part.ref}'s own operating point is not reported`;
    }
    const want = WANTED_TYPES[part.kind] ?? [];
    if ((only.kind === "D" || only.kind === "Q" || only.kind === "J" || only.kind === "M") && !want.includes(only.model.type)) {
      this.skip(part, `the ${kind} element ${only.name} in its subcircuit uses model ${only.model.name} of type ${only.model.type}, but the symbol is a ${part.kind}`);
      return undefined;
    }
    const inside = only.name;
    only.name = part.ref;
    return `; ${inside} is ${part.ref}'s own device`;
  }

  /** A dual-gate's channels: the MOSFET whose gate is on the G1 pin's node is `REF.g1`, on G2 `REF.g2`;
   * failing that (gates behind resistors), of exactly two MOSFETs in series the one at the source. */
  nameChannels(part: Part, elements: Element[]): string {
    const mosfets = elements.filter((e): e is Extract<Element, { kind: "M" }> => e.kind === "M");
    const g1Node = this.node(part, "G1");
    const g2Node = this.node(part, "G2");
    let g1 = mosfets.filter((m) => m.g === g1Node);
    let g2 = mosfets.filter((m) => m.g === g2Node);
    if (!(g1.length === 1 && g2.length === 1) && mosfets.length === 2) {
      const [a, b] = mosfets as [Extract<Element, { kind: "M" }>, Extract<Element, { kind: "M" }>];
      if (a.d === b.s) [g1, g2] = [[a], [b]];
      else if (b.d === a.s) [g1, g2] = [[b], [a]];
    }
    const [lower] = g1;
    const [upper] = g2;
    if (g1.length !== 1 || g2.length !== 1 || lower === undefined || upper === undefined || lower === upper) {
      return `; its gate-1 and gate-2 channels could not be told apart (${mosfets.length} MOSFETs inside), so their operating points are not reported`;
    }
    const names = `; ${lower.name} is the gate-1 channel (${part.ref}.g1), ${upper.name} the gate-2 channel (${part.ref}.g2)`;
    lower.name = `${part.ref}.g1`;
    upper.name = `${part.ref}.g2`;
    return names;
  }

  /** Ideal sources for rails whose voltage is known and which no simulated source part drives. */
  addRails(): void {
    const byAlias = new Map(Object.entries(this.opts.railVolts));
    for (const net of this.circuit.nets) {
      const node = this.nodeOfNet[net.name] ?? net.name;
      if (node === "0") continue;
      const configured = railCandidates(net).map((a) => byAlias.get(a)).find((v) => v !== undefined);
      if (!net.isPower && configured === undefined) continue;
      const volts = configured ?? railCandidates(net).map(railVoltsFromName).find((v) => v !== undefined);
      if (volts === undefined) {
        this.notes.push({ message: `power net ${net.name} has no known voltage: give it one under "rails" in the config, e.g. "rails": { "${localNetName(net.name)}": "9V" }` });
        continue;
      }
      const driver = this.sourceDriven.get(node);
      if (driver !== undefined) {
        this.notes.push({ message: `rail ${net.name} is driven by ${driver}; no ideal ${formatQuantity(volts, "V")} supply added` });
        continue;
      }
      this.elements.push({ kind: "V", name: `Vrail_${net.name}`, pos: node, neg: "0", dc: volts });
    }
  }
}

function railCandidates(net: Net): string[] {
  return [...new Set([net.name, localNetName(net.name), ...net.aliases])];
}

/** Internal resistance when the part gives none [CP: typical fresh cells at room temperature]. */
function defaultBatteryResistance(part: Part, volts: number): { ohms: number; basis: string } {
  const text = `${part.value} ${part.footprint} ${part.libId}`;
  if (/CR\d{4}|coin|button/i.test(text)) return { ohms: 15, basis: "typical lithium coin cell, common practice" };
  if (Math.abs(Math.abs(volts) - 9) < 0.5) return { ohms: 1.5, basis: "typical 9 V alkaline block, 1–2 Ω, common practice" };
  const cells = Math.max(1, Math.round(Math.abs(volts) / 1.5));
  return { ohms: 0.15 * cells, basis: `${cells} alkaline cell(s) at about 0.15 Ω each, common practice` };
}

/** Builds the solver netlist for a circuit. Pure: reads nothing but its arguments. */
export function buildSolverCircuit(circuit: Circuit, opts: BuildOptions): BuildResult {
  const b = new Builder(circuit, opts);
  const connectors: string[] = [];
  const excluded: string[] = [];
  for (const part of circuit.parts) {
    if (part.kind === "power-flag") continue;
    if (isExcluded(part)) {
      excluded.push(part.ref);
      continue;
    }
    if (part.kind === "connector") {
      connectors.push(part.ref);
      continue;
    }
    b.add(part);
  }
  b.addRails();
  if (excluded.length > 0) b.notes.push({ message: `left out as DNP or excluded from simulation: ${excluded.join(", ")}` });
  if (connectors.length > 0) b.notes.push({ message: `connectors are left open (what plugs into them is not simulated): ${connectors.join(", ")}` });
  const title = circuit.file.slice(Math.max(circuit.file.lastIndexOf("/"), circuit.file.lastIndexOf("\\")) + 1);
  return {
    solver: { title, elements: b.elements },
    notes: b.notes,
    unmodelled: b.unmodelled,
    nodeOfNet: b.nodeOfNet,
    ratings: b.ratings,
  };
}
