import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { designTrains, rateTrain, type DesignSpec, type TrainStageType } from "../../../lib/engine/index";
import { rel } from "./helpers";

/** A + R -> 2R with -rA = k C_A C_R, liquid, isothermal; theta = C_R0/C_A0 (0: pure A). */
function autocatalytic(opts: { theta: number; target: number; candidates: TrainStageType[][]; recycleRatio?: number; k?: number; ca0?: number; fa0?: number }): DesignSpec {
  return {
    feed: { flowA: opts.fa0 ?? 1, concA: opts.ca0 ?? 1, ratios: { R: opts.theta } },
    reaction: { stoichiometry: { A: -1, R: 1 }, rate: { law: "power", k: opts.k ?? 1, orders: { A: 1, R: 1 } } },
    target: { conversion: opts.target },
    train: { candidates: opts.candidates, ...(opts.recycleRatio !== undefined ? { recycleRatio: opts.recycleRatio } : {}) },
  };
}

/** Composite Simpson's rule with n (even) panels, written out here so the check does not use the engine's quadrature. */
function simpson(f: (x: number) => number, a: number, b: number, n = 20000): number {
  const h = (b - a) / n;
  let s = f(a) + f(b);
  for (let i = 1; i < n; i++) s += (i % 2 === 1 ? 4 : 2) * f(a + i * h);
  return (s * h) / 3;
}

/** Bisection for a sign change of f on [lo, hi]. */
function bisect(f: (x: number) => number, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  const fa = f(a);
  for (let i = 0; i < 200 && b - a > 1e-15 * Math.max(1, b); i++) {
    const m = 0.5 * (a + b);
    if (Math.sign(f(m)) === Math.sign(fa)) a = m;
    else b = m;
  }
  return 0.5 * (a + b);
}

function single(spec: DesignSpec, sequence: TrainStageType[]) {
  const c = designTrains(spec).candidates.find((cand) => cand.sequence.join(" ") === sequence.join(" "));
  if (!c || !c.feasible) throw new Error(`no feasible ${sequence.join(" ")}`);
  return c;
}

