// The atomic writer on a real temporary folder, with failures injected through its fs seam.
import { chmodSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, symlinkSync, writeFileSync, lstatSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { nodeWriteFs, replaceFileAtomically, type WriteFs } from "../src/fix/write.js";

let folder: string;
beforeEach(() => {
  folder = mkdtempSync(join(tmpdir(), "loadline-write-"));
});
afterEach(() => rmSync(folder, { recursive: true, force: true }));

const before = Buffer.from('(kicad_sch (version 20231120)\r\n  (property "Value" "7k5")\r\n)\r\n');
const after = Buffer.from('(kicad_sch (version 20231120)\r\n  (property "Value" "6k8")\r\n)\r\n');

describe("replaceFileAtomically", () => {
  it("replaces the bytes, keeps the permission bits and leaves no temporary file", () => {
    const file = join(folder, "amp.kicad_sch");
    writeFileSync(file, before);
    chmodSync(file, 0o640);
    const outcome = replaceFileAtomically(file, before, after);
    expect(outcome.ok).toBe(true);
    expect(readFileSync(file).equals(after)).toBe(true);
    expect(statSync(file).mode & 0o7777).toBe(0o640);
    expect(readdirSync(folder)).toEqual(["amp.kicad_sch"]);
  });

  it("keeps an unusual mode too (group-writable, no read for others)", () => {
    const file = join(folder, "amp.kicad_sch");
    writeFileSync(file, before);
    chmodSync(file, 0o660);
    expect(replaceFileAtomically(file, before, after).ok).toBe(true);
    expect(statSync(file).mode & 0o7777).toBe(0o660);
  });

  it("refuses when the file no longer holds the checked bytes", () => {
    const file = join(folder, "amp.kicad_sch");
    writeFileSync(file, Buffer.from('(kicad_sch (version 20231120)\r\n  (property "Value" "8k2")\r\n)\r\n'));
    const outcome = replaceFileAtomically(file, before, after);
    expect(outcome).toEqual({ ok: false, reason: `${file} changed since it was checked; not written (run fix again)` });
    expect(readFileSync(file).toString()).toContain('"8k2"');
  });

  it("refuses when someone writes the file while the temporary file is being written", () => {
    const file = join(folder, "amp.kicad_sch");
    writeFileSync(file, before);
    const real = nodeWriteFs();
    const racing: WriteFs = {
      ...real,
      fsyncSync: (fd) => {
        real.fsyncSync(fd);
        writeFileSync(file, "someone else's edit");
      },
    };
    const outcome = replaceFileAtomically(file, before, after, racing);
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.reason).toMatch(/changed while the fix was being written/);
    expect(readFileSync(file, "utf8")).toBe("someone else's edit");
    expect(readdirSync(folder)).toEqual(["amp.kicad_sch"]);
  });

  it("leaves the original and removes the temporary file when the rename fails", () => {
    const file = join(folder, "amp.kicad_sch");
    writeFileSync(file, before);
    const failing: WriteFs = {
      ...nodeWriteFs(),
      renameSync: () => {
        throw Object.assign(new Error("simulated"), { code: "EXDEV" });
      },
    };
    const outcome = replaceFileAtomically(file, before, after, failing);
    expect(outcome).toEqual({ ok: false, reason: `${file} could not be written (EXDEV: simulated); the original is unchanged` });
    expect(readFileSync(file).equals(before)).toBe(true);
    expect(readdirSync(folder)).toEqual(["amp.kicad_sch"]);
  });

  it("fails, without hanging, when writes make no progress", () => {
    const file = join(folder, "amp.kicad_sch");
    writeFileSync(file, before);
    const stuck: WriteFs = { ...nodeWriteFs(), writeSync: () => 0 };
    const outcome = replaceFileAtomically(file, before, after, stuck);
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.reason).toMatch(/no progress/);
    expect(readFileSync(file).equals(before)).toBe(true);
  });

  it("writes through a symlink to its target and keeps the link", () => {
    const target = join(folder, "real.kicad_sch");
    const link = join(folder, "link.kicad_sch");
    writeFileSync(target, before);
    symlinkSync("real.kicad_sch", link);
    const outcome = replaceFileAtomically(link, before, after);
    expect(outcome).toEqual({ ok: true, path: target });
    expect(lstatSync(link).isSymbolicLink()).toBe(true);
    expect(readFileSync(target).equals(after)).toBe(true);
  });

  it("says so when the file is gone", () => {
    const outcome = replaceFileAtomically(join(folder, "missing.kicad_sch"), before, after);
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.reason).toMatch(/could not be read again before writing \(ENOENT/);
  });
});
