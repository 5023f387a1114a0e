#!/usr/bin/env node
// Entry of `npm start` and `npm test`. Plain JavaScript so it runs before dependencies
// exist: installs them (npm ci) when node_modules is missing or older than the lockfile,
// then hands over to the TypeScript orchestration in scripts/start.ts or scripts/test.ts.
import { spawn, spawnSync } from "node:child_process";
import { existsSync, readFileSync, statSync } from "node:fs";
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
// The IPC channel carries our own stop requests (see below) and tells the orchestrator
// when we are gone.
const script = path.join(root, "scripts", `${command}.ts`);
const child = spawn(process.execPath, ["--import", "tsx", script, ...process.argv.slice(3)], {
  cwd: root,
  stdio: command === "start" ? ["inherit", "inherit", "inherit", "ipc"] : "inherit",
  env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" },
});
for (const stream of [process.stdout, process.stderr]) stream.on("error", () => {});

// A signal to the whole process group reaches the orchestrator directly; one sent to npm
// alone reaches only npm, which passes it on to us. Either way we ask the orchestrator to
// stop over IPC rather than with a second signal, which it would read as "force it".
// (`npm test` has no IPC channel and stops on the first signal, so it gets the signal.)
let asked = false;
const askToStop = (sig = "SIGTERM") => {
  if (asked) return;
  asked = true;
  if (child.connected) child.send("stop", () => {});
  else child.kill(sig);
};
for (const sig of ["SIGINT", "SIGTERM", "SIGHUP"]) process.on(sig, () => askToStop(sig));
child.on("exit", (code, signal) => {
  // An orchestrator that died without its orderly stop (kill -9, a crash) may have left
  // services running; stop them by their recorded pids.
  if (command === "start" && signal === "SIGKILL") {
    spawnSync(process.execPath, ["--import", "tsx", path.join(root, "scripts", "stop-stale.ts")], { cwd: root, stdio: "inherit" });
  }
  process.exit(code ?? (signal ? 1 : 0));
});
// npm runs us as `exec node …` (package.json), so npm is our parent and passes SIGINT and
// SIGTERM on; it dies of SIGHUP without a word. Treat a vanished parent like a stop request,
// so nothing is left running. (Run through a shell that does not exec, watch npm beyond it.)
const parent = process.ppid;
const npm = /^(sh|dash|bash)$/.test(commOf(parent)) ? parentOf(parent) : undefined;
setInterval(() => {
  if (process.ppid !== parent || (npm && !alive(npm))) askToStop();
}, 1000).unref();

function commOf(pid) {
  try {
    return readFileSync(`/proc/${pid}/comm`, "utf8").trim();
  } catch {
    return "";
  }
}

function parentOf(pid) {
  try {
    // /proc/PID/stat: "pid (comm) state ppid …"; comm may hold spaces, so read after the last ")".
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    return Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[1]) || undefined;
  } catch {
    return undefined;
  }
}

function alive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}
