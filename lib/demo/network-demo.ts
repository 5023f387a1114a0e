import type { NetworkKineticsSpec } from "@/lib/schemas/network-spec";

/**
 * The demo's model of several reactions (invented chemistry and numbers): a substrate A adds once to
 * give the wanted mono-adduct B, which over-reacts to the bis-adduct C, while A also couples with itself
 * to a dimer D. The dimerisation is second order in A, so a stirred tank first (A diluted at once)
 * followed by a tube (stopped before B over-reacts) gives more B than a tube alone — the demo's point.
 */
const spec: NetworkKineticsSpec = {
  feed: { volumetricFlow: "3.6 m^3/h", concentrations: { A: "1.2 mol/L", B: 0, C: 0, D: 0 }, temperature: 330 },
  phase: "liquid",
  reactions: [
    { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: "0.004 1/s", orders: { A: 1 } } },
    { stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: "0.0008 1/s", orders: { B: 1 } } },
    { stoichiometry: { A: -2, D: 1 }, rate: { law: "power", k: "0.002 L/(mol*s)", orders: { A: 2 } } },
  ],
  keyReactant: "A",
  product: "B",
};

export const DEMO_NETWORK = {
  project: {
    name: "Mono-adduct campaign",
    description: "Series-parallel chemistry: the mono-adduct B over-reacts to C and the substrate dimerises to D. Train chosen for the yield of B (invented demo data).",
  },
  model: {
    name: "Mono-adduct, three reactions",
    note: "Rate constants fitted to the August bench series at 57 °C (invented demo data).",
    spec,
  },
  sweep: {
    name: "Demo: yield of B against the over-reaction rate",
    thermal: { mode: "isothermal" as const },
    train: { maxStages: 3, types: ["CSTR", "PFR"] as ("CSTR" | "PFR")[] },
    objective: { maximise: "yield" as const, product: "B" },
    constraints: { minConversion: 0.6, maxTotalVolume: 4 },
    /** The over-reaction's rate constant is the least certain of the three: ±50 % around the fitted value (SI, 1/s). */
    grid: [{ field: "reactions.1.rate.k", values: [0.0004, 0.0008, 0.0012] }],
    /** The scenario whose best train is pinned: the fitted value. */
    pinAt: 0.0008,
  },
};
