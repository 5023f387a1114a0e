import { describe, expect, it } from "vitest";
import { bestProduct, pathSeries, residenceTimeAt, selectivityRange, selectivitySeries, timeUnitFor, type PathPointView, type PathsView } from "@/components/kinetics/network-chart-data";

// A → B → C, first order, in a single tube from C_A0 with no B fed (Levenspiel, Chemical Reaction
// Engineering, 3rd ed., ch. 8): C_A = C_A0 e^(-k1 τ), C_B = C_A0 k1/(k2 - k1) (e^(-k1 τ) - e^(-k2 τ)),
// C_B,max/C_A0 = (k1/k2)^(k2/(k2-k1)) at τ = ln(k2/k1)/(k2 - k1).
const k1 = 0.02;
const k2 = 0.005;
const CA0 = 1000; // mol/m3
function tubeAt(tau: number): PathPointView {
  const a = CA0 * Math.exp(-k1 * tau);
  const b = ((CA0 * k1) / (k2 - k1)) * (Math.exp(-k1 * tau) - Math.exp(-k2 * tau));
  return { residenceTime: tau, conversion: 1 - a / CA0, key: a, product: b, selectivity: (k1 * a - k2 * b) / (k1 * a) };
}
const grid = Array.from({ length: 2001 }, (_, i) => i * 0.5); // 0 … 1000 s every 0.5 s
const tube = grid.map(tubeAt);

describe("live chart readouts of several reactions", () => {
  it("the best product concentration along a tube is the closed-form maximum, at its residence time", () => {
    const best = bestProduct(tube)!;
    const cbMax = CA0 * (k1 / k2) ** (k2 / (k2 - k1));
    const tauMax = Math.log(k2 / k1) / (k2 - k1);
    expect(Math.abs(best.product / cbMax - 1)).toBeLessThan(1e-7);
    expect(Math.abs(best.residenceTime - tauMax)).toBeLessThan(0.01);
    expect(best.conversion).toBeCloseTo(1 - Math.exp(-k1 * best.residenceTime), 5); // read linearly between points
  });

  it("refines the peak between grid points: on a coarse log-spaced grid the readout is ten times closer to the closed form than the best point", () => {
    const coarse = Array.from({ length: 81 }, (_, i) => 0.05 * (20000 / 0.05) ** (i / 80)).map(tubeAt);
    const best = bestProduct(coarse)!;
    const cbMax = CA0 * (k1 / k2) ** (k2 / (k2 - k1));
    const gridBest = Math.max(...coarse.map((p) => p.product!));
    expect(Math.abs(gridBest / cbMax - 1)).toBeGreaterThan(1e-3);
    expect(Math.abs(best.product / cbMax - 1)).toBeLessThan(2e-4);
    expect(best.residenceTime / (Math.log(k2 / k1) / (k2 - k1))).toBeCloseTo(1, 2);
  });

  it("no product, no best", () => {
    expect(bestProduct(tube.map((p) => ({ ...p, product: null })))).toBeNull();
  });

  it("residence time to a conversion, interpolated: first order in plug flow reaches 90 % at ln(10)/k (common practice)", () => {
    expect(residenceTimeAt(tube, 0.9)).toBeCloseTo(Math.log(10) / k1, 2);
    expect(residenceTimeAt(tube.slice(0, 10), 0.9)).toBeNull();
  });

  it("picks a readable time unit", () => {
    expect(timeUnitFor(120)).toBe("s");
    expect(timeUnitFor(1200)).toBe("min");
    expect(timeUnitFor(72000)).toBe("h");
  });

  it("draws the paths in the engineer's units, further steady states as marks only", () => {
    const paths: PathsView = {
      key: "A",
      product: "B",
      tube: [tubeAt(0), tubeAt(50)],
      tanks: [
        { residenceTime: 10, conversion: 0.1, key: 900, product: 90, selectivity: 1 },
        { residenceTime: 20, conversion: 0.15, key: 850, product: 140, selectivity: 1, steadyState: 0 },
        { residenceTime: 20, conversion: 0.8, key: 200, product: 500, selectivity: 0.8, steadyState: 1 },
      ],
    };
    const [t, tanks, states] = pathSeries(paths, "mol/L", "s");
    expect(t!.points[0]!.x).toBe(1); // 1000 mol/m3 = 1 mol/L
    expect(t!.points[0]!.y).toBeCloseTo(0, 12);
    expect(tanks!.points.map((p) => p.x)).toEqual([0.9, 0.85]);
    expect(states).toMatchObject({ label: "Further steady states of a tank", line: false, points: [{ x: 0.2, y: 0.5 }] });
    const noProduct = pathSeries({ ...paths, product: null }, "mol/L", "min");
    expect(noProduct[0]!.points[1]).toEqual({ x: 50 / 60, y: tubeAt(50).key / 1000 });
  });

  it("selectivity along the tube leaves out points where the key reactant is not consumed", () => {
    const s = selectivitySeries({ key: "A", product: "B", tube: [tubeAt(0), { ...tubeAt(10), selectivity: null }], tanks: [] }, "mol/m3");
    expect(s[0]!.points).toEqual([{ x: 1000, y: 1 }]);
  });

  it("the selectivity axis stops at −1 so the useful part is not flattened", () => {
    const along = selectivitySeries({ key: "A", product: "B", tube, tanks: [] }, "mol/L");
    expect(Math.min(...along[0]!.points.map((p) => p.y))).toBeLessThan(-10); // A → B → C far along: B is used faster than A
    expect(selectivityRange(along)).toEqual({ range: [-1, 1.04], cut: true });
    expect(selectivityRange([{ id: "s", label: "s", tone: "muted", points: [{ x: 1, y: 0.4 }] }])).toEqual({ range: [0, 1.04], cut: false });
  });
});
