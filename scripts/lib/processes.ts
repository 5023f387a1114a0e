import { spawn, type ChildProcess } from "node:child_process";

export interface Managed {
  name: string;
  child: ChildProcess;
  exited: Promise<number | null>;
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
  const exited = new Promise<number | null>((resolve) => child.on("exit", (code) => resolve(code)));
  return { name, child, exited };
}

/** SIGTERM to the service's group, then SIGKILL if it has not gone after `graceMs`. */
export async function stopService(s: Managed, graceMs = 10_000): Promise<void> {
  if (s.child.exitCode !== null || s.child.signalCode !== null) return;
  const pid = s.child.pid;
  if (!pid) return;
  const signal = (sig: NodeJS.Signals) => {
    try {
      process.kill(-pid, sig);
    } catch {
      // group already gone
    }
  };
  signal("SIGTERM");
  const timer = setTimeout(() => signal("SIGKILL"), graceMs);
  await s.exited;
  clearTimeout(timer);
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
