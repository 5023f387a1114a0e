/**
 * `npm run bench:queue`: the sweep queue end to end on a throwaway PostgreSQL cluster.
 *   1. a 200-scenario sweep of 62 sequences each, submit → last result stored, with 1 and 2 worker processes,
 *      and the largest sweep (2,000 scenarios) with 2;
 *   2. queue latency, submit (commit) → first job started, with idle workers;
 *   3. the candidates endpoint of the production server under 50 concurrent connections (autocannon), a
 *      finished sweep's and a running sweep's, served by one `next start` process and by the clustered
 *      server of `npm start` (scripts/web-server.mjs), with the health route's throughput beside.
 * BENCH_WEB_ONLY=1 skips the worker figures (1 and 2) and the queue latency; BENCH_SECONDS sets each run's length;
 * BENCH_CPU_PROF=<dir> writes CPU profiles of the web processes (node --cpu-prof) under <dir>/single and <dir>/cluster.
 * Prints figures; asserts nothing.
 */
import { spawnSync, type ChildProcess } from "node:child_process";
import { existsSync } from "node:fs";
import path from "node:path";
import { eq } from "drizzle-orm";
import { sweeps } from "../db/schema";
import { benchRoot as root, runQueueBench, seededBenchDatabase, startWorkers, stopAll } from "./queue-bench-setup";
import { loadAverage, loadFigures, startWebServer, warmUp, withTags, type LoadRequest } from "./web-load";
import type { GridAxis } from "../lib/sweeps/grid";

const SCENARIOS_FLOW = 20;
const SCENARIOS_TARGET = 10;
/** Scenarios of the running sweep stored before the endpoint is measured. */
const RUNNING_DONE = 40;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);

