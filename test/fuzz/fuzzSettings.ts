/**
 * How many random cases each fuzz property tries: a bounded number in
 * `npm test`, many more in `npm run fuzz` (MORPHOGAUGE_FUZZ_RUNS). The seed is
 * fixed, so a failure is reproducible; MORPHOGAUGE_FUZZ_SEED explores another stream.
 */
export const FUZZ_RUNS = Number(process.env.MORPHOGAUGE_FUZZ_RUNS ?? 25);
export const FUZZ_SEED = Number(process.env.MORPHOGAUGE_FUZZ_SEED ?? 20261202);
/** Longest one case may take before it counts as a hang, in ms (generous: the CI machine is shared). */
export const CASE_TIME_LIMIT_MS = 10_000;
