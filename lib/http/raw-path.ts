/**
 * An address whose path is not valid percent-encoding (`%FF%FE`, a lone `%`, an encoded
 * surrogate such as `%ED%A0%80`) cannot be decoded into route parameters: Next fails while
 * matching the route, before any handler runs, and answers a plain-text 500. The proxy asks
 * this first and answers such an address itself, as "not found" in our error shape.
 */
export function hasMalformedPathEncoding(pathname: string): boolean {
  for (const segment of pathname.split("/")) {
    if (!segment.includes("%")) continue;
    try {
      decodeURIComponent(segment);
    } catch {
      return true;
    }
  }
  return false;
}

/** The answer to an address that cannot be decoded, or null when the path is fine. */
export function malformedPathResponse(pathname: string): Response | null {
  if (!hasMalformedPathEncoding(pathname)) return null;
  if (pathname === "/api" || pathname.startsWith("/api/")) {
    return Response.json({ error: { code: "not_found", message: "No such record: the address holds characters that are not valid" } }, { status: 404 });
  }
  return new Response("Page not found: the address holds characters that are not valid.", { status: 404, headers: { "Content-Type": "text/plain; charset=utf-8" } });
}
