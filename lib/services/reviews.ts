import { and, asc, eq, ne } from "drizzle-orm";
import type { Database } from "@/db/client";
import { pinnedDesigns, projects, sweeps, users } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz/policy";
import type { TrainStageType } from "@/lib/engine";

export interface ReviewItem {
  pinId: string;
  projectId: string;
  projectName: string;
  sweepName: string | null;
  sequence: TrainStageType[];
  totalVolume: number | null;
  totalCost: number | null;
  note: string;
  pinnedByName: string;
  pinnedAt: Date;
}

/**
 * Every design of the actor's team waiting for their review, oldest first so nothing waits
 * forever. Designs the actor pinned are left out: nobody reviews their own (pins.reviewPin).
 */
export async function listReviewInbox(db: Database, actor: Actor): Promise<ReviewItem[]> {
  assertCan(actor, "pin.review", { teamId: actor.teamId }, "pinned design");
  const rows = await db
    .select({
      pinId: pinnedDesigns.id,
      projectId: pinnedDesigns.projectId,
      projectName: projects.name,
      sweepName: sweeps.name,
      candidate: pinnedDesigns.candidate,
      note: pinnedDesigns.note,
      pinnedByName: users.name,
      pinnedByEmail: users.email,
      pinnedAt: pinnedDesigns.pinnedAt,
    })
    .from(pinnedDesigns)
    .innerJoin(projects, and(eq(projects.id, pinnedDesigns.projectId), eq(projects.teamId, actor.teamId)))
    .leftJoin(sweeps, eq(sweeps.id, pinnedDesigns.sweepId))
    .leftJoin(users, eq(users.id, pinnedDesigns.pinnedBy))
    .where(and(eq(pinnedDesigns.teamId, actor.teamId), eq(pinnedDesigns.state, "proposed"), ne(pinnedDesigns.pinnedBy, actor.userId)))
    .orderBy(asc(pinnedDesigns.pinnedAt));
  return rows.map((r) => {
    const c = r.candidate as { sequence?: TrainStageType[]; totalVolume?: number | null; totalCost?: number | null };
    return {
      pinId: r.pinId,
      projectId: r.projectId,
      projectName: r.projectName,
      sweepName: r.sweepName,
      sequence: c.sequence ?? [],
      totalVolume: c.totalVolume ?? null,
      totalCost: c.totalCost ?? null,
      note: r.note,
      pinnedByName: r.pinnedByName ?? r.pinnedByEmail ?? "—",
      pinnedAt: r.pinnedAt,
    };
  });
}
