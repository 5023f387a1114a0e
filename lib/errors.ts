import type { z } from "zod";
import { labelFor } from "./schemas/field-labels";
import { issueInWords } from "./schemas/issue-words";

/** Every refusal the app answers with; the code decides the HTTP status. */
export type ErrorCode =
  | "bad_request"
  | "unsupported_media_type"
  | "unauthorized"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "payload_too_large"
  | "rate_limited"
  | "internal";

export const STATUS_BY_CODE: Record<ErrorCode, number> = {
  bad_request: 400,
  unsupported_media_type: 415,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  rate_limited: 429,
  internal: 500,
};

/** Field path (dot-joined) → messages, as shown beside form fields. */
export type FieldErrors = Record<string, string[]>;

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fields?: FieldErrors;
  readonly retryAfterSeconds?: number;

  constructor(code: ErrorCode, message: string, opts: { fields?: FieldErrors; retryAfterSeconds?: number; cause?: unknown } = {}) {
    super(message, { cause: opts.cause });
    this.name = "AppError";
    this.code = code;
    this.fields = opts.fields;
    this.retryAfterSeconds = opts.retryAfterSeconds;
  }

  get status(): number {
    return STATUS_BY_CODE[this.code];
  }

  toJSON(): ErrorBody {
    return { error: { code: this.code, message: this.message, ...(this.fields ? { fields: this.fields } : {}) } };
  }
}

export interface ErrorBody {
  error: { code: ErrorCode; message: string; fields?: FieldErrors };
}

/** Paths stay as keys (clients match them to inputs); each message is in words, without the path. */
export function fieldErrorsFromZod(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues.map(closestUnionIssue)) {
    const key = issue.path.length ? issue.path.map(String).join(".") : "(body)";
    (fields[key] ??= []).push(issueInWords(issue));
  }
  return fields;
}

/**
 * Inside a union of object forms (a train's three forms) the form that failed on the fewest fields, when one
 * clearly did and on a named field, is the one the body meant: its issue names that field ("train.recycleRatio")
 * instead of "train: not one of the accepted forms". Other unions (a number or a quantity string) stay as they
 * are. The command line reads its issues by the same rule (scripts/sweep.ts).
 */
function closestUnionIssue(issue: z.core.$ZodIssue): z.core.$ZodIssue {
  if (issue.code !== "invalid_union" || !issue.errors || issue.errors.length < 2) return issue;
  const [best, next] = [...issue.errors].sort((p, q) => p.length - q.length);
  if (best.length === 0 || best.length >= next.length || best[0].path.length === 0) return issue;
  const inner = closestUnionIssue(best[0]);
  return { ...inner, path: [...issue.path, ...inner.path] };
}

/** "Label: message", unless the message already starts with its label (some schemas name it). */
export function labelled(label: string, message: string): string {
  return message.startsWith(`${label}:`) ? message : `${label}: ${message}`;
}

/** "Stage 1 volume: enter a number; Name: use at least 2 characters", labels from the one mapping. */
export function fieldsInWords(fields: FieldErrors): string {
  return Object.entries(fields)
    .map(([key, messages]) => labelled(labelFor(key), messages.join(" ")))
    .join("; ");
}

export function validationError(error: z.ZodError): AppError {
  const fields = fieldErrorsFromZod(error);
  return new AppError("bad_request", fieldsInWords(fields), { fields });
}

export const notFound = (what = "record") => new AppError("not_found", `No such ${what}`);
export const forbidden = (message = "Your role does not allow this") => new AppError("forbidden", message);