describe("tube with recycle", () => {
  it("at the chosen recycle ratio 1/(-rA) at the tube's inlet equals its mean over the tube", () => {
    for (const [theta, target] of [
      [0, 0.9],
      [0.02, 0.95],
      [0.1, 0.8],
    ]) {
      const c = single(autocatalytic({ theta, target, candidates: [["PFR-recycle"]] }), ["PFR-recycle"]);
      const st = c.stages[0];
      const R = st.recycleRatio as number;
      expect(R).toBeGreaterThan(0);
      const x1 = (R * target) / (R + 1);
      expect(rel(st.levenspiel.recycle?.inletConversion as number, x1)).toBeLessThan(1e-12);
      // FA0/(-rA) = 1/((1 - X)(theta + X)) with FA0 = CA0 = k = 1.
      const h = (x: number) => 1 / ((1 - x) * (theta + x));
      const mean = simpson(h, x1, target) / (target - x1);
      // Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 6: at the optimal recycle ratio the height
      // 1/(-rA) at the reactor's inlet equals its mean over the reactor.
      expect(rel(h(x1), mean)).toBeLessThan(1e-8);
      // and the rectangle over [X_in, X_out] at that mean height is the volume (the same chapter's figure)
      expect(rel(st.volume, mean * target)).toBeLessThan(1e-8);
    }
  });

  it("A + R -> 2R from pure A to X = 0.9: the recycle ratio and k tau C_A0 of an independent root finder and quadrature", () => {
    // Independent computation: k tau C_A0 = (R + 1) integral from X1 to 0.9 of dX/(X (1 - X)), X1 = R 0.9/(R + 1);
    // dV/dR = 0 where (0.9 - X1)/(X1 (1 - X1)) = integral (Levenspiel, ch. 6); bisection on R, composite
    // Simpson for the integral. It gives R = 0.429945 and k tau C_A0 = 4.55978 (also 4.55978 from the closed
    // form (R + 1) ln[0.9 (1 - X1)/(0.1 X1)]).
    const xf = 0.9;
    const h = (x: number) => 1 / (x * (1 - x));
    const inlet = (R: number) => (R * xf) / (R + 1);
    const stationary = (R: number) => h(inlet(R)) * (xf - inlet(R)) - simpson(h, inlet(R), xf);
    const R = bisect(stationary, 1e-6, 10);
    const ktau = (R + 1) * simpson(h, inlet(R), xf);
    expect(R).toBeCloseTo(0.429945, 5);
    expect(ktau).toBeCloseTo(4.55978, 4);
    expect(rel(ktau, (R + 1) * Math.log((xf * (1 - inlet(R))) / ((1 - xf) * inlet(R))))).toBeLessThan(1e-10);

    // The engine, with k = 2e-3 m3/(mol s), C_A0 = 500 mol/m3, FA0 = 0.5 mol/s (so k tau C_A0 is not the volume).
    const k = 2e-3;
    const ca0 = 500;
    const fa0 = 0.5;
    const spec = autocatalytic({ theta: 0, target: xf, k, ca0, fa0, candidates: [["PFR-recycle"], ["PFR"], ["CSTR"]] });
    const r = designTrains(spec);
    const c = r.candidates.find((cand) => cand.sequence[0] === "PFR-recycle")!;
    const st = c.stages[0];
    expect(rel(st.recycleRatio as number, R)).toBeLessThan(1e-7);
    expect(rel(k * st.residenceTime * ca0, ktau)).toBeLessThan(1e-8);
    // From pure A a plain tube cannot start (the rate is zero at X = 0); the stirred tank can (common practice).
    expect(r.candidates.find((cand) => cand.sequence[0] === "PFR")!.feasible).toBe(false);
    // stirred tank closed form k tau C_A0 = X/((1 - X) X) = 1/(1 - X) = 10 (Levenspiel, ch. 5)
    expect(rel(k * r.candidates.find((cand) => cand.sequence[0] === "CSTR")!.stages[0].residenceTime * ca0, 10)).toBeLessThan(1e-10);
    expect(r.candidates[0].sequence).toEqual(["PFR-recycle"]);
    expect(r.cautions.some((c) => c.includes("tube with recycle"))).toBe(true);
  });

  it("a recycle ratio of 0 gives the plain tube and a very large one the stirred tank", () => {
    // first order, -rA = k C_A: tube k tau = -ln(1 - X), tank k tau = X/(1 - X) (Levenspiel, ch. 5); the limits
    // of the recycle reactor at R = 0 and R -> infinity (common practice).
    const spec = (recycleRatio: number): DesignSpec => ({
      feed: { flowA: 1, concA: 1 },
      reaction: { rate: { law: "power", k: 0.5, orders: { A: 1 } } },
      target: { conversion: 0.9 },
      train: { candidates: [["PFR-recycle"]], recycleRatio },
    });
    const tube = single(spec(0), ["PFR-recycle"]).stages[0];
    expect(rel(0.5 * tube.residenceTime, -Math.log(0.1))).toBeLessThan(1e-10);
    expect(tube.recycleRatio).toBe(0);
    const tank = single(spec(1e6), ["PFR-recycle"]).stages[0];
    // (R + 1) ln(1 + X/((R + 1)(1 - X))) = 9 - 81/(2 (R + 1)) + ...: within 5e-6 relative at R = 1e6
    expect(rel(0.5 * tank.residenceTime, 9)).toBeLessThan(1e-5);
    expect(0.5 * tank.residenceTime).toBeLessThan(9);
    // Chosen freely, first order needs no recycle: the plain tube is best (Levenspiel, ch. 6).
    expect(single({ ...spec(0), train: { candidates: [["PFR-recycle"]] } }, ["PFR-recycle"]).stages[0].recycleRatio).toBe(0);
  });

  it("rating: a designed tube with recycle rated at its volume and ratio reaches the design's outlet; R = 0 and 1e6 rate as tube and tank", () => {
    const spec = autocatalytic({ theta: 0.05, target: 0.92, candidates: [["CSTR", "PFR-recycle"], ["PFR-recycle", "PFR"]] });
    for (const c of designTrains(spec).candidates) {
      const rated = rateTrain({
        feed: spec.feed,
        reaction: spec.reaction,
        stages: c.stages.map((s) => ({ type: s.type, volume: s.volume, ...(s.recycleRatio !== undefined ? { recycleRatio: s.recycleRatio } : {}) })),
      });
      expect(Math.abs(rated.conversionOut - 0.92)).toBeLessThan(1e-8);
      c.stages.forEach((s, k) => expect(rated.stages[k].recycleRatio).toBe(s.recycleRatio));
    }
    // first order at k tau = 2: tube X = 1 - exp(-2), tank X = 2/3 (Levenspiel, ch. 5)
    const first = { feed: { flowA: 1, concA: 1 }, reaction: { rate: { law: "power" as const, k: 1, orders: { A: 1 } } } };
    expect(Math.abs(rateTrain({ ...first, stages: [{ type: "PFR-recycle", volume: 2, recycleRatio: 0 }] }).conversionOut - (1 - Math.exp(-2)))).toBeLessThan(1e-10);
    expect(Math.abs(rateTrain({ ...first, stages: [{ type: "PFR-recycle", volume: 2, recycleRatio: 1e6 }] }).conversionOut - 2 / 3)).toBeLessThan(1e-6);
  });

  it("gas with expansion, fixed ratio: the recycle reactor's first-order form with epsilon", () => {
    // A -> 2B, pure A, epsilon = 1: FA0 integral of dX/(-rA) = v0/k [(1 + eps) ln((1 - X1)/(1 - X)) - eps (X - X1)]
    // (Levenspiel, ch. 5 for the integral, ch. 6 for the recycle reactor: V = (R + 1) times it from X1).
    const R = 2;
    const X = 0.8;
    const spec: DesignSpec = {
      feed: { flowA: 1, concA: 40 },
      reaction: { phase: "gas", stoichiometry: { A: -1, B: 2 }, rate: { law: "power", k: 0.3, orders: { A: 1 } } },
      target: { conversion: X },
      train: { candidates: [["PFR-recycle"]], recycleRatio: R },
    };
    const st = single(spec, ["PFR-recycle"]).stages[0];
    const x1 = (R * X) / (R + 1);
    const expected = ((R + 1) / 0.3) * (2 * Math.log((1 - x1) / (1 - X)) - (X - x1));
    expect(rel(st.residenceTime, expected)).toBeLessThan(1e-10);
  });

  it("Levenspiel geometry: the rectangle over [X_in, X_out] and the area under the curve from X_1, stretched by R + 1, are the volume", () => {
    const c = single(autocatalytic({ theta: 0.01, target: 0.9, candidates: [["CSTR", "PFR-recycle"]] }), ["CSTR", "PFR-recycle"]);
    const st = c.stages[1];
    const area = (pts: [number, number][]) => Math.abs(pts.reduce((s, [x, y], i) => { const [x2, y2] = pts[(i + 1) % pts.length]; return s + x * y2 - x2 * y; }, 0)) / 2;
    const plot = st.levenspiel;
    expect(rel(area(plot.area), st.volume)).toBeLessThan(2e-6);
    // the polygon through 25 curve points is a trapezoid rule: coarse, but within 2e-3 here
    expect(rel((1 + (st.recycleRatio as number)) * area(plot.recycle!.underCurve), st.volume)).toBeLessThan(2e-3);
    expect(plot.recycle!.inletConversion).toBeGreaterThanOrEqual(st.conversionIn);
  });

  it("refuses a negative recycle ratio, a ratio on a rated stage of another type, and equal volumes with a tube with recycle", () => {
    const spec = autocatalytic({ theta: 0.1, target: 0.8, candidates: [["PFR-recycle"]], recycleRatio: -1 });
    expect(() => designTrains(spec)).toThrow(expect.objectContaining({ path: "train.recycleRatio", code: "invalid-spec" }));
    const eq = autocatalytic({ theta: 0.1, target: 0.8, candidates: [["PFR-recycle"]] });
    expect(() => designTrains({ ...eq, train: { ...eq.train, equalVolume: true } })).toThrow(expect.objectContaining({ path: "train.equalVolume" }));
    const first = { feed: { flowA: 1, concA: 1 }, reaction: { rate: { law: "power" as const, k: 1, orders: { A: 1 } } } };
    expect(() => rateTrain({ ...first, stages: [{ type: "PFR", volume: 1, recycleRatio: 1 }] })).toThrow(expect.objectContaining({ path: "stages.0.recycleRatio" }));
    expect(() => rateTrain({ ...first, stages: [{ type: "PFR-recycle", volume: 1 }] })).toThrow(expect.objectContaining({ path: "stages.0.recycleRatio" }));
    // Without a tube with recycle among the candidates, a rate of zero at the feed is still refused.
    expect(() => designTrains(autocatalytic({ theta: 0, target: 0.9, candidates: [["CSTR"]] }))).toThrow(expect.objectContaining({ path: "reaction.rate" }));
  });

  it("adiabatic reversible with interstage cooling: the inlet-height condition on each stage's own path, and the grid's resolution", () => {
    // tests/fixtures/specs/adiabatic-reversible-cooling.json: A <=> R, k = 0.004 1/s (60 kJ/mol), k_r = 4e-5 1/s
    // (120 kJ/mol) at 330 K, rise 100 K, each later stage reset to 330 K, limit 420 K.
    const spec: DesignSpec = {
      feed: { flowA: 0.5, concA: 1200, temperature: 330, ratios: { R: 0 } },
      reaction: {
        stoichiometry: { A: -1, R: 1 },
        rate: { law: "power", k: 0.004, orders: { A: 1 }, activationEnergy: 60000, reverse: { k: 0.00004, orders: { R: 1 }, activationEnergy: 120000 }, referenceTemperature: 330 },
        thermal: { mode: "adiabatic", adiabaticRise: 100, interstageTemperature: 330, maxTemperature: 420 },
      },
      target: { conversion: 0.9 },
      train: { maxStages: 3, types: ["CSTR", "PFR", "PFR-recycle"] },
    };
    const r = designTrains(spec);
    const gas = 8.314462618;
    const arrhenius = (k: number, e: number, t: number) => k * Math.exp((-e / gas) * (1 / t - 1 / 330));
    let checked = 0;
    for (const c of r.candidates) {
      c.stages.forEach((st, i) => {
        const R = st.recycleRatio;
        if (st.type !== "PFR-recycle" || R === undefined || R <= 0 || R >= 1000 || st.conversionOut - st.conversionIn < 1e-6) return;
        const a = st.conversionIn;
        // the stage's own adiabatic line: from the feed's 330 K for the first stage, from the reset 330 K after
        const temperature = (x: number) => 330 + 100 * (x - (i === 0 ? 0 : a));
        const h = (x: number) => 0.5 / (1200 * (arrhenius(0.004, 60000, temperature(x)) * (1 - x) - arrhenius(0.00004, 120000, temperature(x)) * x));
        const x1 = a + (R / (R + 1)) * (st.conversionOut - a);
        // Levenspiel, ch. 6: at the optimal recycle ratio the inlet height equals the mean height over the tube
        expect(rel(h(x1), simpson(h, x1, st.conversionOut) / (st.conversionOut - x1))).toBeLessThan(1e-7);
        checked++;
      });
    }
    expect(checked).toBeGreaterThan(5);
    // every feasible train against a run on a 1024-point grid (the refinement, not the grid, sets the answer)
    const fine = new Map(designTrains(spec, { gridPoints: 1024 }).candidates.map((c) => [c.sequence.join(" "), c]));
    for (const c of r.candidates) if (c.feasible) expect(rel(c.totalVolume as number, fine.get(c.sequence.join(" "))!.totalVolume as number)).toBeLessThan(1e-9);
  });

  it("property: the chosen recycle ratio is never worse than any fixed ratio of a grid", () => {
    const grid = [0, 0.05, 0.2, 0.5, 1, 2, 5, 20];
    fc.assert(
      fc.property(fc.oneof(fc.constant(0), fc.double({ min: 1e-4, max: 0.3, noNaN: true })), fc.double({ min: 0.5, max: 0.97, noNaN: true }), (theta, target) => {
        const chosen = single(autocatalytic({ theta, target, candidates: [["PFR-recycle"], ["CSTR", "PFR-recycle"]] }), ["PFR-recycle"]).totalVolume as number;
        for (const R of grid) {
          // (a tank beside it keeps the request feasible when a fixed R = 0 cannot start from pure A)
          const fixed = designTrains(autocatalytic({ theta, target, candidates: [["PFR-recycle"], ["CSTR"]], recycleRatio: R })).candidates.find((c) => c.sequence[0] === "PFR-recycle")!;
          if (fixed.feasible) expect(chosen).toBeLessThanOrEqual((fixed.totalVolume as number) * (1 + 1e-9));
        }
      }),
      { numRuns: 25, seed: 15 },
    );
  });

  it("in a sweep of every sequence, a train with a tube with recycle is never worse than the same train with a plain tube in its place", () => {
    const spec: DesignSpec = {
      ...autocatalytic({ theta: 0.03, target: 0.95, candidates: [] }),
      train: { maxStages: 3, types: ["CSTR", "PFR", "PFR-recycle"] },
    };
    const r = designTrains(spec);
    expect(r.candidates).toHaveLength(3 + 9 + 27);
    const byKey = new Map(r.candidates.map((c) => [c.sequence.join(" "), c]));
    for (const c of r.candidates) {
      if (!c.sequence.includes("PFR-recycle") || !c.feasible) continue;
      const plain = byKey.get(c.sequence.map((t) => (t === "PFR-recycle" ? "PFR" : t)).join(" "))!;
      // Within 1e-6: where the grid lets a tube with recycle at its largest ratio (1000) stand in for a
      // stirred tank, it is that tank only to within about 1/R of the tank's own height change (2.8e-8 seen).
      if (plain.feasible) expect(c.totalVolume as number).toBeLessThanOrEqual((plain.totalVolume as number) * (1 + 1e-6));
      for (const s of c.stages) if (s.type === "PFR-recycle") expect(s.recycleRatio).toBeGreaterThanOrEqual(0);
    }
  });
});
