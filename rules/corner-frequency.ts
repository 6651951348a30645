/**
 * corner-frequency — coupling and emitter/source bypass capacitors are large enough for the band's
 * low edge, judged with the resistance they actually work into.
 *
 * ## What it checks
 * Every series coupling capacitor (between two signal nets, at least one of them a transistor
 * terminal or a connector) and every emitter or source bypass capacitor. The resistance each one
 * sees is solved at the band's low edge with the transistors at their operating point and the other
 * coupling and bypass capacitors taken as shorts (the short-circuit time-constant method): for an
 * emitter bypass that is RE ∥ (r_e + R's/(β+1)), for a source bypass RS ∥ 1/gm, for a coupling
 * capacitor the source plus the load. Coaxial connectors count as a 50 Ω port (option `portOhms`);
 * what a pin header connects to is unknown, so it is left open. The
 * corner 1/(2πRC) must lie at or below f_low/margin (margin 10 by default); a corner above the low
 * edge itself is a warning, one between f_low/margin and f_low a note.
 *
 * ## Why it matters
 * Each capacitor makes a high-pass corner. Sized against the wrong resistance — an emitter bypass
 * against RE instead of the few ohms the emitter really presents — it is too small by the ratio of
 * the two, and the gain falls away at the bottom of the band. With the corner a decade below the
 * band the loss there is 0.04 dB and the phase shift under 6°.
 *
 * ## Example
 * A common-emitter stage with RE 2 kΩ, bias divider 40 k/10 k, a 1 kΩ source and β = 100 at
 * 1.65 mA presents 24.4 Ω to its emitter bypass; 20 µF there gives a 327 Hz corner, fine for an
 * HF band but a warning for an audio band starting at 100 Hz.
 *
 * ## References
 * Per-capacitor low-frequency corners f_LS = 1/(2π(Rs+Ri)Cs), f_LC = 1/(2π(Ro+RL)Cc),
 * f_LE = 1/(2πR_e·CE) with R_e = RE ∥ (R's/β + r_e): R. L. Boylestad and L. Nashelsky, Electronic
 * Devices and Circuit Theory, ch. 9. Short-circuit time constants: Sedra & Smith, Microelectronic
 * Circuits. Xc ≤ R/10 at the lowest frequency ("stiff" coupling): A. P. Malvino and D. J. Bates,
 * Electronic Principles; the factor 10 is common practice. 50 Ω ports: common RF practice.
 */
import type { Part } from "../src/circuit/types.js";
import type { Context } from "../src/engine/context.js";
import { isCapacitor, otherNet, terminalsOf } from "../src/engine/context-topology.js";
import type { Rule } from "../src/engine/rule.js";
import type { Element } from "../src/solve/netlist.js";
import type { Finding, RuleDoc } from "../src/engine/types.js";
import { bandText, byRef, finding, numberOption, si } from "./support.js";
import { faradsForReactance, highPassCorner, highPassLossDb } from "../src/solve/reactance.js";

const ID = "corner-frequency";

const doc: RuleDoc = {
  what:
    "Finds every series coupling capacitor (between two signal nets, one of them a transistor terminal or a connector) and every emitter or source bypass capacitor, solves the resistance each one works into at the band's low edge — transistors at their operating point, the other coupling and bypass capacitors taken as shorts, coaxial connectors as a 50 Ω port — and checks that its high-pass corner 1/(2πRC) lies at or below f_low/margin. For an emitter bypass that resistance is RE ∥ (r_e + R's/(β+1)), for a source bypass RS ∥ 1/gm, for a coupling capacitor the source plus the load.",
  why:
    "Every coupling and bypass capacitor is a high-pass corner. Sized against the wrong resistance — an emitter bypass against RE rather than the few ohms the emitter presents — it comes out too small by the ratio of the two and the gain falls away at the bottom of the band. A corner a decade below the band costs 0.04 dB and under 6° there.",
  fix:
    "Raise the capacitor to the value suggested (snapped up to the configured capacitor series), or, where the corner is deliberate (a high-pass that sets the band), raise the band's low edge in loadline.json or suppress the finding on the part with a reason.",
  references: [
    "Per-capacitor corners f_LS = 1/(2π(Rs+Ri)Cs), f_LC = 1/(2π(Ro+RL)Cc), f_LE = 1/(2πR_e·CE), R_e = RE ∥ (R's/β + r_e): R. L. Boylestad and L. Nashelsky, Electronic Devices and Circuit Theory, ch. 9",
    "Short-circuit time constants for the low-frequency response: A. S. Sedra and K. C. Smith, Microelectronic Circuits",
    "Xc ≤ R/10 at the lowest frequency: A. P. Malvino and D. J. Bates, Electronic Principles (the factor 10 is common practice)",
    "Connectors as 50 Ω ports: common RF practice",
  ],
  example:
    "Common-emitter stage, RE 2 kΩ, divider 40 k/10 k, 1 kΩ source, β 100 at 1.65 mA: the emitter presents 24.4 Ω, so a 20 µF bypass has its corner at 327 Hz — fine for an HF band, a warning for an audio band from 100 Hz.",
};

