import { randomUUID } from "node:crypto";
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import { type Database, withTransaction } from "@/db/client";
import { scenarios, sweeps, type Sweep } from "@/db/schema";
import { designTrains, EngineError, type DesignSpec } from "@/lib/engine";
import { assertCan, type Actor } from "@/lib/authz/policy";
import { AppError, labelled, notFound } from "@/lib/errors";
import { bossDbFor, queueFor } from "@/lib/jobs/boss";
import { QUEUES, WAKE_CHANNEL, type SweepChunkPayload } from "@/lib/jobs/queues";
import { designSpecSchema } from "@/lib/schemas/sweep-spec";
import type { NetworkSweepCreate, SweepCreate } from "@/lib/schemas/sweeps";
import { isNetworkSpec, type NetworkKineticsSpec } from "@/lib/schemas/network-spec";
import { toBadRequest } from "./engine-errors";
import { labelFor } from "@/lib/schemas/field-labels";
import { issueInWords } from "@/lib/schemas/issue-words";
import { applyOverrides, chunkRanges, expandGrid, scenarioCount, type GridAxis, type Overrides } from "@/lib/sweeps/grid";
import { checkUncertainFields, trainSpec } from "@/lib/robustness/train";
import type { SweepRobustness } from "@/lib/schemas/robustness";
import type { NetworkScenarioReference, ScenarioReference, StoredNetworkSweepSpec, StoredSweepSpec, WithShapes } from "@/lib/sweeps/stored-json";
import { checkNetworkScenarios, networkBaseSpec } from "./network-sweep-checks";
import { recordAudit } from "./audit";
import { sweepCostingFor } from "./sweep-costing";
import { requireTeamKineticsVersion, requireTeamProject } from "./kinetics";
import type { UnitKind } from "@/lib/units/display";
import { typedUnits, type WithShownUnits } from "@/lib/units/typed-units";

/** Most scenarios one sweep may hold (SWEEP_MAX_SCENARIOS, default 2,000). */
export const maxScenarios = () => Number(process.env.SWEEP_MAX_SCENARIOS ?? 2000);

/** Scenarios per queue job: small enough that several workers share a sweep, large enough to batch writes. */
export function chunkSizeFor(total: number): number {
  const configured = Number(process.env.SWEEP_CHUNK_SIZE ?? 0);
  if (configured > 0) return configured;
  return Math.min(8, Math.max(1, Math.round(total / 40)));
}

/** Where a field of a resolved scenario spec came from in the request, for error paths. */
function fieldOfRequest(path: string, grid: GridAxis[]): string {
  const axis = grid.findIndex((a) => a.field === path);
  if (axis >= 0) return `grid.${axis}.field`;
  return path.startsWith("feed") || path.startsWith("reaction") ? `kineticsVersionId (${path})` : path;
}

/** Checks the resolved scenarios before anything is written: the shape of each, and the engine on the first. */
function checkScenarios(base: Record<string, unknown>, grid: GridAxis[], all: Overrides[]): void {
  const probes = all.length > 1 ? [all[0], all[all.length - 1]] : all;
  for (const o of probes) {
    const parsed = designSpecSchema.safeParse(applyOverrides(base, o));
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      const path = issue.path.join(".");
      const axis = grid.findIndex((a) => path === a.field || path.startsWith(`${a.field}.`) || a.field.startsWith(`${path}.`) || (issue.code === "unrecognized_keys" && a.field.startsWith(path)));
      const field = axis >= 0 ? `grid.${axis}.field` : fieldOfRequest(path, grid);
      const words = issueInWords(issue);
      throw new AppError("bad_request", labelled(labelFor(field), words), { fields: { [field]: [words] } });
    }
  }
  try {
    designTrains(applyOverrides(base, all[0]) as unknown as DesignSpec);
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    // A target one scenario cannot reach is that scenario's result; a malformed spec, or a
    // single-scenario sweep the engine refuses, is the request's error.
    if (all.length === 1 || !["infeasible", "equilibrium"].includes(err.code)) {
      const bad = toBadRequest(err);
      const field = fieldOfRequest(err.path, grid);
      const words = bad.fields?.[err.path] ?? [bad.message];
      throw new AppError("bad_request", `${labelFor(field)}: ${words.join(" ")}`, { fields: { [field]: words } });
    }
  }
}

