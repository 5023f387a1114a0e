import { createHash, randomBytes } from "node:crypto";
import { and, asc, eq, gt, isNull } from "drizzle-orm";
import type { Database, Executor } from "@/db/client";
import { invitations, memberships, teams, users, type Role } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { endUserSessions } from "@/lib/auth/sign-in-sessions";
import { assertCan, type Actor } from "@/lib/authz/policy";
import { AppError, notFound } from "@/lib/errors";
import { appLink, sendMail } from "@/lib/mail";
import type { InvitationAccept, InvitationCreate } from "@/lib/schemas/accounts";
import { recordAudit } from "./audit";

const INVITATION_DAYS = 7;

const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

export async function listMembers(db: Database, actor: Actor) {
  assertCan(actor, "member.list");
  return db
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role, joinedAt: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, actor.teamId))
    .orderBy(asc(users.name));
}

async function countAdmins(tx: Executor, teamId: string): Promise<number> {
  const rows = await tx
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, "admin")));
  return rows.length;
}

async function lockMembership(tx: Executor, actor: Actor, userId: string) {
  const [m] = await tx
    .select()
    .from(memberships)
    .where(and(eq(memberships.teamId, actor.teamId), eq(memberships.userId, userId)))
    .for("update");
  if (!m) throw notFound("member");
  return m;
}

/**
 * Changes a member's role; the team always keeps at least one admin. The member's sessions go
 * on: loadActor reads the role afresh on every request, so the new role applies to the next one.
 */
export async function updateMemberRole(db: Database, actor: Actor, userId: string, role: Role) {
  assertCan(actor, "member.update");
  return db.transaction(async (tx) => {
    const m = await lockMembership(tx, actor, userId);
    if (m.role === role) return m;
    if (m.role === "admin" && (await countAdmins(tx, actor.teamId)) <= 1) {
      throw new AppError("conflict", "The team must keep at least one admin", { fields: { role: ["The last admin cannot change role"] } });
    }
    const [row] = await tx
      .update(memberships)
      .set({ role })
      .where(and(eq(memberships.teamId, actor.teamId), eq(memberships.userId, userId)))
      .returning();
    await recordAudit(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "member.role_changed",
      entityType: "user",
      entityId: userId,
      details: { from: m.role, to: role },
    });
    return row;
  });
}

export async function removeMember(db: Database, actor: Actor, userId: string): Promise<void> {
  assertCan(actor, "member.update");
  await db.transaction(async (tx) => {
    const m = await lockMembership(tx, actor, userId);
    if (m.role === "admin" && (await countAdmins(tx, actor.teamId)) <= 1) {
      throw new AppError("conflict", "The team must keep at least one admin");
    }
    await tx.delete(memberships).where(and(eq(memberships.teamId, actor.teamId), eq(memberships.userId, userId)));
    // Signed out everywhere at once, not when the cookie expires (in other teams too: they sign in again).
    const sessionsEnded = await endUserSessions(tx, userId, "removed from team");
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "member.removed", entityType: "user", entityId: userId, details: { role: m.role, sessionsEnded } });
  });
}

