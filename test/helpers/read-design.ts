// Reads inline test files through an in-memory file source and returns the circuit or the error.
import type { Circuit, Net, ReadError } from "../../src/circuit/types.js";
import { memoryFileSource, readDesign } from "../../src/read/index.js";

export function readMemory(files: Record<string, string | Buffer>, root: string, projectRoot?: string): Circuit {
  const r = readDesign(root, projectRoot !== undefined ? { fs: memoryFileSource(files), projectRoot } : { fs: memoryFileSource(files) });
  if (!r.ok) throw new Error(`read failed: ${r.error.file}:${r.error.line}:${r.error.column}: ${r.error.message}`);
  return r.circuit;
}

export function readError(files: Record<string, string | Buffer>, root: string, projectRoot?: string): ReadError {
  const r = readDesign(root, projectRoot !== undefined ? { fs: memoryFileSource(files), projectRoot } : { fs: memoryFileSource(files) });
  if (r.ok) throw new Error("expected the read to fail");
  return r.error;
}

/** The net a pin is on, by the Part's pin map. */
export function netOf(c: Circuit, ref: string, pin: string): string | undefined {
  return c.parts.find((p) => p.ref === ref)?.pins[pin];
}

export function net(c: Circuit, name: string): Net | undefined {
  return c.nets.find((n) => n.name === name);
}

/** Nets as "name: R1.1 R2.2" lines, for compact whole-design assertions. */
export function netLines(c: Circuit): string[] {
  return c.nets.map((n) => `${n.name}: ${n.pins.map((p) => `${p.ref}.${p.pin}`).join(" ")}`);
}
