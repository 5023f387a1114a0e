import { eq } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { users } from "@/db/schema";
import type { Actor } from "@/lib/authz/policy";
import { DEFAULT_DISPLAY_PREFERENCE, isDisplayPreference, type DisplayPreference } from "@/lib/units/display-preference";

/**
 * The signed-in user's own display-unit choice. Every role may read and set its own (it changes
 * how numbers are shown, never a record of the team), so no policy action and no team audit
 * entry: like switching the active team, it is a personal setting, not a change to the design.
 */
export async function getDisplayPreference(db: Executor, userId: string): Promise<DisplayPreference> {
  const [row] = await db.select({ displayUnits: users.displayUnits }).from(users).where(eq(users.id, userId));
  return row && isDisplayPreference(row.displayUnits) ? row.displayUnits : DEFAULT_DISPLAY_PREFERENCE;
}

export async function setDisplayPreference(db: Executor, actor: Actor, preference: DisplayPreference): Promise<DisplayPreference> {
  await db.update(users).set({ displayUnits: preference }).where(eq(users.id, actor.userId));
  return preference;
}
