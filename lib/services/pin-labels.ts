import { and, eq, inArray } from "drizzle-orm";
import type { Database } from "@/db/client";
import { teamUserNames } from "@/db/queries/user-names";
import { kineticsModels, kineticsVersions, type PinnedDesign } from "@/db/schema";
import type { Actor } from "@/lib/authz/policy";

export interface PinLabels {
  /** Display names of the pins' pinners and reviewers who are members of the actor's team, by user id. */
  names: Record<string, string>;
  /** "Model name v3" and the model of each pin's kinetics version of the actor's team, by version id. */
  versions: Record<string, { label: string; modelId: string }>;
}

/**
 * The words a list of pins shows beside each: who pinned and reviewed it, and which kinetics
 * version it was sized with. Only the actor's team is read: an id from elsewhere gets no name.
 */
export async function pinLabels(db: Database, actor: Actor, pins: Pick<PinnedDesign, "pinnedBy" | "reviewerId" | "kineticsVersionId">[]): Promise<PinLabels> {
  const [names, versions] = await Promise.all([
    teamUserNames(db, actor.teamId, pins.flatMap((p) => [p.pinnedBy, p.reviewerId])),
    kineticsVersionLabels(db, actor.teamId, pins.map((p) => p.kineticsVersionId)),
  ]);
  return { names, versions };
}

async function kineticsVersionLabels(db: Database, teamId: string, ids: string[]): Promise<PinLabels["versions"]> {
  const unique = [...new Set(ids)];
  if (!unique.length) return {};
  const rows = await db
    .select({ id: kineticsVersions.id, version: kineticsVersions.version, name: kineticsModels.name, modelId: kineticsModels.id })
    .from(kineticsVersions)
    .innerJoin(kineticsModels, eq(kineticsModels.id, kineticsVersions.modelId))
    .where(and(inArray(kineticsVersions.id, unique), eq(kineticsModels.teamId, teamId)));
  return Object.fromEntries(rows.map((r) => [r.id, { label: `${r.name} v${r.version}`, modelId: r.modelId }]));
}
