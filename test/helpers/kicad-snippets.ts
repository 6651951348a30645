// Building blocks for inline test schematics, shaped like KiCad 6–8 output (KiCad format notes §3,
// §5, §6). Library geometry follows the notes' examples; boards, values and names are invented.

export const LIB_R = `(symbol "Device:R" (pin_numbers hide) (pin_names (offset 0)) (in_bom yes) (on_board yes)
      (property "Reference" "R" (id 0) (at 2.032 0 90)) (property "Value" "R" (id 1) (at 0 0 90))
      (symbol "R_0_1" (rectangle (start -1.016 -2.54) (end 1.016 2.54)))
      (symbol "R_1_1"
        (pin passive line (at 0 3.81 270) (length 1.27) (name "~" (effects (font (size 1.27 1.27)))) (number "1" (effects (font (size 1.27 1.27)))))
        (pin passive line (at 0 -3.81 90) (length 1.27) (name "~") (number "2"))))`;

/** A one-pin probe with its pin off both axes, so every rotation/mirror lands somewhere distinct. */
export const LIB_PROBE = `(symbol "Test:Probe" (in_bom yes) (on_board yes)
      (property "Reference" "TP" (at 0 0 0)) (property "Value" "Probe" (at 0 0 0))
      (symbol "Probe_1_1" (pin passive line (at 2.54 5.08 270) (length 1.27) (name "P") (number "1"))))`;

/** Ground symbol as KiCad 6 libraries drew it: a hidden power_in pin named after the net. */
export const LIB_GND = `(symbol "power:GND" (power) (pin_names (offset 0)) (in_bom yes) (on_board yes)
      (property "Reference" "#PWR" (at 0 -6.35 0)) (property "Value" "GND" (at 0 -3.81 0))
      (symbol "GND_0_1" (polyline (pts (xy 0 0) (xy 0 -1.27))))
      (symbol "GND_1_1" (pin power_in line (at 0 0 270) (length 0) hide (name "GND") (number "1"))))`;

/** A supply symbol whose hidden pin name and Value can differ (KiCad format notes §7). */
export function libSupply(name: string, pinName: string): string {
  return `(symbol "power:${name}" (power) (in_bom yes) (on_board yes)
      (property "Reference" "#PWR" (at 0 0 0)) (property "Value" "${name}" (at 0 0 0))
      (symbol "${name}_1_1" (pin power_in line (at 0 0 90) (length 0) hide (name "${pinName}") (number "1"))))`;
}

export const LIB_PWR_FLAG = `(symbol "power:PWR_FLAG" (power) (in_bom yes) (on_board yes)
      (property "Reference" "#FLG" (at 0 0 0)) (property "Value" "PWR_FLAG" (at 0 0 0))
      (symbol "PWR_FLAG_0_1" (pin power_out line (at 0 0 90) (length 0) (name "pwr") (number "1"))))`;

/** A dual op-amp: amplifiers in units 1 and 2, supply pins in unit 3 (as KiCad's dual op-amps). */
export const LIB_DUAL_OPAMP = `(symbol "Amp:Dual" (in_bom yes) (on_board yes)
      (property "Reference" "U" (at 0 0 0)) (property "Value" "Dual" (at 0 0 0))
      (symbol "Dual_1_1"
        (pin output line (at 7.62 0 180) (length 2.54) (name "~") (number "1"))
        (pin input line (at -7.62 -2.54 0) (length 2.54) (name "-") (number "2"))
        (pin input line (at -7.62 2.54 0) (length 2.54) (name "+") (number "3")))
      (symbol "Dual_2_1"
        (pin output line (at 7.62 0 180) (length 2.54) (name "~") (number "7"))
        (pin input line (at -7.62 -2.54 0) (length 2.54) (name "-") (number "6"))
        (pin input line (at -7.62 2.54 0) (length 2.54) (name "+") (number "5")))
      (symbol "Dual_3_1"
        (pin power_in line (at -2.54 -7.62 90) (length 3.81) (name "V-") (number "4"))
        (pin power_in line (at -2.54 7.62 270) (length 3.81) (name "V+") (number "8"))))`;

