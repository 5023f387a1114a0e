import { createHash, randomBytes } from "node:crypto";
import { and, desc, eq, isNull } from "drizzle-orm";
import type { Database } from "@/db/client";
import { apiTokens, memberships, teams, users } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz/policy";
import { notFound } from "@/lib/errors";
import { recordAudit } from "./audit";

const TOKEN_PREFIX = "srt_";
const hash = (token: string) => createHash("sha256").update(token).digest("hex");

/** Creates a personal token for the actor's team; the token itself is returned once and never stored. */
export async function createApiToken(db: Database, actor: Actor, input: { name: string }) {
  assertCan(actor, "token.manage");
  const token = `${TOKEN_PREFIX}${randomBytes(32).toString("base64url")}`;
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(apiTokens)
      .values({ userId: actor.userId, teamId: actor.teamId, name: input.name, tokenHash: hash(token), prefix: token.slice(0, 10) })
      .returning({ id: apiTokens.id, name: apiTokens.name, prefix: apiTokens.prefix, createdAt: apiTokens.createdAt });
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "token.created", entityType: "api_token", entityId: row.id, details: { name: row.name } });
    return { ...row, token };
  });
}

export async function listApiTokens(db: Database, actor: Actor) {
  assertCan(actor, "token.manage");
  return db
    .select({ id: apiTokens.id, name: apiTokens.name, prefix: apiTokens.prefix, createdAt: apiTokens.createdAt, lastUsedAt: apiTokens.lastUsedAt, revokedAt: apiTokens.revokedAt })
    .from(apiTokens)
    .where(and(eq(apiTokens.userId, actor.userId), eq(apiTokens.teamId, actor.teamId)))
    .orderBy(desc(apiTokens.createdAt));
}

export async function revokeApiToken(db: Database, actor: Actor, id: string): Promise<void> {
  assertCan(actor, "token.manage");
  await db.transaction(async (tx) => {
    const rows = await tx
      .update(apiTokens)
      .set({ revokedAt: new Date() })
      .where(and(eq(apiTokens.id, id), eq(apiTokens.userId, actor.userId), isNull(apiTokens.revokedAt)))
      .returning({ id: apiTokens.id });
    if (!rows.length) throw notFound("active token");
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "token.revoked", entityType: "api_token", entityId: id });
  });
}

/** The actor a Bearer token stands for (its user, in the token's team, with today's role), or null. */
export async function actorFromApiToken(db: Database, token: string): Promise<Actor | null> {
  if (!token.startsWith(TOKEN_PREFIX)) return null;
  // One query: the token, its user, and the user's membership of the token's team (today's role).
  const [row] = await db
    .select({ id: apiTokens.id, lastUsedAt: apiTokens.lastUsedAt, userId: users.id, email: users.email, name: users.name, teamId: teams.id, teamName: teams.name, role: memberships.role })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .innerJoin(memberships, and(eq(memberships.userId, apiTokens.userId), eq(memberships.teamId, apiTokens.teamId)))
    .innerJoin(teams, eq(teams.id, apiTokens.teamId))
    .where(and(eq(apiTokens.tokenHash, hash(token)), isNull(apiTokens.revokedAt)));
  // No row: unknown or revoked token, or its user has left the team.
  if (!row) return null;
  // Record use at most once a minute: a write on every request would serialise a script's
  // concurrent calls on this one row.
  if (!row.lastUsedAt || Date.now() - row.lastUsedAt.getTime() > 60_000) {
    void db.update(apiTokens).set({ lastUsedAt: new Date() }).where(eq(apiTokens.id, row.id)).catch(() => {});
  }
  return { userId: row.userId, email: row.email, name: row.name, teamId: row.teamId, teamName: row.teamName, role: row.role };
}
