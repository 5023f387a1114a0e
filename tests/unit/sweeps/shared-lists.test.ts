import { describe, expect, expectTypeOf, it } from "vitest";
import { parseViewState, serialiseViewState } from "@/components/sweeps/view-state";
import type { StageType } from "@/lib/engine";
import { candidateQuerySchema } from "@/lib/schemas/sweeps";
import { STAGE_TYPES } from "@/lib/stage-types";
import { SORT_KEYS } from "@/lib/sweeps/sort-keys";

// The sweep page keeps its sort in the URL and sends it to the candidates endpoint; a key one side
// knows and the other does not is a column that silently sorts by rank, or a 400.
const serverKeys = candidateQuerySchema.shape.sort.unwrap().options;

describe("lists shared by the sweep page and the server", () => {
  it("the page keeps exactly the sort keys the candidates endpoint accepts", () => {
    const kept = serverKeys.filter((k) => parseViewState(new URLSearchParams({ sort: k })).sort === k);
    expect(kept).toEqual(serverKeys);
    for (const k of serverKeys) {
      const state = parseViewState(new URLSearchParams({ sort: k }));
      expect(candidateQuerySchema.safeParse({ sort: state.sort }).success).toBe(true);
      // The key survives the round trip through the page's link.
      expect(parseViewState(new URLSearchParams(serialiseViewState(state))).sort).toBe(k);
    }
  });

  it("the list the page offers is the list the endpoint accepts, in the same order", () => {
    expect([...SORT_KEYS]).toEqual(serverKeys);
  });

  it("a key the endpoint refuses falls back to rank on the page", () => {
    const unknown = "volumeOverBest";
    expect(candidateQuerySchema.safeParse({ sort: unknown }).success).toBe(false);
    expect(parseViewState(new URLSearchParams({ sort: unknown })).sort).toBe("rank");
  });

  it("the run-time list of stage types is the engine's StageType", () => {
    expectTypeOf<(typeof STAGE_TYPES)[number]>().toEqualTypeOf<StageType>();
    expect(new Set(STAGE_TYPES).size).toBe(STAGE_TYPES.length);
  });
});
