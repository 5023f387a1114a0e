/**
 * The PostgreSQL harness shared by `npm start` (a persistent project-local cluster)
 * and `npm test` (a throwaway cluster in a temporary folder). It uses Debian's server
 * binaries directly: no Docker engine runs on these machines.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, chownSync, statSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";

const isRoot = process.getuid?.() === 0;

export interface Cluster {
  /** postgres://postgres@127.0.0.1:PORT/ (append the database name). */
  serverUrl: string;
  port: number;
  dataDir: string;
  /** "fast" ends sessions cleanly; "immediate" is for a forced stop. */
  stop(mode?: "fast" | "immediate"): void;
}

function findPgBin(): string | undefined {
  const base = "/usr/lib/postgresql";
  if (!existsSync(base)) return undefined;
  const versions = readdirSync(base)
    .filter((v) => existsSync(path.join(base, v, "bin", "initdb")))
    .sort((a, b) => Number(a) - Number(b));
  const last = versions.at(-1);
  return last ? path.join(base, last, "bin") : undefined;
}

/** Returns the folder of initdb/pg_ctl, installing Debian's postgresql package when root. */
export function ensurePostgresBinaries(log: (m: string) => void = console.log): string {
  const found = findPgBin();
  if (found) return found;
  if (!isRoot) {
    throw new Error(
      "PostgreSQL server binaries are missing. Install them with:\n  sudo apt-get update && sudo apt-get install -y postgresql",
    );
  }
  log("installing Debian's postgresql package (first run only)…");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "-qq", "postgresql"], { stdio: "inherit", env });
  const bin = findPgBin();
  if (!bin) throw new Error("apt-get installed postgresql but no initdb was found under /usr/lib/postgresql");
  return bin;
}

/** Runs a server binary as the postgres user when we are root (initdb refuses root). */
function runPg(bin: string, tool: string, args: string[], opts: { quiet?: boolean; ownSession?: boolean } = {}): void {
  const cmd = path.join(bin, tool);
  const [file0, argv0] = isRoot ? ["runuser", ["-u", "postgres", "--", cmd, ...args]] : [cmd, args];
  // In a session of its own, a Ctrl-C sent to the terminal's whole process group cannot cut it
  // short half-way (a stop killed before it signals the server would leave the server running).
  const [file, argv] = opts.ownSession ? ["setsid", ["--wait", file0, ...argv0]] : [file0, argv0];
  const r = spawnSync(file, argv, { stdio: opts.quiet ? "pipe" : "inherit", encoding: "utf8" });
  if (r.status !== 0) {
    const out = opts.quiet ? `\n${r.stdout ?? ""}${r.stderr ?? ""}` : "";
    throw new Error(`${tool} ${args.join(" ")} failed (exit ${r.status})${out}`);
  }
}

function giveToPostgres(dir: string): void {
  if (!isRoot) return;
  const uid = Number(execFileSync("id", ["-u", "postgres"], { encoding: "utf8" }).trim());
  const gid = Number(execFileSync("id", ["-g", "postgres"], { encoding: "utf8" }).trim());
  chownSync(dir, uid, gid);
}

/** True when the postgres user can reach `dir` (every parent must be traversable). */
function reachableByPostgres(dir: string): boolean {
  if (!isRoot) return true;
  return spawnSync("runuser", ["-u", "postgres", "--", "test", "-x", dir]).status === 0;
}

export async function isPortFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const srv = createServer();
    srv.once("error", () => resolve(false));
    srv.listen(port, "127.0.0.1", () => srv.close(() => resolve(true)));
  });
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const addr = srv.address();
      const port = typeof addr === "object" && addr ? addr.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

function startServer(bin: string, dataDir: string, port: number, extra: string[]): void {
  const socketDir = path.join(dataDir, "..", "socket");
  mkdirSync(socketDir, { recursive: true });
  giveToPostgres(socketDir);
  const opts = ["-c listen_addresses=127.0.0.1", `-p ${port}`, `-k ${socketDir}`, ...extra].join(" ");
  runPg(bin, "pg_ctl", ["-D", dataDir, "-l", path.join(dataDir, "..", "server.log"), "-w", "-t", "60", "-o", opts, "start"], {
    quiet: true,
  });
}

