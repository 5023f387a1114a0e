/**
 * `npm test`: the whole suite on a throwaway PostgreSQL cluster, removed afterwards
 * even when a step fails. typecheck → lint → unit → integration → build → browser.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import pg from "pg";
import { createDb } from "../db/client";
import { runMigrations } from "../db/migrate";
import { seedDemoData } from "../lib/demo/seed";
import { buildIsStale } from "./lib/build";
import { createDatabase, ensurePostgresBinaries, freePort, startThrowawayCluster, type Cluster } from "./lib/postgres";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
// Per run, so two runs in one folder (a developer and a helper script) never clear each other's reports.
const results = path.join(root, "test-results", `reports-${process.pid}`);
const bin = (name: string) => path.join(root, "node_modules", ".bin", name);
const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

interface StepResult {
  name: string;
  ok: boolean;
  seconds: number;
  note?: string;
}

/**
 * One production build and browser run at a time per checkout: two `npm test` runs in the
 * same folder would otherwise write .next/ together. The lock holds our pid; a dead
 * holder's lock is taken over.
 */
async function withBuildLock<T>(fn: () => Promise<T>): Promise<T> {
  const dir = path.join(root, ".data", "build.lock");
  mkdirSync(path.dirname(dir), { recursive: true });
  for (let waitedSeconds = 0; ; waitedSeconds++) {
    try {
      mkdirSync(dir);
      writeFileSync(path.join(dir, "pid"), String(process.pid));
      break;
    } catch {
      const holder = Number(readFileSafe(path.join(dir, "pid")));
      if (!holder || !alive(holder)) {
        rmSync(dir, { recursive: true, force: true });
        continue;
      }
      if (waitedSeconds % 30 === 0) console.log(`› waiting for another npm test in this folder (pid ${holder}) to finish its build and browser run…`);
      await new Promise((r) => setTimeout(r, 1000));
    }
  }
  try {
    return await fn();
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function readFileSafe(file: string): string {
  try {
    return readFileSync(file, "utf8");
  } catch {
    return "";
  }
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

function ensureChromium(): void {
  if (existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) {
    throw new Error(`Chromium is missing at ${CHROMIUM}. Install it with:\n  sudo apt-get update && sudo apt-get install -y chromium`);
  }
  console.log("› installing Debian's chromium for the browser tests (first run only)…");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "-qq", "chromium"], { stdio: "inherit", env });
}

function run(name: string, cmd: string, args: string[], env: Record<string, string> = {}): StepResult {
  console.log(`\n━━ ${name} ━━  ${path.basename(cmd)} ${args.join(" ")}`);
  const t = Date.now();
  const r = spawnSync(cmd, args, { cwd: root, stdio: "inherit", env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1", ...env } });
  return { name, ok: r.status === 0, seconds: (Date.now() - t) / 1000 };
}

function readJson<T>(file: string): T | undefined {
  try {
    return JSON.parse(readFileSync(file, "utf8")) as T;
  } catch {
    return undefined;
  }
}

function countTests(): { passed: number; failed: number } {
  let passed = 0;
  let failed = 0;
  for (const f of ["unit.json", "integration.json", "system.json"]) {
    const r = readJson<{ numPassedTests: number; numFailedTests: number }>(path.join(results, f));
    passed += r?.numPassedTests ?? 0;
    failed += r?.numFailedTests ?? 0;
  }
  const e2e = readJson<{ stats: { expected: number; unexpected: number; flaky: number } }>(path.join(results, "e2e.json"));
  passed += e2e?.stats.expected ?? 0;
  failed += (e2e?.stats.unexpected ?? 0) + (e2e?.stats.flaky ?? 0);
  return { passed, failed };
}

const STEP_NAMES = ["typecheck", "lint", "unit", "integration", "build", "e2e", "system"];
// `npm test -- unit integration` runs only the named steps (for daily work); plain `npm test` runs all.
const only = process.argv.slice(2);
const unknown = only.filter((s) => !STEP_NAMES.includes(s));
if (unknown.length) {
  console.error(`unknown step(s): ${unknown.join(", ")}; steps are ${STEP_NAMES.join(", ")}`);
  process.exit(2);
}
const wanted = (name: string) => only.length === 0 || only.includes(name);

async function main(): Promise<number> {
  const t0 = Date.now();
  rmSync(results, { recursive: true, force: true });
  mkdirSync(results, { recursive: true });
  ensurePostgresBinaries();
  ensureChromium();

  let cluster: Cluster | undefined;
  const cleanup = () => {
    cluster?.stop();
    cluster = undefined;
  };
  process.on("SIGINT", () => (cleanup(), process.exit(130)));
  process.on("SIGTERM", () => (cleanup(), process.exit(143)));
  process.on("SIGHUP", () => (cleanup(), process.exit(129)));

  const steps: StepResult[] = [];
  try {
    console.log("› starting a throwaway PostgreSQL cluster");
    cluster = await startThrowawayCluster();
    console.log(`  on 127.0.0.1:${cluster.port}, data in ${cluster.dataDir}`);
    const serverUrl = cluster.serverUrl;
    const templateUrl = await createDatabase(serverUrl, "seriatim_template");

    const vitestJson = (f: string) => ["--reporter=default", "--reporter=json", `--outputFile.json=${path.join(results, f)}`];
    if (wanted("typecheck")) steps.push(run("typecheck", bin("tsc"), ["--noEmit", "-p", "."]));
    if (wanted("lint")) steps.push(run("lint", bin("eslint"), ["--max-warnings=0", "."]));
    // VITEST_FILES="tests/unit/x.test.ts" narrows the unit and integration steps to those files (daily work).
    const vitestFiles = (process.env.VITEST_FILES ?? "").split(/\s+/).filter(Boolean);
    if (wanted("unit")) steps.push(run("unit", bin("vitest"), ["run", "--project", "unit", ...vitestJson("unit.json"), ...vitestFiles]));
    if (wanted("integration")) {
      steps.push(
        run("integration", bin("vitest"), ["run", "--project", "integration", ...vitestJson("integration.json"), ...vitestFiles], {
          DATABASE_URL: templateUrl,
          TEST_PG_SERVER_URL: cluster.serverUrl,
        }),
      );
    }
    // The browser and system tests need a production build; `npm test -- e2e` builds too,
    // `npm test -- system` only when the build is missing or stale.
    if (wanted("build") || wanted("e2e") || wanted("system")) {
      await withBuildLock(async () => {
        const mustBuild = wanted("build") || wanted("e2e") || buildIsStale(root);
        const build: StepResult = mustBuild ? run("build", bin("next"), ["build"], { NODE_ENV: "production" }) : { name: "build", ok: true, seconds: 0, note: "up to date" };
        if (mustBuild) steps.push(build);
        if (wanted("e2e")) {
          if (build.ok) {
            const e2eUrl = await createDatabase(serverUrl, "seriatim_e2e");
            await runMigrations(e2eUrl);
            const pool = new pg.Pool({ connectionString: e2eUrl, max: 2 });
            await seedDemoData(createDb(pool));
            await pool.end();
            steps.push(
              // E2E_FILES="tests/e2e/a.spec.ts tests/e2e/b.spec.ts" runs only those files (daily work).
              run("e2e", bin("playwright"), ["test", ...(process.env.E2E_FILES ?? "").split(/\s+/).filter(Boolean)], {
                DATABASE_URL: e2eUrl,
                E2E_PORT: String(await freePort()),
                MAIL_FAKE_SMTP_PORT: String(await freePort()),
                MAIL_FAKE_HTTP_PORT: String(await freePort()),
                E2E_JSON_REPORT: path.join(results, "e2e.json"),
                CHROMIUM_PATH: CHROMIUM,
              }),
            );
          } else {
            steps.push({ name: "e2e", ok: false, seconds: 0, note: "not run: the build failed" });
          }
        }
        // `npm start` in a fresh clone of the repository, using this build (tests/system).
        if (wanted("system")) {
          if (build.ok) steps.push(run("system", bin("vitest"), ["run", "--project", "system", ...vitestJson("system.json"), ...vitestFiles]));
          else steps.push({ name: "system", ok: false, seconds: 0, note: "not run: the build failed" });
        }
      });
    }
  } finally {
    cleanup();
  }

  console.log("\n━━ summary ━━");
  for (const s of steps) console.log(`  ${s.ok ? "ok  " : "FAIL"}  ${s.name.padEnd(12)} ${s.seconds.toFixed(1).padStart(6)} s${s.note ? `  (${s.note})` : ""}`);
  const { passed, failed } = countTests();
  const failedSteps = steps.filter((s) => !s.ok).length;
  console.log(`  total ${((Date.now() - t0) / 1000).toFixed(1)} s; throwaway cluster removed`);
  console.log(`tests: ${passed} passed, ${failed} failed`);
  // A run that was meant to execute tests but executed none has failed too.
  const ranTests = steps.some((s) => ["unit", "integration", "e2e", "system"].includes(s.name));
  return failedSteps === 0 && failed === 0 && (passed > 0 || !ranTests) ? 0 : 1;
}

main().then(
  (code) => process.exit(code),
  (err: Error) => {
    console.error(`npm test failed: ${err.message}`);
    process.exit(1);
  },
);
