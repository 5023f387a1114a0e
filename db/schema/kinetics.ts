import { index, integer, jsonb, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { users } from "./identity";
import { teams } from "./teams";
import { projects } from "./projects";
import { rateDatasetVersions } from "./datasets";

/* Kinetics models, their immutable numbered versions, and where a version came from (a fit of a rate dataset). */

/** A named kinetics model of a project; its content lives in numbered, immutable versions. */
export const kineticsModels = pgTable(
  "kinetics_models",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    projectId: uuid("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    createdBy: text("created_by").notNull().references(() => users.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("kinetics_models_project_idx").on(t.projectId)],
);

/** One version of a kinetics model: the feed and reaction part of an engine spec. Never updated. */
export const kineticsVersions = pgTable(
  "kinetics_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    modelId: uuid("model_id").notNull().references(() => kineticsModels.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    /** { feed, reaction } as the engine reads them. */
    spec: jsonb("spec").$type<Record<string, unknown>>().notNull(),
    note: text("note").notNull().default(""),
    createdBy: text("created_by").notNull().references(() => users.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("kinetics_versions_model_version_unique").on(t.modelId, t.version)],
);

/**
 * Where a kinetics version came from when it was not typed in: a dataset version used as a
 * measured table, or a fit to one. One row per kinetics version at most.
 */
export const kineticsSources = pgTable("kinetics_sources", {
  kineticsVersionId: uuid("kinetics_version_id")
    .primaryKey()
    .references(() => kineticsVersions.id, { onDelete: "cascade" }),
  datasetVersionId: uuid("dataset_version_id")
    .notNull()
    .references(() => rateDatasetVersions.id),
  /** "table" (model-free) or "fit". */
  kind: text("kind").notNull(),
  /** The fit as reported (law, parameters with standard errors and intervals, RSS, R²), for kind "fit". */
  fit: jsonb("fit").$type<Record<string, unknown> | null>(),
});

export type KineticsModel = typeof kineticsModels.$inferSelect;
export type KineticsVersion = typeof kineticsVersions.$inferSelect;
export type KineticsSource = typeof kineticsSources.$inferSelect;