interface NewSweep {
  actor: Actor;
  projectId: string;
  kineticsVersionId: string;
  name: string;
  baseSpec: Record<string, unknown>;
  grid: GridAxis[];
  rerunOf?: string;
  inventory?: Record<string, unknown>[] | null;
  /** Also rate every feasible train under uncertainty (sweeps.robustness). */
  robustness?: SweepRobustness | null;
}

async function insertSweepWithJobs(db: Database, s: NewSweep): Promise<Sweep> {
  const all = expandGrid(s.grid);
  // Rating every train under uncertainty multiplies a scenario's work by its samples: one scenario
  // per job, and a longer expiry so a slow but live worker is not taken for a dead one.
  const ranges = chunkRanges(all.length, s.robustness ? 1 : chunkSizeFor(all.length));
  const jobs = ranges.map((r) => ({ id: randomUUID(), ...r }));
  const boss = await queueFor(db);
  return withTransaction(db, async (tx, client) => {
    const [sweep] = await tx
      .insert(sweeps)
      .values({
        teamId: s.actor.teamId,
        projectId: s.projectId,
        kineticsVersionId: s.kineticsVersionId,
        name: s.name,
        baseSpec: s.baseSpec,
        grid: s.grid,
        robustness: s.robustness ?? null,
        total: all.length,
        jobIds: jobs.map((j) => j.id),
        rerunOf: s.rerunOf ?? null,
        inventory: s.inventory ?? null,
        submittedBy: s.actor.userId,
      })
      .returning();
    for (let i = 0; i < all.length; i += 1000) {
      await tx.insert(scenarios).values(all.slice(i, i + 1000).map((overrides, k) => ({ sweepId: sweep.id, index: i + k, overrides })));
    }
    // The jobs are written by this same transaction: no sweep without its jobs, no job without its sweep.
    await boss.insert(
      jobs.map((j) => ({
        id: j.id,
        name: QUEUES.sweepChunk,
        data: { sweepId: sweep.id, from: j.from, to: j.to } satisfies SweepChunkPayload,
        ...(s.robustness ? { expireInSeconds: 30 * 60 } : {}),
      })),
      { db: bossDbFor(client) },
    );
    await client.query("select pg_notify($1, $2)", [WAKE_CHANNEL, sweep.id]);
    await recordAudit(tx, {
      teamId: s.actor.teamId,
      actorId: s.actor.userId,
      action: s.rerunOf ? "sweep.rerun" : "sweep.submitted",
      entityType: "project",
      entityId: s.projectId,
      details: { sweepId: sweep.id, name: sweep.name, scenarios: all.length, ...(s.rerunOf ? { rerunOf: s.rerunOf } : {}) },
    });
    return sweep;
  });
}

