import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

/** Who may import whom (see DEVELOPERS.md); each rule stands behind a boundary. */
const restrict = (patterns) => ["error", { patterns }];

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: [".next/**", "node_modules/**", ".data/**", "drizzle/**", "test-results/**", "playwright-report/**", "next-env.d.ts"],
  },
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "no-eval": "error",
      "no-implied-eval": "error",
      "no-new-func": "error",
    },
  },
  {
    files: ["lib/engine/**"],
    rules: {
      "no-restricted-imports": restrict([
        { group: ["next", "next/*", "react", "react/*", "zod", "drizzle-orm", "drizzle-orm/*", "pg", "pg-boss", "@/db/*", "@/app/*", "@/components/*", "fs", "node:*"], message: "lib/engine is pure: numbers in, numbers out." },
      ]),
    },
  },
  {
    files: ["db/**", "lib/services/**", "lib/jobs/**", "lib/authz/**", "worker/**"],
    rules: {
      "no-restricted-imports": restrict([
        { group: ["next", "next/*", "react", "react/*", "@/app/*", "@/components/*", "server-only"], message: "Services, the database layer and the worker stay free of Next.js and React." },
      ]),
    },
  },
  {
    files: ["components/**"],
    rules: {
      "no-restricted-imports": restrict([
        { group: ["@/db/client", "@/db/seed", "@/lib/services/*", "@/worker/*", "pg", "pg-boss"], allowTypeImports: true, message: "Components reach data through the JSON API, not the database." },
      ]),
    },
  },
];

export default config;
