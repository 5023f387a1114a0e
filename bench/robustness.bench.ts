/**
 * `npm run bench:robustness`: prints figures (never asserts): wall time of Monte Carlo rating of
 * fixed 5-stage trains (mixed CSTR/PFR) for 1,000 and 10,000 samples, by the lean path and, for
 * comparison, by calling rateTrain once per sample; then trains of the demo's three reactions
 * (`npm run bench:robustness -- network` for those alone).
 */
import { EngineError, rateTrain, type RatingSpec } from "../lib/engine/index";
import { rateUnderUncertainty, type Uncertainty } from "../lib/robustness/monte-carlo";
import { applyOverrides } from "../lib/sweeps/grid";
import { rateNetworkUnderUncertainty, type NetworkTrain } from "../lib/robustness/network-monte-carlo";
import { DEMO_NETWORK } from "../lib/demo/network-demo";

const secondOrder: RatingSpec = {
  feed: { flowA: "72 mol/h", concA: "0.8 mol/L", temperature: "320 K" },
  reaction: { rate: { law: "power", k: "2.5e-5 m^3/(mol s)", orders: { A: 2 } } },
  stages: [
    { type: "CSTR", volume: "2.5 L" },
    { type: "PFR", volume: "3 L" },
    { type: "CSTR", volume: "5 L" },
    { type: "PFR", volume: "8 L" },
    { type: "PFR", volume: "12 L" },
  ],
};

const adiabatic: RatingSpec = {
  feed: { flowA: 0.5, concA: 1200, temperature: 330, ratios: { R: 0 } },
  reaction: {
    stoichiometry: { A: -1, R: 1 },
    rate: {
      law: "power",
      k: 0.004,
      orders: { A: 1 },
      activationEnergy: 60000,
      reverse: { k: 0.00004, orders: { R: 1 }, activationEnergy: 120000 },
      referenceTemperature: 330,
    },
    thermal: { mode: "adiabatic", adiabaticRise: 100, interstageTemperature: 330, maxTemperature: 420 },
  },
  stages: [
    { type: "CSTR", volume: 0.05 },
    { type: "PFR", volume: 0.1 },
    { type: "CSTR", volume: 0.1 },
    { type: "PFR", volume: 0.15 },
    { type: "PFR", volume: 0.2 },
  ],
};

const cases: [string, RatingSpec, Uncertainty[]][] = [
  ["isothermal second order, quantity strings, k uniform ±20 %", secondOrder, [{ field: "reaction.rate.k", kind: "uniform", low: 2e-5, high: 3e-5 }]],
  [
    "adiabatic reversible, k ±20 %, feed T normal sd 3 K",
    adiabatic,
    [
      { field: "reaction.rate.k", kind: "plusMinus", fraction: 0.2 },
      { field: "feed.temperature", kind: "normal", mean: 330, sd: 3 },
    ],
  ],
];

/** The straightforward path: every sample rated by rateTrain on the overridden spec (the reference). */
function perSampleRateTrain(spec: RatingSpec, samples: number): number {
  let sum = 0;
  for (let s = 0; s < samples; s++) {
    const k = 0.8 + (0.4 * s) / samples;
    const base = (spec.reaction.rate as { k: number | string }).k;
    const kv = typeof base === "number" ? base : 2.5e-5;
    try {
      sum += rateTrain(applyOverrides(spec, { "reaction.rate.k": kv * k })).conversionOut;
    } catch (err) {
      if (!(err instanceof EngineError)) throw err;
    }
  }
  return sum;
}

/** Wall and CPU (user + system) milliseconds: on a shared machine the CPU figure is the steadier one. */
function time(f: () => unknown): string {
  const t = performance.now();
  const c = process.cpuUsage();
  f();
  const cpu = process.cpuUsage(c);
  return `${(performance.now() - t).toFixed(0)} ms wall, ${((cpu.user + cpu.system) / 1000).toFixed(0)} ms CPU`;
}

const only = process.argv[2];
console.log("Monte Carlo rating of fixed 5-stage trains (one run each after a 200-sample warm-up)\n");
for (const [name, spec, uncertain] of cases) {
  rateUnderUncertainty({ spec, uncertain, target: 0.9, samples: 200, seed: 1 });
  console.log(name);
  for (const n of (process.env.BENCH_SAMPLES ?? "1000,10000").split(",").map(Number)) {
    if (only === "lean" || only === undefined) {
      const ms = time(() => rateUnderUncertainty({ spec, uncertain, target: 0.9, samples: n, seed: 2026 }));
      console.log(`  lean path, ${n.toLocaleString("en")} samples: ${ms}`);
    }
    if (only === "reference" || (only === undefined && n === 1000)) {
      const ms = time(() => perSampleRateTrain(spec, n));
      console.log(`  rateTrain per sample, ${n.toLocaleString("en")} samples: ${ms}`);
    }
  }
}

/** Trains of the demo's three reactions (A -> B, B -> C, 2 A -> D), each sample rated by rateNetworkTrain. */
function networkTrain(stages: NetworkTrain["stages"]): NetworkTrain {
  const { product: _product, ...chemistry } = DEMO_NETWORK.model.spec;
  return { kind: "network", chemistry, stages, product: "B", minConversion: 0.6, minYield: 0.4 };
}
const networkCases: [string, NetworkTrain, Uncertainty[]][] = [
  ["three reactions, CSTR → PFR, k of B → C ±30 %", networkTrain([{ type: "CSTR", volume: 0.24 }, { type: "PFR", volume: 0.29 }]), [{ field: "reactions.1.rate.k", kind: "plusMinus", fraction: 0.3 }]],
  [
    "three reactions, CSTR → CSTR → PFR, all three k ±20 %, feed T normal sd 3 K",
    networkTrain([{ type: "CSTR", volume: 0.15 }, { type: "CSTR", volume: 0.15 }, { type: "PFR", volume: 0.25 }]),
    [
      { field: "reactions.0.rate.k", kind: "plusMinus", fraction: 0.2 },
      { field: "reactions.1.rate.k", kind: "plusMinus", fraction: 0.2 },
      { field: "reactions.2.rate.k", kind: "plusMinus", fraction: 0.2 },
      { field: "feed.temperature", kind: "normal", mean: 330, sd: 3 },
    ],
  ],
];
if (only === "network" || only === undefined) {
  console.log("\nMonte Carlo rating of fixed trains of several reactions (one run each after a 50-sample warm-up)\n");
  for (const [name, train, uncertain] of networkCases) {
    rateNetworkUnderUncertainty({ train, uncertain, samples: 50, seed: 1 });
    console.log(name);
    for (const n of (process.env.BENCH_NETWORK_SAMPLES ?? "200,1000").split(",").map(Number)) {
      const ms = time(() => rateNetworkUnderUncertainty({ train, uncertain, samples: n, seed: 2026 }));
      console.log(`  ${n.toLocaleString("en")} samples: ${ms}`);
    }
  }
}
