/**
 * Cross-site write protection, decided from the request headers alone (no database, no body):
 * proxy.ts calls `checkWrite` for every request before routing.
 *
 * A state-changing request (POST, PUT, PATCH, DELETE) is refused with 403 when it comes from a
 * page of another origin, and with 415 when its body is not of the one type its route reads.
 * Pure functions of plain values, so they are unit-tested without a server.
 */

export const STATE_CHANGING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/** Names a browser uses for this machine; equivalent when APP_URL names one of them. */
const LOOPBACK_HOSTS = ["127.0.0.1", "localhost", "[::1]"];

/**
 * The origins a browser page of this app can have: APP_URL's, and when APP_URL names the
 * loopback interface, the same scheme and port under the other loopback names (a user who opens
 * http://localhost:3000 while APP_URL says http://127.0.0.1:3000 is on the same machine and
 * port). Another port is another origin, whatever the host.
 */
export function allowedOrigins(appUrl: string): Set<string> {
  const app = new URL(appUrl);
  const origins = new Set([app.origin]);
  if (LOOPBACK_HOSTS.includes(app.hostname)) {
    for (const host of LOOPBACK_HOSTS) origins.add(`${app.protocol}//${host}${app.port ? `:${app.port}` : ""}`);
  }
  return origins;
}

export interface WriteRequest {
  method: string;
  pathname: string;
  headers: Headers;
}

export interface Refusal {
  status: 403 | 415;
  code: "forbidden" | "unsupported_media_type";
  message: string;
}

const CROSS_SITE: Refusal = {
  status: 403,
  code: "forbidden",
  message: "This change was sent from a page outside Seriatim and was refused. Make the change in Seriatim itself.",
};

const NO_PROOF: Refusal = {
  status: 403,
  code: "forbidden",
  message: "This change carries a sign-in cookie but does not say which page sent it, so it was refused. Make the change in Seriatim itself, or use a personal API token from a script.",
};

function originOf(url: string): string | null {
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}

/**
 * Origin first (every current browser sends it on a state-changing request; "null", as from a
 * sandboxed frame or a data: page, is foreign), then Sec-Fetch-Site, then Referer. A request
 * with none of them did not come from a browser page: it is let through when it carries no
 * cookie (nothing to ride on) and refused when it does. A Bearer token is not ambient (a page of
 * another site cannot attach one without a CORS preflight, which the app never grants), so such
 * requests skip the check.
 */
export function checkOrigin(req: WriteRequest, allowed: Set<string>): Refusal | null {
  if (!STATE_CHANGING.has(req.method)) return null;
  if (/^bearer\s/i.test(req.headers.get("authorization") ?? "")) return null;
  const origin = req.headers.get("origin");
  if (origin !== null) return allowed.has(origin) ? null : CROSS_SITE;
  const site = req.headers.get("sec-fetch-site");
  if (site !== null) return site === "same-origin" || site === "none" ? null : CROSS_SITE;
  const referer = req.headers.get("referer");
  if (referer !== null) {
    const from = originOf(referer);
    return from !== null && allowed.has(from) ? null : CROSS_SITE;
  }
  return req.headers.has("cookie") ? NO_PROOF : null;
}

/** Routes that take a file: multipart/form-data. */
const UPLOAD_ROUTES = [
  /^\/api\/projects\/[^/]+\/datasets(\/preview)?\/?$/,
  /^\/api\/datasets\/[^/]+\/versions\/?$/,
  /^\/api\/inventory\/import\/?$/,
];

/** The body type a route reads: Auth.js's own forms, file uploads, or JSON everywhere else. */
export function expectedBodyType(pathname: string): "application/x-www-form-urlencoded" | "multipart/form-data" | "application/json" {
  if (pathname === "/api/auth" || pathname.startsWith("/api/auth/")) return "application/x-www-form-urlencoded";
  if (UPLOAD_ROUTES.some((r) => r.test(pathname))) return "multipart/form-data";
  return "application/json";
}

const hasBody = (h: Headers) => h.has("transfer-encoding") || Number(h.get("content-length") ?? 0) > 0;

const BODY_TYPE_WORDS = {
  "application/json": "JSON (Content-Type: application/json)",
  "multipart/form-data": "a file form (Content-Type: multipart/form-data)",
  "application/x-www-form-urlencoded": "a sign-in form (Content-Type: application/x-www-form-urlencoded)",
} as const;

/**
 * A state-changing request under /api must send its body as the one type its route reads; a
 * form or text/plain body (what a page of another site can send without asking first) is
 * refused before any route sees it. A request without a body (a DELETE, a "cancel") needs no type.
 */
export function checkBodyType(req: WriteRequest): Refusal | null {
  if (!STATE_CHANGING.has(req.method) || !req.pathname.startsWith("/api/")) return null;
  const type = (req.headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
  if (!type && !hasBody(req.headers)) return null;
  const expected = expectedBodyType(req.pathname);
  if (type === expected) return null;
  return { status: 415, code: "unsupported_media_type", message: `The request body must be ${BODY_TYPE_WORDS[expected]}` };
}

/** Both checks, origin first: a foreign page learns nothing about what the route would accept. */
export function checkWrite(req: WriteRequest, allowed: Set<string>): Refusal | null {
  return checkOrigin(req, allowed) ?? checkBodyType(req);
}
