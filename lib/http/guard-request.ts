import { NextResponse, type NextRequest } from "next/server";
import { getEnv } from "@/lib/env";
import { formatBytes, jsonBodyLimit, UPLOAD_BYTES } from "./body-limits";
import { allowedOrigins, checkWrite, expectedBodyType, STATE_CHANGING, type Refusal } from "./same-origin";
import { NON_DOCUMENT_CSP, newNonce, pageCsp } from "./security-headers";

let origins: Set<string> | undefined;

function refuse(r: Refusal): NextResponse {
  const fields = r.status === 403 ? undefined : { "(body)": [r.message] };
  const res = NextResponse.json({ error: { code: r.code, message: r.message, ...(fields ? { fields } : {}) } }, { status: r.status });
  res.headers.set("Content-Security-Policy", NON_DOCUMENT_CSP);
  return res;
}

/** A body that declares more bytes than its route reads is refused before it is read. */
function declaredTooLarge(req: NextRequest): Refusal | null {
  const declared = Number(req.headers.get("content-length") ?? 0);
  if (!STATE_CHANGING.has(req.method) || !req.nextUrl.pathname.startsWith("/api/")) return null;
  const path = req.nextUrl.pathname;
  const limit = expectedBodyType(path) === "application/json" ? jsonBodyLimit(path) : UPLOAD_BYTES;
  if (declared <= limit) return null;
  return { status: 413, code: "payload_too_large", message: `The request body is ${formatBytes(declared)}; this request takes at most ${formatBytes(limit)}` };
}

/**
 * What proxy.ts does for every request that is not a static file: refuse cross-site writes,
 * bodies of the wrong type and bodies declared too large (with the app's JSON error shape), then
 * pass the request on with its Content-Security-Policy (pages get a per-request nonce).
 */
export function guardRequest(req: NextRequest): NextResponse {
  origins ??= allowedOrigins(getEnv().APP_URL);
  const refusal = checkWrite({ method: req.method, pathname: req.nextUrl.pathname, headers: req.headers }, origins) ?? declaredTooLarge(req);
  if (refusal) return refuse(refusal);

  if (req.nextUrl.pathname.startsWith("/api/")) {
    const res = NextResponse.next();
    res.headers.set("Content-Security-Policy", NON_DOCUMENT_CSP);
    return res;
  }
  // Next.js reads the nonce from the request's CSP header and puts it on its script tags.
  const csp = pageCsp(newNonce(), process.env.NODE_ENV === "development");
  const requestHeaders = new Headers(req.headers);
  requestHeaders.set("Content-Security-Policy", csp);
  const res = NextResponse.next({ request: { headers: requestHeaders } });
  res.headers.set("Content-Security-Policy", csp);
  return res;
}
