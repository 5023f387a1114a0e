import { and, eq } from "drizzle-orm";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import { projects, rateDatasets, rateDatasetVersions, users } from "../../db/schema";

/**
 * Writes a dataset and its version 1 straight to the e2e database (the upload is another
 * screen's job), as `email` in the project named `projectName` of that user's team.
 */
export async function insertDatasetVersion(opts: { email: string; projectName: string; name: string; rows: Record<string, number>[]; feedConcA?: number }) {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set; run e2e tests through `npm test -- e2e`");
  const pool = new pg.Pool({ connectionString: url, max: 1 });
  try {
    const db = drizzle(pool);
    const [user] = await db.select().from(users).where(eq(users.email, opts.email));
    const [project] = await db.select().from(projects).where(and(eq(projects.name, opts.projectName)));
    const [ds] = await db.insert(rateDatasets).values({ teamId: project.teamId, projectId: project.id, name: opts.name, createdBy: user.id }).returning();
    const [v] = await db
      .insert(rateDatasetVersions)
      .values({ datasetId: ds.id, version: 1, fileName: `${opts.name}.csv`, format: "csv", mapping: {}, rows: opts.rows, rowCount: opts.rows.length, feedConcA: opts.feedConcA ?? null, createdBy: user.id })
      .returning();
    return { projectId: project.id, datasetId: ds.id, versionId: v.id };
  } finally {
    await pool.end();
  }
}
