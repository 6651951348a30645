// `.model` cards from SPICE library text (a project's .lib, a Sim.Library file, the config's models).
// Case-insensitive; `+` continues a line, `*` starts a comment line, `;` / ` $ ` an inline comment.
// Parameters parenthesised or not, `NAME = value` with blanks allowed, SPICE number syntax.
// Read: D, NPN, PNP, NJF, PJF (level 1) and NMOS, PMOS at LEVEL=1 (Shichman–Hodges), and `.subckt`
// blocks (their element lines read by subckt-syntax.ts, expanded by subckt-expand.ts). Anything else
// (other levels, VDMOS, `.param`) is reported in `notes` or in the block's `problems`, never silently
// dropped.
import type { ModelCard, ModelType } from "./netlist.js";
import { parseSpiceNumber } from "../circuit/spice-number.js";
import { readSubcktHeader, readSubcktStatement, type SubcircuitDef } from "./subckt-syntax.js";

export interface CardNote {
  /** 1-based line of the statement in the text. */
  line: number;
  message: string;
}

export interface ParsedModels {
  models: ModelCard[];
  subcircuits: SubcircuitDef[];
  notes: CardNote[];
}

const SUPPORTED: Record<string, ModelType> = {
  D: "D",
  NPN: "NPN",
  PNP: "PNP",
  NJF: "NJF",
  PJF: "PJF",
  NMOS: "NMOS",
  PMOS: "PMOS",
};

/** Text-valued parameters some vendor cards carry (`mfg=Philips`, `type=silicon`): kept out quietly. */
const TEXT_PARAMS = new Set(["MFG", "TYPE", "ICRATING_UNIT", "VERSION"]);

interface Statement {
  line: number;
  text: string;
}

function stripInlineComment(line: string): string {
  let out = line;
  const semi = out.indexOf(";");
  if (semi >= 0) out = out.slice(0, semi);
  const dollar = out.search(/(^|\s)\$/);
  if (dollar >= 0) out = out.slice(0, dollar);
  return out;
}

/** Joins `+` continuations; drops comment and blank lines. */
function statements(text: string): Statement[] {
  const out: Statement[] = [];
  const lines = text.split(/\r\n|\r|\n/);
  lines.forEach((raw, i) => {
    const trimmed = raw.trim();
    if (trimmed === "" || trimmed.startsWith("*")) return;
    const body = stripInlineComment(trimmed).trim();
    if (body === "") return;
    if (body.startsWith("+")) {
      const last = out[out.length - 1];
      if (last) last.text += ` ${body.slice(1)}`;
      else out.push({ line: i + 1, text: body.slice(1) });
      return;
    }
    out.push({ line: i + 1, text: body });
  });
  return out;
}

/** `NPN(IS=1f BF = 200)` → words with `=` joined to its key: ["NPN", "IS=1f", "BF=200"]. */
function words(text: string): string[] {
  const spaced = text.replace(/[(),]/g, " ").replace(/\s*=\s*/g, "=");
  return spaced.split(/\s+/).filter((w) => w !== "");
}

function parseModelStatement(st: Statement, sourceName: string, notes: CardNote[]): ModelCard | undefined {
  const ws = words(st.text);
  const name = ws[1];
  let typeWord = ws[2];
  if (name === undefined || typeWord === undefined) {
    notes.push({ line: st.line, message: "a .model card needs a name and a type, as in '.model Q1 NPN(IS=1e-15 BF=100)'" });
    return undefined;
  }
  if (/^ako:/i.test(typeWord)) {
    notes.push({ line: st.line, message: `model ${name}: 'AKO' cards (a kind of another model) are not supported` });
    return undefined;
  }
  // `NPN(IS=…` with the parenthesis glued: words() already split it; a glued `NPN IS=` is fine too.
  typeWord = typeWord.toUpperCase();
  const type = SUPPORTED[typeWord];
  if (!type) {
    notes.push({ line: st.line, message: `model ${name}: type ${typeWord} is not supported (supported: D, NPN, PNP, NJF, PJF, NMOS and PMOS level 1)` });
    return undefined;
  }
  const params: Record<string, number> = {};
  for (const w of ws.slice(3)) {
    const eq = w.indexOf("=");
    if (eq <= 0) {
      notes.push({ line: st.line, message: `model ${name}: '${w}' is not a PARAMETER=value pair; ignored` });
      continue;
    }
    const key = w.slice(0, eq).toUpperCase();
    const raw = w.slice(eq + 1);
    const value = parseSpiceNumber(raw);
    if (value === undefined) {
      if (!TEXT_PARAMS.has(key)) notes.push({ line: st.line, message: `model ${name}: cannot read ${key}='${raw}' as a number; ignored` });
      continue;
    }
    params[key] = value;
  }
  const level = params.LEVEL;
  if (level !== undefined && level !== 1) {
    const what = type === "NMOS" || type === "PMOS" ? "only LEVEL=1 (Shichman–Hodges) MOSFETs are supported" : `only level 1 ${type} models are supported`;
    notes.push({ line: st.line, message: `model ${name}: LEVEL=${level}: ${what}` });
    return undefined;
  }
  return { name, type, params, source: `${sourceName}, line ${st.line}` };
}

