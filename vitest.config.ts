import { configDefaults, defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["test/**/*.test.ts"],
    // The slow simulations under test/validate/ run with `npm run validate` (vitest.validate.config.ts).
    exclude: [...configDefaults.exclude, "test/validate/**"],
    testTimeout: 180_000,
    hookTimeout: 180_000,
    pool: "forks",
    // Commands the tests start run the TypeScript sources, never a dist/ left by an earlier build;
    // test/cli/compiledBuild.test.ts builds and checks the compiled output itself.
    env: { MORPHOGAUGE_FROM_SOURCE: "1" },
  },
});