export async function listOpenInvitations(db: Database, actor: Actor) {
  assertCan(actor, "invitation.list");
  return db
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt, createdAt: invitations.createdAt })
    .from(invitations)
    .where(and(eq(invitations.teamId, actor.teamId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
    .orderBy(asc(invitations.createdAt));
}

export interface CreatedInvitation {
  id: string;
  email: string;
  role: Role;
  expiresAt: Date;
  mailed: boolean;
}

/** Records the invitation, then mails its one-time link; the token is stored only as a hash. */
export async function createInvitation(db: Database, actor: Actor, input: InvitationCreate): Promise<CreatedInvitation> {
  assertCan(actor, "invitation.create");
  const token = randomBytes(32).toString("base64url");
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
  const row = await db.transaction(async (tx) => {
    const [member] = await tx
      .select({ userId: users.id })
      .from(users)
      .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.teamId, actor.teamId)))
      .where(eq(users.email, input.email));
    if (member) throw new AppError("conflict", "Already a member of this team", { fields: { email: ["Already a member of this team"] } });
    const [open] = await tx
      .select({ id: invitations.id })
      .from(invitations)
      .where(and(eq(invitations.teamId, actor.teamId), eq(invitations.email, input.email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
    if (open) throw new AppError("conflict", "An invitation to this address is already open", { fields: { email: ["An invitation to this address is already open; revoke it to send a new one"] } });
    const [inv] = await tx
      .insert(invitations)
      .values({ teamId: actor.teamId, email: input.email, role: input.role, tokenHash: hashToken(token), invitedBy: actor.userId, expiresAt })
      .returning();
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "invitation.created", entityType: "invitation", entityId: inv.id, details: { email: inv.email, role: inv.role } });
    return inv;
  });

  let mailed = true;
  try {
    await sendMail({
      to: input.email,
      subject: `You are invited to ${actor.teamName} on Seriatim`,
      text: [
        `${actor.name ?? actor.email} invites you to join ${actor.teamName} on Seriatim as ${input.role}.`,
        "",
        `Accept the invitation and choose your password here (valid for ${INVITATION_DAYS} days):`,
        appLink(`/invite/${token}`),
        "",
        "If you did not expect this, ignore this message.",
      ].join("\n"),
    });
  } catch (err) {
    mailed = false;
    console.error("invitation mail failed", { invitationId: row.id, err });
  }
  return { id: row.id, email: row.email, role: row.role, expiresAt: row.expiresAt, mailed };
}

export async function revokeInvitation(db: Database, actor: Actor, id: string): Promise<void> {
  assertCan(actor, "invitation.revoke");
  await db.transaction(async (tx) => {
    const [inv] = await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(and(eq(invitations.id, id), eq(invitations.teamId, actor.teamId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
      .returning();
    if (!inv) throw notFound("open invitation");
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "invitation.revoked", entityType: "invitation", entityId: id, details: { email: inv.email } });
  });
}

/** What the invitation page may show before sign-up: nothing unless the token is live. */
export async function getOpenInvitationByToken(db: Executor, token: string) {
  const [row] = await db
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, teamName: teams.name, teamId: invitations.teamId })
    .from(invitations)
    .innerJoin(teams, eq(teams.id, invitations.teamId))
    .where(and(eq(invitations.tokenHash, hashToken(token)), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())));
  return row ?? null;
}

/**
 * Accepts an invitation: creates the account (or, for an address that already has
 * one, only adds the membership) in one transaction.
 */
export async function acceptInvitation(db: Database, input: InvitationAccept): Promise<{ email: string; createdAccount: boolean }> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const [inv] = await tx
      .select()
      .from(invitations)
      .where(and(eq(invitations.tokenHash, hashToken(input.token)), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())))
      .for("update");
    if (!inv) throw new AppError("not_found", "This invitation is not valid any more (used, revoked or expired)", { fields: { token: ["Invitation not valid"] } });

    let [user] = await tx.select().from(users).where(eq(users.email, inv.email));
    const createdAccount = !user;
    if (!user) {
      [user] = await tx.insert(users).values({ email: inv.email, name: input.name, passwordHash, emailVerified: new Date() }).returning();
    }
    await tx.insert(memberships).values({ teamId: inv.teamId, userId: user.id, role: inv.role }).onConflictDoNothing();
    await tx.update(invitations).set({ acceptedAt: new Date() }).where(eq(invitations.id, inv.id));
    await recordAudit(tx, { teamId: inv.teamId, actorId: user.id, action: "invitation.accepted", entityType: "invitation", entityId: inv.id, details: { email: inv.email, role: inv.role, createdAccount } });
    return { email: inv.email, createdAccount };
  });
}
