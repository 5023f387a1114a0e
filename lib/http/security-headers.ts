/**
 * The Content-Security-Policy of every response. Pages get a fresh nonce per request (proxy.ts
 * passes it to Next.js, which puts it on its own script tags); everything else (JSON, CSV, PDF)
 * is never a document that runs code, so it may load nothing at all.
 *
 * The headers that do not vary (X-Frame-Options, X-Content-Type-Options, Referrer-Policy) are set
 * for every path, static files included, in next.config.mjs.
 */

/** A 128-bit random nonce, base64. */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

/**
 * Scripts: only those carrying this request's nonce, and what they load ('strict-dynamic').
 * Styles: 'unsafe-inline', because the charts (nivo) and React style attributes set inline
 * styles; a style cannot run code, and a nonce in style-src would switch 'unsafe-inline' off.
 * Development adds 'unsafe-eval', which React's dev build needs for its error overlays.
 */
export function pageCsp(nonce: string, dev = false): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

/** For API answers and files: nothing to load, never framed. */
export const NON_DOCUMENT_CSP = "default-src 'none'; frame-ancestors 'none'";
