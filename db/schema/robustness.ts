import { index, jsonb, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users } from "./identity";
import { teams } from "./teams";
import { projects } from "./projects";
import { candidates } from "./sweeps";
import { pinnedDesigns } from "./pins";

/* Robustness runs: Monte Carlo rating of a train under uncertain inputs. */

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

export type RobustnessRun = typeof robustnessRuns.$inferSelect;
