import { expect, type APIRequestContext } from "@playwright/test";

// Reading a sweep's ranked candidates, from the API and from the table cells.

/** A candidate as the API lists it, with the fields these checks read. */
export interface ListedCandidate {
  rank: number;
  sequence: string[];
  feasible: boolean;
  stages: { volume: number; conversionOut: number }[];
  installedCost?: number | null;
  allNewCost?: number | null;
}

export async function listCandidates(ctx: APIRequestContext, sweepId: string, query = "sort=rank&dir=asc&pageSize=25"): Promise<ListedCandidate[]> {
  const res = await ctx.get(`/api/sweeps/${sweepId}/scenarios/0/candidates?${query}`);
  expect(res.status()).toBe(200);
  return ((await res.json()) as { items: ListedCandidate[] }).items;
}

/** Stages that do no work: a conversion step below 1e-6 (docs/engine.md, "Ranking"). */
export function emptyStageCount(c: ListedCandidate): number {
  let before = 0;
  let empty = 0;
  for (const st of c.stages) {
    if (st.conversionOut - before < 1e-6) empty++;
    before = st.conversionOut;
  }
  return empty;
}

/** The leading number of a table cell ("1,234.5 L" -> 1234.5); NaN for "—". */
export function leadingNumber(text: string): number {
  const m = /-?[0-9][0-9,]*(\.[0-9]+)?([eE][+-]?[0-9]+)?/.exec(text);
  return m ? Number(m[0].replace(/,/g, "")) : NaN;
}
