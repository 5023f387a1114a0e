#!/usr/bin/env node
// Entry of `npm start` and `npm test`. Plain JavaScript so it runs before dependencies
// exist: installs them (npm ci) when node_modules is missing or older than the lockfile,
// then hands over to the TypeScript orchestration in scripts/start.ts or scripts/test.ts.
import { spawn, spawnSync } from "node:child_process";
import { existsSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const command = process.argv[2];
if (command !== "start" && command !== "test") {
  console.error("usage: node scripts/bootstrap.mjs start|test");
  process.exit(2);
}

const lock = path.join(root, "package-lock.json");
const installed = path.join(root, "node_modules", ".package-lock.json");
const stale = !existsSync(installed) || statSync(installed).mtimeMs < statSync(lock).mtimeMs;
if (stale) {
  console.log("› installing dependencies (npm ci)…");
  const t0 = Date.now();
  const r = spawnSync("npm", ["ci", "--no-audit", "--no-fund"], { cwd: root, stdio: "inherit" });
  if (r.status !== 0) {
    console.error("npm ci failed");
    process.exit(r.status ?? 1);
  }
  console.log(`  dependencies installed in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
}

// Run in this process tree with tsx as a loader, so signals reach the orchestrator directly.
const child = spawn(process.execPath, ["--import", "tsx", path.join(root, "scripts", `${command}.ts`), ...process.argv.slice(3)], {
  cwd: root,
  stdio: "inherit",
  env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" },
});
// Ctrl-C reaches the whole foreground group; the child does the orderly shutdown.
for (const sig of ["SIGINT", "SIGTERM"]) process.on(sig, () => child.kill(sig === "SIGTERM" ? "SIGTERM" : "SIGINT"));
child.on("exit", (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
// `npm start` runs us under `sh -c`; when npm is told to stop it ends the shell, not us.
// Treat a vanished parent like SIGTERM so nothing is left running.
const parent = process.ppid;
setInterval(() => {
  if (process.ppid !== parent) child.kill("SIGTERM");
}, 1000).unref();
