import { describe, expect, it } from "vitest";
import { designNetwork, networkTrainProfiles, rateNetworkTrain, type NetworkDesignSpec, type NetworkStageResult } from "@/lib/engine";
import { compositionRows, feedOf, objectiveLabel, pathSeries, profileSeries, stageSpans, trainResidenceTime, boundNote } from "@/components/candidates/network-results-data";
import { productOf, speciesOf, type NetworkPaths, type NetworkProfiles, type PathPoint } from "@/components/candidates/network-types";
import { compareNetworkTrains } from "@/components/compare/network-compare-data";
import { typedUnits } from "@/lib/units/typed-units";
import { formatObjective } from "@/components/sweeps/scenario-picker";
import { isNetworkSweep, networkConstraintsOf, networkObjectiveOf } from "@/components/sweeps/network-sweep";

// A -> B -> C, first order in the liquid phase; C_A0 = 1000 mol/m3 = 1 mol/L (common practice: 1 L = 1e-3 m3).
const CA0 = 1000;
const [k1, k2] = [0.8, 0.3];
const series = (train: NetworkDesignSpec["train"]): NetworkDesignSpec => ({
  feed: { volumetricFlow: 0.01, concentrations: { A: CA0, B: 0, C: 0 }, temperature: 300 },
  phase: "liquid",
  reactions: [
    { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: k1, orders: { A: 1 } } },
    { stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: k2, orders: { B: 1 } } },
  ],
  keyReactant: "A",
  train,
  objective: { maximise: "yield", product: "B" },
});

// Levenspiel, Chemical Reaction Engineering, 3rd ed., ch. 8: A -> B -> C, first order.
const tubeA = (tau: number) => CA0 * Math.exp(-k1 * tau);
const tubeB = (tau: number) => ((CA0 * k1) / (k2 - k1)) * (Math.exp(-k1 * tau) - Math.exp(-k2 * tau));
const tankA = (tau: number) => CA0 / (1 + k1 * tau);
const tankB = (tau: number) => (CA0 * k1 * tau) / ((1 + k1 * tau) * (1 + k2 * tau));
const at = (tau: number, a: number, b: number) => ({ residenceTime: tau, concentrations: { A: a, B: b, C: CA0 - a - b } });

describe("network results: words", () => {
  it("says the objective in the trade's words", () => {
    expect(objectiveLabel({ maximise: "yield", product: "B" })).toBe("Highest yield of B");
    expect(objectiveLabel({ maximise: "selectivity", product: "B" })).toBe("Highest selectivity to B");
    expect(objectiveLabel({ minimise: "volume" })).toBe("Least total volume");
    expect(objectiveLabel(null)).toBe("—");
  });
  it("names a scenario's best train by what it ranks by", () => {
    expect(formatObjective(0.4568, "yield", "L")).toBe("yield 45.7 %");
    expect(formatObjective(0.5293, "selectivity", "L")).toBe("selectivity 52.9 %");
    expect(formatObjective(null, "yield", "L")).toBe("no feasible train");
  });
  it("tells a sweep of several reactions by its kind, or by its spec when the kind is not given", () => {
    const spec = { reactions: [], objective: { maximise: "yield", product: "B" }, constraints: { minConversion: 0.5 } };
    expect(isNetworkSweep({ kind: "network", spec })).toBe(true);
    expect(isNetworkSweep({ kind: "single", spec: { reaction: {} } })).toBe(false);
    expect(isNetworkSweep({ spec })).toBe(true);
    expect(networkObjectiveOf({ kind: "network", spec })).toEqual({ maximise: "yield", product: "B" });
    expect(networkObjectiveOf({ kind: "single", spec })).toBeNull();
    expect(networkConstraintsOf({ kind: "network", spec })).toEqual({ minConversion: 0.5 });
  });
  it("raises the first letter of an on-a-limit note", () => {
    expect(boundNote("stage 2: zero volume")).toBe("Stage 2: zero volume");
  });
});

