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
import { DEMO_PASSWORD, DEMO_USERS, seedDemoData } from "../db/seed";
import { buildIsStale, runNextBuild } from "./lib/build";
import { createDatabase, isPortFree, startPersistentCluster, type Cluster } from "./lib/postgres";
import { startService, stopService, waitForHttp, type Managed } from "./lib/processes";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const dataRoot = path.join(root, ".data");
const t0 = Date.now();
const step = (msg: string) => console.log(`› ${msg}  (${((Date.now() - t0) / 1000).toFixed(1)} s)`);

const port = Number(process.env.PORT ?? 3000);
const smtpPort = Number(process.env.MAIL_FAKE_SMTP_PORT ?? 2525);
const mailHttpPort = Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2580);
const pgPort = Number(process.env.SERIATIM_PG_PORT ?? 54329);

let cluster: Cluster | undefined;
const services: Managed[] = [];
let shuttingDown = false;

async function shutdown(code: number): Promise<never> {
  if (!shuttingDown) {
    shuttingDown = true;
    console.log("\n› stopping…");
    for (const s of [...services].reverse()) await stopService(s);
    if (cluster) {
      cluster.stop();
      console.log("  PostgreSQL stopped");
    }
  }
  process.exit(code);
}
process.on("SIGINT", () => void shutdown(0));
process.on("SIGTERM", () => void shutdown(0));

/** A per-installation secret, kept with the data so sessions survive restarts. */
function authSecret(): string {
  if (process.env.AUTH_SECRET) return process.env.AUTH_SECRET;
  mkdirSync(dataRoot, { recursive: true });
  const file = path.join(dataRoot, "auth-secret");
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString("base64url"), { mode: 0o600 });
  return readFileSync(file, "utf8").trim();
}

async function main() {
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

  const tsx = [process.execPath, "--import", "tsx"];
  step("starting mail fake, worker and web");
  services.push(startService("mail", tsx[0], [...tsx.slice(1), "scripts/mail-fake.ts"], env, root));
  services.push(startService("worker", tsx[0], [...tsx.slice(1), "worker/index.ts"], env, root));
  const web = startService("web", path.join(root, "node_modules", ".bin", "next"), ["start", "-H", "127.0.0.1", "-p", String(port)], env, root);
  services.push(web);
  for (const s of services) {
    void s.exited.then((code) => {
      if (!shuttingDown) {
        console.error(`${s.name} exited unexpectedly (code ${code}); stopping everything`);
        void shutdown(1);
      }
    });
  }
  await waitForHttp(`http://127.0.0.1:${port}/api/health`, 60_000, () => web.child.exitCode === null);

  const width = Math.max(...DEMO_USERS.map((u) => u.email.length));
  console.log(`
  Seriatim is running  (ready in ${((Date.now() - t0) / 1000).toFixed(1)} s)

    App          ${appUrl}
    Local mail   http://127.0.0.1:${mailHttpPort}/   (sign-in links and invitations land here)
    Database     ${databaseUrl.replace(/:[^:@/]+@/, ":***@")}

  Demo sign-ins (password ${DEMO_PASSWORD}):
${DEMO_USERS.map((u) => `    ${u.email.padEnd(width)}  ${u.role.padEnd(8)}  ${u.team}`).join("\n")}

  Ctrl-C stops the app, the worker, the mail fake${cluster ? " and PostgreSQL" : ""}.
`);
}

main().catch(async (err: Error) => {
  console.error(`\nnpm start failed: ${err.message}`);
  await shutdown(1);
});
