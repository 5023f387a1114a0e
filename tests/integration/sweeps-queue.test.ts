import type { ChildProcess } from "node:child_process";
import { and, eq, sql } from "drizzle-orm";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { seedDemoData } from "@/lib/demo/seed";
import { candidates, pinnedDesigns, projects, scenarios, sweeps } from "@/db/schema";
import { designTrains, type DesignSpec } from "@/lib/engine";
import type { Actor } from "@/lib/authz/policy";
import { applyOverrides } from "@/lib/sweeps/grid";
import { addKineticsVersion, createKineticsModel } from "@/lib/services/kinetics";
import { cancelSweep, createSweep } from "@/lib/services/sweeps";
import { getPin, pinCandidate } from "@/lib/services/pins";
import { actorByEmail, createTestDatabase, type TestDatabase } from "../helpers/test-db";
import { FAST_RECOVERY_ENV, startWorkerProcess, stopWorkerProcess, waitFor } from "../helpers/worker-process";

// Second-order liquid kinetics, k C_A C_B with 20 % excess B: an invented demo case.
const SECOND_ORDER = {
  feed: { flowA: 0.02, concA: 1000, temperature: 340, ratios: { B: 1.2 } },
  reaction: { stoichiometry: { A: -1, B: -1, R: 1 }, phase: "liquid" as const, rate: { law: "power" as const, k: 1e-4, orders: { A: 1, B: 1 } } },
};
// Reversible first order A ⇌ R with K = kf/kr = 4, so the equilibrium conversion is K/(1+K) = 0.8.
const REVERSIBLE = {
  feed: { flowA: 0.02, concA: 1000, ratios: { R: 0 } },
  reaction: { stoichiometry: { A: -1, R: 1 }, rate: { law: "power" as const, k: 4e-3, orders: { A: 1 }, reverse: { k: 1e-3, orders: { R: 1 } } } },
};

let t: TestDatabase;
let actor: Actor;
let manager: Actor;
let projectId: string;
let versionId: string;
let modelId: string;
const workers: ChildProcess[] = [];

beforeAll(async () => {
  t = await createTestDatabase();
  Object.assign(process.env, FAST_RECOVERY_ENV);
  await seedDemoData(t.db);
  const byEmail = (email: string) => actorByEmail(t.db, email);
  actor = await byEmail("eli.engineer@brightwater.example");
  manager = await byEmail("marta.manager@brightwater.example");
  [{ id: projectId }] = await t.db.select({ id: projects.id }).from(projects).where(eq(projects.name, "Ester line 3 revamp"));
  const created = await createKineticsModel(t.db, actor, projectId, { name: "Esterification, second order", spec: SECOND_ORDER, note: "" });
  versionId = created.version.id;
  modelId = created.model.id;
}, 60_000);

afterEach(async () => {
  await Promise.all(workers.splice(0).map((w) => stopWorkerProcess(w, "SIGKILL")));
  delete process.env.SWEEP_CHUNK_SIZE;
});

afterAll(async () => {
  await t.drop();
});

async function worker(extra: Record<string, string> = {}) {
  const w = await startWorkerProcess(t.url, extra);
  workers.push(w);
  return w;
}

const sweepRow = async (id: string) => (await t.db.select().from(sweeps).where(eq(sweeps.id, id)))[0];
const finished = (id: string, timeoutMs = 100_000) =>
  waitFor(async () => {
    const s = await sweepRow(id);
    return s.status !== "queued" && s.status !== "running" ? s : null;
  }, timeoutMs, "the sweep to finish");

