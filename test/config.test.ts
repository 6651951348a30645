// loadline.json: values read with SI prefixes (BIPM SI Brochure, 9th ed., Table 7: k = 1e3, M = 1e6),
// every mistake reported with file:line:column, defaults recorded. Rule ids below are demo rules.
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";
import { Ajv } from "ajv";
import { defaultConfig, findConfigFile, formatConfigError, loadConfig, DEFAULTS } from "../src/engine/config.js";
import type { RuleInfo } from "../src/engine/rule.js";
import { resolveRuleOptions } from "../src/engine/rule.js";
import { memoryFileSource } from "../src/read/file-source.js";
import { allRules } from "../rules/index.js";

const RULES: RuleInfo[] = [
  {
    id: "rail-bypass", title: "demo", severity: "error", doc: { what: "", why: "", fix: "", references: [] },
    options: {
      maxOhms: { type: "number", default: "2.5 ohm", unit: "Ω", description: "demo limit" },
      margin: { type: "number", default: 2, description: "demo factor" },
      mode: { type: "string", default: "worst", enum: ["worst", "mean"], description: "demo" },
    },
  },
  { id: "e-series", title: "demo", severity: "note", doc: { what: "", why: "", fix: "", references: [] }, options: {} },
];

describe("loadConfig", () => {
  it("reads a full config with units (1.8 MHz = 1.8e6 Hz by the SI prefix M)", () => {
    const text = JSON.stringify({
      band: { low: "1.8MHz", high: "30 MHz" }, rails: { VCC: "12V", VEE: "-5 V" }, swing: "0.5V",
      rules: { "e-series": "off", "rail-bypass": { severity: "warning", options: { maxOhms: "1.5 Ω", mode: "mean" } } },
      ignore: ["legacy/**"], models: "models/demo.lib", series: { resistor: "E96", capacitorCheck: true },
    }, null, 2);
    const { config, errors } = loadConfig(text, "loadline.json", RULES);
    expect(errors).toEqual([]);
    expect(config.band.low).toBeCloseTo(1.8e6, 0);
    expect(config.band.high).toBeCloseTo(30e6, 0);
    expect(config.band.isDefault).toBe(false);
    expect(config.rails["VCC"]).toBeCloseTo(12, 9);
    expect(config.rails["VEE"]).toBeCloseTo(-5, 9);
    expect(config.swing).toEqual({ volts: 0.5, isDefault: false });
    expect(config.rules["e-series"]).toEqual({ severity: "off", options: {} });
    expect(config.rules["rail-bypass"]?.severity).toBe("warning");
    expect(config.rules["rail-bypass"]?.options["maxOhms"]).toBeCloseTo(1.5, 9);
    expect(config.series).toEqual({ resistor: "E96", capacitor: "E12", inductor: "E12", capacitorCheck: true });
    expect(config.defaulted.sort()).toEqual(["series.capacitor", "series.inductor"]);
  });

  it("records every default (our defaults: 0.5–30 MHz band, 1 V swing, E24/E12/E12)", () => {
    const { config, errors } = loadConfig("{}", "loadline.json", RULES);
    expect(errors).toEqual([]);
    expect(config.band).toEqual({ low: 0.5e6, high: 30e6, isDefault: true });
    expect(config.swing).toEqual({ volts: DEFAULTS.swingVolts, isDefault: true });
    expect(config.defaulted).toContain("band");
    expect(defaultConfig().file).toBeUndefined();
  });

  it("names file, line and column of an unknown key and suggests the near miss", () => {
    const text = '{\n  "band": { "low": "1.8MHz", "high": "30MHz" },\n    "bnad": 1\n}';
    const { errors } = loadConfig(text, "loadline.json", RULES);
    expect(errors).toHaveLength(1);
    expect(formatConfigError(errors[0] ?? { file: "", line: 0, column: 0, message: "" })).toBe(
      "loadline.json:3:5: unknown key 'bnad' (did you mean 'band'?); known keys: band, rails, swing, rules, ignore, models, series",
    );
  });

  it("explains a bad quantity, a bad severity, an unknown rule and an unknown option", () => {
    const text = [
      "{",
      '  "band": { "low": "1.8 MHzz", "high": "30MHz" },',
      '  "rules": {',
      '    "rail-bypas": "warning",',
      '    "e-series": "fatal",',
      '    "rail-bypass": { "options": { "maxOhm": 1, "mode": "best" } }',
      "  }",
      "}",
    ].join("\n");
    const { config, errors } = loadConfig(text, "cfg/loadline.json", RULES);
    const at = errors.map((e) => `${e.line}:${e.column}`);
    expect(at).toEqual(["2:20", "4:5", "5:17", "6:35", "6:56"]);
    expect(errors[0]?.message).toMatch(/^band\.low: '1\.8 MHzz' is not a frequency/);
    expect(errors[1]?.message).toBe("unknown rule 'rail-bypas' (did you mean 'rail-bypass'?); `loadline rules` lists them");
    expect(errors[2]?.message).toBe('rules.e-series: expected one of "off", "error", "warning", "note", found the string \'fatal\'');
    expect(errors[3]?.message).toMatch(/^unknown option 'maxOhm' for rule 'rail-bypass' \(did you mean 'maxOhms'\?\); known options: maxOhms, margin, mode$/);
    expect(errors[4]?.message).toBe("rules.rail-bypass.options.mode: expected one of 'worst', 'mean', found the string 'best'");
    // The bad band leaves the default in place, and says so.
    expect(config.band.isDefault).toBe(true);
  });

  it("reports broken JSON at its position instead of throwing", () => {
    const { errors } = loadConfig('{\n  "band": {\n}', "loadline.json", RULES);
    expect(errors).toEqual([{ file: "loadline.json", line: 3, column: 2, message: "not valid JSON: expected ',' or '}' but found end of file" }]);
  });

  it("refuses an inverted band", () => {
    const { errors } = loadConfig('{ "band": { "low": "30MHz", "high": "1MHz" } }', "loadline.json", RULES);
    expect(errors.map((e) => e.message)).toEqual(["band.high: must be above band.low"]);
  });
});

