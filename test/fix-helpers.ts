// Shared by the fix tests: copies of the fixture boards in a temporary folder, and a stand-in rule
// that asks for given values (the e-series rule decides *which* value; these tests are about how a
// decided value gets into the file).
import { cpSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { formatValueLike } from "../src/circuit/value.js";
import type { Context } from "../src/engine/context.js";
import type { Rule } from "../src/engine/rule.js";
import type { TextSpan } from "../src/circuit/types.js";
import type { Finding } from "../src/engine/types.js";

export const FIXTURES = join(import.meta.dirname, "..", "fixtures", "fix");

/** A fresh copy of fixtures/fix in a temporary folder; `done()` removes it. */
export function copyFixtures(): { dir: string; done: () => void } {
  const dir = mkdtempSync(join(tmpdir(), "loadline-fix-"));
  cpSync(FIXTURES, dir, { recursive: true });
  return { dir, done: () => rmSync(dir, { recursive: true, force: true }) };
}

/** What a wish asks for: a value in SI units (written like the part's current value) or exact text. */
export type Wish = number | string;

/**
 * A rule that asks each named part for a value, with a fix edit on the part's Value span. It stops
 * asking once the part has the value, as a real rule would once the value is right. `extraSpans`
 * adds fixes on spans no part carries (a power symbol's Value, for the net-change test).
 */
export function wishRule(wants: Record<string, Wish>, options: { id?: string; extra?: { span: TextSpan; replacement: string }[] } = {}): Rule<Context> {
  const id = options.id ?? "value-wish";
  return {
    id,
    title: "Test stand-in: move parts to wanted values",
    severity: "warning",
    doc: { what: "test", why: "test", fix: "test", references: [] },
    options: {},
    check(ctx) {
      const out: Finding[] = [];
      for (const part of ctx.circuit.parts) {
        const wish = wants[part.ref];
        if (wish === undefined || part.valueSpan === undefined) continue;
        const replacement = typeof wish === "number" ? formatValueLike(wish, part.kind, part.parsed) : wish;
        if (part.value === replacement) continue;
        out.push({
          rule: id, severity: "warning", message: `${part.ref} should be ${replacement}`, parts: [part.ref], nets: [],
          file: part.origin.file, line: part.origin.line, column: part.origin.column, sheetPath: part.origin.sheetPath, data: {},
          fix: { span: part.valueSpan, replacement, description: `${part.ref} ${part.value} -> ${replacement}` },
        });
      }
      for (const extra of options.extra ?? []) {
        out.push({
          rule: id, severity: "warning", message: `extra edit in ${extra.span.file}`, parts: [], nets: [], file: ctx.circuit.file, line: 1, column: 1,
          sheetPath: "/", data: {}, fix: { span: extra.span, replacement: extra.replacement, description: "extra edit" },
        });
      }
      return out;
    },
  };
}

/** A rule that reports any resistor whose value text is one of `values` (to show a fix bringing a new finding). */
export function forbidRule(values: string[]): Rule<Context> {
  return {
    id: "value-forbid",
    title: "Test stand-in: values that must not appear",
    severity: "error",
    doc: { what: "test", why: "test", fix: "test", references: [] },
    options: {},
    check(ctx) {
      return ctx.circuit.parts
        .filter((p) => values.includes(p.value))
        .map((p) => ({
          rule: "value-forbid", severity: "error" as const, message: `${p.ref} must not be ${p.value}`, parts: [p.ref], nets: [],
          file: p.origin.file, line: p.origin.line, column: p.origin.column, sheetPath: p.origin.sheetPath, data: {},
        }));
    },
  };
}
