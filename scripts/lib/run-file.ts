/**
 * What `npm start` is running for this checkout, kept in .data/run.json: the orchestrator's
 * pid, each service's pid and the cluster's data folder. A start after a crash reads it and
 * stops what was left, by those pids only, and only after /proc shows that the pid still is
 * that service of this checkout (a recycled pid belongs to someone else).
 */
import { existsSync, mkdirSync, readFileSync, readlinkSync, renameSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { signalGroup } from "./processes";
import { stopClusterAt } from "./postgres";

export interface RunRecord {
  supervisor: { pid: number; marker: string };
  services: { name: string; pid: number; marker: string }[];
  dataDir?: string;
}

export const runFileOf = (root: string) => path.join(root, ".data", "run.json");

export function writeRunFile(root: string, record: RunRecord): void {
  const file = runFileOf(root);
  mkdirSync(path.dirname(file), { recursive: true });
  writeFileSync(`${file}.tmp`, JSON.stringify(record, null, 2));
  renameSync(`${file}.tmp`, file);
}

export function readRunFile(root: string): RunRecord | undefined {
  try {
    return JSON.parse(readFileSync(runFileOf(root), "utf8")) as RunRecord;
  } catch {
    return undefined;
  }
}

export function removeRunFile(root: string): void {
  rmSync(runFileOf(root), { force: true });
}

/** The command line of a live pid, NUL-separated arguments joined by spaces; "" when gone. */
export function cmdlineOf(pid: number): string {
  try {
    return readFileSync(`/proc/${pid}/cmdline`, "utf8").split("\0").join(" ");
  } catch {
    return "";
  }
}

function cwdOf(pid: number): string {
  try {
    return readlinkSync(`/proc/${pid}/cwd`);
  } catch {
    return "";
  }
}

/**
 * True when `pid` is alive and still is what we recorded: its command line carries `marker`
 * (a path in this checkout), or, for a process that renames itself (next-server), its working
 * directory is that path.
 */
export function isStill(pid: number, marker: string): boolean {
  if (pid <= 0) return false;
  const cmdline = cmdlineOf(pid);
  return cmdline !== "" && (cmdline.includes(marker) || cwdOf(pid) === marker);
}

async function waitGone(pid: number, marker: string, ms: number): Promise<boolean> {
  const deadline = Date.now() + ms;
  while (Date.now() < deadline) {
    if (!isStill(pid, marker)) return true;
    await new Promise((r) => setTimeout(r, 100));
  }
  return !isStill(pid, marker);
}

/**
 * Stops what a previous `npm start` of this checkout left behind. Throws when that start is
 * still running (its orchestrator is alive): two instances cannot share the cluster.
 */
export async function stopStaleServices(root: string, log: (m: string) => void = console.log): Promise<void> {
  const record = readRunFile(root);
  if (!record) return;
  if (record.supervisor.pid !== process.pid && isStill(record.supervisor.pid, record.supervisor.marker)) {
    throw new Error(`Seriatim is already running from this folder (process ${record.supervisor.pid}); stop it first.`);
  }
  for (const s of record.services) {
    if (!isStill(s.pid, s.marker)) continue;
    log(`stopping the ${s.name} left running by an earlier start (process ${s.pid})`);
    signalGroup(s.pid, "SIGTERM");
    if (!(await waitGone(s.pid, s.marker, 8_000))) signalGroup(s.pid, "SIGKILL");
  }
  if (record.dataDir && existsSync(path.join(record.dataDir, "postmaster.pid"))) {
    log("stopping the PostgreSQL cluster left running by an earlier start");
    stopClusterAt(record.dataDir);
  }
  removeRunFile(root);
}
