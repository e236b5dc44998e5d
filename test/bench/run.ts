import { runFitBench } from "./fitBench.ts";

// Benchmarks of the hot paths against reference implementations on the same input.
// Not tests: they use the clock. Run with `npm run bench`.
runFitBench();
