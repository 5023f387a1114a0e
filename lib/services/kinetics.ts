import { and, desc, eq, max } from "drizzle-orm";
import type { Database, Executor } from "@/db/client";
import { kineticsModels, kineticsSources, kineticsVersions, projects } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz/policy";
import { AppError, notFound } from "@/lib/errors";
import { isNetworkSpec } from "@/lib/schemas/network-spec";
import type { AnyKineticsSpec } from "@/lib/schemas/sweeps";
import { checkKinetics } from "./kinetics-checks";
import { recordAudit } from "./audit";

/** Where a version came from, saved in the same transaction as the version (optional). */
export interface KineticsVersionSource {
  datasetVersionId: string;
  kind: "table" | "fit";
  fit: Record<string, unknown> | null;
}

async function insertSource(tx: Executor, kineticsVersionId: string, source: KineticsVersionSource | undefined) {
  if (source) await tx.insert(kineticsSources).values({ kineticsVersionId, ...source });
}

/** A project of the actor's team, or 404 (also for another team's id). */
export async function requireTeamProject(db: Executor, actor: Actor, projectId: string) {
  const [p] = await db.select().from(projects).where(and(eq(projects.id, projectId), eq(projects.teamId, actor.teamId)));
  if (!p) throw notFound("project");
  return p;
}

export async function createKineticsModel(db: Database, actor: Actor, projectId: string, input: { name: string; spec: AnyKineticsSpec; note: string; source?: KineticsVersionSource }) {
  const project = await requireTeamProject(db, actor, projectId);
  assertCan(actor, "kinetics.create", project, "project");
  checkKinetics(input.spec);
  return db.transaction(async (tx) => {
    const [model] = await tx.insert(kineticsModels).values({ teamId: actor.teamId, projectId, name: input.name, createdBy: actor.userId }).returning();
    const [version] = await tx
      .insert(kineticsVersions)
      .values({ modelId: model.id, version: 1, spec: input.spec as Record<string, unknown>, note: input.note, createdBy: actor.userId })
      .returning();
    await insertSource(tx, version.id, input.source);
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "kinetics.created", entityType: "project", entityId: projectId, details: { model: model.name, modelId: model.id, version: 1, ...sourceDetails(input.source) } });
    return { model, version: { ...version, kind: kindOfSpec(version.spec) } };
  });
}

/** "single" for a model of one reaction, "network" for one of several. */
export type KineticsKind = "single" | "network";
export const kindOfSpec = (spec: unknown): KineticsKind => (isNetworkSpec(spec) ? "network" : "single");

/** A model keeps its kind: sweeps, pins and reports of its earlier versions read the same chemistry. */
function assertSameKind(model: KineticsKind, version: KineticsKind) {
  if (model === version) return;
  const message =
    model === "network"
      ? "This model has several reactions; a version with one reaction belongs in a new model"
      : "This model has one reaction; a version with several reactions belongs in a new model";
  throw new AppError("conflict", message, { fields: { spec: [message] } });
}

const sourceDetails = (source: KineticsVersionSource | undefined) => (source ? { source: { kind: source.kind, datasetVersionId: source.datasetVersionId } } : {});

export async function requireTeamModel(db: Executor, actor: Actor, modelId: string) {
  const [m] = await db.select().from(kineticsModels).where(and(eq(kineticsModels.id, modelId), eq(kineticsModels.teamId, actor.teamId)));
  if (!m) throw notFound("kinetics model");
  return m;
}

/** Editing a model makes a new version; earlier versions (and sweeps that ran on them) stay as they were. */
export async function addKineticsVersion(db: Database, actor: Actor, modelId: string, input: { spec: AnyKineticsSpec; note: string; source?: KineticsVersionSource }) {
  const model = await requireTeamModel(db, actor, modelId);
  assertCan(actor, "kinetics.create", { teamId: model.teamId }, "kinetics model");
  checkKinetics(input.spec);
  return db.transaction(async (tx) => {
    // Lock the model row so two concurrent edits get consecutive numbers.
    await tx.select({ id: kineticsModels.id }).from(kineticsModels).where(eq(kineticsModels.id, modelId)).for("update");
    const [{ latest }] = await tx.select({ latest: max(kineticsVersions.version) }).from(kineticsVersions).where(eq(kineticsVersions.modelId, modelId));
    const [previous] = await tx.select({ spec: kineticsVersions.spec }).from(kineticsVersions).where(eq(kineticsVersions.modelId, modelId)).orderBy(desc(kineticsVersions.version)).limit(1);
    if (previous) assertSameKind(kindOfSpec(previous.spec), kindOfSpec(input.spec));
    const [version] = await tx
      .insert(kineticsVersions)
      .values({ modelId, version: (latest ?? 0) + 1, spec: input.spec as Record<string, unknown>, note: input.note, createdBy: actor.userId })
      .returning();
    await insertSource(tx, version.id, input.source);
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "kinetics.version_added", entityType: "project", entityId: model.projectId, details: { model: model.name, modelId, version: version.version, ...sourceDetails(input.source) } });
    return { ...version, kind: kindOfSpec(version.spec) };
  });
}

export async function listKineticsModels(db: Database, actor: Actor, projectId: string) {
  const project = await requireTeamProject(db, actor, projectId);
  assertCan(actor, "kinetics.read", project, "project");
  const models = await db.select().from(kineticsModels).where(eq(kineticsModels.projectId, projectId)).orderBy(kineticsModels.name);
  const out = [];
  for (const m of models) {
    const [latest] = await db.select().from(kineticsVersions).where(eq(kineticsVersions.modelId, m.id)).orderBy(desc(kineticsVersions.version)).limit(1);
    out.push({ ...m, latestVersion: latest ? { ...latest, kind: kindOfSpec(latest.spec) } : latest });
  }
  return out;
}

export async function getKineticsModel(db: Database, actor: Actor, modelId: string) {
  const model = await requireTeamModel(db, actor, modelId);
  assertCan(actor, "kinetics.read", { teamId: model.teamId }, "kinetics model");
  const versions = await db.select().from(kineticsVersions).where(eq(kineticsVersions.modelId, modelId)).orderBy(desc(kineticsVersions.version));
  return { ...model, kind: versions[0] ? kindOfSpec(versions[0].spec) : ("single" as KineticsKind), versions: versions.map((v) => ({ ...v, kind: kindOfSpec(v.spec) })) };
}

/** A version of a model of the actor's team, with its model (for the project it belongs to). */
export async function requireTeamKineticsVersion(db: Executor, actor: Actor, versionId: string) {
  const [row] = await db
    .select({ version: kineticsVersions, model: kineticsModels })
    .from(kineticsVersions)
    .innerJoin(kineticsModels, eq(kineticsModels.id, kineticsVersions.modelId))
    .where(and(eq(kineticsVersions.id, versionId), eq(kineticsModels.teamId, actor.teamId)));
  return row ?? null;
}
