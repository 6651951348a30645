// Runs a TypeScript script of ours (fixture generator, one-off tools) by bundling it to a temp file.
import { build } from "esbuild";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";

const [entry, ...args] = process.argv.slice(2);
if (!entry) { console.error("usage: node scripts/run-ts.mjs FILE.ts [args…]"); process.exit(2); }
const dir = mkdtempSync(join(tmpdir(), "loadline-run-"));
const outfile = join(dir, "script.mjs");
try {
  await build({ entryPoints: [entry], outfile, bundle: true, platform: "node", target: "node20", format: "esm",
    packages: "external", logLevel: "warning" });
  process.argv = [process.argv[0], entry, ...args];
  await import(pathToFileURL(outfile).href);
} finally {
  rmSync(dir, { recursive: true, force: true });
}
