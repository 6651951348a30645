import { describe, expect, it } from "vitest";
import { classifyPart, type ClassifyInput } from "../src/circuit/classify.js";

// Library ids and pin namings below are those of KiCad's shipped symbol libraries (Device,
// Transistor_BJT, Transistor_FET, Simulation_SPICE, Connector_Generic), from memory of the KiCad 6
// libraries read for shared/notes/kicad-schematic-format.md §5 [MEM]; pin orders of named packages are
// from the manufacturers' datasheets [MEM], as noted in src/circuit/part-names.ts.

function sym(partial: Partial<ClassifyInput> & { ref: string; libId: string }): ClassifyInput {
  return { value: "", pinNames: {}, pinTypes: {}, fields: {}, isPowerSymbol: false, ...partial };
}
const passivePins = { pinNames: { "1": "~", "2": "~" }, pinTypes: { "1": "passive", "2": "passive" } };

describe("two-terminal parts", () => {
  it("Device:R with unnamed pins", () => {
    expect(classifyPart(sym({ ref: "R1", libId: "Device:R", value: "4k7", ...passivePins }))).toEqual({
      kind: "resistor",
      roles: { "1": "1", "2": "2" },
    });
  });
  it("Device:C_Polarized and Device:CP: pin 1 is + (KiCad convention)", () => {
    for (const libId of ["Device:C_Polarized", "Device:CP", "Device:CP_Small", "Device:C_Polarized_US"]) {
      expect(classifyPart(sym({ ref: "C3", libId, value: "100uF", ...passivePins }))).toEqual({
        kind: "polarized-capacitor",
        roles: { "+": "1", "-": "2" },
      });
    }
  });
  it("Device:C_Small, Device:L", () => {
    expect(classifyPart(sym({ ref: "C1", libId: "Device:C_Small", ...passivePins })).kind).toBe("capacitor");
    expect(classifyPart(sym({ ref: "L1", libId: "Device:L", ...passivePins })).kind).toBe("inductor");
  });
  it("Device:D with pins named K (1) and A (2)", () => {
    expect(classifyPart(sym({ ref: "D1", libId: "Device:D", value: "1N4148", pinNames: { "1": "K", "2": "A" } }))).toEqual({
      kind: "diode",
      roles: { K: "1", A: "2" },
    });
  });
  it("a zener by symbol, and a zener's part number on a plain diode symbol", () => {
    expect(classifyPart(sym({ ref: "D2", libId: "Device:D_Zener", value: "5V6", pinNames: { "1": "K", "2": "A" } })).kind).toBe("zener");
    expect(classifyPart(sym({ ref: "D3", libId: "Device:D", value: "BZX55C6V2", pinNames: { "1": "K", "2": "A" } })).kind).toBe("zener");
  });
  it("Device:Battery with pins named + and -", () => {
    expect(classifyPart(sym({ ref: "BT1", libId: "Device:Battery", value: "9V", pinNames: { "1": "+", "2": "-" } }))).toEqual({
      kind: "battery",
      roles: { "+": "1", "-": "2" },
    });
  });
  it("Simulation_SPICE:VDC and IDC", () => {
    expect(classifyPart(sym({ ref: "V1", libId: "Simulation_SPICE:VDC", value: "1", ...passivePins }))).toEqual({
      kind: "voltage-source",
      roles: { "+": "1", "-": "2" },
    });
    expect(classifyPart(sym({ ref: "I1", libId: "Simulation_SPICE:IDC", ...passivePins })).kind).toBe("current-source");
  });
});