/** A sweep of a model of one reaction (a target conversion) or of several (objective and limits). */
export async function createSweep(db: Database, actor: Actor, projectId: string, input: SweepCreate | NetworkSweepCreate): Promise<Sweep> {
  const project = await requireTeamProject(db, actor, projectId);
  assertCan(actor, "sweep.create", project, "project");
  const kv = await requireTeamKineticsVersion(db, actor, input.kineticsVersionId);
  if (!kv || kv.model.projectId !== projectId) {
    throw new AppError("not_found", "No such kinetics version in this project", { fields: { kineticsVersionId: ["No such kinetics version in this project"] } });
  }
  const total = scenarioCount(input.grid);
  if (total > maxScenarios()) {
    throw new AppError("bad_request", `The grid gives ${total} scenarios; a sweep may hold at most ${maxScenarios()}`, {
      fields: { grid: [`${total} scenarios; at most ${maxScenarios()}`] },
    });
  }
  const network = !("target" in input);
  if (network !== isNetworkSpec(kv.version.spec)) {
    const words = network
      ? "this kinetics version has one reaction; its sweep names a target conversion instead of what to rank by and the limits"
      : "this kinetics version has several reactions; its sweep names what to rank by and the limits instead of a target conversion";
    throw new AppError("bad_request", `${labelFor("kineticsVersionId")}: ${words}`, { fields: { kineticsVersionId: [words] } });
  }
  if (!("target" in input)) return createNetworkSweep(db, actor, projectId, kv, input, total);
  const { costing, inventory } = await sweepCostingFor(db, actor, input);
  // The units the engineer typed the model in are for showing it again; the engine reads SI only.
  const { shownUnits: _shownUnits, ...chemistry } = kv.version.spec as Record<string, unknown>;
  const engineSpec = { ...chemistry, target: input.target, train: input.train, ...(input.objective ? { objective: input.objective } : {}) };
  checkScenarios(engineSpec, input.grid, expandGrid(input.grid));
  if (input.robustness) checkUncertainFields(trainSpec(engineSpec, []), input.robustness.uncertain, "robustness.uncertain");
  const baseSpec = costing ? { ...engineSpec, costing } : engineSpec;
  return insertSweepWithJobs(db, {
    ...sweepOrigin(actor, projectId, kv, input, total),
    baseSpec,
    inventory,
    robustness: input.robustness ?? null,
  });
}

/**
 * Who submits a sweep of either kind, where, on which kinetics version, its grid, and its name: the
 * engineer's, or the model, its version and how many scenarios when they give none.
 */
function sweepOrigin(actor: Actor, projectId: string, kv: { model: { name: string }; version: { id: string; version: number } }, input: { name?: string; grid: GridAxis[] }, total: number) {
  return {
    actor,
    projectId,
    kineticsVersionId: kv.version.id,
    name: input.name ?? `${kv.model.name} v${kv.version.version} · ${total} scenario${total === 1 ? "" : "s"}`,
    grid: input.grid,
  };
}

async function createNetworkSweep(
  db: Database,
  actor: Actor,
  projectId: string,
  kv: NonNullable<Awaited<ReturnType<typeof requireTeamKineticsVersion>>>,
  input: NetworkSweepCreate,
  total: number,
): Promise<Sweep> {
  if (input.robustness) {
    const words = "rating every train under uncertainty during the sweep is not offered for models of several reactions; rate a chosen train from its page";
    throw new AppError("bad_request", `${labelFor("robustness")}: ${words}`, { fields: { robustness: [words] } });
  }
  const baseSpec = networkBaseSpec(kv.version.spec as unknown as NetworkKineticsSpec, input);
  checkNetworkScenarios(baseSpec, input.grid, expandGrid(input.grid));
  return insertSweepWithJobs(db, {
    ...sweepOrigin(actor, projectId, kv, input, total),
    baseSpec,
    robustness: null,
  });
}

async function requireTeamSweep(db: Database, actor: Actor, sweepId: string): Promise<Sweep> {
  const [s] = await db.select().from(sweeps).where(and(eq(sweeps.id, sweepId), eq(sweeps.teamId, actor.teamId)));
  if (!s) throw notFound("sweep");
  assertCan(actor, "sweep.read", s, "sweep");
  return s;
}

/** What the screens and API show of a sweep: no job ids, progress as numbers. */
export function sweepView(s: Sweep) {
  const { jobIds: _jobIds, baseSpec, ...rest } = s;
  const elapsed = s.startedAt ? ((s.finishedAt ?? new Date()).getTime() - s.startedAt.getTime()) / 1000 : null;
  const remaining = elapsed && s.done > 0 && s.status === "running" ? (elapsed / s.done) * (s.total - s.done) : null;
  // The kind travels with the spec so a screen narrows both at once.
  const kinded = isNetworkSpec(baseSpec)
    ? { kind: "network" as const, spec: baseSpec as unknown as StoredNetworkSweepSpec }
    : { kind: "single" as const, spec: baseSpec as unknown as StoredSweepSpec };
  return { ...rest, grid: s.grid as GridAxis[], robustness: s.robustness as SweepRobustness | null, ...kinded, progress: { done: s.done, total: s.total, fraction: s.total ? s.done / s.total : 0, elapsedSeconds: elapsed, remainingSeconds: remaining } };
}

