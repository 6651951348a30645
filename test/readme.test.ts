// The README's generated sections (rule table, commands, limits, the demo run) must match what the
// code produces now; regenerate with `node scripts/run-ts.mjs scripts/readme.ts`.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { renderReadme } from "../scripts/readme.js";

describe("README", () => {
  it("is current with the rules, commands, limits and the demo run", () => {
    const readme = readFileSync(new URL("../README.md", import.meta.url), "utf8");
    expect(renderReadme(readme)).toBe(readme);
  });

  it("gives exactly two set-up commands in its quick start: the demo and the tests", () => {
    const readme = readFileSync(new URL("../README.md", import.meta.url), "utf8");
    const quick = readme.slice(readme.indexOf("## Quick start"), readme.indexOf("## ", readme.indexOf("## Quick start") + 3));
    const commands = [...quick.matchAll(/^npm .*$/gm)].map((m) => m[0].replace(/\s+#.*$/, ""));
    expect(commands).toEqual(["npm ci && npm run demo", "npm ci && npm test"]);
  });
});