describe("transistors", () => {
  it("Device:Q_NPN_BCE, named pins", () => {
    expect(classifyPart(sym({ ref: "Q1", libId: "Device:Q_NPN_BCE", value: "Q_NPN_BCE", pinNames: { "1": "B", "2": "C", "3": "E" } }))).toEqual({
      kind: "npn",
      roles: { B: "1", C: "2", E: "3" },
    });
  });
  it("Device:Q_PNP_EBC with unnamed pins: roles from the letter order of the library id", () => {
    expect(classifyPart(sym({ ref: "Q2", libId: "Device:Q_PNP_EBC", pinNames: { "1": "~", "2": "~", "3": "~" } }))).toEqual({
      kind: "pnp",
      roles: { E: "1", B: "2", C: "3" },
    });
  });
  it("Device:Q_NPN_BCEC (tab is a second collector)", () => {
    const c = classifyPart(sym({ ref: "Q5", libId: "Device:Q_NPN_BCEC", pinNames: { "1": "B", "2": "C", "3": "E", "4": "C" } }));
    expect(c).toEqual({ kind: "npn", roles: { B: "1", C: "2", E: "3" } });
  });
  it("Transistor_BJT:2N3904 (TO-92 E-B-C) and BC557 (C-B-E) by part number", () => {
    expect(classifyPart(sym({ ref: "Q1", libId: "Transistor_BJT:2N3904", value: "2N3904", pinNames: { "1": "E", "2": "B", "3": "C" } }))).toEqual({
      kind: "npn",
      roles: { E: "1", B: "2", C: "3" },
    });
    expect(classifyPart(sym({ ref: "Q2", libId: "Transistor_BJT:BC557", value: "BC557", pinNames: { "1": "C", "2": "B", "3": "E" } }))).toEqual({
      kind: "pnp",
      roles: { C: "1", B: "2", E: "3" },
    });
  });
  it("Transistor_BJT of unknown number: polarity from the description", () => {
    const c = classifyPart(sym({
      ref: "Q4", libId: "Transistor_BJT:XYZ123", value: "XYZ123",
      pinNames: { "1": "E", "2": "B", "3": "C" }, fields: { Description: "0.1A Ic, 30V Vce, Small Signal PNP Transistor, TO-92" },
    }));
    expect(c.kind).toBe("pnp");
  });
  it("a transistor whose polarity nothing tells is 'other', never guessed", () => {
    const c = classifyPart(sym({ ref: "Q9", libId: "MyParts:Mystery", value: "X1", pinNames: { "1": "B", "2": "C", "3": "E" } }));
    expect(c.kind).toBe("other");
  });
  it("unnamed pins on a named part: usual package order (2N3904 TO-92 E-B-C) [MEM]", () => {
    const c = classifyPart(sym({ ref: "Q3", libId: "MyParts:TO92", value: "2N3904", pinNames: { "1": "1", "2": "2", "3": "3" } }));
    expect(c).toEqual({ kind: "npn", roles: { E: "1", B: "2", C: "3" } });
  });
  it("Device:Q_NJFET_DSG and a J310 on it", () => {
    expect(classifyPart(sym({ ref: "Q6", libId: "Device:Q_NJFET_DSG", value: "J310", pinNames: { "1": "D", "2": "S", "3": "G" } }))).toEqual({
      kind: "njfet",
      roles: { D: "1", S: "2", G: "3" },
    });
  });
  it("J310 on a generic 3-pin symbol classifies by value", () => {
    expect(classifyPart(sym({ ref: "Q7", libId: "MyParts:FET3", value: "J310", pinNames: { "1": "G", "2": "S", "3": "D" } }))).toEqual({
      kind: "njfet",
      roles: { G: "1", S: "2", D: "3" },
    });
  });
  it("Transistor_FET:2N7000 (pins S G D) and Device:Q_NMOS_GDSB (four terminals)", () => {
    expect(classifyPart(sym({ ref: "Q8", libId: "Transistor_FET:2N7000", value: "2N7000", pinNames: { "1": "S", "2": "G", "3": "D" } }))).toEqual({
      kind: "nmos",
      roles: { S: "1", G: "2", D: "3" },
    });
    expect(classifyPart(sym({ ref: "Q9", libId: "Device:Q_NMOS_GDSB", pinNames: { "1": "G", "2": "D", "3": "S", "4": "B" } }))).toEqual({
      kind: "nmos",
      roles: { G: "1", D: "2", S: "3", B: "4" },
    });
  });
  it("a BF998-class dual-gate MOSFET by value and by pin names G1/G2/D/S", () => {
    const byValue = classifyPart(sym({ ref: "Q10", libId: "MyParts:SOT143", value: "BF998", pinNames: { "1": "S", "2": "D", "3": "G2", "4": "G1" } }));
    expect(byValue).toEqual({ kind: "dual-gate-mosfet", roles: { S: "1", D: "2", G2: "3", G1: "4" } });
    const byPins = classifyPart(sym({ ref: "Q11", libId: "MyParts:Tetrode", value: "TETRODE", pinNames: { "1": "S", "2": "D", "3": "G2", "4": "G1" } }));
    expect(byPins.kind).toBe("dual-gate-mosfet");
  });
});

