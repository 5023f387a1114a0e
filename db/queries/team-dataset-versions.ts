import { and, eq } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { rateDatasets, rateDatasetVersions } from "@/db/schema";

/** A dataset version of one team with its dataset, or null (also for another team's id). */
export async function teamDatasetVersion(db: Executor, teamId: string, versionId: string) {
  const [row] = await db
    .select({ version: rateDatasetVersions, dataset: rateDatasets })
    .from(rateDatasetVersions)
    .innerJoin(rateDatasets, eq(rateDatasets.id, rateDatasetVersions.datasetId))
    .where(and(eq(rateDatasetVersions.id, versionId), eq(rateDatasets.teamId, teamId)));
  return row ?? null;
}
