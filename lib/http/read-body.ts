import { AppError } from "@/lib/errors";
import { formatBytes } from "./body-limits";
import { MAX_FILE_MB } from "@/lib/schemas/upload-limits";

export function bodyTooLarge(limit: number, declared?: number): AppError {
  const size = declared !== undefined ? `The request body is ${formatBytes(declared)}; ` : "The request body is too large; ";
  return new AppError("payload_too_large", `${size}this request takes at most ${formatBytes(limit)}`, {
    fields: { "(body)": [`At most ${formatBytes(limit)}`] },
  });
}

/** An upload over the file limit, named as the file: the same answer whichever check meets it first. */
export function fileTooLarge(): AppError {
  return new AppError("payload_too_large", `The file is larger than ${MAX_FILE_MB}; split it into smaller files`, {
    fields: { file: [`The file is larger than ${MAX_FILE_MB}`] },
  });
}

/**
 * The body as UTF-8 text, read chunk by chunk with a byte counter: a declared Content-Length
 * above `limit` is refused before anything is read, and an undeclared body is cut off (the
 * stream cancelled) as soon as it passes the limit, so an oversized body never sits in memory.
 */
export async function readBodyText(req: Request, limit: number): Promise<string> {
  const declared = req.headers.get("content-length");
  if (declared !== null && Number(declared) > limit) {
    await req.body?.cancel().catch(() => undefined);
    throw bodyTooLarge(limit, Number(declared));
  }
  if (!req.body) return "";
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel().catch(() => undefined);
      throw bodyTooLarge(limit);
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    bytes.set(c, at);
    at += c.byteLength;
  }
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new AppError("bad_request", "The body must be JSON in UTF-8", { fields: { "(body)": ["Not UTF-8 text"] } });
  }
}
