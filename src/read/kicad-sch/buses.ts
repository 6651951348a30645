// Bus names and their member nets (KiCad format notes §9): vector buses `D[0..7]` → D0…D7,
// group buses `{SDA SCL}` / `I2C{SDA SCL}`, and bus aliases.

/** Widest bus expanded; a wider range is read as an ordinary name. */
export const MAX_BUS_MEMBERS = 4096;

export interface BusName {
  kind: "vector" | "group";
  /** Member net names in order (vector: by index, group: as listed). */
  members: string[];
}

const VECTOR = /^(.*?)\[(\d+)\.\.(\d+)\]$/;
const GROUP = /^([^{}\s]*)\{(.+)\}$/;

export function parseBusName(text: string, aliases: Map<string, string[]>, depth = 0): BusName | undefined {
  const v = VECTOR.exec(text);
  if (v) {
    const prefix = v[1] ?? "";
    let a = Number(v[2]);
    let b = Number(v[3]);
    if (a === b) return undefined; // `X[3..3]` is not a bus
    if (a > b) { const t = a; a = b; b = t; }
    if (b - a + 1 > MAX_BUS_MEMBERS || prefix.includes("[")) return undefined;
    const members: string[] = [];
    for (let i = a; i <= b; i++) members.push(prefix + String(i));
    return { kind: "vector", members };
  }
  const g = GROUP.exec(text);
  if (g && depth < 4) {
    const name = g[1] ?? "";
    const members: string[] = [];
    for (const part of (g[2] ?? "").split(/[\s,]+/).filter((s) => s !== "")) {
      const inner = parseBusName(part, aliases, depth + 1);
      const names = inner ? inner.members : [part];
      // With a group name the members are NAME.member (inference; KiCad format notes §9).
      for (const m of names) members.push(name === "" ? m : `${name}.${m}`);
      if (members.length > MAX_BUS_MEMBERS) return undefined;
    }
    return members.length > 0 ? { kind: "group", members } : undefined;
  }
  const alias = aliases.get(text);
  if (alias && depth < 4) {
    const members: string[] = [];
    for (const m of alias) {
      const inner = parseBusName(m, aliases, depth + 1);
      members.push(...(inner ? inner.members : [m]));
    }
    return members.length > 0 && members.length <= MAX_BUS_MEMBERS ? { kind: "group", members } : undefined;
  }
  return undefined;
}
