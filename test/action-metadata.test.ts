// action.yml against the entry point and GitHub's metadata rules (docs, "Metadata syntax for GitHub
// Actions"): ids start with a letter or "_", JavaScript actions run on node20 or node24, boolean
// inputs need a default because getBooleanInput throws on an empty value (@actions/core 3.0.1).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";

const repo = new URL("..", import.meta.url).pathname;
const yml = readFileSync(`${repo}action.yml`, "utf8");
const entry = readFileSync(`${repo}src/action/index.ts`, "utf8");

/** Two-space-indented keys of a top-level section (the file is plain, hand-written YAML). */
function sectionKeys(section: string): Map<string, string> {
  const start = yml.indexOf(`\n${section}:\n`);
  if (start < 0) return new Map();
  const body = yml.slice(start + section.length + 3);
  const end = body.search(/\n[a-z]/);
  const text = end < 0 ? body : body.slice(0, end);
  const keys = new Map<string, string>();
  let current = "";
  for (const line of text.split("\n")) {
    const key = /^ {2}([A-Za-z_][A-Za-z0-9_-]*):\s*$/.exec(line);
    if (key) {
      current = key[1] ?? "";
      keys.set(current, "");
    } else if (current) keys.set(current, `${keys.get(current) ?? ""}${line}\n`);
  }
  return keys;
}

describe("action.yml", () => {
  const inputs = sectionKeys("inputs");
  const outputs = sectionKeys("outputs");

  it("declares exactly the inputs the entry point reads, each described", () => {
    const read = new Set([...entry.matchAll(/(?:getInput|getMultilineInput|booleanInput)\("([a-z-]+)"/g)].map((m) => m[1]));
    expect(new Set(inputs.keys())).toEqual(read);
    for (const body of inputs.values()) expect(body).toMatch(/description: \S/);
  });

  it("declares exactly the outputs the entry point sets", () => {
    const set = new Set([...entry.matchAll(/setOutput\("([a-z-]+)"/g)].map((m) => m[1]));
    expect(new Set(outputs.keys())).toEqual(set);
  });

  it("gives boolean inputs a default and runs the bundle on node24", () => {
    for (const name of ["annotations", "summary"]) expect(inputs.get(name)).toMatch(/default: "(true|false)"/);
    expect(inputs.get("fail-on")).toContain("default: error");
    expect(inputs.get("paths")).toContain('default: "."');
    expect(yml).toMatch(/\nruns:\n {2}using: node24\n {2}main: dist\/index\.js\n/);
    expect(yml).toMatch(/^name: loadline$/m);
  });
});
