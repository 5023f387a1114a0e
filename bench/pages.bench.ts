/**
 * `npm run bench:pages`: how long people wait on the results screens, measured in Debian's Chromium
 * (Playwright) against `next start` with a finished 160 × 62 sweep on a throwaway PostgreSQL cluster,
 * signed in as the demo engineer. Prints, as medians of several runs:
 *   - navigation to the sweep page → first ranked row painted, → first thumbnail chart painted
 *     (and → the page answering clicks, for reference);
 *   - navigation to a candidate page → its title and chart;
 *   - a sort, and a page change, of the ranked table → the new rows shown.
 * Goals from issue 14: 800 ms, 1 s, 600 ms, 300 ms. Prints figures; asserts nothing.
 *
 * BENCH_APP_DIR=/path/to/another/checkout runs `next start` from that folder's build instead (an
 * earlier version of the screens, for a before-and-after on the same data); its node_modules and
 * .next must be there.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, request, type Page } from "@playwright/test";
import { benchRoot as root, runQueueBench, seededBenchDatabase, startWorkers, stopAll } from "./queue-bench-setup";
import { buildIsStale } from "../scripts/lib/build";
import { freePort } from "../scripts/lib/postgres";
import { waitForHttp } from "../scripts/lib/processes";
import { eq } from "drizzle-orm";
import { sweeps } from "../db/schema";
import type { GridAxis } from "../lib/sweeps/grid";

const RUNS = Number(process.env.BENCH_RUNS ?? 7);
const DEMO_PASSWORD = "seriatim-demo-2026";
const ENGINEER = "eli.engineer@brightwater.example";

// Invented demo kinetics: a second-order liquid reaction with 20 % excess B (as bench:queue).
const kinetics = {
  feed: { flowA: 0.02, concA: 1000, temperature: 340, ratios: { B: 1.2 } },
  reaction: { stoichiometry: { A: -1, B: -1, R: 1 }, phase: "liquid" as const, rate: { law: "power" as const, k: 1e-4, orders: { A: 1, B: 1 } } },
};
// 16 feed flows × 10 targets = 160 scenarios; up to 5 stages of CSTR or PFR = 62 sequences each.
const grid: GridAxis[] = [
  { field: "feed.flowA", from: 0.01, to: 0.05, steps: 16 },
  { field: "target.conversion", from: 0.8, to: 0.95, steps: 10 },
];

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const fmt = (xs: number[]) => `median ${median(xs).toFixed(0)} ms (min ${Math.min(...xs).toFixed(0)}, max ${Math.max(...xs).toFixed(0)}, ${xs.length} runs)`;

/** Milliseconds since the page's navigation began (its time origin) at the first frame where `selector` is shown. */
async function paintedAt(page: Page, selector: string): Promise<number> {
  const handle = await page.waitForFunction(
    (sel) => {
      const el = document.querySelector(sel);
      return el && (el as HTMLElement).getBoundingClientRect().height > 0 ? performance.now() : null;
    },
    selector,
    { polling: "raf", timeout: 120_000 },
  );
  return (await handle.jsonValue()) as number;
}

/** Where a sort's or a page change's wait went, in the page's own clock (ms from the click). */
interface ChangeParts {
  /** The click's event → the candidates request sent (0 when no request was needed). */
  requestSent: number | null;
  /** The request sent → its answer's last byte (the server and the transfer). */
  answered: number | null;
  /** The last byte (or the click, when nothing was asked) → the new rows painted (parse, render, paint). */
  drawn: number;
  /** Main-thread tasks over 50 ms between the click and the rows, summed. */
  longTasks: number;
  /** Other requests the page made between the click and the rows (route prefetches of the new rows' links, …). */
  others: number;
  /** With no request after the click: when the rows read ahead (asked before the click) had arrived, ms after the click (negative: before it). */
  readAheadEnd: number | null;
}

/**
 * Milliseconds from now until the first ranked row reads differently from `before` and nothing is
 * loading; and, read in the page, where that time went (`parts`).
 */
