/**
 * `npm start`: provisions and runs the whole product on this machine.
 * PostgreSQL (project-local cluster unless DATABASE_URL is set) → migrations → demo data
 * → production build (when stale) → mail fake + worker + web. Ctrl-C stops all of it.
 */
import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import pg from "pg";
import { createDb } from "../db/client";
import { runMigrations } from "../db/migrate";
import { DEMO_PASSWORD, DEMO_USERS, seedDemoData } from "../lib/demo/seed";
import { buildIsStale, runNextBuild } from "./lib/build";
import { createDatabase, isPortFree, startPersistentCluster, type Cluster } from "./lib/postgres";
import { SupervisedService, startService, waitForHttp } from "./lib/processes";
import { removeRunFile, stopStaleServices, writeRunFile } from "./lib/run-file";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const dataRoot = path.join(root, ".data");
const t0 = Date.now();
const step = (msg: string) => console.log(`› ${msg}  (${((Date.now() - t0) / 1000).toFixed(1)} s)`);
// A closed terminal (SIGHUP) makes writes to it fail; the stop must go on regardless.
for (const stream of [process.stdout, process.stderr]) stream.on("error", () => {});

const port = Number(process.env.PORT ?? 3000);
const smtpPort = Number(process.env.MAIL_FAKE_SMTP_PORT ?? 2525);
const mailHttpPort = Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2580);
const pgPort = Number(process.env.SERIATIM_PG_PORT ?? 54329);
const marker = (file: string) => path.join(root, file);

let cluster: Cluster | undefined;
const services: SupervisedService[] = [];
let shuttingDown = false;
let directSignals = 0;
// Only a start that got past the check for a running instance may remove the record.
let ownsRunFile = false;

function recordRun(): void {
  ownsRunFile = true;
  writeRunFile(root, {
    supervisor: { pid: process.pid, marker: marker("scripts/start.ts") },
    services: services.filter((s) => s.pid).map((s) => ({ name: s.name, pid: s.pid!, marker: root })),
    dataDir: cluster?.dataDir,
  });
}

/** The orderly stop: web, worker and mail fake together, then PostgreSQL last. */
async function shutdown(code: number): Promise<never> {
  if (!shuttingDown) {
    shuttingDown = true;
    console.log("\n› stopping… (a second Ctrl-C forces it)");
    await Promise.all([...services].reverse().map((s) => s.stop()));
    if (cluster) {
      cluster.stop();
      console.log("  PostgreSQL stopped");
    }
    if (ownsRunFile) removeRunFile(root);
    process.exit(code);
  }
  // A second caller waits for the first stop to finish.
  return new Promise<never>(() => {});
}

/** No waiting: kill every service outright and stop PostgreSQL in immediate mode. */
function forceStop(): never {
  console.log("\n› forced stop");
  for (const s of services) s.kill();
  cluster?.stop("immediate");
  if (ownsRunFile) removeRunFile(root);
  process.exit(130);
}

// A signal sent to the whole process group reaches us directly, and the bootstrap forwards
// its own copy as an IPC message, never as a signal: so only a second *signal* (a human
// pressing Ctrl-C twice) forces the stop; the forwarded duplicate merely asks for one.
for (const sig of ["SIGINT", "SIGTERM", "SIGHUP"] as const) {
  process.on(sig, () => {
    directSignals++;
    if (directSignals > 1 && shuttingDown) forceStop();
    void shutdown(0);
  });
}
process.on("message", (m) => {
  if (m === "stop") void shutdown(0);
});
process.on("disconnect", () => void shutdown(0));

/** A per-installation secret, kept with the data so sessions survive restarts. */
function authSecret(): string {
  if (process.env.AUTH_SECRET) return process.env.AUTH_SECRET;
  mkdirSync(dataRoot, { recursive: true });
  const file = path.join(dataRoot, "auth-secret");
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString("base64url"), { mode: 0o600 });
  return readFileSync(file, "utf8").trim();
}

