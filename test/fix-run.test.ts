// `fix` end to end on copies of the fixture boards in a temporary folder: byte-exact results, dry
// runs, idempotence, multi-instance sheets, CRLF and BOM files, RKM spelling, refusals (changed file,
// a fix that would change the nets or bring a new finding, a failed write) and the exit codes.
//
// Expected bytes are built independently of the code under test: the original file's bytes with the
// byte sequence `(property "Value" "OLD"` (found by a byte search, unique in the file) replaced.
import { chmodSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { fixExitCode, runFix, type FixRequest } from "../src/fix/run.js";
import { readDesign } from "../src/read/index.js";
import { nodeWriteFs, type WriteFs } from "../src/fix/write.js";
import { copyFixtures, forbidRule, wishRule } from "./fix-helpers.js";

let dir: string;
let done: () => void;
beforeEach(() => ({ dir, done } = copyFixtures()));
afterEach(() => done());

const DIVIDER = "divider-crlf.kicad_sch";
const RECEIVER = "two-channel/receiver.kicad_sch";
const CHANNEL = "two-channel/channel.kicad_sch";

function run(paths: string[], rules: FixRequest["lintRules"], extra: Partial<FixRequest> = {}) {
  return runFix({ paths, cwd: dir, lintRules: rules, ...extra });
}

function bytes(file: string): Buffer {
  return readFileSync(join(dir, file));
}

/** `original` with its one occurrence of `(property "Value" "OLD"` turned into `… "NEW"`. */
function expectValueReplaced(original: Buffer, oldValue: string, newValue: string): Buffer {
  const needle = Buffer.from(`(property "Value" "${oldValue}"`, "utf8");
  const at = original.indexOf(needle);
  if (at < 0 || original.indexOf(needle, at + 1) >= 0) throw new Error(`test setup: ${needle.toString()} must occur exactly once`);
  const token = at + needle.length - Buffer.byteLength(`"${oldValue}"`);
  return Buffer.concat([original.subarray(0, token), Buffer.from(`"${newValue}"`, "utf8"), original.subarray(at + needle.length)]);
}

describe("loadline fix on a CRLF board", () => {
  it("changes exactly the value bytes, keeps CRLF, reports the change, and exits 0", () => {
    const original = bytes(DIVIDER);
    const report = run([DIVIDER], [wishRule({ R3: "6k8" })]);
    expect(report.errors).toEqual([]);
    expect(report.refused).toEqual([]);
    expect(report.files.map((f) => [f.display, f.written, f.edits.map((e) => e.description)])).toEqual([[DIVIDER, true, ["R3 7k3 -> 6k8"]]]);
    expect(bytes(DIVIDER).equals(expectValueReplaced(original, "7k3", "6k8"))).toBe(true);
    expect(bytes(DIVIDER).includes(Buffer.from("\n")) && !/[^\r]\n/.test(bytes(DIVIDER).toString("latin1"))).toBe(true);
    expect(fixExitCode(report)).toBe(0);
  });

  it("changes nothing the second time (nothing to fix, exit 0)", () => {
    run([DIVIDER], [wishRule({ R3: "6k8" })]);
    const once = bytes(DIVIDER);
    const again = run([DIVIDER], [wishRule({ R3: "6k8" })]);
    expect(again.files).toEqual([]);
    expect(again.refused).toEqual([]);
    expect(fixExitCode(again)).toBe(0);
    expect(bytes(DIVIDER).equals(once)).toBe(true);
  });

  it("writes a value in the board's RKM spelling (IEC 60062 letter-for-decimal-point code: 6800 Ω is 6k8)", () => {
    const original = bytes(DIVIDER);
    const report = run([DIVIDER], [wishRule({ R3: 6800 })]);
    expect(report.files[0]?.edits[0]?.replacement).toBe("6k8");
    expect(bytes(DIVIDER).equals(expectValueReplaced(original, "7k3", "6k8"))).toBe(true);
  });

  it("--dry-run prints a diff with CRLF lines and writes nothing", () => {
    const original = bytes(DIVIDER);
    const report = run([DIVIDER], [wishRule({ R3: "6k8" })], { dryRun: true });
    expect(bytes(DIVIDER).equals(original)).toBe(true);
    const diff = report.files[0]?.diff ?? "";
    expect(report.files[0]?.written).toBe(false);
    expect(diff.startsWith(`--- a/${DIVIDER}\n+++ b/${DIVIDER}\n@@ -568,7 +568,7 @@\n`)).toBe(true);
    expect(diff).toContain('-\t\t(property "Value" "7k3"\r\n+\t\t(property "Value" "6k8"\r\n');
    expect(fixExitCode(report)).toBe(0);
  });

  it("keeps the file's permission bits", () => {
    chmodSync(join(dir, DIVIDER), 0o640);
    run([DIVIDER], [wishRule({ R3: "6k8" })]);
    expect(statSync(join(dir, DIVIDER)).mode & 0o7777).toBe(0o640);
  });

  it("keeps a byte-order mark and non-ASCII text before the span", () => {
    const withBom = Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), bytes(DIVIDER)]);
    writeFileSync(join(dir, DIVIDER), withBom);
    run([DIVIDER], [wishRule({ R2: "5k6", C1: "100 nF" })]);
    const expected = expectValueReplaced(expectValueReplaced(withBom, "4k7", "5k6"), "100n", "100 nF");
    expect(bytes(DIVIDER).equals(expected)).toBe(true);
  });

  it("refuses when the file changed between the check and the write, and keeps the other person's bytes", () => {
    const theirs = expectValueReplaced(bytes(DIVIDER), "10k", "12k");
    const real = nodeWriteFs();
    let first = true;
    const meddling: WriteFs = {
      ...real,
      realpathSync: (path) => {
        if (first) {
          first = false;
          writeFileSync(join(dir, DIVIDER), theirs); // someone saves the schematic right now
        }
        return real.realpathSync(path);
      },
    };
    const report = run([DIVIDER], [wishRule({ R3: "6k8" })], { writeFs: meddling });
    expect(report.files).toEqual([]);
    expect(report.refused.map((r) => r.reason)).toEqual([`${DIVIDER} changed since it was checked; not written (run fix again)`]);
    expect(bytes(DIVIDER).equals(theirs)).toBe(true);
    expect(fixExitCode(report)).toBe(1);
  });
});

