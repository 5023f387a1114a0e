import { and, eq } from "drizzle-orm";
import { projects, rateDatasets, rateDatasetVersions, users } from "../../db/schema";
import { withE2eDatabase } from "./helpers/e2e-database";

/**
 * Writes a dataset and its version 1 straight to the e2e database (the upload is another
 * screen's job), as `email` in the project named `projectName` of that user's team.
 */
export async function insertDatasetVersion(opts: { email: string; projectName: string; name: string; rows: Record<string, number>[]; feedConcA?: number }) {
  return withE2eDatabase(async (db) => {
    const [user] = await db.select().from(users).where(eq(users.email, opts.email));
    const [project] = await db.select().from(projects).where(and(eq(projects.name, opts.projectName)));
    const [ds] = await db.insert(rateDatasets).values({ teamId: project.teamId, projectId: project.id, name: opts.name, createdBy: user.id }).returning();
    const [v] = await db
      .insert(rateDatasetVersions)
      .values({ datasetId: ds.id, version: 1, fileName: `${opts.name}.csv`, format: "csv", mapping: {}, rows: opts.rows, rowCount: opts.rows.length, feedConcA: opts.feedConcA ?? null, createdBy: user.id })
      .returning();
    return { projectId: project.id, datasetId: ds.id, versionId: v.id };
  });
}