/** A logic gate with hidden supply pins, the legacy implicit power connection (§7, §8.3). */
export const LIB_GATE = `(symbol "Logic:Inverter" (in_bom yes) (on_board yes)
      (property "Reference" "U" (at 0 0 0)) (property "Value" "Inverter" (at 0 0 0))
      (symbol "Inverter_1_1"
        (pin input line (at -7.62 0 0) (length 3.81) (name "~") (number "1"))
        (pin output line (at 7.62 0 180) (length 3.81) (name "~") (number "2"))
        (pin power_in line (at 0 5.08 270) (length 0) hide (name "VCC") (number "14"))
        (pin power_in line (at 0 -5.08 90) (length 0) hide (name "GND") (number "7"))))`;

/** A pin with an alternate function (§5 Pins). */
export const LIB_ALT = `(symbol "Test:Alt" (in_bom yes) (on_board yes)
      (property "Reference" "U" (at 0 0 0)) (property "Value" "Alt" (at 0 0 0))
      (symbol "Alt_1_1"
        (pin bidirectional line (at -5.08 0 0) (length 2.54) (name "PA0") (number "1")
          (alternate "SDA" bidirectional line) (alternate "ADC0" input line))))`;

export interface Place {
  lib: string;
  ref: string;
  value?: string;
  x: number;
  y: number;
  angle?: number;
  mirror?: "x" | "y";
  unit?: number;
  uuid?: string;
  onBoard?: boolean;
  extra?: string;
}

export function place(p: Place): string {
  return `(symbol (lib_id "${p.lib}") (at ${p.x} ${p.y} ${p.angle ?? 0})${p.mirror ? ` (mirror ${p.mirror})` : ""} (unit ${p.unit ?? 1})
    (in_bom yes) (on_board ${p.onBoard === false ? "no" : "yes"})${p.uuid ? ` (uuid ${p.uuid})` : ""}
    (property "Reference" "${p.ref}" (id 0) (at ${p.x} ${p.y - 5} 0))
    (property "Value" "${p.value ?? p.lib.split(":")[1]}" (id 1) (at ${p.x} ${p.y + 5} 0))${p.extra ?? ""})`;
}

export function wire(x1: number, y1: number, x2: number, y2: number): string {
  return `(wire (pts (xy ${x1} ${y1}) (xy ${x2} ${y2})) (stroke (width 0) (type default) (color 0 0 0 0)))`;
}

export function label(text: string, x: number, y: number, kind: "label" | "global_label" | "hierarchical_label" = "label"): string {
  const shape = kind === "label" ? "" : " (shape input)";
  return `(${kind} "${text}"${shape} (at ${x} ${y} 0) (effects (font (size 1.27 1.27))))`;
}

export function junction(x: number, y: number): string {
  return `(junction (at ${x} ${y}) (diameter 0) (color 0 0 0 0))`;
}

export function schematic(body: string[], opts: { version?: number; uuid?: string; libs?: string[]; tail?: string } = {}): string {
  return `(kicad_sch (version ${opts.version ?? 20211123}) (generator eeschema)
  (uuid ${opts.uuid ?? "aaaaaaaa-0000-4000-8000-000000000000"})
  (paper "A4")
  (lib_symbols
    ${(opts.libs ?? [LIB_R]).join("\n    ")})
  ${body.join("\n  ")}
  ${opts.tail ?? ""}
)
`;
}

export function sheet(name: string, file: string, uuid: string, x: number, y: number, pins: { name: string; x: number; y: number; shape?: string }[] = [], extra = ""): string {
  return `(sheet (at ${x} ${y}) (size 20 20) (fields_autoplaced)
    (stroke (width 0) (type solid) (color 0 0 0 0)) (fill (color 0 0 0 0.0000))
    (uuid ${uuid})
    (property "Sheet name" "${name}" (id 0) (at ${x} ${y - 1} 0))
    (property "Sheet file" "${file}" (id 1) (at ${x} ${y + 21} 0))
    ${pins.map((p) => `(pin "${p.name}" ${p.shape ?? "input"} (at ${p.x} ${p.y} 180) (effects (font (size 1.27 1.27))) (uuid ${uuid}-${p.name.replace(/\W/g, "")}))`).join("\n    ")}${extra})`;
}
