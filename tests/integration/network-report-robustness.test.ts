import type { ChildProcess } from "node:child_process";
import { eq } from "drizzle-orm";
import { PDFParse } from "pdf-parse";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { candidates, kineticsModels, kineticsVersions, pinnedDesigns, projects, scenarios, sweeps } from "@/db/schema";
import type { Actor } from "@/lib/authz/policy";
import { designNetwork, rateNetworkTrain, type NetworkDesignSpec, type NetworkSpec } from "@/lib/engine";
import { DEMO_NETWORK } from "@/lib/demo/network-demo";
import { seedDemoData } from "@/lib/demo/seed";
import { renderReportPdf } from "@/lib/reports/report-pdf";
import { networkTrainOf, rateNetworkRobustness } from "@/lib/robustness/network-train";
import { withNumbers } from "@/lib/robustness/numeric-path";
import { isNetworkRobustnessResult } from "@/lib/schemas/robustness";
import { getDesignReport } from "@/lib/services/design-reports";
import { createCandidateRun, createPinRun, getRun, listCandidateRuns, listPinRuns } from "@/lib/services/robustness";
import { networkCandidateRows, networkScenarioReference } from "@/lib/sweeps/network-candidate-rows";
import type { PinnedNetworkCandidate } from "@/lib/sweeps/stored-json";
import { actorByEmail, createTestDatabase, type TestDatabase } from "../helpers/test-db";
import { FAST_RECOVERY_ENV, startWorkerProcess, stopWorkerProcess, waitFor } from "../helpers/worker-process";
import { demoNetworkSpec, frozenNetworkCandidate } from "../unit/helpers/network-pin";
import { refusal } from "../helpers/refusal";

// Stored rows in the shapes the web app keeps for a sweep of several reactions (the contract of issue 13):
// the sweep's starting spec, a scenario with the over-reaction's rate constant set, its ranked candidates
// and two pins of the best one (one holding the scenario's spec, one relying on the sweep's).
let t: TestDatabase;
let engineer: Actor;
let viewer: Actor;
let otherTeam: Actor;
let candidateId: string;
let pinId: string;
let pinWithoutSpecId: string;
let scenarioSpec: NetworkDesignSpec;
let frozen: PinnedNetworkCandidate;
const workers: ChildProcess[] = [];
const OVERRIDES = { "reactions.1.rate.k": 0.0008 };

beforeAll(async () => {
  t = await createTestDatabase();
  Object.assign(process.env, FAST_RECOVERY_ENV);
  await seedDemoData(t.db);
  engineer = await actorByEmail(t.db, "eli.engineer@brightwater.example");
  viewer = await actorByEmail(t.db, "vic.viewer@brightwater.example");
  otherTeam = await actorByEmail(t.db, "kai.admin@kestrel.example");
  const [project] = await t.db.select().from(projects).where(eq(projects.teamId, engineer.teamId));
  const [model] = await t.db.insert(kineticsModels).values({ teamId: engineer.teamId, projectId: project.id, name: DEMO_NETWORK.model.name, createdBy: engineer.userId }).returning();
  const [version] = await t.db
    .insert(kineticsVersions)
    .values({ modelId: model.id, version: 1, spec: DEMO_NETWORK.model.spec as unknown as Record<string, unknown>, note: "", createdBy: engineer.userId })
    .returning();
  // A minimum yield as well, so the run reports the chance of missing it.
  const base = { ...demoNetworkSpec(), constraints: { ...DEMO_NETWORK.sweep.constraints, minYield: 0.3 } };
  scenarioSpec = withNumbers(base, OVERRIDES);
  const result = designNetwork(scenarioSpec);
  const [sweep] = await t.db
    .insert(sweeps)
    .values({ teamId: engineer.teamId, projectId: project.id, kineticsVersionId: version.id, name: "Yield of B", baseSpec: base as unknown as Record<string, unknown>, total: 1, done: 1, status: "succeeded", submittedBy: engineer.userId })
    .returning();
  // Scenario reference and candidate rows built by the same code the sweep worker and the demo seed use.
  const reference = networkScenarioReference(scenarioSpec, result);
  const [scenario] = await t.db
    .insert(scenarios)
    .values({ sweepId: sweep.id, index: 0, overrides: OVERRIDES, status: "succeeded", reference: { ...reference }, bestObjective: result.candidates[0].objective, candidateCount: result.candidates.length })
    .returning();
  const rows = await t.db.insert(candidates).values(networkCandidateRows(sweep.id, scenario.id, result)).returning();
  candidateId = rows.find((r) => r.rank === 1)!.id;
  frozen = frozenNetworkCandidate(result.candidates[0], { index: 0, overrides: OVERRIDES, reference }, { id: sweep.id, name: sweep.name });
  const pinRow = { teamId: engineer.teamId, projectId: project.id, sweepId: sweep.id, candidateId, kineticsVersionId: version.id, candidate: frozen as unknown as Record<string, unknown>, pinnedBy: engineer.userId };
  [{ id: pinId }] = await t.db.insert(pinnedDesigns).values({ ...pinRow, spec: scenarioSpec as unknown as Record<string, unknown> }).returning();
  [{ id: pinWithoutSpecId }] = await t.db.insert(pinnedDesigns).values({ ...pinRow, candidateId: null, spec: {} }).returning();
}, 120_000);

