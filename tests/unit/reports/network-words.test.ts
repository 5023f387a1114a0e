import { describe, expect, it } from "vitest";
import { describeHeat, describeNetworkFeed, describeNetworkReaction, objectiveWords, reactionEquation } from "@/lib/reports/network-words";

describe("a network's chemistry in words", () => {
  it("writes stoichiometry as an equation, consumed on the left", () => {
    expect(reactionEquation({ A: -1, B: -1, C: 2 })).toBe("A + B → 2 C");
    expect(reactionEquation({ A: -0.5, B: 1 })).toBe("0.5 A → B");
    expect(reactionEquation({ B: 1, A: -2 })).toBe("2 A → B");
  });

  it("shows stored SI constants in the units the engineer typed, with the stored value beside them", () => {
    const shown = { "reactions.0.rate.k": "mol/L|h", "reactions.0.rate.activationEnergy": "kJ/mol", "reactions.0.rate.reverse.k": "mol/L|min" };
    const r = describeNetworkReaction(
      { stoichiometry: { A: -2, D: 1 }, rate: { law: "power", k: 1e-6, orders: { A: 2 }, activationEnergy: 65_000, reverse: { k: 0.002, orders: { D: 1 } } } },
      0,
      shown,
    );
    expect(r.equation).toBe("2 A → D");
    expect(r.formula).toBe("r = k·C_A^2 − k_rev·C_D");
    expect(r.law).toBe("power law, reversible, Arrhenius");
    // Second order: 1e-6 m³/(mol s) = 1e-6 × 1000 L/m³ × 3600 s/h = 3.6 L/(mol h) (common practice).
    expect(r.constants[0]).toEqual({ label: "k", value: "3.6 (L/mol)/h (1.000e-6 (mol/m³)^-1/s)" });
    expect(r.constants[1]).toEqual({ label: "Activation energy", value: "65 kJ/mol (65000 J/mol)" });
    // First order: 0.002 1/s = 0.12 1/min.
    expect(r.constants[2]).toEqual({ label: "k_rev", value: "0.12 1/min (0.002 1/s)" });
  });

  it("shows a quantity kept with its unit as written, and an expression law as its formula", () => {
    expect(describeNetworkReaction({ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: "0.24 1/min", orders: { A: 1 } } }, 0, {}).constants).toEqual([{ label: "k", value: "0.24 1/min" }]);
    const e = describeNetworkReaction({ stoichiometry: { A: -1, B: 1 }, rate: { law: "expression", expression: "kf * C_A / (1 + K * C_B)", parameters: { kf: 0.01, K: "0.5 L/mol" } } }, 1, {});
    expect(e.index).toBe(2);
    expect(e.formula).toBe("r = kf * C_A / (1 + K * C_B)");
    expect(e.constants).toEqual([
      { label: "kf", value: "0.01" },
      { label: "K", value: "0.5 L/mol" },
    ]);
  });

  it("lists the feed species by species in the units typed", () => {
    const lines = describeNetworkFeed(
      { phase: "gas", feed: { volumetricFlow: 0.1, concentrations: { A: 1200, I: 0 }, temperature: 333.15 } },
      { "feed.concentrations.A": "mol/L", "feed.temperature": "degC" },
    );
    expect(lines).toEqual([
      { label: "Phase", value: "gas (isobaric, ideal)" },
      { label: "Feed volumetric flow", value: "0.1 m³/s" },
      { label: "Feed temperature", value: "60 °C (333.15 K)" },
      { label: "Feed concentration of A", value: "1.2 mol/L (1200 mol/m³)" },
      { label: "Feed concentration of I", value: "0 mol/m³" },
    ]);
  });

  it("names objectives and heat modes in the words of the screens", () => {
    expect(objectiveWords({ maximise: "yield", product: "B" })).toBe("Highest yield of B");
    expect(objectiveWords({ maximise: "selectivity", product: "B" })).toBe("Highest selectivity to B");
    expect(objectiveWords({ minimise: "volume" })).toBe("Least total volume");
    expect(describeHeat({ mode: "isothermal" })).toBe("Isothermal at the feed temperature");
    expect(describeHeat({ mode: "stageTemperature", min: 300, max: 360 })).toBe("Each stage at its own temperature, chosen between 300 K and 360 K");
  });
});
