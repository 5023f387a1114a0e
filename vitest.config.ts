import { defineConfig } from "vitest/config";
import { fileURLToPath } from "node:url";

const root = fileURLToPath(new URL(".", import.meta.url));

export default defineConfig({
  resolve: { alias: { "@": root } },
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
          globalSetup: ["tests/integration/global-setup.ts"],
          fileParallelism: false,
          // Generous: these wait for real conditions (a worker process starting, a sweep ending)
          // on a 2-core machine that CI may be sharing with other jobs; they time nothing.
          testTimeout: 120000,
          hookTimeout: 180000,
        },
      },
      {
        extends: true,
        test: {
          // `npm start` in a fresh clone, signals, a killed worker, a database restart.
          name: "system",
          include: ["tests/system/**/*.test.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 300000,
          hookTimeout: 120000,
        },
      },
    ],
  },
});
