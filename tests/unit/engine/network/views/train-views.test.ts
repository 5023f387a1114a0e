import { describe, expect, it } from "vitest";
import { designNetwork, EngineError, networkTrainProfiles, rateNetworkTrain, type NetworkDesignSpec } from "../../../../../lib/engine";
import fixture from "../../../../fixtures/specs/network-three-reactions.json";
import { firstOrder, liquid, rel } from "../helpers";

const CA0 = 580;
const k1 = 0.8;
const k2 = 0.3;
const v0 = 1e-3;
/** A -> B -> C, both first order, liquid, v0 = 1e-3 m3/s. */
const series = liquid({ A: CA0, B: 0, C: 0 }, [firstOrder("A", "B", k1), firstOrder("B", "C", k2)]);

/** Tank of residence time t on a feed (a, b): consecutive first-order reactions, common practice. */
function tank(a: number, b: number, t: number) {
  const A = a / (1 + k1 * t);
  return { A, B: (b + k1 * t * A) / (1 + k2 * t) };
}
/** Tube of residence time t on a feed (a, b): consecutive first-order reactions in plug flow, common practice. */
function tube(a: number, b: number, t: number) {
  return { A: a * Math.exp(-k1 * t), B: b * Math.exp(-k2 * t) + ((a * k1) / (k2 - k1)) * (Math.exp(-k1 * t) - Math.exp(-k2 * t)) };
}

describe("profile of a CSTR then a PFR, A -> B -> C", () => {
  const t1 = 1.5;
  const t2 = 2.2;
  const profiles = networkTrainProfiles(series, [
    { type: "CSTR", volume: t1 * v0 },
    { type: "PFR", volume: t2 * v0 },
  ]);
  const [cstr, pfr] = profiles.stages;

  it("the tank steps to the closed form at its start and stays there", () => {
    expect(profiles.species).toEqual(["A", "B", "C"]);
    expect(cstr.type).toBe("CSTR");
    expect(cstr.startResidenceTime).toBe(0);
    expect(rel(cstr.endResidenceTime, t1)).toBeLessThan(1e-12);
    expect(cstr.points.map((p) => p.residenceTime)).toEqual([0, 0, cstr.endResidenceTime]);
    expect(cstr.points[0].concentrations).toEqual({ A: CA0, B: 0, C: 0 });
    const out = tank(CA0, 0, t1);
    for (const p of cstr.points.slice(1)) {
      expect(rel(p.concentrations.A, out.A)).toBeLessThan(1e-9);
      expect(rel(p.concentrations.B, out.B)).toBeLessThan(1e-9);
    }
  });

  it("the tube follows the closed form from the tank's outlet; the times add up", () => {
    const inlet = tank(CA0, 0, t1);
    expect(pfr.startResidenceTime).toBe(cstr.endResidenceTime);
    expect(rel(pfr.endResidenceTime, t1 + t2)).toBeLessThan(1e-12);
    expect(pfr.points).toHaveLength(32);
    expect(pfr.points[0].residenceTime).toBe(pfr.startResidenceTime);
    expect(pfr.points[31].residenceTime).toBe(pfr.endResidenceTime);
    for (const p of pfr.points) {
      const exact = tube(inlet.A, inlet.B, p.residenceTime - t1);
      expect(Math.abs(p.concentrations.A - exact.A) / CA0).toBeLessThan(1e-8);
      expect(Math.abs(p.concentrations.B - exact.B) / CA0).toBeLessThan(1e-8);
    }
  });

  it("a stage of zero volume starts and ends at the same time with two points", () => {
    const p = networkTrainProfiles(series, [
      { type: "PFR", volume: 0 },
      { type: "CSTR", volume: 0 },
      { type: "PFR", volume: v0 },
    ], { pointsPerStage: 5 });
    for (const s of p.stages.slice(0, 2)) {
      expect(s.startResidenceTime).toBe(0);
      expect(s.endResidenceTime).toBe(0);
      expect(s.points).toHaveLength(2);
      for (const q of s.points) expect(q.concentrations).toEqual({ A: CA0, B: 0, C: 0 });
    }
    expect(p.stages[2].points).toHaveLength(7);
  });
});