export async function getSweep(db: Database, actor: Actor, sweepId: string) {
  return sweepView(await requireTeamSweep(db, actor, sweepId));
}

export async function listSweeps(db: Database, actor: Actor, projectId: string) {
  const project = await requireTeamProject(db, actor, projectId);
  assertCan(actor, "sweep.read", project, "project");
  const rows = await db.select().from(sweeps).where(eq(sweeps.projectId, projectId)).orderBy(desc(sweeps.createdAt)).limit(200);
  return rows.map(sweepView);
}

/** Cancels a queued or running sweep: pending jobs are cancelled, a job in hand stops at its next scenario. */
export async function cancelSweep(db: Database, actor: Actor, sweepId: string) {
  const s = await requireTeamSweep(db, actor, sweepId);
  assertCan(actor, "sweep.cancel", { teamId: s.teamId, createdBy: s.submittedBy }, "sweep");
  const [row] = await db.transaction(async (tx) => {
    const updated = await tx
      .update(sweeps)
      .set({ status: "cancelled", finishedAt: new Date() })
      .where(and(eq(sweeps.id, sweepId), inArray(sweeps.status, ["queued", "running"])))
      .returning();
    if (updated.length === 0) throw new AppError("conflict", `The sweep is already ${s.status}`);
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "sweep.cancelled", entityType: "project", entityId: s.projectId, details: { sweepId, done: s.done, total: s.total } });
    return updated;
  });
  const boss = await queueFor(db);
  if (s.jobIds.length) await boss.cancel(QUEUES.sweepChunk, s.jobIds);
  return sweepView(row);
}

export async function rerunSweep(db: Database, actor: Actor, sweepId: string) {
  const s = await requireTeamSweep(db, actor, sweepId);
  assertCan(actor, "sweep.create", s, "sweep");
  const sweep = await insertSweepWithJobs(db, {
    actor,
    projectId: s.projectId,
    kineticsVersionId: s.kineticsVersionId,
    name: `${s.name} (re-run)`,
    baseSpec: s.baseSpec,
    grid: s.grid as GridAxis[],
    robustness: s.robustness as SweepRobustness | null,
    rerunOf: s.id,
    inventory: s.inventory,
  });
  return sweepView(sweep);
}

export async function listScenarios(db: Database, actor: Actor, sweepId: string) {
  await requireTeamSweep(db, actor, sweepId);
  const rows = await db
    .select({
      index: scenarios.index,
      overrides: scenarios.overrides,
      status: scenarios.status,
      error: scenarios.error,
      bestObjective: scenarios.bestObjective,
      reference: scenarios.reference,
      candidateCount: scenarios.candidateCount,
    })
    .from(scenarios)
    .where(eq(scenarios.sweepId, sweepId))
    .orderBy(asc(scenarios.index));
  return rows as WithShapes<(typeof rows)[number], { reference: ScenarioReference | NetworkScenarioReference | null }>[];
}

export { requireTeamSweep };
export const scenarioIdOf = async (db: Database, sweepId: string, index: number) => {
  const [row] = await db.select({ id: scenarios.id }).from(scenarios).where(and(eq(scenarios.sweepId, sweepId), eq(scenarios.index, index)));
  return row?.id ?? null;
};

/**
 * The units the engineer typed the sweep's kinetics in (empty when the model kept none), for
 * screens that offer "as typed in the kinetics". Read through getSweep, so another team's sweep is
 * not found.
 */
export async function sweepTypedUnits(db: Database, actor: Actor, sweepId: string): Promise<Partial<Record<UnitKind, string>>> {
  const sweep = await getSweep(db, actor, sweepId);
  const kv = await requireTeamKineticsVersion(db, actor, sweep.kineticsVersionId);
  return typedUnits((kv?.version.spec ?? {}) as WithShownUnits);
}
