// `loadline rules` lists every rule with its default severity; `loadline rules ID` explains one:
// what it checks, why, what to do, its options and references — the same text SARIF help carries.
import type { Command } from "commander";
import { allRules } from "../../rules/index.js";
import type { RuleInfo } from "../engine/rule.js";
import { ruleHelpText } from "../engine/rule-doc.js";
import { editDistance } from "../engine/config.js";
import type { Colors } from "../report/colors.js";
import { createColors } from "../report/colors.js";

export function formatRuleList(rules: readonly RuleInfo[], c: Colors): string {
  const width = Math.max(4, ...rules.map((r) => r.id.length));
  const lines = [c.bold(`${"rule".padEnd(width)}  ${"default".padEnd(7)}  title`)];
  for (const rule of [...rules].sort((a, b) => (a.id < b.id ? -1 : 1))) {
    lines.push(`${c.magenta(rule.id.padEnd(width))}  ${rule.severity.padEnd(7)}  ${rule.title}`);
  }
  lines.push("", c.dim("`loadline rules ID` explains one; set severities and options under \"rules\" in loadline.json."));
  return `${lines.join("\n")}\n`;
}

export function explainRule(rules: readonly RuleInfo[], id: string): { ok: true; text: string } | { ok: false; message: string } {
  const rule = rules.find((r) => r.id === id);
  if (rule) return { ok: true, text: `${ruleHelpText(rule)}\n` };
  const near = rules.map((r) => r.id).filter((known) => editDistance(id, known) <= 2);
  const hint = near.length > 0 ? ` (did you mean ${near.map((n) => `'${n}'`).join(" or ")}?)` : "";
  return { ok: false, message: `unknown rule '${id}'${hint}; \`loadline rules\` lists them` };
}

export function register(program: Command): void {
  program
    .command("rules")
    .description("list the rules, or explain one")
    .argument("[id]", "a rule id")
    .option("--no-color", "plain text without colours")
    .action((id: string | undefined, opts: { color: boolean }) => {
      const colors = createColors(opts.color && process.stdout.isTTY === true && !process.env["NO_COLOR"]);
      if (id === undefined) {
        process.stdout.write(formatRuleList(allRules, colors));
        return;
      }
      const explained = explainRule(allRules, id);
      if (explained.ok) process.stdout.write(explained.text);
      else {
        process.stderr.write(`loadline: ${explained.message}\n`);
        process.exitCode = 2;
      }
    });
}