describe("outlet composition table", { timeout: 60000 }, () => {
  it("shows the best single tube's outlet in mol/L: C_B,max/C_A0 = (k1/k2)^(k2/(k2-k1)) (Levenspiel, ch. 8)", () => {
    const r = designNetwork(series({ candidates: [["PFR"]] }));
    const best = r.candidates[0]!;
    const rows = compositionRows({ species: ["A", "B", "C"], stages: best.stages, feed: { A: CA0, B: 0, C: 0 } }, "mol/L");
    expect(rows.map((x) => x.label)).toEqual(["Feed", "Stage 1 PFR"]);
    expect(rows[0]!.values).toEqual([1, 0, 0]);
    expect(rows[1]!.values[1]!).toBeCloseTo((k1 / k2) ** (k2 / (k2 - k1)), 6);
    // Every cell is the stored outlet, only converted (1 mol/L = 1000 mol/m3).
    expect(rows[1]!.values[0]! * 1000).toBeCloseTo(best.stages[0]!.outlet.A!, 9);
    // A, B and C add up to what was fed (the network conserves A + B + C).
    expect(rows[1]!.values.reduce((s, v) => s! + v!, 0)!).toBeCloseTo(1, 9);
  });

  it("keeps every stage of a two-stage train and notes a tank with several steady states", () => {
    const stages: NetworkStageResult[] = [
      { type: "CSTR", volume: 1, residenceTime: 100, temperature: 300, outlet: { A: 600, B: 300 }, steadyStates: [{ conversion: 0.4, outlet: { A: 600, B: 300 } }, { conversion: 0.7, outlet: { A: 300, B: 500 } }, { conversion: 0.95, outlet: { A: 50, B: 400 } }] },
      { type: "PFR", volume: 2, residenceTime: 200, temperature: 300, outlet: { A: 100, B: 700 } },
    ];
    const rows = compositionRows({ species: ["A", "B"], stages, feed: null }, "mol/m3");
    expect(rows.map((x) => x.label)).toEqual(["Stage 1 CSTR", "Stage 2 PFR"]);
    expect(rows[0]!.values).toEqual([600, 300]);
    expect(rows[1]!.values).toEqual([100, 700]);
    expect(rows[0]!.steadyStates).toEqual({ count: 3, conversions: [0.4, 0.7, 0.95] });
    expect(rows[1]!.steadyStates).toBeUndefined();
    expect(trainResidenceTime(stages)).toBe(300);
    expect(trainResidenceTime([])).toBeNull();
  });
});

// A tank of 2 s then a tube of 3 s, as the profiles endpoint gives them.
const TANK = 2;
const tankOut = at(TANK, tankA(TANK), tankB(TANK));
const profiles: NetworkProfiles = {
  species: ["A", "B", "C"],
  stages: [
    { type: "CSTR", startResidenceTime: 0, endResidenceTime: TANK, points: [at(0, CA0, 0), { ...tankOut, residenceTime: 0 }, tankOut] },
    { type: "PFR", startResidenceTime: TANK, endResidenceTime: TANK + 3, points: [0, 1, 2, 3].map((t) => at(TANK + t, tankOut.concentrations.A * Math.exp(-k1 * t), NaN)) },
  ],
};
// The tube after the tank: B follows dB/dt = k1 A - k2 B from the tank's outlet (closed form of the linear pair).
for (const p of profiles.stages[1]!.points) {
  const t = p.residenceTime - TANK;
  const a0 = tankOut.concentrations.A;
  const b0 = tankOut.concentrations.B;
  p.concentrations.B = ((a0 * k1) / (k2 - k1)) * (Math.exp(-k1 * t) - Math.exp(-k2 * t)) + b0 * Math.exp(-k2 * t);
  p.concentrations.C = CA0 - p.concentrations.A! - p.concentrations.B;
}

describe("concentration profiles", () => {
  it("draws one line per species through every stage, in minutes when asked (60 s = 1 min)", () => {
    const s = profileSeries(profiles, "mol/L", "min");
    expect(s.map((x) => x.label)).toEqual(["A", "B", "C"]);
    const a = s[0]!.points;
    expect(a).toHaveLength(3 + 4);
    // The tank: its contents jump to the outlet at its inlet and stay there.
    expect(a[0]).toEqual({ x: 0, y: 1 });
    expect(a[1]!.x).toBe(0);
    expect(a[1]!.y).toBeCloseTo(tankA(TANK) / 1000, 12);
    expect(a[2]!.x).toBeCloseTo(TANK / 60, 12);
    for (let i = 1; i < a.length; i++) expect(a[i]!.x).toBeGreaterThanOrEqual(a[i - 1]!.x);
    expect(a[a.length - 1]!.x).toBeCloseTo((TANK + 3) / 60, 12);
    expect(s.map((x) => x.tone)).toEqual([{ stage: 0 }, { stage: 1 }, { stage: 2 }]);
  });
  it("shades each stage's span of cumulative residence time", () => {
    expect(stageSpans(profiles, "s")).toEqual([
      { from: 0, to: TANK, label: "1 CSTR" },
      { from: TANK, to: TANK + 3, label: "2 PFR" },
    ]);
    expect(feedOf(profiles)).toEqual({ A: CA0, B: 0, C: 0 });
  });
});

