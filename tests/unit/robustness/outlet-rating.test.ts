import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import {
  designTrains,
  EngineError,
  normaliseRatingSpec,
  rateTrain,
  rateTrainOutlet,
  type DesignSpec,
  type RatingSpec,
  type StageType,
} from "../../../lib/engine/index";
import { applyOverrides } from "../../../lib/sweeps/grid";

// The lean path (normalise once, then rateTrainOutlet per sample) must give rateTrain's outlet on the
// same inputs to 1e-9: rateTrain is the reference here, on every kind of fixture spec we ship.
const fixture = (name: string) => JSON.parse(readFileSync(join(__dirname, "../../fixtures/specs", name), "utf8"));

/** A deterministic stream in [0, 1) for perturbations (no dependence on the sampler under test). */
function stream(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

function outletOrRefusal(f: () => number): number | string {
  try {
    return f();
  } catch (err) {
    if (err instanceof EngineError) return `refused: ${err.path}`;
    throw err;
  }
}

/** Trains around the designed optimum of a fixture: its best sequences, volumes scaled and mixed. */
function trainsFor(spec: DesignSpec): RatingSpec[] {
  const design = designTrains(spec);
  const feasible = design.candidates.filter((c) => c.feasible).slice(0, 4);
  const out: RatingSpec[] = [];
  const next = stream(11);
  for (const c of feasible) {
    for (const scale of [0.4, 1, 2.5]) {
      out.push({
        feed: spec.feed,
        reaction: spec.reaction,
        stages: c.stages.map((s) => ({ type: s.type, volume: s.volume * scale * (0.7 + 0.6 * next()) })),
      });
    }
  }
  // A mixed 5-stage train from the largest single-stage reference volume.
  const ref = design.reference.singlePFR ?? design.reference.singleCSTR ?? 1;
  const types: StageType[] = ["CSTR", "PFR", "CSTR", "PFR", "PFR"];
  out.push({ feed: spec.feed, reaction: spec.reaction, stages: types.map((type, i) => ({ type, volume: (ref * (i + 1)) / 10 })) });
  return out;
}

const cases: [string, string[]][] = [
  ["first-order-liquid.json", ["reaction.rate.k", "feed.flowA", "feed.concA"]],
  ["second-order-five-stages.json", ["reaction.rate.k", "feed.concA"]],
  ["adiabatic-reversible-cooling.json", ["reaction.rate.k", "reaction.rate.reverse.k", "feed.temperature", "reaction.rate.activationEnergy"]],
  ["saturation-inhibition.json", ["reaction.rate.vmax", "reaction.rate.km", "reaction.rate.ki"]],
  ["gas-expansion.json", ["reaction.rate.k", "feed.temperature"]],
  ["expression-autocatalytic.json", ["reaction.rate.parameters.k", "feed.flowA"]],
  ["rate-table.json", ["feed.flowA"]],
];

describe("lean rating equals rateTrain to 1e-9", () => {
  for (const [file, fields] of cases) {
    it(`on trains built from ${file}, with perturbed inputs`, () => {
      const trains = trainsFor(fixture(file));
      const next = stream(file.length);
      let compared = 0;
      for (const train of trains) {
        const si = normaliseRatingSpec(train);
        for (let s = 0; s < 6; s++) {
          const overrides: Record<string, number> = {};
          for (const f of fields) {
            const base = f.split(".").reduce<unknown>((n, k) => (n as Record<string, unknown>)[k], si) as number;
            overrides[f] = base * (s === 0 ? 1 : 0.75 + 0.5 * next());
          }
          const lean = outletOrRefusal(() => rateTrainOutlet(applyOverrides(si, overrides)));
          // rateTrain on the original (quantity strings and all) with the same SI overrides.
          const full = outletOrRefusal(() => rateTrain(applyOverrides(train, overrides)).conversionOut);
          if (typeof full === "number" && typeof lean === "number") {
            expect(Math.abs(lean - full)).toBeLessThan(1e-9);
            compared++;
          } else expect(lean).toEqual(full);
        }
      }
      expect(compared).toBeGreaterThan(trains.length);
    });
  }

  it("on an adiabatic CSTR with several steady states (the lowest is passed on)", () => {
    const spec: RatingSpec = fixture("rating-adiabatic-cstr.json");
    const si = normaliseRatingSpec(spec);
    let multiple = 0;
    for (const litres of [5, 20, 50, 80, 120, 200, 400, 800]) {
      for (const t of [290, 300, 310, 320]) {
        const stages = [{ type: "CSTR" as const, volume: litres / 1000 }];
        const full = rateTrain({ ...applyOverrides(spec, { "feed.temperature": t }), stages });
        if (full.stages[0].multiple) multiple++;
        expect(Math.abs(rateTrainOutlet({ ...applyOverrides(si, { "feed.temperature": t }), stages }) - full.conversionOut)).toBeLessThan(1e-9);
      }
    }
    expect(multiple).toBeGreaterThan(0);
  });

  it("normalising converts quantity strings to SI numbers (mol/h, mol/L, L/(mol min), L, degC; converted by hand)", () => {
    const si = normaliseRatingSpec({
      feed: { flowA: "36 mol/h", concA: "2 mol/L", temperature: "50 degC" },
      reaction: { rate: { law: "power", k: "0.9 L/(mol min)", orders: { A: 2 } } },
      stages: [{ type: "CSTR", volume: "250 L" }],
    });
    expect(si.feed.flowA).toBeCloseTo(0.01, 12); // 36/3600
    expect(si.feed.concA).toBeCloseTo(2000, 9);
    expect(si.feed.temperature).toBeCloseTo(323.15, 9);
    expect((si.reaction.rate as { k: number }).k).toBeCloseTo(1.5e-5, 15); // 0.9e-3 m3 / 60 s
    expect(si.stages[0].volume).toBeCloseTo(0.25, 12);
  });
});
