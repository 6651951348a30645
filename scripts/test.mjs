// `npm test`: typecheck, then the vitest suite, then one plain summary line CI can read.
import { spawnSync } from "node:child_process";
import { readFileSync, rmSync } from "node:fs";

const run = (cmd, args) => spawnSync(cmd, args, { stdio: "inherit", shell: false }).status ?? 1;

if (run("npx", ["tsc", "--noEmit"]) !== 0) {
  console.log("typecheck failed: 0 passed, 1 failed");
  process.exit(1);
}
const results = ".vitest-results.json";
rmSync(results, { force: true });
const status = run("npx", ["vitest", "run", "--reporter=default", "--reporter=json", `--outputFile.json=${results}`, ...process.argv.slice(2)]);
try {
  const r = JSON.parse(readFileSync(results, "utf8"));
  console.log(`${r.numPassedTests} passed, ${r.numFailedTests} failed`);
} catch {
  console.log("0 passed, 1 failed (vitest wrote no results)");
}
process.exit(status);