async function rowsChanged(page: Page, act: () => Promise<void>, parts?: ChangeParts[]): Promise<number> {
  const before = await page.getByTestId("candidate-row").first().getByRole("checkbox").getAttribute("aria-label");
  await page.evaluate(() => {
    const w = window as unknown as { benchClick?: number; benchLong?: number; benchObserver?: PerformanceObserver };
    w.benchClick = undefined;
    w.benchLong = 0;
    document.addEventListener("click", (e) => (w.benchClick = e.timeStamp), { capture: true, once: true });
    w.benchObserver?.disconnect();
    w.benchObserver = new PerformanceObserver((list) => {
      for (const e of list.getEntries()) if (w.benchClick !== undefined && e.startTime >= w.benchClick) w.benchLong! += e.duration;
    });
    w.benchObserver.observe({ type: "longtask" });
  });
  const t0 = performance.now();
  await act();
  const shown = await page.waitForFunction(
    (old) => {
      const box = document.querySelector('[data-testid="candidate-row"] input[type="checkbox"]');
      const busy = document.querySelector('[aria-busy="true"]');
      return !!box && box.getAttribute("aria-label") !== old && !busy ? performance.now() : null;
    },
    before,
    { polling: "raf", timeout: 120_000 },
  );
  const elapsed = performance.now() - t0;
  const at = (await shown.jsonValue()) as number;
  const split = (await page.evaluate((rowsAt) => {
    const w = window as unknown as { benchClick?: number; benchLong?: number };
    const click = w.benchClick ?? rowsAt;
    const asked = (performance.getEntriesByType("resource") as PerformanceResourceTiming[]).filter((e) => e.name.includes("/candidates?") && e.startTime >= click && e.startTime <= rowsAt).at(-1);
    const before = (performance.getEntriesByType("resource") as PerformanceResourceTiming[]).filter((e) => e.name.includes("/candidates?") && e.startTime < click).at(-1);
    const others = performance.getEntriesByType("resource").filter((e) => !e.name.includes("/candidates?") && e.startTime >= click && e.startTime <= rowsAt).length;
    return { click, asked: asked ? [asked.startTime, asked.responseEnd] : null, longTasks: w.benchLong ?? 0, others, readAheadEnd: !asked && before ? before.responseEnd - click : null };
  }, at)) as { click: number; asked: [number, number] | null; longTasks: number; others: number; readAheadEnd: number | null };
  parts?.push({
    requestSent: split.asked ? split.asked[0] - split.click : null,
    answered: split.asked ? split.asked[1] - split.asked[0] : null,
    drawn: at - (split.asked ? split.asked[1] : split.click),
    longTasks: split.longTasks,
    others: split.others,
    readAheadEnd: split.readAheadEnd,
  });
  return elapsed;
}

/** The parts of several changes as medians, for the printout. */
function partsLine(parts: ChangeParts[]): string {
  const asked = parts.filter((p) => p.answered !== null);
  const ahead = parts.filter((p) => p.readAheadEnd !== null).map((p) => p.readAheadEnd!);
  const m = (xs: number[]) => (xs.length ? median(xs).toFixed(0) : "—");
  return (
    `click → request sent ${m(asked.map((p) => p.requestSent!))} ms; request → last byte ${m(asked.map((p) => p.answered!))} ms; ` +
    `→ rows painted ${m(parts.map((p) => p.drawn))} ms; long tasks ${m(parts.map((p) => p.longTasks))} ms; other requests meanwhile ${m(parts.map((p) => p.others))} (medians; ${parts.length - asked.length} of ${parts.length} needed no request${ahead.length ? `; the rows read ahead arrived ${m(ahead)} ms after the click (negative: before)` : ""})`
  );
}

