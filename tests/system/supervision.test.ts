/**
 * The product stays up through a worker's death and a database restart: under `npm start`,
 * a sweep is submitted, its worker is killed with SIGKILL and PostgreSQL is restarted while
 * it runs; the sweep still ends with every candidate exactly once, and the web app (same
 * process throughout) answered every health check.
 */
import pg from "pg";
import { afterAll, beforeAll, expect, it, onTestFailed } from "vitest";
import { restartClusterAt } from "../../scripts/lib/postgres";
import { cloneCheckout, killAll, processesOf, recordedPids, startProduct, waitFor, type Checkout, type Running } from "./harness";

// Invented demo kinetics: second-order liquid esterification with 20 % excess B.
const KINETICS = {
  feed: { flowA: 0.02, concA: "1 mol/L", temperature: "66.85 degC", ratios: { B: 1.2 } },
  reaction: { stoichiometry: { A: -1, B: -1, R: 1 }, phase: "liquid", rate: { law: "power", k: 1e-4, orders: { A: 1, B: 1 } } },
};
const MAX_STAGES = 5;
// Every CSTR/PFR sequence of 1 to 5 stages: 2 + 4 + 8 + 16 + 32.
const SEQUENCES = Array.from({ length: MAX_STAGES }, (_, i) => 2 ** (i + 1)).reduce((a, b) => a + b, 0);
// Large enough that the kill and the restart land while it runs (tens of seconds here).
const GRID = [
  { field: "feed.flowA", from: 0.01, to: 0.05, steps: 20 },
  { field: "target.conversion", from: 0.8, to: 0.95, steps: 15 },
];

let checkout: Checkout;
let run: Running | undefined;

beforeAll(async () => {
  checkout = await cloneCheckout();
});

afterAll(async () => {
  if (run) {
    try {
      process.kill(-run.npm.pid!, "SIGTERM");
    } catch {
      // gone
    }
    await waitFor(async () => processesOf(checkout).length === 0, 30_000, "the product to stop").catch(() => {});
  }
  await killAll(checkout);
  checkout.remove();
});

/** A signed-in session over plain HTTP, the way the sign-in form does it. */
async function signIn(base: string, email: string, password: string) {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(";");
      const i = pair.indexOf("=");
      jar.set(pair.slice(0, i), pair.slice(i + 1));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const csrfRes = await fetch(`${base}/api/auth/csrf`);
  keep(csrfRes);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookie(), "X-Auth-Return-Redirect": "1", origin: base },
    body: new URLSearchParams({ email, password, csrfToken, callbackUrl: "/" }),
  });
  keep(res);
  expect(res.status).toBeLessThan(400);
  return async (method: string, p: string, body?: unknown) => {
    const r = await fetch(`${base}${p}`, {
      method,
      headers: { cookie: cookie(), origin: base, ...(body ? { "content-type": "application/json" } : {}) },
      body: body ? JSON.stringify(body) : undefined,
    });
    const text = await r.text();
    if (!r.ok) throw new Error(`${method} ${p}: ${r.status} ${text}`);
    return JSON.parse(text) as Record<string, unknown>;
  };
}

