import { NextResponse, type NextRequest } from "next/server";
import { getEnv } from "@/lib/env";
import { jsonBodyLimit, UPLOAD_BYTES } from "./body-limits";
import { bodyTooLarge, fileTooLarge } from "./read-body";
import { allowedOrigins, checkWrite, expectedBodyType, STATE_CHANGING, type Refusal } from "./same-origin";
import { NON_DOCUMENT_CSP, newNonce, pageCsp } from "./security-headers";

let origins: Set<string> | undefined;

function answer(body: unknown, status: number): NextResponse {
  const res = NextResponse.json(body, { status });
  res.headers.set("Content-Security-Policy", NON_DOCUMENT_CSP);
  return res;
}

function refuse(r: Refusal): NextResponse {
  const fields = r.status === 403 ? undefined : { "(body)": [r.message] };
  return answer({ error: { code: r.code, message: r.message, ...(fields ? { fields } : {}) } }, r.status);
}

/** A body that declares more bytes than its route reads is refused before it is read. */
function declaredTooLarge(req: NextRequest): NextResponse | null {
  const path = req.nextUrl.pathname;
  if (!STATE_CHANGING.has(req.method) || !path.startsWith("/api/")) return null;
  const declared = Number(req.headers.get("content-length") ?? 0);
  const type = expectedBodyType(path);
  const limit = type === "application/json" ? jsonBodyLimit(path) : UPLOAD_BYTES;
  if (!(declared > limit)) return null;
  const err = type === "multipart/form-data" ? fileTooLarge() : bodyTooLarge(limit, declared);
  return answer(err.toJSON(), err.status);
}

/**
 * What proxy.ts does for every request that is not a static file: refuse cross-site writes,
 * bodies of the wrong type and bodies declared too large (with the app's JSON error shape), then
 * pass the request on with its Content-Security-Policy (pages get a per-request nonce).
 */
export function guardRequest(req: NextRequest): NextResponse {
  origins ??= allowedOrigins(getEnv().APP_URL);
  const refusal = checkWrite({ method: req.method, pathname: req.nextUrl.pathname, headers: req.headers }, origins);
  if (refusal) return refuse(refusal);
  const tooLarge = declaredTooLarge(req);
  if (tooLarge) return tooLarge;

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
