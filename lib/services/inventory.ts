import { and, asc, eq, inArray } from "drizzle-orm";
import type { Database } from "@/db/client";
import { inventoryVessels, type InventoryVesselRow } from "@/db/schema";
import { assertCan, can, type Actor } from "@/lib/authz/policy";
import { parseInventoryFile, type ParsedInventory } from "@/lib/costs/inventory-file";
import { AppError, notFound } from "@/lib/errors";
import type { InventoryVesselInput, InventoryVesselUpdate } from "@/lib/schemas/inventory";
import { recordAudit } from "./audit";

export function vesselView(v: InventoryVesselRow) {
  const { teamId: _team, createdBy: _by, ...rest } = v;
  return rest;
}

const tagTaken = (tag: string) => new AppError("conflict", `The tag ${tag} is already in the inventory`, { fields: { tag: ["Already in the inventory"] } });

function isUniqueViolation(err: unknown): boolean {
  const e = err as { code?: string; cause?: { code?: string } };
  return e?.code === "23505" || e?.cause?.code === "23505";
}

export async function listInventory(db: Database, actor: Actor) {
  assertCan(actor, "inventory.read");
  const rows = await db.select().from(inventoryVessels).where(eq(inventoryVessels.teamId, actor.teamId)).orderBy(asc(inventoryVessels.tag));
  return { vessels: rows.map(vesselView), permissions: { manage: can(actor, "inventory.manage") } };
}

export async function requireTeamVessel(db: Database, actor: Actor, id: string): Promise<InventoryVesselRow> {
  const [row] = await db.select().from(inventoryVessels).where(and(eq(inventoryVessels.id, id), eq(inventoryVessels.teamId, actor.teamId)));
  if (!row) throw notFound("vessel");
  assertCan(actor, "inventory.read", row, "vessel");
  return row;
}

export async function getVessel(db: Database, actor: Actor, id: string) {
  return vesselView(await requireTeamVessel(db, actor, id));
}

export async function createVessel(db: Database, actor: Actor, input: InventoryVesselInput) {
  assertCan(actor, "inventory.manage");
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx.insert(inventoryVessels).values({ ...input, teamId: actor.teamId, createdBy: actor.userId }).returning();
      await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "inventory.created", entityType: "inventory_vessel", entityId: row.id, details: { tag: row.tag } });
      return vesselView(row);
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw tagTaken(input.tag);
    throw err;
  }
}

export async function updateVessel(db: Database, actor: Actor, id: string, input: InventoryVesselUpdate) {
  const current = await requireTeamVessel(db, actor, id);
  assertCan(actor, "inventory.manage", current, "vessel");
  try {
    return await db.transaction(async (tx) => {
      const [row] = await tx.update(inventoryVessels).set({ ...input, updatedAt: new Date() }).where(eq(inventoryVessels.id, id)).returning();
      await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "inventory.updated", entityType: "inventory_vessel", entityId: id, details: { tag: row.tag, changed: Object.keys(input) } });
      return vesselView(row);
    });
  } catch (err) {
    if (isUniqueViolation(err) && input.tag) throw tagTaken(input.tag);
    throw err;
  }
}

export async function deleteVessel(db: Database, actor: Actor, id: string): Promise<void> {
  const current = await requireTeamVessel(db, actor, id);
  assertCan(actor, "inventory.manage", current, "vessel");
  await db.transaction(async (tx) => {
    await tx.delete(inventoryVessels).where(eq(inventoryVessels.id, id));
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "inventory.deleted", entityType: "inventory_vessel", entityId: id, details: { tag: current.tag } });
  });
}

export interface ImportResult extends ParsedInventory {
  /** Tags of the file already in the inventory: accepting updates them. */
  updates: string[];
  accepted: boolean;
  created: number;
  updated: number;
}

/**
 * Reads an uploaded inventory file. Preview (accept = false) writes nothing; accept writes every
 * row in one transaction, creating new tags and updating existing ones, and refuses the whole
 * file while any row has a problem, so a half-read file never lands.
 */
export async function importInventory(db: Database, actor: Actor, file: { name: string; data: ArrayBuffer }, accept: boolean): Promise<ImportResult> {
  assertCan(actor, "inventory.manage");
  const parsed = await parseInventoryFile(file.name, file.data);
  const tags = parsed.vessels.map((v) => v.tag);
  const existing = tags.length
    ? await db.select({ id: inventoryVessels.id, tag: inventoryVessels.tag }).from(inventoryVessels).where(and(eq(inventoryVessels.teamId, actor.teamId), inArray(inventoryVessels.tag, tags)))
    : [];
  const byTag = new Map(existing.map((e) => [e.tag, e.id]));
  const result: ImportResult = { ...parsed, updates: existing.map((e) => e.tag), accepted: false, created: 0, updated: 0 };
  if (!accept) return result;
  if (parsed.problems.length) {
    const fields = Object.fromEntries(parsed.problems.map((p) => [`rows.${p.row}.${p.field}`, [p.message]]));
    throw new AppError("bad_request", `${parsed.problems.length} problem${parsed.problems.length === 1 ? "" : "s"} in the file; nothing was imported`, { fields });
  }
  if (parsed.vessels.length === 0) throw new AppError("bad_request", "The file holds no vessels", { fields: { file: ["No vessel rows"] } });
  await db.transaction(async (tx) => {
    for (const { row: _row, ...v } of parsed.vessels) {
      const id = byTag.get(v.tag);
      if (id) await tx.update(inventoryVessels).set({ ...v, updatedAt: new Date() }).where(eq(inventoryVessels.id, id));
      else await tx.insert(inventoryVessels).values({ ...v, teamId: actor.teamId, createdBy: actor.userId });
    }
    await recordAudit(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "inventory.imported",
      entityType: "team",
      entityId: actor.teamId,
      details: { fileName: file.name, created: parsed.vessels.length - byTag.size, updated: byTag.size },
    });
  });
  return { ...result, accepted: true, created: parsed.vessels.length - byTag.size, updated: byTag.size };
}
