import { and, desc, eq } from "drizzle-orm";
import { type Database, withTransaction } from "@/db/client";
import { robustnessRuns, type RobustnessRun } from "@/db/schema";
import { EngineError, type DesignSpec, type RatingSpec } from "@/lib/engine";
import { teamCandidateWithScenario } from "@/db/queries/team-candidates";
import { assertCan, type Actor } from "@/lib/authz/policy";
import { AppError, notFound } from "@/lib/errors";
import { bossDbFor, queueFor } from "@/lib/jobs/boss";
import { QUEUES, WAKE_CHANNEL, type RobustnessPayload } from "@/lib/jobs/queues";
import { checkUncertainFields, offeredFields, rateRobustness, trainSpec } from "@/lib/robustness/train";
import type { NetworkTrain } from "@/lib/robustness/network-monte-carlo";
import { checkNetworkUncertainFields, networkTrainOf, offeredNetworkFields, rateNetworkRobustness } from "@/lib/robustness/network-train";
import { withNumbers } from "@/lib/robustness/numeric-path";
import { isNetworkSpec } from "@/lib/schemas/network-spec";
import type { StoredNetworkStage } from "@/lib/sweeps/stored-json";
import { pinNetworkSpec } from "./design-reports";
import { INLINE_SAMPLES, NETWORK_INLINE_SAMPLES, type AnyRobustnessRunResult, type RobustnessCreate, type RobustnessRunRequest } from "@/lib/schemas/robustness";
import { toBadRequest } from "./engine-errors";
import { applyOverrides } from "@/lib/sweeps/grid";
import { recordAudit } from "./audit";
import { getPin } from "./pins";

/** The fixed train a run rates, and where it belongs. */
type Subject = {
  teamId: string;
  projectId: string;
  candidateId: string | null;
  pinId: string | null;
} & (
  | {
      kind: "single";
      train: RatingSpec;
      /** The scenario's target conversion. */
      target: number;
    }
  | {
      /** A train of several reactions: checked against its sweep's minimum conversion and yield. */
      kind: "network";
      train: NetworkTrain;
      target: number | null;
    }
);

async function candidateSubject(db: Database, actor: Actor, candidateId: string): Promise<Subject> {
  const row = await teamCandidateWithScenario(db, actor.teamId, candidateId);
  if (!row) throw notFound("candidate");
  assertCan(actor, "sweep.read", { teamId: row.sweep.teamId }, "candidate");
  if (!row.candidate.feasible) {
    throw new AppError("conflict", "An infeasible candidate has no train to rate", { fields: { candidateId: [row.candidate.reason ?? "infeasible"] } });
  }
  const where = { teamId: row.sweep.teamId, projectId: row.sweep.projectId, candidateId, pinId: null };
  if (isNetworkSpec(row.sweep.baseSpec)) {
    const train = networkTrainOf(withNumbers(row.sweep.baseSpec, row.scenario.overrides), row.candidate.stages as unknown as StoredNetworkStage[]);
    return { ...where, kind: "network", train, target: train.minConversion };
  }
  const spec = applyOverrides(row.sweep.baseSpec, row.scenario.overrides) as unknown as DesignSpec;
  return { ...where, kind: "single", train: trainSpec(spec, row.candidate.stages), target: spec.target.conversion };
}

async function pinSubject(db: Database, actor: Actor, pinId: string): Promise<Subject> {
  const pin = await getPin(db, actor, pinId);
  const where = { teamId: pin.teamId, projectId: pin.projectId, candidateId: null, pinId };
  const network = await pinNetworkSpec(db, pin.teamId, pin);
  if (network) {
    const train = networkTrainOf(network.spec, network.candidate.stages, network.modelProduct);
    return { ...where, kind: "network", train, target: train.minConversion };
  }
  const spec = pin.spec as unknown as DesignSpec;
  const stages = (pin.candidate as { stages: Record<string, unknown>[] }).stages;
  return { ...where, kind: "single", train: trainSpec(spec, stages), target: spec.target.conversion };
}

/** What the API shows of a run: no job id; the request without the stored train. */
export function runView(r: RobustnessRun) {
  const { jobId: _job, teamId: _team, request, ...rest } = r;
  const { train: _train, ...asked } = request as RobustnessRunRequest;
  return { ...rest, result: r.result as AnyRobustnessRunResult | null, request: asked };
}

/**
 * Rates a candidate's or a pin's train by Monte Carlo. Up to INLINE_SAMPLES samples are rated here
 * and stored as succeeded; more are queued for the worker ("robustness" queue) in the same transaction.
 */
