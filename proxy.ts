import type { NextRequest } from "next/server";
import { guardRequest } from "@/lib/http/guard-request";
import { malformedPathResponse } from "@/lib/http/raw-path";
import { NON_DOCUMENT_CSP } from "@/lib/http/security-headers";

/**
 * Runs before routing, for pages and the API (not for Next's static files). An address Next
 * could not decode into route parameters is answered here (404 in our error shape) instead of
 * failing inside Next's router with a 500; then cross-site writes, body types and declared sizes
 * are refused, in one place, and every page gets its Content-Security-Policy nonce. The logic
 * lives in lib/http/; see docs/security.md.
 */
export function proxy(request: NextRequest) {
  const malformed = malformedPathResponse(request.nextUrl.pathname);
  if (!malformed) return guardRequest(request);
  malformed.headers.set("Content-Security-Policy", NON_DOCUMENT_CSP);
  return malformed;
}

export const config = {
  matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"],
};
