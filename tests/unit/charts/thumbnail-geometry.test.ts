import { describe, expect, it } from "vitest";
import { chartGeometry, type Point } from "../../../lib/charts/levenspiel-geometry";
import { THUMBNAIL_POINTS, THUMBNAIL_TOP_POINTS, thumbnailPlot, thumbnailYMax } from "../../../lib/charts/thumbnail-plots";
import { applyViewPatch, parseViewState } from "../../../components/sweeps/view-query";
import { rel, height, cstrVolume, pfrVolume, sampled } from "./first-order-closed-forms";


/** A CSTR to X 0.5, then a PFR to 0.9, as the engine's 25-point plots would give them, cut for a thumbnail. */
function train() {
  const stages = [
    { type: "CSTR" as const, conversionIn: 0, conversionOut: 0.5, volume: cstrVolume(0, 0.5) },
    { type: "PFR" as const, conversionIn: 0.5, conversionOut: 0.9, volume: pfrVolume(0.5, 0.9) },
  ];
  const plots = [
    { curve: sampled(0, 0.5), area: [[0, 0], [0, height(0.5)], [0.5, height(0.5)], [0.5, 0]] as Point[] },
    { curve: sampled(0.5, 0.9), area: [[0.5, 0], ...sampled(0.5, 0.9), [0.9, 0]] as Point[] },
  ].map(thumbnailPlot);
  return { stages, plots };
}

describe("the ranked table's thumbnails", () => {
  it("keep each stage's area equal to its closed-form volume with the PFR top sampled coarsely", () => {
    const { stages, plots } = train();
    expect(plots.every((p) => p.curve.length <= THUMBNAIL_POINTS)).toBe(true);
    const curve = plots.flatMap((p) => p.curve as Point[]);
    const geo = chartGeometry({ curve, stages: stages.map((s, i) => ({ ...s, area: plots[i].area as Point[] })), topPoints: THUMBNAIL_TOP_POINTS });
    expect(rel(geo.stages[0].area, cstrVolume(0, 0.5))).toBeLessThan(1e-9);
    expect(rel(geo.stages[1].area, pfrVolume(0.5, 0.9))).toBeLessThan(1e-9);
    // The PFR's top: THUMBNAIL_TOP_POINTS + 1 points along the curve, plus its two base corners.
    expect(geo.stages[1].polygon).toHaveLength(THUMBNAIL_TOP_POINTS + 3);
    // Drawn from 9 points a stage, the top still lies on the true curve 1/(k CA0 (1 - X)) within 1 %.
    for (const [x, y] of geo.stages[1].polygon.filter(([, y]) => y > 0)) expect(rel(y, height(x))).toBeLessThan(0.01);
  });

  it("share one height on a page: the tallest thumbnail's, the same the full chart would take", () => {
    const { stages, plots } = train();
    const short = { feasible: true, stages: stages.slice(0, 1), levenspiel: plots.slice(0, 1) };
    const tall = { feasible: true, stages, levenspiel: plots };
    const infeasible = { feasible: false, stages, levenspiel: null };
    const yMax = thumbnailYMax([short, tall, infeasible])!;
    // The outlet height at X 0.9 is 1/(k CA0 0.1) · FA0 = 0.1667 m3: the scale is the next round value above it (× 1.05).
    expect(yMax).toBeGreaterThanOrEqual(height(0.9));
    expect(yMax).toBe(chartGeometry({ curve: plots.flatMap((p) => p.curve as Point[]), stages: stages.map((s, i) => ({ ...s, area: plots[i].area as Point[] })) }).yMax);
    expect(thumbnailYMax([infeasible])).toBeUndefined();
  });
});

describe("the sweep page's view changes", () => {
  const state = parseViewState(new URLSearchParams("sort=totalVolume&page=3&scenario=4"));

  it("start again at page 1 on any change but paging", () => {
    expect(applyViewPatch(state, { sort: "sequence", dir: "asc" })).toMatchObject({ sort: "sequence", page: 1, scenario: 4 });
    expect(applyViewPatch(state, { scenario: 7 })).toMatchObject({ sort: "totalVolume", page: 1, scenario: 7 });
  });

  it("keep the sort and scenario when paging", () => {
    expect(applyViewPatch(state, { page: 4 })).toMatchObject({ sort: "totalVolume", page: 4, scenario: 4 });
  });
});
