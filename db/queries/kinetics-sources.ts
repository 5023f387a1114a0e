import { and, desc, eq, inArray, type SQL } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { kineticsModels, kineticsSources, kineticsVersions, rateDatasets, rateDatasetVersions } from "@/db/schema";

/** Which sources to read: those of some kinetics versions, or those drawn from one dataset. */
export type KineticsSourceFilter = { kineticsVersionIds: string[] } | { datasetId: string };

/**
 * Where kinetics versions of a team came from (a fit to a dataset version, or typed by hand
 * against one), with the dataset and the model each joins: one query for the model page, the
 * dataset page and the design report. Both the model and the dataset must be the team's, so
 * another team's rows never come back. Newest kinetics version first.
 */
export function teamKineticsSources(db: Executor, teamId: string, filter: KineticsSourceFilter) {
  const which: SQL =
    "datasetId" in filter ? eq(rateDatasetVersions.datasetId, filter.datasetId) : inArray(kineticsSources.kineticsVersionId, filter.kineticsVersionIds);
  return db
    .select({
      kineticsVersionId: kineticsSources.kineticsVersionId,
      kind: kineticsSources.kind,
      fit: kineticsSources.fit,
      datasetVersionId: kineticsSources.datasetVersionId,
      datasetVersion: rateDatasetVersions.version,
      fileName: rateDatasetVersions.fileName,
      rowCount: rateDatasetVersions.rowCount,
      datasetId: rateDatasets.id,
      datasetName: rateDatasets.name,
      modelId: kineticsModels.id,
      modelName: kineticsModels.name,
      kineticsVersion: kineticsVersions.version,
      createdAt: kineticsVersions.createdAt,
    })
    .from(kineticsSources)
    .innerJoin(rateDatasetVersions, eq(rateDatasetVersions.id, kineticsSources.datasetVersionId))
    .innerJoin(rateDatasets, eq(rateDatasets.id, rateDatasetVersions.datasetId))
    .innerJoin(kineticsVersions, eq(kineticsVersions.id, kineticsSources.kineticsVersionId))
    .innerJoin(kineticsModels, eq(kineticsModels.id, kineticsVersions.modelId))
    .where(and(which, eq(kineticsModels.teamId, teamId), eq(rateDatasets.teamId, teamId)))
    .orderBy(desc(kineticsVersions.createdAt), desc(kineticsVersions.version));
}
