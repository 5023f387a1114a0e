import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemoData } from "@/lib/demo/seed";
import { auditEntries, signInSessions, users } from "@/db/schema";
import { endSession, endUserSessions, isSessionInForce, sessionInForce, startSession } from "@/lib/auth/sign-in-sessions";
import { loadActor } from "@/lib/authz/actor";
import { removeMember, updateMemberRole } from "@/lib/services/members";
import { actorByEmail, createTestDatabase, type TestDatabase } from "../helpers/test-db";

let t: TestDatabase;
beforeAll(async () => {
  t = await createTestDatabase();
  await seedDemoData(t.db);
});
afterAll(() => t.drop());

async function userId(email: string): Promise<string> {
  const [u] = await t.db.select().from(users).where(eq(users.email, email));
  return u.id;
}

/** The actor as a browser session sees it: the same query, joined with the session row. */
const sessionActor = (uid: string, sid: string) => loadActor(t.db, uid, undefined, sessionInForce(sid, uid));

describe("sign-in sessions", () => {
  it("a session is in force from sign-in until sign-out, and the actor query finds nothing after", async () => {
    const uid = await userId("vic.viewer@brightwater.example");
    const sid = await startSession(t.db, uid);
    const other = await startSession(t.db, uid);
    expect(await isSessionInForce(t.db, sid, uid)).toBe(true);
    expect((await sessionActor(uid, sid))?.role).toBe("viewer");
    await endSession(t.db, sid, "signed out");
    expect(await isSessionInForce(t.db, sid, uid)).toBe(false);
    expect(await sessionActor(uid, sid)).toBeNull();
    // Another browser of the same user is not signed out.
    expect((await sessionActor(uid, other))?.role).toBe("viewer");
    const [row] = await t.db.select().from(signInSessions).where(eq(signInSessions.id, sid));
    expect(row.endReason).toBe("signed out");
  });

  it("a session id only counts for its own user", async () => {
    const viewer = await userId("vic.viewer@brightwater.example");
    const engineer = await userId("eli.engineer@brightwater.example");
    const sid = await startSession(t.db, viewer);
    expect(await isSessionInForce(t.db, sid, engineer)).toBe(false);
    expect(await sessionActor(engineer, sid)).toBeNull();
  });

  it("a session older than 30 days is no longer in force, and such rows are cleared at the next sign-in", async () => {
    const uid = await userId("eli.engineer@brightwater.example");
    const sid = await startSession(t.db, uid);
    await t.db.update(signInSessions).set({ createdAt: sql`now() - interval '31 days'` }).where(eq(signInSessions.id, sid));
    expect(await isSessionInForce(t.db, sid, uid)).toBe(false);
    await startSession(t.db, uid);
    expect(await t.db.select().from(signInSessions).where(eq(signInSessions.id, sid))).toEqual([]);
  });

  it("removing a member ends all their sessions in the same transaction, and says so in the audit entry", async () => {
    const admin = await actorByEmail(t.db, "ada.admin@brightwater.example");
    const uid = await userId("vic.viewer@brightwater.example");
    const a = await startSession(t.db, uid);
    const b = await startSession(t.db, uid);
    const live = (await t.db.select().from(signInSessions).where(eq(signInSessions.userId, uid))).filter((r) => !r.endedAt).length;
    expect(live).toBeGreaterThanOrEqual(2);
    await removeMember(t.db, admin, uid);
    expect(await isSessionInForce(t.db, a, uid)).toBe(false);
    expect(await isSessionInForce(t.db, b, uid)).toBe(false);
    const [audit] = await t.db.select().from(auditEntries).where(eq(auditEntries.action, "member.removed"));
    expect(audit.details).toMatchObject({ role: "viewer", sessionsEnded: live });
    expect(await endUserSessions(t.db, uid, "again")).toBe(0);
  });

  it("a demoted member keeps the session, and the very next actor load has the new role", async () => {
    const admin = await actorByEmail(t.db, "ada.admin@brightwater.example");
    const uid = await userId("eli.engineer@brightwater.example");
    const sid = await startSession(t.db, uid);
    expect((await sessionActor(uid, sid))?.role).toBe("engineer");
    await updateMemberRole(t.db, admin, uid, "viewer");
    expect((await sessionActor(uid, sid))?.role).toBe("viewer");
  });
});
