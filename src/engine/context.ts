// The Context: everything a rule may ask about one design, computed on first request and cached.
// Rules never do circuit math; they ask here ("|Z| from this net to ground over the band", "the
// operating point of Q3", "which stage is common-base"), and the figures come from src/solve.
import type { Circuit, Part } from "../circuit/types.js";
import type { Element, SolverCircuit } from "../solve/netlist.js";
import { diagnoseTopology } from "../solve/index.js";
import type { Config, ESeriesName } from "./config.js";
import type { BandOfOperation, BiasThevenin, ComplexPoint, Rail, Stack, Stage } from "./context-types.js";
import type { BaseReport, DeviceReport, RailReport } from "./result.js";
import { surveyRails } from "./context-rails.js";
import type { PartOnNet, SupplyPath, AcGroundTest } from "./context-topology.js";
import {
  ACTIVE_KINDS, classifyStage, dcNeighbourhood, findStacks, groundingCapacitors, indexCircuit, netOfRole,
  pathToSupply, terminalsOf,
} from "./context-topology.js";
import type { CapacitorModel, DeviceOperatingPoint, OperatingPoint, PartRatings, SolverBuild, Unmodelled } from "./context-solver.js";
import type { PowerRating, SaturationEdge } from "./context-limits.js";
import { cardOf, partDissipation, resistorPowerRating, saturationEdge } from "./context-limits.js";
import {
  buildSolver, capacitorModel, impedanceAt, impedanceBetweenAt, seriesDecade, solveDc, thermalVoltage, transferAt,
} from "./context-solver.js";

export type { PartOnNet, SupplyPath } from "./context-topology.js";
export type { CapacitorModel, DeviceOperatingPoint, OperatingPoint, PartRatings, SolverBuild, Unmodelled } from "./context-solver.js";
export type { PowerRating, SaturationEdge } from "./context-limits.js";

/** A collector/drain load fed from a rail: the part, the device it feeds, and its size in ohms. */
export interface RailLoad {
  /** The load part nearest the device (collector resistor, choke). */
  part: Part;
  device: Part;
  /** Resistance, or for a choke its reactance at the band's low edge (its smallest in the band). */
  ohms: number;
  /** The parts from the device to the rail, nearest first (load, then any decoupling). */
  path: Part[];
}

/** A rule's record that it could not do its whole job, listed by `model-coverage`. */
export interface Limitation {
  rule: string;
  reason: string;
  parts: string[];
}

/** What the HTML report draws; rules add to it while they check. */
export interface ReportCollector {
  readonly rails: RailReport[];
  readonly bases: BaseReport[];
  addRail(rail: RailReport): void;
  addBase(base: BaseReport): void;
  /** The device operating-point table, from the operating point (empty when it could not be solved). */
  devices(): DeviceReport[];
}

export interface ImpedanceOptions {
  /** Leave the transistors out (their small-signal models) and see only the passive network. */
  passiveOnly: boolean;
  /** Elements added for a what-if ("with a 1 nF 0603 added here"), in solver node names. */
  extra?: Element[];
  /** Element names to leave out (what the network looks like without C7). */
  without?: string[];
  /** Capacitor element names to treat as AC shorts (the short-circuit time-constant method). */
  shorted?: string[];
}

export interface Context {
  readonly circuit: Circuit;
  readonly config: Config;
  /** The band of operation; `isDefault` when the user configured none (messages then say so). */
  readonly band: BandOfOperation;
  readonly report: ReportCollector;

  /** Names of the ground nets. */
  ground(): string[];
  isGround(net: string): boolean;
  /** Every supply rail with its volts (from the config, the net name, a battery, a source field). */
  rails(): Rail[];
  rail(net: string): Rail | undefined;
  /** Power nets whose voltage nothing states (messages ask the user to set it in `rails`). */
  unresolvedRails(): string[];
  /** Ground, a rail, or a power net of unknown voltage: an AC ground by definition. */
  isSupply(net: string): boolean;

  /** The part with this reference (DNP parts included; check `dnp`). */
  part(ref: string): Part | undefined;
  /** Fitted parts on a net with the pin and its role. */
  partsOn(net: string): PartOnNet[];
  /** The net on a part's pin of this role ("B", "C", "1", "+"). */
  netOf(ref: string, role: string): string | undefined;
  /** The transistors (bipolar and FET), fitted, in reference order. */
  devices(): Part[];

