import { describe, expect, it } from "vitest";
import { rateTrain, type RatingSpec } from "../../../../lib/engine/index";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { pfrOutlet } from "../../../../lib/engine/network/pfr";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import type { NetworkPowerRate, NetworkSpec } from "../../../../lib/engine/network/types";

/**
 * A one-reaction network must rate a stage exactly as today's one-reaction engine does: the
 * conversion of each stage type at a given volume, from the public rateTrain.
 */
const CASES: { name: string; rate: NetworkPowerRate; cB0?: number }[] = [
  { name: "first order", rate: { law: "power", k: 0.02, orders: { A: 1 } } },
  { name: "order 1.5", rate: { law: "power", k: 4e-4, orders: { A: 1.5 } } },
  { name: "second order in A and B", rate: { law: "power", k: 2e-5, orders: { A: 1, B: 1 } }, cB0: 700 },
  { name: "reversible", rate: { law: "power", k: 0.02, orders: { A: 1 }, reverse: { k: 0.005, orders: { B: 1 } } } },
];

const FA0 = 0.5;
const CA0 = 500;
const v0 = FA0 / CA0;

describe("a one-reaction network agrees with today's engine", () => {
  for (const c of CASES) {
    for (const volume of [0.01, 0.08, 0.2]) {
      it(`${c.name}, ${volume} m3`, () => {
        const cB0 = c.cB0 ?? 0;
        const spec: NetworkSpec = {
          feed: { volumetricFlow: v0, concentrations: { A: CA0, B: cB0 } },
          phase: "liquid",
          reactions: [{ stoichiometry: { A: -1, B: c.name === "second order in A and B" ? -1 : 1 }, rate: c.rate }],
          keyReactant: "A",
        };
        const net = resolveNetwork(spec);
        const rating = (type: "CSTR" | "PFR") => {
          const r: RatingSpec = {
            feed: { flowA: FA0, concA: CA0, ratios: { B: cB0 / CA0 } },
            reaction: {
              stoichiometry: { A: -1, B: c.name === "second order in A and B" ? -1 : 1 },
              rate: c.rate.reverse ? { law: "power", k: c.rate.k, orders: c.rate.orders, reverse: c.rate.reverse } : { law: "power", k: c.rate.k, orders: c.rate.orders },
            },
            stages: [{ type, volume }],
          };
          return rateTrain(r).conversionOut;
        };
        const xPfr = 1 - pfrOutlet(net, net.F0, net.T0, volume, { rtol: 1e-11 }).flows[0] / net.F0[0];
        const xCstr = cstrSteadyStates(net, net.F0, net.T0, volume)[0].conversion;
        // not a trivial agreement: the stage reaches a conversion well inside (0, 1), and the two types differ
        expect(xPfr).toBeGreaterThan(0.05);
        expect(xPfr).toBeLessThan(0.999);
        expect(xPfr - xCstr).toBeGreaterThan(1e-3);
        expect(Math.abs(xPfr - rating("PFR"))).toBeLessThan(1e-7);
        expect(Math.abs(xCstr - rating("CSTR"))).toBeLessThan(1e-7);
      });
    }
  }
});
