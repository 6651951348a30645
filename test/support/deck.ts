// Test support: reads the small subset of SPICE netlist syntax our reference decks use and
// builds the SolverCircuit the deck describes, so the test and ngspice always run the same
// circuit. Not product code: it throws on anything outside the subset.
//
// Subset: title line, `*` comments, `+` continuations, R C L V I D Q J M elements, `.model`
// cards, `.op`, `.ac dec|lin N f1 f2`; `.options`, `.save`, `.control … .endc` and `.end` are
// skipped. Names and nodes are lower-cased, as ngspice writes them in its rawfile.

import type { Element, ModelCard, ModelType, SolverCircuit } from "../../src/solve/netlist.js";

export interface DeckAnalyses {
  op: boolean;
  ac?: { sweep: "dec" | "lin"; points: number; fStart: number; fStop: number };
}

export interface Deck {
  title: string;
  circuit: SolverCircuit;
  analyses: DeckAnalyses;
}

const SUFFIX: Record<string, number> = { f: 1e-15, p: 1e-12, n: 1e-9, u: 1e-6, m: 1e-3, k: 1e3, g: 1e9, t: 1e12 };

/** SPICE number: 4.7k, 10u, 1Meg, 25mil, 6.734f, 1e-15; trailing unit letters ignored. */
export function spiceNumber(text: string, where: string): number {
  const m = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)(meg|mil|[fpnumkgt])?[a-z]*$/i.exec(text.trim());
  if (!m) throw new Error(`${where}: "${text}" is not a SPICE number`);
  const base = Number(m[1]);
  const suffix = (m[2] ?? "").toLowerCase();
  if (suffix === "meg") return base * 1e6;
  if (suffix === "mil") return base * 25.4e-6;
  return suffix ? base * (SUFFIX[suffix] ?? 1) : base;
}

const MODEL_TYPES: Record<string, ModelType> = { d: "D", npn: "NPN", pnp: "PNP", njf: "NJF", pjf: "PJF", nmos: "NMOS", pmos: "PMOS" };

function parseModel(body: string, where: string, source: string): ModelCard {
  // .model NAME TYPE(P=V P=V …) or .model NAME TYPE P=V …
  const m = /^\.model\s+(\S+)\s+([a-z]+)\s*\(?(.*?)\)?\s*$/i.exec(body);
  if (!m) throw new Error(`${where}: cannot read .model card`);
  const type = MODEL_TYPES[(m[2] ?? "").toLowerCase()];
  if (!type) throw new Error(`${where}: model type ${m[2]} is outside the test subset`);
  const params: Record<string, number> = {};
  const pairs = (m[3] ?? "").replace(/\s*=\s*/g, "=").split(/[\s,]+/).filter(Boolean);
  for (const pair of pairs) {
    const [key, value] = pair.split("=");
    if (!key || value === undefined) throw new Error(`${where}: expected NAME=VALUE, got "${pair}"`);
    params[key.toUpperCase()] = spiceNumber(value, where);
  }
  return { name: (m[1] ?? "").toLowerCase(), type, params, source };
}

interface PendingDevice {
  build: (models: Map<string, ModelCard>) => Element;
}

/** Reads `VALUE`, `DC VALUE`, `AC MAG` groups of a source line. */
function sourceValues(tokens: string[], where: string): { dc: number; ac?: number } {
  let dc = 0;
  let ac: number | undefined;
  for (let i = 0; i < tokens.length; i++) {
    const t = (tokens[i] ?? "").toLowerCase();
    if (t === "dc") dc = spiceNumber(tokens[++i] ?? "", where);
    else if (t === "ac") {
      ac = spiceNumber(tokens[++i] ?? "", where);
      if (tokens[i + 1] !== undefined && /^[\d.+-]/.test(tokens[i + 1] ?? "")) i++; // phase
    } else if (i === 0) dc = spiceNumber(t, where);
    else throw new Error(`${where}: unexpected "${tokens[i]}" on a source line`);
  }
  return ac === undefined ? { dc } : { dc, ac };
}

