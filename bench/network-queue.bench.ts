/**
 * `npm run bench:queue-network`: a sweep of a model of several reactions on the queue, end to end, on a
 * throwaway PostgreSQL cluster: the three-reaction example's chemistry (tests/fixtures/specs), every
 * sequence of 1..5 stages (62) maximising the yield of B, 200 scenarios (the second reaction's rate
 * constant × the largest total volume), 2 worker processes, submit (commit) → last result stored.
 * Goal on this 2-core machine, quiet: at most 60 s. Prints figures; asserts nothing.
 */
import type { ChildProcess } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import { eq } from "drizzle-orm";
import { sweeps } from "../db/schema";
import { benchRoot as root, runQueueBench, seededBenchDatabase, startWorkers, stopAll } from "./queue-bench-setup";
import { applyOverrides, expandGrid, type GridAxis } from "../lib/sweeps/grid";
import { designNetwork, type NetworkDesignSpec } from "../lib/engine";

const fixture = JSON.parse(readFileSync(path.join(root, "tests/fixtures/specs/network-three-reactions.json"), "utf8"));
const chemistry = { feed: fixture.feed, phase: fixture.phase, reactions: fixture.reactions, keyReactant: fixture.keyReactant, product: "B" };
const WORKERS = 2;

async function main(serverUrl: string, children: ChildProcess[]) {
  const { url, pool, db, actor, projectId } = await seededBenchDatabase(serverUrl, "bench_queue_network");
  const { createKineticsModel } = await import("../lib/services/kinetics");
  const { createSweep } = await import("../lib/services/sweeps");
  const { networkSweepCreateSchema } = await import("../lib/schemas/sweeps");
  const { version } = await createKineticsModel(db, actor, projectId, { name: "Bench three reactions", spec: chemistry, note: "" });
  const env: NodeJS.ProcessEnv = { ...process.env, DATABASE_URL: url, NODE_ENV: "production" as const };

  const submit = (grid: GridAxis[]) =>
    createSweep(
      db,
      actor,
      projectId,
      networkSweepCreateSchema.parse({
        kineticsVersionId: version.id,
        train: { maxStages: 5, types: ["CSTR", "PFR"] },
        objective: { maximise: "yield", product: "B" },
        constraints: { minConversion: 0.5, maxTotalVolume: 2 },
        grid,
      }),
    );
  const waitDone = async (id: string) => {
    for (;;) {
      const [s] = await db.select({ status: sweeps.status }).from(sweeps).where(eq(sweeps.id, id));
      if (s.status !== "queued" && s.status !== "running") return s.status;
      await new Promise((r) => setTimeout(r, 20));
    }
  };

  const ws = await startWorkers(WORKERS, env);
  children.push(...ws);
  await waitDone((await submit([{ field: "reactions.1.rate.k", values: [0.5, 1, 1.5, 2] }])).id); // warm-up
  const grid: GridAxis[] = [
    { field: "reactions.1.rate.k", from: 0.5, to: 2, steps: 20 },
    { field: "constraints.maxTotalVolume", from: 0.5, to: 2, steps: 10 },
  ];
  const t0 = performance.now();
  const big = await submit(grid);
  const status = await waitDone(big.id);
  const seconds = (performance.now() - t0) / 1000;
  const count = (await pool.query("select count(*)::int n from candidates where sweep_id = $1", [big.id])).rows[0].n;
  // The engine alone on a sample of the same scenarios, in this process, at the same load: what the
  // queue adds is the difference to 200 × this / workers.
  const [row] = await db.select({ baseSpec: sweeps.baseSpec }).from(sweeps).where(eq(sweeps.id, big.id));
  const sample = expandGrid(grid).filter((_, i) => i % 20 === 0);
  designNetwork(applyOverrides(row.baseSpec, sample[0]!) as unknown as NetworkDesignSpec);
  const e0 = performance.now();
  for (const o of sample) designNetwork(applyOverrides(row.baseSpec, o) as unknown as NetworkDesignSpec);
  const perScenario = (performance.now() - e0) / 1000 / sample.length;
  const load = (await import("node:os")).loadavg()[0]!;
  const failed = (await pool.query("select count(*)::int n from scenarios where sweep_id = $1 and status = 'failed'", [big.id])).rows[0].n;
  console.log(
    "\nSeriatim network queue benchmark (throwaway PostgreSQL, this machine)\n" +
      `  ${WORKERS} workers  200 scenarios × 62 sequences of the three-reaction example, maximising yield: ${seconds.toFixed(2)} s ` +
      `(${status}, ${count} candidates, ${failed} scenarios refused; goal 60 s)\n` +
      `  engine alone, one process: ${perScenario.toFixed(3)} s per scenario (${sample.length} scenarios), so 200 × that / ${WORKERS} = ${((200 * perScenario) / WORKERS).toFixed(1)} s without the queue; load average ${load.toFixed(1)}`,
  );
  await stopAll(ws);
  children.length = 0;
  await pool.end();
}

runQueueBench(main);
