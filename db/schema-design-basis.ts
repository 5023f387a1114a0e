import { boolean, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { projects, teams, users } from "./schema";
import { candidates, kineticsVersions, pinnedDesigns } from "./schema-sweeps";

/*
 * Tables of the path from bench data to a reviewed design basis: rate datasets and their
 * versions, kinetic fits, project cost settings, the plant's idle vessels and robustness runs.
 */

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

/** Cost basis of a project: correlations per stage type, standard sizes, limits, installation factor. */
export const projectCostSettings = pgTable("project_cost_settings", {
  projectId: uuid("project_id")
    .primaryKey()
    .references(() => projects.id, { onDelete: "cascade" }),
  teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
  /** { CSTR: { a, b, n, source }, PFR: { a, b, n, source }, currency, basisYear }. */
  settings: jsonb("settings").$type<Record<string, unknown>>().notNull(),
  updatedBy: text("updated_by").notNull().references(() => users.id),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});

export const vesselTypeEnum = pgEnum("vessel_type", ["CSTR", "PFR"]);

/** An idle vessel the plant owns (team-wide), which a train may reuse instead of buying new. */
export const inventoryVessels = pgTable(
  "inventory_vessels",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    /** The plant's equipment tag, unique in the team. */
    tag: text("tag").notNull(),
    type: vesselTypeEnum("type").notNull(),
    /** Working volume, m3. */
    volume: doublePrecision("volume").notNull(),
    available: boolean("available").notNull().default(true),
    /** Cost of bringing it into service (moving, inspection, re-piping). */
    reuseCost: doublePrecision("reuse_cost").notNull().default(0),
    location: text("location").notNull().default(""),
    note: text("note").notNull().default(""),
    createdBy: text("created_by").notNull().references(() => users.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("inventory_vessels_team_tag_unique").on(t.teamId, t.tag)],
);

export const robustnessStatusEnum = pgEnum("robustness_status", ["queued", "running", "succeeded", "failed"]);

/** A Monte Carlo rating of one fixed train (a candidate or a pinned design) under uncertain inputs. */
export const robustnessRuns = pgTable(
  "robustness_runs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    projectId: uuid("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    candidateId: uuid("candidate_id").references(() => candidates.id, { onDelete: "set null" }),
    pinId: uuid("pin_id").references(() => pinnedDesigns.id, { onDelete: "cascade" }),
    /** { uncertain, target, samples, seed } as submitted. */
    request: jsonb("request").$type<Record<string, unknown>>().notNull(),
    status: robustnessStatusEnum("status").notNull().default("queued"),
    /** P5, P50, P95, probability of missing the target, distribution points. */
    result: jsonb("result").$type<Record<string, unknown> | null>(),
    error: text("error"),
    jobId: text("job_id"),
    createdBy: text("created_by").notNull().references(() => users.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [index("robustness_runs_pin_idx").on(t.pinId), index("robustness_runs_candidate_idx").on(t.candidateId)],
);

export type RateDataset = typeof rateDatasets.$inferSelect;
export type RateDatasetVersion = typeof rateDatasetVersions.$inferSelect;
export type KineticsSource = typeof kineticsSources.$inferSelect;
export type ProjectCostSettings = typeof projectCostSettings.$inferSelect;
export type InventoryVesselRow = typeof inventoryVessels.$inferSelect;
export type RobustnessRun = typeof robustnessRuns.$inferSelect;
