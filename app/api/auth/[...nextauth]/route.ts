import { getDb } from "@/db/client";
import { handlers } from "@/lib/auth/config";
import { getThrottleState, throttleMessage } from "@/lib/auth/throttle";
import { AppError, validationError } from "@/lib/errors";
import { toResponse } from "@/lib/http";
import { linkSignInSchema, passwordSignInSchema } from "@/lib/schemas/foundation";

export const GET = handlers.GET;

/**
 * Auth.js handles the protocol; in front of it we validate the two sign-in forms
 * (400 naming the field) and refuse throttled addresses (429) before any password check.
 */
export async function POST(req: Request): Promise<Response> {
  const path = new URL(req.url).pathname;
  try {
    if (path.endsWith("/callback/credentials")) {
      const form = Object.fromEntries(await req.clone().formData());
      const parsed = passwordSignInSchema.safeParse(form);
      if (!parsed.success) throw validationError(parsed.error);
      const state = await getThrottleState(getDb(), parsed.data.email);
      if (state.blocked) throw new AppError("rate_limited", throttleMessage(state), { retryAfterSeconds: state.retryAfterSeconds });
    } else if (path.endsWith("/signin/nodemailer")) {
      const parsed = linkSignInSchema.safeParse(Object.fromEntries(await req.clone().formData()));
      if (!parsed.success) throw validationError(parsed.error);
    }
  } catch (err) {
    return toResponse(err);
  }
  return handlers.POST(req as Parameters<typeof handlers.POST>[0]);
}
