// A rule's documentation in the shapes its readers need: plain text (terminal, SARIF help.text) and
// Markdown (SARIF help.markdown, README table). One source — the rule file's `doc` — so they agree.
import type { RuleInfo } from "./rule.js";
import type { RuleOption } from "./types.js";

export function formatOptionDefault(option: RuleOption): string {
  const value = Array.isArray(option.default) ? option.default.join(", ") : String(option.default);
  if (typeof option.default === "number" && option.unit) return `${value} ${option.unit}`;
  return value;
}

export function ruleHelpText(rule: RuleInfo): string {
  const lines = [`${rule.id}: ${rule.title} (default severity: ${rule.severity})`, "", "What it checks", rule.doc.what, "", "Why it matters", rule.doc.why, "", "What to do", rule.doc.fix];
  const options = Object.entries(rule.options);
  if (options.length > 0) {
    lines.push("", "Options");
    for (const [name, option] of options) {
      const choices = option.enum ? ` (one of ${option.enum.join(", ")})` : "";
      lines.push(`  ${name} (${option.type}, default ${formatOptionDefault(option)})${choices}: ${option.description}`);
    }
  }
  if (rule.doc.references.length > 0) {
    lines.push("", "References");
    for (const ref of rule.doc.references) lines.push(`  - ${ref}`);
  }
  lines.push("", `Suppress on one part with the symbol field  loadline-ignore = "${rule.id}: <reason>"`);
  return lines.join("\n");
}

/** Markdown-escape text written by people (rule docs are ours, but keep tables and emphasis intact). */
function md(text: string): string {
  return text.replace(/[\\`*_[\]<>|]/g, (c) => `\\${c}`);
}

export function ruleHelpMarkdown(rule: RuleInfo): string {
  const parts = [
    `**${md(rule.title)}** (\`${rule.id}\`, default severity: ${rule.severity})`,
    "",
    "## What it checks",
    md(rule.doc.what),
    "",
    "## Why it matters",
    md(rule.doc.why),
    "",
    "## What to do",
    md(rule.doc.fix),
  ];
  const options = Object.entries(rule.options);
  if (options.length > 0) {
    parts.push("", "## Options", "", "| option | type | default | meaning |", "|---|---|---|---|");
    for (const [name, option] of options) {
      const choices = option.enum ? ` One of ${option.enum.map((e) => `\`${e}\``).join(", ")}.` : "";
      parts.push(`| \`${name}\` | ${option.type} | ${md(formatOptionDefault(option))} | ${md(option.description)}${choices} |`);
    }
  }
  if (rule.doc.references.length > 0) {
    parts.push("", "## References", ...rule.doc.references.map((r) => `- ${md(r)}`));
  }
  parts.push("", `Suppress on one part with the symbol field \`loadline-ignore\` = \`${rule.id}: <reason>\`.`);
  return parts.join("\n");
}
