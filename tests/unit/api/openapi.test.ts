import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildOpenApiDocument, ENDPOINTS } from "@/lib/openapi";

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((e) => {
    const p = path.join(dir, e);
    return statSync(p).isDirectory() ? routeFiles(p) : e === "route.ts" ? [p] : [];
  });
}

/** Every (method, path) the app/api folder really serves, read from the route files. */
function servedEndpoints(): string[] {
  const out: string[] = [];
  for (const file of routeFiles("app/api")) {
    const rel = path.dirname(path.relative("app", file)).split(path.sep).join("/");
    if (rel.startsWith("api/auth/")) continue; // Auth.js's own protocol
    const apiPath = "/" + rel.replace(/\[(\w+)\]/g, "{$1}");
    const src = readFileSync(file, "utf8");
    for (const m of src.matchAll(/export (?:const|async function|function) (GET|POST|PUT|PATCH|DELETE)\b/g)) out.push(`${m[1].toLowerCase()} ${apiPath}`);
  }
  return out.sort();
}

describe("the OpenAPI document", () => {
  it("lists exactly the endpoints the route handlers serve", () => {
    expect(ENDPOINTS.map((e) => `${e.method} ${e.path}`).sort()).toEqual(servedEndpoints());
  });

  it("describes request bodies from the zod schemas", () => {
    const doc = buildOpenApiDocument("http://127.0.0.1:3000");
    type Body = { properties: Record<string, unknown>; required: string[] };
    const create = doc.paths["/api/projects/{projectId}/sweeps"].post as { requestBody: { content: { "application/json": { schema: { anyOf: Body[] } } } } };
    // A sweep of a model of one reaction, or of several: both bodies are listed.
    const [schema, network] = create.requestBody.content["application/json"].schema.anyOf;
    expect(Object.keys(schema!.properties)).toEqual(expect.arrayContaining(["kineticsVersionId", "target", "train", "objective", "grid"]));
    expect(schema!.required).toEqual(expect.arrayContaining(["kineticsVersionId", "target", "train"]));
    expect(Object.keys(network!.properties)).toEqual(expect.arrayContaining(["kineticsVersionId", "thermal", "train", "objective", "constraints", "grid"]));
    expect(network!.required).toEqual(expect.arrayContaining(["kineticsVersionId", "train", "objective"]));
    const model = doc.paths["/api/projects/{projectId}/kinetics"].post as { requestBody: { content: { "application/json": { schema: { anyOf: { properties: { spec: { properties: Record<string, unknown> } } }[] } } } } };
    expect(Object.keys(model.requestBody.content["application/json"].schema.anyOf[1]!.properties.spec.properties)).toEqual(expect.arrayContaining(["reactions", "keyReactant", "product"]));
    const candidates = doc.paths["/api/sweeps/{sweepId}/scenarios/{index}/candidates"].get as { parameters: { name: string; in: string }[] };
    expect(candidates.parameters.map((p) => p.name)).toEqual(["sweepId", "index", "sort", "dir", "feasible", "contains", "stages", "page", "pageSize", "include"]);
  });
});
