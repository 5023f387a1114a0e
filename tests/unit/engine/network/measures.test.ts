import { describe, expect, it } from "vitest";
import { streamMeasures } from "../../../../lib/engine/network/measures";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import { firstOrder, liquid } from "./helpers";

describe("conversion, yield and selectivity", () => {
  const net = resolveNetwork(liquid({ A: 100, B: 5, C: 0 }, [firstOrder("A", "B", 1), firstOrder("A", "C", 1)]));

  it("follow their definitions, measured against the feed", () => {
    // A: 0.1 -> 0.04 mol/s; B: 0.005 -> 0.035 mol/s. X = 0.6, Y = 0.03/0.1, S = 0.03/0.06 (definitions)
    const m = streamMeasures(net, [0.04, 0.035, 0.03], net.T0, "B");
    expect(m.conversion).toBeCloseTo(0.6, 14);
    expect(m.yield).toBeCloseTo(0.3, 14);
    expect(m.selectivity).toBeCloseTo(0.5, 14);
    expect(m.outlet).toEqual({ A: 40, B: 35, C: 30 });
  });

  it("selectivity is null at zero conversion, yield and selectivity null without a product", () => {
    const feed = streamMeasures(net, net.F0, net.T0, "B");
    expect(feed.conversion).toBe(0);
    expect(feed.yield).toBe(0);
    expect(feed.selectivity).toBeNull();
    const none = streamMeasures(net, [0.04, 0.035, 0.03], net.T0);
    expect(none.yield).toBeNull();
    expect(none.selectivity).toBeNull();
  });

  it("a gas's outlet concentrations are at the stage's temperature and total molar flow", () => {
    const gas = resolveNetwork({
      feed: { volumetricFlow: 1e-3, concentrations: { A: 30, B: 0, N: 10 }, temperature: 400 },
      phase: "gas",
      reactions: [{ stoichiometry: { A: -1, B: 2 }, rate: { law: "power", k: 1, orders: { A: 1 } } }],
      keyReactant: "A",
    });
    // Ideal gas at constant pressure: C_T = P/(R T) = 40 mol/m3 at 400 K, so 32 mol/m3 at 500 K;
    // C_i = y_i C_T with y from the flows 0.01, 0.04, 0.01 (total 0.06): common practice
    const m = streamMeasures(gas, [0.01, 0.04, 0.01], 500);
    expect(m.outlet.A).toBeCloseTo((32 * 0.01) / 0.06, 12);
    expect(m.outlet.B).toBeCloseTo((32 * 0.04) / 0.06, 12);
    expect(m.outlet.N).toBeCloseTo((32 * 0.01) / 0.06, 12);
  });
});