const kinetics = {
  feed: { flowA: 0.02, concA: 1000, temperature: 340, ratios: { B: 1.2 } },
  reaction: { stoichiometry: { A: -1, B: -1, R: 1 }, phase: "liquid" as const, rate: { law: "power" as const, k: 1e-4, orders: { A: 1, B: 1 } } },
};

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
  // BENCH_WEB_ONLY=1: only what the endpoint figures need (the sweep, stored once by 2 workers).
  for (const n of process.env.BENCH_WEB_ONLY ? [2] : [1, 2]) {
    const ws = await startWorkers(n, env);
    children.push(...ws);
    await waitDone((await submit([{ field: "feed.flowA", values: [0.01, 0.02, 0.03, 0.04] }])).id); // warm-up
    const latencies: number[] = [];
    for (let i = 0; i < (process.env.BENCH_WEB_ONLY ? 0 : 5); i++) {
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
    if (latencies.length) rows.push(
      `  ${n} worker${n > 1 ? "s" : " "}  200 scenarios × 62 sequences: ${seconds.toFixed(2)} s (${status}, ${count} candidates, ${(count / seconds).toFixed(0)} candidates/s); ` +
        `submit → first job started: median ${latencies[2].toFixed(0)} ms, max ${latencies[4].toFixed(0)} ms`,
    );
    if (n === 2 && !process.env.BENCH_WEB_ONLY) {
      // The largest sweep a user can submit: 2,000 scenarios (200 flows × 10 targets) of 62 sequences.
      const t1 = performance.now();
      const large = await submit([
        { field: "feed.flowA", from: 0.01, to: 0.05, steps: 200 },
        { field: "target.conversion", from: 0.8, to: 0.95, steps: 10 },
      ]);
      const largeStatus = await waitDone(large.id);
      const largeSeconds = (performance.now() - t1) / 1000;
      const sized = (await pool.query("select count(*)::int n, sum(pg_column_size(c.*))::bigint bytes from candidates c where sweep_id = $1", [large.id])).rows[0];
      rows.push(
        `  2 workers  2,000 scenarios × 62 sequences (the largest sweep): ${largeSeconds.toFixed(1)} s (${largeStatus}, ${sized.n} candidates, ${(sized.n / largeSeconds).toFixed(0)} candidates/s; ` +
          `its rows' own data ${(Number(sized.bytes) / 1e6).toFixed(1)} MB)`,
      );
    }
    await stopAll(ws);
    children.length = 0;
  }

  // Storage: the candidates table with its indexes (TOAST included) shared out per candidate, and the
  // big sweep's share of it.
  const st = (
    await pool.query(
      `select pg_total_relation_size('candidates')::bigint total, (select count(*) from candidates)::int n,
              (select sum(pg_column_size(c.*)) from candidates c where sweep_id = $1)::bigint sweep_data,
              (select count(*) from candidates where sweep_id = $1)::int sweep_n`,
      [bigSweepId],
    )
  ).rows[0];
  const perCandidate = Number(st.total) / st.n;
  rows.push(
    `  storage: candidates table with indexes ${(Number(st.total) / 1e6).toFixed(1)} MB for ${st.n} candidates = ${perCandidate.toFixed(0)} bytes a candidate; ` +
      `the 200 × 62 sweep about ${((perCandidate * st.sweep_n) / 1e6).toFixed(1)} MB (its rows' own data ${(Number(st.sweep_data) / 1e6).toFixed(1)} MB)`,
  );

  // The candidates endpoint under load: a finished sweep (kept answers) and a running one (read
  // each time), served by `next start` (one process, as before scripts/web-server.mjs) and by the
  // clustered server `npm start` runs (one process per core).
  if (!existsSync(path.join(root, ".next", "BUILD_ID"))) spawnSync(path.join(root, "node_modules/.bin/next"), ["build"], { cwd: root, stdio: "inherit", env });
  const { token } = await createApiToken(db, actor, { name: "bench" });
  const total = (await pool.query("select count(*)::int n from candidates where sweep_id = $1", [bigSweepId])).rows[0].n;
  const running = await submit(grid);
  const { runSweepChunk } = await import("../lib/services/sweep-chunks");
  await runSweepChunk(db, { sweepId: running.id, from: 0, to: RUNNING_DONE });
  const finishedRequests = Array.from({ length: 50 }, (_, i) => ({
    method: "GET" as const,
    path: `/api/sweeps/${bigSweepId}/scenarios/${(i * 7) % 200}/candidates?sort=${["totalVolume", "rank", "stageCount"][i % 3]}&dir=${i % 2 ? "desc" : "asc"}&page=${1 + (i % 2)}&pageSize=25`,
  }));
  // A running sweep's first page, as its page asks for it: the first 25 by rank of a scenario that has results.
  const runningRequests = Array.from({ length: 50 }, (_, i) => ({ method: "GET" as const, path: `/api/sweeps/${running.id}/scenarios/${i % RUNNING_DONE}/candidates?sort=rank&page=1&pageSize=25` }));
  const auth = { authorization: `Bearer ${token}` };
  rows.push(`  candidates endpoint, finished sweep of ${total} candidates, sorted + paged (25 rows), 50 connections, ${SECONDS} s each; running sweep: ${RUNNING_DONE} of 200 scenarios stored:`);
  for (const mode of ["single", "cluster"] as const) {
    const server = await startWebServer(mode, env);
    children.push(server.child);
    const at = (requests: LoadRequest[], overallRate?: number, headers: Record<string, string> = auth) => loadFigures(server.url, { requests, overallRate, headers, seconds: SECONDS });
    // Warm-up: every URL once (a finished answer is then kept) and a short run for the JIT.
    await warmUp(server.url, [...finishedRequests, ...runningRequests], auth);
    const tagged = await withTags(server.url, finishedRequests, auth);
    rows.push(`   ${server.label}  (load average ${loadAverage()} before this server's runs)`);
    rows.push(`    health route (the framework's floor), closed loop: ${await at([{ method: "GET", path: "/api/health" }], undefined, {})}`);
    rows.push(`    finished, closed loop (saturation):     ${await at(finishedRequests)}`);
    rows.push(`    finished, open loop at 200 req/s:       ${await at(finishedRequests, 200)}`);
    rows.push(`    finished, repeat with If-None-Match:    ${await at(tagged)}`);
    rows.push(`    running, first page, closed loop:       ${await at(runningRequests)}`);
    rows.push(`    running, first page, open at 200 req/s: ${await at(runningRequests, 200)}`);
    await stopAll([server.child]);
    children.length = 0;
  }
  console.log("\nSeriatim queue benchmark (throwaway PostgreSQL, this machine)\n" + rows.join("\n"));
  if (timings[1]) console.log(`  speed-up 1 → 2 workers: ${(timings[1] / timings[2]).toFixed(2)}×`);
  await pool.end();
}

runQueueBench(main);