afterEach(async () => {
  await Promise.all(workers.splice(0).map((w) => stopWorkerProcess(w, "SIGKILL")));
});
afterAll(() => t.drop());

async function pdfText(pdf: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    return (await parser.getText()).text.replace(/\s+/g, " ");
  } finally {
    await parser.destroy();
  }
}

const kOverReaction = [{ field: "reactions.1.rate.k" as const, kind: "plusMinus" as const, fraction: 0.5 }];

describe("design report of a pinned train of several reactions, read from the database", () => {
  it("carries the scenario's chemistry, the composition table of the frozen stages and the path", async () => {
    const r = await getDesignReport(t.db, engineer, pinId);
    expect(r.kind).toBe("network");
    const n = r.network!;
    expect(r.kinetics.model).toBe(DEMO_NETWORK.model.name);
    // The scenario's value of the over-reaction's constant, in SI as the grid set it.
    expect(n.reactions[1].constants[0]).toEqual({ label: "k", value: "8.000e-4 1/s" });
    expect(n.reactions[0].constants[0]).toEqual({ label: "k", value: "0.004 1/s" });
    n.composition.rows.slice(1).forEach((row, i) => expect(row.values).toEqual(n.composition.species.map((s) => frozen.stages[i].outlet[s])));
    expect(n.chart?.stages).toHaveLength(frozen.stages.length);
    expect(n.objective).toContainEqual({ label: "Minimum yield", value: "30 %" });
  });

  it("a pin without the scenario's spec reads it from its sweep with the scenario's values", async () => {
    const a = (await getDesignReport(t.db, engineer, pinId)).network!;
    const b = (await getDesignReport(t.db, engineer, pinWithoutSpecId)).network!;
    expect(b.chemistry.reactions).toEqual(scenarioSpec.reactions);
    expect(b.composition).toEqual(a.composition);
    expect(b.chart).toEqual(a.chart);
  });

  it("another team's pin is not found", async () => {
    expect((await refusal(getDesignReport(t.db, otherTeam, pinId))).code).toBe("not_found");
  });
});

