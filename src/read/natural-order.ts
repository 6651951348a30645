// Natural order for references, pin numbers and net names: digit runs compare as numbers, so R2
// comes before R10 and MXA9 before MXA10 (the order KiCad's netlist uses). Ties fall back to plain
// code-point order so the result is total and deterministic.

const CHUNK = /(\d+|\D+)/g;

export function naturalCompare(a: string, b: string): number {
  if (a === b) return 0;
  const ca = a.match(CHUNK) ?? [];
  const cb = b.match(CHUNK) ?? [];
  const n = Math.min(ca.length, cb.length);
  for (let i = 0; i < n; i++) {
    const x = ca[i] ?? "";
    const y = cb[i] ?? "";
    if (x === y) continue;
    const dx = x.charCodeAt(0) >= 48 && x.charCodeAt(0) <= 57;
    const dy = y.charCodeAt(0) >= 48 && y.charCodeAt(0) <= 57;
    if (dx && dy) {
      const nx = x.replace(/^0+(?=\d)/, "");
      const ny = y.replace(/^0+(?=\d)/, "");
      if (nx.length !== ny.length) return nx.length - ny.length;
      if (nx !== ny) return nx < ny ? -1 : 1;
      continue; // equal numbers written with different zero padding: decided below
    }
    return x < y ? -1 : 1;
  }
  if (ca.length !== cb.length) return ca.length - cb.length;
  return a < b ? -1 : 1;
}

export function comparePins(a: { ref: string; pin: string }, b: { ref: string; pin: string }): number {
  return naturalCompare(a.ref, b.ref) || naturalCompare(a.pin, b.pin);
}
