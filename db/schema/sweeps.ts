import { boolean, customType, doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { users } from "./identity";
import { teams } from "./teams";
import { projects } from "./projects";
import { kineticsVersions } from "./kinetics";
import { decodeStages, encodeStages } from "../stage-codec";

/** A candidate's stages, kept as a few bytes (db/stage-codec.ts) and read back as the same list. */
const storedStages = customType<{ data: Record<string, unknown>[]; driverData: Buffer }>({
  dataType: () => "bytea",
  toDriver: (stages) => encodeStages(stages),
  fromDriver: (bytes) => decodeStages(bytes),
});

/* Optimisation sweeps, their operating scenarios and the ranked candidate trains of each. */

export const sweepStatusEnum = pgEnum("sweep_status", ["queued", "running", "succeeded", "failed", "cancelled"]);
export const scenarioStatusEnum = pgEnum("scenario_status", ["pending", "succeeded", "failed"]);

export const sweeps = pgTable(
  "sweeps",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    projectId: uuid("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    kineticsVersionId: uuid("kinetics_version_id").notNull().references(() => kineticsVersions.id),
    name: text("name").notNull(),
    /** The full engine spec every scenario starts from (kinetics version + target, train, objective). */
    baseSpec: jsonb("base_spec").$type<Record<string, unknown>>().notNull(),
    /** The scenario grid as submitted. */
    grid: jsonb("grid").$type<unknown[]>().notNull().default([]),
    status: sweepStatusEnum("status").notNull().default("queued"),
    total: integer("total").notNull(),
    done: integer("done").notNull().default(0),
    failedScenarios: integer("failed_scenarios").notNull().default(0),
    error: text("error"),
    jobIds: jsonb("job_ids").$type<string[]>().notNull().default([]),
    rerunOf: uuid("rerun_of"),
    /** Monte Carlo settings { uncertain, samples, seed } when candidates are also rated under uncertainty. */
    robustness: jsonb("robustness").$type<Record<string, unknown> | null>(),
    /** The team's available inventory vessels as they were when the sweep was submitted, when reuse was asked for. */
    inventory: jsonb("inventory").$type<Record<string, unknown>[] | null>(),
    submittedBy: text("submitted_by").notNull().references(() => users.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp("started_at", { withTimezone: true }),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [index("sweeps_project_idx").on(t.projectId, t.createdAt), index("sweeps_team_idx").on(t.teamId)],
);

export const scenarios = pgTable(
  "scenarios",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sweepId: uuid("sweep_id").notNull().references(() => sweeps.id, { onDelete: "cascade" }),
    index: integer("index").notNull(),
    /** Field path → value for this scenario, e.g. { "feed.flowA": 0.02 }. */
    overrides: jsonb("overrides").$type<Record<string, number>>().notNull(),
    status: scenarioStatusEnum("status").notNull().default("pending"),
    error: jsonb("error").$type<{ message: string; path: string | null; code: string } | null>(),
    bestObjective: doublePrecision("best_objective"),
    reference: jsonb("reference").$type<Record<string, unknown> | null>(),
    candidateCount: integer("candidate_count").notNull().default(0),
    computedAt: timestamp("computed_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("scenarios_sweep_index_unique").on(t.sweepId, t.index)],
);

export const candidates = pgTable(
  "candidates",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sweepId: uuid("sweep_id").notNull().references(() => sweeps.id, { onDelete: "cascade" }),
    scenarioId: uuid("scenario_id").notNull().references(() => scenarios.id, { onDelete: "cascade" }),
    /** Stage types joined by "-", e.g. "CSTR-PFR"; unique per scenario, so a retried job never duplicates. */
    sequenceKey: text("sequence_key").notNull(),
    rank: integer("rank").notNull(),
    stageCount: integer("stage_count").notNull(),
    feasible: boolean("feasible").notNull(),
    totalVolume: doublePrecision("total_volume"),
    totalCost: doublePrecision("total_cost"),
    /** Total volume over the single-PFR volume of the same scenario. */
    ratioToPfr: doublePrecision("ratio_to_pfr"),
    reason: text("reason"),
    /** Installed cost (purchase × installation factor, less reused vessels), when the sweep had a cost basis. */
    installedCost: doublePrecision("installed_cost"),
    /** Probability that the fixed train meets the target under the sweep's uncertain inputs. */
    probabilityMeet: doublePrecision("probability_meet"),
    /**
     * Several reactions only: the key reactant's conversion, the wanted product's yield and selectivity at
     * the train's outlet, the value ranked on (yield, selectivity or total volume), and where the optimum
     * sits on a bound. Null for one-reaction sweeps and infeasible trains.
     */
    conversion: doublePrecision("conversion"),
    yield: doublePrecision("yield"),
    selectivity: doublePrecision("selectivity"),
    objectiveValue: doublePrecision("objective_value"),
    onBound: jsonb("on_bound").$type<string[] | null>(),
    /** Which inventory vessel equips which stage, and what is bought, when reuse was asked for. */
    inventoryPlan: jsonb("inventory_plan").$type<Record<string, unknown> | null>(),
    /** Stages without their plot data, kept compact (db/stage-codec.ts). */
    stages: storedStages("stages").notNull(),
    /** Levenspiel plot data per stage (curve and area), read only when a chart is drawn. */
    levenspiel: jsonb("levenspiel").$type<unknown[]>().notNull(),
  },
  (t) => [
    // One index serves both the ranked reads and a retried job's writes (ranks are 1..n in a scenario,
    // so a repeated row conflicts and is skipped).
    uniqueIndex("candidates_scenario_rank_unique").on(t.scenarioId, t.rank),
  ],
);

export type Sweep = typeof sweeps.$inferSelect;
export type Scenario = typeof scenarios.$inferSelect;
export type Candidate = typeof candidates.$inferSelect;
export type SweepStatus = (typeof sweepStatusEnum.enumValues)[number];
