import { NextResponse } from "next/server";
import type { z } from "zod";
import { AppError, fieldsInWords, validationError, type FieldErrors } from "./errors";
import { jsonBodyLimit } from "./http/body-limits";
import { readBodyText } from "./http/read-body";
import { hasControlCharacter, MAX_QUERY_STRING, MAX_QUERY_VALUE, TEXT_MESSAGES } from "./schemas/text";

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
  return parseWith(schema, await readRawJson(req, opts));
}

/**
 * Reads a JSON body that comes in two kinds (a model of one reaction or of several): `pick` looks at
 * the raw body and names the schema, so a mistake is reported against the kind the body is, not as
 * "neither kind".
 */
export async function readJsonOfKind<A extends z.ZodType, B extends z.ZodType>(req: Request, pick: (body: unknown) => boolean, whenTrue: A, otherwise: B): Promise<z.output<A> | z.output<B>> {
  return parseWithKind(await readRawJson(req), pick, whenTrue, otherwise);
}

/** The same on a value already read. */
export function parseWithKind<A extends z.ZodType, B extends z.ZodType>(body: unknown, pick: (body: unknown) => boolean, whenTrue: A, otherwise: B): z.output<A> | z.output<B> {
  return pick(body) ? parseWith(whenTrue, body) : parseWith(otherwise, body);
}

async function readRawJson(req: Request, opts: { maxBytes?: number } = {}): Promise<unknown> {
  const text = await readBodyText(req, opts.maxBytes ?? jsonBodyLimit(new URL(req.url).pathname));
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("bad_request", "The body must be JSON", { fields: { "(body)": ["Malformed JSON"] } });
  }
}

export function parseWith<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const parsed = schema.safeParse(value);
  if (!parsed.success) throw validationError(parsed.error);
  return parsed.data;
}

export const json = (data: unknown, status = 200) => NextResponse.json(data, { status });

/** 204: done, nothing to send back (a removal). */
export const noContent = () => new Response(null, { status: 204 });

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A uuid path parameter; anything else is "not found" (never a 500 from the database). */
export async function uuidParam<K extends string>(ctx: { params: Promise<Record<K, string>> }, key: K, what: string): Promise<string> {
  const value = (await ctx.params)[key];
  if (typeof value !== "string" || !UUID.test(value)) throw new AppError("not_found", `No such ${what}`);
  return value;
}

/**
 * Query-string parameters validated by a schema: 400 naming each bad parameter. Whatever the
 * schema, an over-long query string, an over-long value or a control character is refused
 * first, so nothing malformed reaches a query.
 */
export function readQuery<S extends z.ZodType>(req: Request, schema: S): z.output<S> {
  return parseWith(schema, queryValues(req));
}

/** The query string as name → value (the last of repeated names), checked for length and control characters. */
export function queryValues(req: Request): Record<string, string> {
  const url = new URL(req.url);
  if (url.search.length > MAX_QUERY_STRING) {
    throw new AppError("bad_request", `The address is too long: at most ${MAX_QUERY_STRING} characters after "?"`, { fields: { "(query)": ["Too long"] } });
  }
  const values: Record<string, string> = {};
  const fields: FieldErrors = {};
  for (const [name, value] of url.searchParams) {
    const key = hasControlCharacter(name) || name.length > 100 ? "(query)" : name;
    if (key === "(query)") (fields[key] ??= []).push("A parameter name is malformed");
    else if (value.length > MAX_QUERY_VALUE) (fields[key] ??= []).push(`Use at most ${MAX_QUERY_VALUE} characters`);
    else if (hasControlCharacter(value)) (fields[key] ??= []).push(TEXT_MESSAGES.singleLineControl);
    else values[name] = value;
  }
  const names = Object.keys(fields);
  if (names.length) throw new AppError("bad_request", fieldsInWords(fields), { fields });
  return values;
}
