import { configDefaults, defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["test/**/*.test.ts"],
    // The slow simulations under test/validate/ run with `npm run validate` (vitest.validate.config.ts).
    exclude: [...configDefaults.exclude, "test/validate/**"],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: "forks",
  },
});
