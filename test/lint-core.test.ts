// The lint() core on in-memory files: config found beside the design, rule severities and
// options, suppressions, a design that cannot be read, a rule that throws. The rules here are
// test doubles; the real rules have their own tests against independent figures.
import { describe, expect, it } from "vitest";
import { lint } from "../src/engine/lint.js";
import { memoryPathLister } from "../src/engine/expand.js";
import type { Context } from "../src/engine/context.js";
import type { Rule } from "../src/engine/rule.js";
import { memoryFileSource } from "../src/read/index.js";
import { kicadNetlist } from "../fixtures/rules/netlist-writer.js";

const doc = { what: "w", why: "y", fix: "f", references: [] };

/** One note per resistor, naming it: enough to see severities, options and suppressions at work. */
const perResistor: Rule<Context> = {
  id: "test-per-resistor",
  title: "One finding per resistor",
  severity: "warning",
  doc,
  options: { word: { type: "string", default: "resistor", description: "the word used" } },
  check(ctx, options) {
    return ctx.circuit.parts.filter((p) => p.kind === "resistor").map((p) => ({
      rule: "test-per-resistor", severity: "warning" as const, message: `${String(options.word)} ${p.ref}`,
      parts: [p.ref], nets: [], file: p.origin.file, line: p.origin.line, column: p.origin.column, sheetPath: "/", data: {},
    }));
  },
};

const throwing: Rule<Context> = {
  id: "test-throws",
  title: "Always fails",
  severity: "warning",
  doc,
  options: {},
  check() {
    throw new Error("deliberate");
  },
};

const divider = kicadNetlist("divider", ["R1 +9V mid 10k", "R2 mid GND 10k loadline-ignore=test-per-resistor:matched-pair"]);

describe("lint()", () => {
  it("runs rules over a design held in memory, with the config found beside it", () => {
    const files = {
      "/boards/a/divider.net": divider,
      "/boards/a/loadline.json": JSON.stringify({ rules: { "test-per-resistor": { severity: "error", options: { word: "part" } } } }),
    };
    const result = lint({ paths: ["/boards"], fs: memoryFileSource(files), lister: memoryPathLister(Object.keys(files)), rules: [perResistor] });
    expect(result.errors ?? []).toEqual([]);
    expect(result.designs).toHaveLength(1);
    const findings = result.designs[0]?.findings ?? [];
    expect(findings.map((f) => [f.message, f.severity, f.suppressed?.reason])).toEqual([
      ["part R1", "error", undefined],
      ["part R2", "error", "matched-pair"],
    ]);
  });

  it("records an unreadable design and goes on with the others", () => {
    const files = { "/b/good.net": divider, "/b/bad.net": "(export (version \"E\") (components (comp (ref \"R1\")" };
    const result = lint({ paths: ["/b/bad.net", "/b/good.net"], fs: memoryFileSource(files), rules: [perResistor] });
    const bad = result.designs.find((d) => d.file.endsWith("bad.net"));
    const good = result.designs.find((d) => d.file.endsWith("good.net"));
    expect(bad?.errors[0]?.file).toContain("bad.net");
    expect(bad?.errors[0]?.line).toBeGreaterThan(0);
    expect(good?.findings).toHaveLength(2);
  });

  it("turns a rule that throws into an error finding naming the rule", () => {
    const result = lint({ paths: ["/c/divider.net"], fs: memoryFileSource({ "/c/divider.net": divider }), rules: [throwing, perResistor] });
    const findings = result.designs[0]?.findings ?? [];
    const failure = findings.find((f) => f.rule === "test-throws");
    expect(failure?.severity).toBe("error");
    expect(failure?.message).toContain("test-throws");
    expect(failure?.message).toContain("deliberate");
    expect(findings.filter((f) => f.rule === "test-per-resistor")).toHaveLength(2);
  });

  it("reports a bad config with its position and checks nothing under it", () => {
    const files = { "/d/divider.net": divider, "/d/loadline.json": '{\n  "bnad": {}\n}' };
    const result = lint({ paths: ["/d/divider.net"], fs: memoryFileSource(files), rules: [perResistor] });
    expect(result.errors?.[0]).toMatchObject({ file: "/d/loadline.json", line: 2 });
    expect(result.errors?.[0]?.message).toContain("did you mean 'band'");
  });

  it("skips what the config's ignore globs cover when a folder is expanded", () => {
    const files = {
      "/e/loadline.json": JSON.stringify({ ignore: ["old/**"] }),
      "/e/new/divider.net": divider,
      "/e/old/divider.net": divider,
    };
    const result = lint({ paths: ["/e"], fs: memoryFileSource(files), lister: memoryPathLister(Object.keys(files)), rules: [perResistor] });
    expect(result.designs.map((d) => d.file)).toEqual(["/e/new/divider.net"]);
  });
});
