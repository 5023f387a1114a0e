import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { designTrains, EngineError, GAS_CONSTANT, rateTrain, stagePlots, type DesignSpec, type ThermalSpec, type TrainStageType } from "../../../lib/engine/index";
import { rel } from "./helpers";

/*
 * A <=> R, first order both ways, liquid, pure A: -rA = k1(T) C_A0 (1 - X) - k2(T) C_A0 X, with
 * k_i(T) = k_i,ref exp(-E_i/R (1/T - 1/T_ref)) as the engine writes Arrhenius terms (k at a reference
 * temperature). E2 > E1: exothermic (heat of reaction E1 - E2 < 0).
 */
const K1 = 0.004;
const K2 = 4e-5;
const E1 = 60000;
const E2 = 120000;
const TREF = 330;
const FA0 = 0.5;
const CA0 = 1200;

function spec(thermal: ThermalSpec, candidates: TrainStageType[][], target = 0.9): DesignSpec {
  return {
    feed: { flowA: FA0, concA: CA0, temperature: TREF, ratios: { R: 0 } },
    reaction: {
      stoichiometry: { A: -1, R: 1 },
      rate: { law: "power", k: K1, orders: { A: 1 }, activationEnergy: E1, reverse: { k: K2, orders: { R: 1 }, activationEnergy: E2 }, referenceTemperature: TREF },
      thermal,
    },
    target: { conversion: target },
    train: { candidates },
  };
}

const k1 = (t: number) => K1 * Math.exp((-E1 / GAS_CONSTANT) * (1 / t - 1 / TREF));
const k2 = (t: number) => K2 * Math.exp((-E2 / GAS_CONSTANT) * (1 / t - 1 / TREF));
const rate = (x: number, t: number) => CA0 * (k1(t) * (1 - x) - k2(t) * x);

/*
 * d(-rA)/dT = 0 gives k1 E1 (1 - X) = k2 E2 X. With k_i = k_i0 exp(-E_i/RT), k_i0 = k_i,ref exp(E_i/(R T_ref)):
 *   T_opt(X) = (E2 - E1) / (R ln[(k20 E2 X)/(k10 E1 (1 - X))]),
 * and since ln(k20/k10) = ln(k2,ref/k1,ref) + (E2 - E1)/(R T_ref), in the engine's reference form
 *   1/T_opt = 1/T_ref + R/(E2 - E1) ln[(k2,ref E2 X)/(k1,ref E1 (1 - X))].
 * Net rate zero (equilibrium, K = k1/k2 = X/(1 - X)): T_eq(X) = (E2 - E1)/(R ln[(k20 X)/(k10 (1 - X))]).
 */
const k10 = K1 * Math.exp(E1 / (GAS_CONSTANT * TREF));
const k20 = K2 * Math.exp(E2 / (GAS_CONSTANT * TREF));
const tOpt = (x: number) => (E2 - E1) / (GAS_CONSTANT * Math.log((k20 * E2 * x) / (k10 * E1 * (1 - x))));
const tEq = (x: number) => (E2 - E1) / (GAS_CONSTANT * Math.log((k20 * x) / (k10 * (1 - x))));

/** Composite Simpson's rule with n (even) panels, written out here so the check does not use the engine's quadrature. */
function simpson(f: (x: number) => number, a: number, b: number, n = 20000): number {
  const h = (b - a) / n;
  let s = f(a) + f(b);
  for (let i = 1; i < n; i++) s += (i % 2 === 1 ? 4 : 2) * f(a + i * h);
  return (s * h) / 3;
}

const adiabaticFree: ThermalSpec = {
  mode: "adiabatic",
  adiabaticRise: 100,
  maxTemperature: 420,
  interstageTemperature: { min: 300, max: 420 },
  feedTemperature: { min: 300, max: 420 },
};

