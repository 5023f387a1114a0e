import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
import { dirname, join, relative, resolve } from "node:path";

/**
 * The import graph of the source folders, read as text so that no rule of ours can be switched
 * off by an ESLint comment or a configuration edit without this test noticing.
 */

export type ImportEdge = {
  /** The importing file, relative to the repository root ("lib/services/pins.ts"). */
  from: string;
  /** What was written after `from` ("@/db/client", "./grid", "next/server"). */
  specifier: string;
  /** The imported file relative to the root when it is ours ("db/client.ts"), else null (a package). */
  target: string | null;
  /** True when nothing but types crosses the edge (`import type`, `export type`, or every name marked `type`). */
  typeOnly: boolean;
  line: number;
};

export const SOURCE_FOLDERS = ["app", "components", "lib", "db", "worker", "scripts", "proxy.ts", "instrumentation-client.ts"] as const;

const EXTENSIONS = [".ts", ".tsx", ".mts", ".js", ".mjs"];

function listSources(root: string, folder: string): string[] {
  const full = join(root, folder);
  if (!existsSync(full)) return [];
  if (statSync(full).isFile()) return [folder];
  return (readdirSync(full, { recursive: true }) as string[])
    .filter((f) => EXTENSIONS.some((e) => f.endsWith(e)) && !f.endsWith(".d.ts"))
    .map((f) => join(folder, f));
}

function resolveTarget(root: string, fromFile: string, specifier: string): string | null {
  let base: string;
  if (specifier.startsWith("@/")) base = join(root, specifier.slice(2));
  else if (specifier.startsWith(".")) base = resolve(root, dirname(fromFile), specifier);
  else return null;
  const candidates = [base, ...EXTENSIONS.map((e) => base + e), ...EXTENSIONS.map((e) => join(base, "index" + e))];
  for (const c of candidates) {
    if (existsSync(c) && statSync(c).isFile()) return relative(root, c);
  }
  return relative(root, base);
}

// import x from "y"; import { a, type b } from "y"; import type { T } from "y"; export { x } from "y";
// export * from "y"; import "y"; import("y"); require("y")
const STATIC = /^\s*(import|export)\s+(type\s+)?([\s\S]*?)\s*from\s*["']([^"']+)["']/gm;
const BARE = /^\s*import\s+["']([^"']+)["']/gm;
const DYNAMIC = /(?:import|require)\(\s*["']([^"']+)["']\s*\)/g;

function lineOf(text: string, index: number): number {
  return text.slice(0, index).split("\n").length;
}

function namesAreAllTypes(clause: string): boolean {
  const braces = clause.match(/^\{([\s\S]*)\}$/);
  if (!braces) return false;
  const names = braces[1].split(",").map((n) => n.trim()).filter(Boolean);
  return names.length > 0 && names.every((n) => n.startsWith("type "));
}

export function readImportGraph(root: string): ImportEdge[] {
  const edges: ImportEdge[] = [];
  for (const folder of SOURCE_FOLDERS) {
    for (const file of listSources(root, folder)) {
      const text = readFileSync(join(root, file), "utf8");
      for (const m of text.matchAll(STATIC)) {
        const clause = m[3].trim();
        edges.push({
          from: file,
          specifier: m[4],
          target: resolveTarget(root, file, m[4]),
          typeOnly: Boolean(m[2]) || namesAreAllTypes(clause),
          line: lineOf(text, m.index ?? 0),
        });
      }
      for (const m of text.matchAll(BARE)) {
        edges.push({ from: file, specifier: m[1], target: resolveTarget(root, file, m[1]), typeOnly: false, line: lineOf(text, m.index ?? 0) });
      }
      for (const m of text.matchAll(DYNAMIC)) {
        edges.push({ from: file, specifier: m[1], target: resolveTarget(root, file, m[1]), typeOnly: false, line: lineOf(text, m.index ?? 0) });
      }
    }
  }
  return edges;
}
