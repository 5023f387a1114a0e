import { index, jsonb, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users } from "./identity";
import { teams } from "./teams";
import { projects } from "./projects";
import { kineticsVersions } from "./kinetics";
import { sweeps } from "./sweeps";

/* Trains pinned to a project with their assumptions, and their review. */

export const reviewStateEnum = pgEnum("review_state", ["proposed", "approved", "rejected", "superseded"]);

/** A frozen copy of one candidate, pinned to a project with its spec, under review. */
export const pinnedDesigns = pgTable(
  "pinned_designs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    projectId: uuid("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    sweepId: uuid("sweep_id").references(() => sweeps.id, { onDelete: "set null" }),
    candidateId: uuid("candidate_id"),
    kineticsVersionId: uuid("kinetics_version_id").notNull().references(() => kineticsVersions.id),
    /** The candidate as it was ranked (stages, totals, plot data). */
    candidate: jsonb("candidate").$type<Record<string, unknown>>().notNull(),
    /** The resolved engine spec of its scenario. */
    spec: jsonb("spec").$type<Record<string, unknown>>().notNull(),
    note: text("note").notNull().default(""),
    state: reviewStateEnum("state").notNull().default("proposed"),
    pinnedBy: text("pinned_by").notNull().references(() => users.id),
    pinnedAt: timestamp("pinned_at", { withTimezone: true }).notNull().defaultNow(),
    reviewerId: text("reviewer_id").references(() => users.id),
    reviewComment: text("review_comment"),
    reviewedAt: timestamp("reviewed_at", { withTimezone: true }),
  },
  (t) => [index("pinned_designs_project_idx").on(t.projectId, t.pinnedAt)],
);

export type PinnedDesign = typeof pinnedDesigns.$inferSelect;
