import { defineConfig } from "vitest/config";

/** Long simulation checks (`npm run validate`), kept out of `npm test`. */
export default defineConfig({
  test: {
    include: ["test/validate/**/*.test.ts"],
    testTimeout: 3_600_000,
    hookTimeout: 600_000,
    pool: "forks",
  },
});