const options = {
  margin: {
    type: "number" as const,
    default: 10,
    description: "How far below the band's low edge a corner must sit: corner ≤ f_low/margin (10 keeps the loss at the edge under 0.05 dB).",
  },
  portOhms: {
    type: "number" as const,
    default: 50,
    unit: "ohm",
    description: "Source or load resistance a coaxial connector (BNC, SMA, …) presents to a coupling capacitor (an RF port is 50 Ω); other connectors are left open, their load unknown.",
  },
};

type Role = "coupling" | "emitter-bypass" | "source-bypass";

interface Candidate {
  cap: Part;
  role: Role;
  /** The nets the capacitor joins (for a bypass: the emitter/source net first). */
  a: string;
  b: string;
  device?: Part;
}

function deviceTerminalsOn(ctx: Context, net: string): { part: Part; role: string }[] {
  return ctx.partsOn(net)
    .filter(({ part }) => terminalsOf(part.kind) !== undefined)
    .map(({ part, role }) => ({ part, role }));
}

/** A tuned node: an inductor and a capacitor both from it to a supply. Capacitors there belong to
 * the tuned circuit, whose coupling is a filter design matter, not a DC block. */
function isTankNode(ctx: Context, net: string): boolean {
  const toSupply = (kind: string): boolean => ctx.partsOn(net).some(({ part }) => {
    const other = otherNet(part, net);
    return other !== undefined && ctx.isSupply(other) && (kind === "L" ? part.kind === "inductor" : isCapacitor(part));
  });
  return toSupply("L") && toSupply("C");
}

function findCandidates(ctx: Context): Candidate[] {
  const out: Candidate[] = [];
  for (const part of ctx.circuit.parts) {
    if (part.dnp || !isCapacitor(part)) continue;
    const nets = Object.values(part.pins);
    if (nets.length !== 2) continue;
    const [n1 = "", n2 = ""] = nets;
    if (n1 === n2) continue;
    const s1 = ctx.isSupply(n1);
    const s2 = ctx.isSupply(n2);
    if (s1 && s2) continue;
    if (s1 || s2) {
      const x = s1 ? n2 : n1;
      const common = deviceTerminalsOn(ctx, x).find(({ part: d, role }) => terminalsOf(d.kind)?.common === role);
      if (!common) continue;
      const bipolar = common.part.kind === "npn" || common.part.kind === "pnp";
      out.push({ cap: part, role: bipolar ? "emitter-bypass" : "source-bypass", a: x, b: s1 ? n1 : n2, device: common.part });
      continue;
    }
    // Coupling: a DC block between two signal nets.
    const across = ctx.partsOn(n1).some(({ part: p }) => p.ref !== part.ref && otherNet(p, n1) === n2);
    if (across) continue;
    const t1 = deviceTerminalsOn(ctx, n1);
    const t2 = deviceTerminalsOn(ctx, n2);
    if (t1.some((x) => t2.some((y) => y.part.ref === x.part.ref))) continue; // feedback round one device
    const connector = (n: string): boolean => ctx.partsOn(n).some(({ part: p }) => p.kind === "connector");
    if (t1.length === 0 && t2.length === 0 && !connector(n1) && !connector(n2)) continue;
    if (isTankNode(ctx, n1) || isTankNode(ctx, n2)) continue;
    out.push({ cap: part, role: "coupling", a: n1, b: n2, device: t1[0]?.part ?? t2[0]?.part });
  }
  return out.sort((x, y) => byRef(x.cap, y.cap));
}

/** A coaxial connector (BNC, SMA, SMB, MCX, U.FL, F): an RF port of known impedance. What a pin
 * header or terminal block connects to is unknown, so those stay open. */
function isCoaxial(part: Part): boolean {
  return /coax|bnc|sma|smb|mcx|mmcx|u\.fl|ipex|f-type/i.test(`${part.libId} ${part.value} ${part.footprint}`);
}

/** Coaxial connector pins on signal nets terminated in the port resistance, in solver nodes: a
 * capacitor with that ESR, so the termination is there for signal and absent at DC (the bias stays put). */
function portTerminations(ctx: Context, portOhms: number): Element[] {
  const out: Element[] = [];
  for (const part of ctx.circuit.parts) {
    if (part.dnp || part.kind !== "connector" || !isCoaxial(part)) continue;
    for (const [pin, net] of Object.entries(part.pins)) {
      if (ctx.isSupply(net)) continue;
      const node = ctx.nodeOf(net);
      if (node !== undefined) out.push({ kind: "C", name: `Cport_${part.ref}_${pin}`, a: node, b: "0", farads: 1, esr: portOhms });
    }
  }
  return out;
}

const ROLE_TEXT: Record<Role, string> = {
  coupling: "coupling capacitor",
  "emitter-bypass": "emitter bypass",
  "source-bypass": "source bypass",
};

