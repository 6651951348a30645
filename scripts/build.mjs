// Bundles the CLI and the GitHub Action into single files (dist/ is committed: the Action runs it
// without installing anything). The benchmark is bundled on request (`--bench`) and never committed.
import { build } from "esbuild";
import { existsSync } from "node:fs";

const banner = {
  // CJS dependencies (commander, undici inside @actions/core) call require(); ESM output needs one.
  js: "import { createRequire as __loadlineCreateRequire } from 'node:module'; const require = __loadlineCreateRequire(import.meta.url);",
};
const common = {
  bundle: true, platform: "node", target: "node20", format: "esm", banner,
  legalComments: "none", logLevel: "warning",
};
// `--bench` builds only the benchmark, so `npm run build` (and the committed dist/) never depends on it.
const entries = process.argv.includes("--bench")
  ? [["bench/index.ts", "bench/out/bench.js"]]
  : [["src/cli/index.ts", "dist/cli.js"], ["src/action/index.ts", "dist/index.js"]];
for (const [entry, outfile] of entries) {
  if (!existsSync(entry)) continue;
  await build({ ...common, entryPoints: [entry], outfile });
}
