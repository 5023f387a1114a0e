import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { candidates, sweeps } from "@/db/schema";
import { designTrains, type StagePlot } from "@/lib/engine";
import { validationError } from "@/lib/errors";
import { candidateQuerySchema, kineticsModelCreateSchema, sweepCreateSchema } from "@/lib/schemas/sweeps";
import { compareCandidates, listCandidates } from "@/lib/services/candidates";
import { createKineticsModel } from "@/lib/services/kinetics";
import { pinCandidate, reviewPin } from "@/lib/services/pins";
import { runSweepChunk } from "@/lib/services/sweep-chunks";
import { createSweep } from "@/lib/services/sweeps";
import { rateFixedTrain } from "@/lib/services/rating";
import { createCandidateRun } from "@/lib/services/robustness";
import { rateRequestSchema } from "@/lib/schemas/costs";
import { RECYCLE_CAUTION } from "@/lib/stage-types";
import { PDFParse } from "pdf-parse";
import Papa from "papaparse";
import { getDesignReport } from "@/lib/services/design-reports";
import { exportCandidates } from "@/lib/services/candidate-export";
import { candidateCautions, candidateRowsForExport, candidatesCsv, stageTableCsv } from "@/lib/reports/exports";
import { renderReportPdf } from "@/lib/reports/report-pdf";
import { scenarioDesignSpec } from "@/lib/sweeps/stage-plots";
import type { TestDatabase } from "../helpers/test-db";
import { demoActors, ESTER_PROJECT, projectIdNamed, seededTestDatabase } from "./helpers/demo-team";

// An invented autocatalytic liquid reaction A + R -> 2R with a little R in the feed: the case where a tube with recycle pays.
const KINETICS = {
  feed: { flowA: 0.1, concA: 900, temperature: 310, ratios: { R: 0.03 } },
  reaction: { stoichiometry: { A: -1, R: 1 }, phase: "liquid", rate: { law: "power", k: 3e-6, orders: { A: 1, R: 1 } } },
};

let t: TestDatabase;
let actors: Awaited<ReturnType<typeof demoActors>>;
let kineticsVersionId: string;
let chosen: string;
let fixed: string;
let pinId: string;

async function run(body: unknown, scenarios: number): Promise<string> {
  const sweep = await createSweep(t.db, actors.engineer, await projectIdNamed(t.db, ESTER_PROJECT), sweepCreateSchema.parse(body));
  expect(await runSweepChunk(t.db, { sweepId: sweep.id, from: 0, to: scenarios })).toMatchObject({ finished: "succeeded" });
  return sweep.id;
}

const page = (sweepId: string, index: number, q: Record<string, string> = {}) => listCandidates(t.db, actors.engineer, sweepId, index, candidateQuerySchema.parse({ pageSize: "50", ...q }));

beforeAll(async () => {
  t = await seededTestDatabase();
  actors = await demoActors(t.db);
  const projectId = await projectIdNamed(t.db, ESTER_PROJECT);
  const { version } = await createKineticsModel(t.db, actors.engineer, projectId, kineticsModelCreateSchema.parse({ name: "Autocatalytic, recycle", spec: KINETICS, note: "invented" }));
  kineticsVersionId = version.id;
  chosen = await run({ kineticsVersionId, target: { conversion: 0.9 }, train: { maxStages: 2, types: ["CSTR", "PFR", "PFR-recycle"] }, grid: [{ field: "feed.flowA", values: [0.1, 0.2] }] }, 2);
  fixed = await run({ kineticsVersionId, target: { conversion: 0.9 }, train: { candidates: [["PFR-recycle"], ["CSTR", "PFR-recycle"]], recycleRatio: "0.5" }, grid: [] }, 1);
}, 240_000);

afterAll(async () => {
  await t?.drop();
});

