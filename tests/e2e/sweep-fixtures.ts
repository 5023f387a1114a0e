import { expect, type APIRequestContext } from "@playwright/test";

// Invented demo kinetics: second-order liquid esterification with 20 % excess B.
export const SECOND_ORDER = {
  feed: { flowA: 0.02, concA: "1 mol/L", temperature: "66.85 degC", ratios: { B: 1.2 } },
  reaction: { stoichiometry: { A: -1, B: -1, R: 1 }, phase: "liquid", rate: { law: "power", k: 1e-4, orders: { A: 1, B: 1 } } },
};

export async function firstProjectId(ctx: APIRequestContext): Promise<string> {
  const body = (await (await ctx.get("/api/projects")).json()) as { projects: { id: string; name: string }[] };
  return body.projects.find((p) => p.name === "Ester line 3 revamp")!.id;
}

export async function createModel(ctx: APIRequestContext, projectId: string, name = `Kinetics ${Date.now()}`) {
  const res = await ctx.post(`/api/projects/${projectId}/kinetics`, { data: { name, spec: SECOND_ORDER, note: "bench fit 2026-11" } });
  expect(res.status()).toBe(201);
  return (await res.json()) as { model: { id: string }; version: { id: string; version: number } };
}

export async function submitSweep(ctx: APIRequestContext, projectId: string, versionId: string, grid: unknown[] = [], maxStages = 3) {
  const res = await ctx.post(`/api/projects/${projectId}/sweeps`, {
    data: { kineticsVersionId: versionId, target: { conversion: 0.9 }, train: { maxStages, types: ["CSTR", "PFR"] }, grid },
  });
  expect(res.status(), await res.text()).toBe(201);
  return ((await res.json()) as { sweep: { id: string; total: number } }).sweep;
}

// Generous: the one worker finishes the sweeps queued by earlier specs first, on a shared machine.
export async function waitForSweep(ctx: APIRequestContext, sweepId: string, timeoutMs = 120_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const { sweep } = (await (await ctx.get(`/api/sweeps/${sweepId}`)).json()) as { sweep: { status: string; progress: { done: number; total: number } } };
    if (!["queued", "running"].includes(sweep.status)) return sweep;
    if (Date.now() > deadline) throw new Error(`sweep ${sweepId} still ${sweep.status}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

export interface CandidatePage {
  total: number;
  items: { id: string; rank: number; sequence: string[]; totalVolume: number | null; stageCount: number; feasible: boolean }[];
}
