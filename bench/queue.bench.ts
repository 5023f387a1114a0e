/**
 * `npm run bench:queue`: the sweep queue end to end on a throwaway PostgreSQL cluster.
 *   1. a 200-scenario sweep of 62 sequences each, submit → last result stored, with 1 and 2 worker processes;
 *   2. queue latency, submit (commit) → first job started, with idle workers;
 *   3. the candidates endpoint of the production server under 50 concurrent connections (autocannon).
 * Prints figures; asserts nothing.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { existsSync } from "node:fs";
import path from "node:path";
import autocannon from "autocannon";
import { eq } from "drizzle-orm";
import { sweeps } from "../db/schema";
import { benchRoot as root, runQueueBench, seededBenchDatabase, startWorkers, stopAll } from "./queue-bench-setup";
import { freePort } from "../scripts/lib/postgres";
import { waitForHttp } from "../scripts/lib/processes";
import type { GridAxis } from "../lib/sweeps/grid";

const SCENARIOS_FLOW = 20;
const SCENARIOS_TARGET = 10;

const kinetics = {
  feed: { flowA: 0.02, concA: 1000, temperature: 340, ratios: { B: 1.2 } },
  reaction: { stoichiometry: { A: -1, B: -1, R: 1 }, phase: "liquid" as const, rate: { law: "power" as const, k: 1e-4, orders: { A: 1, B: 1 } } },
};

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];

async function main(serverUrl: string, children: ChildProcess[]) {
  const { url, pool, db, actor, projectId } = await seededBenchDatabase(serverUrl, "bench_queue");
  const { createKineticsModel } = await import("../lib/services/kinetics");
  const { createSweep } = await import("../lib/services/sweeps");
  const { createApiToken } = await import("../lib/services/tokens");
  const { version } = await createKineticsModel(db, actor, projectId, { name: "Bench second order", spec: kinetics, note: "" });
  const env: NodeJS.ProcessEnv = { ...process.env, DATABASE_URL: url, NODE_ENV: "production" as const };

  const grid: GridAxis[] = [
    { field: "feed.flowA", from: 0.01, to: 0.05, steps: SCENARIOS_FLOW },
    { field: "target.conversion", from: 0.8, to: 0.95, steps: SCENARIOS_TARGET },
  ];
  const submit = (g: GridAxis[]) => createSweep(db, actor, projectId, { kineticsVersionId: version.id, target: { conversion: 0.9 }, train: { maxStages: 5, types: ["CSTR", "PFR"] }, grid: g });
  const waitDone = async (id: string) => {
    for (;;) {
      const [s] = await db.select({ status: sweeps.status, done: sweeps.done }).from(sweeps).where(eq(sweeps.id, id));
      if (s.status !== "queued" && s.status !== "running") return s.status;
      await new Promise((r) => setTimeout(r, 20));
    }
  };
  const firstStartMs = async (sweepId: string) => {
    const r = await pool.query(
      `select extract(epoch from (select min(started_on) from pgboss.job where id::text in (select jsonb_array_elements_text(job_ids) from sweeps where id = $1))
         - (select created_at from sweeps where id = $1)) * 1000 as ms`,
      [sweepId],
    );
    return Number(r.rows[0].ms);
  };

  const rows: string[] = [];
  let bigSweepId = "";
  const timings: Record<number, number> = {};
  for (const n of [1, 2]) {
    const ws = await startWorkers(n, env);
    children.push(...ws);
    await waitDone((await submit([{ field: "feed.flowA", values: [0.01, 0.02, 0.03, 0.04] }])).id); // warm-up
    const latencies: number[] = [];
    for (let i = 0; i < 5; i++) {
      await new Promise((r) => setTimeout(r, 700)); // let the workers go idle
      const s = await submit([]);
      await waitDone(s.id);
      latencies.push(await firstStartMs(s.id));
    }
    const t0 = performance.now();
    const big = await submit(grid);
    const status = await waitDone(big.id);
    const seconds = (performance.now() - t0) / 1000;
    timings[n] = seconds;
    bigSweepId = big.id;
    const count = (await pool.query("select count(*)::int n from candidates where sweep_id = $1", [big.id])).rows[0].n;
    latencies.sort((a, b) => a - b);
    rows.push(
      `  ${n} worker${n > 1 ? "s" : " "}  200 scenarios × 62 sequences: ${seconds.toFixed(2)} s (${status}, ${count} candidates, ${(count / seconds).toFixed(0)} candidates/s); ` +
        `submit → first job started: median ${latencies[2].toFixed(0)} ms, max ${latencies[4].toFixed(0)} ms`,
    );
    await stopAll(ws);
    children.length = 0;
  }

  // The candidates endpoint of the production server, under load.
  if (!existsSync(path.join(root, ".next", "BUILD_ID"))) spawnSync(path.join(root, "node_modules/.bin/next"), ["build"], { cwd: root, stdio: "inherit", env });
  const port = await freePort();
  const web = spawn(path.join(root, "node_modules/.bin/next"), ["start", "-H", "127.0.0.1", "-p", String(port)], { cwd: root, env, stdio: "ignore" });
  children.push(web);
  await waitForHttp(`http://127.0.0.1:${port}/api/health`, 60_000);
  const { token } = await createApiToken(db, actor, { name: "bench" });
  const total = (await pool.query("select count(*)::int n from candidates where sweep_id = $1", [bigSweepId])).rows[0].n;
  const requests = Array.from({ length: 50 }, (_, i) => ({
    method: "GET" as const,
    path: `/api/sweeps/${bigSweepId}/scenarios/${(i * 7) % 200}/candidates?sort=${["totalVolume", "rank", "stageCount"][i % 3]}&dir=${i % 2 ? "desc" : "asc"}&page=${1 + (i % 2)}&pageSize=25`,
  }));
  // Closed loop: every connection sends its next request as soon as the last one is answered,
  // so this measures the server's saturation throughput (latency = connections / throughput).
  // Open loop: 50 connections sharing a fixed offered rate, as 50 people paging through
  // results would; latency then shows service time plus any queueing.
  const load = async (overallRate?: number) => {
    const times: number[] = [];
    const result = await new Promise<autocannon.Result>((resolve, reject) => {
      const inst = autocannon(
        { url: `http://127.0.0.1:${port}`, connections: 50, duration: 10, headers: { authorization: `Bearer ${token}` }, requests, ...(overallRate ? { overallRate } : {}) },
        (err, res) => (err ? reject(err) : resolve(res)),
      );
      inst.on("response", (_client, _status, _bytes, responseTime) => times.push(responseTime));
    });
    times.sort((a, b) => a - b);
    return (
      `${result.requests.total} requests, ${result.non2xx} non-2xx, ${result.requests.average.toFixed(0)} req/s, ` +
      `p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${percentile(times, 95).toFixed(1)} ms, p99 ${percentile(times, 99).toFixed(1)} ms`
    );
  };
  const closed = await load();
  const open = await load(100);
  rows.push(`  candidates endpoint, sweep of ${total} candidates, sorted + paged (25 rows), 50 connections, 10 s each:`);
  rows.push(`    closed loop (saturation): ${closed}`);
  rows.push(`    open loop at 100 req/s:   ${open}`);
  console.log("\nSeriatim queue benchmark (throwaway PostgreSQL, this machine)\n" + rows.join("\n"));
  console.log(`  speed-up 1 → 2 workers: ${(timings[1] / timings[2]).toFixed(2)}×`);
  await pool.end();
}

runQueueBench(main);
