// Property: for random value edits on every fixture board, the edited files read back to the same
// nets (same partition, same names), the same parts with exactly the new values, and only the
// intended bytes differ. "Only the intended bytes" is checked with the reader's spans in the *new*
// file, not with the offset arithmetic under test: the bytes between consecutive value tokens must
// be identical before and after.
import { readdirSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Circuit, Part, TextSpan } from "../src/circuit/types.js";
import { applyEditsToBytes } from "../src/fix/apply.js";
import { spanKey } from "../src/fix/plan.js";
import { overlaySource } from "../src/fix/sources.js";
import { netDifference, partDifference } from "../src/fix/verify.js";
import { findRootSheets, nodeFileSource, readDesign } from "../src/read/index.js";

const FIXTURE_ROOT = join(import.meta.dirname, "..", "fixtures");

function schematicsUnder(dir: string, depth = 0): string[] {
  if (depth > 8) return [];
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return schematicsUnder(path, depth + 1);
    return name.endsWith(".kicad_sch") ? [path] : [];
  });
}

interface Board {
  root: string;
  circuit: Circuit;
  /** One entry per distinct Value span, with every part that holds it. */
  spans: { span: TextSpan; holders: Part[] }[];
}

function boards(): Board[] {
  const fs = nodeFileSource();
  const out: Board[] = [];
  // Each folder of fixtures is its own project: find the roots folder by folder.
  const byFolder = new Map<string, string[]>();
  for (const file of schematicsUnder(FIXTURE_ROOT)) {
    const folder = join(file, "..");
    byFolder.set(folder, [...(byFolder.get(folder) ?? []), file]);
  }
  for (const files of byFolder.values()) {
    for (const root of findRootSheets(files, fs).roots) {
      const read = readDesign(root, { fs });
      if (!read.ok) continue; // boards meant to fail reading are other tests' business
      const groups = new Map<string, { span: TextSpan; holders: Part[] }>();
      for (const part of read.circuit.parts) {
        if (part.valueSpan === undefined) continue;
        const group = groups.get(spanKey(part.valueSpan)) ?? { span: part.valueSpan, holders: [] };
        group.holders.push(part);
        groups.set(spanKey(part.valueSpan), group);
      }
      if (groups.size > 0) out.push({ root, circuit: read.circuit, spans: [...groups.values()] });
    }
  }
  return out;
}

// Value text as people write it, plus the characters that need escaping and non-ASCII ones.
const valueText = fc.string({
  unit: fc.constantFrom("0", "1", "4", "7", ".", "k", "K", "M", "R", "n", "u", "µ", "p", "F", "Ω", " ", "%", '"', "\\", "V", "é"),
  minLength: 1,
  maxLength: 10,
});

const found = boards();

describe("random value edits on fixture boards", () => {
  it("finds the fixture boards (our own fix boards at least)", () => {
    const names = found.map((b) => relative(FIXTURE_ROOT, b.root));
    expect(names).toEqual(expect.arrayContaining(["fix/divider-crlf.kicad_sch", "fix/two-channel/receiver.kicad_sch"]));
  });

  for (const board of found) {
    it(`${relative(FIXTURE_ROOT, board.root)}: same nets, exact values, only the value bytes differ`, () => {
      const base = nodeFileSource();
      fc.assert(
        fc.property(
          fc.uniqueArray(fc.nat({ max: board.spans.length - 1 }), { minLength: 1, maxLength: Math.min(6, board.spans.length) }),
          fc.array(valueText, { minLength: 6, maxLength: 6 }),
          (picks, values) => {
            const chosen = picks.map((index, i) => ({ group: board.spans[index] as { span: TextSpan; holders: Part[] }, value: values[i] ?? "1k" }));
            // Apply per file.
            const byFile = new Map<string, typeof chosen>();
            for (const c of chosen) byFile.set(c.group.span.file, [...(byFile.get(c.group.span.file) ?? []), c]);
            const replaced = new Map<string, Buffer>();
            const originals = new Map<string, Buffer>();
            for (const [file, edits] of byFile) {
              const real = base.realpath(file);
              const original = base.read(file);
              if (typeof real !== "string" || !Buffer.isBuffer(original)) throw new Error(`cannot read ${file}`);
              const applied = applyEditsToBytes(original, edits.map((e) => ({ span: e.group.span, replacement: e.value })));
              if (!applied.ok) throw new Error(applied.problem);
              replaced.set(real, applied.bytes);
              originals.set(file, original);
            }
            const after = readDesign(board.root, { fs: overlaySource(base, replaced) });
            expect(after.ok).toBe(true);
            if (!after.ok) return;
            expect(netDifference(board.circuit, after.circuit)).toBeUndefined();
            const expected = chosen.flatMap((c) => c.group.holders.map((h) => ({ ref: h.ref, value: c.value })));
            expect(partDifference(board.circuit, after.circuit, expected)).toBeUndefined();

            // Byte check with the new file's own spans.
            const newParts = new Map(after.circuit.parts.map((p) => [p.ref, p]));
            for (const [file, edits] of byFile) {
              const oldBytes = originals.get(file) as Buffer;
              const newBytes = replaced.get(base.realpath(file) as string) as Buffer;
              const oldSpans = edits.map((e) => e.group.span).sort((a, b) => a.start - b.start);
              const newSpans = edits
                .map((e) => newParts.get(e.group.holders[0]?.ref ?? "")?.valueSpan)
                .filter((s): s is TextSpan => s !== undefined)
                .sort((a, b) => a.start - b.start);
              expect(newSpans).toHaveLength(oldSpans.length);
              expect(gaps(oldBytes, oldSpans)).toEqual(gaps(newBytes, newSpans));
            }
          },
        ),
        { numRuns: 25 },
      );
    });
  }
});

/** The byte runs between (and around) the spans, as hex, so a difference prints legibly. */
function gaps(bytes: Buffer, spans: readonly TextSpan[]): string[] {
  const text = bytes.toString("utf8");
  const out: string[] = [];
  let cursor = 0;
  for (const span of spans) {
    out.push(Buffer.from(text.slice(cursor, span.start), "utf8").toString("hex"));
    cursor = span.end;
  }
  out.push(Buffer.from(text.slice(cursor), "utf8").toString("hex"));
  return out;
}