describe("best temperature path", () => {
  it("follows the closed-form rate-maximising temperature T_opt(X) and the equilibrium line of A <=> R", () => {
    // A wide stage range so that T_opt lies inside it for X >= 0.2.
    const r = designTrains(spec({ mode: "stageTemperature", min: 250, max: 700 }, [["PFR"]]));
    const path = r.reference.bestTemperaturePath;
    expect(path).toBeTruthy();
    if (!path) return;
    let checked = 0;
    for (const p of path.points) {
      if (p.conversion < 0.2) continue;
      // closed form derived from d(-rA)/dT = 0 (above); Brent's minimiser on a flat maximum: 1e-7 relative
      expect(rel(p.temperature, tOpt(p.conversion))).toBeLessThan(1e-7);
      // equilibrium line from K = k1/k2 = X/(1 - X) (common practice)
      expect(rel(p.equilibriumTemperature as number, tEq(p.conversion))).toBeLessThan(1e-10);
      expect(p.temperature).toBeLessThan(p.equilibriumTemperature as number);
      checked++;
    }
    expect(checked).toBeGreaterThan(30);
    // Near the feed T_opt exceeds the range, so the path sits at its top (700 K).
    expect(path.points[0].temperature).toBe(700);
    // The volume against the test's own Simpson integral of FA0/(-rA) along the clipped closed-form path.
    const clipped = (x: number) => Math.min(700, Math.max(250, x > 0 ? tOpt(x) : 700));
    const independent = simpson((x) => FA0 / rate(x, clipped(x)), 0, 0.9);
    expect(rel(path.volume, independent)).toBeLessThan(1e-8);
  });

  it("is absent (null) for an irreversible reaction and for an endothermic one", () => {
    const irreversible: DesignSpec = { ...spec(adiabaticFree, [["PFR", "PFR"]]), reaction: { ...spec(adiabaticFree, []).reaction, rate: { law: "power", k: K1, orders: { A: 1 }, activationEnergy: E1 } } };
    expect(designTrains(irreversible).reference.bestTemperaturePath).toBeNull();
    expect(designTrains(irreversible).candidates[0].volumeOverBestPath).toBeUndefined();
    const endothermic = spec({ mode: "stageTemperature", min: 300, max: 420 }, [["PFR"]]);
    if (endothermic.reaction.rate.law === "power" && endothermic.reaction.rate.reverse) endothermic.reaction.rate.reverse.activationEnergy = 30000;
    expect(designTrains(endothermic).reference.bestTemperaturePath).toBeNull();
  });

  it("is approached from above by adiabatic trains of more and more tubes with free interstage temperatures", () => {
    const ratios: number[] = [];
    let pathVolume = 0;
    for (const n of [2, 3, 4, 6, 8]) {
      const r = designTrains(spec(adiabaticFree, [Array.from({ length: n }, () => "PFR" as const)]));
      const c = r.candidates[0];
      pathVolume = r.reference.bestTemperaturePath?.volume as number;
      expect(rel(c.volumeOverBestPath as number, (c.totalVolume as number) / pathVolume)).toBeLessThan(1e-12);
      ratios.push(c.volumeOverBestPath as number);
      // Every stage respects the maximum temperature and its inlet range.
      for (const s of c.stages) {
        expect(s.temperatureChosen).toBe(true);
        expect(s.temperatureIn).toBeGreaterThanOrEqual(300);
        expect(s.temperatureOut).toBeLessThanOrEqual(420 * (1 + 1e-12));
      }
    }
    // The best path bounds every staged train from below (Levenspiel, Chemical Reaction Engineering, 3rd
    // ed., ch. 9): each ratio above 1, falling with the number of stages, within 6 % at eight stages.
    for (let i = 0; i < ratios.length; i++) {
      expect(ratios[i]).toBeGreaterThan(1);
      if (i > 0) expect(ratios[i]).toBeLessThan(ratios[i - 1]);
    }
    expect(ratios[ratios.length - 1]).toBeLessThan(1.06);
  });
});

