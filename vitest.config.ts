// Test runner configuration: vitest over test/, one fork per file, generous timeouts
// (no wall-clock assertions live in tests; timeouts only stop runaway cases).
import { defineConfig } from "vitest/config";

export default defineConfig({
  test: {
    include: ["test/**/*.test.ts"],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: "forks",
  },
});
