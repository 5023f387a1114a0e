import { describe, expect, it } from "vitest";
import { EngineError, networkPaths, type NetworkPaths, type PathPoint } from "../../../../../lib/engine";
import { firstOrder, liquid, rel } from "../helpers";

const CA0 = 580;
const k1 = 0.8;
const k2 = 0.3;
/** A -> B -> C, both first order, liquid, v0 = 1e-3 m3/s. */
const series = liquid({ A: CA0, B: 0, C: 0 }, [firstOrder("A", "B", k1), firstOrder("B", "C", k2)]);

/** Error of a view, or a failure of the test when there is none. */
function failure(run: () => unknown): EngineError {
  try {
    run();
  } catch (err) {
    if (err instanceof EngineError) return err;
    throw err;
  }
  throw new Error("expected an EngineError");
}

describe("paths of A -> B -> C, first order (liquid)", () => {
  const paths: NetworkPaths = networkPaths(series, "B");

  it("the tube follows the closed form at every point, the feed first", () => {
    expect(paths.key).toBe("A");
    expect(paths.product).toBe("B");
    expect(paths.tube[0]).toMatchObject({ residenceTime: 0, conversion: 0, key: CA0, product: 0 });
    expect(paths.tube).toHaveLength(81);
    for (const q of paths.tube) {
      const t = q.residenceTime;
      // consecutive first-order reactions in plug flow, common practice:
      // C_A = C_A0 e^{-k1 t}, C_B = C_A0 k1/(k2 - k1) (e^{-k1 t} - e^{-k2 t})
      const a = CA0 * Math.exp(-k1 * t);
      const b = ((CA0 * k1) / (k2 - k1)) * (Math.exp(-k1 * t) - Math.exp(-k2 * t));
      expect(Math.abs(q.key - a) / CA0).toBeLessThan(1e-7);
      expect(Math.abs(q.product! - b) / CA0).toBeLessThan(1e-7);
      expect(Math.abs(q.concentrations.C - (CA0 - a - b)) / CA0).toBeLessThan(1e-7);
      expect(q.conversion).toBeCloseTo(1 - a / CA0, 7);
      expect(q.steadyState).toBeUndefined();
      // instantaneous selectivity of B along the path: (k1 C_A - k2 C_B) / (k1 C_A), from the two rates
      expect(rel(q.selectivity!, (k1 * q.key - k2 * q.product!) / (k1 * q.key))).toBeLessThan(1e-9);
    }
  });

  it("the grid is log-spaced from 1e-3 time scales to where ~99.9 % of A is used", () => {
    // time scale of first-order use: C_A0 / (k1 C_A0) = 1/k1
    expect(rel(paths.residenceTimes.from, 1e-3 / k1)).toBeLessThan(1e-12);
    const times = paths.tube.slice(1).map((q) => q.residenceTime);
    expect(times[0]).toBe(paths.residenceTimes.from);
    expect(times[times.length - 1]).toBe(paths.residenceTimes.to);
    const ratios = times.slice(1).map((t, i) => t / times[i]);
    for (const r of ratios) expect(rel(r, ratios[0])).toBeLessThan(1e-9);
    const last = paths.tube[paths.tube.length - 1].conversion;
    // 99.9 % of A is used at t = ln(1000)/k1; the end lies within one coarse step (factor 10^(7/199)) past it
    expect(last).toBeGreaterThanOrEqual(0.999);
    expect(paths.residenceTimes.to).toBeLessThan((Math.log(1000) / k1) * 10 ** (7 / 199) * (1 + 1e-9));
  });

  it("every tank lies on the closed-form locus and has one steady state", () => {
    expect(paths.tanks).toHaveLength(80);
    paths.tanks.forEach((q, i) => {
      const t = q.residenceTime;
      expect(t).toBe(paths.tube[i + 1].residenceTime);
      expect(q.steadyState).toBe(0);
      // consecutive first-order reactions in one stirred tank, common practice:
      // C_A = C_A0/(1 + k1 t), C_B = C_A0 k1 t / ((1 + k1 t)(1 + k2 t))
      expect(rel(q.key, CA0 / (1 + k1 * t))).toBeLessThan(1e-9);
      expect(rel(q.product!, (CA0 * k1 * t) / ((1 + k1 * t) * (1 + k2 * t)))).toBeLessThan(1e-9);
    });
  });

  it("without a wanted product: no product concentration and no selectivity", () => {
    const plain = networkPaths(series, undefined, { points: 12 });
    expect(plain.product).toBeNull();
    expect(plain.tube).toHaveLength(13);
    for (const q of [...plain.tube, ...plain.tanks]) {
      expect(q.product).toBeNull();
      expect(q.selectivity).toBeNull();
    }
  });
});

