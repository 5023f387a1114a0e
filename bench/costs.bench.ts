/**
 * `npm run bench:costs`: time of the least-cost reuse plan (the MILP of lib/costs/inventory.ts)
 * for an inventory of 30 vessels and a 5-stage train; goal < 1 s. Prints figures.
 */
import { planFromInventory, type InventoryVessel, type StageNeed } from "../lib/costs/inventory";
import { planTrain, type DesignedStage, type SnapshotVessel } from "../lib/costs/train-plan";

let seed = 20261202;
const rnd = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;

/** An invented plant inventory: mixed types, 0.5–20 m3, about one in five in use. */
function inventory(n: number): SnapshotVessel[] {
  return Array.from({ length: n }, (_, i) => ({
    id: `v${i}`,
    tag: `V-${100 + i}`,
    type: rnd() < 0.6 ? "CSTR" : "PFR",
    volume: 0.5 + rnd() * 19.5,
    available: rnd() > 0.2,
    reuseCost: rnd() * 60000,
  }));
}

function stages(count: number, parallel: number): DesignedStage[] {
  return Array.from({ length: count }, () => ({
    type: rnd() < 0.5 ? "CSTR" : "PFR",
    volume: (1 + rnd() * 12) * parallel,
    vessels: { count: parallel, sizeEach: 0 },
    cost: 80000 + rnd() * 250000,
  }));
}

function time(label: string, fn: () => number, runs = 25) {
  for (let i = 0; i < 3; i++) fn();
  const times: number[] = [];
  let reused = 0;
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    reused = fn();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  console.log(`  ${label.padEnd(58)} median ${times[Math.floor(runs / 2)].toFixed(2).padStart(7)} ms   max ${times[runs - 1].toFixed(2).padStart(7)} ms   (last plan reused ${reused})`);
}

console.log("Least-cost reuse of idle vessels (MILP, javascript-lp-solver); median and max of 25 runs after 3 warm-ups; goal < 1 s");
const inv = inventory(30);
const five = stages(5, 1);
const needs: StageNeed[] = five.map((s) => ({ type: s.type, volume: s.volume, purchaseCost: (s.cost ?? 0) * 4 }));
time("planFromInventory: 30 vessels, 5 stages", () => planFromInventory(needs, inv as InventoryVessel[]).assignments.filter((a) => a.vesselId).length);
time("planTrain: 30 vessels, 5 stages, 1 vessel each", () => planTrain(five, inv, 4).reusedCount);
const fiveBy3 = stages(5, 3);
time("planTrain: 30 vessels, 5 stages, 3 parallel vessels each", () => planTrain(fiveBy3, inv, 4).reusedCount);
// Many random 5-stage trains against fresh 30-vessel inventories: the spread a sweep sees.
const trains = Array.from({ length: 40 }, () => ({ inv: inventory(30), st: stages(5, 1 + Math.floor(rnd() * 2)) }));
const each: number[] = [];
for (const { inv: i, st } of trains) {
  const t0 = performance.now();
  planTrain(st, i, 4);
  each.push(performance.now() - t0);
}
each.sort((a, b) => a - b);
console.log(`  ${"40 random trains (5 stages, 1–2 parallel), 30 vessels".padEnd(58)} median ${each[20].toFixed(2).padStart(7)} ms   max ${each[39].toFixed(2).padStart(7)} ms`);
