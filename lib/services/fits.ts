import { and, desc, eq } from "drizzle-orm";
import type { Database, Executor } from "@/db/client";
import { kineticsModels, rateDatasets, rateDatasetVersions } from "@/db/schema";
import { teamKineticsSources } from "@/db/queries/kinetics-sources";
import { teamDatasetVersion } from "@/db/queries/team-dataset-versions";
import { assertCan, type Actor } from "@/lib/authz/policy";
import { CAUTIONS } from "@/lib/engine";
import { AppError, notFound } from "@/lib/errors";
import { AIC_CRITERION, dataRange, fitSummary, MissingFeedConcentration, preparePoints, toEngineLaw, tryFit, type DatasetRow, type PreparedPoints } from "@/lib/fitting/from-dataset";
import type { FitRequest, FitResponse, FitSave, LawFitOut } from "@/lib/schemas/fits";
import type { KineticsSpec } from "@/lib/schemas/sweeps";
import { checkKinetics } from "./kinetics-checks";
import { addKineticsVersion, createKineticsModel } from "./kinetics";

/** Why a fitted law holds only where it was measured; shown with every fit. */
export const FIT_CAUTIONS = [
  "A fitted rate law is only valid inside the measured range of conversion, concentration and temperature; a design that runs outside it extrapolates.",
  "Standard errors and 95 % intervals come from the linearised covariance at the optimum and assume independent, equal-variance errors.",
  // The sizes built on the law carry the product's cautions, in the one wording shown everywhere.
  ...CAUTIONS,
];

/** A dataset version of the actor's team with its dataset, or 404 (also for another team's id). */
export async function requireTeamDatasetVersion(db: Executor, actor: Actor, versionId: string) {
  const row = await teamDatasetVersion(db, actor.teamId, versionId);
  if (!row) throw notFound("dataset version");
  assertCan(actor, "dataset.read", { teamId: row.dataset.teamId }, "dataset version");
  return row;
}

type VersionRow = Awaited<ReturnType<typeof requireTeamDatasetVersion>>;

function prepare(row: VersionRow, feedConcA: number | undefined): { prepared: PreparedPoints; c0: number | null } {
  const c0 = feedConcA ?? row.version.feedConcA ?? null;
  try {
    return { prepared: preparePoints(row.version.rows as DatasetRow[], c0), c0 };
  } catch (err) {
    if (err instanceof MissingFeedConcentration) {
      const msg = `Give the feed concentration C_A0 (mol/m³): ${err.message}, and C_A = C_A0·(1 − X) needs it`;
      throw new AppError("bad_request", msg, { fields: { feedConcA: [msg] } });
    }
    throw err;
  }
}

/** Fits each requested law to a dataset version, on demand; nothing is stored. */
export async function fitDatasetVersion(db: Database, actor: Actor, versionId: string, input: FitRequest): Promise<FitResponse> {
  const row = await requireTeamDatasetVersion(db, actor, versionId);
  const { prepared, c0 } = prepare(row, input.feedConcA);
  const fits: LawFitOut[] = input.laws.map((law) => {
    const r = tryFit(law, prepared);
    if (!r.ok) return r;
    return { law, ok: true, ...fitSummary(r.fit), parity: r.fit.parity, residuals: r.fit.residuals };
  });
  return {
    dataset: { id: row.dataset.id, projectId: row.dataset.projectId, name: row.dataset.name, versionId: row.version.id, version: row.version.version, rowCount: row.version.rowCount },
    feedConcA: c0,
    assumptions: prepared.assumptions,
    range: dataRange(row.version.rows as DatasetRow[], prepared.points, c0),
    criterion: AIC_CRITERION,
    fits,
    cautions: FIT_CAUTIONS,
  };
}

/**
 * Refits one law server-side (client numbers are never trusted), maps it to the engine's rate
 * law and saves it as a new kinetics model, or a new version of a model of the same project,
 * with its source row, in one transaction.
 */
