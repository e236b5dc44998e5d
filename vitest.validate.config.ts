import { defineConfig } from "vitest/config";

// Slow seeded simulations (coverage of intervals over thousands of replicates): `npm run validate`.
// MORPHOGAUGE_VALIDATE_SCALE=0.2 runs a bounded version (see test/validate/validateScale.ts).
export default defineConfig({
  test: {
    include: ["test/validate/**/*.test.ts"],
    testTimeout: 1_800_000,
    hookTimeout: 60_000,
    pool: "forks",
  },
});
