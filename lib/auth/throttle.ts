import { and, desc, eq, gt } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { signInAttempts } from "@/db/schema";
import { getEnv } from "@/lib/env";

export interface ThrottleState {
  blocked: boolean;
  failures: number;
  retryAfterSeconds: number;
}

/**
 * Counts failed password sign-ins for one address within the window, since its last
 * success. At SIGNIN_MAX_FAILURES the address is refused until the oldest counted
 * failure leaves the window.
 */
export async function getThrottleState(db: Executor, email: string, now = new Date()): Promise<ThrottleState> {
  const { SIGNIN_MAX_FAILURES: max, SIGNIN_WINDOW_MINUTES: minutes } = getEnv();
  const windowStart = new Date(now.getTime() - minutes * 60_000);
  const recent = await db
    .select({ succeeded: signInAttempts.succeeded, at: signInAttempts.at })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.email, email.toLowerCase()), gt(signInAttempts.at, windowStart)))
    .orderBy(desc(signInAttempts.at))
    .limit(max + 1);
  const lastSuccess = recent.findIndex((a) => a.succeeded);
  const failures = lastSuccess === -1 ? recent : recent.slice(0, lastSuccess);
  if (failures.length < max) return { blocked: false, failures: failures.length, retryAfterSeconds: 0 };
  const oldestCounted = failures[max - 1].at;
  const retryAfterSeconds = Math.max(1, Math.ceil((oldestCounted.getTime() + minutes * 60_000 - now.getTime()) / 1000));
  return { blocked: true, failures: failures.length, retryAfterSeconds };
}

export async function recordSignInAttempt(db: Executor, email: string, succeeded: boolean): Promise<void> {
  await db.insert(signInAttempts).values({ email: email.toLowerCase(), succeeded });
}

export function throttleMessage(state: ThrottleState): string {
  const minutes = Math.ceil(state.retryAfterSeconds / 60);
  return `Too many failed sign-ins for this address. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}, or use an e-mail sign-in link.`;
}
