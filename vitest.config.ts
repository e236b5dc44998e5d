import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["test/**/*.test.ts"],
    // Long simulation checks run with `npm run validate` (vitest.validate.config.ts).
    exclude: ["test/validate/**", "**/node_modules/**"],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: "forks",
  },
});
