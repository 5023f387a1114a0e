import type { ChildProcess } from "node:child_process";
import { and, eq } from "drizzle-orm";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { seedDemoData } from "@/lib/demo/seed";
import { auditEntries, candidates, pinnedDesigns, projects, robustnessRuns, scenarios, sweeps } from "@/db/schema";
import type { DesignSpec } from "@/lib/engine";
import type { Actor } from "@/lib/authz/policy";
import { rateUnderUncertainty } from "@/lib/robustness/monte-carlo";
import { trainSpec } from "@/lib/robustness/train";
import { candidateQuerySchema } from "@/lib/schemas/sweeps";
import { listCandidates } from "@/lib/services/candidates";
import { createKineticsModel } from "@/lib/services/kinetics";
import { createSweep } from "@/lib/services/sweeps";
import { applyOverrides } from "@/lib/sweeps/grid";
import { createCandidateRun, createPinRun, getRun, listCandidateRuns, listPinRuns } from "@/lib/services/robustness";
import { actorByEmail, createTestDatabase, type TestDatabase } from "../helpers/test-db";
import { FAST_RECOVERY_ENV, startWorkerProcess, stopWorkerProcess, waitFor } from "../helpers/worker-process";
import { refusal } from "../helpers/refusal";

let t: TestDatabase;
let engineer: Actor;
let viewer: Actor;
let otherTeam: Actor;
let pin: typeof pinnedDesigns.$inferSelect;
const workers: ChildProcess[] = [];

beforeAll(async () => {
  t = await createTestDatabase();
  Object.assign(process.env, FAST_RECOVERY_ENV);
  await seedDemoData(t.db);
  const byEmail = (email: string) => actorByEmail(t.db, email);
  engineer = await byEmail("eli.engineer@brightwater.example");
  viewer = await byEmail("vic.viewer@brightwater.example");
  otherTeam = await byEmail("kai.admin@kestrel.example");
  [pin] = await t.db.select().from(pinnedDesigns);
}, 60_000);

afterEach(async () => {
  await Promise.all(workers.splice(0).map((w) => stopWorkerProcess(w, "SIGKILL")));
});

afterAll(async () => {
  await t.drop();
});

const kPlusMinus20 = [{ field: "reaction.rate.k" as const, kind: "plusMinus" as const, fraction: 0.2 }];

/** The same Monte Carlo run straight from the library on the pinned train: the reference for what is stored. */
function direct(samples: number, seed: number, target: number) {
  const train = trainSpec(pin.spec as unknown as DesignSpec, (pin.candidate as { stages: Record<string, unknown>[] }).stages);
  return rateUnderUncertainty({ spec: train, uncertain: kPlusMinus20, target, samples, seed });
}