async function createRun(db: Database, actor: Actor, subject: Subject, input: RobustnessCreate) {
  assertCan(actor, "robustness.create", { teamId: subject.teamId });
  if (subject.kind === "network") {
    if (input.target !== undefined) {
      const why = "A train of several reactions is checked against its sweep's minimum conversion and minimum yield; leave the target out";
      throw new AppError("bad_request", why, { fields: { target: [why] } });
    }
    checkNetworkUncertainFields(subject.train, input.uncertain);
  } else checkUncertainFields(subject.train, input.uncertain);
  const target = input.target ?? subject.target;
  const request = { uncertain: input.uncertain, target, samples: input.samples, seed: input.seed, train: subject.train };
  const inline = input.samples <= (subject.kind === "network" ? NETWORK_INLINE_SAMPLES : INLINE_SAMPLES);
  let result = null;
  if (inline) {
    try {
      const asked = { uncertain: input.uncertain, samples: input.samples, seed: input.seed };
      result = subject.kind === "network" ? rateNetworkRobustness(subject.train, asked) : rateRobustness(subject.train, { ...asked, target: target as number });
    } catch (err) {
      if (err instanceof EngineError) throw toBadRequest(err, "train");
      throw err;
    }
  }
  const values = {
    teamId: subject.teamId,
    projectId: subject.projectId,
    candidateId: subject.candidateId,
    pinId: subject.pinId,
    request,
    status: inline ? ("succeeded" as const) : ("queued" as const),
    result: result as unknown as Record<string, unknown> | null,
    createdBy: actor.userId,
    finishedAt: inline ? new Date() : null,
  };
  const audit = (runId: string) => ({
    teamId: actor.teamId,
    actorId: actor.userId,
    action: inline ? "robustness.rated" : "robustness.queued",
    entityType: "project",
    entityId: subject.projectId,
    details: { runId, candidateId: subject.candidateId, pinId: subject.pinId, samples: input.samples, fields: input.uncertain.map((u) => u.field) },
  });
  if (inline) {
    const run = await db.transaction(async (tx) => {
      const [r] = await tx.insert(robustnessRuns).values(values).returning();
      await recordAudit(tx, audit(r.id));
      return r;
    });
    return runView(run);
  }
  const boss = await queueFor(db);
  const run = await withTransaction(db, async (tx, client) => {
    const [r] = await tx.insert(robustnessRuns).values(values).returning();
    // The job is written by this same transaction: no queued run without its job.
    const jobId = await boss.send(QUEUES.robustness, { runId: r.id } satisfies RobustnessPayload, { db: bossDbFor(client) });
    const [withJob] = await tx.update(robustnessRuns).set({ jobId }).where(eq(robustnessRuns.id, r.id)).returning();
    await client.query("select pg_notify($1, $2)", [WAKE_CHANNEL, r.id]);
    await recordAudit(tx, audit(r.id));
    return withJob;
  });
  return runView(run);
}

export async function createCandidateRun(db: Database, actor: Actor, candidateId: string, input: RobustnessCreate) {
  return createRun(db, actor, await candidateSubject(db, actor, candidateId), input);
}

export async function createPinRun(db: Database, actor: Actor, pinId: string, input: RobustnessCreate) {
  return createRun(db, actor, await pinSubject(db, actor, pinId), input);
}

async function listFor(db: Database, subject: Subject) {
  const where = subject.pinId ? eq(robustnessRuns.pinId, subject.pinId) : eq(robustnessRuns.candidateId, subject.candidateId as string);
  const rows = await db.select().from(robustnessRuns).where(and(where, eq(robustnessRuns.teamId, subject.teamId))).orderBy(desc(robustnessRuns.createdAt));
  let fields: { field: string; label: string; unit: string; value: number }[] = [];
  try {
    fields = subject.kind === "network" ? offeredNetworkFields(subject.train) : offeredFields(subject.train);
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
  }
  const limits = subject.kind === "network" ? { minConversion: subject.train.minConversion, minYield: subject.train.minYield, product: subject.train.product } : null;
  const inlineSamples = subject.kind === "network" ? NETWORK_INLINE_SAMPLES : INLINE_SAMPLES;
  return { runs: rows.map(runView), fields, target: subject.target, kind: subject.kind, limits, inlineSamples };
}

/** A candidate's runs, newest first, with the numeric inputs its train offers. */
export async function listCandidateRuns(db: Database, actor: Actor, candidateId: string) {
  return listFor(db, await candidateSubject(db, actor, candidateId));
}

/** A pinned design's runs, newest first, with the numeric inputs its train offers. */
export async function listPinRuns(db: Database, actor: Actor, pinId: string) {
  return listFor(db, await pinSubject(db, actor, pinId));
}

/** One run; readable by whoever may read its candidate (sweep.read) or its pinned design. */
export async function getRun(db: Database, actor: Actor, runId: string) {
  const [r] = await db.select().from(robustnessRuns).where(and(eq(robustnessRuns.id, runId), eq(robustnessRuns.teamId, actor.teamId)));
  if (!r) throw notFound("robustness run");
  if (r.pinId) {
    await getPin(db, actor, r.pinId).catch(() => {
      throw notFound("robustness run");
    });
  } else {
    assertCan(actor, "sweep.read", r, "robustness run");
  }
  return runView(r);
}