  /** Each transistor's configuration, decided from the AC topology. */
  stages(): Stage[];
  stage(ref: string): Stage | undefined;
  /** Series device chains from a rail toward ground (cascodes, totem poles), bottom first. */
  stacks(): Stack[];
  /** Capacitors from this net straight to ground or a rail (tank capacitors across an inductor excluded). */
  groundingCapacitors(net: string): Part[];
  /** How a net is fed from a rail through resistors/inductors (a collector's load and decoupling). */
  supplyPath(net: string): SupplyPath | undefined;
  /** The collector/drain loads whose DC feed passes through this rail. */
  railLoads(rail: string): RailLoad[];
  /** The DC network hanging on a net: nets and resistors/inductors reachable without crossing a supply. */
  dcNetwork(net: string): { nets: string[]; parts: Part[] };

  /** The Thevenin equivalent of the DC bias network a device's terminal sees, all transistors removed.
   * `ohms` is Infinity when no DC path reaches a defined potential. Undefined without a solver. */
  bias(ref: string, role: string): BiasThevenin | undefined;

  /** The solver netlist with its notes, unmodelled parts and net→node map; undefined when it could not be built. */
  solver(): SolverBuild | undefined;
  /** Why `solver()` is undefined. */
  solverProblem(): string | undefined;
  /** The DC operating point; undefined when it could not be built or did not converge. */
  operatingPoint(): OperatingPoint | undefined;
  /** Why `operatingPoint()` is undefined. */
  operatingPointProblem(): string | undefined;
  /** A re-solve with some resistors changed (ref -> ohms); undefined when it did not converge. Cached per set. */
  operatingPointWith(overrides: Record<string, number>): OperatingPoint | undefined;
  /** A node's DC voltage from the operating point. */
  voltage(net: string): number | undefined;
  /** One device's operating point. A dual-gate MOSFET is two channels in series: `channel` "g1"
   * (the default, at the source) or "g2" (at the drain). */
  device(ref: string, channel?: "g1" | "g2"): DeviceOperatingPoint | undefined;
  /** A part's absolute maximum ratings from the model library or its fields. */
  rating(ref: string): PartRatings | undefined;
  /** Where a device's headroom ends at its operating point: VCE(sat) (its rating, else 0.2 V [CP]) or
   * VDS(sat) = VGS − VTO (JFET) / VGS − VTH (MOSFET). `channel` as for `device`. */
  saturationEdge(ref: string, channel?: "g1" | "g2"): SaturationEdge | undefined;
  /** DC watts a resistor (V²/R) or a device takes at the operating point. */
  dissipation(ref: string): number | undefined;
  /** A resistor's power rating: its own (Value, Power field), else by footprint size [CP], else
   * `fallbackWatts` marked as assumed. */
  resistorPowerRating(ref: string, fallbackWatts: number): PowerRating | undefined;
  /** Parts the solver could not model, with why. */
  unmodelled(): Unmodelled[];

  /** |Z| from a net to ground at the given frequencies. Off-board supplies count as open (the board's
   * own bypass must hold the rail); an on-board battery counts with its internal resistance. */
  impedance(net: string, frequencies: readonly number[], options: ImpedanceOptions): ComplexPoint[] | undefined;
  /** The impedance between two nets (neither need be ground): what a series part across them works into. */
  impedanceBetween(a: string, b: string, frequencies: readonly number[], options: ImpedanceOptions): ComplexPoint[] | undefined;
  /** Small-signal voltage transfer from one net to another at the operating point. */
  transfer(input: string, output: string, frequencies: readonly number[]): ComplexPoint[] | undefined;
  /** Log-spaced frequencies over the band and a decade beyond each edge, band edges included. */
  frequencies(perDecade?: number): number[];
  /** A capacitor's series R-L-C model (value, ESR, ESL from fields, package or defaults) and its SRF. */
  capacitor(ref: string): CapacitorModel | undefined;
  /** The same part with another value: its model as the package and dielectric would give it
   * (for "add a 1 nF 0603 like C12"). Without a part, a generic 0603 ceramic. */
  capacitorLike(ref: string | undefined, farads: number): CapacitorModel | undefined;
  /** IEC 60063 series values of a kind's configured series (or the one named) around a value. */
  seriesValues(series: ESeriesName, from: number, to: number): number[];
  /** The smallest member of the series at or above `value` (within rounding). */
  snapUp(value: number, series: ESeriesName): number;
  /** The member nearest `value` on a log scale. */
  snapNearest(value: number, series: ESeriesName): number;
  /** The solver node of a net (what `extra` elements connect to). */
  nodeOf(net: string): string | undefined;
  /** kT/q at the solver's temperature. */
  thermalVoltage(): number;