describe("robustness runs", () => {
  it("a small run is rated in the request and stored as succeeded, with its audit entry", async () => {
    const run = await createCandidateRun(t.db, engineer, pin.candidateId!, { uncertain: kPlusMinus20, samples: 800, seed: 11 });
    expect(run.status).toBe("succeeded");
    const target = (pin.spec as unknown as DesignSpec).target.conversion;
    const expected = direct(800, 11, target);
    const result = run.result!;
    expect(result.p50).toBe(expected.p50);
    expect(result.probabilityOfMissingTarget).toBe(expected.probabilityOfMissingTarget);
    expect(result.target).toBe(target);
    // k ±20 % around the design value: the train (sized to reach the target at nominal k) misses it
    // in a fraction of the samples strictly between none and all.
    expect(result.probabilityOfMissingTarget).toBeGreaterThan(0);
    expect(result.probabilityOfMissingTarget).toBeLessThan(1);
    expect(result.p5).toBeLessThan(result.p50);
    expect(result.p50).toBeLessThan(result.p95);
    const [stored] = await t.db.select().from(robustnessRuns).where(eq(robustnessRuns.id, run.id));
    expect(stored).toMatchObject({ status: "succeeded", candidateId: pin.candidateId, createdBy: engineer.userId });
    const audit = await t.db.select().from(auditEntries).where(and(eq(auditEntries.action, "robustness.rated"), eq(auditEntries.entityId, pin.projectId)));
    expect(audit.some((a) => (a.details as { runId?: string }).runId === run.id)).toBe(true);
    const listed = await listCandidateRuns(t.db, engineer, pin.candidateId!);
    expect(listed.runs[0].id).toBe(run.id);
    expect(listed.fields.map((f) => f.field)).toEqual(["reaction.rate.k", "reaction.rate.activationEnergy", "feed.flowA", "feed.concA", "feed.temperature"]);
    // "1 mol/L" in the demo spec is offered as its SI value.
    expect(listed.fields.find((f) => f.field === "feed.concA")!.value).toBeCloseTo(1000, 9);
  });

  it("a large run goes to the worker: queued, then succeeded with the same numbers as the library", async () => {
    workers.push(await startWorkerProcess(t.url));
    const run = await createPinRun(t.db, engineer, pin.id, { uncertain: kPlusMinus20, samples: 6000, seed: 3, target: 0.88 });
    expect(run.status).toBe("queued");
    const done = await waitFor(async () => {
      const r = await getRun(t.db, engineer, run.id);
      return r.status === "succeeded" || r.status === "failed" ? r : null;
    }, 120_000, "the robustness run to finish");
    expect(done.status).toBe("succeeded");
    const expected = direct(6000, 3, 0.88);
    expect(done.result!.p95).toBe(expected.p95);
    expect(done.result!.probabilityOfMissingTarget).toBe(expected.probabilityOfMissingTarget);
    const listed = await listPinRuns(t.db, engineer, pin.id);
    expect(listed.runs.map((r) => r.id)).toContain(run.id);
  });

  it("a field the spec does not hold is a 400 naming uncertain.N.field, and nothing is written", async () => {
    const before = await t.db.select().from(robustnessRuns);
    const err = await refusal(
      createCandidateRun(t.db, engineer, pin.candidateId!, {
        uncertain: [...kPlusMinus20, { field: "reaction.rate.vmax", kind: "uniform", low: 1, high: 2 }],
        samples: 100,
        seed: 1,
      }),
    );
    expect(err.code).toBe("bad_request");
    expect(Object.keys(err.fields ?? {})).toEqual(["uncertain.1.field"]);
    expect(await t.db.select().from(robustnessRuns)).toHaveLength(before.length);
  });

  it("another team sees no candidate, pin or run; a viewer sees no run of a proposed pin", async () => {
    const [any] = await t.db.select().from(robustnessRuns).where(eq(robustnessRuns.pinId, pin.id));
    expect((await refusal(createCandidateRun(t.db, otherTeam, pin.candidateId!, { uncertain: kPlusMinus20, samples: 10, seed: 1 }))).code).toBe("not_found");
    expect((await refusal(listPinRuns(t.db, otherTeam, pin.id))).code).toBe("not_found");
    expect((await refusal(getRun(t.db, otherTeam, any.id))).code).toBe("not_found");
    expect((await refusal(getRun(t.db, viewer, any.id))).code).toBe("not_found");
    expect((await refusal(createPinRun(t.db, viewer, pin.id, { uncertain: kPlusMinus20, samples: 10, seed: 1 }))).code).toBe("not_found");
  });

  it("a sweep with robustness stores probabilityMeet on every feasible candidate, and sorting by it works", async () => {
    workers.push(await startWorkerProcess(t.url));
    const [{ id: projectId }] = await t.db.select({ id: projects.id }).from(projects).where(eq(projects.name, "Ester line 3 revamp"));
    // First order, isothermal liquid: an invented case.
    const spec = { feed: { flowA: 0.02, concA: 1000, temperature: 330 }, reaction: { rate: { law: "power" as const, k: 0.002, orders: { A: 1 } } } };
    const { version } = await createKineticsModel(t.db, engineer, projectId, { name: "First order, robustness sweep", spec, note: "" });
    const robustness = { uncertain: kPlusMinus20, samples: 200, seed: 9 };
    const bad = await refusal(
      createSweep(t.db, engineer, projectId, { kineticsVersionId: version.id, target: { conversion: 0.9 }, train: { maxStages: 2 }, grid: [], robustness: { ...robustness, uncertain: [{ field: "reaction.rate.km", kind: "plusMinus", fraction: 0.1 }] } }),
    );
    expect(Object.keys(bad.fields ?? {})).toEqual(["robustness.uncertain.0.field"]);

    const sweep = await createSweep(t.db, engineer, projectId, { kineticsVersionId: version.id, target: { conversion: 0.9 }, train: { maxStages: 3, types: ["CSTR", "PFR"] }, grid: [], robustness });
    await waitFor(async () => ((await t.db.select().from(sweeps).where(eq(sweeps.id, sweep.id)))[0].status === "succeeded" ? true : null), 120_000, "the sweep");
    const [scenario] = await t.db.select().from(scenarios).where(eq(scenarios.sweepId, sweep.id));
    const rows = await t.db.select().from(candidates).where(eq(candidates.scenarioId, scenario.id));
    const feasible = rows.filter((c) => c.feasible);
    expect(feasible.length).toBeGreaterThan(3);
    for (const c of feasible) {
      // Reference: the library's Monte Carlo on the same train, seed and target.
      const train = trainSpec(applyOverrides(sweep.baseSpec, scenario.overrides) as unknown as DesignSpec, c.stages);
      const direct = rateUnderUncertainty({ spec: train, uncertain: kPlusMinus20, target: 0.9, samples: 200, seed: 9 });
      expect(c.probabilityMeet).toBe(1 - direct.probabilityOfMissingTarget);
    }
    // Each optimum is sized to meet the target exactly at the nominal k, so about half the draws (k below nominal) miss.
    for (const c of feasible) expect(c.probabilityMeet!).toBeGreaterThan(0.3);
    const page = await listCandidates(t.db, engineer, sweep.id, 0, candidateQuerySchema.parse({ sort: "probabilityMeet", dir: "desc" }));
    const shown = page.items.filter((c) => c.feasible).map((c) => c.probabilityMeet as number);
    expect(shown).toEqual([...shown].sort((a, b) => b - a));
    expect(shown).toHaveLength(feasible.length);
  });
});
