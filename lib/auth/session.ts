import { cookies, headers } from "next/headers";
import { redirect } from "next/navigation";
import { getDb } from "@/db/client";
import { loadActor } from "@/lib/authz/actor";
import type { Actor } from "@/lib/authz/policy";
import { AppError } from "@/lib/errors";
import { actorFromApiToken } from "@/lib/services/tokens";
import { auth } from "./config";

/** Cookie holding the team the user last switched to; checked against memberships on every read. */
export const TEAM_COOKIE = "seriatim-team";

export async function getSessionUserId(): Promise<string | null> {
  const session = await auth();
  return session?.user?.id ?? null;
}

export async function getActor(): Promise<Actor | null> {
  const userId = await getSessionUserId();
  if (!userId) return null;
  const preferred = (await cookies()).get(TEAM_COOKIE)?.value;
  return loadActor(getDb(), userId, preferred);
}

/**
 * For route handlers: a personal API token (Authorization: Bearer) or the session cookie.
 * 401 when neither is valid, 403 for a signed-in user without a team.
 */
export async function requireActor(): Promise<Actor> {
  const authorization = (await headers()).get("authorization");
  if (authorization) {
    const [scheme, token] = authorization.split(" ");
    const actor = scheme?.toLowerCase() === "bearer" && token ? await actorFromApiToken(getDb(), token) : null;
    if (!actor) throw new AppError("unauthorized", "The API token is not valid (unknown, revoked, or its user left the team)");
    return actor;
  }
  const userId = await getSessionUserId();
  if (!userId) throw new AppError("unauthorized", "Sign in first");
  const preferred = (await cookies()).get(TEAM_COOKIE)?.value;
  const actor = await loadActor(getDb(), userId, preferred);
  if (!actor) throw new AppError("forbidden", "You are not a member of any team");
  return actor;
}

/** For pages: sends signed-out visitors to the sign-in page. */
export async function requirePageActor(): Promise<Actor> {
  const actor = await getActor();
  if (!actor) redirect("/signin");
  return actor;
}
