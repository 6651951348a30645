// Runs the rules over one design's context: severity and options from the config, each rule
// isolated so a bug in one cannot stop the others (it becomes a problem in the report instead).
import type { Finding, Severity } from "./types.js";
import type { Rule } from "./rule.js";
import { resolveRuleOptions } from "./rule.js";
import type { Config } from "./config.js";
import type { RunProblem } from "./result.js";

/** The severity a rule runs at under a config, or "off". */
export function ruleLevel(rule: Pick<Rule, "id" | "severity">, config: Pick<Config, "rules">): Severity | "off" {
  return config.rules[rule.id]?.severity ?? rule.severity;
}

export interface RunOutcome {
  findings: Finding[];
  problems: RunProblem[];
}

/**
 * Calls each enabled rule's `check` with its resolved options. A severity set in the config replaces
 * the severity of every finding of that rule; otherwise a rule's own choice per finding stands.
 * `where` names the design for problems raised by a failing rule.
 */
export function runRules<Ctx>(rules: readonly Rule<Ctx>[], ctx: Ctx, config: Pick<Config, "rules">, where: string): RunOutcome {
  const findings: Finding[] = [];
  const problems: RunProblem[] = [];
  for (const rule of rules) {
    const level = ruleLevel(rule, config);
    if (level === "off") continue;
    const configured = config.rules[rule.id];
    const options = resolveRuleOptions(rule, configured?.options);
    let produced: Finding[];
    try {
      produced = rule.check(ctx, options);
    } catch (err) {
      const message = err instanceof Error ? err.message : String(err);
      problems.push({
        file: where,
        line: 0,
        column: 0,
        message: `rule '${rule.id}' stopped with an internal error (a bug in loadline, please report it): ${message}`,
      });
      continue;
    }
    for (const finding of produced) {
      findings.push({
        ...finding,
        rule: rule.id,
        severity: configured?.severity !== undefined ? level : finding.severity,
      });
    }
  }
  return { findings, problems };
}
