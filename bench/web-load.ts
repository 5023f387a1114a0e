/**
 * HTTP load for the benches: the production web server started as `next start` (one process) or as
 * `npm start` runs it (scripts/web-server.mjs, one process per core), and autocannon runs whose
 * latencies are read per response so the percentiles are exact.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { loadavg } from "node:os";
import path from "node:path";
import autocannon from "autocannon";
import { freePort } from "../scripts/lib/postgres";
import { waitForHttp } from "../scripts/lib/processes";
import { benchRoot as root } from "./queue-bench-setup";

export interface LoadRequest {
  method: "GET";
  path: string;
  headers?: Record<string, string>;
}

const percentile = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] : NaN);

export const loadAverage = () =>
  loadavg()
    .map((l) => l.toFixed(2))
    .join(" ");

/** The production server on a free loopback port, resolved once its health route answers. */
export async function startWebServer(mode: "single" | "cluster", env: NodeJS.ProcessEnv) {
  const port = await freePort();
  const args =
    mode === "single"
      ? [path.join(root, "node_modules/next/dist/bin/next"), "start", "-H", "127.0.0.1", "-p", String(port)]
      : [path.join(root, "scripts/web-server.mjs"), "127.0.0.1", String(port)];
  const child: ChildProcess = spawn(process.execPath, [...(process.env.BENCH_CPU_PROF ? ["--cpu-prof", `--cpu-prof-dir=${path.join(process.env.BENCH_CPU_PROF, mode)}`] : []), ...args], { cwd: root, env, stdio: "ignore" });
  await waitForHttp(`http://127.0.0.1:${port}/api/health`, 120_000, () => child.exitCode === null);
  const label = mode === "single" ? "next start, 1 process" : `scripts/web-server.mjs, ${env.WEB_PROCESSES ?? "one per core"} processes`;
  return { child, url: `http://127.0.0.1:${port}`, label };
}

/** Each request once, one after another, then a short run: code compiled and warm, kept answers filled. */
export async function warmUp(url: string, requests: LoadRequest[], headers: Record<string, string>): Promise<void> {
  for (const r of requests) await (await fetch(url + r.path, { headers })).arrayBuffer();
  await loadFigures(url, { requests, headers, seconds: 3 });
}

/** The same requests again, each naming the ETag its first answer carried (as a browser's repeat does). */
export async function withTags(url: string, requests: LoadRequest[], headers: Record<string, string>): Promise<LoadRequest[]> {
  return Promise.all(
    requests.map(async (r) => {
      const res = await fetch(url + r.path, { headers });
      await res.arrayBuffer();
      const etag = res.headers.get("etag");
      return etag ? { ...r, headers: { ...headers, "if-none-match": etag } } : r;
    }),
  );
}

/** One autocannon run of 50 connections: closed loop, or open at `overallRate` requests/s in all. */
export async function loadFigures(url: string, o: { requests: LoadRequest[]; headers: Record<string, string>; seconds: number; overallRate?: number }): Promise<string> {
  const times: number[] = [];
  const statuses = new Map<number, number>();
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const inst = autocannon(
      { url, connections: 50, duration: o.seconds, headers: o.headers, requests: o.requests, ...(o.overallRate ? { overallRate: o.overallRate } : {}) },
      (err, res) => (err ? reject(err) : resolve(res)),
    );
    inst.on("response", (_client, status, _bytes, responseTime) => {
      times.push(responseTime);
      statuses.set(status, (statuses.get(status) ?? 0) + 1);
    });
  });
  times.sort((a, b) => a - b);
  const codes = [...statuses].map(([code, n]) => `${n}×${code}`).join(" ");
  return (
    `${result.requests.total} requests (${codes}), ${result.requests.average.toFixed(0)} req/s, ` +
    `p50 ${percentile(times, 50).toFixed(1)} ms, p95 ${percentile(times, 95).toFixed(1)} ms, p99 ${percentile(times, 99).toFixed(1)} ms`
  );
}
