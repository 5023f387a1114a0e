import { fillPath, type FuzzRoute } from "./fuzz-routes";
import { Fuzzer, MALFORMED_IDS, RAW_BODIES, WRONG_CONTENT_TYPES } from "./fuzz-values";

/** One request of the fuzz, ready to send; `label` says what it tried, for the failure list. */
export interface FuzzRequest {
  label: string;
  method: string;
  path: string;
  headers: Record<string, string>;
  body?: string | Uint8Array<ArrayBuffer> | FormData;
}

// Query values, already percent-encoded as sent: bad encodings, NUL, control characters, huge.
const QUERY_VALUES = ["%00", "%FF%FE", "%ED%A0%80", "%", "%zz", "a%00b", "%0A", "%C0%AF", "x".repeat(3000), "-1", "1e309", "NaN", "%F0%9F%A7%AA", "'%20or%201=1--"];
const QUERY_NAMES = ["entityType", "entityId", "archived", "ids", "sort", "page", "pageSize", "format", "%00", "x"];

const JSON_TYPE = { "Content-Type": "application/json" };
const isWrite = (m: string) => m !== "GET";

function encodeJson(value: unknown): string {
  return JSON.stringify(value);
}

function withContentType(type: string | null): Record<string, string> {
  return type === null ? {} : { "Content-Type": type };
}

/** A junk body: not JSON, not the JSON expected, or the wrong content type. */
function junkBody(f: Fuzzer): Pick<FuzzRequest, "headers" | "body"> & { what: string } {
  const raw = f.pick(RAW_BODIES);
  const type = f.chance(0.5) ? "application/json" : f.pick(WRONG_CONTENT_TYPES);
  return { headers: withContentType(type), body: raw, what: `junk body (${type ?? "no content type"})` };
}

/** A multipart upload with one bad part: file name, text field, or the mapping JSON. */
function badUpload(f: Fuzzer, route: FuzzRoute): Pick<FuzzRequest, "headers" | "body"> & { what: string } {
  const form = new FormData();
  const fields = Object.keys(route.form?.properties ?? { accept: {} }).filter((k) => k !== "file");
  const bad = f.pick([...fields, "file name", "file"]);
  for (const name of fields) {
    const good = name === "mapping" ? encodeJson({ columns: { conc: "concA", rate: "rate" } }) : name === "accept" ? "true" : "Fuzz upload";
    form.set(name, name === bad ? f.pick([f.nastyString(), "{", encodeJson({ columns: { "\u0000": "rate" } }), encodeJson({ columns: { "\uD800": "rate" } })]) : good);
  }
  const fileName = bad === "file name" ? f.pick(["rates\u0000.csv", "\u0000.xlsx", "a".repeat(400) + ".csv"]) : "rates.csv";
  const content = bad === "file" ? f.pick(["\u0000\u0000", "conc,rate\n\u0000,1\n", "PK\u0003\u0004 not a zip", "tag,type,volume\nT\u0000,CSTR,1\n"]) : "conc,rate\n100,0.1\n200,0.2\n";
  form.set("file", new Blob([content], { type: "text/csv" }), fileName);
  if (f.chance(0.15)) form.set("\u0000", "unknown field");
  return { headers: {}, body: form, what: `upload with bad ${bad}` };
}

/** A sign-in form with one field made bad, or a body that is not a form at all. */
function badSignIn(f: Fuzzer): Pick<FuzzRequest, "headers" | "body"> & { what: string } {
  if (f.chance(0.5)) {
    const b = junkBody(f);
    return { ...b, headers: { ...b.headers, "X-Auth-Return-Redirect": "1" } };
  }
  const fields: Record<string, string> = { email: `fuzz.${f.int(1e6)}@nowhere.example`, password: "not-the-password", csrfToken: "fuzz" };
  const bad = f.pick(["email", "email", "password", "csrfToken"]);
  fields[bad] = f.nastyString();
  if (bad === "password") fields.email = f.pick(["", "not-an-address", "\u0000@x.example"]);
  const body = Object.entries(fields)
    .map(([k, v]) => `${k}=${encodeURIComponent(v.replace(/[\uD800-\uDFFF]/g, "?"))}`)
    .join("&");
  return { headers: { "Content-Type": "application/x-www-form-urlencoded", "X-Auth-Return-Redirect": "1" }, body, what: `sign-in form with bad ${bad}` };
}

