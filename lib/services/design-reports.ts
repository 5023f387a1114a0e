import { and, desc, eq, inArray, isNull, or, sql } from "drizzle-orm";
import type { Database } from "@/db/client";
import { teamKineticsSources } from "@/db/queries/kinetics-sources";
import { teamUserNames } from "@/db/queries/user-names";
import { candidates, inventoryVessels, projectCostSettings, projects, robustnessRuns, sweeps, type PinnedDesign } from "@/db/schema";
import type { Actor } from "@/lib/authz/policy";
import { buildDesignReport, plannedVesselIds, reportCosting, type DesignReport } from "@/lib/reports/design-report";
import { networkCurves } from "@/lib/reports/network-curves";
import { isPinnedNetworkCandidate } from "@/lib/reports/network-report";
import { withNumbers } from "@/lib/robustness/numeric-path";
import { isNetworkSpec } from "@/lib/schemas/network-spec";
import { getDisplayPreference } from "./display-units";
import { requireTeamKineticsVersion } from "./kinetics";
import { getPin } from "./pins";

/**
 * The design report of a pin, read through the pin's own authorisation (getPin: viewers see
 * approved pins only, another team's pin is not found); every other read is scoped to the
 * pin's team and project. The content itself comes from the pure builder.
 */
export async function getDesignReport(db: Database, actor: Actor, pinId: string, now = new Date()): Promise<DesignReport> {
  const pin = await getPin(db, actor, pinId);
  const [project] = await db
    .select({ id: projects.id, name: projects.name, description: projects.description })
    .from(projects)
    .where(and(eq(projects.id, pin.projectId), eq(projects.teamId, actor.teamId)));
  const [kinetics, [source], [candidate], [costSettings], robustness, names, preference] = await Promise.all([
    requireTeamKineticsVersion(db, actor, pin.kineticsVersionId),
    teamKineticsSources(db, actor.teamId, { kineticsVersionIds: [pin.kineticsVersionId] }),
    pin.candidateId
      ? db.select({ installedCost: candidates.installedCost, inventoryPlan: candidates.inventoryPlan }).from(candidates).where(eq(candidates.id, pin.candidateId))
      : Promise.resolve([]),
    db
      .select({ settings: projectCostSettings.settings, updatedAt: projectCostSettings.updatedAt })
      .from(projectCostSettings)
      .where(and(eq(projectCostSettings.projectId, pin.projectId), eq(projectCostSettings.teamId, actor.teamId))),
    latestRobustnessRun(db, actor.teamId, pin),
    teamUserNames(db, actor.teamId, [pin.pinnedBy, pin.reviewerId]),
    getDisplayPreference(db, actor.userId),
  ]);
  const costing = reportCosting(pin, candidate ?? null);
  return buildDesignReport({
    network: await networkInputs(db, actor.teamId, pin, kinetics?.version.spec),
    pin,
    project: project ?? { id: pin.projectId, name: "project", description: "" },
    names,
    kinetics: kinetics ? { model: kinetics.model.name, version: kinetics.version.version, spec: kinetics.version.spec } : null,
    source: source
      ? { kind: source.kind, fit: source.fit ?? null, dataset: source.datasetName, datasetVersion: source.datasetVersion, fileName: source.fileName, rowCount: source.rowCount }
      : null,
    candidate: costing,
    costSettings: costSettings ?? null,
    robustness: robustness?.result ? { id: robustness.id, request: robustness.request, result: robustness.result, finishedAt: robustness.finishedAt } : null,
    inventoryTags: await inventoryTags(db, actor.teamId, plannedVesselIds(costing)),
    now,
    preference,
  });
}

/**
 * The pin's latest succeeded robustness run. Looked up when the report is built rather than
 * copied at pin time: a run started on the candidate before (or after) pinning rates the same
 * frozen train and scenario, and pins made before this lookup existed get their candidate's run too.
 */
async function latestRobustnessRun(db: Database, teamId: string, pin: PinnedDesign) {
  const [run] = await db
    .select({ id: robustnessRuns.id, request: robustnessRuns.request, result: robustnessRuns.result, finishedAt: robustnessRuns.finishedAt })
    .from(robustnessRuns)
    .where(
      and(
        pin.candidateId ? or(eq(robustnessRuns.pinId, pin.id), and(isNull(robustnessRuns.pinId), eq(robustnessRuns.candidateId, pin.candidateId))) : eq(robustnessRuns.pinId, pin.id),
        eq(robustnessRuns.teamId, teamId),
        eq(robustnessRuns.status, "succeeded"),
      ),
    )
    // Latest finished first; a run without a finish time (should not happen once succeeded) goes last.
    .orderBy(sql`${robustnessRuns.finishedAt} desc nulls last`, desc(robustnessRuns.createdAt))
    .limit(1);
  return run ?? null;
}

/**
 * For a pinned train of several reactions: its scenario's design spec (the pin's own when it holds
 * the chemistry, else its sweep's starting spec with the scenario's values), the frozen candidate and
 * the model's wanted product. Null for a one-reaction pin.
 */
export async function pinNetworkSpec(db: Database, teamId: string, pin: PinnedDesign, modelSpec?: unknown) {
  if (!isPinnedNetworkCandidate(pin.candidate)) return null;
  const frozen = pin.candidate;
  let spec: Record<string, unknown> = pin.spec;
  if (!isNetworkSpec(spec)) {
    const [sweep] = await db
      .select({ baseSpec: sweeps.baseSpec })
      .from(sweeps)
      .where(and(eq(sweeps.id, frozen.sweep.id), eq(sweeps.teamId, teamId)));
    spec = withNumbers(sweep?.baseSpec ?? {}, frozen.scenario.overrides ?? {});
  }
  const model = (modelSpec ?? {}) as { product?: unknown };
  return { spec, candidate: frozen, modelProduct: typeof model.product === "string" ? model.product : null };
}

/** The network part of a report's inputs: the spec and the curves the report draws. */
async function networkInputs(db: Database, teamId: string, pin: PinnedDesign, modelSpec: unknown) {
  const found = await pinNetworkSpec(db, teamId, pin, modelSpec);
  if (!found) return undefined;
  const objective = (found.spec.objective ?? {}) as { product?: unknown };
  const product = typeof objective.product === "string" ? objective.product : found.modelProduct;
  return { spec: found.spec, curves: networkCurves(found.spec, found.candidate, product) };
}

/** Tags of the team's vessels by id; ids that are not well-formed uuids are skipped rather than queried. */
async function inventoryTags(db: Database, teamId: string, ids: string[]): Promise<Record<string, string>> {
  const uuids = ids.filter((id) => /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id));
  if (!uuids.length) return {};
  const rows = await db
    .select({ id: inventoryVessels.id, tag: inventoryVessels.tag })
    .from(inventoryVessels)
    .where(and(eq(inventoryVessels.teamId, teamId), inArray(inventoryVessels.id, uuids)));
  return Object.fromEntries(rows.map((r) => [r.id, r.tag]));
}
