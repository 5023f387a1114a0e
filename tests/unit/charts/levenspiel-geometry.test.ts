import { describe, expect, it } from "vitest";
import { designTrains, type StageResult } from "../../../lib/engine/index";
import { chartGeometry, shoelace, stagePolygon } from "../../../lib/charts/levenspiel-geometry";
import { fromCubicMetres } from "../../../lib/charts/volume-units";
import { rel, FA0, CA0, K, height, cstrVolume, pfrVolume, sampled } from "./first-order-closed-forms";

const TOL = 1e-6;

describe("Levenspiel chart geometry, first order by closed form", () => {
  const curve = sampled(0, 0.95, 200);

  it("a single CSTR is the rectangle of the outlet height over its span", () => {
    const v = cstrVolume(0, 0.9);
    const g = stagePolygon({ type: "CSTR", conversionIn: 0, conversionOut: 0.9, volume: v }, curve);
    expect(rel(g.area, v)).toBeLessThan(TOL);
    expect(rel(g.outletHeight, height(0.9))).toBeLessThan(TOL);
    const xs = g.polygon.map(([x]) => x);
    expect(Math.min(...xs)).toBe(0);
    expect(Math.max(...xs)).toBe(0.9);
    for (const [, y] of g.polygon) expect(y === 0 || rel(y, height(0.9)) < TOL).toBe(true);
  });

  it("a single PFR is the area under the curve over its span", () => {
    const v = pfrVolume(0, 0.9);
    const g = stagePolygon({ type: "PFR", conversionIn: 0, conversionOut: 0.9, volume: v }, curve);
    expect(rel(g.area, v)).toBeLessThan(TOL);
    expect(Math.abs(shoelace(g.polygon) - v) / v).toBeLessThan(TOL);
    // The top follows the curve: the only correction is the trapezoid error of the sampled curve.
    expect(Math.abs(g.heightScale - 1)).toBeLessThan(1e-3);
    for (const [x, y] of g.polygon.filter(([, y]) => y > 0)) expect(rel(y, height(x))).toBeLessThan(1e-3);
  });

  it("a CSTR then two PFRs: each polygon's area is its closed-form volume and the spans tile the axis", () => {
    const spans: [number, number][] = [[0, 0.5], [0.5, 0.8], [0.8, 0.92]];
    const stages = spans.map(([a, b], i) => ({ type: i === 0 ? ("CSTR" as const) : ("PFR" as const), conversionIn: a, conversionOut: b, volume: i === 0 ? cstrVolume(a, b) : pfrVolume(a, b) }));
    const geo = chartGeometry({ curve: sampled(0, 0.92, 25), stages, target: 0.92 });
    geo.stages.forEach((s, i) => {
      expect(rel(s.area, stages[i].volume)).toBeLessThan(TOL);
      // 25 points over the whole axis, only four in the last span: the outline still keeps within 0.2 % of the curve.
      expect(Math.abs(s.heightScale - 1)).toBeLessThan(2e-3);
    });
    expect(geo.xMax).toBeGreaterThanOrEqual(0.92);
    expect(geo.yMax).toBeGreaterThanOrEqual(height(0.92));
  });

  it("volume units scale by the exact definitions", () => {
    expect(fromCubicMetres(1, "L")).toBe(1000);
    expect(rel(fromCubicMetres(0.003785411784, "gal"), 1)).toBeLessThan(1e-12);
    expect(rel(fromCubicMetres(0.028316846592, "ft3"), 1)).toBeLessThan(1e-12);
  });
});

describe("Levenspiel chart geometry of engine results (designTrains)", () => {
  const result = designTrains({
    feed: { flowA: FA0, concA: CA0 },
    reaction: { rate: { law: "power", k: K, orders: { A: 1 } } },
    target: { conversion: 0.9 },
    train: { maxStages: 3, types: ["CSTR", "PFR"] },
  });
  const feasible = result.candidates.filter((c) => c.feasible);

  it("has every sequence of up to three stages", () => {
    expect(feasible.length).toBe(14);
  });

  for (const c of feasible) {
    it(`${c.sequence.join("-")}: polygon areas equal the engine's stage volumes, which equal the closed forms`, () => {
      const stages = c.stages.map((s: StageResult) => ({ type: s.type, conversionIn: s.conversionIn, conversionOut: s.conversionOut, volume: s.volume, area: s.levenspiel.area }));
      const curve = c.stages.flatMap((s) => s.levenspiel.curve);
      for (const withArea of [true, false]) {
        const geo = chartGeometry({ curve, stages: withArea ? stages : stages.map(({ area: _a, ...s }) => s), target: 0.9 });
        geo.stages.forEach((g, i) => {
          const s = c.stages[i];
          expect(rel(g.area, s.volume)).toBeLessThan(TOL);
          const closed = s.type === "CSTR" ? cstrVolume(s.conversionIn, s.conversionOut) : pfrVolume(s.conversionIn, s.conversionOut);
          expect(rel(s.volume, closed)).toBeLessThan(TOL);
          // The drawn outline sits on the engine's own outline (6-digit rounded points).
          if (s.type === "CSTR") expect(rel(g.outletHeight, s.levenspiel.area[1][1])).toBeLessThan(1e-5);
          else expect(Math.abs(g.heightScale - 1)).toBeLessThan(1e-3);
          expect(g.polygon[0][0]).toBeCloseTo(s.conversionIn, 12);
          expect(g.polygon[1][0]).toBeCloseTo(s.conversionOut, 12);
        });
        const total = geo.stages.reduce((t, g) => t + g.area, 0);
        expect(rel(total, c.totalVolume as number)).toBeLessThan(TOL);
      }
    });
  }
});
