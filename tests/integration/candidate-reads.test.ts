import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Actor } from "@/lib/authz/policy";
import { candidateQuerySchema, kineticsModelCreateSchema, sweepCreateSchema } from "@/lib/schemas/sweeps";
import { FINAL_CACHE_CONTROL, readCandidates, RUNNING_CACHE_CONTROL, type CandidatesAnswer } from "@/lib/services/candidate-reads";
import { cancelSweep, createSweep } from "@/lib/services/sweeps";
import { runSweepChunk } from "@/lib/services/sweep-chunks";
import { createKineticsModel } from "@/lib/services/kinetics";
import { refusal } from "../helpers/refusal";
import type { TestDatabase } from "../helpers/test-db";
import { demoActors, ESTER_PROJECT, projectIdNamed, seededTestDatabase } from "./helpers/demo-team";

// An invented second-order liquid reaction, as the queue bench uses; the figures are not checked here,
// only how the endpoint's answers are cached and who may see them.
const KINETICS = {
  feed: { flowA: 0.02, concA: 1000, temperature: 340, ratios: { B: 1.2 } },
  reaction: { stoichiometry: { A: -1, B: -1, R: 1 }, phase: "liquid", rate: { law: "power", k: 1e-4, orders: { A: 1, B: 1 } } },
};

let t: TestDatabase;
let actors: Awaited<ReturnType<typeof demoActors>>;
let projectId: string;
let versionId: string;

beforeAll(async () => {
  t = await seededTestDatabase();
  actors = await demoActors(t.db);
  projectId = await projectIdNamed(t.db, ESTER_PROJECT);
  const created = await createKineticsModel(t.db, actors.engineer, projectId, kineticsModelCreateSchema.parse({ name: "Cache check, second order", spec: KINETICS, note: "invented" }));
  versionId = created.version.id;
}, 180_000);

afterAll(async () => {
  await t?.drop();
});

const submit = (flows: number[]) =>
  createSweep(t.db, actors.engineer, projectId, sweepCreateSchema.parse({ kineticsVersionId: versionId, target: { conversion: 0.9 }, train: { maxStages: 3, types: ["CSTR", "PFR"] }, grid: [{ field: "feed.flowA", values: flows }] }));

const query = (q: Record<string, string> = {}) => candidateQuerySchema.parse(q);
const read = (actor: Actor, sweepId: string, index: number, q = query(), ifNoneMatch: string | null = null) => readCandidates(t.db, actor, sweepId, index, q, ifNoneMatch);
const bodyOf = (a: CandidatesAnswer) => {
  if (a.status !== 200) throw new Error(`expected a full answer, got ${a.status}`);
  return JSON.parse(a.body) as { total: number; scenario: { status: string }; items: { rank: number; sequence: string[] }[] };
};

