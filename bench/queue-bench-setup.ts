/**
 * What the queue benches share (bench/queue.bench.ts, bench/network-queue.bench.ts): a migrated,
 * demo-seeded database on a throwaway cluster with the demo engineer and a project of theirs, and
 * worker processes started and stopped the way production runs them.
 */
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { eq } from "drizzle-orm";
import pg from "pg";
import { SMTPServer } from "smtp-server";
import { createDb } from "../db/client";
import { runMigrations } from "../db/migrate";
import { users } from "../db/schema";
import { seedDemoData } from "../lib/demo/seed";
import { createDatabase, startThrowawayCluster } from "../scripts/lib/postgres";

export const benchRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");

/** A mail sink on a free loopback port for the workers' "sweep finished" mail (discarded), started once. */
let mailSink: Promise<{ url: string; server: SMTPServer }> | null = null;
function startMailSink() {
  mailSink ??= new Promise((resolve) => {
    const server = new SMTPServer({ authOptional: true, disabledCommands: ["STARTTLS"], logger: false, onData: (stream, _s, done) => (stream.resume(), stream.on("end", () => done())) });
    server.listen(0, "127.0.0.1", () => {
      const address = server.server.address();
      resolve({ url: `smtp://127.0.0.1:${typeof address === "object" && address ? address.port : 0}`, server });
    });
  });
  return mailSink;
}

/** `n` worker processes, resolved once each says it is listening for jobs; their mail goes to a local sink. */
export async function startWorkers(n: number, baseEnv: NodeJS.ProcessEnv): Promise<ChildProcess[]> {
  const env = { ...baseEnv, SMTP_URL: (await startMailSink()).url };
  return Promise.all(
    Array.from({ length: n }, () => {
      const child = spawn(process.execPath, ["--import", "tsx", "worker/index.ts"], { cwd: benchRoot, env, stdio: ["ignore", "pipe", "inherit"] });
      return new Promise<ChildProcess>((resolve) => child.stdout!.on("data", (d: Buffer) => d.toString().includes("listening for jobs") && resolve(child)));
    }),
  );
}

export async function stopAll(children: ChildProcess[]) {
  await Promise.all(children.map((c) => new Promise((r) => (c.on("exit", r), c.kill("SIGTERM")))));
}

/** A fresh database `name` on the cluster, migrated and seeded with the demo; DATABASE_URL points at it. */
export async function seededBenchDatabase(serverUrl: string, name: string) {
  const url = await createDatabase(serverUrl, name);
  process.env.DATABASE_URL = url;
  await runMigrations(url);
  const pool = new pg.Pool({ connectionString: url, max: 4 });
  const db = createDb(pool);
  await seedDemoData(db);
  // Imported only now: the services read DATABASE_URL when first loaded.
  const { loadActor } = await import("../lib/authz/actor");
  const [eli] = await db.select().from(users).where(eq(users.email, "eli.engineer@brightwater.example"));
  const actor = (await loadActor(db, eli.id))!;
  const projectId = (await pool.query("select id from projects where team_id = $1 limit 1", [actor.teamId])).rows[0].id as string;
  return { url, pool, db, actor, projectId };
}

/**
 * Runs a queue bench on a throwaway cluster: `body` gets the cluster's server URL and a list to put
 * the processes it starts in; whatever is still running is stopped and the cluster removed afterwards,
 * then the process exits (1 on an error, printed).
 */
export function runQueueBench(body: (serverUrl: string, children: ChildProcess[]) => Promise<void>): void {
  const run = async () => {
    const cluster = await startThrowawayCluster();
    const children: ChildProcess[] = [];
    try {
      await body(cluster.serverUrl, children);
    } finally {
      await stopAll(children.filter((c) => c.exitCode === null));
      if (mailSink) (await mailSink).server.close();
      cluster.stop();
    }
  };
  run().then(
    () => process.exit(0),
    (err) => {
      console.error(err);
      process.exit(1);
    },
  );
}