/** Statements inside a `.subckt` block: element lines, `.model` cards (local to the block), and the
 * dot-cards we cannot honour there. */
class SubcktCollector {
  readonly def: SubcircuitDef;
  /** Depth of `.subckt` definitions written inside this one (not supported; skipped to their `.ends`). */
  private nested = 0;
  private readonly names = new Map<string, number>();

  constructor(st: Statement, sourceName: string, private readonly notes: CardNote[]) {
    const header = readSubcktHeader(st.text);
    this.def = { name: header.name, pins: header.pins, statements: [], models: [], problems: [], ignored: [], line: st.line, source: sourceName };
    if (header.problem) this.def.problems.push({ line: st.line, message: header.problem });
  }

  /** Takes one statement; true when it closed the block. */
  take(st: Statement, first: string): boolean {
    const def = this.def;
    if (this.nested > 0) {
      if (first === ".ends") this.nested--;
      else if (first === ".subckt") this.nested++;
      return false;
    }
    switch (first) {
      case ".ends":
        return true;
      case ".subckt":
        this.nested++;
        def.problems.push({ line: st.line, message: `a subcircuit defined inside subcircuit ${def.name} is not supported; define it at the top level` });
        return false;
      case ".model": {
        const card = parseModelStatement(st, def.source, this.notes);
        if (card) def.models.push(card);
        return false;
      }
      case ".param": case ".func": case ".include": case ".inc": case ".lib":
        def.problems.push({ line: st.line, message: `'${first}' inside subcircuit ${def.name} is not supported (parameters and expressions are not evaluated, other files are not read)` });
        return false;
      default:
        break;
    }
    if (first.startsWith(".")) {
      def.ignored.push({ line: st.line, message: `'${first}' inside subcircuit ${def.name} has no effect on the operating point or the small-signal sweep; ignored` });
      return false;
    }
    const read = readSubcktStatement(st.text, st.line);
    if ("problem" in read) {
      def.problems.push({ line: st.line, message: read.problem });
      return false;
    }
    const earlier = this.names.get(read.statement.name);
    if (earlier !== undefined) {
      def.problems.push({ line: st.line, message: `${read.statement.name} is defined again in subcircuit ${def.name} (first at line ${earlier})` });
      return false;
    }
    this.names.set(read.statement.name, st.line);
    def.statements.push(read.statement);
    for (const what of read.ignored) def.ignored.push({ line: st.line, message: `${read.statement.name}: ${what} ignored` });
    return false;
  }
}

/** Reads every `.model` card and `.subckt` block of a SPICE library text. `sourceName` says where the
 * text came from ("model library 'lib/rf.lib'"), and becomes each card's `source`. */
export function parseModelCards(text: string, sourceName = "model text"): ParsedModels {
  const models: ModelCard[] = [];
  const subcircuits: SubcircuitDef[] = [];
  const notes: CardNote[] = [];
  const seen = new Map<string, number>();
  const seenSubckt = new Map<string, number>();
  let open: SubcktCollector | undefined;
  for (const st of statements(text)) {
    const first = (st.text.split(/\s+/)[0] ?? "").toLowerCase();
    if (open) {
      if (!open.take(st, first)) continue;
      const def = open.def;
      open = undefined;
      const key = def.name.toUpperCase();
      const earlier = seenSubckt.get(key);
      if (earlier !== undefined) notes.push({ line: def.line, message: `subcircuit ${def.name} is defined again (first at line ${earlier}); the first is used` });
      else {
        seenSubckt.set(key, def.line);
        subcircuits.push(def);
      }
      continue;
    }
    switch (first) {
      case ".model": {
        const card = parseModelStatement(st, sourceName, notes);
        if (!card) break;
        const key = card.name.toUpperCase();
        const earlier = seen.get(key);
        if (earlier !== undefined) {
          notes.push({ line: st.line, message: `model ${card.name} is defined again (first at line ${earlier}); the first is used` });
          break;
        }
        seen.set(key, st.line);
        models.push(card);
        break;
      }
      case ".subckt":
        open = new SubcktCollector(st, sourceName, notes);
        break;
      case ".ends":
        notes.push({ line: st.line, message: "'.ends' without a '.subckt' before it; ignored" });
        break;
      case ".lib": case ".endl": case ".end": case ".title":
        break;
      case ".include": case ".inc": case ".param":
        notes.push({ line: st.line, message: `'${first}' is not followed; only .model cards and .subckt blocks in this text are read` });
        break;
      default:
        notes.push({ line: st.line, message: `'${st.text.slice(0, 40)}' is not a .model card or inside a .subckt block; ignored` });
    }
  }
  if (open) notes.push({ line: open.def.line, message: `subcircuit ${open.def.name} has no .ends; not used` });
  return { models, subcircuits, notes };
}

/** The card named `name`, compared case-insensitively as SPICE does. */
export function findModelCard(models: readonly ModelCard[], name: string): ModelCard | undefined {
  const want = name.trim().toUpperCase();
  return models.find((m) => m.name.toUpperCase() === want);
}
