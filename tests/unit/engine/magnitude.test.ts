import { describe, expect, it } from "vitest";
import { designTrains, EngineError, MAX_RATED_VESSEL, rateTrain, type DesignSpec } from "../../../lib/engine/index";
import { powerSpec, rel } from "./helpers";

function errorOf(f: () => unknown): EngineError {
  try {
    f();
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error("expected an EngineError");
}

function expressionSpec(expression: string, target = 0.9): DesignSpec {
  return {
    feed: { flowA: 1, concA: 1000 },
    reaction: { rate: { law: "expression", expression } },
    target: { conversion: target },
    train: { maxStages: 1 },
  };
}

describe("results near the limits of floating point say so", () => {
  it("a rate constant of 1e308 overflows the rate and is refused in words, never a volume of 0", () => {
    const e = errorOf(() => designTrains(powerSpec({ k: 1e308, order: 1, target: 0.9, ca0: 1000 })));
    expect(e.message).toMatch(/rate overflows at X = 0\b/);
    expect(e.message).toMatch(/check the rate constant/);
    expect(e.path).toBe("reaction.rate");
  });

  it("exp(1000*X) overflows part way and the message names the conversion", () => {
    const e = errorOf(() => designTrains(expressionSpec("exp(1000*X)")));
    // exp(x) overflows a double past x = ln(1.8e308) = 709.78 (common practice), so at X of about 0.71
    const x = Number(/X = ([0-9.]+)/.exec(e.message)?.[1]);
    expect(x).toBeGreaterThan(0.70);
    expect(x).toBeLessThan(0.72);
    expect(e.path).toBe("reaction.rate.expression");
  });

  it("a rate so small that FA0/(-rA) overflows is refused as an underflow", () => {
    const e = errorOf(() => designTrains(expressionSpec("1e-320")));
    expect(e.message).toMatch(/rate underflows/);
  });

  it("a volume below 1 nL is refused rather than printed as 0 L", () => {
    // first-order CSTR, V = v0 X/(k(1-X)) (closed form, common practice): 1e-3 * 9 / 1e12 = 9e-15 m3
    const e = errorOf(() => designTrains(powerSpec({ k: 1e12, order: 1, target: 0.9, fa0: 1, ca0: 1000 })));
    expect(e.message).toMatch(/below 1 nL/);
  });

  it("a volume above 1 km3 is refused", () => {
    // first-order PFR, V = -v0 ln(1-X)/k (closed form, common practice): 1 * 2.303 / 1e-10 = 2.3e10 m3
    const e = errorOf(() => designTrains(powerSpec({ k: 1e-10, order: 1, target: 0.9, fa0: 1, ca0: 1 })));
    expect(e.message).toMatch(/above 1 km3/);
  });

  it("just inside both limits the closed forms still hold", () => {
    const x = 0.9;
    const v0 = 1e-3;
    // first-order CSTR V = v0 X/(k(1-X)) and PFR V = -v0 ln(1-X)/k (closed forms, common practice)
    for (const k of [1e6, 1e-11]) {
      const r = designTrains(powerSpec({ k, order: 1, target: x, fa0: 1, ca0: 1000 }));
      expect(rel(r.reference.singleCSTR as number, (v0 * x) / (k * (1 - x)))).toBeLessThan(1e-8);
      expect(rel(r.reference.singlePFR as number, (-v0 * Math.log(1 - x)) / k)).toBeLessThan(1e-8);
    }
  });

  it("rating refuses a vessel above the largest plausible size, naming the stage", () => {
    const spec = {
      feed: { flowA: 0.5, concA: 1000 },
      reaction: { rate: { law: "power" as const, k: 0.01, orders: { A: 1 } } },
      stages: [{ type: "CSTR" as const, volume: 1e30 }],
    };
    const e = errorOf(() => rateTrain(spec));
    expect(e.path).toBe("stages.0.volume");
    expect(e.message).toContain("at most 1e9 m3");
    // at the limit itself the first-order CSTR closed form X = k tau/(1 + k tau) holds (common practice)
    const ok = rateTrain({ ...spec, stages: [{ type: "CSTR", volume: MAX_RATED_VESSEL }] });
    const kt = 0.01 * (MAX_RATED_VESSEL / (0.5 / 1000));
    expect(Math.abs(ok.conversionOut - kt / (1 + kt))).toBeLessThan(1e-12);
  });

  it("rating with k = 1e308 is refused in words", () => {
    const e = errorOf(() =>
      rateTrain({
        feed: { flowA: 0.5, concA: 1000 },
        reaction: { rate: { law: "power", k: 1e308, orders: { A: 1 } } },
        stages: [{ type: "PFR", volume: 1 }],
      }),
    );
    expect(e.message).toMatch(/rate overflows/);
  });
});

describe("ranking of trains with empty stages", () => {
  it("first-order isothermal: the single PFR leads, trains padded with empty stages come last", () => {
    // first order, isothermal: the PFR is the least volume for any split (common practice), so every
    // longer train either splits the tube (same volume) or pads it with an empty stirred tank.
    const r = designTrains(powerSpec({ k: 0.05, order: 1, target: 0.9, fa0: 1, ca0: 1000, maxStages: 3 }));
    const v0 = 1e-3;
    expect(r.candidates[0].sequence).toEqual(["PFR"]);
    expect(rel(r.candidates[0].totalVolume as number, (-v0 * Math.log(0.1)) / 0.05)).toBeLessThan(1e-6);
    const firstPadded = r.candidates.findIndex((c) => (c.emptyStages ?? 0) > 0);
    expect(firstPadded).toBeGreaterThan(0);
    for (const c of r.candidates.slice(firstPadded)) expect(c.emptyStages ?? 0).toBeGreaterThan(0);
    for (const c of r.candidates.slice(0, firstPadded)) {
      for (const st of c.stages) expect(st.conversionOut - st.conversionIn).toBeGreaterThanOrEqual(1e-6);
    }
  });
});
