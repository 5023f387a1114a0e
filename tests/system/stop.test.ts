/**
 * The stop path of `npm start`: every signal a terminal, a supervisor or a human sends, to
 * npm alone or to its whole process group, stops the web app, the worker, the mail fake and
 * PostgreSQL, frees the ports, and a next start works. The web app runs as several processes
 * (scripts/web-server.mjs): its primary and every web process are among what must be gone.
 */
import { afterAll, afterEach, beforeAll, describe, expect, it, onTestFailed } from "vitest";
import { cloneCheckout, killAll, portsFree, postmasterPid, processesOf, recordedPids, startProduct, waitFor, type Checkout } from "./harness";

let checkout: Checkout;
const timings: string[] = [];

beforeAll(async () => {
  checkout = await cloneCheckout();
});

// A case that failed half-way must not leave its instance to the next one.
afterEach(async () => {
  await killAll(checkout);
});

afterAll(async () => {
  await killAll(checkout);
  checkout.remove();
  console.log(`time from the signal to every process gone:\n${timings.join("\n")}`);
});

async function expectAllGone(since: number, label: string) {
  let left: string[] = [];
  try {
    await waitFor(async () => (left = processesOf(checkout).map((p) => `${p.pid} ${p.cmdline}`)).length === 0, 30_000, `every process of ${label} to end`);
  } catch (err) {
    // Name what was still there at the deadline: it may be gone a moment later.
    throw new Error(`${(err as Error).message}; still running at the deadline:\n  ${left.join("\n  ")}`);
  }
  timings.push(`  ${label}: ${((Date.now() - since) / 1000).toFixed(1)} s`);
  expect(processesOf(checkout)).toEqual([]);
  expect(await portsFree(checkout)).toEqual([]);
}

describe("npm start stops everything it started", () => {
  const cases = (["SIGINT", "SIGTERM", "SIGHUP"] as const).flatMap((signal) => (["the process group", "npm alone"] as const).map((to) => ({ signal, to })));

  for (const { signal, to } of cases) it(`${signal} to ${to}`, async () => {
    const run = await startProduct(checkout, { WEB_PROCESSES: "2" });
    onTestFailed(() => console.log(`npm start said:\n${run.output()}`));
    const pids = recordedPids(checkout);
    expect(Object.keys(pids).sort()).toEqual(["mail fake", "web app", "worker"]);
    const postmaster = postmasterPid(checkout.dataDir!);
    expect(postmaster).toBeGreaterThan(0);
    const running = processesOf(checkout).map((p) => p.pid);
    for (const pid of [...Object.values(pids), postmaster!, run.npm.pid!]) expect(running).toContain(pid);
    // The web app is a primary and its two web processes (WEB_PROCESSES=2): all three must go too.
    const web = processesOf(checkout).filter((p) => p.cmdline.includes("scripts/web-server.mjs"));
    expect(web.map((p) => p.pid)).toContain(pids["web app"]);
    expect(web).toHaveLength(3);

    const t = Date.now();
    process.kill(to === "npm alone" ? run.npm.pid! : -run.npm.pid!, signal);
    await expectAllGone(t, `${signal} to ${to}`);
    await run.exited;
    if (to === "the process group") expect(run.output()).not.toContain("forced stop");
    expect(run.output()).toContain("PostgreSQL stopped");
  });

  it("a second Ctrl-C forces the stop", async () => {
    const run = await startProduct(checkout);
    // What was left and what npm start said, so a rare failure here can be read, not guessed.
    onTestFailed(() => console.log(`left running:\n${processesOf(checkout).map((p) => `  ${p.pid} ${p.cmdline}`).join("\n")}\nnpm start said:\n${run.output()}`));
    const t = Date.now();
    process.kill(-run.npm.pid!, "SIGINT");
    await waitFor(async () => run.output().includes("stopping…"), 30_000, "the stop to begin");
    // The orderly stop can finish before a second Ctrl-C comes (it takes about a second): only
    // a second signal that reaches a running orchestrator has anything to force.
    const supervisor = processesOf(checkout).find((p) => p.cmdline.includes("scripts/start.ts"));
    const stillStopping = supervisor !== undefined && !run.output().includes("PostgreSQL stopped");
    process.kill(-run.npm.pid!, "SIGINT");
    await expectAllGone(t, "SIGINT twice to the process group");
    // Which of the two ends it is a race the test cannot win every time: the orchestrator reads a
    // signal only between steps, so one that lands during the last step (stopping PostgreSQL) finds
    // the orderly stop already finishing. Either way everything is gone, and the stop says how.
    const out = run.output();
    expect(out.includes("forced stop") || out.includes("PostgreSQL stopped"), out).toBe(true);
    if (!stillStopping) expect(out).not.toContain("forced stop");
  });

  it("a start after the orchestrator was killed outright stops what it left and runs", async () => {
    const first = await startProduct(checkout);
    const left = recordedPids(checkout);
    const supervisor = processesOf(checkout).find((p) => p.cmdline.includes("scripts/start.ts"))!;
    expect(supervisor).toBeDefined();
    const t = Date.now();
    process.kill(supervisor.pid, "SIGKILL");
    // Its services notice they lost their parent; the bootstrap stops the cluster.
    await expectAllGone(t, "SIGKILL to the orchestrator");
    await first.exited;

    const second = await startProduct(checkout);
    const now = recordedPids(checkout);
    for (const name of Object.keys(left)) expect(now[name]).not.toBe(left[name]);
    const res = await fetch(`http://127.0.0.1:${checkout.ports.web}/api/health`);
    expect(res.status).toBe(200);
    const t2 = Date.now();
    process.kill(-second.npm.pid!, "SIGTERM");
    await expectAllGone(t2, "SIGTERM to the process group after a restart");
  });
});