describe("instantaneous selectivity, A -> B (first order) beside 2A -> C (second order)", () => {
  const ka = 0.05;
  const kb = 2e-4;
  const spec = liquid({ A: 1000, B: 0, C: 0 }, [
    firstOrder("A", "B", ka),
    { stoichiometry: { A: -2, C: 1 }, rate: { law: "power", k: kb, orders: { A: 2 } } },
  ]);
  it("equals k1 / (k1 + 2 k2 C_A) at every tube and tank point", () => {
    // R_B = k1 C_A and -R_A = k1 C_A + 2 k2 C_A^2 (A's coefficient -2 in the second reaction), so the
    // ratio of rates is k1 / (k1 + 2 k2 C_A): parallel reactions of different order, common practice
    const paths = networkPaths(spec, "B", { points: 30 });
    const all: PathPoint[] = [...paths.tube, ...paths.tanks];
    expect(all.length).toBe(61);
    for (const q of all) expect(rel(q.selectivity!, ka / (ka + 2 * kb * q.key))).toBeLessThan(1e-12);
    // along the tube C_A falls, so the selectivity to B rises
    const s = paths.tube.map((q) => q.selectivity!);
    for (let i = 1; i < s.length; i++) expect(s[i]).toBeGreaterThan(s[i - 1]);
  });
});

describe("an equilibrium stops the path where it stops changing", () => {
  it("A <=> B ends near X = K/(1+K), far before the cap", () => {
    const kf = 0.03;
    const K = 3;
    const spec = liquid({ A: 800, B: 0 }, [
      { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: kf, orders: { A: 1 }, reverse: { k: kf / K, orders: { B: 1 } } } },
    ]);
    const paths = networkPaths(spec, "B");
    // equilibrium conversion of A <=> B, first order both ways, common practice: X_e = K/(1+K)
    const last = paths.tube[paths.tube.length - 1];
    expect(Math.abs(last.conversion - K / (1 + K))).toBeLessThan(1e-5);
    expect(paths.residenceTimes.to).toBeLessThan(1e4 / kf / 10);
    // beyond equilibrium nothing more is used: the instantaneous selectivity is undefined there or B is still formed
    for (const q of paths.tube) expect(q.selectivity === null || rel(q.selectivity, 1) < 1e-9).toBe(true);
  });

  it("a longest residence time given caps the grid", () => {
    const paths = networkPaths(series, "B", { maxResidenceTime: 2, points: 20 });
    expect(paths.residenceTimes.to).toBe(2);
    // the grid starts at 1e-3 of the time scale 1/k1 or of the cap, whichever is shorter
    expect(rel(paths.residenceTimes.from, Math.min(1e-3 / k1, 2e-3))).toBeLessThan(1e-12);
  });
});

