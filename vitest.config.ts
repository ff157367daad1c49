import { defineConfig } from "vitest/config";
import path from "node:path";

const root = import.meta.dirname;

// Three projects: pure unit tests; integration tests against the real
// PostgreSQL and fake SMTP server that scripts/test.sh starts; browser journeys
// in headless Chromium against the production build.
export default defineConfig({
  resolve: {
    alias: {
      "@": root,
      // Outside Next's server bundle the marker package would throw on import.
      "server-only": path.join(root, "tests/support/server-only-stub.ts"),
    },
  },
  test: {
    projects: [
      {
        extends: true,
        test: { name: "unit", include: ["tests/unit/**/*.test.ts"], environment: "node" },
      },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.e2e.test.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 90_000,
        },
      },
    ],
  },
});