describe("a finished sweep's candidates", () => {
  let sweepId: string;

  beforeAll(async () => {
    sweepId = (await submit([0.02, 0.04])).id;
    expect(await runSweepChunk(t.db, { sweepId, from: 0, to: 2 })).toMatchObject({ finished: "succeeded" });
  }, 120_000);

  it("carry a strong ETag and may be kept; a repeat naming it gets 304 with no body", async () => {
    const first = await read(actors.engineer, sweepId, 0);
    expect(first.status).toBe(200);
    expect(first.etag).toMatch(/^"[^"]+"$/);
    expect(first.cacheControl).toBe(FINAL_CACHE_CONTROL);
    expect(first.cacheControl).toMatch(/private/);
    expect(bodyOf(first).total).toBeGreaterThan(0);

    const again = await read(actors.engineer, sweepId, 0, query(), first.etag);
    expect(again).toEqual({ status: 304, etag: first.etag, cacheControl: FINAL_CACHE_CONTROL });
    // A list of tags, or the weak form of the same tag, matches too (the header's comparison rules).
    expect((await read(actors.engineer, sweepId, 0, query(), `"other", W/${first.etag}`)).status).toBe(304);
    // A stale tag gets the full answer again, with the same tag and body as the first time.
    const stale = await read(actors.engineer, sweepId, 0, query(), '"c1-not-this-one"');
    expect(stale.status).toBe(200);
    expect(stale.etag).toBe(first.etag);
    expect(bodyOf(stale)).toEqual(bodyOf(first));
  });

  it("give another tag for another question: sort, page, filter or scenario", async () => {
    const base = (await read(actors.engineer, sweepId, 0)).etag;
    const tags = await Promise.all([
      read(actors.engineer, sweepId, 0, query({ sort: "totalVolume", dir: "desc" })),
      read(actors.engineer, sweepId, 0, query({ page: "2", pageSize: "5" })),
      read(actors.engineer, sweepId, 0, query({ feasible: "true" })),
      read(actors.engineer, sweepId, 1),
    ]);
    const all = [base, ...tags.map((a) => a.etag)];
    expect(new Set(all).size).toBe(all.length);
    // The same question written with its defaults spelled out is the same question.
    expect((await read(actors.engineer, sweepId, 0, query({ sort: "rank", dir: "asc", page: "1" }))).etag).toBe(base);
    // And the answers differ as the question does: descending volume puts the largest first.
    const desc = bodyOf(tags[0]!).items;
    expect(desc.length).toBeGreaterThan(1);
    const paged = bodyOf(tags[1]!);
    expect(paged.items.map((c) => c.rank)).toEqual([6, 7, 8, 9, 10].slice(0, paged.items.length));
  });

  it("stay hidden from another team and refused to a viewer, even with a valid tag", async () => {
    const { etag } = await read(actors.engineer, sweepId, 0);
    const other = await refusal(read(actors.otherTeam, sweepId, 0, query(), etag));
    expect(other.status).toBe(404);
    expect(other.message).toMatch(/scenario/);
    const viewer = await refusal(read(actors.viewer, sweepId, 0, query(), etag));
    expect(viewer.status).toBe(403);
    // A team member who may read sweeps shares the answer (the tag names the answer, not the reader).
    expect((await read(actors.manager, sweepId, 0, query(), etag)).status).toBe(304);
  });

  it("say 'no such scenario' for a number past the sweep's end, tag or not", async () => {
    const { etag } = await read(actors.engineer, sweepId, 0);
    expect((await refusal(read(actors.engineer, sweepId, 7))).status).toBe(404);
    expect((await refusal(read(actors.engineer, sweepId, 7, query(), etag))).status).toBe(404);
    expect((await refusal(read(actors.engineer, sweepId, 7, query(), "*"))).status).toBe(404);
  });
});

