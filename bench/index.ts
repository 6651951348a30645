// `npm run bench`: speed and memory of the reader and the solver, measured rather than asserted.
// Sections run in separate child processes would isolate peak RSS better; the reader bench reports
// its own peak for each project it reads.
import { benchRead } from "./read-bench.js";
import { benchSolve } from "./solve-bench.js";

const only = process.argv[2];
if (!only || only === "read") await benchRead();
if (!only || only === "solve") await benchSolve();