  /** Record that a rule could not do its whole job (shown by `model-coverage`). */
  noteLimited(rule: string, reason: string, parts?: string[]): void;
  limitations(): Limitation[];
}

/** Capacitors that tell configurations apart must be a signal short in the band: at most 100 Ω at
 * the band's geometric centre (a tank or neutralising capacitor is far smaller). Our choice. */
const TOPOLOGY_SHORT_OHMS = 100;

function lazy<T>(compute: () => T): () => T {
  let done = false;
  let value: T;
  return () => {
    if (!done) {
      value = compute();
      done = true;
    }
    return value;
  };
}

function naturalCompare(a: string, b: string): number {
  return a.localeCompare(b, "en", { numeric: true });
}

export interface ContextExtras {
  /** A SPICE model library from the config's `models` key, added to the design's own libraries. */
  modelsText?: string;
}

export function createContext(circuit: Circuit, config: Config, extras: ContextExtras = {}): Context {
  const band: BandOfOperation = { low: config.band.low, high: config.band.high, isDefault: config.band.isDefault };
  const index = indexCircuit(circuit);
  const groundNets = new Set(circuit.nets.filter((n) => n.isGround).map((n) => n.name));
  const railSurvey = lazy(() => surveyRails(circuit, config.rails));
  const railByNet = lazy(() => new Map(railSurvey().rails.map((r) => [r.net, r])));
  const isGround = (net: string): boolean => groundNets.has(net);
  // A power net is an AC ground whether or not its voltage is known (VCC with no config entry).
  const unresolvedSet = lazy(() => new Set(railSurvey().unresolved));
  const isSupply = (net: string): boolean => groundNets.has(net) || railByNet().has(net) || unresolvedSet().has(net);
  const centre = Math.sqrt(band.low * band.high);
  const acTest: AcGroundTest = {
    isSupply,
    isGround,
    minimumFarads: 1 / (2 * Math.PI * centre * TOPOLOGY_SHORT_OHMS),
  };

  const devices = lazy(() =>
    circuit.parts.filter((p) => !p.dnp && ACTIVE_KINDS.has(p.kind)).sort((a, b) => naturalCompare(a.ref, b.ref)));
  const stages = lazy(() => devices().map((d) => classifyStage(d, index, acTest)).filter((s): s is Stage => s !== undefined));
  const stacks = lazy(() => findStacks(devices(), index, acTest));

  const railLoads = lazy(() => {
    const byRail = new Map<string, RailLoad[]>();
    for (const device of devices()) {
      const terminals = terminalsOf(device.kind);
      if (!terminals) continue;
      // Only the terminal a load hangs on: a collector or drain (for p-type devices also their
      // source/emitter side is at the rail, but that is not a load).
      const net = netOfRole(device, terminals.output);
      if (net === undefined || isSupply(net)) continue;
      const path = pathToSupply(net, index, acTest);
      const first = path?.parts[0];
      if (!path || !first) continue;
      const ohms = loadOhms(first, band.low);
      if (ohms === undefined) continue;
      // Every rail on the way up feeds this load: the local decoupled rail and the main rail above it.
      const rails = new Set<string>([path.rail]);
      let cursor = net;
      for (const part of path.parts) {
        const next = Object.values(part.pins).find((n) => n !== cursor);
        if (next === undefined) break;
        if (isSupply(next) && !groundNets.has(next)) rails.add(next);
        cursor = next;
      }
      for (const rail of rails) {
        const list = byRail.get(rail) ?? [];
        list.push({ part: first, device, ohms, path: path.parts });
        byRail.set(rail, list);
      }
    }
    return byRail;
  });

  const built = lazy(() => {
    const railVolts: Record<string, number> = {};
    for (const rail of railSurvey().rails) {
      // A battery or source part sets its own rail in the netlist; only the others need a source.
      if (rail.from === "config" || rail.from === "name") railVolts[rail.net] = rail.volts;
    }
    const modelsText = [...circuit.modelLibraries.map((m) => m.text), ...(extras.modelsText ? [extras.modelsText] : [])].join("\n");
    return buildSolver(circuit, railVolts, modelsText === "" ? undefined : modelsText);
  });
  // Nodes with no DC path (an input connector's node behind its coupling capacitor: the connector
  // itself is not simulated) get a 1 GΩ leak to ground, as the ngspice reference decks do, so the
  // operating point exists; the build's notes say which.
  const leaked = lazy((): SolverBuild | undefined => {
    const b = built();
    if (!b.ok) return undefined;
    const { circuit: solver, nodes } = withDcLeaks(b.build.solver);
    const notes = nodes.length === 0 ? b.build.notes
      : [...b.build.notes, { message: `no DC path at ${nodes.join(", ")}: held at ground through 1 GΩ for the operating point` }];
    return { ...b.build, solver, notes };
  });
  const solverBuild = (): SolverBuild | undefined => leaked();

  const op = lazy((): { op?: OperatingPoint; problem?: string } => {
    const build = solverBuild();
    if (!build) return { problem: built().ok ? "no solver netlist" : (built() as { problem: string }).problem };
    const result = solveDc(build.solver);
    if (!result.converged) return { problem: result.problem ?? "the DC operating point did not converge" };
    return { op: result };
  });

  const overrideCache = new Map<string, OperatingPoint | undefined>();
  const limitations: Limitation[] = [];
  const railReports: RailReport[] = [];
  const baseReports: BaseReport[] = [];
  const biasCache = new Map<string, BiasThevenin | undefined>();
  const capacitorCache = new Map<string, CapacitorModel | undefined>();

  /** The AC network for impedance questions: off-board rail sources removed (open), each node given a
   * 1 GΩ leak so an isolated node cannot make the matrix singular (as the ngspice reference decks do). */
  const acNetwork = lazy((): SolverCircuit | undefined => {
    const build = solverBuild();
    if (!build) return undefined;
    const partRefs = new Set(circuit.parts.map((p) => p.ref));
    const elements = build.solver.elements.filter((e) => e.kind !== "V" || partRefs.has(e.name));
    const nodes = new Set<string>();
    for (const e of elements) for (const n of elementNodes(e)) nodes.add(n);
    nodes.delete("0");
    const leaks: Element[] = [...nodes].map((n) => ({ kind: "R", name: `Rleak_${n}`, a: n, b: "0", ohms: 1e9 }));
    return { title: build.solver.title, elements: [...elements, ...leaks] };
  });

  const ctx: Context = {
    circuit,
    config,
    band,
    report: {
      rails: railReports,
      bases: baseReports,
      addRail: (rail) => railReports.push(rail),
      addBase: (base) => baseReports.push(base),
      devices: () => deviceTable(op().op),
    },
    ground: () => [...groundNets],
    isGround,
    rails: () => railSurvey().rails,
    rail: (net) => railByNet().get(net),
    unresolvedRails: () => railSurvey().unresolved,
    isSupply,
    part: (ref) => index.part(ref),
    partsOn: (net) => index.partsOn(net),
    netOf: (ref, role) => {
      const part = index.part(ref);
      return part ? netOfRole(part, role) : undefined;
    },
    devices,
    stages,
    stage: (ref) => stages().find((s) => s.ref === ref),
    stacks,
    groundingCapacitors: (net) => groundingCapacitors(net, index, acTest),
    supplyPath: (net) => pathToSupply(net, index, acTest),
    railLoads: (rail) => railLoads().get(rail) ?? [],
    dcNetwork: (net) => dcNeighbourhood(net, index, isSupply),

    bias(ref, role) {
      const key = `${ref}:${role}`;
      if (biasCache.has(key)) return biasCache.get(key);
      const value = computeBias(ref, role);
      biasCache.set(key, value);
      return value;
    },

    solver: solverBuild,
    solverProblem: () => {
      const b = built();
      return b.ok ? undefined : b.problem;
    },
    operatingPoint: () => op().op,
    operatingPointProblem: () => op().problem,
    operatingPointWith(overrides) {
      const keys = Object.keys(overrides).sort(naturalCompare);
      const key = keys.map((k) => `${k}=${overrides[k]}`).join(";");
      if (overrideCache.has(key)) return overrideCache.get(key);
      const build = solverBuild();
      let result: OperatingPoint | undefined;
      if (build) {
        const elements = build.solver.elements.map((e): Element => {
          const ohms = overrides[e.name];
          return e.kind === "R" && ohms !== undefined ? { ...e, ohms } : e;
        });
        const solved = solveDc({ title: build.solver.title, elements });
        result = solved.converged ? solved : undefined;
      }
      overrideCache.set(key, result);
      return result;
    },
    voltage(net) {
      const build = solverBuild();
      const point = op().op;
      if (!build || !point) return undefined;
      if (groundNets.has(net)) return 0;
      const node = build.nodeOfNet[net];
      return node === undefined ? undefined : point.nodeVoltages[node];
    },
    device(ref, channel) {
      const devices = op().op?.devices;
      if (!devices) return undefined;
      if (channel !== undefined) return devices[`${ref}.${channel}`];
      return devices[ref] ?? devices[`${ref}.g1`];
    },
    rating: (ref) => solverBuild()?.ratings[ref],
    saturationEdge(ref, channel) {
      const device = ctx.device(ref, channel);
      if (!device) return undefined;
      const name = channel !== undefined ? `${ref}.${channel}` : op().op?.devices[ref] ? ref : `${ref}.g1`;
      return saturationEdge(device, cardOf(solverBuild()?.solver.elements ?? [], name), ctx.rating(ref));
    },
    dissipation(ref) {
      const part = index.part(ref);
      const point = op().op;
      return part && point ? partDissipation(part, point, (net) => ctx.voltage(net)) : undefined;
    },
    resistorPowerRating(ref, fallbackWatts) {
      const part = index.part(ref);
      return part?.kind === "resistor" ? resistorPowerRating(part, fallbackWatts) : undefined;
    },
    unmodelled: () => solverBuild()?.unmodelled ?? [],

    impedance(net, frequencies, options) {
      const network = whatIf(options, frequencies);
      const node = ctx.nodeOf(net);
      if (!network || node === undefined) return undefined;
      const point = options.passiveOnly ? null : op().op;
      if (point === undefined) return undefined;
      return impedanceAt(network, point, node, [...frequencies], options.passiveOnly);
    },
    impedanceBetween(a, b, frequencies, options) {
      const network = whatIf(options, frequencies);
      const nodeA = ctx.nodeOf(a);
      const nodeB = ctx.nodeOf(b);
      if (!network || nodeA === undefined || nodeB === undefined) return undefined;
      const point = options.passiveOnly ? null : op().op;
      if (point === undefined) return undefined;
      return impedanceBetweenAt(network, point, nodeA, nodeB, [...frequencies], options.passiveOnly);
    },
    transfer(input, output, frequencies) {
      const build = solverBuild();
      const point = op().op;
      const a = ctx.nodeOf(input);
      const b = ctx.nodeOf(output);
      if (!build || !point || a === undefined || b === undefined) return undefined;
      return transferAt(build.solver, point, a, b, [...frequencies]);
    },
    frequencies: (perDecade = 40) => logGrid(band.low / 10, band.high * 10, perDecade, [band.low, band.high]),
    capacitor(ref) {
      if (capacitorCache.has(ref)) return capacitorCache.get(ref);
      const part = index.part(ref);
      const model = part ? capacitorModel(part) : undefined;
      capacitorCache.set(ref, model);
      return model;
    },
    capacitorLike(ref, farads) {
      const template = ref === undefined ? undefined : index.part(ref);
      return capacitorModel(hypotheticalCapacitor(template, farads));
    },
    seriesValues: (series, from, to) => seriesBetween(series, from, to),
    snapUp(value, series) {
      const candidates = seriesBetween(series, value / 10, value * 10);
      return candidates.find((v) => v >= value * (1 - 1e-9)) ?? value;
    },
    snapNearest(value, series) {
      const candidates = seriesBetween(series, value / 10, value * 10);
      let best = value;
      let bestDistance = Number.POSITIVE_INFINITY;
      for (const v of candidates) {
        const d = Math.abs(Math.log(v / value));
        if (d < bestDistance) {
          best = v;
          bestDistance = d;
        }
      }
      return best;
    },
    nodeOf(net) {
      if (groundNets.has(net)) return "0";
      return solverBuild()?.nodeOfNet[net];
    },
    thermalVoltage,

    noteLimited(rule, reason, parts = []) {
      const same = limitations.find((l) => l.rule === rule && l.reason === reason);
      if (same) {
        for (const p of parts) if (!same.parts.includes(p)) same.parts.push(p);
      } else limitations.push({ rule, reason, parts: [...parts] });
    },
    limitations: () => limitations,
  };

  /** The network for an impedance question, with the asked-for parts removed, shorted or added. */
  function whatIf(options: ImpedanceOptions, frequencies: readonly number[]): SolverCircuit | undefined {
    const base = options.passiveOnly ? acNetwork() : solverBuild()?.solver;
    if (!base) return undefined;
    const nothingChanged = !options.without?.length && !options.shorted?.length && !options.extra?.length;
    // The unchanged network is the very object the operating point was solved for: no re-solve.
    if (nothingChanged) return base;
    const without = new Set(options.without ?? []);
    const shorted = new Set(options.shorted ?? []);
    const lowest = Math.min(...frequencies);
    // 1 mΩ of reactance at the lowest frequency asked: a short for every practical purpose, while
    // the DC solution (capacitors open) stays the one the operating point was found for.
    const shortFarads = 1e3 / (2 * Math.PI * (Number.isFinite(lowest) && lowest > 0 ? lowest : 1));
    const elements: Element[] = [];
    for (const e of base.elements) {
      if (without.has(e.name)) continue;
      if (e.kind === "C" && shorted.has(e.name)) elements.push({ kind: "C", name: e.name, a: e.a, b: e.b, farads: shortFarads });
      else elements.push(e);
    }
    elements.push(...(options.extra ?? []));
    const changed: SolverCircuit = { title: base.title, elements };
    // Taking a part out can leave a node with no DC path; the small-signal analysis re-solves the
    // operating point of the changed network, so it needs the same leaks.
    return options.passiveOnly ? changed : withDcLeaks(changed).circuit;
  }

  /** Thevenin by two DC solves of the network with the transistors taken out: open-circuit voltage,
   * then the voltage change for a small test current (exact for a resistive network). */
  function computeBias(ref: string, role: string): BiasThevenin | undefined {
    const part = index.part(ref);
    const net = part ? netOfRole(part, role) : undefined;
    if (!part || net === undefined) return undefined;
    const neighbourhood = dcNeighbourhood(net, index, isSupply);
    const partsInvolved = neighbourhood.parts.map((p) => p.ref).sort(naturalCompare);
    if (groundNets.has(net)) return { volts: 0, ohms: 0, parts: [] };
    const reachesSupply = neighbourhood.nets.some((n) => isSupply(n)) ||
      neighbourhood.nets.some((n) => index.partsOn(n).some(({ part: p }) => p.kind === "battery" || p.kind === "voltage-source"));
    if (!reachesSupply) return { volts: Number.NaN, ohms: Number.POSITIVE_INFINITY, parts: partsInvolved };
    const build = solverBuild();
    const node = build?.nodeOfNet[net];
    if (!build || node === undefined) return undefined;
    const elements = build.solver.elements.filter((e) => !isTransistorElement(e));
    const open = solveDc({ title: build.solver.title, elements });
    const testAmps = 1e-6;
    const probe: Element = { kind: "I", name: "Iprobe_bias", pos: "0", neg: node, dc: testAmps };
    const loaded = solveDc({ title: build.solver.title, elements: [...elements, probe] });
    const v0 = open.nodeVoltages[node];
    const v1 = loaded.nodeVoltages[node];
    if (!open.converged || !loaded.converged || v0 === undefined || v1 === undefined) return undefined;
    return { volts: v0, ohms: (v1 - v0) / testAmps, parts: partsInvolved };
  }

  return ctx;
}

