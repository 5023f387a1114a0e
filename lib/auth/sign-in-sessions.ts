import { and, eq, gt, isNull, lt, or, sql, type SQL } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { signInSessions } from "@/db/schema";

/**
 * A session lasts while its cookie does (8 hours, renewed while in use) but never more than this
 * many days after the sign-in that began it, and ends at once at sign-out or removal.
 */
export const SESSION_MAX_DAYS = 30;

/** SQL condition: this row is a session still in force. */
export function sessionInForce(sessionId: string, userId: string): SQL {
  return and(
    eq(signInSessions.id, sessionId),
    eq(signInSessions.userId, userId),
    isNull(signInSessions.endedAt),
    gt(signInSessions.createdAt, sql`now() - make_interval(days => ${SESSION_MAX_DAYS})`),
  )!;
}

/** Records a sign-in; its id goes into the session cookie. Clears the user's long-finished rows. */
export async function startSession(db: Executor, userId: string): Promise<string> {
  await db
    .delete(signInSessions)
    .where(
      and(
        eq(signInSessions.userId, userId),
        or(lt(signInSessions.endedAt, sql`now() - interval '1 day'`), lt(signInSessions.createdAt, sql`now() - make_interval(days => ${SESSION_MAX_DAYS})`)),
      ),
    );
  const [row] = await db.insert(signInSessions).values({ userId }).returning({ id: signInSessions.id });
  return row.id;
}

export async function isSessionInForce(db: Executor, sessionId: string, userId: string): Promise<boolean> {
  const [row] = await db.select({ id: signInSessions.id }).from(signInSessions).where(sessionInForce(sessionId, userId));
  return Boolean(row);
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
export const isSessionId = (v: unknown): v is string => typeof v === "string" && UUID.test(v);

export async function endSession(db: Executor, sessionId: string, reason: string): Promise<void> {
  if (!isSessionId(sessionId)) return;
  await db
    .update(signInSessions)
    .set({ endedAt: new Date(), endReason: reason })
    .where(and(eq(signInSessions.id, sessionId), isNull(signInSessions.endedAt)));
}

/** Ends every session of a user (all their browsers); returns how many were in force. */
export async function endUserSessions(db: Executor, userId: string, reason: string): Promise<number> {
  const ended = await db
    .update(signInSessions)
    .set({ endedAt: new Date(), endReason: reason })
    .where(and(eq(signInSessions.userId, userId), isNull(signInSessions.endedAt)))
    .returning({ id: signInSessions.id });
  return ended.length;
}