describe("rating a train of given volumes", () => {
  it("a CSTR then a PFR matches the closed forms, with yield and selectivity of B", () => {
    const t1 = 1.5;
    const t2 = 2.2;
    const r = rateNetworkTrain(series, [{ type: "CSTR", volume: t1 * v0 }, { type: "PFR", volume: t2 * v0 }], "B");
    const mid = tank(CA0, 0, t1);
    const out = tube(mid.A, mid.B, t2);
    expect(rel(r.stages[0].outlet.B, mid.B)).toBeLessThan(1e-9);
    expect(r.stages[0].steadyStates).toBeUndefined();
    expect(Math.abs(r.outlet.A - out.A) / CA0).toBeLessThan(1e-8);
    expect(Math.abs(r.outlet.B - out.B) / CA0).toBeLessThan(1e-8);
    // yield on A fed and selectivity per A used, common practice
    expect(Math.abs(r.conversion - (1 - out.A / CA0))).toBeLessThan(1e-8);
    expect(Math.abs(r.yield! - out.B / CA0)).toBeLessThan(1e-8);
    expect(Math.abs(r.selectivity! - out.B / (CA0 - out.A))).toBeLessThan(1e-8);
  });

  it("without a wanted product: no yield, no selectivity", () => {
    const r = rateNetworkTrain(series, [{ type: "PFR", volume: v0 }]);
    expect(r.yield).toBeNull();
    expect(r.selectivity).toBeNull();
    expect(rel(r.outlet.A, CA0 * Math.exp(-k1))).toBeLessThan(1e-8);
  });

  it("gives the designer's own outlet for the designer's volumes (three-reaction example)", () => {
    const spec = { ...(fixture as unknown as NetworkDesignSpec), train: { maxStages: 2, types: ["CSTR", "PFR"] } } as NetworkDesignSpec;
    const designed = designNetwork(spec).candidates.filter((c) => c.feasible);
    expect(designed.length).toBeGreaterThan(3);
    for (const c of designed) {
      const r = rateNetworkTrain(spec, c.stages.map((s) => ({ type: s.type, volume: s.volume, temperature: s.temperature })), "B");
      for (const s of ["A", "B", "C", "D"]) expect(Math.abs(r.outlet[s] - c.outlet![s]) / 580).toBeLessThan(1e-12);
      expect(Math.abs(r.yield! - c.yield!)).toBeLessThan(1e-12);
      expect(Math.abs(r.conversion - c.conversion!)).toBeLessThan(1e-12);
      r.stages.forEach((s, i) => expect(s.outlet.B).toBeCloseTo(c.stages[i].outlet.B, 9));
    }
  });

  it("a stage's bad volume names the stage", () => {
    let err: unknown;
    try {
      rateNetworkTrain(series, [{ type: "PFR", volume: v0 }, { type: "CSTR", volume: -1 }]);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(EngineError);
    expect((err as EngineError).path).toBe("stages.1.volume");
  });
});

describe("a tank with three steady states (cubic autocatalysis A + 2B -> 3B)", () => {
  // r = k C_A C_B^2, beta = 0.05, Da = k t C_A0^2 = 4 at t = 100 s
  const spec = liquid({ A: 1000, B: 50 }, [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 4e-8, orders: { A: 1, B: 2 } } }]);
  // roots of 4x^3 - 3.6x^2 + 0.61x - 0.01 = 0 (the tank balance x = Da (1-x)(beta+x)^2; algebra, as in cstr-multiplicity.test.ts)
  const roots = [(2.8 - Math.sqrt(7.04)) / 8, 0.2, (2.8 + Math.sqrt(7.04)) / 8];
  const stages = [{ type: "CSTR" as const, volume: 100 * v0 }, { type: "PFR" as const, volume: 50 * v0 }];

  it("lists every state and continues from the lowest conversion", () => {
    const r = rateNetworkTrain(spec, stages, "B");
    const states = r.stages[0].steadyStates!;
    expect(states).toHaveLength(3);
    states.forEach((s, i) => expect(rel(s.conversion, roots[i])).toBeLessThan(1e-9));
    expect(rel(r.stages[0].outlet.A, 1000 * (1 - roots[0]))).toBeLessThan(1e-9);
    // the tube after it starts from the lowest state: its conversion is the tube's from there
    const alone = rateNetworkTrain(liquid({ A: 1000 * (1 - roots[0]), B: 50 + 1000 * roots[0] }, spec.reactions), [stages[1]]);
    expect(rel(r.outlet.A, alone.outlet.A)).toBeLessThan(1e-9);
    expect(r.conversion).toBeGreaterThan(roots[0]);
  });

  it("the profile's tank holds the lowest state too", () => {
    const p = networkTrainProfiles(spec, stages);
    expect(rel(p.stages[0].points[2].concentrations.A, 1000 * (1 - roots[0]))).toBeLessThan(1e-9);
    expect(p.stages[1].points[0].concentrations.A).toBe(p.stages[0].points[2].concentrations.A);
  });
});