export const cornerFrequency: Rule<Context> = {
  id: ID,
  title: "Coupling and bypass capacitors keep their corners below the band",
  severity: "warning",
  doc,
  options,
  tags: ["bias", "values"],
  check(ctx, opts) {
    const margin = numberOption(opts, "margin", 10);
    const portOhms = numberOption(opts, "portOhms", 50);
    const candidates = findCandidates(ctx);
    if (candidates.length === 0) return [];
    if (!ctx.operatingPoint()) {
      ctx.noteLimited(ID, `no operating point (${ctx.operatingPointProblem() ?? "not solved"}): corners not computed`, candidates.map((c) => c.cap.ref));
      return [];
    }
    const fLow = ctx.band.low;
    const series = ctx.config.series.capacitor;
    const terminations = portTerminations(ctx, portOhms);
    // Every other large capacitor is a short for this one (short-circuit time constants), and so
    // is every capacitor that bypasses a signal-side node to a supply (a cascode base, a local rail).
    const shortable = ctx.circuit.parts.filter((p) => !p.dnp && isCapacitor(p)).map((p) => p.ref);
    const candidateRefs = new Set(candidates.map((c) => c.cap.ref));
    const findings: Finding[] = [];
    const unmodelled = new Set(ctx.unmodelled().map((u) => u.ref));
    for (const c of candidates) {
      const farads = c.cap.parsed.number;
      if (farads === undefined || !(farads > 0)) continue;
      // Without its transistor in the analysis the resistance the capacitor sees would be wrong.
      const missing = [c.device?.ref, ...ctx.devices().filter((d) => Object.values(d.pins).some((n) => n === c.a || n === c.b)).map((d) => d.ref)]
        .filter((r): r is string => r !== undefined && unmodelled.has(r));
      if (missing.length > 0) {
        ctx.noteLimited(ID, `${c.cap.ref} not judged: ${[...new Set(missing)].join(", ")} not modelled`, [c.cap.ref, ...new Set(missing)]);
        continue;
      }
      const others = shortable.filter((ref) => ref !== c.cap.ref && (candidateRefs.has(ref) || isBypassOfSignalNode(ctx, ref)));
      const options = { passiveOnly: false, without: [c.cap.ref], shorted: others, extra: terminations };
      const points = c.role === "coupling"
        ? ctx.impedanceBetween(c.a, c.b, [fLow], options)
        : ctx.impedance(c.a, [fLow], options);
      const seen = points?.[0];
      if (!seen || !(seen.magnitude > 0) || !Number.isFinite(seen.magnitude)) {
        ctx.noteLimited(ID, "the resistance a capacitor works into could not be solved", [c.cap.ref]);
        continue;
      }
      const ohms = seen.magnitude;
      const corner = highPassCorner(ohms, farads);
      const allowed = fLow / margin;
      if (corner <= allowed * (1 + 1e-9)) continue;
      const neededFarads = faradsForReactance(ohms, fLow / margin);
      const suggested = ctx.snapUp(neededFarads, series);
      const severe = corner > fLow;
      const lossDb = highPassLossDb(fLow, corner);
      const who = c.device ? ` of ${c.device.ref}` : "";
      const nets = c.role === "coupling" ? `between ${c.a} and ${c.b}` : `on ${c.a}`;
      findings.push(finding(ctx, ID, {
        at: c.cap,
        severity: severe ? "warning" : "note",
        message: `${c.cap.ref} (${si(farads, "F")}, ${ROLE_TEXT[c.role]}${who} ${nets}) works into ${si(ohms, "Ω")} at the operating point, so its corner is ${si(corner, "Hz")} — ${severe ? `above the band's low edge ${si(fLow, "Hz")} (about ${lossDb.toFixed(1)} dB lost there)` : `within a factor ${margin} of the band's low edge ${si(fLow, "Hz")}`}, band ${bandText(ctx)}. Use at least ${si(neededFarads, "F")} (e.g. ${si(suggested, "F")}) for a corner at ${si(allowed, "Hz")}.`,
        parts: [c.cap.ref, ...(c.device ? [c.device.ref] : [])],
        nets: c.role === "coupling" ? [c.a, c.b] : [c.a],
        data: {
          role: c.role, farads, seenOhms: ohms, cornerHertz: corner, bandLowHertz: fLow, margin,
          neededFarads, suggestedFarads: suggested, lossAtEdgeDb: lossDb,
        },
      }));
    }
    return findings;
  },
};

/** A capacitor from a non-supply net straight to a supply (bias-node or local-rail bypass). */
function isBypassOfSignalNode(ctx: Context, ref: string): boolean {
  const part = ctx.part(ref);
  if (!part) return false;
  const nets = Object.values(part.pins);
  return nets.length === 2 && nets.some((n) => ctx.isSupply(n)) && nets.some((n) => !ctx.isSupply(n));
}
