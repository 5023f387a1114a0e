import { describe, expect, it } from "vitest";
import { EngineError } from "../../../../lib/engine/errors";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { pfrOutlet } from "../../../../lib/engine/network/pfr";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import type { NetworkReaction, NetworkSpec } from "../../../../lib/engine/network/types";

/**
 * The largest network the engine takes: 12 species, 10 reactions. Species S0..S10 are isomers of one
 * formula unit "M" except that a "2 S_j -> S_j+1" step makes a dimer; S11 is a second reactant carrying
 * one unit "Q" that some steps consume. Counting M units (1 each, 2 for a dimer product) and Q units
 * gives conserved combinations (atom balances, common practice).
 */
function network(): { spec: NetworkSpec; mUnits: number[]; qUnits: number[] } {
  const concentrations: Record<string, number> = {};
  for (let i = 0; i < 12; i++) concentrations[`S${i}`] = i === 0 ? 500 : i === 11 ? 100 : 0;
  const reactions: NetworkReaction[] = [];
  const mUnits = new Array<number>(12).fill(0);
  const qUnits = new Array<number>(12).fill(0);
  mUnits[0] = 1;
  qUnits[11] = 1;
  for (let j = 0; j < 10; j++) {
    const a = `S${j}`;
    const b = `S${j + 1}`;
    if (j % 3 === 0) {
      // a + Q -> b: b carries a's M units and one Q
      reactions.push({ stoichiometry: { [a]: -1, S11: -1, [b]: 1 }, rate: { law: "power", k: 1e-3 * (j + 1), orders: { [a]: 1, S11: 1 } } });
      mUnits[j + 1] = mUnits[j];
      qUnits[j + 1] = qUnits[j] + 1;
    } else if (j % 3 === 1) {
      reactions.push({ stoichiometry: { [a]: -1, [b]: 1 }, rate: { law: "power", k: 0.5 / (j + 1), orders: { [a]: 1 }, reverse: { k: 0.05, orders: { [b]: 1 } } } });
      mUnits[j + 1] = mUnits[j];
      qUnits[j + 1] = qUnits[j];
    } else {
      reactions.push({ stoichiometry: { [a]: -2, [b]: 1 }, rate: { law: "power", k: 2e-4 * j, orders: { [a]: 2 } } });
      mUnits[j + 1] = 2 * mUnits[j];
      qUnits[j + 1] = 2 * qUnits[j];
    }
  }
  return { spec: { feed: { volumetricFlow: 0.01, concentrations }, phase: "liquid", reactions, keyReactant: "S0" }, mUnits, qUnits };
}

const dot = (w: number[], F: ArrayLike<number>) => w.reduce((s, wi, i) => s + wi * F[i], 0);

describe("a network of 10 reactions and 12 species", () => {
  const { spec, mUnits, qUnits } = network();
  const net = resolveNetwork(spec);

  for (const V of [0.05, 1, 20]) {
    it(`conserves M and Q units in a tube and a tank of ${V} m3`, () => {
      const stages = [pfrOutlet(net, net.F0, net.T0, V).flows, ...cstrSteadyStates(net, net.F0, net.T0, V).map((s) => s.flows)];
      for (const F of stages) {
        expect(Math.abs(dot(mUnits, F) - dot(mUnits, net.F0))).toBeLessThan(1e-9 * dot(mUnits, net.F0));
        expect(Math.abs(dot(qUnits, F) - dot(qUnits, net.F0))).toBeLessThan(1e-9 * dot(qUnits, net.F0));
        expect(F[0]).toBeLessThan(net.F0[0]);
        expect(F[10]).toBeGreaterThan(0);
      }
    });
  }

  it("refuses an eleventh reaction and a thirteenth species at their fields", () => {
    const more = network().spec;
    more.reactions.push(more.reactions[0]);
    expect(() => resolveNetwork(more)).toThrow(EngineError);
    try {
      resolveNetwork(more);
    } catch (err) {
      expect((err as EngineError).path).toBe("reactions");
    }
    const wide = network().spec;
    wide.feed.concentrations.S12 = 0;
    try {
      resolveNetwork(wide);
      expect.unreachable();
    } catch (err) {
      expect((err as EngineError).path).toBe("feed.concentrations");
    }
  });
});
