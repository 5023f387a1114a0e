/**
 * Wall time of the network designer: the command line's three-reaction liquid example with every sequence
 * of 1..5 stages (62) maximising the yield of B, and five stirred tanks of the Van de Vusse case; then how
 * far each objective is from a run with tighter search settings (tube tolerance 1e-10). Prints figures,
 * asserts nothing (goals: 1 s and 50 ms on the 2-core machine, quiet). Last, the cost of solving every tank
 * for all its steady states during the search, on an autocatalytic network. Run with:
 *   esbuild bench/network-design.bench.ts --bundle --platform=node --format=esm \
 *     --outfile=node_modules/.cache/seriatim/bench-network.mjs --log-level=error && node node_modules/.cache/seriatim/bench-network.mjs
 */
import { designNetwork, makeProblem, type NetworkDesignOptions } from "../lib/engine/network/design";
import { makeKinetics } from "../lib/engine/network/kinetics";
import { resolveNetwork } from "../lib/engine/network/resolve";
import { stageOutlet } from "../lib/engine/network/train-eval";
import type { NetworkDesignSpec } from "../lib/engine/network/design-types";
import contractExample from "../tests/fixtures/specs/network-three-reactions.json";

/** The command line's example (tests/fixtures/specs), widened to every sequence of 1..5 stages. */
const example: NetworkDesignSpec = { ...(contractExample as unknown as NetworkDesignSpec), train: { maxStages: 5, types: ["CSTR", "PFR"] } };

const vanDeVusse: NetworkDesignSpec = {
  feed: { volumetricFlow: 1e-3, concentrations: { A: 1000, B: 0, C: 0, D: 0 } },
  phase: "liquid",
  reactions: [
    { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 1, orders: { A: 1 } } },
    { stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: 2, orders: { B: 1 } } },
    { stoichiometry: { A: -2, D: 1 }, rate: { law: "power", k: 0.01, orders: { A: 2 } } },
  ],
  keyReactant: "A",
  train: { candidates: [["CSTR", "CSTR", "CSTR", "CSTR", "CSTR"]] },
  objective: { maximise: "yield", product: "B" },
};

function time(label: string, spec: NetworkDesignSpec, runs: number, warmUps = 1) {
  for (let i = 0; i < warmUps; i++) designNetwork(spec);
  const ts: number[] = [];
  let result = designNetwork(spec);
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    result = designNetwork(spec);
    ts.push(performance.now() - t);
  }
  ts.sort((a, b) => a - b);
  console.log(`${label}: median ${ts[Math.floor(runs / 2)].toFixed(0)} ms over ${runs} runs after ${warmUps} warm-up (min ${ts[0].toFixed(0)} ms)`);
  return result;
}

const r = time("three-reaction example, 62 sequences", example, 3);
console.log(`  best ${r.candidates[0].sequence.join("-")} yield ${r.candidates[0].objective}`);
// A short case: the compiler needs a few runs to settle (after one warm-up the median ranged 38–53 ms between runs).
const v = time("Van de Vusse, five stirred tanks", vanDeVusse, 9, 5);
console.log(`  C_B ${(v.candidates[0].outlet!.B / 1000).toPrecision(10)} mol/L (best known 0.0691196701)`);

// A much finer search: tubes at 1e-10, twice the grid, every distinct start among the best eight polished.
const converged: NetworkDesignOptions = { searchRtol: 1e-10, gridPoints: 50, polishStarts: 8 };
for (const [label, spec, fast] of [["three-reaction example", example, r], ["Van de Vusse", vanDeVusse, v]] as const) {
  const t = performance.now();
  const fine = designNetwork(spec, converged);
  const ms = performance.now() - t;
  let worst = 0;
  let worstSeq = "";
  for (const c of fine.candidates) {
    const f = fast.candidates.find((q) => q.sequence.join() === c.sequence.join())!;
    const d = Math.abs(f.objective! - c.objective!) / Math.abs(c.objective!);
    if (d > worst) [worst, worstSeq] = [d, c.sequence.join("-")];
  }
  const better = fine.candidates.filter((c) => c.objective! > fast.candidates.find((q) => q.sequence.join() === c.sequence.join())!.objective! * (1 + 1e-9)).length;
  console.log(`${label}: finer search ${ms.toFixed(0)} ms; largest relative gap of an objective ${worst.toExponential(2)} (${worstSeq}); finer search better by > 1e-9 on ${better} sequences`);
}

// The same example with each stage at its own temperature (300..360 K; activation energies of our own).
const heated: NetworkDesignSpec = {
  ...example,
  thermal: { mode: "stageTemperature", min: 300, max: 360 },
  reactions: example.reactions.map((r, j) => (r.rate.law === "power" ? { ...r, rate: { ...r.rate, activationEnergy: [60e3, 40e3, 80e3][j] } } : r)),
};
const h = time("three-reaction example with stage temperatures, 62 sequences", heated, 1);
console.log(`  best ${h.candidates[0].sequence.join("-")} yield ${h.candidates[0].objective} at ${h.candidates[0].stages.map((s) => s.temperature.toFixed(1)).join(", ")} K`);

// What the search pays when a network may give a tank several steady states (cstr-uniqueness.ts): every
// tank is then solved with the full steady-state search instead of Newton from the feed (which, past the
// fold, fails and falls back on the full search itself: that inflates its figure here). Cubic
// autocatalysis A + 2B -> 3B beside A -> C (the case of tests/unit/engine/network/design-multiplicity.test.ts).
const autocatalytic: NetworkDesignSpec = {
  feed: { volumetricFlow: 1, concentrations: { A: 1000, B: 10, C: 0 } },
  phase: "liquid",
  keyReactant: "A",
  reactions: [
    { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 1e-8, orders: { A: 1, B: 2 } } },
    { stoichiometry: { A: -1, C: 1 }, rate: { law: "power", k: 2e-4, orders: { A: 1 } } },
  ],
  train: { candidates: [["CSTR"], ["CSTR", "CSTR"]] },
  objective: { maximise: "yield", product: "C" },
  constraints: { maxTotalVolume: 2e4 },
};
{
  const problem = makeProblem(autocatalytic, makeKinetics(resolveNetwork(autocatalytic)));
  const sizes = Array.from({ length: 200 }, (_, q) => 10 * 1.04 ** q);
  const per = (unique: boolean) => {
    const p = { ...problem, tanksUnique: unique };
    const t = performance.now();
    for (const tau of sizes) {
      try {
        stageOutlet(p, "CSTR", p.kin.net.F0, tau);
      } catch {
        // past the fold Newton from the feed can fail; the search then falls back on the full search
      }
    }
    return ((performance.now() - t) / sizes.length) * 1000;
  };
  per(true);
  per(false);
  console.log(`one autocatalytic tank: Newton from the feed ${per(true).toFixed(0)} µs, every steady state (what the search now uses) ${per(false).toFixed(0)} µs`);
  const t = performance.now();
  const d = designNetwork(autocatalytic);
  console.log(`  two sequences of such tanks designed in ${(performance.now() - t).toFixed(0)} ms; best ${d.candidates[0].sequence.join("-")} yield ${d.candidates[0].objective}`);
}
