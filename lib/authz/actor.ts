import { asc, eq, type SQL } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { memberships, signInSessions, teams, users } from "@/db/schema";
import type { Actor } from "./policy";

export interface TeamChoice {
  teamId: string;
  teamName: string;
  role: Actor["role"];
}

/** Every team the user belongs to, oldest membership first. */
export async function listTeamsOfUser(db: Executor, userId: string): Promise<TeamChoice[]> {
  return db
    .select({ teamId: teams.id, teamName: teams.name, role: memberships.role })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(memberships.createdAt), asc(teams.name));
}

/**
 * The actor for a signed-in user, read fresh from the database on every request (one query)
 * so a changed or removed membership takes effect at once. `preferredTeamId` (from the team
 * switcher or an API token) is honoured only when the user really is a member of that team.
 * `session`, for a browser session, is the condition its sign-in row must meet
 * (lib/auth/sign-in-sessions.ts): joined into the same query, so an ended session finds no actor.
 */
export async function loadActor(db: Executor, userId: string, preferredTeamId?: string, session?: SQL): Promise<Actor | null> {
  const base = db
    .select({ email: users.email, name: users.name, teamId: teams.id, teamName: teams.name, role: memberships.role })
    .from(users)
    .innerJoin(memberships, eq(memberships.userId, users.id))
    .innerJoin(teams, eq(teams.id, memberships.teamId));
  const rows = await (session ? base.innerJoin(signInSessions, session) : base)
    .where(eq(users.id, userId))
    .orderBy(asc(memberships.createdAt), asc(teams.name));
  const chosen = rows.find((r) => r.teamId === preferredTeamId) ?? rows[0];
  if (!chosen) return null;
  return { userId, email: chosen.email, name: chosen.name, teamId: chosen.teamId, teamName: chosen.teamName, role: chosen.role };
}
