// A hand-built LintResult for reporter tests: an invented two-design project (an HF preamp board and
// a sheet that fails to read). Figures are demo data, not measurements; the hostile strings are
// there to prove every reporter escapes what users type into fields and file names.
import type { Finding } from "../../src/engine/types.js";
import type { LintResult } from "../../src/engine/result.js";
import type { RuleInfo } from "../../src/engine/rule.js";

export const ROOT = "/work/demo-repo";
export const BASE = { cwd: ROOT, root: ROOT };

export const HOSTILE = "<script>alert(1)</script> 100% %0A ::error::x, a:b\r\nnext line & µΩ–€";
export const LONG_VALUE = "4k7 ".repeat(2500); // 10 kB

const PREAMP = "hw/rf board/preamp.kicad_sch";
const ROOT_SHEET = "hw/rf board/front-end.kicad_sch";

function finding(partial: Partial<Finding> & Pick<Finding, "rule" | "severity" | "message">): Finding {
  return { parts: [], nets: [], file: PREAMP, line: 1, column: 1, sheetPath: "/preamp/", data: {}, ...partial };
}

export const DEMO_RULES: (RuleInfo & { level: "error" | "warning" | "note" | "off" })[] = [
  {
    id: "rail-bypass", title: "Rail impedance stays under target across the band", severity: "error", level: "error",
    doc: { what: "Sweeps |Z| from each supply rail to ground over the band.", why: "A rail with high impedance couples stages.", fix: "Add a capacitor whose self-resonance falls in the band.", references: ["Demo reference, invented for tests"] },
    options: { marginDb: { type: "number", default: 0, description: "Extra margin below the target, dB." } }, tags: ["rf", "power"],
  },
  {
    id: "cascode-base", title: "Cascode base is an AC ground", severity: "warning", level: "warning",
    doc: { what: "Checks |Z| from a common-base device's base to ground.", why: "A floating base lets the cascode oscillate.", fix: "Bypass the base with a low-ESL capacitor.", references: [] },
    options: {},
  },
  {
    id: "e-series", title: "Values come from the configured E series", severity: "note", level: "note",
    doc: { what: "Compares values with IEC 60063 series.", why: "Odd values are hard to buy.", fix: "Use the nearest preferred value.", references: ["IEC 60063:2015"] },
    options: {},
  },
  {
    id: "gate-protection", title: "MOSFET gates have a discharge path", severity: "warning", level: "off",
    doc: { what: "Looks for a DC path from each gate.", why: "A floating gate collects charge.", fix: "Add a gate resistor to source.", references: [] },
    options: {},
  },
];

export function demoFindings(): Finding[] {
  return [
    finding({
      rule: "rail-bypass", severity: "error", parts: ["C12", "C13"], nets: ["+12V_RF"], line: 120, column: 5,
      message: "+12V_RF: |Z| reaches 4.2 Ω at 28 MHz, over the 1.2 Ω target; add a 10 nF capacitor beside C12",
      data: { worstOhms: 4.2, atHertz: 28e6, targetOhms: 1.2, curve: [[1e6, 0.3], [28e6, 4.2]] },
    }),
    finding({
      rule: "cascode-base", severity: "warning", parts: ["Q2"], nets: ["BASE,2"], line: 88, column: 3,
      message: `Q2 base: ${HOSTILE}`, data: { openOhms: Infinity, note: HOSTILE },
    }),
    finding({
      rule: "e-series", severity: "note", parts: ["R7"], line: 40, column: 7, file: ROOT_SHEET, sheetPath: "/",
      message: `R7 ${LONG_VALUE} is not an E24 value`, data: {},
      suppressed: { reason: "matched pair, select on test <b>" },
    }),
    finding({
      rule: "e-series", severity: "note", parts: ["R9"], line: 52, column: 7, file: ROOT_SHEET, sheetPath: "/",
      message: "R9 5.1 kΩ is not an E12 value (µΩ–€ check)",
      fix: { span: { file: ROOT_SHEET, start: 1000, end: 1005 }, replacement: '"4k7"', description: "R9 5k1 -> 4k7" },
    }),
  ];
}

export function demoResult(): LintResult {
  return {
    toolVersion: "0.1.0",
    band: { low: 0.5e6, high: 30e6, isDefault: true },
    rules: DEMO_RULES,
    designs: [
      {
        file: ROOT_SHEET,
        sheetFiles: [ROOT_SHEET, PREAMP],
        findings: demoFindings(),
        rails: [
          {
            net: "+12V_RF", volts: 12, targetOhms: 1.2, targetBasis: "demo basis <i>", worst: { ohms: 4.2, hertz: 28e6 },
            curve: [[1e5, 0.08], [1e6, 0.3], [1e7, 1.1], [28e6, 4.2], [1e8, Infinity]],
          },
          { net: "VBIAS", volts: 6, targetOhms: 10, targetBasis: "demo", worst: { ohms: 2, hertz: 5e5 }, curve: [[1e5, 8], [1e6, 2], [3e7, 0.5]] },
        ],
        bases: [{ ref: "Q2", net: "BASE,2", limitOhms: 5, curve: [[1e6, 2], [1e7, 6], [3e7, 9]] }],
        devices: [
          { ref: "Q1", type: "npn", region: "active", figures: { vce: 5.1, ic: 0.012, gm: 0.46 } },
          { ref: "Q2", type: "npn", region: "active", figures: { vce: 4.3, ic: 0.012 } },
        ],
        errors: [],
        notes: [{ file: PREAMP, line: 3, column: 1, message: "schematic version 20250114 is newer than tested" }],
      },
      {
        file: "hw/broken.kicad_sch", sheetFiles: ["hw/broken.kicad_sch"], findings: [], rails: [], bases: [], devices: [],
        errors: [{ file: "hw/broken.kicad_sch", line: 7, column: 12, message: "expected ')' but the file ended" }],
      },
    ],
  };
}
