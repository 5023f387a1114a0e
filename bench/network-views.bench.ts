/**
 * Wall time of the views of a network the screens draw as the user types: the paths (single tube and
 * single stirred tanks, 80 residence times) of the command line's three-reaction example and of a tank
 * with three steady states (cubic autocatalysis), the profile of a three-stage train and its rating.
 * Prints figures, asserts nothing (goal: paths well under 100 ms on the 2-core machine, quiet). Run with
 * `npm run bench:views` (also part of `npm run bench`).
 */
import { networkPaths, networkTrainProfiles, rateNetworkTrain, type NetworkDesignSpec, type ViewStage } from "../lib/engine";
import example from "../tests/fixtures/specs/network-three-reactions.json";

const chemistry = example as unknown as NetworkDesignSpec;
const autocatalysis: NetworkDesignSpec = {
  feed: { volumetricFlow: 1e-3, concentrations: { A: 1000, B: 50 } },
  phase: "liquid",
  reactions: [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 4e-8, orders: { A: 1, B: 2 } } }],
  keyReactant: "A",
  train: { maxStages: 1 },
  objective: { maximise: "yield", product: "B" },
};
const train: ViewStage[] = [
  { type: "CSTR", volume: 0.005 },
  { type: "PFR", volume: 0.01 },
  { type: "CSTR", volume: 0.02 },
];

function time(label: string, run: () => unknown, runs: number): void {
  run(); // warm-up
  const ts: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    run();
    ts.push(performance.now() - t);
  }
  ts.sort((a, b) => a - b);
  console.log(`${label}: median ${ts[Math.floor(runs / 2)].toFixed(1)} ms over ${runs} runs (min ${ts[0].toFixed(1)} ms, max ${ts[runs - 1].toFixed(1)} ms)`);
}

time("paths, three-reaction example (80 times)", () => networkPaths(chemistry, "B"), 20);
const p = networkPaths(chemistry, "B");
console.log(`  ${p.tube.length} tube points, ${p.tanks.length} tank states, ${p.residenceTimes.from.toExponential(2)} .. ${p.residenceTimes.to.toPrecision(3)} s`);
time("paths, cubic autocatalysis (three states over part of the grid)", () => networkPaths(autocatalysis, "B"), 10);
const q = networkPaths(autocatalysis, "B");
console.log(`  ${q.tanks.length} tank states at ${new Set(q.tanks.map((t) => t.residenceTime)).size} sizes`);
time("profile of CSTR-PFR-CSTR, three-reaction example", () => networkTrainProfiles(chemistry, train), 20);
time("rating of CSTR-PFR-CSTR, three-reaction example", () => rateNetworkTrain(chemistry, train, "B"), 20);