async function main() {
  await stopStaleServices(root, (m) => step(m));
  for (const [name, p] of [
    ["web (PORT)", port],
    ["mail fake SMTP (MAIL_FAKE_SMTP_PORT)", smtpPort],
    ["mail fake web (MAIL_FAKE_HTTP_PORT)", mailHttpPort],
  ] as const) {
    if (!(await isPortFree(p))) throw new Error(`Port ${p} for the ${name} is taken; set that variable to a free port.`);
  }

  let databaseUrl = process.env.DATABASE_URL;
  if (databaseUrl) {
    step("using the PostgreSQL server in DATABASE_URL (no local cluster)");
  } else {
    step(`starting the project-local PostgreSQL cluster on 127.0.0.1:${pgPort}`);
    cluster = await startPersistentCluster(path.join(dataRoot, "postgres"), pgPort);
    recordRun();
    databaseUrl = await createDatabase(cluster.serverUrl, "seriatim");
  }

  step("applying migrations");
  await runMigrations(databaseUrl);
  step("seeding demo data");
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 2 });
  await seedDemoData(createDb(pool));
  await pool.end();

  const appUrl = process.env.APP_URL ?? `http://127.0.0.1:${port}`;
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    DATABASE_URL: databaseUrl,
    APP_URL: appUrl,
    AUTH_URL: `${appUrl}/api/auth`,
    AUTH_SECRET: authSecret(),
    SMTP_URL: process.env.SMTP_URL ?? `smtp://127.0.0.1:${smtpPort}`,
    MAIL_FAKE_SMTP_PORT: String(smtpPort),
    MAIL_FAKE_HTTP_PORT: String(mailHttpPort),
    NEXT_TELEMETRY_DISABLED: "1",
    NODE_ENV: "production",
  };

  if (buildIsStale(root)) {
    step("building the production app (next build)");
    runNextBuild(root, env);
  } else {
    step("production build is up to date");
  }

  if (shuttingDown) return;
  // Each service watches us (parent-watch.cjs) and stops itself if we die without stopping it.
  const node = (script: string) => [process.execPath, ["--require", marker("scripts/lib/parent-watch.cjs"), "--import", "tsx", marker(script)]] as const;
  const serviceEnv = { ...env, SERIATIM_SUPERVISOR_PID: String(process.pid) };
  const supervise = (name: string, [cmd, args]: readonly [string, readonly string[]]) => {
    const s = new SupervisedService(name, () => startService(name, cmd, [...args], serviceEnv, root), recordRun);
    services.push(s);
    return s;
  };
  step("starting mail fake, worker and web");
  supervise("mail fake", node("scripts/mail-fake.ts"));
  supervise("worker", node("worker/index.ts"));
  // One web process per core behind one port (scripts/web-server.mjs; WEB_PROCESSES sets the count).
  const web = supervise("web app", [process.execPath, ["--require", marker("scripts/lib/parent-watch.cjs"), marker("scripts/web-server.mjs"), "127.0.0.1", String(port)]]);
  recordRun();
  await waitForHttp(`http://127.0.0.1:${port}/api/health`, 120_000, () => web.restarts === 0 && web.current.child.exitCode === null);
  if (shuttingDown) return;

  const width = Math.max(...DEMO_USERS.map((u) => u.email.length));
  console.log(`
  Seriatim is running  (ready in ${((Date.now() - t0) / 1000).toFixed(1)} s)

    App          ${appUrl}
    Local mail   http://127.0.0.1:${mailHttpPort}/   (sign-in links and invitations land here)
    Database     ${databaseUrl.replace(/:[^:@/]+@/, ":***@")}${cluster ? `\n    Cluster      ${cluster.dataDir}` : ""}

  Demo sign-ins (password ${DEMO_PASSWORD}):
${DEMO_USERS.map((u) => `    ${u.email.padEnd(width)}  ${u.role.padEnd(8)}  ${u.team}`).join("\n")}

  A worker or web app that dies is started again. Ctrl-C (or SIGTERM, or closing the
  terminal) stops the app, the worker, the mail fake${cluster ? " and then PostgreSQL" : ""}.
`);
}

main().catch(async (err: Error) => {
  console.error(`\nnpm start failed: ${err.message}`);
  await shutdown(1);
});
