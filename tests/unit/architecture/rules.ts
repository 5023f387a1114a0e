import type { ImportEdge } from "./import-graph";

/**
 * The layer rules of docs/architecture.md, as checks over the import graph. eslint.config.mjs states
 * the same rules for the editor; this copy reads the source itself, so switching a lint rule off (or an
 * eslint-disable comment) cannot let a wrong import through unnoticed.
 */

const under = (path: string | null, folder: string): boolean =>
  path !== null && (path === folder || path.startsWith(folder + "/"));

/** lib/ files that are the web edge: request, response and session handling on top of Next.js. */
export const WEB_EDGE = ["lib/http.ts", "lib/http", "lib/multipart.ts", "lib/auth/config.ts", "lib/auth/session.ts"];
/** lib/ files that run in the browser as well. */
export const SHARED_CLIENT = ["lib/client"];

const inAny = (path: string | null, folders: string[]) => folders.some((f) => under(path, f));
const isDomain = (file: string) =>
  (under(file, "lib") && !inAny(file, [...WEB_EDGE, ...SHARED_CLIENT])) || under(file, "db") || under(file, "worker");
const NEXT_OR_REACT = /^(next|next-auth|react|react-dom|server-only)(\/|$)/;

export interface Rule {
  name: string;
  /** A violation's description, or null when the edge is allowed. */
  check(edge: ImportEdge): string | null;
}

export const RULES: Rule[] = [
  {
    name: "lib/ never imports components/ or app/",
    check: (e) => (under(e.from, "lib") && (under(e.target, "components") || under(e.target, "app")) ? "lib imports a screen or route" : null),
  },
  {
    name: "the engine imports only its own files, mathjs and ml-matrix",
    check: (e) => {
      if (!under(e.from, "lib/engine")) return null;
      if (e.target === null) return e.specifier === "mathjs" || e.specifier === "ml-matrix" ? null : "the engine imports a package";
      return under(e.target, "lib/engine") ? null : "the engine imports outside itself";
    },
  },
  {
    name: "outside lib/engine, only types come from past lib/engine/index.ts",
    check: (e) =>
      !under(e.from, "lib/engine") && under(e.target, "lib/engine") && e.target !== "lib/engine/index.ts" && !e.typeOnly
        ? "an engine internal imported at run time"
        : null,
  },
  {
    name: "db/ imports nothing of ours above it but lib/env.ts",
    check: (e) => (under(e.from, "db") && e.target !== null && !under(e.target, "db") && e.target !== "lib/env.ts" ? "db imports upwards" : null),
  },
  {
    name: "domain folders never import Next.js, React or the web edge",
    check: (e) => {
      if (!isDomain(e.from)) return null;
      if (NEXT_OR_REACT.test(e.specifier)) return "domain code imports Next.js or React";
      return inAny(e.target, WEB_EDGE) ? "domain code imports the web edge" : null;
    },
  },
  {
    name: "pages and route handlers call services: no schema, queries or SQL in app/",
    check: (e) =>
      under(e.from, "app") && (under(e.target, "db/schema") || under(e.target, "db/queries") || /^(drizzle-orm|pg|pg-boss)(\/|$)/.test(e.specifier))
        ? "a page or route queries the database itself"
        : null,
  },
  {
    name: "components reach data through the API: only types from db/, services, jobs, auth and the worker",
    check: (e) =>
      under(e.from, "components") && !e.typeOnly &&
      (inAny(e.target, ["db", "lib/services", "lib/jobs", "lib/auth", "worker"]) || /^(pg|pg-boss|drizzle-orm)(\/|$)/.test(e.specifier))
        ? "a component imports server code at run time"
        : null,
  },
  {
    name: "the worker never imports screens or routes",
    check: (e) => (under(e.from, "worker") && (under(e.target, "components") || under(e.target, "app")) ? "the worker imports a screen or route" : null),
  },
];

/** Every edge that breaks a rule, as "file:line imports specifier — rule". */
export function violations(edges: ImportEdge[], rules: Rule[] = RULES): string[] {
  const out: string[] = [];
  for (const e of edges) {
    for (const r of rules) {
      const why = r.check(e);
      if (why) out.push(`${e.from}:${e.line} imports ${e.specifier}${e.typeOnly ? " (types)" : ""}: ${why} (${r.name})`);
    }
  }
  return out;
}
