// The `lib_symbols` section: embedded copies of the library symbols a sheet uses, reduced to what
// connectivity needs (pins with unit/body style, power flag, properties). KiCad format notes §5.
import type { ReadNote } from "../../circuit/types.js";
import { argNumber, argText, childOf, childrenOf, flagOf, keywordOf, where, type SList } from "../sexpr.js";
import { inRange, toGrid } from "./geometry.js";
import type { LibPin, LibSymbol } from "./sheet-data.js";
import { fieldText } from "./versions.js";
import { unescapeKicad } from "./escapes.js";

const SUB_SYMBOL_SUFFIX = /_(\d+)_(\d+)$/;

export function extractLibSymbols(section: SList, version: number, file: string, notes: ReadNote[]): Map<string, LibSymbol> {
  const lib = new Map<string, LibSymbol>();
  for (const sym of childrenOf(section, "symbol")) {
    const rawId = argText(sym, 1);
    if (rawId === undefined) {
      const p = where(sym);
      notes.push({ file, line: p.line, column: p.column, message: "library symbol without a name; ignored" });
      continue;
    }
    lib.set(unescapeKicad(rawId), readLibSymbol(sym, unescapeKicad(rawId), version, file, notes));
  }
  resolveDerived(lib, file, notes);
  return lib;
}

function readLibSymbol(sym: SList, id: string, version: number, file: string, notes: ReadNote[]): LibSymbol {
  const powerList = childOf(sym, "power");
  const power = powerList ? (argText(powerList, 1) === "local" ? "local" : "global") : undefined;
  const properties: Record<string, string> = {};
  for (const prop of childrenOf(sym, "property")) {
    const name = argText(prop, 1);
    const value = argText(prop, 2);
    if (name !== undefined && value !== undefined) properties[name] = fieldText(value, version);
  }
  const pins: LibPin[] = [];
  let unitCount = 1;
  for (const pin of childrenOf(sym, "pin")) {
    const p = readPin(pin, 0, 0, version, file, notes);
    if (p) pins.push(p);
  }
  for (const sub of childrenOf(sym, "symbol")) {
    const m = SUB_SYMBOL_SUFFIX.exec(argText(sub, 1) ?? "");
    const unit = m ? Number(m[1]) : 0;
    const style = m ? Number(m[2]) : 0;
    if (!m) {
      const p = where(sub);
      notes.push({ file, line: p.line, column: p.column,
        message: `sub-symbol "${argText(sub, 1) ?? ""}" of ${id} does not end in _UNIT_STYLE; its pins are treated as common to all units` });
    }
    unitCount = Math.max(unitCount, unit);
    for (const pin of childrenOf(sub, "pin")) {
      const p = readPin(pin, unit, style, version, file, notes);
      if (p) pins.push(p);
    }
  }
  const extendsName = argText(childOf(sym, "extends"), 1);
  const out: LibSymbol = { id, power, pins, unitCount, properties };
  if (extendsName !== undefined) out.extendsName = extendsName;
  return out;
}

function readPin(pin: SList, unit: number, style: number, version: number, file: string, notes: ReadNote[]): LibPin | undefined {
  const at = childOf(pin, "at");
  const px = argNumber(at, 1);
  const py = argNumber(at, 2);
  if (px === undefined || py === undefined || !inRange(toGrid(px)) || !inRange(toGrid(py))) {
    const p = where(pin);
    notes.push({ file, line: p.line, column: p.column, message: "library pin without a readable (at x y) position; ignored" });
    return undefined;
  }
  const rawType = argText(pin, 1) ?? "unspecified";
  const alternates = new Map<string, string>();
  for (const alt of childrenOf(pin, "alternate")) {
    const name = argText(alt, 1);
    if (name !== undefined) alternates.set(name, normaliseType(argText(alt, 2) ?? rawType));
  }
  return {
    number: fieldText(argText(childOf(pin, "number"), 1) ?? "", version),
    name: fieldText(argText(childOf(pin, "name"), 1) ?? "", version),
    type: normaliseType(keywordOf(pin) === "pin" ? rawType : "unspecified"),
    x: toGrid(px),
    y: toGrid(py),
    unit,
    style,
    hidden: flagOf(pin, "hide") === true,
    alternates,
  };
}

function normaliseType(t: string): string {
  return t === "unconnected" ? "no_connect" : t;
}

/** Derived symbols (`extends`) take their parent's pins and units; their own properties win. */
function resolveDerived(lib: Map<string, LibSymbol>, file: string, notes: ReadNote[]): void {
  const resolving = new Set<string>();
  const resolve = (sym: LibSymbol): void => {
    if (sym.extendsName === undefined) return;
    if (resolving.has(sym.id)) {
      notes.push({ file, line: 0, column: 0, message: `library symbol ${sym.id} extends itself through its parents; inheritance ignored` });
      delete sym.extendsName;
      return;
    }
    const prefix = sym.id.includes(":") ? sym.id.slice(0, sym.id.indexOf(":") + 1) : "";
    const parent = lib.get(prefix + sym.extendsName) ?? lib.get(sym.extendsName);
    if (!parent) {
      notes.push({ file, line: 0, column: 0, message: `library symbol ${sym.id} extends "${sym.extendsName}", which is not embedded; it keeps only its own pins` });
      delete sym.extendsName;
      return;
    }
    resolving.add(sym.id);
    resolve(parent);
    resolving.delete(sym.id);
    if (sym.pins.length === 0) {
      sym.pins = parent.pins;
      sym.unitCount = parent.unitCount;
    }
    sym.power ??= parent.power;
    sym.properties = { ...parent.properties, ...sym.properties };
    delete sym.extendsName;
  };
  for (const sym of lib.values()) resolve(sym);
}
