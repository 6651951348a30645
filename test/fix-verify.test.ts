// The before/after comparisons that decide whether an edited file may be written. Small invented
// circuits; what is checked is which differences are caught and how they are named.
import { describe, expect, it } from "vitest";
import type { Circuit, Net, Part } from "../src/circuit/types.js";
import type { Finding } from "../src/engine/types.js";
import { findingDifference, netDifference, partDifference } from "../src/fix/verify.js";

function part(ref: string, value: string, pins: Record<string, string>): Part {
  return {
    ref, value, parsed: { text: value }, kind: "resistor", libId: "Device:R", footprint: "", pins, pinNames: {}, roles: {},
    fields: {}, dnp: false, excludedFromSim: false, origin: { file: "a.kicad_sch", line: 1, column: 1, sheetPath: "/" },
  };
}
function net(name: string, pins: [string, string][]): Net {
  return { name, aliases: [name], pins: pins.map(([ref, pin]) => ({ ref, pin })), isGround: name === "GND", isPower: false, noConnect: false };
}
function circuit(parts: Part[], nets: Net[]): Circuit {
  return { file: "a.kicad_sch", format: "kicad_sch", version: "20231120", parts, nets, sheets: [], notes: [], modelLibraries: [] };
}
function finding(rule: string, parts: string[], message = "m"): Finding {
  return { rule, severity: "warning", message, parts, nets: [], file: "a.kicad_sch", line: 1, column: 1, sheetPath: "/", data: {} };
}

const base = circuit(
  [part("R1", "10k", { "1": "+9V", "2": "BIAS" }), part("R2", "7k3", { "1": "BIAS", "2": "GND" })],
  [net("+9V", [["R1", "1"]]), net("BIAS", [["R1", "2"], ["R2", "1"]]), net("GND", [["R2", "2"]])],
);

describe("netDifference", () => {
  it("accepts the same partition in another order", () => {
    const same = circuit(base.parts, [net("GND", [["R2", "2"]]), net("BIAS", [["R2", "1"], ["R1", "2"]]), net("+9V", [["R1", "1"]])]);
    expect(netDifference(base, same)).toBeUndefined();
  });
  it("names a renamed net and a moved pin", () => {
    const renamed = circuit(base.parts, [net("+9V", [["R1", "1"]]), net("VB", [["R1", "2"], ["R2", "1"]]), net("GND", [["R2", "2"]])]);
    expect(netDifference(base, renamed)).toBe("net BIAS is gone; net VB is new");
    const moved = circuit(base.parts, [net("+9V", [["R1", "1"], ["R2", "1"]]), net("BIAS", [["R1", "2"]]), net("GND", [["R2", "2"]])]);
    expect(netDifference(base, moved)).toBe("net +9V has other pins (R1.1 before, R1.1 R2.1 after); net BIAS has other pins (R1.2 R2.1 before, R1.2 after)");
  });
});

describe("partDifference", () => {
  it("accepts exactly the intended value change", () => {
    const fixed = circuit([base.parts[0] as Part, part("R2", "6k8", { "1": "BIAS", "2": "GND" })], base.nets);
    expect(partDifference(base, fixed, [{ ref: "R2", value: "6k8" }])).toBeUndefined();
  });
  it("names a value that did not change, one that changed unasked, and a changed field", () => {
    const wrong = circuit([part("R1", "12k", { "1": "+9V", "2": "BIAS" }), { ...part("R2", "7k3", { "1": "BIAS", "2": "GND" }), fields: { Tolerance: "1%" } }], base.nets);
    expect(partDifference(base, wrong, [{ ref: "R2", value: "6k8" }])).toBe(
      'R1 reads back as "12k", not "10k"; R2 reads back as "7k3", not "6k8"; R2\'s fields changed',
    );
  });
});

describe("findingDifference", () => {
  it("passes when the fixed finding is gone and nothing new appears", () => {
    expect(findingDifference([finding("e-series", ["R2"]), finding("x", ["R1"])], [finding("x", ["R1"], "other words")], [{ rule: "e-series", ref: "R2" }])).toBeUndefined();
  });
  it("names a finding that stays and a new one", () => {
    const result = findingDifference([finding("e-series", ["R2"])], [finding("e-series", ["R2"], "still off"), finding("headroom", ["Q1"], "VCE 0.2 V")], [{ rule: "e-series", ref: "R2" }]);
    expect(result).toBe("e-series still reports R2: still off; the change brings a new warning (headroom): VCE 0.2 V");
  });
  it("ignores suppressed findings on both sides", () => {
    const muted = { ...finding("headroom", ["Q1"]), suppressed: { reason: "known" } };
    expect(findingDifference([], [muted], [])).toBeUndefined();
  });
});
