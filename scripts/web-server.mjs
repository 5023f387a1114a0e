// The production web server `npm start` runs: Next.js's production handler in one process per
// core, all sharing one port through Node's cluster module (the primary accepts connections and
// hands them to the workers in turn). Plain JavaScript so the web processes load no TypeScript
// loader. Usage: node scripts/web-server.mjs <host> <port>
//   WEB_PROCESSES  how many web processes (default: the number of cores; 1 serves from this process)
// The primary restarts a worker that dies, and on SIGTERM/SIGINT/SIGHUP stops them all and then
// itself. Workers stop on the same signals (a signal to the process group reaches each of them)
// and also when the primary goes without telling them.
import cluster from "node:cluster";
import http from "node:http";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const [host = "127.0.0.1", portText = process.env.PORT ?? "3000"] = process.argv.slice(2);
const port = Number(portText);
const SIGNALS = ["SIGTERM", "SIGINT", "SIGHUP"];

/** WEB_PROCESSES, or one per core; anything but a whole number from 1 up is refused at start. */
function processCount() {
  const raw = process.env.WEB_PROCESSES;
  if (raw === undefined || raw === "") return Math.max(1, os.availableParallelism());
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 1 || n > 256) {
    console.error(`WEB_PROCESSES must be a whole number from 1 to 256 (got "${raw}")`);
    process.exit(2);
  }
  return n;
}

/** Next.js's production handler behind a plain HTTP server on host:port (shared when in a cluster). */
async function serve() {
  const { default: createNext } = await import("next");
  const app = createNext({ dev: false, dir: root, hostname: host, port });
  await app.prepare();
  const handle = app.getRequestHandler();
  const server = http.createServer((req, res) => void handle(req, res));
  // Longer than a balancer's idle timeout (commonly 60 s), so the balancer closes first.
  server.keepAliveTimeout = 65_000;
  let stopping = false;
  const stop = () => {
    if (stopping) return;
    stopping = true;
    server.close(() => process.exit(0));
    server.closeIdleConnections();
    // Requests still in flight get a moment; then the process goes regardless.
    setTimeout(() => process.exit(0), 3_000).unref();
  };
  for (const sig of SIGNALS) process.on(sig, stop);
  if (cluster.isWorker) process.on("disconnect", stop);
  await new Promise((resolve, reject) => server.once("error", reject).listen(port, host, () => resolve(undefined)));
}

function runPrimary(count) {
  let stopping = false;
  const recentDeaths = [];
  const fork = () => cluster.fork({ SERIATIM_SUPERVISOR_PID: String(process.pid) });
  cluster.on("exit", (worker, code, signal) => {
    if (stopping) {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(0);
      return;
    }
    // A worker that keeps dying at once (a broken build, a taken port) ends the server, so the
    // supervisor above sees the failure and says so, instead of a silent crash loop here.
    const now = Date.now();
    recentDeaths.push(now);
    while (recentDeaths.length && now - recentDeaths[0] > 30_000) recentDeaths.shift();
    console.error(`web process ${worker.process.pid} exited (${signal ?? `code ${code}`})${recentDeaths.length > 2 * count ? "; too many in 30 s, stopping" : "; starting another"}`);
    if (recentDeaths.length > 2 * count) return stopAll(1);
    fork();
  });
  const stopAll = (exitCode) => {
    if (stopping) return;
    stopping = true;
    const workers = Object.values(cluster.workers ?? {});
    if (workers.length === 0) process.exit(exitCode);
    for (const w of workers) w?.process.kill("SIGTERM");
    // A worker that does not go in time is killed; the primary never outlives its workers.
    setTimeout(() => {
      for (const w of Object.values(cluster.workers ?? {})) w?.process.kill("SIGKILL");
      process.exit(exitCode);
    }, 6_000).unref();
  };
  for (const sig of SIGNALS) process.on(sig, () => stopAll(0));
  console.log(`web: ${count} processes on http://${host}:${port}`);
  for (let i = 0; i < count; i++) fork();
}

if (cluster.isPrimary) {
  const count = processCount();
  if (count === 1) {
    serve().then(
      () => console.log(`web: 1 process on http://${host}:${port}`),
      (err) => (console.error(err), process.exit(1)),
    );
  } else {
    runPrimary(count);
  }
} else {
  serve().catch((err) => (console.error(err), process.exit(1)));
}
