// The exported netlist, versions E (KiCad 6+) and D (KiCad 5), shaped as KiCad format notes §12
// describe them (read from the exporter and its regression data). Boards and values invented.
import { describe, expect, it } from "vitest";
import { net, netLines, readError, readMemory } from "./helpers/read-design.js";

const NET_E = `(export (version "E")
  (design (source "/home/bench/preamp/preamp.kicad_sch") (date "2024-03-01") (tool "Eeschema 8.0.4")
    (sheet (number "1") (name "/") (tstamps "/")
      (title_block (title "Preamp") (company) (rev "B") (date "") (source "preamp.kicad_sch")))
    (sheet (number "2") (name "/bias/") (tstamps "/9a7e0000-0000-4000-8000-000000000001/")
      (title_block (source "bias.kicad_sch"))))
  (components
    (comp (ref "R10") (value "4k7") (footprint "Resistor_SMD:R_0603_1608Metric")
      (datasheet "~") (description "Resistor")
      (fields (field (name "Footprint") "Resistor_SMD:R_0603_1608Metric") (field (name "Datasheet") "~") (field (name "Tolerance") "1%"))
      (libsource (lib "Device") (part "R") (description "Resistor"))
      (property (name "Tolerance") (value "1%"))
      (property (name "Sheetname") (value "bias"))
      (property (name "Sheetfile") (value "bias.kicad_sch"))
      (sheetpath (names "/bias/") (tstamps "/9a7e0000-0000-4000-8000-000000000001/"))
      (tstamps "3f1d0000-0000-4000-8000-000000000010"))
    (comp (ref "R2") (value "100k")
      (libsource (lib "Device") (part "R"))
      (property (name "dnp"))
      (sheetpath (names "/") (tstamps "/")) (tstamps "3f1d0000-0000-4000-8000-000000000002"))
    (comp (ref "Q1") (value "BC549C")
      (libsource (lib "Transistor_BJT") (part "BC549"))
      (sheetpath (names "/") (tstamps "/")) (tstamps "3f1d0000-0000-4000-8000-000000000003")))
  (libparts
    (libpart (lib "Device") (part "R") (description "Resistor")
      (pins (pin (num "1") (name "") (type "passive")) (pin (num "2") (name "") (type "passive"))))
    (libpart (lib "Transistor_BJT") (part "BC549")
      (pins (pin (num "1") (name "C") (type "passive")) (pin (num "2") (name "B") (type "input")) (pin (num "3") (name "E") (type "passive")))))
  (nets
    (net (code "1") (name "/bias/{slash}VB") (class "Default")
      (node (ref "Q1") (pin "2") (pinfunction "B") (pintype "input"))
      (node (ref "R10") (pin "1") (pintype "passive"))
      (node (ref "R2") (pin "2") (pintype "passive")))
    (net (code "2") (name "GND")
      (node (ref "Q1") (pin "3") (pinfunction "E") (pintype "passive"))
      (node (ref "R10") (pin "2") (pintype "passive")))
    (net (code "3") (name "+12V")
      (node (ref "R2") (pin "1") (pintype "passive")))
    (net (code "5") (name "unconnected-(Q1-C-Pad1)")
      (node (ref "Q1") (pin "1") (pinfunction "C") (pintype "passive+no_connect")))))
`;

const NET_D = `(export (version D)
  (design (source /home/bench/old/old.sch) (date "01/03/2019 10:00:00") (tool "Eeschema 5.1.5"))
  (components
    (comp (ref R1) (value 4,7K) (footprint Resistor_SMD:R_0805)
      (fields (field (name Tolerance) 5%))
      (libsource (lib device) (part R)) (sheetpath (names /) (tstamps /)) (tstamp 5C7A1B2D))
    (comp (ref C1) (value 100n) (libsource (lib device) (part C)) (sheetpath (names /) (tstamps /)) (tstamp 5C7A1B2E)))
  (libparts
    (libpart (lib device) (part R) (pins (pin (num 1) (name ~) (type passive)) (pin (num 2) (name ~) (type passive))))
    (libpart (lib device) (part C) (pins (pin (num 1) (name ~) (type passive)) (pin (num 2) (name ~) (type passive)))))
  (nets
    (net (code 1) (name "Net-(C1-Pad1)") (node (ref R1) (pin 2)) (node (ref C1) (pin 1)))
    (net (code 2) (name GND) (node (ref C1) (pin 2)) (node (ref R1) (pin 1)) (node (ref #FLG01) (pin 1)))))
`;

describe("netlist version E", () => {
  const c = readMemory({ "n/preamp.net": NET_E }, "n/preamp.net");

  it("reads nets with unescaped names, natural pin order, and no-connect marks", () => {
    expect(c.format).toBe("kicad_net");
    expect(c.version).toBe("E");
    expect(netLines(c)).toEqual([
      "+12V: R2.1",
      "/bias//VB: Q1.2 R2.2 R10.1",
      "GND: Q1.3 R10.2",
      "unconnected-(Q1-C-Pad1): Q1.1",
    ]);
    expect(net(c, "GND")).toMatchObject({ isGround: true, isPower: true, noConnect: false });
    expect(net(c, "+12V")?.isPower).toBe(true);
    expect(net(c, "unconnected-(Q1-C-Pad1)")?.noConnect).toBe(true);
  });

  it("reads parts with fields, sheet path, DNP, pin names from libparts and classification", () => {
    const r10 = c.parts.find((p) => p.ref === "R10");
    expect(r10).toMatchObject({
      value: "4k7", libId: "Device:R", footprint: "Resistor_SMD:R_0603_1608Metric", kind: "resistor",
      fields: { Description: "Resistor", Tolerance: "1%" }, dnp: false,
      origin: { file: "n/preamp.net", sheetPath: "/bias/" },
      pins: { "1": "/bias//VB", "2": "GND" },
    });
    expect(r10?.parsed.number).toBeCloseTo(4700, 6);
    expect(r10?.valueSpan).toBeUndefined();
    expect(c.parts.find((p) => p.ref === "R2")?.dnp).toBe(true);
    const q1 = c.parts.find((p) => p.ref === "Q1");
    expect(q1?.pinNames).toEqual({ "1": "C", "2": "B", "3": "E" });
    expect(c.parts.map((p) => p.ref)).toEqual(["Q1", "R2", "R10"]);
    expect(c.sheets).toEqual([{ path: "/", file: "preamp.kicad_sch" }, { path: "/bias/", file: "bias.kicad_sch" }]);
  });
});

describe("netlist version D", () => {
  it("keeps bare values with a decimal comma whole and skips power-flag nodes", () => {
    const c = readMemory({ "n/old.net": NET_D }, "n/old.net");
    expect(c.parts.find((p) => p.ref === "R1")?.value).toBe("4,7K");
    expect(c.parts.find((p) => p.ref === "R1")?.fields).toEqual({ Tolerance: "5%" });
    expect(netLines(c)).toEqual(["GND: C1.2 R1.1", "Net-(C1-Pad1): C1.1 R1.2"]);
    expect(c.parts.find((p) => p.ref === "C1")?.pinNames).toEqual({ "1": "", "2": "" });
  });

  it("a truncated netlist is a ReadError with its position", () => {
    const cut = NET_D.slice(0, NET_D.indexOf("(nets"));
    const e = readError({ "n/cut.net": cut }, "n/cut.net");
    expect(e.file).toBe("n/cut.net");
    expect(e.message).toBe("expected ')' to close the list opened at line 1, column 1 (the file ends first)");
  });
});
