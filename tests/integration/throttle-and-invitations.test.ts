import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemoData } from "@/lib/demo/seed";
import { memberships, signInAttempts, users } from "@/db/schema";
import { verifyPassword } from "@/lib/auth/password";
import { getThrottleState, recordSignInAttempt } from "@/lib/auth/throttle";
import { loadActor } from "@/lib/authz/actor";
import { AppError } from "@/lib/errors";
import { acceptInvitation, createInvitation, getOpenInvitationByToken, updateMemberRole } from "@/lib/services/members";
import { createTestDatabase, type TestDatabase } from "../helpers/test-db";

let t: TestDatabase;
beforeAll(async () => {
  t = await createTestDatabase();
  await seedDemoData(t.db);
});
afterAll(() => t.drop());

describe("sign-in throttling (10 failures in 15 minutes per address)", () => {
  it("blocks at the tenth failure and says when to retry", async () => {
    const email = "someone@throttle.example";
    for (let i = 0; i < 9; i++) await recordSignInAttempt(t.db, email, false);
    expect((await getThrottleState(t.db, email)).blocked).toBe(false);
    await recordSignInAttempt(t.db, email, false);
    const state = await getThrottleState(t.db, email);
    expect(state.blocked).toBe(true);
    expect(state.retryAfterSeconds).toBeGreaterThan(14 * 60);
    expect(state.retryAfterSeconds).toBeLessThanOrEqual(15 * 60);
  });

  it("forgets failures older than the window and those before a success", async () => {
    const email = "other@throttle.example";
    const old = new Date(Date.now() - 16 * 60_000);
    for (let i = 0; i < 10; i++) await t.db.insert(signInAttempts).values({ email, succeeded: false, at: old });
    expect((await getThrottleState(t.db, email)).blocked).toBe(false);
    for (let i = 0; i < 9; i++) await recordSignInAttempt(t.db, email, false);
    await recordSignInAttempt(t.db, email, true);
    await recordSignInAttempt(t.db, email, false);
    expect(await getThrottleState(t.db, email)).toMatchObject({ blocked: false, failures: 1 });
  });
});

describe("invitations", () => {
  it("refuses to invite a member, or the same address twice, naming the field", async () => {
    const [adminUser] = await t.db.select().from(users).where(eq(users.email, "ada.admin@brightwater.example"));
    const admin = (await loadActor(t.db, adminUser.id))!;
    await expect(createInvitation(t.db, admin, { email: "eli.engineer@brightwater.example", role: "viewer" })).rejects.toMatchObject({
      code: "conflict",
      fields: { email: ["Already a member of this team"] },
    });
    const inv = await createInvitation(t.db, admin, { email: "noor.haddad@brightwater.example", role: "engineer" });
    expect(inv).toMatchObject({ email: "noor.haddad@brightwater.example", role: "engineer" });
    await expect(createInvitation(t.db, admin, { email: "noor.haddad@brightwater.example", role: "viewer" })).rejects.toMatchObject({ code: "conflict" });
  });

  it("accepting twice fails the second time and leaves one membership", async () => {
    const [adminUser] = await t.db.select().from(users).where(eq(users.email, "ada.admin@brightwater.example"));
    const admin = (await loadActor(t.db, adminUser.id))!;
    const { createHash, randomBytes } = await import("node:crypto");
    // Insert an invitation with a known token the way the service stores it (hash only).
    const token = randomBytes(32).toString("base64url");
    const { invitations } = await import("@/db/schema");
    await t.db.insert(invitations).values({
      teamId: admin.teamId,
      email: "sam.ortiz@brightwater.example",
      role: "viewer",
      tokenHash: createHash("sha256").update(token).digest("hex"),
      invitedBy: admin.userId,
      expiresAt: new Date(Date.now() + 86_400_000),
    });
    expect(await getOpenInvitationByToken(t.db, token)).toMatchObject({ email: "sam.ortiz@brightwater.example", role: "viewer" });
    const first = await acceptInvitation(t.db, { token, name: "Sam Ortiz", password: "long-enough-secret" });
    expect(first).toEqual({ email: "sam.ortiz@brightwater.example", createdAccount: true });
    await expect(acceptInvitation(t.db, { token, name: "Sam Again", password: "another-long-secret" })).rejects.toBeInstanceOf(AppError);

    const [sam] = await t.db.select().from(users).where(eq(users.email, "sam.ortiz@brightwater.example"));
    expect(sam.name).toBe("Sam Ortiz");
    expect(await verifyPassword("long-enough-secret", sam.passwordHash!)).toBe(true);
    const rows = await t.db.select().from(memberships).where(eq(memberships.userId, sam.id));
    expect(rows.map((r) => r.role)).toEqual(["viewer"]);
  });

  it("the last admin cannot step down", async () => {
    const [adminUser] = await t.db.select().from(users).where(eq(users.email, "kai.admin@kestrel.example"));
    const admin = (await loadActor(t.db, adminUser.id))!;
    await expect(updateMemberRole(t.db, admin, admin.userId, "viewer")).rejects.toMatchObject({ code: "conflict" });
  });
});
