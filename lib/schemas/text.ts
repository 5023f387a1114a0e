import { z } from "zod";

/**
 * Text we store or look up: PostgreSQL refuses NUL in text and JSON, and a lone UTF-16
 * surrogate (half of an emoji or other astral character) in JSON, so both are refused here,
 * at the edge, with a message naming the field instead of a failed write. Other C0 control
 * characters are refused too: tab, line feed and carriage return only in multi-line text.
 */
const SINGLE_LINE_CONTROL = /[\u0000-\u001F]/;
const MULTI_LINE_CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F]/;
// With the u flag a well-formed pair is one code point, so only a lone half matches.
const LONE_SURROGATE = /[\uD800-\uDFFF]/u;

export const TEXT_MESSAGES = {
  singleLineControl: "Use one line of plain text: tabs, line breaks and invisible control characters (such as NUL) are not accepted",
  multiLineControl: "Remove the invisible control characters (such as NUL); plain text, tabs and line breaks are fine",
  brokenCharacter: "Holds a broken character (half of an emoji or other symbol); retype the text",
} as const;

export function hasControlCharacter(value: string, multiline = false): boolean {
  return (multiline ? MULTI_LINE_CONTROL : SINGLE_LINE_CONTROL).test(value);
}

export function hasLoneSurrogate(value: string): boolean {
  return LONE_SURROGATE.test(value);
}

export interface TextOptions {
  /** Tabs and line breaks allowed (notes, descriptions, comments). */
  multiline?: boolean;
  /** Message when the value is missing or not text. */
  error?: string;
}

/**
 * The one string schema for every stored or queried text field; chain `.trim()`, `.min()`,
 * `.max()` as usual. Lengths and emptiness stay with each field.
 */
export function text(opts: TextOptions = {}): z.ZodString {
  const base = opts.error ? z.string({ error: opts.error }) : z.string();
  return base
    .refine((s) => !hasControlCharacter(s, opts.multiline), { message: opts.multiline ? TEXT_MESSAGES.multiLineControl : TEXT_MESSAGES.singleLineControl, abort: true })
    .refine((s) => !hasLoneSurrogate(s), { message: TEXT_MESSAGES.brokenCharacter, abort: true });
}

/** Multi-line text: notes, descriptions, review comments. */
export const multilineText = (opts: Omit<TextOptions, "multiline"> = {}) => text({ ...opts, multiline: true });

/** A name used as a key inside stored JSON (species, column headers, parameters). */
export const keyText = () => text();

/** Longest value of one query-string parameter we read; longer ones are refused before any query. */
export const MAX_QUERY_VALUE = 200;
/** Longest whole query string a route reads. */
export const MAX_QUERY_STRING = 2000;

/** The name of an uploaded file as we store it beside its rows. */
export const fileNameSchema = text().max(255, "Use a file name of at most 255 characters");

/** The message for a file name `fileNameSchema` refuses, or null when it is fine. */
export function fileNameProblem(name: string): string | null {
  const parsed = fileNameSchema.safeParse(name);
  return parsed.success ? null : `The file name: ${parsed.error.issues[0].message.toLowerCase()}`;
}
