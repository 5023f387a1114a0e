import type { z } from "zod";

/** Every refusal the app answers with; the code decides the HTTP status. */
export type ErrorCode =
  | "bad_request"
  | "unauthorized"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "payload_too_large"
  | "rate_limited"
  | "internal";

export const STATUS_BY_CODE: Record<ErrorCode, number> = {
  bad_request: 400,
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

export function fieldErrorsFromZod(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join(".") : "(body)";
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

export function validationError(error: z.ZodError): AppError {
  const fields = fieldErrorsFromZod(error);
  const names = Object.keys(fields).join(", ");
  return new AppError("bad_request", `Invalid input: ${names}`, { fields });
}

export const notFound = (what = "record") => new AppError("not_found", `No such ${what}`);
export const forbidden = (message = "Your role does not allow this") => new AppError("forbidden", message);
