import { spawn, type ChildProcess } from "node:child_process";

export interface Managed {
  name: string;
  child: ChildProcess;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
}

/**
 * Spawns a long-running service in its own process group (so a terminal Ctrl-C does not
 * hit it before we stop it in order) and prefixes its output with its name.
 */
export function startService(name: string, cmd: string, args: string[], env: NodeJS.ProcessEnv, cwd: string): Managed {
  const child = spawn(cmd, args, { cwd, env, detached: true, stdio: ["ignore", "pipe", "pipe"] });
  const prefix = (chunk: Buffer) =>
    chunk
      .toString()
      .split("\n")
      .filter((l) => l.trim())
      .map((l) => `[${name}] ${l}`)
      .join("\n") + "\n";
  child.stdout?.on("data", (c: Buffer) => process.stdout.write(prefix(c)));
  child.stderr?.on("data", (c: Buffer) => process.stderr.write(prefix(c)));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    child.on("exit", (code, signal) => resolve({ code, signal })),
  );
  // A spawn failure (missing binary) must read as an exit, not crash the orchestrator.
  child.on("error", (err) => console.error(`[${name}] could not start: ${err.message}`));
  return { name, child, exited };
}

/** Sends `sig` to a whole process group; false when it is gone already. */
export function signalGroup(pid: number, sig: NodeJS.Signals): boolean {
  try {
    process.kill(-pid, sig);
    return true;
  } catch {
    return false;
  }
}

/** SIGTERM to the service's group, then SIGKILL if it has not gone after `graceMs`. */
export async function stopService(s: Managed, graceMs = 8_000): Promise<void> {
  if (s.child.exitCode !== null || s.child.signalCode !== null) return;
  const pid = s.child.pid;
  if (!pid) return;
  signalGroup(pid, "SIGTERM");
  const timer = setTimeout(() => signalGroup(pid, "SIGKILL"), graceMs);
  await s.exited;
  clearTimeout(timer);
  // Anything the service itself started in its group goes with it.
  signalGroup(pid, "SIGKILL");
}

/**
 * Keeps one service running: when it exits unexpectedly it is started again after a
 * back-off (1 s, doubling up to 30 s; back to 1 s once a run has lasted a minute).
 */
const FIRST_DELAY_MS = 1_000;
const MAX_DELAY_MS = 30_000;
const STABLE_MS = 60_000;

export class SupervisedService {
  current: Managed;
  restarts = 0;
  private stopped = false;
  private timer: NodeJS.Timeout | undefined;
  private delayMs = FIRST_DELAY_MS;
  private startedAt = Date.now();

  constructor(
    readonly name: string,
    private readonly launch: () => Managed,
    private readonly onChange: () => void = () => {},
  ) {
    this.current = this.spawn();
  }

  private spawn(): Managed {
    const m = this.launch();
    this.startedAt = Date.now();
    void m.exited.then(({ code, signal }) => {
      if (this.stopped || this.current !== m) return;
      // Whatever it had started in its group (esbuild's service, say) goes with it.
      if (m.child.pid) signalGroup(m.child.pid, "SIGKILL");
      if (Date.now() - this.startedAt > STABLE_MS) this.delayMs = FIRST_DELAY_MS;
      const how = signal ? `signal ${signal}` : `code ${code}`;
      console.error(`${this.name} exited unexpectedly (${how}); starting it again in ${(this.delayMs / 1000).toFixed(0)} s`);
      this.timer = setTimeout(() => {
        if (this.stopped) return;
        this.restarts++;
        this.current = this.spawn();
        this.onChange();
      }, this.delayMs);
      this.delayMs = Math.min(this.delayMs * 2, MAX_DELAY_MS);
    });
    return m;
  }

  get pid(): number | undefined {
    return this.current.child.pid;
  }

  async stop(graceMs?: number): Promise<void> {
    this.stopped = true;
    clearTimeout(this.timer);
    await stopService(this.current, graceMs);
  }

  /** No orderly stop: SIGKILL to the group at once. */
  kill(): void {
    this.stopped = true;
    clearTimeout(this.timer);
    if (this.current.child.pid) signalGroup(this.current.child.pid, "SIGKILL");
  }
}

export async function waitForHttp(url: string, timeoutMs: number, isAlive: () => boolean = () => true): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (!isAlive()) throw new Error(`service for ${url} exited before it was ready`);
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not answer 200 within ${timeoutMs / 1000} s`);
}