describe("profiles and composition of a train agree", { timeout: 60000 }, () => {
  it("each stage's profile ends at the outlet the composition table shows; tank then tube by the closed forms (Levenspiel, ch. 8)", () => {
    // A 2 s tank then a 1 s tube at v0 = 0.01 m3/s.
    const spec = series({ candidates: [["CSTR", "PFR"]] });
    const train = [
      { type: "CSTR" as const, volume: 0.02 },
      { type: "PFR" as const, volume: 0.01 },
    ];
    const rating = rateNetworkTrain(spec, train, "B");
    const stages: NetworkStageResult[] = rating.stages.map((st, i) => ({ ...train[i]!, residenceTime: train[i]!.volume / 0.01, temperature: 300, outlet: st.outlet }));
    const prof = networkTrainProfiles(spec, train);
    const rows = compositionRows({ species: prof.species, stages, feed: feedOf(prof) }, "mol/L");
    expect(rows[0]!.values).toEqual([1, 0, 0]);
    // The tank: C_A = C_A0/(1 + k1 tau), C_B = k1 tau C_A0/((1 + k1 tau)(1 + k2 tau)).
    expect(rows[1]!.values[0]!).toBeCloseTo(tankA(2) / 1000, 8);
    expect(rows[1]!.values[1]!).toBeCloseTo(tankB(2) / 1000, 8);
    // The tube after it: A decays from the tank's outlet; B by the linear pair's closed form.
    const [a0, b0] = [tankA(2), tankB(2)];
    expect(rows[2]!.values[0]!).toBeCloseTo((a0 * Math.exp(-k1)) / 1000, 6);
    expect(rows[2]!.values[1]!).toBeCloseTo((((a0 * k1) / (k2 - k1)) * (Math.exp(-k1) - Math.exp(-k2)) + b0 * Math.exp(-k2)) / 1000, 6);
    const lines = profileSeries(prof, "mol/L", "s");
    prof.stages.forEach((st, i) => {
      prof.species.forEach((_sp, j) => {
        const last = lines[j]!.points.filter((p) => Math.abs(p.x - st.endResidenceTime) < 1e-9).pop()!;
        expect(Math.abs(last.y - rows[i + 1]!.values[j]!)).toBeLessThan(1e-6);
      });
    });
  });
});

describe("concentration path", () => {
  const taus = [0.25, 0.5, 1, 2, 4, 8];
  const point = (tau: number, a: number, b: number, steadyState?: number): PathPoint => ({
    residenceTime: tau,
    conversion: 1 - a / CA0,
    key: a,
    product: b,
    selectivity: null,
    concentrations: { A: a, B: b, C: CA0 - a - b },
    ...(steadyState !== undefined ? { steadyState } : {}),
  });
  const paths: NetworkPaths = {
    key: "A",
    product: "B",
    tube: taus.map((t) => point(t, tubeA(t), tubeB(t))),
    tanks: [...taus.map((t) => point(t, tankA(t), tankB(t))), point(4, 10, 5, 1)],
    residenceTimes: { from: 0.25, to: 8 },
  };

  it("has the single tube and tanks as references and each stage as its own segment", () => {
    const s = pathSeries(paths, profiles, "mol/L")!;
    expect(s.map((x) => x.label)).toEqual(["Single tube", "Single stirred tank", "Single stirred tank, steady state 2", "Stage 1 CSTR", "Stage 2 PFR"]);
    expect(s.map((x) => x.tone)).toEqual(["reference", "muted", "muted", { stage: 0 }, { stage: 1 }]);
    // The tube's path: x = C_A, y = C_B, in mol/L.
    expect(s[0]!.points[2]!.x).toBeCloseTo(Math.exp(-k1), 12);
    expect(s[0]!.points[2]!.y).toBeCloseTo((k1 / (k2 - k1)) * (Math.exp(-k1) - Math.exp(-k2)), 12);
    // Another steady state is drawn as points apart, not joined to the lowest-conversion line.
    expect(s[2]!.line).toBe(false);
    expect(s[1]!.points).toHaveLength(taus.length);
    // A tank goes straight from its inlet (the feed) to its outlet, which lies on the single tanks' path.
    expect(s[3]!.points).toEqual([
      { x: 1, y: 0 },
      { x: tankA(TANK) / 1000, y: tankB(TANK) / 1000 },
    ]);
    const onTanks = s[1]!.points[3]!; // tau = 2 s, the tank's own size
    expect(s[3]!.points[1]!.x).toBeCloseTo(onTanks.x, 12);
    expect(s[3]!.points[1]!.y).toBeCloseTo(onTanks.y, 12);
    // The tube after it starts where the tank ends.
    expect(s[4]!.points[0]!.x).toBeCloseTo(s[3]!.points[1]!.x, 12);
    expect(s[4]!.points[0]!.y).toBeCloseTo(s[3]!.points[1]!.y, 12);
  });

  it("draws nothing without a wanted product", () => {
    expect(pathSeries({ ...paths, product: null }, profiles, "mol/L")).toBeNull();
  });
});