describe("loadline fix on a sheet used by two sheet instances", () => {
  it("changes the shared value once when both instances want the same value, and says so", () => {
    const original = bytes(CHANNEL);
    const report = run([RECEIVER], [wishRule({ R107: "6k8", R207: "6k8" })]);
    expect(report.refused).toEqual([]);
    expect(report.files.map((f) => f.display)).toEqual([CHANNEL]);
    expect(report.files[0]?.edits.map((e) => e.description)).toEqual([
      `R107/R207 7k3 -> 6k8 (one value in ${CHANNEL}, shared by /channel 1/, /channel 2/; right for every instance)`,
    ]);
    expect(bytes(CHANNEL).equals(expectValueReplaced(original, "7k3", "6k8"))).toBe(true);
  });

  it("refuses when the instances want different values, names both, and writes nothing", () => {
    const original = bytes(CHANNEL);
    const report = run([RECEIVER], [wishRule({ R107: "6k8", R207: "7k5" })]);
    expect(report.files).toEqual([]);
    expect(report.refused.map((r) => r.reason)).toEqual([
      `R107/R207 share one value in ${CHANNEL}; R107 (/channel 1/) wants 6k8, R207 (/channel 2/) wants 7k5: not changed`,
    ]);
    expect(bytes(CHANNEL).equals(original)).toBe(true);
    expect(fixExitCode(report)).toBe(1);
  });

  it("works from a cwd other than the process's folder, naming files relative to that cwd", () => {
    const home = process.cwd();
    process.chdir(dir); // files now sit inside the process's folder, as in a real run
    try {
      const report = runFix({ paths: ["receiver.kicad_sch"], cwd: join(dir, "two-channel"), lintRules: [wishRule({ R107: "6k8", R207: "6k8" })] });
      expect(report.errors).toEqual([]);
      expect(report.files.map((f) => [f.display, f.written])).toEqual([["channel.kicad_sch", true]]);
    } finally {
      process.chdir(home);
    }
    expect(bytes(CHANNEL).toString("utf8")).toContain('(property "Value" "6k8"');
  });

  it("refuses when only one instance asks", () => {
    const report = run([RECEIVER], [wishRule({ R107: "6k8" })]);
    expect(report.refused[0]?.reason).toMatch(/R207 \(\/channel 2\/\) has no fix for it: not changed$/);
  });
});

describe("loadline fix on a KiCad 6 file with per-instance values", () => {
  it("fixes each instance's own value in the root's symbol_instances, even to different values", () => {
    const root = "two-channel-v6/receiver.kicad_sch";
    const original = bytes(root);
    const child = bytes("two-channel-v6/channel.kicad_sch");
    const report = run([root], [wishRule({ R107: "6k8", R207: "7k5" })]);
    expect(report.refused).toEqual([]);
    const instanceValue = (ref: string, value: string) => Buffer.from(`(reference "${ref}") (unit 1) (value "${value}")`);
    let expected = original;
    for (const [ref, from, to] of [["R107", "7k3", "6k8"], ["R207", "7k3", "7k5"]] as const) {
      const at = expected.indexOf(instanceValue(ref, from));
      expected = Buffer.concat([expected.subarray(0, at), instanceValue(ref, to), expected.subarray(at + instanceValue(ref, from).length)]);
    }
    expect(bytes(root).equals(expected)).toBe(true);
    expect(bytes("two-channel-v6/channel.kicad_sch").equals(child)).toBe(true);
  });
});

