import { NextResponse, type NextRequest } from "next/server";
import { malformedPathResponse } from "@/lib/http/raw-path";

/**
 * Runs before routing: an address Next could not decode into route parameters is answered
 * here (404 in our error shape) instead of failing inside Next's router with a 500.
 */
export function proxy(request: NextRequest) {
  return malformedPathResponse(request.nextUrl.pathname) ?? NextResponse.next();
}

export const config = {
  matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"],
};
