// A default Config literal for tests that must not load config.ts's dependencies.
import type { Config } from "../../src/engine/config.js";

export function testConfig(overrides: Partial<Config> = {}): Config {
  return {
    band: { low: 0.5e6, high: 30e6, isDefault: true },
    rails: {},
    swing: { volts: 1, isDefault: true },
    rules: {},
    ignore: [],
    series: { resistor: "E24", capacitor: "E12", inductor: "E12", capacitorCheck: false },
    defaulted: ["band", "swing"],
    ...overrides,
  };
}
