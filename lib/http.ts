import { NextResponse } from "next/server";
import type { z } from "zod";
import { AppError, validationError } from "./errors";
import { jsonBodyLimit } from "./http/body-limits";
import { readBodyText } from "./http/read-body";

/** Wraps a route handler so every failure leaves as a JSON error with the right status. */
export function route<C>(fn: (req: Request, ctx: C) => Promise<Response>) {
  return async (req: Request, ctx: C): Promise<Response> => {
    try {
      return await fn(req, ctx);
    } catch (err) {
      return toResponse(err);
    }
  };
}

export function toResponse(err: unknown): Response {
  if (err instanceof AppError) {
    const headers: Record<string, string> = {};
    if (err.retryAfterSeconds) headers["Retry-After"] = String(err.retryAfterSeconds);
    return NextResponse.json(err.toJSON(), { status: err.status, headers });
  }
  console.error("unhandled error in route handler", err);
  return NextResponse.json({ error: { code: "internal", message: "Something went wrong on our side; nothing was saved." } }, { status: 500 });
}

/**
 * Reads and validates a JSON body: 400 naming each bad field, never a 500. The body is read as
 * it streams in and refused with 413 past its route's limit (lib/http/body-limits.ts), so an
 * oversized body is never held whole.
 */
export async function readJson<S extends z.ZodType>(req: Request, schema: S, opts: { maxBytes?: number } = {}): Promise<z.output<S>> {
  const text = await readBodyText(req, opts.maxBytes ?? jsonBodyLimit(new URL(req.url).pathname));
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw new AppError("bad_request", "The body must be JSON", { fields: { "(body)": ["Malformed JSON"] } });
  }
  return parseWith(schema, body);
}

export function parseWith<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const parsed = schema.safeParse(value);
  if (!parsed.success) throw validationError(parsed.error);
  return parsed.data;
}

export const json = (data: unknown, status = 200) => NextResponse.json(data, { status });

/** A uuid path parameter; anything else is "not found" (never a 500 from the database). */
export async function uuidParam<K extends string>(ctx: { params: Promise<Record<K, string>> }, key: K, what: string): Promise<string> {
  const value = (await ctx.params)[key];
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(value)) throw new AppError("not_found", `No such ${what}`);
  return value;
}

/** Query-string parameters validated by a schema: 400 naming each bad parameter. */
export function readQuery<S extends z.ZodType>(req: Request, schema: S): z.output<S> {
  return parseWith(schema, Object.fromEntries(new URL(req.url).searchParams));
}