describe("simulator fields", () => {
  it("Sim.Device wins and Sim.Pins gives the roles", () => {
    const c = classifyPart(sym({
      ref: "Q12", libId: "MyParts:Q3", value: "MyTransistor", pinNames: { "1": "1", "2": "2", "3": "3" },
      fields: { "Sim.Device": "PNP", "Sim.Pins": "1=C 2=B 3=E" },
    }));
    expect(c).toEqual({ kind: "pnp", roles: { C: "1", B: "2", E: "3" } });
  });
  it("KiCad 6 Spice_Primitive Q + Spice_Node_Sequence (C B E order) + a model name", () => {
    const c = classifyPart(sym({
      ref: "Q13", libId: "MyParts:Q3", value: "Q2N3904", pinNames: { "1": "1", "2": "2", "3": "3" },
      fields: { Spice_Primitive: "Q", Spice_Model: "Q2N3904", Spice_Node_Sequence: "3 2 1" },
    }));
    expect(c).toEqual({ kind: "npn", roles: { C: "3", B: "2", E: "1" } });
  });
  it("Sim.Pins on a diode (1=K 2=A)", () => {
    const c = classifyPart(sym({ ref: "D4", libId: "MyParts:D", value: "MyDiode", ...passivePins, fields: { "Sim.Device": "D", "Sim.Pins": "1=K 2=A" } }));
    expect(c).toEqual({ kind: "diode", roles: { K: "1", A: "2" } });
  });
});

describe("reference prefix and the rest", () => {
  it("falls back to the reference prefix for unknown libraries", () => {
    expect(classifyPart(sym({ ref: "R7", libId: "Mine:Thing", ...passivePins })).kind).toBe("resistor");
    expect(classifyPart(sym({ ref: "BT2", libId: "Mine:Cell", pinNames: { "1": "+", "2": "-" } })).kind).toBe("battery");
    expect(classifyPart(sym({ ref: "J1", libId: "Mine:Jack", pinNames: { "1": "1", "2": "2" } })).kind).toBe("connector");
    expect(classifyPart(sym({ ref: "U1", libId: "Mine:Opamp", pinNames: { "1": "OUT" } })).kind).toBe("other");
    expect(classifyPart(sym({ ref: "RV1", libId: "Mine:Pot", pinNames: { "1": "1", "2": "2", "3": "3" } })).kind).toBe("other");
  });
  it("connectors and power symbols", () => {
    expect(classifyPart(sym({ ref: "J2", libId: "Connector_Generic:Conn_01x02" })).kind).toBe("connector");
    expect(classifyPart(sym({ ref: "#PWR01", libId: "power:+9V", isPowerSymbol: true })).kind).toBe("power-flag");
  });
  it("partial roles when a pin name is missing", () => {
    const c = classifyPart(sym({ ref: "Q14", libId: "Device:Q_NPN", pinNames: { "1": "B", "2": "C", "3": "~" } }));
    expect(c.kind).toBe("npn");
    expect(c.roles).toEqual({ B: "1", C: "2" });
  });
});
