// The netlist KiCad's schematic editor exports (`.net`, s-expression "KiCad" format, versions D and
// E; KiCad format notes §12) read into the same Circuit shape as a schematic. Membership and names
// are KiCad's own; there is no geometry, so origins point into the netlist file.
import type { Circuit, Net, NetPin, Part, ReadNote, ReadResult, SheetInstance } from "../circuit/types.js";
import type { FileSource } from "./file-source.js";
import { unescapeKicad } from "./kicad-sch/escapes.js";
import { isGroundName } from "./kicad-sch/net-names.js";
import { loadModelLibraries } from "./model-libraries.js";
import { buildPart, sortCircuit } from "./part-builder.js";
import { argText, childOf, childrenOf, textOf, where, type SexprTree, type SList } from "./sexpr.js";

/** Properties the exporter adds that are bookkeeping, not part fields. */
const BOOKKEEPING = new Set(["sheetname", "sheetfile", "ki_keywords", "ki_fp_filters", "ki_description", "ki_locked"]);
const FLAG_PROPERTIES = new Set(["dnp", "exclude_from_bom", "exclude_from_board", "exclude_from_sim"]);
const FALSE_TEXT = new Set(["", "0", "n", "no", "false", "off"]);

interface LibPart {
  names: Record<string, string>;
  types: Record<string, string>;
}

/** `(key "text")` child → text; `~` and absent are empty. */
function attr(list: SList | undefined, key: string): string {
  if (!list) return "";
  const t = argText(childOf(list, key), 1) ?? "";
  return t === "~" ? "" : t;
}

/** `(field (name "X") "text")` → text (absent text = empty). */
function fieldValue(field: SList): string {
  for (let i = 1; i < field.content.length; i++) {
    const t = textOf(field.content[i]);
    if (t !== undefined) return t === "~" ? "" : t;
  }
  return "";
}

