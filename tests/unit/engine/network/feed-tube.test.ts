import { describe, expect, it } from "vitest";
import { buildFeedTube } from "../../../../lib/engine/network/feed-tube";
import { makeKinetics } from "../../../../lib/engine/network/kinetics";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import { firstOrder, liquid, rel } from "./helpers";

const CA0 = 580;

/** Residence times spread over the whole range read, log-spaced with an irregular offset so they fall between steps. */
function times(lo: number, hi: number, count: number): number[] {
  return Array.from({ length: count }, (_, q) => lo * (hi / lo) ** ((q + 0.37) / count));
}

describe("the tube fed with the feed, read off one fine integration", () => {
  it("series A -> B -> C, first order: every reading within 1e-9 of the closed form over seven decades", () => {
    const k1 = 10;
    const k2 = 1;
    const kin = makeKinetics(resolveNetwork(liquid({ A: CA0, B: 0, C: 0 }, [firstOrder("A", "B", k1), firstOrder("B", "C", k2)])));
    const tube = buildFeedTube(kin, 1e-4, 100)!;
    expect(tube).not.toBeNull();
    expect(tube.length).toBeCloseTo(100, 9);
    const v0 = kin.net.v0;
    for (const tau of times(1e-5, 100, 300)) {
      const F = tube.at(tau)!;
      // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 8: plug flow, series first order
      // C_A = C_A0 e^(-k1 tau), C_B = C_A0 k1/(k2 - k1) (e^(-k1 tau) - e^(-k2 tau)), C_C the rest
      const cA = CA0 * Math.exp(-k1 * tau);
      const cB = ((CA0 * k1) / (k2 - k1)) * (Math.exp(-k1 * tau) - Math.exp(-k2 * tau));
      // Relative to the feed, the scale the search compares yields and conversions on.
      expect(Math.abs(F[0] / v0 - cA) / CA0).toBeLessThan(1e-9);
      expect(Math.abs(F[1] / v0 - cB) / CA0).toBeLessThan(1e-9);
      expect(Math.abs(F[2] / v0 - (CA0 - cA - cB)) / CA0).toBeLessThan(1e-9);
    }
  });

  it("second-order dimerisation 2 A -> D over eleven decades: within 1e-9 of the feed and 1e-8 of itself of C_A = C_A0 / (1 + 2 k C_A0 tau)", () => {
    const k = 0.5;
    const spec = liquid({ A: CA0, D: 0 }, [{ stoichiometry: { A: -2, D: 1 }, rate: { law: "power", k, orders: { A: 2 } } }]);
    const kin = makeKinetics(resolveNetwork(spec));
    // The chemistry's time scale is 1 / (2 k C_A0) = 1.7e-3 s; the scan's smallest time is a thousandth of it.
    const tube = buildFeedTube(kin, 1.7e-6, 1e3)!;
    for (const tau of times(1e-8, 1e3, 300)) {
      const F = tube.at(tau)!;
      // closed form for a second-order reaction in plug flow (common practice): 1/C_A - 1/C_A0 = 2 k tau
      const cA = CA0 / (1 + 2 * k * CA0 * tau);
      expect(Math.abs(F[0] / kin.net.v0 - cA) / CA0).toBeLessThan(1e-9);
      expect(rel(F[0] / kin.net.v0, cA)).toBeLessThan(1e-8);
    }
  });

  it("reads nothing beyond its length, and is not built where a species can run out under a zero order", () => {
    const kin = makeKinetics(resolveNetwork(liquid({ A: CA0, B: 0 }, [firstOrder("A", "B", 1)])));
    const tube = buildFeedTube(kin, 1e-3, 10)!;
    expect(tube.at(10)).not.toBeNull();
    expect(tube.at(10.5)).toBeNull();
    const zeroOrder = liquid({ A: CA0, B: 0 }, [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 1, orders: { A: 0 } } }]);
    expect(buildFeedTube(makeKinetics(resolveNetwork(zeroOrder)), 1e-3, 10)).toBeNull();
  });
});