describe("compare trains of several reactions", () => {
  const stage = (B: number): NetworkStageResult => ({ type: "PFR", volume: 1, residenceTime: 1, temperature: 300, outlet: { A: 1, B } });
  it("gives each train's gap to the best yield, selectivity and volume, and the product leaving", () => {
    const d = compareNetworkTrains([
      { id: "a", feasible: true, totalVolume: 2, yield: 0.6, selectivity: 0.8, product: "B", stages: [stage(600)] },
      { id: "b", feasible: true, totalVolume: 1.5, yield: 0.5, selectivity: 0.9, product: "B", stages: [stage(400), stage(500)] },
      { id: "c", feasible: false, totalVolume: null, yield: null, selectivity: null, product: "B", stages: [] },
    ]);
    expect(d[0]).toEqual({ id: "a", yieldBelowBest: 0, selectivityBelowBest: expect.closeTo(0.1, 12), volumeOverBest: 0.5, productOutlet: 600 });
    expect(d[1]).toEqual({ id: "b", yieldBelowBest: expect.closeTo(0.1, 12), selectivityBelowBest: 0, volumeOverBest: 0, productOutlet: 500 });
    expect(d[2]).toEqual({ id: "c", yieldBelowBest: null, selectivityBelowBest: null, volumeOverBest: null, productOutlet: null });
  });
});

describe("a compared candidate without its own product and species", () => {
  it("takes the product from the objective its scenario ranked by, and the species from its outlet", () => {
    const scenario = (objective: { maximise: "yield"; product: string } | { minimise: "volume" }) => ({ index: 0, overrides: {}, reference: { kind: "network" as const, singleCSTR: null, singlePFR: null, objective, feedVolumetricFlow: 0.01 } });
    expect(productOf({ scenario: scenario({ maximise: "yield", product: "B" }) })).toBe("B");
    expect(productOf({ scenario: scenario({ minimise: "volume" }) })).toBeNull();
    expect(productOf({ product: null, scenario: scenario({ maximise: "yield", product: "B" }) })).toBeNull();
    expect(speciesOf({ stages: [{ type: "CSTR", volume: 1, residenceTime: 1, temperature: 300, outlet: { A: 1, B: 2 } }] })).toEqual(["A", "B"]);
    expect(speciesOf({ species: ["A", "B", "C"], stages: [] })).toEqual(["A", "B", "C"]);
  });
});

describe("units a model of several reactions was typed in", () => {
  it("reads the concentration, time and activation energy units of its species and reactions", () => {
    const u = typedUnits({ shownUnits: { "feed.concentrations.A": "mol/L", "feed.concentrations.B": "kmol/m3", "reactions.0.rate.k": "mol/L|min", "reactions.1.rate.activationEnergy": "kJ/mol", "feed.temperature": "degC" } });
    expect(u).toEqual({ concentration: "mol/L", time: "min", energyPerMol: "kJ/mol", temperature: "degC", volume: "L" });
  });
});