export function readNetlistTree(tree: SexprTree, file: string, fs: FileSource, projectRoot: string): ReadResult {
  const root = tree.nodes[0];
  if (!root || root.type !== "list") {
    return { ok: false, error: { file, line: 1, column: 1, message: "not a KiCad netlist: expected \"(export\" at the start" } };
  }
  const notes: ReadNote[] = [];
  const version = argText(childOf(root, "version"), 1) ?? "";
  if (version !== "D" && version !== "E") {
    const p = where(childOf(root, "version") ?? root);
    notes.push({ file, line: p.line, column: p.column, message: `netlist version "${version}" is not D or E; reading it anyway` });
  }

  const libParts = new Map<string, LibPart>();
  const libSection = childOf(root, "libparts");
  for (const lp of libSection ? childrenOf(libSection, "libpart") : []) {
    const entry: LibPart = { names: {}, types: {} };
    const pins = childOf(lp, "pins");
    for (const pin of pins ? childrenOf(pins, "pin") : []) {
      const num = attr(pin, "num");
      if (num === "") continue;
      entry.names[num] = attr(pin, "name");
      entry.types[num] = attr(pin, "type");
    }
    libParts.set(`${attr(lp, "lib")}:${attr(lp, "part")}`, entry);
  }

  interface CompBuild { list: SList; ref: string; pins: Record<string, string>; pinNames: Record<string, string>; pinTypes: Record<string, string> }
  const comps = new Map<string, CompBuild>();
  const compSection = childOf(root, "components");
  for (const comp of compSection ? childrenOf(compSection, "comp") : []) {
    const ref = attr(comp, "ref");
    if (ref === "") {
      const p = where(comp);
      notes.push({ file, line: p.line, column: p.column, message: "component without a reference; ignored" });
      continue;
    }
    if (ref.startsWith("#")) continue;
    comps.set(ref, { list: comp, ref, pins: {}, pinNames: {}, pinTypes: {} });
  }

  const nets: Net[] = [];
  const netSection = childOf(root, "nets");
  const unknownRefs = new Set<string>();
  for (const net of netSection ? childrenOf(netSection, "net") : []) {
    const name = unescapeKicad(attr(net, "name"));
    const pins: NetPin[] = [];
    let noConnect = name.startsWith("unconnected-(");
    let powerPin = false;
    for (const node of childrenOf(net, "node")) {
      const ref = attr(node, "ref");
      const pin = attr(node, "pin");
      const pintype = attr(node, "pintype");
      if (pintype.includes("+no_connect") || pintype.startsWith("no_connect")) noConnect = true;
      if (pintype.startsWith("power_in") || pintype.startsWith("power_out")) powerPin = true;
      const comp = comps.get(ref);
      if (!comp) {
        if (!ref.startsWith("#") && !unknownRefs.has(ref)) {
          unknownRefs.add(ref);
          const p = where(node);
          notes.push({ file, line: p.line, column: p.column, ref, message: `net ${name} lists ${ref}, which is not among the components; ignored` });
        }
        continue;
      }
      comp.pins[pin] = name;
      const fn = attr(node, "pinfunction");
      if (fn !== "" && comp.pinNames[pin] === undefined) comp.pinNames[pin] = fn;
      if (pintype !== "" && comp.pinTypes[pin] === undefined) comp.pinTypes[pin] = pintype.replace("+no_connect", "");
      pins.push({ ref, pin });
    }
    if (pins.length === 0) continue;
    const globalName = !name.includes("/") && !name.startsWith("Net-(") && !name.startsWith("unconnected-(");
    const isGround = globalName && isGroundName(name);
    nets.push({
      name,
      aliases: [name],
      pins,
      isGround,
      // No power symbols in a netlist: a global name on a supply pin, or a rail-like name, is power (heuristic).
      isPower: isGround || (globalName && (powerPin || /^([+-]\d|V(CC|DD|EE|SS|BAT|IN)\b|\+)/i.test(name))),
      noConnect,
    });
  }

  const parts: Part[] = [];
  for (const c of comps.values()) parts.push(buildNetlistPart(c, libParts, file));
  const sheets: SheetInstance[] = [];
  const design = childOf(root, "design");
  for (const sheet of design ? childrenOf(design, "sheet") : []) {
    sheets.push({ path: unescapeKicad(attr(sheet, "name")), file: attr(childOf(sheet, "title_block"), "source") });
  }
  sortCircuit(parts, nets);
  const circuit: Circuit = {
    file,
    format: "kicad_net",
    version,
    parts,
    nets,
    sheets,
    notes,
    modelLibraries: loadModelLibraries(parts, fs, projectRoot, notes),
  };
  return { ok: true, circuit };

  function buildNetlistPart(c: CompBuild, libs: Map<string, LibPart>, netFile: string): Part {
    const comp = c.list;
    const libsource = childOf(comp, "libsource");
    const libId = libsource ? `${attr(libsource, "lib")}:${attr(libsource, "part")}` : "";
    const lib = libs.get(libId);
    const fields: Record<string, string> = {};
    const datasheet = attr(comp, "datasheet");
    if (datasheet !== "") fields["Datasheet"] = datasheet;
    const description = attr(comp, "description");
    if (description !== "") fields["Description"] = description;
    const fieldList = childOf(comp, "fields");
    for (const f of fieldList ? childrenOf(fieldList, "field") : []) {
      const n = attr(f, "name");
      if (n !== "" && n.toLowerCase() !== "footprint") fields[n] = fieldValue(f);
    }
    const flags = new Set<string>();
    for (const prop of childrenOf(comp, "property")) {
      const n = attr(prop, "name");
      const lower = n.toLowerCase();
      if (FLAG_PROPERTIES.has(lower)) { flags.add(lower); continue; }
      if (n === "" || BOOKKEEPING.has(lower) || fields[n] !== undefined) continue;
      fields[n] = attr(prop, "value");
    }
    const sheetPath = unescapeKicad(attr(childOf(comp, "sheetpath"), "names")) || "/";
    const fieldFlag = (names: string[], falseMeansSet: boolean): boolean => Object.entries(fields).some(([k, v]) =>
      names.includes(k.toLowerCase()) && (falseMeansSet ? FALSE_TEXT.has(v.trim().toLowerCase()) && v.trim() !== "" : !FALSE_TEXT.has(v.trim().toLowerCase())));
    const pinNames: Record<string, string> = {};
    const pinTypes: Record<string, string> = {};
    for (const pin of Object.keys(c.pins)) {
      pinNames[pin] = lib?.names[pin] ?? c.pinNames[pin] ?? "";
      pinTypes[pin] = lib?.types[pin] ?? c.pinTypes[pin] ?? "";
    }
    const p = where(comp);
    return buildPart({
      ref: c.ref,
      value: attr(comp, "value"),
      libId,
      footprint: attr(comp, "footprint"),
      pins: c.pins,
      pinNames,
      pinTypes,
      fields,
      dnp: flags.has("dnp") || fieldFlag(["dnp", "dnf"], false),
      excludedFromSim: flags.has("exclude_from_sim") || fieldFlag(["sim.enable", "spice_netlist_enabled"], true),
      origin: { file: netFile, line: p.line, column: p.column, sheetPath },
    });
  }
}
