// Runs lint() over one rule's fixture boards from disk and checks each against its expected.json.
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { lint } from "../../src/engine/lint.js";
import type { Finding } from "../../src/engine/types.js";
import { checkExpected, expectedBoards } from "./expectations.js";

export function lintBoard(path: string): { findings: Finding[]; result: ReturnType<typeof lint> } {
  const result = lint({ paths: [path] });
  expect(result.errors ?? [], `run errors for ${path}`).toEqual([]);
  const design = result.designs[0];
  expect(design?.errors ?? [], `design errors for ${path}`).toEqual([]);
  return { findings: design?.findings ?? [], result };
}

/** One test per board: its must and must-not findings, figures within their stated tolerances. */
export function describeRuleBoards(rule: string): void {
  const folder = resolve("fixtures/rules", rule);
  describe(`${rule} fixture boards (expected.json)`, () => {
    const boards = expectedBoards(folder);
    it("has boards that must trigger the rule and boards that must not", () => {
      expect(boards.some((b) => b.expected.must.some((m) => m.rule === rule))).toBe(true);
      expect(boards.some((b) => b.expected.mustNot.some((m) => m.rule === rule))).toBe(true);
    });
    for (const board of boards) {
      it(board.expected.board, () => {
        checkExpected(lintBoard(board.board).findings, board.expected);
      });
    }
  });
}
