// What a net's name says: its local part and the supply voltage a power-symbol-style name states.
// Shared by the Context (which nets are rails) and the solver netlist builder (what each rail is).

/** The last path component of a hierarchical net name: "/preamp/+9V" -> "+9V". */
export function localNetName(net: string): string {
  const trimmed = net.endsWith("/") ? net.slice(0, -1) : net;
  const slash = trimmed.lastIndexOf("/");
  return slash >= 0 ? trimmed.slice(slash + 1) : trimmed;
}

/**
 * Volts written in a supply net's name, KiCad power-symbol style: "+9V", "-5V", "+3V3", "+3.3V",
 * "12V", "VCC_9V", "+9V_RF". Undefined when the name carries no voltage ("VCC", "VBIAS").
 */
export function voltsFromNetName(net: string): number | undefined {
  const name = localNetName(net);
  // A voltage token is digits, an optional decimal part, then V, then optionally the RKM decimal
  // digits ("3V3"); it must not be glued to more letters or digits before it ("R10V" is not a rail).
  const match = /(?:^|[^0-9A-Za-z.])([+-]?)(\d+)(?:[.,](\d+))?V(\d+)?(?![0-9])/i.exec(name) ??
    /^([+-]?)(\d+)(?:[.,](\d+))?V(\d+)?$/i.exec(name);
  if (!match) return undefined;
  const [, sign, whole, decimals, rkmDecimals] = match;
  if (decimals !== undefined && rkmDecimals !== undefined) return undefined;
  const fraction = decimals ?? rkmDecimals ?? "";
  const magnitude = Number(`${whole}${fraction ? `.${fraction}` : ""}`);
  if (!Number.isFinite(magnitude)) return undefined;
  return sign === "-" ? -magnitude : magnitude;
}
