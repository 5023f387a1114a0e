import { describe, expect, it } from "vitest";
import { designTrains, type DesignSpec } from "../../../lib/engine/index";
import { chartGeometry } from "../../../lib/charts/levenspiel-geometry";
import { thumbnailPlot, THUMBNAIL_TOP_POINTS } from "../../../lib/charts/thumbnail-plots";
import { chartInputs } from "../../../components/charts/candidate-chart-data";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

// A + R -> 2R, liquid, isothermal, -rA = k CA CR = k CA0^2 (1 - X)(theta + X).
const FA0 = 0.2; // mol/s
const CA0 = 800; // mol/m3
const K = 2e-6; // m3/(mol s)
const THETA = 0.02;

function spec(candidates: DesignSpec["train"] extends infer T ? (T extends { candidates: infer C } ? C : never) : never, target: number): DesignSpec {
  return {
    feed: { flowA: FA0, concA: CA0, ratios: { R: THETA } },
    reaction: { stoichiometry: { A: -1, R: 1 }, rate: { law: "power", k: K, orders: { A: 1, R: 1 } } },
    target: { conversion: target },
    train: { candidates },
  };
}

/**
 * Design equation of the tube with recycle (Levenspiel, ch. 6) in closed form for this rate law:
 * V = (R + 1) FA0/(k CA0^2) ∫_{X1}^{Xf} dX/((1 - X)(theta + X)), and by partial fractions the integral is
 * ln[(theta + Xf)(1 - X1) / ((1 - Xf)(theta + X1))] / (1 + theta).
 */
function closedFormVolume(x1: number, xf: number, r: number): number {
  const integral = Math.log(((THETA + xf) * (1 - x1)) / ((1 - xf) * (THETA + x1))) / (1 + THETA);
  return ((r + 1) * FA0 * integral) / (K * CA0 * CA0);
}

function recycleChart(sequence: ("CSTR" | "PFR" | "PFR-recycle")[], target: number, thumbnail = false) {
  const c = designTrains(spec([sequence], target)).candidates[0]!;
  expect(c.feasible).toBe(true);
  const plots = c.stages.map((s) => (thumbnail ? thumbnailPlot(s.levenspiel) : s.levenspiel));
  return { c, geo: chartGeometry({ ...chartInputs(c.stages, plots), target, ...(thumbnail ? { topPoints: THUMBNAIL_TOP_POINTS } : {}) }) };
}

describe("Levenspiel chart of a tube with recycle", () => {
  it("draws the rectangle over [X_in, X_out] whose area is the stage volume, and the closed form agrees", () => {
    const { c, geo } = recycleChart(["PFR-recycle"], 0.9);
    const s = c.stages[0]!;
    const drawn = geo.stages[0]!;
    // Rectangle: area = volume (the design equation, Levenspiel ch. 6), to round-off.
    expect(rel(drawn.area, s.volume)).toBeLessThan(1e-12);
    const heights = new Set(drawn.polygon.filter(([, y]) => y > 0).map(([, y]) => y));
    expect(heights.size).toBe(1);
    // The volume itself against the closed form at the design's own R and X_1.
    const r = s.recycleRatio!;
    const x1 = (s.conversionIn + r * s.conversionOut) / (r + 1);
    expect(r).toBeGreaterThan(0);
    expect(rel(s.volume, closedFormVolume(x1, 0.9, r))).toBeLessThan(1e-8);
  });

  it("draws the area under the curve over the tube, from X_1 to X_out, as the volume / (R + 1)", () => {
    const { c, geo } = recycleChart(["PFR-recycle"], 0.9);
    const s = c.stages[0]!;
    const under = geo.stages[0]!.underCurve!;
    const r = s.recycleRatio!;
    expect(under.recycleRatio).toBe(r);
    expect(rel(under.inletConversion, (s.conversionIn + r * s.conversionOut) / (r + 1))).toBeLessThan(1e-12);
    expect(rel(under.area * (r + 1), s.volume)).toBeLessThan(1e-12);
    // Its outline follows FA0/(-rA) (scaled only by the sampling's error): the top at the outlet is the curve's height there.
    const xf = s.conversionOut;
    const heightAt = (x: number) => FA0 / (K * CA0 * CA0 * (1 - x) * (THETA + x));
    const outletTop = under.polygon.find(([x, y]) => x === xf && y > 0)!;
    expect(rel(outletTop[1], heightAt(xf))).toBeLessThan(1e-3);
    // At the optimum the height at the tube's inlet equals the mean over the tube, i.e. the rectangle's height (Levenspiel, ch. 6).
    const inletTop = under.polygon.find(([x, y]) => x === under.inletConversion && y > 0)!;
    expect(rel(inletTop[1], geo.stages[0]!.outletHeight)).toBeLessThan(1e-3);
  });

  it("keeps both areas in a train and in the ranked table's thumbnail", () => {
    for (const thumbnail of [false, true]) {
      const { c, geo } = recycleChart(["CSTR", "PFR-recycle"], 0.95, thumbnail);
      const s = c.stages[1]!;
      expect(rel(geo.stages[1]!.area, s.volume)).toBeLessThan(1e-12);
      expect(rel(geo.stages[1]!.underCurve!.area * (s.recycleRatio! + 1), s.volume)).toBeLessThan(1e-12);
      expect(geo.stages[0]!.underCurve).toBeUndefined();
      // The axis reaches the highest point drawn, the tube's area included.
      expect(geo.yMax).toBeGreaterThanOrEqual(Math.max(...geo.stages[1]!.underCurve!.polygon.map(([, y]) => y)));
    }
  });
});
