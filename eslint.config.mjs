import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

/**
 * Who may import whom (docs/architecture.md has the diagram). ESLint's flat config does not merge the
 * options of one rule across blocks, so each folder gets one block with every boundary that applies to
 * it; tests/unit/architecture/boundaries.test.ts checks the same rules on the import graph itself.
 */
const restrict = (...groups) => ["error", { patterns: groups.flat() }];

const ENGINE_PURE = {
  group: ["next", "next/*", "react", "react/*", "zod", "drizzle-orm", "drizzle-orm/*", "pg", "pg-boss", "@/*", "fs", "node:*", "../*"],
  message: "lib/engine is pure: numbers in, numbers out; it imports only its own files, mathjs and ml-matrix.",
};
const ENGINE_ENTRY = {
  group: ["@/lib/engine/*", "**/engine/*", "!@/lib/engine/index", "!**/lib/engine/index"],
  allowTypeImports: true,
  message: "Use the engine through its entry, @/lib/engine (types may be imported from its files).",
};
const NO_SCREENS = {
  group: ["@/components/*", "@/app/*", "**/components/*", "**/app/*"],
  message: "lib/, db/ and the worker never import screens or routes.",
};
const NO_WEB = {
  group: ["next", "next/*", "next-auth", "next-auth/*", "react", "react/*", "react-dom", "react-dom/*", "server-only",
    "@/lib/http", "@/lib/http/*", "@/lib/multipart", "@/lib/auth/config", "@/lib/auth/session"],
  message: "Domain code (lib/ outside the web edge, db/, the worker) stays free of Next.js, React and the HTTP layer.",
};
const DB_BASE = {
  group: ["@/lib/*", "!@/lib/env", "@/app/*", "@/components/*", "@/worker/*", "@/scripts/*", "../lib/*", "!../lib/env", "../app/*", "../components/*", "../worker/*"],
  message: "db/ holds the schema, the client and shared queries: it imports nothing of ours but lib/env (configuration).",
};
const ROUTES_CALL_SERVICES = {
  group: ["@/db/schema", "@/db/schema/*", "@/db/queries", "@/db/queries/*", "drizzle-orm", "drizzle-orm/*", "pg", "pg-boss"],
  message: "Pages and route handlers call lib/services; only the database handle (@/db/client) is passed through.",
};
const SCREENS_USE_API = {
  group: ["@/db/*", "@/lib/services/*", "@/lib/jobs/*", "@/lib/auth/*", "@/worker/*", "pg", "pg-boss", "drizzle-orm", "drizzle-orm/*"],
  allowTypeImports: true,
  message: "Components reach data through the JSON API; only types cross from the server.",
};

/** Files of lib/ that are the web edge (Next.js request and session handling). */
const WEB_EDGE = ["lib/http.ts", "lib/http/**", "lib/multipart.ts", "lib/auth/config.ts", "lib/auth/session.ts"];
/** Modules that run in the browser as well as on the server. */
const SHARED_CLIENT = ["lib/client/**"];

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
  { files: ["lib/engine/**"], rules: { "no-restricted-imports": restrict(ENGINE_PURE) } },
  // The engine's subfolders may reach the engine's own files (one level up, two from a sub-subfolder), never out of the engine.
  { files: ["lib/engine/*/**"], rules: { "no-restricted-imports": restrict({ ...ENGINE_PURE, group: [...ENGINE_PURE.group.filter((g) => g !== "../*"), "../../*"] }) } },
  { files: ["lib/engine/*/*/**"], rules: { "no-restricted-imports": restrict({ ...ENGINE_PURE, group: [...ENGINE_PURE.group.filter((g) => g !== "../*"), "../../../*"] }) } },
  { files: ["lib/**"], ignores: ["lib/engine/**", ...WEB_EDGE, ...SHARED_CLIENT], rules: { "no-restricted-imports": restrict(NO_SCREENS, NO_WEB, ENGINE_ENTRY) } },
  { files: [...WEB_EDGE, ...SHARED_CLIENT], rules: { "no-restricted-imports": restrict(NO_SCREENS, ENGINE_ENTRY) } },
  { files: ["db/**"], rules: { "no-restricted-imports": restrict(DB_BASE, NO_WEB) } },
  { files: ["worker/**"], rules: { "no-restricted-imports": restrict(NO_SCREENS, NO_WEB, ENGINE_ENTRY) } },
  { files: ["app/**", "proxy.ts"], rules: { "no-restricted-imports": restrict(ROUTES_CALL_SERVICES, ENGINE_ENTRY) } },
  { files: ["components/**"], rules: { "no-restricted-imports": restrict(SCREENS_USE_API, ENGINE_ENTRY) } },
  { files: ["scripts/**"], rules: { "no-restricted-imports": restrict(NO_SCREENS, ENGINE_ENTRY) } },
];

export default config;