function badQuery(f: Fuzzer, route: FuzzRoute): { query: string; what: string } {
  const names = route.query.length ? route.query.map((q) => q.name) : QUERY_NAMES;
  const parts: string[] = [];
  const n = 1 + f.int(3);
  for (let i = 0; i < n; i++) parts.push(`${f.chance(0.85) ? f.pick(names) : f.pick(QUERY_NAMES)}=${f.pick(QUERY_VALUES)}`);
  return { query: "?" + parts.join("&"), what: `query ${parts.join("&").slice(0, 80)}` };
}

/**
 * One request for a route. Ids of the team's own records are used only where the body is
 * refused anyway, so the fuzz never deletes or changes a record; other requests carry a
 * malformed id or an id that does not exist.
 */
export function buildRequest(f: Fuzzer, route: FuzzRoute, ids: Record<string, string>): FuzzRequest {
  const valid = Object.fromEntries(route.params.map((p) => [p, p === "index" ? "0" : (ids[p] ?? f.uuid())]));
  const destructive = isWrite(route.method) && !route.jsonBody && !route.form && route.params.length > 0;
  let params = valid;
  let what = "";
  // A GET whose query the route does not read gains nothing from a real id: only bad ids.
  const idOnly = destructive || (route.method === "GET" && route.query.length === 0);
  if (route.params.length && (f.chance(0.45) || idOnly)) {
    const p = f.pick(route.params);
    const malformed = destructive && f.chance(0.3) ? f.uuid() : f.pick(MALFORMED_IDS);
    params = { ...(destructive ? Object.fromEntries(route.params.map((q) => [q, f.uuid()])) : valid), [p]: malformed };
    what = `${p}=${malformed.slice(0, 40)}`;
  }
  const path = fillPath(route.template, params);
  const label = (extra: string) => `${route.method} ${route.template} [${[what, extra].filter(Boolean).join("; ")}]`;

  if (!isWrite(route.method)) {
    if (what && f.chance(0.7)) return { label: label(""), method: route.method, path, headers: {} };
    const q = badQuery(f, route);
    return { label: label(q.what), method: route.method, path: path + q.query, headers: {} };
  }
  if (route.template.startsWith("/api/auth/")) {
    const b = badSignIn(f);
    return { label: label(b.what), method: route.method, path, headers: b.headers, body: b.body };
  }
  if (what && route.jsonBody && f.chance(0.7)) {
    // A well-formed body: the malformed id alone must be refused.
    return { label: label("well-formed body"), method: route.method, path, headers: JSON_TYPE, body: encodeJson(f.sample(route.jsonBody)) };
  }
  if (route.jsonBody && f.chance(0.8)) {
    const body = f.mutate(f.sample(route.jsonBody));
    const type = f.chance(0.85) ? "application/json" : f.pick(WRONG_CONTENT_TYPES);
    return { label: label(`mutated body ${encodeJson(body).slice(0, 100)} (${type ?? "no content type"})`), method: route.method, path, headers: withContentType(type), body: encodeJson(body) };
  }
  if ((route.form || route.template.endsWith("/import")) && f.chance(0.7)) {
    const b = badUpload(f, route);
    return { label: label(b.what), method: route.method, path, headers: b.headers, body: b.body };
  }
  const b = junkBody(f);
  return { label: label(b.what), method: route.method, path, headers: b.headers, body: b.body };
}