export function parseDeck(text: string, fileName: string): Deck {
  const rawLines = text.split(/\r?\n/);
  const title = (rawLines[0] ?? "").replace(/^\*\s*/, "").trim();
  // Logical lines with their first physical line number, continuations joined.
  const lines: Array<{ line: number; text: string }> = [];
  let inControl = false;
  rawLines.slice(1).forEach((raw, i) => {
    const stripped = raw.replace(/;.*$/, "").trim();
    if (stripped === "" || stripped.startsWith("*")) return;
    const lower = stripped.toLowerCase();
    if (lower.startsWith(".control")) { inControl = true; return; }
    if (lower.startsWith(".endc")) { inControl = false; return; }
    if (inControl) return;
    if (stripped.startsWith("+")) {
      const last = lines[lines.length - 1];
      if (!last) throw new Error(`${fileName}:${i + 2}: continuation line with nothing to continue`);
      last.text += ` ${stripped.slice(1).trim()}`;
      return;
    }
    lines.push({ line: i + 2, text: stripped });
  });

  const models = new Map<string, ModelCard>();
  const pending: PendingDevice[] = [];
  const analyses: DeckAnalyses = { op: false };
  const source = `ngspice reference deck ${fileName}`;

  for (const { line, text: body } of lines) {
    const where = `${fileName}:${line}`;
    const tokens = body.split(/\s+/);
    const head = (tokens[0] ?? "").toLowerCase();
    if (head.startsWith(".")) {
      if (head === ".model") {
        const card = parseModel(body, where, source);
        models.set(card.name, card);
      } else if (head === ".op") analyses.op = true;
      else if (head === ".ac") {
        const sweep = (tokens[1] ?? "").toLowerCase();
        if (sweep !== "dec" && sweep !== "lin") throw new Error(`${where}: only .ac dec/lin are in the subset`);
        analyses.ac = {
          sweep,
          points: spiceNumber(tokens[2] ?? "", where),
          fStart: spiceNumber(tokens[3] ?? "", where),
          fStop: spiceNumber(tokens[4] ?? "", where),
        };
      } else if (head === ".temp") {
        throw new Error(`${where}: the solver runs at 27 °C only; remove .temp`);
      } else if (![".options", ".option", ".save", ".end"].includes(head)) {
        throw new Error(`${where}: directive ${head} is outside the test subset`);
      }
      continue;
    }
    const name = head;
    const nodes = tokens.slice(1).map((t) => t.toLowerCase());
    const need = (count: number): void => {
      if (tokens.length < count + 1) throw new Error(`${where}: ${name} needs ${count} fields`);
    };
    const model = (modelName: string) => (ms: Map<string, ModelCard>): ModelCard => {
      const card = ms.get(modelName.toLowerCase());
      if (!card) throw new Error(`${where}: model ${modelName} is not defined`);
      return card;
    };
    const value = (i: number): number => spiceNumber(tokens[i] ?? "", where);
    const n = (i: number): string => nodes[i - 1] ?? "";
    switch (name[0]) {
      case "r": need(3); pending.push({ build: () => ({ kind: "R", name, a: n(1), b: n(2), ohms: value(3) }) }); break;
      case "c": need(3); pending.push({ build: () => ({ kind: "C", name, a: n(1), b: n(2), farads: value(3) }) }); break;
      case "l": need(3); pending.push({ build: () => ({ kind: "L", name, a: n(1), b: n(2), henries: value(3) }) }); break;
      case "v": {
        need(2);
        const v = sourceValues(tokens.slice(3), where);
        pending.push({ build: () => ({ kind: "V", name, pos: n(1), neg: n(2), ...v }) });
        break;
      }
      case "i": {
        need(2);
        const v = sourceValues(tokens.slice(3), where);
        pending.push({ build: () => ({ kind: "I", name, pos: n(1), neg: n(2), ...v }) });
        break;
      }
      case "d": {
        need(3);
        const m = model(tokens[3] ?? "");
        const area = tokens[4] !== undefined ? value(4) : undefined;
        pending.push({ build: (ms) => ({ kind: "D", name, anode: n(1), cathode: n(2), model: m(ms), ...(area !== undefined ? { area } : {}) }) });
        break;
      }
      case "q": {
        need(4);
        const m = model(tokens[4] ?? "");
        const area = tokens[5] !== undefined ? value(5) : undefined;
        pending.push({ build: (ms) => ({ kind: "Q", name, c: n(1), b: n(2), e: n(3), model: m(ms), ...(area !== undefined ? { area } : {}) }) });
        break;
      }
      case "j": {
        need(4);
        const m = model(tokens[4] ?? "");
        const area = tokens[5] !== undefined ? value(5) : undefined;
        pending.push({ build: (ms) => ({ kind: "J", name, d: n(1), g: n(2), s: n(3), model: m(ms), ...(area !== undefined ? { area } : {}) }) });
        break;
      }
      case "m": {
        need(5);
        const m = model(tokens[5] ?? "");
        const geometry: { w?: number; l?: number } = {};
        for (const t of tokens.slice(6)) {
          const [k, v] = t.split("=");
          if (!k || v === undefined) throw new Error(`${where}: expected W=… or L=…, got "${t}"`);
          if (k.toLowerCase() === "w") geometry.w = spiceNumber(v, where);
          else if (k.toLowerCase() === "l") geometry.l = spiceNumber(v, where);
          else throw new Error(`${where}: MOSFET instance parameter ${k} is outside the test subset`);
        }
        pending.push({ build: (ms) => ({ kind: "M", name, d: n(1), g: n(2), s: n(3), b: n(4), model: m(ms), ...geometry }) });
        break;
      }
      default:
        throw new Error(`${where}: element ${tokens[0]} is outside the test subset`);
    }
  }
  return { title, circuit: { title: fileName, elements: pending.map((p) => p.build(models)) }, analyses };
}