describe("sweeps on the queue, with real worker processes", () => {
  it("a submitted sweep completes and each scenario's ranking equals the engine's", async () => {
    await worker();
    const sweep = await createSweep(t.db, actor, projectId, {
      kineticsVersionId: versionId,
      target: { conversion: 0.9 },
      train: { maxStages: 3, types: ["CSTR", "PFR"] },
      grid: [
        { field: "feed.flowA", values: [0.01, 0.03] },
        { field: "target.conversion", values: [0.8, 0.9] },
      ],
    });
    expect(sweep.total).toBe(4);
    const done = await finished(sweep.id);
    expect(done).toMatchObject({ status: "succeeded", done: 4, failedScenarios: 0 });

    for (const s of await t.db.select().from(scenarios).where(eq(scenarios.sweepId, sweep.id))) {
      // The same engine run directly on the scenario's resolved spec is the reference.
      const expected = designTrains(applyOverrides(sweep.baseSpec, s.overrides) as unknown as DesignSpec);
      const stored = await t.db.select().from(candidates).where(eq(candidates.scenarioId, s.id)).orderBy(candidates.rank);
      expect(stored.map((c) => c.sequenceKey)).toEqual(expected.candidates.map((c) => c.sequence.join("-")));
      stored.forEach((c, i) => expect(c.totalVolume).toBeCloseTo(expected.candidates[i].totalVolume!, 12));
      expect(s.reference).toMatchObject({ singlePFR: expected.reference.singlePFR, singleCSTR: expected.reference.singleCSTR });
    }
  });

  it("two workers share one sweep", async () => {
    await worker();
    await worker();
    process.env.SWEEP_CHUNK_SIZE = "1";
    const sweep = await createSweep(t.db, actor, projectId, {
      kineticsVersionId: versionId,
      target: { conversion: 0.9 },
      train: { maxStages: 4, types: ["CSTR", "PFR"] },
      grid: [{ field: "feed.flowA", from: 0.01, to: 0.05, steps: 30 }],
    });
    expect((await finished(sweep.id)).status).toBe("succeeded");
    const r = await t.pool.query("select count(distinct output->>'worker')::int as n from pgboss.job where id::text = any($1::text[])", [sweep.jobIds]);
    expect(r.rows[0].n).toBe(2);
  });

  it("a worker killed mid-sweep and a restarted one leave exactly one candidate per scenario and sequence", async () => {
    process.env.SWEEP_CHUNK_SIZE = "1";
    const first = await worker();
    const sweep = await createSweep(t.db, actor, projectId, {
      kineticsVersionId: versionId,
      target: { conversion: 0.9 },
      train: { maxStages: 5, types: ["CSTR", "PFR"] },
      grid: [{ field: "feed.flowA", from: 0.01, to: 0.05, steps: 60 }],
    });
    await waitFor(async () => (await sweepRow(sweep.id)).done >= 5, 60_000, "some progress");
    await stopWorkerProcess(first, "SIGKILL");
    const mid = await sweepRow(sweep.id);
    expect(mid.status).toBe("running");
    expect(mid.done).toBeLessThan(60);

    await worker();
    const done = await finished(sweep.id, 90_000);
    expect(done).toMatchObject({ status: "succeeded", done: 60 });
    const counts = await t.pool.query(
      "select count(*)::int as total, count(distinct (scenario_id, sequence_key))::int as distinct_pairs from candidates where sweep_id = $1",
      [sweep.id],
    );
    // 62 sequences of 1..5 stages of two types, for each of the 60 scenarios.
    expect(counts.rows[0]).toEqual({ total: 60 * 62, distinct_pairs: 60 * 62 });
  }, 120_000);

  it("cancelling stops a running sweep", async () => {
    process.env.SWEEP_CHUNK_SIZE = "1";
    await worker();
    const sweep = await createSweep(t.db, actor, projectId, {
      kineticsVersionId: versionId,
      target: { conversion: 0.9 },
      train: { maxStages: 5, types: ["CSTR", "PFR"] },
      grid: [{ field: "feed.flowA", from: 0.01, to: 0.05, steps: 400 }],
    });
    await waitFor(async () => (await sweepRow(sweep.id)).done >= 2, 60_000, "some progress");
    const view = await cancelSweep(t.db, actor, sweep.id);
    expect(view.status).toBe("cancelled");
    await new Promise((r) => setTimeout(r, 1500));
    const a = await sweepRow(sweep.id);
    await new Promise((r) => setTimeout(r, 1000));
    const b = await sweepRow(sweep.id);
    expect(b.status).toBe("cancelled");
    expect(b.done).toBe(a.done);
    expect(b.done).toBeLessThan(400);
    const jobs = await t.pool.query("select state, count(*)::int n from pgboss.job where id::text = any($1::text[]) group by state", [sweep.jobIds]);
    const byState = Object.fromEntries(jobs.rows.map((r) => [r.state, r.n]));
    expect(byState.cancelled).toBeGreaterThan(300);
    expect(byState.created ?? 0).toBe(0);
  }, 60_000);

  it("records an engine refusal on its scenario and still completes the sweep", async () => {
    await worker();
    const { version } = await createKineticsModel(t.db, actor, projectId, { name: "Reversible isomerisation", spec: REVERSIBLE, note: "" });
    const sweep = await createSweep(t.db, actor, projectId, {
      kineticsVersionId: version.id,
      target: { conversion: 0.5 },
      train: { maxStages: 2, types: ["CSTR", "PFR"] },
      grid: [{ field: "target.conversion", values: [0.5, 0.7, 0.85] }],
    });
    expect(await finished(sweep.id)).toMatchObject({ status: "succeeded", done: 3, failedScenarios: 1 });
    const [refused] = await t.db.select().from(scenarios).where(and(eq(scenarios.sweepId, sweep.id), eq(scenarios.status, "failed")));
    expect(refused.overrides).toEqual({ "target.conversion": 0.85 });
    expect(refused.error).toMatchObject({ code: "equilibrium", path: "target.conversion" });
    expect(refused.error!.message).toContain("0.8");
  });

  it("a chunk that fails on every attempt marks its sweep failed", async () => {
    await worker();
    const sweep = await createSweep(t.db, actor, projectId, { kineticsVersionId: versionId, target: { conversion: 0.9 }, train: { maxStages: 2 }, grid: [] });
    // Sabotage the stored spec behind the API's back so the engine crashes (not an EngineError).
    await t.pool.query("update sweeps set base_spec = base_spec - 'feed' where id = $1", [sweep.id]);
    const failed = await finished(sweep.id, 60_000);
    expect(failed.status).toBe("failed");
    expect(failed.error).toBeTruthy();
  });

  it("a pinned design is unaffected when its kinetics model is edited later", async () => {
    await worker();
    const sweep = await createSweep(t.db, actor, projectId, { kineticsVersionId: versionId, target: { conversion: 0.9 }, train: { maxStages: 2 }, grid: [] });
    await finished(sweep.id);
    const [best] = await t.db.select().from(candidates).where(and(eq(candidates.sweepId, sweep.id), eq(candidates.rank, 1)));
    const pin = await pinCandidate(t.db, actor, best.id, { note: "lowest volume" });
    const before = await getPin(t.db, manager, pin.id);

    const v2 = await addKineticsVersion(t.db, actor, modelId, { spec: { ...SECOND_ORDER, reaction: { ...SECOND_ORDER.reaction, rate: { ...SECOND_ORDER.reaction.rate, k: 5e-5 } } }, note: "k from the new bench run" });
    expect(v2.version).toBeGreaterThanOrEqual(2);

    const after = await getPin(t.db, manager, pin.id);
    expect(after.candidate).toEqual(before.candidate);
    expect(after.spec).toEqual(before.spec);
    expect(after.kineticsVersionId).toBe(versionId);
    expect((after.spec as { reaction: { rate: { k: number } } }).reaction.rate.k).toBe(1e-4);
    const [stillThere] = await t.db.select({ n: sql<number>`count(*)::int` }).from(pinnedDesigns).where(eq(pinnedDesigns.id, pin.id));
    expect(stillThere.n).toBe(1);
  });
});
