import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { getDb } from "@/db/client";
import { loadActor } from "@/lib/authz/actor";
import type { Actor } from "@/lib/authz/policy";
import { AppError } from "@/lib/errors";
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

/** For route handlers and server actions: 401 when signed out, 403 without a team. */
export async function requireActor(): Promise<Actor> {
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