/** Transistors are removed from a bias network; diodes stay (a diode string is part of the bias). */
function isTransistorElement(e: Element): boolean {
  return e.kind === "Q" || e.kind === "J" || e.kind === "M";
}

function elementNodes(e: Element): string[] {
  switch (e.kind) {
    case "R": case "C": case "L": return [e.a, e.b];
    case "V": case "I": return [e.pos, e.neg];
    case "D": return [e.anode, e.cathode];
    case "Q": return [e.c, e.b, e.e];
    case "J": return [e.d, e.g, e.s];
    case "M": return [e.d, e.g, e.s, e.b];
  }
}

/** A load's size: a resistor's ohms; a choke's reactance at the band's low edge. */
function loadOhms(part: Part, lowHertz: number): number | undefined {
  const value = part.parsed.number;
  if (value === undefined || !(value > 0)) return undefined;
  if (part.kind === "resistor") return value;
  if (part.kind === "inductor") return 2 * Math.PI * lowHertz * value;
  return undefined;
}

/** The circuit with a 1 GΩ leak to ground on every node that has no DC path (see diagnoseTopology). */
function withDcLeaks(circuit: SolverCircuit): { circuit: SolverCircuit; nodes: string[] } {
  const nodes = [...new Set(diagnoseTopology(circuit).filter((p) => p.kind === "no-dc-path").flatMap((p) => p.nodes))].filter((n) => n !== "0");
  if (nodes.length === 0) return { circuit, nodes };
  const leaks: Element[] = nodes.map((n) => ({ kind: "R", name: `Rleak_${n}`, a: n, b: "0", ohms: 1e9 }));
  return { circuit: { title: circuit.title, elements: [...circuit.elements, ...leaks] }, nodes };
}