function stopServer(bin: string, dataDir: string, mode: "fast" | "immediate" = "fast"): void {
  try {
    runPg(bin, "pg_ctl", ["-D", dataDir, "-m", mode, "-w", "stop"], { quiet: true, ownSession: true });
  } catch {
    // Already stopped; or, should the stop itself have been cut short, once more while a server runs there.
    if (existsSync(path.join(dataDir, "postmaster.pid"))) {
      try {
        runPg(bin, "pg_ctl", ["-D", dataDir, "-m", mode, "-w", "stop"], { quiet: true, ownSession: true });
      } catch {
        // stopped meanwhile
      }
    }
  }
}

/** Stops the server of `dataDir` if one runs there (a stale one left by a crashed start). */
export function stopClusterAt(dataDir: string, mode: "fast" | "immediate" = "fast"): void {
  const bin = findPgBin();
  if (bin && existsSync(path.join(dataDir, "postmaster.pid"))) stopServer(bin, dataDir, mode);
}

/** `pg_ctl restart -m fast` on a running cluster, keeping its options (used by the system tests). */
export function restartClusterAt(dataDir: string): void {
  const bin = findPgBin();
  if (!bin) throw new Error("PostgreSQL server binaries are missing");
  runPg(bin, "pg_ctl", ["-D", dataDir, "-m", "fast", "-w", "-t", "60", "-l", path.join(dataDir, "..", "server.log"), "restart"], { quiet: true });
}

/**
 * Where the persistent cluster of a checkout lives: inside it, or, when the postgres user
 * cannot enter the checkout (a folder under /root, a private temp folder), in a folder of
 * its own under /var/tmp named by a hash of the checkout's full path.
 */
export function clusterBaseFor(root: string): string {
  if (reachableByPostgres(root)) return root;
  const key = createHash("sha256").update(path.resolve(root)).digest("hex").slice(0, 16);
  return path.join("/var/tmp", `seriatim-${key}`);
}

function initCluster(bin: string, dataDir: string): void {
  mkdirSync(dataDir, { recursive: true });
  giveToPostgres(dataDir);
  giveToPostgres(path.dirname(dataDir));
  runPg(bin, "initdb", ["-D", dataDir, "-U", "postgres", "-A", "trust", "-E", "UTF8", "--locale=C.UTF-8", "--no-sync"], {
    quiet: true,
  });
}

export async function createDatabase(serverUrl: string, name: string): Promise<string> {
  const client = new pg.Client({ connectionString: `${serverUrl}postgres` });
  await client.connect();
  try {
    const exists = await client.query("select 1 from pg_database where datname = $1", [name]);
    if (exists.rowCount === 0) await client.query(`create database "${name.replace(/"/g, "")}"`);
  } finally {
    await client.end();
  }
  return `${serverUrl}${name}`;
}

/**
 * A project-local cluster that survives restarts (`npm start`). Created on first use
 * under `root`, started on `port` on loopback only.
 */
export async function startPersistentCluster(root: string, port: number): Promise<Cluster> {
  const bin = ensurePostgresBinaries();
  mkdirSync(root, { recursive: true });
  const base = clusterBaseFor(root);
  mkdirSync(base, { recursive: true });
  giveToPostgres(base);
  const dataDir = path.join(base, "data");
  if (!existsSync(path.join(dataDir, "PG_VERSION"))) initCluster(bin, dataDir);
  if (existsSync(path.join(dataDir, "postmaster.pid"))) stopServer(bin, dataDir);
  if (!(await isPortFree(port))) {
    throw new Error(`Port ${port} on 127.0.0.1 is taken. Set SERIATIM_PG_PORT to another port, or DATABASE_URL to a server.`);
  }
  startServer(bin, dataDir, port, []);
  return {
    serverUrl: `postgres://postgres@127.0.0.1:${port}/`,
    port,
    dataDir,
    stop: (mode: "fast" | "immediate" = "fast") => stopServer(bin, dataDir, mode),
  };
}

/** A throwaway cluster in a temporary folder on a free port (`npm test`); stop() removes it. */
export async function startThrowawayCluster(): Promise<Cluster> {
  const bin = ensurePostgresBinaries();
  const base = mkdtempSync(path.join(tmpdir(), "seriatim-pg-"));
  giveToPostgres(base);
  const dataDir = path.join(base, "data");
  initCluster(bin, dataDir);
  const port = await freePort();
  startServer(bin, dataDir, port, ["-c fsync=off", "-c synchronous_commit=off", "-c full_page_writes=off"]);
  return {
    serverUrl: `postgres://postgres@127.0.0.1:${port}/`,
    port,
    dataDir,
    stop: () => {
      stopServer(bin, dataDir);
      if (existsSync(base) && statSync(base).isDirectory()) rmSync(base, { recursive: true, force: true });
    },
  };
}
