import { readFileSync } from "node:fs";
import { asc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { candidates, scenarios, sweeps } from "@/db/schema";
import { designNetwork, type NetworkDesignSpec } from "@/lib/engine";
import type { Actor } from "@/lib/authz/policy";
import { parseWithKind } from "@/lib/http";
import { candidateQuerySchema, isNetworkKineticsBody, isNetworkSweepBody, kineticsModelCreateSchema, kineticsVersionCreateSchema, networkKineticsModelCreateSchema, networkKineticsVersionCreateSchema, networkSweepCreateSchema, sweepCreateSchema } from "@/lib/schemas/sweeps";
import { addKineticsVersion, createKineticsModel, getKineticsModel, listKineticsModels } from "@/lib/services/kinetics";
import { createSweep, getSweep, listScenarios, rerunSweep } from "@/lib/services/sweeps";
import { runSweepChunk } from "@/lib/services/sweep-chunks";
import { compareCandidates, listCandidates } from "@/lib/services/candidates";
import { getCandidate } from "@/lib/services/candidate-detail";
import { getPin, pinCandidate } from "@/lib/services/pins";
import { exportCandidates } from "@/lib/services/candidate-export";
import { isNetworkExport, networkCandidatesCsv } from "@/lib/reports/network-candidate-export";
import { CAUTIONS } from "@/lib/engine";
import type { PinnedNetworkCandidate } from "@/lib/sweeps/stored-json";
import Papa from "papaparse";
import { applyOverrides } from "@/lib/sweeps/grid";
import { refusal } from "../helpers/refusal";
import type { TestDatabase } from "../helpers/test-db";
import { demoActors, ESTER_PROJECT, projectIdNamed, seededTestDatabase } from "./helpers/demo-team";

// The three-reaction example of the command line (A -> B wanted, B -> C and 2A -> D side reactions), an
// invented case; its chemistry is what a kinetics model of several reactions stores.
const FIXTURE = JSON.parse(readFileSync("tests/fixtures/specs/network-three-reactions.json", "utf8")) as Record<string, unknown>;
const CHEMISTRY = { feed: FIXTURE.feed, phase: FIXTURE.phase, reactions: FIXTURE.reactions, keyReactant: FIXTURE.keyReactant, product: "B" };
const SINGLE = { feed: { flowA: 0.02, concA: 1000 }, reaction: { stoichiometry: { A: -1, R: 1 }, rate: { law: "power", k: 4e-3, orders: { A: 1 } } } };

/** The model body as the kinetics route reads it (the schema picked from the body). */
const modelBody = (body: unknown) => parseWithKind(body, isNetworkKineticsBody, networkKineticsModelCreateSchema, kineticsModelCreateSchema);
const versionBody = (body: unknown) => parseWithKind(body, isNetworkKineticsBody, networkKineticsVersionCreateSchema, kineticsVersionCreateSchema);
const sweepBody = (body: unknown) => parseWithKind(body, isNetworkSweepBody, networkSweepCreateSchema, sweepCreateSchema);

let t: TestDatabase;
let engineer: Actor;
let projectId: string;
let modelId: string;
let versionId: string;

beforeAll(async () => {
  t = await seededTestDatabase();
  ({ engineer } = await demoActors(t.db));
  projectId = await projectIdNamed(t.db, ESTER_PROJECT);
  const created = await createKineticsModel(t.db, engineer, projectId, modelBody({ name: "Three reactions, B wanted", spec: CHEMISTRY, note: "invented" }));
  modelId = created.model.id;
  versionId = created.version.id;
}, 180_000);

afterAll(async () => {
  await t?.drop();
});

const fieldsOf = async (p: Promise<unknown> | (() => unknown)) => {
  const err = await refusal(typeof p === "function" ? Promise.resolve().then(p) : p);
  return { status: err.status, fields: err.fields ?? {}, message: err.message };
};

describe("kinetics models of several reactions", () => {
  it("are created and read back with their kind", async () => {
    const model = await getKineticsModel(t.db, engineer, modelId);
    expect(model.kind).toBe("network");
    expect(model.versions.map((v) => v.kind)).toEqual(["network"]);
    expect((model.versions[0]!.spec as { reactions: unknown[] }).reactions).toHaveLength(3);
    const listed = (await listKineticsModels(t.db, engineer, projectId)).find((m) => m.id === modelId);
    expect(listed?.latestVersion?.kind).toBe("network");
    // One-reaction models of the seeded project keep answering "single".
    expect((await listKineticsModels(t.db, engineer, projectId)).filter((m) => m.id !== modelId).every((m) => m.latestVersion?.kind === "single")).toBe(true);
  });

  it("refuse a species the feed does not list, at the field, in words", async () => {
    const reactions = structuredClone(CHEMISTRY.reactions) as { stoichiometry: Record<string, number> }[];
    reactions[1]!.stoichiometry = { B: -1, E: 1 };
    const r = await fieldsOf(() => modelBody({ name: "Missing species", spec: { ...CHEMISTRY, reactions }, note: "" }));
    expect(r.status).toBe(400);
    expect(Object.keys(r.fields)).toEqual(["spec.reactions.1.stoichiometry.E"]);
    expect(r.message).toMatch(/^Reaction 2, coefficient of E: /);
    expect(r.message).not.toMatch(/spec\.|stoichiometry\./);
  });

  it("refuse an unknown key reactant", async () => {
    const r = await fieldsOf(() => modelBody({ name: "Unknown key", spec: { ...CHEMISTRY, keyReactant: "Z" }, note: "" }));
    expect(r.status).toBe(400);
    expect(Object.keys(r.fields)).toEqual(["spec.keyReactant"]);
    expect(r.message).toMatch(/^Key reactant: /);
  });

  it("refuse what only the engine can tell (a unit it cannot read) at the field", async () => {
    const reactions = structuredClone(CHEMISTRY.reactions) as { rate: { k: unknown } }[];
    reactions[1]!.rate.k = "1 furlong/s";
    const r = await fieldsOf(createKineticsModel(t.db, engineer, projectId, modelBody({ name: "Bad unit", spec: { ...CHEMISTRY, reactions }, note: "" })));
    expect(r.status).toBe(400);
    expect(Object.keys(r.fields)).toEqual(["spec.reactions.1.rate.k"]);
    expect(r.message).toMatch(/^Reaction 2, rate constant k: /);
  });

  it("keep their kind: a version of the other kind is a conflict at spec, and nothing is written", async () => {
    const r = await fieldsOf(addKineticsVersion(t.db, engineer, modelId, versionBody({ spec: SINGLE, note: "" })));
    expect(r.status).toBe(409);
    expect(Object.keys(r.fields)).toEqual(["spec"]);
    expect(r.message).toMatch(/several reactions/);
    expect((await getKineticsModel(t.db, engineer, modelId)).versions).toHaveLength(1);

    const single = await createKineticsModel(t.db, engineer, projectId, modelBody({ name: "One reaction", spec: SINGLE, note: "" }));
    expect(single.version.kind).toBe("single");
    const back = await fieldsOf(addKineticsVersion(t.db, engineer, single.model.id, versionBody({ spec: CHEMISTRY, note: "" })));
    expect(back.status).toBe(409);
    expect(back.message).toMatch(/one reaction/);
  });
});

const SWEEP = {
  kineticsVersionId: "",
  train: { maxStages: 2, types: ["CSTR", "PFR"] },
  objective: { maximise: "yield", product: "B" },
  constraints: { minConversion: 0.5, maxTotalVolume: 2 },
  grid: [{ field: "reactions.1.rate.k", values: [0.5, 2] }],
};

describe("sweeps of a model of several reactions", () => {
  let sweepId: string;

  it("are submitted with the body picked as a network sweep and store the engine's spec", async () => {
    const sweep = await createSweep(t.db, engineer, projectId, sweepBody({ ...SWEEP, kineticsVersionId: versionId }));
    sweepId = sweep.id;
    const view = await getSweep(t.db, engineer, sweep.id);
    expect(view.kind).toBe("network");
    if (view.kind !== "network") return;
    expect(view.total).toBe(2);
    // The chemistry without the units it was typed in or the model's product, plus what the sweep adds.
    expect(Object.keys(view.spec).sort()).toEqual(["constraints", "feed", "keyReactant", "objective", "phase", "reactions", "thermal", "train"]);
    expect(view.spec.thermal).toEqual({ mode: "isothermal" });
  });

  it("run on the worker's path: each scenario's candidates are the engine's own ranking for that scenario", async () => {
    const report = await runSweepChunk(t.db, { sweepId, from: 0, to: 2 });
    expect(report).toMatchObject({ computed: 2, written: 2, finished: "succeeded" });
    const [row] = await t.db.select().from(sweeps).where(eq(sweeps.id, sweepId));
    const scenarioRows = await t.db.select().from(scenarios).where(eq(scenarios.sweepId, sweepId)).orderBy(asc(scenarios.index));
    for (const sc of scenarioRows) {
      // Independent path: the engine called directly on the scenario's spec.
      const direct = designNetwork(applyOverrides(row!.baseSpec, sc.overrides) as unknown as NetworkDesignSpec);
      const stored = await t.db.select().from(candidates).where(eq(candidates.scenarioId, sc.id)).orderBy(asc(candidates.rank));
      expect(stored.map((c) => c.sequenceKey)).toEqual(direct.candidates.map((c) => c.sequence.join("-")));
      stored.forEach((c, i) => {
        const d = direct.candidates[i]!;
        expect(c.objectiveValue).toBeCloseTo(d.objective!, 12);
        expect(c.yield).toBeCloseTo(d.yield!, 12);
        expect(c.conversion).toBeCloseTo(d.conversion!, 12);
        expect(c.totalVolume).toBeCloseTo(d.totalVolume!, 12);
        expect(c.levenspiel).toEqual([]);
        expect(c.totalCost).toBeNull();
      });
      expect(sc.bestObjective).toBeCloseTo(direct.candidates[0]!.objective!, 12);
      expect(sc.reference).toMatchObject({ kind: "network", objective: { maximise: "yield", product: "B" }, feedVolumetricFlow: 0.1 });
    }
    // The second reaction faster takes more B on to C: the best yield falls as its constant rises (the two scenarios differ).
    expect(scenarioRows[1]!.bestObjective!).toBeLessThan(scenarioRows[0]!.bestObjective!);
    const listed = await listScenarios(t.db, engineer, sweepId);
    expect(listed.map((s) => s.status)).toEqual(["succeeded", "succeeded"]);
  });

  it("list candidates sorted by yield, highest first, in the database", async () => {
    const page = await listCandidates(t.db, engineer, sweepId, 1, candidateQuerySchema.parse({ sort: "yield", dir: "desc" }));
    expect(page.kind).toBe("network");
    const yields = page.items.filter((c) => c.feasible).map((c) => c.yield!);
    expect(yields.length).toBeGreaterThan(1);
    expect(yields).toEqual([...yields].sort((a, b) => b - a));
    // The same order from the engine's own answer for scenario 2, sorted here by yield (ties by rank).
    const [row] = await t.db.select().from(sweeps).where(eq(sweeps.id, sweepId));
    const direct = designNetwork(applyOverrides(row!.baseSpec, page.scenario.overrides) as unknown as NetworkDesignSpec);
    const byYield = direct.candidates.filter((c) => c.feasible).sort((a, b) => b.yield! - a.yield! || a.rank - b.rank);
    expect(page.items.filter((c) => c.feasible).map((c) => c.sequenceKey)).toEqual(byYield.map((c) => c.sequence.join("-")));
    expect(page.items[0]).toMatchObject({ conversion: expect.any(Number), selectivity: expect.any(Number), objectiveValue: expect.any(Number), onBound: expect.any(Array) });
    const stage = page.items[0]!.stages[0] as unknown as { outlet: Record<string, number> };
    expect(Object.keys(stage.outlet).sort()).toEqual(["A", "B", "C", "D"]);
  });

  it("answer a candidate with its chemistry, concentration profiles along the train and paths from the feed", async () => {
    const page = await listCandidates(t.db, engineer, sweepId, 0, candidateQuerySchema.parse({ sort: "rank" }));
    const best = page.items[0]!;
    const c = await getCandidate(t.db, engineer, best.id);
    expect(c.kind).toBe("network");
    if (c.kind !== "network") return;
    expect(c).toMatchObject({ keyReactant: "A", product: "B", species: ["A", "B", "C", "D"] });
    expect((c.chemistry.reactions[1]!.rate as { k: number }).k).toBe(0.5); // scenario 1's value of the varied constant
    expect(c.cautions).toEqual(CAUTIONS);
    const profiles = c.profiles!;
    expect(profiles.stages).toHaveLength(c.stages.length);
    // The profile ends where the train does: cumulative residence time V/v0 summed over the stages, and the
    // designer's stored outlet (two separate computations of the engine: the search and the view).
    const totalTau = c.stages.reduce((sum, st) => sum + st.volume / 0.1, 0);
    const last = profiles.stages.at(-1)!;
    expect(last.endResidenceTime).toBeCloseTo(totalTau, 9);
    const end = last.points.at(-1)!.concentrations;
    for (const sp of ["A", "B", "C", "D"]) expect(end[sp]!).toBeCloseTo(c.stages.at(-1)!.outlet[sp]!, 3);
    // Mass balance on the key reactant's atoms, A + B + C + 2D = C_A0 = 580 mol/m3 at every point of the
    // profile (stoichiometry of the three reactions; a liquid keeps its volumetric flow): common practice.
    for (const st of profiles.stages) for (const pt of st.points) {
      const x = pt.concentrations;
      expect(x.A! + x.B! + x.C! + 2 * x.D!).toBeCloseTo(580, 6);
    }
    const paths = c.paths!;
    expect(paths).toMatchObject({ key: "A", product: "B" });
    expect(paths.tube.length).toBeGreaterThan(10);
    expect(paths.tanks.length).toBeGreaterThan(10);
  });

  it("compare two candidates: yield below the best and volume over the best", async () => {
    const page = await listCandidates(t.db, engineer, sweepId, 0, candidateQuerySchema.parse({ sort: "yield", dir: "desc", feasible: "true" }));
    const [a, b] = page.items;
    const [ca, cb] = await compareCandidates(t.db, engineer, [b!.id, a!.id]);
    expect(ca!.kind).toBe("network");
    expect(cb!.differences.yieldBelowBest).toBe(0);
    expect(ca!.differences.yieldBelowBest).toBeCloseTo(a!.yield! - b!.yield!, 14);
    const minVolume = Math.min(a!.totalVolume!, b!.totalVolume!);
    expect(ca!.differences.volumeOverBest).toBeCloseTo(b!.totalVolume! - minVolume, 14);
  });

  it("pin a candidate: the frozen copy is of the network kind with its outlet composition", async () => {
    const page = await listCandidates(t.db, engineer, sweepId, 0, candidateQuerySchema.parse({ sort: "rank" }));
    const best = page.items[0]!;
    const pin = await pinCandidate(t.db, engineer, best.id, { note: "best yield" });
    const frozen = (await getPin(t.db, engineer, pin.id)).candidate as unknown as PinnedNetworkCandidate;
    expect(frozen.kind).toBe("network");
    expect(frozen.sequence.join("-")).toBe(best.sequenceKey);
    expect(frozen.yield).toBe(best.yield);
    expect(frozen.outlet).toEqual((best.stages.at(-1) as unknown as { outlet: Record<string, number> }).outlet);
    // Yield of B on A fed, from the frozen outlet (definition of the trade).
    expect(frozen.yield!).toBeCloseTo(frozen.outlet!.B! / 580, 9);
    expect(frozen.totalResidenceTime).toBeCloseTo(best.totalVolume! / 0.1, 9);
    expect(frozen.scenario.reference?.kind).toBe("network");
  });

  it("export the ranked list with conversion, yield and selectivity columns", async () => {
    const data = await exportCandidates(t.db, engineer, sweepId, 0, { sort: "yield", dir: "desc" });
    expect(isNetworkExport(data)).toBe(true);
    const parsed = Papa.parse<Record<string, unknown>>(networkCandidatesCsv(sweepId, data), { header: true, comments: "#", dynamicTyping: true, skipEmptyLines: true });
    expect(parsed.meta.fields).toEqual(expect.arrayContaining(["conversion (-)", "yield (-)", "selectivity (-)"]));
    expect(parsed.data).toHaveLength(data.total);
    expect(parsed.data[0]!["yield (-)"]).toBe(data.items[0]!.yield);
  });

  it("re-run as a new sweep of the same kind", async () => {
    const again = await rerunSweep(t.db, engineer, sweepId);
    expect(again.kind).toBe("network");
    expect(again.total).toBe(2);
  });

  it("name the request's fields when refused, and write nothing", async () => {
    const count = async () => (await t.db.select({ id: sweeps.id }).from(sweeps).where(eq(sweeps.projectId, projectId))).length;
    const before = await count();
    const missing = await fieldsOf(createSweep(t.db, engineer, projectId, sweepBody({ ...SWEEP, kineticsVersionId: versionId, grid: [{ field: "reactions.7.rate.k", values: [1, 2] }] })));
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.fields)).toEqual(["grid.0.field"]);

    const species = await fieldsOf(createSweep(t.db, engineer, projectId, sweepBody({ ...SWEEP, kineticsVersionId: versionId, grid: [{ field: "feed.concentrations.Q", values: [1, 2] }] })));
    expect(Object.keys(species.fields)).toEqual(["grid.0.field"]);

    // A negative rate constant from the grid: the engine's reading is reported at the varied input.
    const negative = await fieldsOf(createSweep(t.db, engineer, projectId, sweepBody({ ...SWEEP, kineticsVersionId: versionId, grid: [{ field: "reactions.1.rate.k", values: [1, -2] }] })));
    expect(Object.keys(negative.fields)).toEqual(["grid.0.field"]);

    // Minimum conversion no train can reach in a one-scenario sweep.
    const unreachable = await fieldsOf(createSweep(t.db, engineer, projectId, sweepBody({ ...SWEEP, kineticsVersionId: versionId, grid: [], constraints: { minConversion: 0.999999, maxTotalVolume: 1e-4 } })));
    expect(Object.keys(unreachable.fields)).toEqual(["constraints.minConversion"]);
    expect(unreachable.message).toMatch(/^Minimum conversion: /);

    // A network body for a one-reaction model, and the reverse.
    const single = (await listKineticsModels(t.db, engineer, projectId)).find((m) => m.latestVersion?.kind === "single")!;
    const wrong = await fieldsOf(createSweep(t.db, engineer, projectId, sweepBody({ ...SWEEP, kineticsVersionId: single.latestVersion!.id })));
    expect(Object.keys(wrong.fields)).toEqual(["kineticsVersionId"]);
    const reverse = await fieldsOf(createSweep(t.db, engineer, projectId, sweepBody({ kineticsVersionId: versionId, target: { conversion: 0.9 }, train: { maxStages: 2 } })));
    expect(Object.keys(reverse.fields)).toEqual(["kineticsVersionId"]);

    expect(await count()).toBe(before);
  });
});
