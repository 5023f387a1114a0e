import { doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { users } from "./identity";
import { teams } from "./teams";
import { projects } from "./projects";

/* Rate datasets (bench measurements of rate against conversion) and their immutable versions. */

/** A named set of rate measurements of a project; its rows live in numbered, immutable versions. */
export const rateDatasets = pgTable(
  "rate_datasets",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    projectId: uuid("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    createdBy: text("created_by").notNull().references(() => users.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("rate_datasets_project_idx").on(t.projectId)],
);

/** One accepted upload of a dataset: rows in SI units (mol/m3, mol/(m3 s), K), never updated. */
export const rateDatasetVersions = pgTable(
  "rate_dataset_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    datasetId: uuid("dataset_id").notNull().references(() => rateDatasets.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    fileName: text("file_name").notNull(),
    /** "csv" or "xlsx". */
    format: text("format").notNull(),
    /** Column choices and units as the user made them (header → role, unit per role). */
    mapping: jsonb("mapping").$type<Record<string, unknown>>().notNull(),
    /** The accepted rows in SI: { conversion?, concA?, concR?, temperature?, rate }. */
    rows: jsonb("rows").$type<Record<string, number>[]>().notNull(),
    rowCount: integer("row_count").notNull(),
    /** Feed concentration of A (mol/m3) used to convert between conversion and concentration, if given. */
    feedConcA: doublePrecision("feed_conc_a"),
    note: text("note").notNull().default(""),
    createdBy: text("created_by").notNull().references(() => users.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("rate_dataset_versions_unique").on(t.datasetId, t.version)],
);

export type RateDataset = typeof rateDatasets.$inferSelect;
export type RateDatasetVersion = typeof rateDatasetVersions.$inferSelect;