describe("stage temperatures as decision variables", () => {
  it("a single stage at its own temperature equals the best isothermal stage of an independent scan", () => {
    // Closed forms (Levenspiel, ch. 5, reversible first order, pure A): with k = k1 + k2,
    // PFR: V = v0/k ln[k1/(k1 - k X)]; CSTR: V = v0 X/(k1 - k X).
    const v0 = FA0 / CA0;
    const x = 0.8;
    const pfr = (t: number) => (v0 / (k1(t) + k2(t))) * Math.log(k1(t) / (k1(t) - (k1(t) + k2(t)) * x));
    const cstr = (t: number) => (v0 * x) / (k1(t) - (k1(t) + k2(t)) * x);
    for (const [type, volume] of [
      ["PFR", pfr],
      ["CSTR", cstr],
    ] as const) {
      // The test's own scan: 0.001 K steps over the range, the feasible points only.
      let best = Infinity;
      let bestT = NaN;
      for (let t = 300; t <= 400 + 1e-9; t += 0.001) {
        const v = volume(t);
        if (Number.isFinite(v) && v > 0 && v < best) {
          best = v;
          bestT = t;
        }
      }
      const c = designTrains(spec({ mode: "stageTemperature", min: 300, max: 400 }, [[type]], x)).candidates[0];
      const st = c.stages[0];
      expect(st.temperatureChosen).toBe(true);
      expect(st.temperatureIn).toBe(st.temperatureOut);
      expect(Math.abs(st.temperatureIn - bestT)).toBeLessThan(2e-3);
      // The scan can only be above the true minimum, and by little at this spacing.
      expect(st.volume).toBeLessThanOrEqual(best * (1 + 1e-12));
      expect(rel(st.volume, best)).toBeLessThan(1e-8);
      // And the engine's volume is the closed form's at the temperature it chose.
      expect(rel(st.volume, volume(st.temperatureIn))).toBeLessThan(1e-9);
    }
  });

  it("freeing a temperature never makes a train worse than at any fixed temperature of the range (property)", () => {
    const sequences: TrainStageType[][] = [
      ["PFR", "PFR"],
      ["CSTR", "PFR"],
      ["PFR", "CSTR", "PFR"],
    ];
    // A fixed temperature at which no train reaches the target is an error for the whole request: every
    // total is then infinite.
    const totals = (s: DesignSpec): Map<string, number> => {
      try {
        return new Map(designTrains(s).candidates.map((c) => [c.sequence.join(" "), c.totalVolume ?? Infinity]));
      } catch (e) {
        if (e instanceof EngineError && (e.code === "infeasible" || e.code === "equilibrium")) return new Map(sequences.map((q) => [q.join(" "), Infinity]));
        throw e;
      }
    };
    const freeInterstage = totals(spec({ mode: "adiabatic", adiabaticRise: 100, maxTemperature: 420, interstageTemperature: { min: 300, max: 400 } }, sequences));
    const freeStages = totals(spec({ mode: "stageTemperature", min: 300, max: 400 }, sequences, 0.85));
    let compared = 0;
    fc.assert(
      fc.property(fc.double({ min: 300, max: 400, noNaN: true }), (t) => {
        // Same train with the interstage temperature fixed at t (the fixed form of the same field).
        const fixed = totals(spec({ mode: "adiabatic", adiabaticRise: 100, maxTemperature: 420, interstageTemperature: t }, sequences));
        // Every stage at the one temperature t.
        const one = totals(spec({ mode: "stageTemperature", min: t, max: t }, sequences, 0.85));
        for (const seq of sequences.map((s) => s.join(" "))) {
          if (Number.isFinite(fixed.get(seq) as number)) compared++;
          expect(freeInterstage.get(seq) as number).toBeLessThanOrEqual((fixed.get(seq) as number) * (1 + 1e-9));
          expect(freeStages.get(seq) as number).toBeLessThanOrEqual((one.get(seq) as number) * (1 + 1e-9));
        }
      }),
      { numRuns: 12, seed: 15 },
    );
    // Not vacuous: most fixed interstage temperatures of the range give feasible trains to compare with.
    expect(compared).toBeGreaterThan(12);
  });

  it("a chosen temperature keeps the fixed-temperature result when the range is a single value", () => {
    const fixed = designTrains(spec({ mode: "adiabatic", adiabaticRise: 100, maxTemperature: 420, interstageTemperature: 350 }, [["CSTR", "PFR", "PFR"]]));
    const single = designTrains(spec({ mode: "adiabatic", adiabaticRise: 100, maxTemperature: 420, interstageTemperature: { min: 350, max: 350 } }, [["CSTR", "PFR", "PFR"]]));
    expect(rel(single.candidates[0].totalVolume as number, fixed.candidates[0].totalVolume as number)).toBeLessThan(1e-9);
    expect(single.candidates[0].stages.map((s) => s.temperatureIn)).toEqual([330, 350, 350]);
    expect(single.candidates[0].stages[0].temperatureChosen).toBeUndefined();
    expect(single.candidates[0].stages[1].temperatureChosen).toBe(true);
  });

  it("reports each chosen stage on its own temperature path, and its plot is redrawn from the stored stage", () => {
    const s = spec(adiabaticFree, [["CSTR", "PFR", "PFR"]]);
    const c = designTrains(s).candidates[0];
    for (const st of c.stages) {
      // Adiabatic line within a stage (common practice): T_out = T_in + rise (X_out - X_in).
      expect(Math.abs(st.temperatureOut - (st.temperatureIn + 100 * (st.conversionOut - st.conversionIn)))).toBeLessThan(1e-9);
      // The CSTR's plot height at its outlet is FA0/(-rA) at the outlet temperature (closed form above).
      if (st.type === "CSTR") expect(rel(st.volume, ((st.conversionOut - st.conversionIn) * FA0) / rate(st.conversionOut, st.temperatureOut))).toBeLessThan(1e-12);
    }
    const redrawn = stagePlots({ feed: s.feed, reaction: s.reaction }, c.stages);
    expect(redrawn).toEqual(c.stages.map((st) => st.levenspiel));
    expect(designTrains(s).cautions.some((w) => w.includes("exchangers and their duty are not sized"))).toBe(true);
  });

  it("refuses what it cannot do, naming the field", () => {
    const err = (f: () => unknown) => {
      try {
        f();
      } catch (e) {
        return e instanceof EngineError ? e.path : String(e);
      }
      return "no error";
    };
    // A chosen feed temperature needs the later stages' inlets given or chosen.
    expect(err(() => designTrains(spec({ mode: "adiabatic", adiabaticRise: 100, feedTemperature: { min: 300, max: 400 } }, [["PFR"]])))).toBe("reaction.thermal.feedTemperature");
    expect(err(() => designTrains(spec({ mode: "stageTemperature", min: 400, max: 300 }, [["PFR"]])))).toBe("reaction.thermal.min");
    // Rating takes temperatures as given.
    const rating = { feed: spec(adiabaticFree, []).feed, reaction: spec(adiabaticFree, []).reaction, stages: [{ type: "PFR" as const, volume: 0.01 }] };
    expect(err(() => rateTrain(rating))).toBe("reaction.thermal.feedTemperature");
    // Past the highest equilibrium conversion within the range (K = X/(1 - X) at 300 K: X = 0.99888).
    expect(err(() => designTrains(spec({ mode: "stageTemperature", min: 300, max: 400 }, [["PFR"]], 0.9995)))).toBe("target.conversion");
    expect(err(() => designTrains({ ...spec(adiabaticFree, [["PFR", "PFR"]]), train: { candidates: [["PFR", "PFR"]], equalVolume: true } }))).toBe("train.equalVolume");
  });
});