describe("cubic autocatalysis A + 2B -> 3B with a little B fed: every steady state of every tank", () => {
  // r = k C_A C_B^2; beta = C_B0/C_A0 = 0.05; Da = k t C_A0^2 = 0.04 t
  const spec = liquid({ A: 1000, B: 50 }, [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 4e-8, orders: { A: 1, B: 2 } } }]);
  const beta = 0.05;
  const balance = (x: number, da: number) => da * (1 - x) * (beta + x) ** 2 - x;
  /** Roots of the tank's balance in [0, 1], counted by sign changes on a fine grid (independent of the engine). */
  const rootsAt = (da: number) => {
    let count = 0;
    const n = 200000;
    for (let i = 0; i < n; i++) if (Math.sign(balance(i / n, da)) !== Math.sign(balance((i + 1) / n, da))) count++;
    return count;
  };
  const paths = networkPaths(spec, "B", { points: 60 });

  it("lists as many states at each size as the balance has roots, each a root, lowest conversion first", () => {
    const sizes = [...new Set(paths.tanks.map((q) => q.residenceTime))];
    expect(sizes.length).toBe(60);
    let several = 0;
    for (const t of sizes) {
      const states = paths.tanks.filter((q) => q.residenceTime === t);
      const da = 4e-8 * t * 1000 ** 2;
      expect(states).toHaveLength(rootsAt(da));
      if (states.length > 1) several++;
      states.forEach((q, i) => {
        expect(q.steadyState).toBe(i);
        if (i > 0) expect(q.conversion).toBeGreaterThan(states[i - 1].conversion);
        // the balance x = Da (1 - x)(beta + x)^2 of a stirred tank, common practice
        expect(Math.abs(balance(q.conversion, da))).toBeLessThan(1e-9);
      });
    }
    // the grid crosses the region of three states (Da = 4 lies in it, see cstr-multiplicity.test.ts)
    expect(several).toBeGreaterThan(2);
  });
});

describe("substrate inhibition r = k C_A/(1 + K C_A)^2 written as an expression: every steady state of every tank", () => {
  // k = 1 1/s, K = 1 m3/mol, C_A0 = 20 mol/m3
  const spec = liquid({ A: 20, P: 0 }, [
    { stoichiometry: { A: -1, P: 1 }, rate: { law: "expression", expression: "k * C_A / (1 + K * C_A)^2", parameters: { k: 1, K: "1 m^3/mol" } } },
  ]);
  // the tank balance (C_A0 - C)(1 + C)^2 = k t C, common practice for a stirred tank
  const balance = (c: number, t: number) => (20 - c) * (1 + c) ** 2 - t * c;
  const rootsAt = (t: number) => {
    let count = 0;
    const n = 200000;
    for (let i = 0; i < n; i++) if (Math.sign(balance((20 * i) / n, t)) !== Math.sign(balance((20 * (i + 1)) / n, t))) count++;
    return count;
  };

  it("lists as many states at each size as the balance has roots, each a root", () => {
    const paths = networkPaths(spec, "P");
    const sizes = [...new Set(paths.tanks.map((q) => q.residenceTime))];
    expect(sizes.length).toBe(80);
    let several = 0;
    for (const t of sizes) {
      const states = paths.tanks.filter((q) => q.residenceTime === t);
      expect(states).toHaveLength(rootsAt(t));
      if (states.length > 1) several++;
      states.forEach((q, i) => {
        expect(q.steadyState).toBe(i);
        expect(Math.abs(balance(q.key, t)) / (20 * 21 ** 2)).toBeLessThan(1e-9);
      });
    }
    expect(several).toBeGreaterThan(2);
  });
});

describe("bad chemistry names the field", () => {
  it("a negative rate constant of the second reaction", () => {
    const bad = liquid({ A: CA0, B: 0, C: 0 }, [firstOrder("A", "B", k1), firstOrder("B", "C", -1)]);
    const err = failure(() => networkPaths(bad, "B"));
    expect(err.path).toBe("reactions.1.rate.k");
  });
  it("a wanted product not in the feed", () => {
    expect(failure(() => networkPaths(series, "D")).path).toBe("product");
  });
});
