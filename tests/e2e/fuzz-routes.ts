import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import type { JsonSchema } from "./fuzz-values";

export type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";

/** One handler of the API as the fuzz sees it: read from the route files, described by the OpenAPI document. */
export interface FuzzRoute {
  method: Method;
  /** "/api/projects/{projectId}" */
  template: string;
  params: string[];
  jsonBody?: JsonSchema;
  form?: JsonSchema;
  query: { name: string; schema: JsonSchema }[];
}

// Auth.js answers under one catch-all; these are the addresses of it that clients reach.
const AUTH_PATHS: Record<Method, string[]> = {
  GET: ["/api/auth/session", "/api/auth/csrf", "/api/auth/providers", "/api/auth/error", "/api/auth/signin"],
  POST: ["/api/auth/callback/credentials", "/api/auth/signin/nodemailer", "/api/auth/signout"],
  PUT: [],
  PATCH: [],
  DELETE: [],
};

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((e) => {
    const p = path.join(dir, e);
    return statSync(p).isDirectory() ? routeFiles(p) : e === "route.ts" ? [p] : [];
  });
}

interface OpenApiOperation {
  parameters?: { name: string; in: string; schema: JsonSchema }[];
  requestBody?: { content: Record<string, { schema: JsonSchema }> };
}

/**
 * Every (method, path) served under app/api, so a new route file is fuzzed without editing the
 * test; bodies and query parameters from the OpenAPI document where it describes them.
 */
export function discoverRoutes(openapi: { paths: Record<string, Record<string, OpenApiOperation>> }): FuzzRoute[] {
  const out: FuzzRoute[] = [];
  for (const file of routeFiles("app/api")) {
    const rel = path.dirname(path.relative("app", file)).split(path.sep).join("/");
    const src = readFileSync(file, "utf8");
    const methods = [...src.matchAll(/export (?:const|async function|function) (GET|POST|PUT|PATCH|DELETE)\b/g)].map((m) => m[1] as Method);
    for (const method of methods) {
      if (rel.includes("[...")) {
        for (const p of AUTH_PATHS[method]) out.push({ method, template: p, params: [], query: [] });
        continue;
      }
      const template = "/" + rel.replace(/\[(\w+)\]/g, "{$1}");
      const op = openapi.paths[template]?.[method.toLowerCase()];
      out.push({
        method,
        template,
        params: [...template.matchAll(/\{(\w+)\}/g)].map((m) => m[1]),
        jsonBody: op?.requestBody?.content["application/json"]?.schema,
        form: op?.requestBody?.content["multipart/form-data"]?.schema,
        query: (op?.parameters ?? []).filter((p) => p.in === "query").map((p) => ({ name: p.name, schema: p.schema })),
      });
    }
  }
  return out.sort((a, b) => `${a.template} ${a.method}`.localeCompare(`${b.template} ${b.method}`));
}

/** The path with each {param} replaced by the value given (already percent-encoded as wanted). */
export function fillPath(template: string, values: Record<string, string>): string {
  return template.replace(/\{(\w+)\}/g, (_, name: string) => values[name]);
}