it("a killed worker and a database restart mid-sweep: every candidate exactly once, the web app always answering", async () => {
  run = await startProduct(checkout, {
    // A dead worker's job comes back within seconds (the defaults are minutes).
    SWEEP_JOB_EXPIRE_SECONDS: "10",
    QUEUE_MAINTENANCE_SECONDS: "1",
    SWEEP_JOB_RETRY_DELAY_SECONDS: "1",
    SWEEP_JOB_RETRY_LIMIT: "8",
  });
  onTestFailed(() => console.log(`npm start said:\n${run!.output().split("\n").slice(-120).join("\n")}`));
  const base = `http://127.0.0.1:${checkout.ports.web}`;
  const started = recordedPids(checkout);
  const webPid = started["web app"];
  expect(webPid).toBeGreaterThan(0);

  // Health is polled throughout; every poll must get an answer (200, or 503 while the database is away).
  const answers: (number | string)[] = [];
  let polling = true;
  const poller = (async () => {
    while (polling) {
      try {
        const res = await fetch(`${base}/api/health`, { signal: AbortSignal.timeout(15_000) });
        answers.push(res.status);
      } catch (err) {
        answers.push(`no answer: ${(err as Error).message}`);
      }
      await new Promise((r) => setTimeout(r, 100));
    }
  })();

  const api = await signIn(base, "eli.engineer@brightwater.example", "seriatim-demo-2026");
  const { projects } = (await api("GET", "/api/projects")) as { projects: { id: string; name: string }[] };
  const projectId = projects.find((p) => p.name === "Ester line 3 revamp")!.id;
  const { version } = (await api("POST", `/api/projects/${projectId}/kinetics`, { name: `Restart check ${Date.now()}`, spec: KINETICS, note: "" })) as {
    version: { id: string };
  };
  const { sweep } = (await api("POST", `/api/projects/${projectId}/sweeps`, {
    kineticsVersionId: version.id,
    target: { conversion: 0.9 },
    train: { maxStages: MAX_STAGES, types: ["CSTR", "PFR"] },
    grid: GRID,
  })) as { sweep: { id: string; total: number } };
  expect(sweep.total).toBe(300);

  // Progress is read from the database; a fresh connection each time, as the server restarts.
  const dbUrl = `postgres://postgres@127.0.0.1:${checkout.ports.pg}/seriatim`;
  const query = async (text: string): Promise<pg.QueryResultRow[] | undefined> => {
    const client = new pg.Client({ connectionString: dbUrl, connectionTimeoutMillis: 5_000 });
    client.on("error", () => {});
    try {
      await client.connect();
      return (await client.query(text, [sweep.id])).rows;
    } catch {
      return undefined;
    } finally {
      await client.end().catch(() => {});
    }
  };
  const candidates = async () => (await query("select count(*)::int n from candidates where sweep_id = $1"))?.[0].n as number | undefined;

  await waitFor(async () => ((await candidates()) ?? 0) > 0, 120_000, "the first candidates");
  const killedAt = Date.now();
  const countAtKill = (await candidates())!;
  process.kill(started.worker, "SIGKILL");
  const newWorker = await waitFor(
    async () => {
      const w = recordedPids(checkout).worker;
      return w && w !== started.worker && run!.output().includes(`worker ${w}: listening for jobs`) ? w : undefined;
    },
    120_000,
    "a new worker",
  );
  const restartSeconds = (Date.now() - killedAt) / 1000;
  await waitFor(async () => ((await candidates()) ?? 0) > countAtKill, 120_000, "progress after the worker's restart");
  const countBeforeRestart = (await candidates())!;
  expect(countBeforeRestart).toBeLessThan(sweep.total * SEQUENCES);

  restartClusterAt(checkout.dataDir!);
  const status = await waitFor(
    async () => {
      const s = (await query("select status from sweeps where id = $1"))?.[0]?.status as string | undefined;
      return s && !["queued", "running"].includes(s) ? s : undefined;
    },
    240_000,
    "the sweep to finish",
  );
  polling = false;
  await poller;

  expect(status).toBe("succeeded");
  const [totals] = (await query(
    "select count(*)::int n, count(distinct (scenario_id, sequence_key))::int dist, count(distinct scenario_id)::int scen from candidates where sweep_id = $1",
  ))!;
  expect(totals).toEqual({ n: sweep.total * SEQUENCES, dist: sweep.total * SEQUENCES, scen: sweep.total });
  const uneven = await query("select scenario_id from candidates where sweep_id = $1 group by scenario_id having count(*) <> " + SEQUENCES);
  expect(uneven).toEqual([]);

  // The web app was never restarted and never stopped answering; the new worker is the one running.
  const now = recordedPids(checkout);
  expect(now["web app"]).toBe(webPid);
  expect(processesOf(checkout).some((p) => p.pid === webPid)).toBe(true);
  expect(now.worker).toBe(newWorker);
  expect(answers.filter((a) => typeof a === "string")).toEqual([]);
  expect(answers.length).toBeGreaterThan(0);
  expect(answers.every((a) => a === 200 || a === 503)).toBe(true);
  expect(await (await fetch(`${base}/api/health`)).json()).toEqual({ status: "ok", database: "reachable" });
  console.log(
    `worker back ${restartSeconds.toFixed(1)} s after SIGKILL; health answers: ${answers.filter((a) => a === 200).length} × 200, ` +
      `${answers.filter((a) => a === 503).length} × 503; candidates at kill ${countAtKill}, at database restart ${countBeforeRestart}, final ${totals.n}`,
  );
});