/** A capacitor part like `template` (same footprint, fields, kind) but of another value. */
function hypotheticalCapacitor(template: Part | undefined, farads: number): Part {
  const base: Part = template ?? {
    ref: "Cnew", value: "", kind: "capacitor", libId: "Device:C", footprint: "Capacitor_SMD:C_0603_1608Metric",
    pins: {}, pinNames: {}, roles: { "1": "1", "2": "2" }, fields: {}, dnp: false, excludedFromSim: false,
    parsed: { text: "" }, origin: { file: "", line: 0, column: 0, sheetPath: "/" },
  };
  const fields = { ...base.fields };
  // Fields that pin the original part's own figures do not carry over to another value.
  for (const key of Object.keys(fields)) if (/^(esr|esl|srf)$/i.test(key)) delete fields[key];
  return { ...base, ref: "Cnew", value: "", fields, parsed: { ...base.parsed, text: "", number: farads } };
}

/** Every member of an IEC 60063 series between two values (inclusive), ascending. */
function seriesBetween(series: ESeriesName, from: number, to: number): number[] {
  const decade = seriesDecade(series);
  const out: number[] = [];
  const first = Math.floor(Math.log10(from)) - 1;
  const last = Math.ceil(Math.log10(to)) + 1;
  for (let exponent = first; exponent <= last; exponent++) {
    for (const mantissa of decade) {
      const v = Number((mantissa * 10 ** exponent).toPrecision(4));
      if (v >= from * (1 - 1e-9) && v <= to * (1 + 1e-9)) out.push(v);
    }
  }
  return out;
}

