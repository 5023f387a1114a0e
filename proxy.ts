import type { NextRequest } from "next/server";
import { guardRequest } from "@/lib/http/guard-request";

/**
 * Runs before routing, for pages and the API (not for Next's static files): cross-site writes,
 * body types and declared sizes are refused here, in one place, and every page gets its
 * Content-Security-Policy nonce. The logic lives in lib/http/; see docs/security.md.
 */
export function proxy(request: NextRequest) {
  return guardRequest(request);
}

export const config = {
  matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"],
};