describe("resolveRuleOptions", () => {
  it("applies defaults, converting unit strings to SI", () => {
    const rule = RULES[0];
    if (!rule) throw new Error("demo rule missing");
    expect(resolveRuleOptions(rule)).toEqual({ maxOhms: 2.5, margin: 2, mode: "worst" });
    expect(resolveRuleOptions(rule, { margin: 3, mode: "bogus" })).toEqual({ maxOhms: 2.5, margin: 3, mode: "worst" });
  });
});

describe("findConfigFile", () => {
  it("finds the nearest loadline.json above the design and stops at the repository root", () => {
    const fs = memoryFileSource({
      "/repo/.git/HEAD": "ref: refs/heads/main\n",
      "/repo/loadline.json": "{}",
      "/repo/hw/sub/board.kicad_sch": "(kicad_sch)",
      "/repo/hw/loadline.json": "{}",
      "/loadline.json": "{}",
      "/other/repo/.git/HEAD": "x",
      "/other/repo/board.kicad_sch": "(kicad_sch)",
    });
    expect(findConfigFile("/repo/hw/sub/board.kicad_sch", fs)).toBe("/repo/hw/loadline.json");
    expect(findConfigFile("/repo/top.kicad_sch", fs)).toBe("/repo/loadline.json");
    expect(findConfigFile("/other/repo/board.kicad_sch", fs)).toBeUndefined();
  });
});

describe("example configs in the repository", () => {
  const repo = new URL("..", import.meta.url).pathname;
  const schema: unknown = JSON.parse(readFileSync(join(repo, "schema/loadline.schema.json"), "utf8"));
  const ajv = new Ajv({ allErrors: true, strict: true, allowUnionTypes: true });
  const validate = ajv.compile(schema as object);

  const found: string[] = [];
  const walk = (dir: string, depth: number): void => {
    if (depth > 8) return;
    for (const name of readdirSync(dir)) {
      if (name === "node_modules" || name === ".git" || name === "dist") continue;
      const path = join(dir, name);
      if (statSync(path).isDirectory()) walk(path, depth + 1);
      else if (name === "loadline.json" || name.endsWith(".loadline.json")) found.push(path);
    }
  };
  walk(repo, 0);

  it("has at least the starter example", () => {
    expect(found.map((p) => relative(repo, p))).toContain("examples/loadline.json");
  });
  for (const path of found) {
    it(`${relative(repo, path)} validates against schema/loadline.schema.json and loads cleanly`, () => {
      const text = readFileSync(path, "utf8");
      const ok = validate(JSON.parse(text));
      expect(ok ? "" : ajv.errorsText(validate.errors)).toBe("");
      // …and names only rules and options that exist, so an example cannot drift from the code.
      expect(loadConfig(text, relative(repo, path), allRules).errors).toEqual([]);
    });
  }
});
