import { eq } from "drizzle-orm";
import type { Database } from "@/db/client";
import { projectCostSettings } from "@/db/schema";
import { assertCan, can, type Actor } from "@/lib/authz/policy";
import { costObjectiveOf, defaultCostBasis, standardSizesOf } from "@/lib/costs/cost-basis";
import { AppError } from "@/lib/errors";
import { costBasisSchema, type CostBasis } from "@/lib/schemas/costs";
import { recordAudit } from "./audit";
import { requireTeamProject } from "./kinetics";

export interface CostBasisView {
  basis: CostBasis;
  /** True until someone saves the project's own basis: the defaults are shown. */
  isDefault: boolean;
  /** The standard sizes the basis gives (m3), or null for any size. */
  standardSizes: number[] | null;
  /** The sweep objective it prefills. */
  objective: ReturnType<typeof costObjectiveOf>;
  updatedAt: Date | null;
  permissions: { update: boolean };
}

function view(actor: Actor, teamId: string, basis: CostBasis, row: { updatedAt: Date } | null): CostBasisView {
  return {
    basis,
    isDefault: !row,
    standardSizes: standardSizesOf(basis),
    objective: costObjectiveOf(basis),
    updatedAt: row?.updatedAt ?? null,
    permissions: { update: can(actor, "cost.update", { teamId }) },
  };
}

/** The project's cost basis, or the defaults when none is saved. */
export async function getCostBasis(db: Database, actor: Actor, projectId: string): Promise<CostBasisView> {
  const project = await requireTeamProject(db, actor, projectId);
  assertCan(actor, "cost.read", project, "project");
  const [row] = await db.select().from(projectCostSettings).where(eq(projectCostSettings.projectId, projectId));
  const saved = row ? costBasisSchema.safeParse(row.settings) : null;
  return view(actor, project.teamId, saved?.success ? saved.data : defaultCostBasis(), saved?.success ? row : null);
}

/** Checks what the schema alone cannot: the sizes and the largest vessel must leave something to buy. */
function checkBasis(basis: CostBasis): void {
  const sizes = standardSizesOf(basis);
  if (sizes && sizes.length === 0) {
    throw new AppError("bad_request", "No R10 preferred size lies in that range", { fields: { "sizes.max": ["No R10 preferred size lies between min and max"] } });
  }
  if (sizes && basis.maxVesselVolume !== null && sizes[0] > basis.maxVesselVolume * (1 + 1e-12)) {
    const message = `The smallest standard size (${sizes[0]} m3) is above the maximum vessel volume`;
    throw new AppError("bad_request", message, { fields: { maxVesselVolume: [message] } });
  }
}

export async function saveCostBasis(db: Database, actor: Actor, projectId: string, basis: CostBasis): Promise<CostBasisView> {
  const project = await requireTeamProject(db, actor, projectId);
  assertCan(actor, "cost.update", project, "project");
  checkBasis(basis);
  const row = await db.transaction(async (tx) => {
    const values = { projectId, teamId: project.teamId, settings: basis as unknown as Record<string, unknown>, updatedBy: actor.userId, updatedAt: new Date() };
    const [saved] = await tx
      .insert(projectCostSettings)
      .values(values)
      .onConflictDoUpdate({ target: projectCostSettings.projectId, set: { settings: values.settings, updatedBy: values.updatedBy, updatedAt: values.updatedAt } })
      .returning();
    await recordAudit(tx, {
      teamId: actor.teamId,
      actorId: actor.userId,
      action: "project.costs_updated",
      entityType: "project",
      entityId: projectId,
      details: { currency: basis.currency, basisYear: basis.basisYear, installationFactor: basis.installationFactor.value },
    });
    return saved;
  });
  return view(actor, project.teamId, basis, row);
}