describe("the fix boards", () => {
  it("read to the nets worked out by hand in fixtures/fix/README.md", () => {
    const nets = (file: string) => {
      const read = readDesign(join(dir, file));
      if (!read.ok) throw new Error(read.error.message);
      return Object.fromEntries(read.circuit.nets.map((n) => [n.name, n.pins.map((p) => `${p.ref}.${p.pin}`).sort().join(" ")]));
    };
    expect(nets(DIVIDER)).toEqual({ "+9V": "R1.1", "/BIAS": "C1.1 R1.2 R2.1 R3.1", GND: "C1.2 R2.2 R3.2" });
    const receiver = { "/ANT1": "R107.1 R108.1 R91.1", "/ANT2": "R207.1 R208.1 R92.1", "/IF1": "R108.2", "/IF2": "R208.2", GND: "R107.2 R207.2 R91.2 R92.2" };
    expect(nets(RECEIVER)).toEqual(receiver);
    expect(nets("two-channel-v6/receiver.kicad_sch")).toEqual(receiver);
  });
});

describe("loadline fix refuses on doubt", () => {
  it("refuses an edit that would rename a net (a power symbol's Value names its net) and writes nothing", () => {
    const original = bytes(DIVIDER);
    const text = original.toString("utf8");
    // The placed +9V symbol's Value (the second `"+9V"` after the library copy's), as a character span.
    const placed = text.indexOf('(property "Value" "+9V"', text.indexOf('(lib_id "power:+9V")'));
    const start = placed + '(property "Value" '.length;
    const span = { file: join(dir, DIVIDER), start, end: start + '"+9V"'.length };
    const report = run([DIVIDER], [wishRule({}, { extra: [{ span, replacement: "+12V" }] })]);
    expect(report.files).toEqual([]);
    expect(report.refused).toHaveLength(1);
    expect(report.refused[0]?.reason).toMatch(/not changed, because with the change net \+9V is gone; net \+12V is new/);
    expect(bytes(DIVIDER).equals(original)).toBe(true);
  });

  it("refuses the one edit that brings a new finding and makes the other", () => {
    const original = bytes(DIVIDER);
    const report = run([DIVIDER], [wishRule({ R2: "12k", R3: "6k8" }), forbidRule(["12k"])]);
    expect(report.refused.map((r) => r.reason)).toEqual([
      "R2: not changed, because with the change the change brings a new error (value-forbid): R2 must not be 12k",
    ]);
    expect(report.files[0]?.edits.map((e) => e.refs)).toEqual([["R3"]]);
    expect(bytes(DIVIDER).equals(expectValueReplaced(original, "7k3", "6k8"))).toBe(true);
    expect(fixExitCode(report)).toBe(1);
  });

  it("undoes a written file when writing the next one fails", () => {
    const divider = bytes(DIVIDER);
    const channel = bytes(CHANNEL);
    const real = nodeWriteFs();
    const failing: WriteFs = {
      ...real,
      renameSync: (from, to) => {
        if (to.endsWith("channel.kicad_sch")) throw Object.assign(new Error("simulated"), { code: "ENOSPC" });
        real.renameSync(from, to);
      },
    };
    const report = run([DIVIDER, RECEIVER], [wishRule({ R3: "6k8", R107: "6k8", R207: "6k8" })], { writeFs: failing });
    expect(report.files).toEqual([]);
    expect(report.refused.map((r) => r.reason).sort()).toEqual([
      `${DIVIDER}: undone, because writing ${CHANNEL} failed (the original was restored)`,
      `${CHANNEL} could not be written (ENOSPC: simulated); the original is unchanged`,
    ].sort());
    expect(bytes(DIVIDER).equals(divider)).toBe(true);
    expect(bytes(CHANNEL).equals(channel)).toBe(true);
  });

  it("says so when the written file does not read back as written, and leaves it", () => {
    const real = nodeWriteFs();
    const racing: WriteFs = {
      ...real,
      renameSync: (from, to) => {
        real.renameSync(from, to);
        writeFileSync(to, "(kicad_sch (version 20231120))\n"); // another program saves right after us
      },
    };
    const report = run([DIVIDER], [wishRule({ R3: "6k8" })], { writeFs: racing });
    expect(report.files).toEqual([]);
    expect(report.refused[0]?.reason).toBe(
      `${DIVIDER}: written, but re-reading it showed after writing, ${DIVIDER} did not read back as written (changed by someone else?); left as it is now`,
    );
  });

  it("fails the run (exit 2) on a file that cannot be read, writing nothing", () => {
    writeFileSync(join(dir, "broken.kicad_sch"), '(kicad_sch (version 20231120)\n  (symbol (lib_id "Device:R")\n');
    const report = run(["broken.kicad_sch"], [wishRule({ R3: "6k8" })]);
    expect(report.errors.length).toBeGreaterThan(0);
    expect(report.errors[0]?.file).toBe("broken.kicad_sch");
    expect(report.errors[0]?.line).toBeGreaterThan(0);
    expect(fixExitCode(report)).toBe(2);
  });
});