describe("robustness of a train of several reactions", () => {
  it("offers each reaction's rate constant and the feed, in SI, by the labels of the forms", async () => {
    const list = await listCandidateRuns(t.db, engineer, candidateId);
    expect(list.kind).toBe("network");
    expect(list.limits).toEqual({ minConversion: 0.6, minYield: 0.3, product: "B" });
    const byField = Object.fromEntries(list.fields.map((f) => [f.field, f]));
    // 0.002 L/(mol s) = 2e-6 m³/(mol s) (common practice: 1 L = 1e-3 m³); 3.6 m³/h = 1e-3 m³/s.
    expect(byField["reactions.2.rate.k"].value).toBeCloseTo(2e-6, 15);
    expect(byField["reactions.2.rate.k"].label).toBe("Reaction 3, rate constant k");
    expect(byField["reactions.1.rate.k"].value).toBe(0.0008);
    expect(byField["feed.volumetricFlow"].value).toBeCloseTo(1e-3, 12);
    expect(byField["feed.temperature"].value).toBe(330);
  });

  it("rates the candidate in the request: the stored result is the library's run on the same train and seed", async () => {
    const run = await createCandidateRun(t.db, engineer, candidateId, { uncertain: kOverReaction, samples: 120, seed: 4 });
    expect(run.status).toBe("succeeded");
    const result = run.result!;
    expect(isNetworkRobustnessResult(result)).toBe(true);
    if (!isNetworkRobustnessResult(result)) return;
    const expected = rateNetworkRobustness(networkTrainOf(scenarioSpec as unknown as Record<string, unknown>, frozen.stages), { uncertain: kOverReaction, samples: 120, seed: 4 });
    expect(result).toEqual(expected);
    expect(result.minYield).toBe(0.3);
    expect(result.probabilityMissMinYield).not.toBeNull();
    expect(result.yield!.histogram.reduce((s, h) => s + h.count, 0)).toBe(120 - result.refusedSamples);
    // At the nominal inputs the fixed train gives the yield it was pinned with (the same engine, rated again).
    expect(result.nominal!.yield).toBeCloseTo(frozen.yield!, 6);
  });

  it("refuses a one-reaction input and a target, naming the field", async () => {
    const wrong = await refusal(createCandidateRun(t.db, engineer, candidateId, { uncertain: [{ field: "reaction.rate.k", kind: "plusMinus", fraction: 0.2 }], samples: 10, seed: 1 }));
    expect(wrong.code).toBe("bad_request");
    expect(Object.keys(wrong.fields ?? {})).toEqual(["uncertain.0.field"]);
    const target = await refusal(createCandidateRun(t.db, engineer, candidateId, { uncertain: kOverReaction, samples: 10, seed: 1, target: 0.9 }));
    expect(Object.keys(target.fields ?? {})).toEqual(["target"]);
    const viewerRun = await refusal(createCandidateRun(t.db, viewer, candidateId, { uncertain: kOverReaction, samples: 10, seed: 1 }));
    expect(["forbidden", "not_found"]).toContain(viewerRun.code);
  });

  it("queues a larger run of the pin for the worker, and the report then shows the yield's spread", { timeout: 240_000 }, async () => {
    workers.push(await startWorkerProcess(t.url));
    const run = await createPinRun(t.db, engineer, pinId, { uncertain: kOverReaction, samples: 300, seed: 8 });
    expect(run.status).toBe("queued");
    const done = await waitFor(
      async () => {
        const r = await getRun(t.db, engineer, run.id);
        return r.status === "succeeded" || r.status === "failed" ? r : null;
      },
      200_000,
      "the robustness run to finish",
    );
    expect(done.status).toBe("succeeded");
    const expected = rateNetworkRobustness(networkTrainOf(scenarioSpec as unknown as Record<string, unknown>, frozen.stages), { uncertain: kOverReaction, samples: 300, seed: 8 });
    expect(done.result).toEqual(expected);
    expect((await listPinRuns(t.db, engineer, pinId)).runs[0].id).toBe(run.id);

    const report = await getDesignReport(t.db, engineer, pinId);
    expect(report.robustness.recorded).toBe(true);
    if (!report.robustness.recorded) return;
    expect(report.robustness.network?.probabilityMissMinYield).toBe(expected.probabilityMissMinYield);
    expect(report.robustness.network?.yield?.p50).toBe(expected.yield!.p50);
    const text = await pdfText(await renderReportPdf(report));
    expect(text).toContain("Chance of missing the minimum yield");
    expect(text).toContain("Yield of B P5 / P50 / P95");
    expect(text).toContain("Uncertain: Reaction 2, rate constant k");
  });
});

describe("the seeded demo pin of several reactions (frozen by the pin service's own freeze)", () => {
  it("reports its composition against the engine's rating of the same train, and rates it under uncertainty", async () => {
    const [project] = await t.db.select().from(projects).where(eq(projects.name, DEMO_NETWORK.project.name));
    const [demoPin] = await t.db.select().from(pinnedDesigns).where(eq(pinnedDesigns.projectId, project.id));
    const r = await getDesignReport(t.db, engineer, demoPin.id);
    expect(r.kind).toBe("network");
    const n = r.network!;
    const frozenDemo = demoPin.candidate as unknown as PinnedNetworkCandidate;
    // The fixed train rated again from the feed, independently of the designer's search.
    const rated = rateNetworkTrain(n.chemistry as unknown as NetworkSpec, frozenDemo.stages.map((s) => ({ type: s.type, volume: s.volume })), "B");
    n.composition.rows.slice(1).forEach((row, i) => row.values.forEach((v, j) => expect(Math.abs(v! - rated.stages[i].outlet[n.composition.species[j]])).toBeLessThan(1e-6 * 1200)));
    expect(n.composition.rows[0].values).toEqual([1200, 0, 0, 0]);
    expect(n.chart).not.toBeNull();

    const run = await createPinRun(t.db, engineer, demoPin.id, { uncertain: [{ field: "reactions.0.rate.k", kind: "plusMinus", fraction: 0.2 }], samples: 60, seed: 1 });
    expect(run.status).toBe("succeeded");
    expect(isNetworkRobustnessResult(run.result)).toBe(true);
    // The demo sweep sets no minimum yield: the chance of missing one is not reported.
    if (isNetworkRobustnessResult(run.result)) expect(run.result.probabilityMissMinYield).toBeNull();
  });
});
