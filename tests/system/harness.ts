/**
 * Runs the real `npm start` in a fresh clone of this repository: committed files only, with
 * this checkout's node_modules and production build (.next) linked in so nothing is
 * installed or built again. Processes are found through /proc, by the clone's and the
 * cluster's folders in their working directory or command line.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { existsSync, mkdtempSync, readdirSync, readFileSync, readlinkSync, rmSync, symlinkSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { freePort, isPortFree } from "../../scripts/lib/postgres";
import { waitFor } from "../helpers/worker-process";

export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..", "..");
export { waitFor };

export interface Checkout {
  dir: string;
  ports: { web: number; smtp: number; mailHttp: number; pg: number };
  /** The cluster's data folder, once a start has printed it. */
  dataDir?: string;
  remove(): void;
}

export async function cloneCheckout(): Promise<Checkout> {
  if (!existsSync(path.join(repoRoot, ".next", "BUILD_ID"))) throw new Error("The system tests need a production build: run them through `npm test -- system`.");
  // mkdtemp makes a 0700 folder the postgres user cannot enter: the cluster then lives
  // outside the checkout, which is the case these tests must cover.
  const dir = mkdtempSync(path.join(tmpdir(), "seriatim-system-"));
  const clone = spawnSync("git", ["clone", "--quiet", "--no-hardlinks", repoRoot, dir], { encoding: "utf8" });
  if (clone.status !== 0) throw new Error(`git clone failed: ${clone.stderr}`);
  symlinkSync(path.join(repoRoot, "node_modules"), path.join(dir, "node_modules"));
  symlinkSync(path.join(repoRoot, ".next"), path.join(dir, ".next"));
  // Fresh files are newer than the linked build and dependencies: date them back, or the
  // start would run `npm ci` (into the shared node_modules) and `next build` again.
  spawnSync("find", [dir, "-path", path.join(dir, ".git"), "-prune", "-o", "!", "-type", "l", "-exec", "touch", "-h", "-d", "@946684800", "{}", "+"]);
  const ports = { web: await freePort(), smtp: await freePort(), mailHttp: await freePort(), pg: await freePort() };
  const checkout: Checkout = {
    dir,
    ports,
    remove() {
      rmSync(dir, { recursive: true, force: true });
      // The cluster folder outside the checkout (/var/tmp/seriatim-<hash>).
      if (checkout.dataDir && !checkout.dataDir.startsWith(dir)) rmSync(path.dirname(checkout.dataDir), { recursive: true, force: true });
    },
  };
  return checkout;
}

export interface Running {
  npm: ChildProcess;
  output(): string;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
}

/** `npm start` in its own process group (pgid = npm's pid); resolves once the banner is out. */
export async function startProduct(checkout: Checkout, extraEnv: Record<string, string> = {}): Promise<Running> {
  const env: NodeJS.ProcessEnv = { ...process.env };
  for (const k of Object.keys(env)) if (k.startsWith("VITEST") || k === "DATABASE_URL" || k === "NODE_ENV" || k === "TEST_PG_SERVER_URL") delete env[k];
  Object.assign(env, {
    PORT: String(checkout.ports.web),
    MAIL_FAKE_SMTP_PORT: String(checkout.ports.smtp),
    MAIL_FAKE_HTTP_PORT: String(checkout.ports.mailHttp),
    SERIATIM_PG_PORT: String(checkout.ports.pg),
    // npm's once-a-week registry check for its own new version may run as npm exits; not ours to wait for.
    npm_config_update_notifier: "false",
    ...extraEnv,
  });
  const npm = spawn("npm", ["start"], { cwd: checkout.dir, env, detached: true, stdio: ["ignore", "pipe", "pipe"] });
  let out = "";
  npm.stdout!.on("data", (d: Buffer) => (out += d.toString()));
  npm.stderr!.on("data", (d: Buffer) => (out += d.toString()));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => npm.on("exit", (code, signal) => resolve({ code, signal })));
  let gone = false;
  void exited.then(() => (gone = true));
  await waitFor(async () => out.includes("Seriatim is running") || gone, 240_000, "the start banner");
  if (gone) throw new Error(`npm start ended before it was ready:\n${out}`);
  const dataDir = out.match(/Cluster\s+(\S+)/)?.[1];
  if (!dataDir) throw new Error(`the banner names no cluster folder:\n${out}`);
  checkout.dataDir = dataDir;
  return { npm, output: () => out, exited };
}

export interface ProcessInfo {
  pid: number;
  cmdline: string;
}

/** Every live process whose working directory or command line is in the clone or the cluster folder. */
export function processesOf(checkout: Checkout): ProcessInfo[] {
  const places = [checkout.dir, checkout.dataDir && path.dirname(checkout.dataDir)].filter((p): p is string => !!p);
  const found: ProcessInfo[] = [];
  for (const entry of readdirSync("/proc")) {
    const pid = Number(entry);
    if (!pid || pid === process.pid) continue;
    let cwd = "";
    let cmdline = "";
    try {
      cmdline = readFileSync(`/proc/${pid}/cmdline`, "utf8").split("\0").join(" ").trim();
      cwd = readlinkSync(`/proc/${pid}/cwd`);
    } catch {
      // gone meanwhile, or a kernel thread
    }
    if (!cmdline) continue; // zombies and kernel threads have none
    if (places.some((p) => cwd === p || cwd.startsWith(`${p}/`) || cmdline.includes(p))) found.push({ pid, cmdline });
  }
  return found;
}

export async function portsFree(checkout: Checkout): Promise<number[]> {
  const taken: number[] = [];
  for (const p of Object.values(checkout.ports)) if (!(await isPortFree(p))) taken.push(p);
  return taken;
}

/** The pids `npm start` recorded for its services (.data/run.json in the clone). */
export function recordedPids(checkout: Checkout): Record<string, number> {
  try {
    const record = JSON.parse(readFileSync(path.join(checkout.dir, ".data", "run.json"), "utf8")) as { services: { name: string; pid: number }[] };
    return Object.fromEntries(record.services.map((s) => [s.name, s.pid]));
  } catch {
    return {};
  }
}

export function postmasterPid(dataDir: string): number | undefined {
  try {
    return Number(readFileSync(path.join(dataDir, "postmaster.pid"), "utf8").split("\n")[0]) || undefined;
  } catch {
    return undefined;
  }
}

/** Ends whatever of the clone still runs (after a failed case): SIGTERM to all, SIGKILL to the rest. */
export async function killAll(checkout: Checkout): Promise<void> {
  const send = (sig: NodeJS.Signals) => {
    for (const p of processesOf(checkout)) {
      try {
        process.kill(p.pid, sig);
      } catch {
        // gone
      }
    }
  };
  if (processesOf(checkout).length === 0) return;
  send("SIGTERM");
  await waitFor(async () => processesOf(checkout).length === 0, 20_000, "the leftovers to stop").catch(() => send("SIGKILL"));
  await waitFor(async () => processesOf(checkout).length === 0, 10_000, "the leftovers to die");
}
