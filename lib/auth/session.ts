import { cookies, headers } from "next/headers";
import { redirect } from "next/navigation";
import { getDb } from "@/db/client";
import { loadActor } from "@/lib/authz/actor";
import type { Actor } from "@/lib/authz/policy";
import { AppError } from "@/lib/errors";
import { actorFromApiToken } from "@/lib/services/tokens";
import { auth } from "./config";
import { isSessionInForce, sessionInForce } from "./sign-in-sessions";

/** Cookie holding the team the user last switched to; checked against memberships on every read. */
export const TEAM_COOKIE = "seriatim-team";

interface CookieSession {
  userId: string;
  sessionId: string;
}

/** The user and sign-in row named by the session cookie, if it is valid (not yet checked against the row). */
async function cookieSession(): Promise<CookieSession | null> {
  const session = await auth();
  const userId = session?.user?.id;
  // A cookie without a sign-in row id predates session rows: treated as signed out.
  if (!userId || !session.sessionId) return null;
  return { userId, sessionId: session.sessionId };
}

/** The signed-in user's id, when the cookie is valid and its session has not been ended. */
export async function getSessionUserId(): Promise<string | null> {
  const s = await cookieSession();
  if (!s) return null;
  return (await isSessionInForce(getDb(), s.sessionId, s.userId)) ? s.userId : null;
}

async function sessionActor(s: CookieSession): Promise<Actor | null> {
  const preferred = (await cookies()).get(TEAM_COOKIE)?.value;
  return loadActor(getDb(), s.userId, preferred, sessionInForce(s.sessionId, s.userId));
}

export async function getActor(): Promise<Actor | null> {
  const s = await cookieSession();
  return s ? sessionActor(s) : null;
}

/**
 * For route handlers: a personal API token (Authorization: Bearer) or the session cookie.
 * 401 when neither is valid (an ended session included), 403 for a signed-in user without a team.
 */
export async function requireActor(): Promise<Actor> {
  const authorization = (await headers()).get("authorization");
  if (authorization) {
    const [scheme, token] = authorization.split(" ");
    const actor = scheme?.toLowerCase() === "bearer" && token ? await actorFromApiToken(getDb(), token) : null;
    if (!actor) throw new AppError("unauthorized", "The API token is not valid (unknown, revoked, or its user left the team)");
    return actor;
  }
  const s = await cookieSession();
  if (!s) throw new AppError("unauthorized", "Sign in first");
  const actor = await sessionActor(s);
  if (actor) return actor;
  // The one query found nothing: say whether the session ended or the user has no team.
  if (!(await isSessionInForce(getDb(), s.sessionId, s.userId))) throw new AppError("unauthorized", "Your session has ended; sign in again");
  throw new AppError("forbidden", "You are not a member of any team");
}

/** For pages: sends signed-out visitors (and ended sessions) to the sign-in page. */
export async function requirePageActor(): Promise<Actor> {
  const actor = await getActor();
  if (!actor) redirect("/signin");
  return actor;
}
