/** Whole-process entry of the baseline: one JSON line of volumes per spec file (second-order bench specs only). */
import { readFileSync } from "node:fs";
import { baselineOptimise } from "./baseline";

for (const file of process.argv.slice(2)) {
  const s = JSON.parse(readFileSync(file, "utf8"));
  const volumes = baselineOptimise({
    fa0: s.feed.flowA,
    ca0: s.feed.concA,
    k: s.reaction.rate.k,
    order: s.reaction.rate.orders.A,
    target: s.target.conversion,
    maxStages: s.train.maxStages,
  });
  process.stdout.write(`${JSON.stringify({ volumes })}\n`);
}
