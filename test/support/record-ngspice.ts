// (Re)records the ngspice reference output for every deck in test/reference/ngspice/:
//   node scripts/run-ts.mjs test/support/record-ngspice.ts [NAME …]
// Writes NAME.raw.json beside NAME.cir with the ngspice version that produced it. Only the
// real part of the AC frequency scale is kept (the rawfile's imaginary part there is junk).

import { readdirSync, writeFileSync } from "node:fs";
import { REFERENCE_DIR, recordingPath, runNgspice, type Recording } from "./ngspice.js";

function tidy(rec: Recording): Recording {
  return {
    ...rec,
    plots: rec.plots.map((p) => {
      if (!p.imag) return p;
      const imag = { ...p.imag };
      delete imag["frequency"];
      return { ...p, imag };
    }),
  };
}

const requested = process.argv.slice(2);
const names = requested.length
  ? requested
  : readdirSync(REFERENCE_DIR).filter((f) => f.endsWith(".cir")).map((f) => f.replace(/\.cir$/, "")).sort();
for (const name of names) {
  const rec = tidy(runNgspice(name));
  writeFileSync(recordingPath(name), `${JSON.stringify(rec)}\n`);
  const points = rec.plots.map((p) => `${p.plotname}: ${p.real[p.variables[0] ?? ""]?.length ?? 0} points`).join(", ");
  console.log(`${name}: ${rec.ngspice}, ${points}`);
}
