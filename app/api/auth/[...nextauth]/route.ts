import { getDb } from "@/db/client";
import { handlers } from "@/lib/auth/config";
import { getThrottleState, throttleMessage } from "@/lib/auth/throttle";
import { AppError, validationError } from "@/lib/errors";
import { toResponse } from "@/lib/http";
import { linkSignInSchema, passwordSignInSchema } from "@/lib/schemas/accounts";

export const GET = handlers.GET;

/**
 * The fields of a sign-in form. A body that is not a form (JSON, plain text, multipart without
 * a boundary, no content type) reads as an empty form, so it gets the same 400 naming the
 * missing fields as a form left blank, never a 500 from the body parser.
 */
async function formFields(req: Request): Promise<Record<string, unknown>> {
  try {
    return Object.fromEntries(await req.clone().formData());
  } catch {
    return {};
  }
}

/**
 * Auth.js handles the protocol; in front of it we validate the two sign-in forms
 * (400 naming the field) and refuse throttled addresses (429) before any password check.
 */
export async function POST(req: Request): Promise<Response> {
  const path = new URL(req.url).pathname;
  try {
    if (path.endsWith("/callback/credentials")) {
      const parsed = passwordSignInSchema.safeParse(await formFields(req));
      if (!parsed.success) throw validationError(parsed.error);
      const state = await getThrottleState(getDb(), parsed.data.email);
      if (state.blocked) throw new AppError("rate_limited", throttleMessage(state), { retryAfterSeconds: state.retryAfterSeconds });
    } else if (path.endsWith("/signin/nodemailer")) {
      const parsed = linkSignInSchema.safeParse(await formFields(req));
      if (!parsed.success) throw validationError(parsed.error);
    }
  } catch (err) {
    return toResponse(err);
  }
  return handlers.POST(req as Parameters<typeof handlers.POST>[0]);
}
