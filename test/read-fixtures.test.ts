// Every fixture board: the nets read from its .kicad_sch and from its .net are the same partition of
// pins, and carry the same names wherever the design names them. The .net files and
// expected-nets.json were written by the fixture author from the intended connectivity, not by this
// reader, so they are an outside check on geometry, hierarchy and naming.
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import type { Circuit } from "../src/circuit/types.js";
import { nodeFileSource, readDesign } from "../src/read/index.js";

const FIXTURES = fileURLToPath(new URL("../fixtures/", import.meta.url));

interface ExpectedNets {
  nets: { name: string; named: boolean; pins: string[] }[];
}

const boards = existsSync(FIXTURES)
  ? readdirSync(FIXTURES).filter((d) => ["kicad_sch", "net"].every((ext) => existsSync(join(FIXTURES, d, `${d}.${ext}`))))
  : [];

function read(path: string): Circuit {
  const r = readDesign(path, { fs: nodeFileSource() });
  if (!r.ok) throw new Error(`${r.error.file}:${r.error.line}:${r.error.column}: ${r.error.message}`);
  return r.circuit;
}

/** Net name keyed by its sorted pin list: the partition with names attached. */
function partition(c: Circuit): Map<string, string> {
  return new Map(c.nets.map((n) => [n.pins.map((p) => `${p.ref}.${p.pin}`).sort().join(" "), n.name]));
}

describe("fixture boards: schematic and netlist agree", () => {
  it("there are fixture boards to compare", () => {
    expect(boards.length).toBeGreaterThanOrEqual(1);
  });

  for (const board of boards) {
    describe(board, () => {
      const sch = read(join(FIXTURES, board, `${board}.kicad_sch`));
      const net = read(join(FIXTURES, board, `${board}.net`));
      const expected = JSON.parse(readFileSync(join(FIXTURES, board, "expected-nets.json"), "utf8")) as ExpectedNets;
      const fromSch = partition(sch);
      const fromNet = partition(net);
      const wanted = new Map(expected.nets.map((n) => [[...n.pins].sort().join(" "), n]));

      it("the schematic's nets are the netlist's partition of pins", () => {
        expect([...fromSch.keys()].sort()).toEqual([...fromNet.keys()].sort());
        expect([...fromSch.keys()].sort()).toEqual([...wanted.keys()].sort());
      });

      it("named nets carry the same names in both", () => {
        for (const [pins, n] of wanted) {
          if (!n.named) continue;
          expect({ pins, name: fromSch.get(pins) }).toEqual({ pins, name: n.name });
          expect({ pins, name: fromNet.get(pins) }).toEqual({ pins, name: n.name });
        }
      });

      it("every part of the netlist is a part of the schematic with the same value", () => {
        const values = (c: Circuit) => Object.fromEntries(c.parts.map((p) => [p.ref, p.value]));
        expect(values(sch)).toEqual(values(net));
      });
    });
  }
});