describe("a running sweep's candidates", () => {
  it("keep a stored scenario's answer with a tag and 304, and read a pending one afresh until its rows arrive", async () => {
    const sweepId = (await submit([0.02, 0.03, 0.04])).id;
    const before = await read(actors.engineer, sweepId, 1);
    expect(before).toMatchObject({ status: 200, etag: null, cacheControl: RUNNING_CACHE_CONTROL });
    expect(bodyOf(before)).toMatchObject({ total: 0, scenario: { status: "pending" } });
    // A pending scenario is read afresh every time: nothing is kept, a tag is never answered with 304.
    expect(await read(actors.engineer, sweepId, 1, query(), '"anything"')).toMatchObject({ status: 200, etag: null, cacheControl: RUNNING_CACHE_CONTROL });

    // Scenarios 0 and 1 arrive; the sweep is still running (scenario 2 is pending).
    expect(await runSweepChunk(t.db, { sweepId, from: 0, to: 2 })).toMatchObject({ written: 2 });
    const after = await read(actors.engineer, sweepId, 1);
    // The pending answer was not kept: the rows show as soon as they are stored.
    expect(after.status).toBe(200);
    expect(bodyOf(after).scenario.status).toBe("succeeded");
    expect(bodyOf(after).total).toBeGreaterThan(0);
    // A stored scenario never changes again, so its answer is kept like a finished sweep's.
    expect(after.etag).toMatch(/^"[^"]+"$/);
    expect(after.cacheControl).toBe(FINAL_CACHE_CONTROL);
    expect(await read(actors.engineer, sweepId, 1, query(), after.etag)).toEqual({ status: 304, etag: after.etag, cacheControl: FINAL_CACHE_CONTROL });
    // Another question about the same scenario has its own tag.
    const sorted = await read(actors.engineer, sweepId, 1, query({ sort: "totalVolume", dir: "desc" }));
    expect(sorted.etag).not.toBeNull();
    expect(sorted.etag).not.toBe(after.etag);

    // Scenario 2 is still pending: read afresh, and its rows show once the worker stores them.
    const pending = await read(actors.engineer, sweepId, 2);
    expect(pending).toMatchObject({ status: 200, etag: null, cacheControl: RUNNING_CACHE_CONTROL });
    expect(bodyOf(pending)).toMatchObject({ total: 0, scenario: { status: "pending" } });

    // Once the last scenario arrives the sweep is finished, and every answer becomes cacheable as soon
    // as the process looks at the sweep's state again (it trusts "running" for a second at most).
    expect(await runSweepChunk(t.db, { sweepId, from: 2, to: 3 })).toMatchObject({ finished: "succeeded" });
    const last = await read(actors.engineer, sweepId, 2);
    expect(last.status).toBe(200);
    expect(bodyOf(last).scenario.status).toBe("succeeded");
    expect(bodyOf(last).total).toBeGreaterThan(0);
    await expect.poll(async () => (await read(actors.engineer, sweepId, 0)).cacheControl, { timeout: 10_000 }).toBe(FINAL_CACHE_CONTROL);
    const finished = await read(actors.engineer, sweepId, 1);
    expect(finished.cacheControl).toBe(FINAL_CACHE_CONTROL);
    // The answer kept while the sweep ran is the one the finished sweep gives.
    expect(bodyOf(finished)).toEqual(bodyOf(after));
  });

  it("keep a stored scenario's answer as strictly as a finished one: another team and a viewer are refused, tag or not", async () => {
    const sweepId = (await submit([0.02, 0.03])).id;
    expect(await runSweepChunk(t.db, { sweepId, from: 0, to: 1 })).toMatchObject({ written: 1 });
    const own = await read(actors.engineer, sweepId, 0);
    expect(own.etag).not.toBeNull();
    const other = await refusal(read(actors.otherTeam, sweepId, 0, query(), own.etag));
    expect(other.status).toBe(404);
    expect(other.message).toMatch(/scenario/);
    // The same answer as for a scenario that does not exist, and as for another team's pending one.
    expect((await refusal(read(actors.otherTeam, sweepId, 1))).status).toBe(404);
    expect((await refusal(read(actors.viewer, sweepId, 0, query(), own.etag))).status).toBe(403);
    expect((await read(actors.manager, sweepId, 0, query(), own.etag)).status).toBe(304);
    // A scenario number past the sweep's end is no such scenario, not a kept answer.
    expect((await refusal(read(actors.engineer, sweepId, 9, query(), own.etag))).status).toBe(404);
  });

  it("of a cancelled sweep are final: the scenarios that never ran stay empty and may be kept", async () => {
    const sweepId = (await submit([0.02, 0.03])).id;
    await cancelSweep(t.db, actors.engineer, sweepId);
    const a = await read(actors.engineer, sweepId, 0);
    expect(a.cacheControl).toBe(FINAL_CACHE_CONTROL);
    expect(bodyOf(a)).toMatchObject({ total: 0, scenario: { status: "pending" } });
    // The worker refuses to write into a cancelled sweep, so the kept answer cannot go stale.
    expect(await runSweepChunk(t.db, { sweepId, from: 0, to: 2 })).toMatchObject({ written: 0 });
    expect(bodyOf(await read(actors.engineer, sweepId, 0)).total).toBe(0);
  });
});
