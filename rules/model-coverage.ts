/**
 * model-coverage — one note per design saying what could not be analysed and which checks that
 * limited.
 *
 * ## What it checks
 * Collects the parts the solver could not model (no model for a part number, an unreadable value, a
 * kind the solver does not know), a DC operating point that could not be built or did not converge,
 * and every limitation the other rules recorded while they ran ("no operating point for Q3: the base
 * impedance limit could not be computed"). When anything is on the list it is reported as one note.
 *
 * ## Why it matters
 * A clean report means something only when every part was in the analysis. A transistor without a
 * model drops out of the operating point, so the checks that need its bias say nothing about it;
 * this note makes that silence visible instead of letting it pass for a pass.
 *
 * ## Example
 * A board with a dual-gate MOSFET whose part number is not in the built-in library and no
 * `.model` card gets: "Not analysed: Q4 (no model for 'BF999'); limited: base-ac-ground (no
 * operating point for Q4)". Adding the card in a model library clears it.
 *
 * ## References
 * Model cards and their parameters: the SPICE conventions (Berkeley SPICE, ngspice manual).
 */
import type { Context } from "../src/engine/context.js";
import type { Rule } from "../src/engine/rule.js";
import type { RuleDoc } from "../src/engine/types.js";
import { finding } from "./support.js";

const ID = "model-coverage";

const doc: RuleDoc = {
  what:
    "Lists, as one note per design, the parts the solver could not model (no model for a part number, an unreadable value, a kind it does not know), power nets whose voltage nothing states, a DC operating point that could not be built or did not converge, and every limitation the other rules recorded while they ran.",
  why:
    "A clean report means something only when every part was in the analysis. A transistor without a model drops out of the operating point, and the checks that need its bias say nothing about it; this note makes that silence visible instead of letting it pass for a pass.",
  fix:
    "Give the part a value the reader understands, a part number from the built-in library, or a SPICE .model card (a Sim.Library field on the symbol, or \"models\" in loadline.json).",
  references: ["Model cards and parameter names: the SPICE conventions (Berkeley SPICE, ngspice manual)"],
  example:
    "A dual-gate MOSFET with an unknown part number and no .model card: \"Not analysed: Q4 (no model for 'BF999'); limited: base-ac-ground (no operating point for Q4)\".",
};

export const modelCoverage: Rule<Context> = {
  id: ID,
  title: "Every part is in the analysis, or the report says what is not",
  severity: "note",
  doc,
  options: {},
  tags: ["models"],
  check(ctx) {
    const unmodelled = ctx.unmodelled();
    const limitations = ctx.limitations().filter((l) => l.rule !== ID);
    const solverProblem = ctx.solverProblem();
    const opProblem = solverProblem === undefined ? ctx.operatingPointProblem() : undefined;
    const unpowered = ctx.unresolvedRails();
    if (unmodelled.length === 0 && limitations.length === 0 && solverProblem === undefined && opProblem === undefined && unpowered.length === 0) return [];

    const sentences: string[] = [];
    if (solverProblem !== undefined) sentences.push(`The design could not be turned into a circuit to solve: ${solverProblem}.`);
    if (opProblem !== undefined) sentences.push(`The DC operating point could not be found: ${opProblem}.`);
    if (unpowered.length > 0) {
      sentences.push(`No voltage known for ${unpowered.join(", ")}: the operating point solves ${unpowered.length === 1 ? "it as an ordinary net, powered only through what connects it" : "them as ordinary nets, powered only through what connects them"} to a rail; if ${unpowered.length === 1 ? "it is a supply, give it" : "they are supplies, give each"} a voltage under "rails" in loadline.json (e.g. "rails": { "${unpowered[0] ?? "VCC"}": "9V" }).`);
    }
    if (unmodelled.length > 0) sentences.push(`Not analysed: ${unmodelled.map((u) => `${u.ref} (${u.reason})`).join("; ")}.`);
    if (limitations.length > 0) {
      const byRule = new Map<string, string[]>();
      for (const l of limitations) byRule.set(l.rule, [...(byRule.get(l.rule) ?? []), l.reason]);
      sentences.push(`Checks limited: ${[...byRule].map(([rule, reasons]) => `${rule} (${[...new Set(reasons)].join("; ")})`).join("; ")}.`);
    }
    const parts = [...new Set([...unmodelled.map((u) => u.ref), ...limitations.flatMap((l) => l.parts)])]
      .sort((a, b) => a.localeCompare(b, "en", { numeric: true }));
    const first = parts.map((ref) => ctx.part(ref)).find((p) => p !== undefined);
    return [finding(ctx, ID, {
      at: first,
      severity: "note",
      message: sentences.join(" "),
      parts,
      nets: [],
      data: {
        unmodelled: unmodelled.map((u) => u.ref),
        limitedRules: [...new Set(limitations.map((l) => l.rule))],
        operatingPoint: solverProblem === undefined && opProblem === undefined,
        unresolvedRails: unpowered,
      },
    })];
  },
};
