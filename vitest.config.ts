import { defineConfig } from "vitest/config";
import path from "node:path";

const alias = { "@": path.resolve(import.meta.dirname) };

// Three projects: pure unit tests, integration tests against the real PostgreSQL,
// and browser tests against the production build in Debian's Chromium.
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: "unit", include: ["tests/unit/**/*.test.ts"], environment: "node" },
      },
      {
        // Route handlers and queries import "server-only", which throws outside React server code; here it is a no-op.
        resolve: { alias: { ...alias, "server-only": path.resolve(import.meta.dirname, "node_modules/server-only/empty.js") } },
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          globalSetup: ["tests/integration/global-setup.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        // The browser tests load the demo seed, which saves analyses through the server's queries.
        resolve: { alias: { ...alias, "server-only": path.resolve(import.meta.dirname, "node_modules/server-only/empty.js") } },
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          globalSetup: ["tests/e2e/global-setup.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 300_000,
        },
      },
    ],
  },
});
