import { eq } from "drizzle-orm";
import { memberships, teams, users, type Role } from "../../db/schema";
import { hashPassword } from "../../lib/auth/password";
import { withE2eDatabase } from "./helpers/e2e-database";

export const MEMBER_PASSWORD = "a-member-of-the-test-2026";

/**
 * A fresh member of Brightwater with the given role, written straight to the e2e database (the
 * invitation flow has its own spec), so a test may remove or demote it without touching the
 * demo users other specs sign in as.
 */
export async function insertMember(role: Role): Promise<{ userId: string; email: string }> {
  return withE2eDatabase(async (db) => {
    const email = `member.${Date.now()}.${Math.random().toString(36).slice(2, 8)}@brightwater.example`;
    const [team] = await db.select().from(teams).where(eq(teams.name, "Brightwater Fine Chemicals"));
    const [user] = await db.insert(users).values({ email, name: "Test Member", passwordHash: await hashPassword(MEMBER_PASSWORD), emailVerified: new Date() }).returning();
    await db.insert(memberships).values({ teamId: team.id, userId: user.id, role });
    return { userId: user.id, email };
  });
}
