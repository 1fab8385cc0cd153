import path from "node:path";
import { defineConfig } from "vitest/config";

const alias = {
  "@": path.resolve(__dirname),
  // `server-only` throws outside a React Server Component bundle; tests import server modules directly.
  "server-only": path.resolve(__dirname, "tests/support/empty-module.ts"),
};

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: "unit",
          include: ["tests/geometry/**/*.test.ts", "tests/lib/**/*.test.ts", "tests/scripts/**/*.test.ts"],
          environment: "node",
        },
      },
      {
        resolve: { alias },
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          setupFiles: ["tests/support/require-test-db.ts", "tests/support/mock-next.ts"],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 120_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: "browser",
          include: ["tests/browser/**/*.test.ts"],
          environment: "node",
          globalSetup: ["tests/support/global-server.ts"],
          setupFiles: ["tests/support/require-test-db.ts"],
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 300_000,
        },
      },
    ],
  },
});
