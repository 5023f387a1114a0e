import { createHash, randomBytes } from "node:crypto";
import { and, desc, eq, isNull } from "drizzle-orm";
import type { Database } from "@/db/client";
import { apiTokens } from "@/db/schema-sweeps";
import { loadActor } from "@/lib/authz/actor";
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
  const [row] = await db
    .update(apiTokens)
    .set({ lastUsedAt: new Date() })
    .where(and(eq(apiTokens.tokenHash, hash(token)), isNull(apiTokens.revokedAt)))
    .returning({ userId: apiTokens.userId, teamId: apiTokens.teamId });
  if (!row) return null;
  const actor = await loadActor(db, row.userId, row.teamId);
  // A token outlives nothing: if its user left the team, it stops working.
  return actor && actor.teamId === row.teamId ? actor : null;
}
