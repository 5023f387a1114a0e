import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";

const SOURCES = ["app", "components", "lib", "db", "next.config.mjs", "tailwind.config.ts", "postcss.config.mjs", "package-lock.json", "tsconfig.json"];

function newestMtime(p: string): number {
  if (!existsSync(p)) return 0;
  const st = statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  return readdirSync(p).reduce((m, e) => Math.max(m, newestMtime(path.join(p, e))), st.mtimeMs);
}

/** True when there is no production build or a source file is newer than it. */
export function buildIsStale(root: string): boolean {
  const buildId = path.join(root, ".next", "BUILD_ID");
  if (!existsSync(buildId)) return true;
  const built = statSync(buildId).mtimeMs;
  return SOURCES.some((s) => newestMtime(path.join(root, s)) > built);
}

export function runNextBuild(root: string, env: NodeJS.ProcessEnv): void {
  const r = spawnSync(path.join(root, "node_modules", ".bin", "next"), ["build"], {
    cwd: root,
    stdio: "inherit",
    env: { ...env, NEXT_TELEMETRY_DISABLED: "1", NODE_ENV: "production" },
  });
  if (r.status !== 0) throw new Error(`next build failed (exit ${r.status})`);
}
