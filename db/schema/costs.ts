import { boolean, doublePrecision, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { users } from "./identity";
import { teams } from "./teams";
import { projects } from "./projects";

/* Project cost settings and the plant's idle vessels that a train may reuse. */

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

export type ProjectCostSettings = typeof projectCostSettings.$inferSelect;
export type InventoryVesselRow = typeof inventoryVessels.$inferSelect;
