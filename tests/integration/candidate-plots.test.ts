import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { candidates, sweeps } from "@/db/schema";
import { designTrains, type StagePlot } from "@/lib/engine";
import { candidateQuerySchema, kineticsModelCreateSchema, sweepCreateSchema } from "@/lib/schemas/sweeps";
import { compareCandidates, listCandidates } from "@/lib/services/candidates";
import { createKineticsModel } from "@/lib/services/kinetics";
import { pinCandidate } from "@/lib/services/pins";
import { runSweepChunk } from "@/lib/services/sweep-chunks";
import { createSweep } from "@/lib/services/sweeps";
import { scenarioDesignSpec } from "@/lib/sweeps/stage-plots";
import type { TestDatabase } from "../helpers/test-db";
import { demoActors, ESTER_PROJECT, projectIdNamed, seededTestDatabase } from "./helpers/demo-team";

// An invented first-order liquid reaction A -> R: its Levenspiel curve has a closed form to check against.
const K = 2e-3; // 1/s
const CA0 = 500; // mol/m3
const FA0 = 0.05; // mol/s
const KINETICS = {
  feed: { flowA: FA0, concA: CA0, temperature: 320 },
  reaction: { stoichiometry: { A: -1, R: 1 }, phase: "liquid", rate: { law: "power", k: K, orders: { A: 1 } } },
};

let t: TestDatabase;
let actors: Awaited<ReturnType<typeof demoActors>>;
let projectId: string;
let sweepId: string;

beforeAll(async () => {
  t = await seededTestDatabase();
  actors = await demoActors(t.db);
  projectId = await projectIdNamed(t.db, ESTER_PROJECT);
  const { version } = await createKineticsModel(t.db, actors.engineer, projectId, kineticsModelCreateSchema.parse({ name: "Plot points, first order", spec: KINETICS, note: "invented" }));
  const sweep = await createSweep(
    t.db,
    actors.engineer,
    projectId,
    sweepCreateSchema.parse({ kineticsVersionId: version.id, target: { conversion: 0.9 }, train: { maxStages: 2, types: ["CSTR", "PFR"] }, grid: [{ field: "feed.flowA", values: [FA0, 2 * FA0] }] }),
  );
  sweepId = sweep.id;
  expect(await runSweepChunk(t.db, { sweepId, from: 0, to: 2 })).toMatchObject({ finished: "succeeded" });
}, 180_000);

afterAll(async () => {
  await t?.drop();
});

describe("plot points are recomputed, not stored", () => {
  it("stores no plot points with a one-reaction candidate", async () => {
    const rows = await t.db.select({ n: sql<number>`jsonb_array_length(${candidates.levenspiel})::int` }).from(candidates).where(eq(candidates.sweepId, sweepId));
    expect(rows.length).toBe(12);
    expect(rows.every((r) => r.n === 0)).toBe(true);
  });

  it("gives every candidate of every scenario the plot points its design returned, and the first-order curve's closed form", async () => {
    const [sweep] = await t.db.select({ baseSpec: sweeps.baseSpec }).from(sweeps).where(eq(sweeps.id, sweepId));
    for (const index of [0, 1]) {
      const page = await listCandidates(t.db, actors.engineer, sweepId, index, candidateQuerySchema.parse({ include: "levenspiel", pageSize: "50" }));
      const designed = designTrains(scenarioDesignSpec(sweep.baseSpec as Record<string, unknown>, page.scenario.overrides as Record<string, number>));
      expect(page.items.length).toBe(designed.candidates.length);
      for (const item of page.items) {
        const same = designed.candidates.find((c) => c.sequence.join("-") === item.sequence.join("-"))!;
        expect(item.levenspiel).toEqual(same.stages.map((s) => s.levenspiel));
      }
      // Levenspiel plot of a first-order liquid reaction (common practice): FA0/(-rA) = FA0 / (k CA0 (1 - X)).
      const fa0 = index === 0 ? FA0 : 2 * FA0;
      const tube = page.items.find((c) => c.sequence.join("-") === "PFR")!;
      for (const [x, h] of tube.levenspiel![0].curve) expect(Math.abs(h - fa0 / (K * CA0 * (1 - x))) / h).toBeLessThan(1e-5);
    }
  });

  it("gives the ranked table's thumbnails at most 9 points a stage, from the same curve, its ends kept", async () => {
    const q = (include: string) => candidateQuerySchema.parse({ include, pageSize: "50" });
    const full = await listCandidates(t.db, actors.engineer, sweepId, 0, q("levenspiel"));
    const small = await listCandidates(t.db, actors.engineer, sweepId, 0, q("thumbnails"));
    for (const [i, item] of small.items.entries()) {
      const whole = full.items[i].levenspiel!;
      item.levenspiel!.forEach((plot, s) => {
        expect(plot.curve.length).toBeLessThanOrEqual(9);
        expect(plot.curve[0]).toEqual(whole[s].curve[0]);
        expect(plot.curve.at(-1)).toEqual(whole[s].curve.at(-1));
        for (const point of plot.curve) expect(whole[s].curve).toContainEqual(point);
        // The outline keeps its base corners, so the shaded volume starts and ends on the axis.
        expect(plot.area[0]).toEqual(whole[s].area[0]);
        expect(plot.area.at(-1)).toEqual(whole[s].area.at(-1));
      });
    }
  });

  it("keeps plot points that an older sweep stored, and recomputes them for compare and for a pin", async () => {
    const [first] = (await listCandidates(t.db, actors.engineer, sweepId, 0, candidateQuerySchema.parse({ pageSize: "50" }))).items.filter((c) => c.feasible);
    const [fresh] = await compareCandidates(t.db, actors.engineer, [first.id]);
    expect(fresh.kind).toBe("single");
    expect(fresh.levenspiel.length).toBe(fresh.stages.length);
    expect(fresh.levenspiel[0].curve.length).toBeGreaterThan(1);

    const pin = await pinCandidate(t.db, actors.engineer, first.id, { note: "plot points check" });
    const pinned = pin.candidate as { stages: { levenspiel: StagePlot }[] };
    expect(pinned.stages.map((s) => s.levenspiel)).toEqual(fresh.levenspiel);

    // A row written before plot points stopped being stored keeps its own (here a marker of our own).
    const marker: StagePlot[] = fresh.stages.map(() => ({ curve: [[0, 1]], area: [[0, 0]] }));
    await t.db.update(candidates).set({ levenspiel: marker }).where(eq(candidates.id, first.id));
    const [old] = await compareCandidates(t.db, actors.engineer, [first.id]);
    expect(old.levenspiel).toEqual(marker);
  });
});