describe("a sweep with the tube with recycle", () => {
  it("stores every train with its recycle ratios and lists them as the design gave them", async () => {
    const [sweep] = await t.db.select({ baseSpec: sweeps.baseSpec }).from(sweeps).where(eq(sweeps.id, chosen));
    for (const index of [0, 1]) {
      const p = await page(chosen, index);
      const designed = designTrains(scenarioDesignSpec(sweep.baseSpec as Record<string, unknown>, p.scenario.overrides as Record<string, number>));
      // 3 + 9 sequences of one and two stages of three types.
      expect(p.items.length).toBe(12);
      for (const item of p.items) {
        const same = designed.candidates.find((c) => c.sequence.join(" ") === item.sequence.join(" "))!;
        expect(same).toBeDefined();
        expect(item.stages.map((s) => s.type)).toEqual(item.sequence);
        // Stored and read back exactly (the stage codec keeps such a list as JSON).
        expect(item.stages.map((s) => s.recycleRatio)).toEqual(same.stages.map((s) => s.recycleRatio));
        for (const s of item.stages) expect("recycleRatio" in s).toBe(s.type === "PFR-recycle");
      }
      const alone = p.items.find((c) => c.sequence.join(" ") === "PFR-recycle")!;
      expect(alone.feasible).toBe(true);
      expect(alone.stages[0].recycleRatio).toBeGreaterThan(0);
    }
  });

  it("redraws the plots of a tube with recycle with its stored ratio", async () => {
    const [sweep] = await t.db.select({ baseSpec: sweeps.baseSpec }).from(sweeps).where(eq(sweeps.id, fixed));
    const p = await page(fixed, 0, { include: "levenspiel" });
    const designed = designTrains(scenarioDesignSpec(sweep.baseSpec as Record<string, unknown>, {}));
    expect(p.items.length).toBe(2);
    for (const item of p.items) {
      const same = designed.candidates.find((c) => c.sequence.join(" ") === item.sequence.join(" "))!;
      expect(item.levenspiel).toEqual(same.stages.map((s) => s.levenspiel));
      const k = item.sequence.indexOf("PFR-recycle");
      expect(item.stages[k].recycleRatio).toBe(0.5);
      expect(item.levenspiel![k].recycle?.recycleRatio).toBe(0.5);
    }
    // The chosen ratio too: plots recomputed from the stored stage match the design, not a plain tube's (R = 0).
    const chosenPage = await page(chosen, 0, { include: "thumbnails" });
    const tube = chosenPage.items.find((c) => c.sequence.join(" ") === "PFR-recycle")!;
    expect(tube.levenspiel![0].recycle?.recycleRatio).toBe(tube.stages[0].recycleRatio);
    expect(tube.levenspiel![0].recycle?.recycleRatio).toBeGreaterThan(0);
  });

  it("filters the ranked table on a run with a tube with recycle, written either way", async () => {
    const some = await page(chosen, 0, { contains: "PFR-recycle" });
    // 1 + 5 of the 12 hold one (alone; then the 2-stage trains with it first or second, counted once).
    expect(some.items.map((c) => c.sequence.join(" ")).sort()).toEqual(["CSTR PFR-recycle", "PFR PFR-recycle", "PFR-recycle", "PFR-recycle CSTR", "PFR-recycle PFR", "PFR-recycle PFR-recycle"]);
    const run = await page(chosen, 0, { contains: "CSTR-PFRrecycle" });
    expect(run.items.map((c) => c.sequence.join(" "))).toEqual(["CSTR PFR-recycle"]);
    // "PFR" alone matches plain tubes only, never inside the tube with recycle's key.
    const tubes = await page(chosen, 0, { contains: "PFR" });
    expect(tubes.items.every((c) => c.sequence.includes("PFR"))).toBe(true);
  });

  it("compares and pins a train with a tube with recycle, keeping its ratio and plots", async () => {
    const best = (await page(fixed, 0)).items.find((c) => c.sequence.join(" ") === "CSTR PFR-recycle")!;
    const [compared] = await compareCandidates(t.db, actors.engineer, [best.id]);
    expect(compared.kind).toBe("single");
    expect(compared.sequence).toEqual(["CSTR", "PFR-recycle"]);
    const pin = await pinCandidate(t.db, actors.engineer, best.id, { note: "tube with recycle" });
    pinId = pin.id;
    const pinned = pin.candidate as { sequence: string[]; stages: { recycleRatio?: number; levenspiel: StagePlot }[] };
    expect(pinned.sequence).toEqual(["CSTR", "PFR-recycle"]);
    expect(pinned.stages[1].recycleRatio).toBe(0.5);
    expect(pinned.stages[1].levenspiel.recycle?.recycleRatio).toBe(0.5);
    const stored = await t.db.select({ id: candidates.id }).from(candidates).where(eq(candidates.id, best.id));
    expect(stored.length).toBe(1);
    const approved = await reviewPin(t.db, actors.manager, pin.id, { decision: "approve", comment: "recycle pump to be sized separately" });
    expect(approved.state).toBe("approved");
  });

  it("refuses a bad recycle ratio naming the field, and a same-volume train with one", async () => {
    for (const recycleRatio of [-0.2, "lots"]) {
      const parsed = sweepCreateSchema.safeParse({ kineticsVersionId, target: { conversion: 0.9 }, train: { candidates: [["PFR-recycle"]], recycleRatio } });
      expect(parsed.success).toBe(false);
      const err = validationError(parsed.error!);
      expect(err.code).toBe("bad_request");
      expect(Object.keys(err.fields!)).toEqual(["train.recycleRatio"]);
      expect(err.message).toMatch(/^Recycle ratio: /);
    }
    const body = sweepCreateSchema.parse({ kineticsVersionId, target: { conversion: 0.9 }, train: { candidates: [["PFR-recycle", "CSTR"]], equalVolume: true } });
    await expect(createSweep(t.db, actors.engineer, await projectIdNamed(t.db, ESTER_PROJECT), body)).rejects.toMatchObject({ code: "bad_request", fields: { "train.equalVolume": expect.any(Array) } });
  });

  it("rates a designed train with a tube with recycle back to its target, with the recycle's caution", async () => {
    const best = (await page(fixed, 0)).items.find((c) => c.sequence.join(" ") === "CSTR PFR-recycle")!;
    const projectId = await projectIdNamed(t.db, ESTER_PROJECT);
    const stages = best.stages.map((s) => ({ type: s.type, volume: s.volume, ...(s.recycleRatio !== undefined ? { recycleRatio: s.recycleRatio } : {}) }));
    const rating = await rateFixedTrain(t.db, actors.engineer, projectId, rateRequestSchema.parse({ kineticsVersionId, stages, target: 0.9 }));
    // A design rated at its own volumes reaches its own target (common practice: rating inverts sizing).
    expect(Math.abs(rating.conversionOut - 0.9)).toBeLessThan(1e-6);
    expect(rating.stages[1]!.recycleRatio).toBe(0.5);
    expect(rating.cautions).toContain(RECYCLE_CAUTION);
    for (const [stage, field] of [[{ type: "PFR-recycle", volume: 2 }, "stages.0.recycleRatio"], [{ type: "PFR", volume: 2, recycleRatio: 1 }, "stages.0.recycleRatio"], [{ type: "PFR-recycle", volume: 2, recycleRatio: -1 }, "stages.0.recycleRatio"]] as const) {
      const parsed = rateRequestSchema.safeParse({ kineticsVersionId, stages: [stage], target: 0.9 });
      expect(parsed.success).toBe(false);
      const err = validationError(parsed.error!);
      expect(Object.keys(err.fields!)).toEqual([field]);
      expect(err.message).toMatch(/^Stage 1 recycle ratio: /);
    }
  });

  it("carries the recycle ratio and the recycle's caution in the design report, its PDF and CSV, and the ranked list's exports", async () => {
    const r = await getDesignReport(t.db, actors.manager, pinId);
    expect(r.train.label).toBe("CSTR → Tube with recycle");
    expect(r.stages.map((s) => s.recycleRatio)).toEqual([null, 0.5]);
    expect(r.cautions.general.at(-1)).toBe(RECYCLE_CAUTION);
    expect(r.chart.stages[1]!.recycle?.recycleRatio).toBe(0.5);
    expect(r.objective).toContainEqual({ label: "Recycle ratio", value: "0.5, fixed for every tube with recycle" });
    const csv = Papa.parse<string[]>(stageTableCsv(r).split("\n").slice(2).join("\n")).data;
    expect(csv[0]!.slice(0, 3)).toEqual(["stage", "type", "recycle ratio (-)"]);
    expect(csv[2]!.slice(0, 3)).toEqual(["2", "PFR-recycle", "0.5"]);
    expect(stageTableCsv(r).split("\n")[1]).toContain("the recycle pump and line");
    const parser = new PDFParse({ data: new Uint8Array(await renderReportPdf(r)) });
    try {
      const text = (await parser.getText()).text.replace(/\s+/g, " ");
      expect(text).toContain("Recycle ratio");
      expect(text).toContain("Tube with recycle");
      expect(text).toContain("the recycle pump and line, their cost and their hold-up are not included");
    } finally {
      await parser.destroy();
    }

    const data = await exportCandidates(t.db, actors.engineer, fixed, 0, { sort: "rank", dir: "asc" });
    const list = candidatesCsv(fixed, data).split("\n");
    expect(list[1]).toContain("the recycle pump and line");
    const table = Papa.parse<string[]>(list.slice(2).join("\n")).data;
    const column = table[0]!.indexOf("stage recycle ratios (-)");
    expect(column).toBeGreaterThan(0);
    const row = table.find((cells) => cells[1] === "CSTR-PFR-recycle")!;
    expect(row[column]).toBe(" | 0.5");
    expect(candidateRowsForExport(data).find((c) => c.sequence === "CSTR-PFR-recycle")!.stageRecycleRatios).toEqual([null, 0.5]);
    expect(candidateCautions(data)).toContain(RECYCLE_CAUTION);
  });

  it("rates a train with a tube with recycle under uncertainty at its designed ratio", async () => {
    const best = (await page(fixed, 0)).items.find((c) => c.sequence.join(" ") === "CSTR PFR-recycle")!;
    const run = await createCandidateRun(t.db, actors.engineer, best.id, { uncertain: [{ field: "reaction.rate.k", kind: "plusMinus", fraction: 0.1 }], samples: 40, seed: 3 });
    expect(run.status).toBe("succeeded");
    const result = run.result as { nominal: number; refusedSamples: number; p50: number };
    // At the nominal inputs the designed train reaches its own target (rating inverts sizing, common practice).
    expect(Math.abs(result.nominal - 0.9)).toBeLessThan(1e-6);
    expect(result.refusedSamples).toBe(0);
    expect(result.p50).toBeGreaterThan(0.8);
  });
});
