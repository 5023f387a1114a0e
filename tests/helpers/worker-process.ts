import { spawn, type ChildProcess } from "node:child_process";

/** Env that makes a killed worker's job come back within seconds (defaults are minutes). */
export const FAST_RECOVERY_ENV = {
  SWEEP_JOB_EXPIRE_SECONDS: "3",
  QUEUE_MAINTENANCE_SECONDS: "1",
  SWEEP_JOB_RETRY_DELAY_SECONDS: "0",
  SWEEP_JOB_RETRY_LIMIT: "2",
};

/**
 * A real worker process (worker/index.ts) on the given database; resolves once it listens. Loading
 * it through tsx takes a few seconds on a quiet machine and far longer on a busy one, hence the
 * two-minute allowance (a wait for a condition, not a timing).
 */
export function startWorkerProcess(databaseUrl: string, extraEnv: Record<string, string> = {}): Promise<ChildProcess> {
  const child = spawn(process.execPath, ["--import", "tsx", "worker/index.ts"], {
    env: { ...process.env, ...FAST_RECOVERY_ENV, ...extraEnv, DATABASE_URL: databaseUrl, SMTP_URL: "smtp://127.0.0.1:9" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let err = "";
  child.stderr!.on("data", (d: Buffer) => (err += d.toString()));
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`worker did not start within 2 minutes: ${err}`)), 120_000);
    child.stdout!.on("data", (d: Buffer) => {
      if (d.toString().includes("listening for jobs")) {
        clearTimeout(timer);
        resolve(child);
      }
    });
    child.on("exit", (code) => reject(new Error(`worker exited (${code}) before listening: ${err}`)));
  });
}

export async function stopWorkerProcess(child: ChildProcess, signal: NodeJS.Signals = "SIGTERM"): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return;
  await new Promise((resolve) => {
    child.once("exit", resolve);
    child.kill(signal);
  });
}

/** Polls `probe` until it returns a value, or fails after `timeoutMs`. */
export async function waitFor<T>(probe: () => Promise<T | undefined | null | false>, timeoutMs = 30_000, what = "condition"): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}