async function main(serverUrl: string, children: ChildProcess[]) {
  const load0 = os.loadavg();
  const { url, pool, db, actor, projectId } = await seededBenchDatabase(serverUrl, "bench_pages");
  const { createKineticsModel } = await import("../lib/services/kinetics");
  const { createSweep } = await import("../lib/services/sweeps");
  const { version } = await createKineticsModel(db, actor, projectId, { name: "Bench second order", spec: kinetics, note: "" });
  const env: NodeJS.ProcessEnv = { ...process.env, DATABASE_URL: url, NODE_ENV: "production" as const };

  // The sweep, finished by two workers the way production runs it.
  const workers = await startWorkers(2, env);
  children.push(...workers);
  const sweep = await createSweep(db, actor, projectId, { kineticsVersionId: version.id, target: { conversion: 0.9 }, train: { maxStages: 5, types: ["CSTR", "PFR"] }, grid });
  for (;;) {
    const [s] = await db.select({ status: sweeps.status }).from(sweeps).where(eq(sweeps.id, sweep.id));
    if (s.status !== "queued" && s.status !== "running") break;
    await new Promise((r) => setTimeout(r, 200));
  }
  await stopAll(workers);
  children.length = 0;
  const count = (await pool.query("select count(*)::int n from candidates where sweep_id = $1", [sweep.id])).rows[0].n as number;
  const candidateId = (await pool.query("select c.id from candidates c join scenarios s on s.id = c.scenario_id where c.sweep_id = $1 and s.index = 0 order by c.rank limit 1", [sweep.id])).rows[0].id as string;

  const appDir = process.env.BENCH_APP_DIR ? path.resolve(process.env.BENCH_APP_DIR) : root;
  if (appDir === root && buildIsStale(root)) spawnSync(path.join(root, "node_modules/.bin/next"), ["build"], { cwd: root, stdio: "inherit", env });
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const webEnv = { ...env, APP_URL: base, AUTH_URL: `${base}/api/auth`, AUTH_SECRET: "bench-only-secret-0123456789abcdef", NEXT_TELEMETRY_DISABLED: "1" };
  const web = spawn(path.join(appDir, "node_modules/.bin/next"), ["start", "-H", "127.0.0.1", "-p", String(port)], { cwd: appDir, env: webEnv, stdio: "ignore" });
  children.push(web);
  await waitForHttp(`${base}/api/health`, 120_000);

  // Signed in over HTTP as the sign-in form does; the browser context takes the session cookie.
  const api = await request.newContext({ baseURL: base, extraHTTPHeaders: { origin: base } });
  const { csrfToken } = (await (await api.get("/api/auth/csrf")).json()) as { csrfToken: string };
  const signIn = await api.post("/api/auth/callback/credentials", { form: { email: ENGINEER, password: DEMO_PASSWORD, csrfToken, callbackUrl: "/" }, headers: { "X-Auth-Return-Redirect": "1" } });
  if (!signIn.ok()) throw new Error(`sign-in failed: ${signIn.status()}`);
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
  });
  const context = await browser.newContext({ baseURL: base, storageState: await api.storageState(), viewport: { width: 1280, height: 900 } });

  const sweepUrl = `/projects/${projectId}/sweeps/${sweep.id}`;
  const candidateUrl = `${sweepUrl}/candidates/${candidateId}`;
  // One unmeasured visit of each page: the server's first compile of a route and the browser's cache of the scripts.
  for (const u of [sweepUrl, candidateUrl]) {
    const p = await context.newPage();
    await p.goto(u);
    await p.getByRole("button", { name: "Sign out" }).waitFor();
    await p.close();
  }

  const firstRow: number[] = [];
  const firstChart: number[] = [];
  const firstByte: number[] = [];
  const lastByte: number[] = [];
  const parsed: number[] = [];
  const interactive: number[] = [];
  const candidate: number[] = [];
  const sort: number[] = [];
  const nextPage: number[] = [];
  const sortParts: ChangeParts[] = [];
  const pageParts: ChangeParts[] = [];
  for (let i = 0; i < RUNS; i++) {
    // A new scenario each run, so no run reads a page the server or the browser already holds.
    const page = await context.newPage();
    await page.goto(`${sweepUrl}?scenario=${(i * 23) % 160}`, { waitUntil: "commit" });
    firstRow.push(await paintedAt(page, '[data-testid="candidate-row"]'));
    // Where the wait goes: the server's answer (first byte, last byte) and the browser's parse of it.
    const nav = (await page.evaluate(() => {
      const n = performance.getEntriesByType("navigation")[0] as PerformanceNavigationTiming;
      return [n.responseStart, n.responseEnd, n.domContentLoadedEventEnd];
    })) as number[];
    // A timing still 0 had not happened yet when the row was painted (the answer was still streaming).
    if (nav[0] > 0) firstByte.push(nav[0]);
    if (nav[1] > 0) lastByte.push(nav[1]);
    if (nav[2] > 0) parsed.push(nav[2]);
    firstChart.push(await paintedAt(page, '[data-testid="thumbnail"] svg'));
    interactive.push(
      (await (
        await page.waitForFunction(() => {
          const b = [...document.querySelectorAll("button")].find((x) => x.textContent?.trim() === "Sign out");
          return b && !(b as HTMLButtonElement).disabled ? performance.now() : null;
        }, undefined, { polling: "raf", timeout: 120_000 })
      ).jsonValue()) as number,
    );
    // BENCH_PROFILE=prefix keeps the first run's sort and page change as Chromium CPU profiles
    // (prefix.sort.cpuprofile, prefix.page.cpuprofile), to see where the browser's time goes.
    const profiled = async (name: string, change: () => Promise<number>) => {
      if (!process.env.BENCH_PROFILE || i > 0) return change();
      const cdp = await page.context().newCDPSession(page);
      await cdp.send("Profiler.enable");
      await cdp.send("Profiler.setSamplingInterval", { interval: 200 });
      await cdp.send("Profiler.start");
      const ms = await change();
      const { profile } = await cdp.send("Profiler.stop");
      writeFileSync(`${process.env.BENCH_PROFILE}.${name}.cpuprofile`, JSON.stringify(profile));
      await cdp.detach();
      return ms;
    };
    sort.push(await profiled("sort", () => rowsChanged(page, () => page.getByTestId("sort-sequence").click(), sortParts)));
    nextPage.push(await profiled("page", () => rowsChanged(page, () => page.getByRole("button", { name: "Next →" }).click(), pageParts)));
    await page.close();

    const cand = await context.newPage();
    await cand.goto(candidateUrl, { waitUntil: "commit" });
    await paintedAt(cand, '[data-testid="candidate-title"]');
    candidate.push(await paintedAt(cand, "#chart-title ~ * svg, section:has(#chart-title) svg"));
    await cand.close();
  }
  const load1 = os.loadavg();
  // The server's own share of a sort: the ranked page with its thumbnails read in this process, as
  // the endpoint reads it uncached (a new scenario each time, sorted by sequence).
  const { listCandidates } = await import("../lib/services/candidates");
  const serverRead: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const t = performance.now();
    await listCandidates(db, actor, sweep.id, (i * 29 + 7) % 160, { sort: "sequence", dir: "asc", page: 1, pageSize: 25, include: "thumbnails" });
    serverRead.push(performance.now() - t);
  }
  // The same over HTTP from this process (the session check, the route and the transfer; no browser).
  const overHttp: number[] = [];
  let answerBytes = 0;
  for (let i = 0; i < RUNS; i++) {
    const t = performance.now();
    const res = await api.get(`/api/sweeps/${sweep.id}/scenarios/${(i * 31 + 11) % 160}/candidates?sort=sequence&dir=asc&page=1&pageSize=25&include=thumbnails`);
    answerBytes = (await res.body()).length;
    overHttp.push(performance.now() - t);
  }
  const html = await (await api.get(sweepUrl)).body();
  // BENCH_SAVE_HTML=file keeps the page's HTML, to see what its size is made of.
  if (process.env.BENCH_SAVE_HTML) writeFileSync(process.env.BENCH_SAVE_HTML, html);

  console.log(`\nSeriatim page benchmark (Chromium against next start${appDir === root ? "" : ` from ${appDir}`}, throwaway PostgreSQL, this machine)`);
  console.log(`  sweep: 160 scenarios × 62 sequences, ${count} candidates; table pages of 25 rows`);
  console.log(`  sweep page → first ranked row painted:   ${fmt(firstRow)}   (goal 800 ms)`);
  console.log(`  sweep page → first thumbnail painted:    ${fmt(firstChart)}   (goal 1000 ms)`);
  console.log(`    of which: server's first byte ${fmt(firstByte)}; last byte ${fmt(lastByte)}${parsed.length ? `; document parsed ${fmt(parsed)}` : ""}`);
  console.log(`  sweep page → answering clicks:           ${fmt(interactive)}`);
  console.log(`  candidate page → title and chart:        ${fmt(candidate)}   (goal 600 ms)`);
  console.log(`  sort by sequence → new rows:             ${fmt(sort)}   (goal 300 ms)`);
  console.log(`    of which (in the page's clock): ${partsLine(sortParts)}`);
  console.log(`  next page → new rows:                    ${fmt(nextPage)}   (goal 300 ms)`);
  console.log(`    of which (in the page's clock): ${partsLine(pageParts)}`);
  console.log(`  one table page with thumbnails read by the service in process (no HTTP): ${fmt(serverRead)}`);
  console.log(`  the same page over HTTP from this process (session check, route, transfer): ${fmt(overHttp)}; ${(answerBytes / 1024).toFixed(0)} KB`);
  console.log(`  sweep page HTML (first page and its thumbnails' plot data inside): ${(html.length / 1024).toFixed(0)} KB`);
  console.log(`  load average (1, 5, 15 min): before ${load0.map((x) => x.toFixed(2)).join(", ")}; after ${load1.map((x) => x.toFixed(2)).join(", ")}; ${os.cpus().length} cores`);

  await context.close();
  await browser.close();
  await api.dispose();
  await pool.end();
}

runQueueBench(main);