export async function saveFitAsKinetics(db: Database, actor: Actor, versionId: string, input: FitSave) {
  const row = await requireTeamDatasetVersion(db, actor, versionId);
  assertCan(actor, "kinetics.create", { teamId: row.dataset.teamId }, "dataset version");
  const { prepared, c0 } = prepare(row, input.feedConcA);
  const result = tryFit(input.law, prepared);
  if (!result.ok) throw new AppError("bad_request", `The ${input.law} law cannot be fitted: ${result.error}`, { fields: { law: [result.error] } });

  const stoichiometry = input.stoichiometry ?? (input.law === "reversible" ? { A: -1, R: 1 } : undefined);
  if (input.law === "reversible" && !(stoichiometry && typeof stoichiometry.R === "number" && stoichiometry.R > 0)) {
    const msg = "The reversible law's reverse term reads C_R: the stoichiometry must make R (e.g. { A: -1, R: 1 })";
    throw new AppError("bad_request", msg, { fields: { stoichiometry: [msg] } });
  }
  const spec: KineticsSpec = {
    feed: input.feed,
    reaction: { ...(stoichiometry ? { stoichiometry } : {}), phase: input.phase ?? "liquid", rate: toEngineLaw(result.fit) },
  };
  // Field names of the body: feed.*, stoichiometry, ...
  checkKinetics(spec, "");

  const summary = fitSummary(result.fit);
  const range = dataRange(row.version.rows as DatasetRow[], prepared.points, c0);
  const source = {
    datasetVersionId: row.version.id,
    kind: "fit" as const,
    fit: { law: input.law, ...summary, range, assumptions: prepared.assumptions, feedConcA: c0, dataset: { name: row.dataset.name, version: row.version.version } },
  };

  if (input.modelId) {
    const [model] = await db.select().from(kineticsModels).where(and(eq(kineticsModels.id, input.modelId), eq(kineticsModels.teamId, actor.teamId)));
    if (!model) throw notFound("kinetics model");
    if (model.projectId !== row.dataset.projectId) {
      const msg = "That kinetics model belongs to another project than the dataset";
      throw new AppError("bad_request", msg, { fields: { modelId: [msg] } });
    }
    const version = await addKineticsVersion(db, actor, model.id, { spec, note: input.note, source });
    return { model, version, fit: source.fit };
  }
  const { model, version } = await createKineticsModel(db, actor, row.dataset.projectId, { name: input.modelName!, spec, note: input.note, source });
  return { model, version, fit: source.fit };
}

/** The sources of some kinetics versions, with their dataset's name and version number, for the model page. */
export async function listKineticsSources(db: Executor, actor: Actor, kineticsVersionIds: string[]) {
  if (!kineticsVersionIds.length) return [];
  assertCan(actor, "kinetics.read");
  return teamKineticsSources(db, actor.teamId, { kineticsVersionIds });
}

/** A dataset of the actor's team and one of its versions by number (the latest when absent), for the fit screen. */
export async function getDatasetVersionForFit(db: Executor, actor: Actor, datasetId: string, versionNumber?: number) {
  const [dataset] = await db.select().from(rateDatasets).where(and(eq(rateDatasets.id, datasetId), eq(rateDatasets.teamId, actor.teamId)));
  if (!dataset) throw notFound("dataset");
  assertCan(actor, "dataset.read", { teamId: dataset.teamId }, "dataset");
  const all = await db
    .select({ id: rateDatasetVersions.id, version: rateDatasetVersions.version, rowCount: rateDatasetVersions.rowCount, feedConcA: rateDatasetVersions.feedConcA, rows: rateDatasetVersions.rows })
    .from(rateDatasetVersions)
    .where(eq(rateDatasetVersions.datasetId, datasetId))
    .orderBy(desc(rateDatasetVersions.version));
  const version = versionNumber === undefined ? all[0] : all.find((v) => v.version === versionNumber);
  if (!version) throw notFound("dataset version");
  const rows = version.rows as DatasetRow[];
  const columns = (["conversion", "concA", "concR", "temperature"] as const).filter((c) => rows.some((r) => typeof r[c] === "number"));
  return {
    dataset,
    version: { id: version.id, version: version.version, rowCount: version.rowCount, feedConcA: version.feedConcA, columns },
    versions: all.map((v) => v.version),
  };
}
