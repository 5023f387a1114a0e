import { and, eq, inArray } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { memberships, users } from "@/db/schema";

/**
 * Display names (the name, else the e-mail address) of members of one team, by user id. Ids of
 * people outside the team are left out, so a page or report never shows who they are.
 */
export async function teamUserNames(db: Executor, teamId: string, ids: (string | null | undefined)[]): Promise<Record<string, string>> {
  const unique = [...new Set(ids.filter((x): x is string => !!x))];
  if (!unique.length) return {};
  const rows = await db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(users)
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.teamId, teamId)))
    .where(inArray(users.id, unique));
  return Object.fromEntries(rows.map((r) => [r.id, r.name ?? r.email]));
}