/** Log-spaced points from `from` to `to` inclusive, `perDecade` per decade, plus `include` points. */
export function logGrid(from: number, to: number, perDecade: number, include: readonly number[] = []): number[] {
  const decades = Math.log10(to / from);
  const steps = Math.max(1, Math.ceil(decades * perDecade));
  const points: number[] = [];
  for (let i = 0; i <= steps; i++) points.push(from * 10 ** ((decades * i) / steps));
  for (const f of include) if (f >= from && f <= to) points.push(f);
  points.sort((a, b) => a - b);
  // Drop near-duplicates (an included edge that falls on a grid point).
  return points.filter((f, i) => i === 0 || f / (points[i - 1] ?? f) > 1 + 1e-9);
}

/** The figures a bench builder reads off a Q-point table, per device kind (the solver reports more:
 * internal junction voltages, every conductance, which would only crowd the table). */
const TABLE_FIGURES: Record<DeviceOperatingPoint["kind"], readonly string[]> = {
  bjt: ["vbe", "vce", "ic", "ib", "power", "gm", "cpi", "cmu"],
  jfet: ["vgs", "vds", "id", "power", "gm", "gds", "cgs", "cgd"],
  mosfet: ["vgs", "vds", "id", "vth", "power", "gm", "gds", "cgs", "cgd"],
  diode: ["vd", "id", "power"],
};

function deviceTable(point: OperatingPoint | undefined): DeviceReport[] {
  if (!point) return [];
  return Object.entries(point.devices)
    .sort(([a], [b]) => naturalCompare(a, b))
    .map(([ref, d]) => {
      const figures: Record<string, number> = {};
      const all = d as unknown as Record<string, unknown>;
      for (const k of TABLE_FIGURES[d.kind]) {
        const v = all[k];
        if (typeof v === "number" && Number.isFinite(v)) figures[k] = v;
      }
      return { ref, type: d.kind === "diode" ? "diode" : d.type, region: d.region, figures };
    });
}
