/**
 * How many bytes a request body may have, per route: one table, read by proxy.ts (refusing a
 * declared Content-Length above it before the body is read) and by readJson (counting the bytes
 * as they stream in, for bodies that do not declare their length).
 */
import { UPLOAD_BODY_BYTES } from "@/lib/schemas/upload-limits";

const KiB = 1024;
const MiB = 1024 * KiB;

/** Most JSON bodies are a form's worth: a name, a few numbers, a short text. */
export const SMALL_JSON_BYTES = 64 * KiB;

/**
 * Bodies that may carry a rate law as a measured table (kinetics, sweeps, rating a train): a
 * table of 20,000 points written out as JSON is about 1 MB.
 */
export const SPEC_JSON_BYTES = 2 * MiB;

/** File uploads: the file plus the form around it (lib/schemas/upload-limits.ts). */
export const UPLOAD_BYTES = UPLOAD_BODY_BYTES;

/** The largest body any route reads; next.config.mjs sizes the proxy's body buffer to it. */
export const MAX_BODY_BYTES = 4 * MiB;

const SPEC_ROUTES = [
  /^\/api\/projects\/[^/]+\/(sweeps|kinetics|rate)\/?$/,
  /^\/api\/kinetics\/preview\/?$/,
  /^\/api\/kinetics\/[^/]+\/versions\/?$/,
];

export function jsonBodyLimit(pathname: string): number {
  return SPEC_ROUTES.some((r) => r.test(pathname)) ? SPEC_JSON_BYTES : SMALL_JSON_BYTES;
}

/** "64 KB", "2 MB": a limit as a user reads it. */
export function formatBytes(bytes: number): string {
  if (bytes >= MiB) return `${+(bytes / MiB).toFixed(1)} MB`;
  if (bytes >= KiB) return `${+(bytes / KiB).toFixed(1)} KB`;
  return `${bytes} bytes`;
}
