// What a placed symbol is in one sheet instance: reference, unit and (v6) value come from the
// instance data, not from the symbol's own properties (KiCad format notes §10.3, §14): v7+ files keep
// them inside each symbol under the sheet path `/rootuuid/sheetuuid…`; v6 files keep them in the
// root's `symbol_instances` under `/sheetuuid…/symboluuid`; missing entries fall back to the
// 7.0-dev `default_instance`, then to the symbol's own fields.
import type { TextSpan } from "../../circuit/types.js";
import type { SheetInstance } from "./hierarchy.js";
import type { InstanceData, PlacedSymbol, SheetData } from "./sheet-data.js";

export interface ResolvedSymbol {
  sym: PlacedSymbol;
  reference: string;
  unit: number;
  value: string;
  valueSpan?: TextSpan;
  footprint: string;
  dnp: boolean;
  excludeFromSim: boolean;
  onBoard: boolean;
}

const sheetPathKeys = new WeakMap<SheetInstance, { v7: string; v6Prefix: string }>();

/** The instance's path keys: `/rootuuid/sheetuuid…` (v7+) and `/sheetuuid…/` (v6, + symbol uuid). */
function pathKeys(inst: SheetInstance, root: SheetData): { v7: string; v6Prefix: string } {
  let keys = sheetPathKeys.get(inst);
  if (!keys) {
    keys = { v7: "/" + [root.uuid, ...inst.uuidPath].join("/"), v6Prefix: "/" + inst.uuidPath.map((u) => `${u}/`).join("") };
    sheetPathKeys.set(inst, keys);
  }
  return keys;
}

export function resolveSymbol(sym: PlacedSymbol, inst: SheetInstance, root: SheetData): ResolvedSymbol {
  const keys = pathKeys(inst, root);
  // Which file holds the instance data matters for the Value span a fix will edit.
  let data: InstanceData | undefined = sym.instances.size > 0 ? sym.instances.get(keys.v7) : undefined;
  let dataFile = inst.sheet.file;
  if (!data) {
    data = root.symbolInstances.size > 0 ? root.symbolInstances.get(keys.v6Prefix + sym.uuid) : undefined;
    dataFile = root.file;
  }
  if (!data) {
    data = sym.defaultInstance;
    dataFile = inst.sheet.file;
  }
  const out: ResolvedSymbol = {
    sym,
    reference: data?.reference ?? sym.reference,
    unit: data?.unit ?? sym.unit,
    value: sym.value,
    footprint: data?.footprint !== undefined && data.footprint !== "" ? data.footprint : sym.footprint,
    dnp: sym.dnp || inst.dnp,
    excludeFromSim: sym.excludeFromSim || inst.excludeFromSim,
    onBoard: sym.onBoard && inst.onBoard,
  };
  if (sym.valueSpan) out.valueSpan = { file: inst.sheet.file, ...sym.valueSpan };
  // A per-instance value (v6, early 7.0-dev) overrides the symbol's own; a fix must edit it there.
  if (data?.value !== undefined && data.value !== "" && data !== sym.defaultInstance) {
    out.value = data.value;
    if (data.valueSpan) out.valueSpan = { file: dataFile, ...data.valueSpan };
  }
  return out;
}
