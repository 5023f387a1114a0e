#!/usr/bin/env node
// Entry of `npm run --silent sweep`. Plain JavaScript so it runs from a fresh clone: it bundles
// scripts/sweep.ts with esbuild on first use (and again when a file the bundle was built from is newer),
// then runs the bundle in this same process. What a run pays before its first file is kept small:
// - freshness: the files esbuild reported as the bundle's inputs are stat'ed (a millisecond or two)
//   instead of a shell running `find` over the source folders; esbuild is loaded only to build;
// - compiling: V8's code cache of the bundle, written after the first run, spares parsing and compiling
//   the bundle's functions again (about a third of loading it); V8 refuses a cache of another Node
//   version or another bundle, and then a new one is written.
import { mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { Script } from "node:vm";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const dir = path.join(root, "node_modules", ".cache", "seriatim");
const bundle = path.join(dir, "sweep.cjs");
// V8 refuses a cache made under other flags; one cache per Node version and flags, so runs with different
// flags (a test runner's NODE_OPTIONS, say) do not keep rewriting each other's.
const codeCache = path.join(dir, `sweep.cjs.${fnv1a(`${process.version} ${process.execArgv.join(" ")} ${process.env.NODE_OPTIONS ?? ""}`)}.v8cache`);
const manifest = path.join(dir, "sweep.inputs.json");
// Bump when the build options below change, so an older bundle is rebuilt.
const RECIPE = "cjs-minify-1";
// Inputs besides the sources: this launcher, and the installed dependencies (npm rewrites this file on install).
const ALWAYS = ["scripts/sweep-run.mjs", "node_modules/.package-lock.json"];

function fnv1a(text) {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193);
  return (h >>> 0).toString(16);
}

function fresh() {
  let m;
  try {
    m = JSON.parse(readFileSync(manifest, "utf8"));
    if (m.recipe !== RECIPE) return false;
    statSync(bundle);
  } catch {
    return false;
  }
  for (const file of m.inputs) {
    try {
      if (statSync(path.join(root, file)).mtimeMs > m.builtAt) return false;
    } catch {
      return false; // a file the bundle came from is gone
    }
  }
  return true;
}

/** Written aside and renamed: a run starting at the same time reads the old file or the new, never half of one. */
function replace(file, contents) {
  const tmp = `${file}.${process.pid}.tmp`;
  writeFileSync(tmp, contents);
  renameSync(tmp, file);
}

async function build() {
  const { build: esbuild } = await import("esbuild");
  // Taken before reading the sources, so an edit made while building makes the next run build again.
  const builtAt = Date.now();
  const result = await esbuild({
    absWorkingDir: root,
    entryPoints: ["scripts/sweep.ts"],
    bundle: true,
    platform: "node",
    // CommonJS so the bundle can be compiled as one function with V8's code cache (node:vm).
    format: "cjs",
    minify: true,
    metafile: true,
    write: false,
    outfile: bundle,
    logLevel: "error",
  });
  const sources = Object.keys(result.metafile.inputs).filter((f) => !f.startsWith("node_modules/"));
  mkdirSync(dir, { recursive: true });
  for (const f of readdirSync(dir)) if (f.endsWith(".v8cache")) rmSync(path.join(dir, f), { force: true });
  replace(bundle, result.outputFiles[0].contents);
  replace(manifest, JSON.stringify({ recipe: RECIPE, builtAt, inputs: [...ALWAYS, ...sources] }));
}

if (!fresh()) await build();

let cachedData;
try {
  cachedData = readFileSync(codeCache);
} catch {
  // first run after a build: compiled from source, and the cache written at exit
}
const source = readFileSync(bundle, "utf8");
const script = new Script(`(function (exports, require, module, __filename, __dirname) {${source}\n})`, { filename: bundle, cachedData });
const run = script.runInThisContext();
if (cachedData === undefined || script.cachedDataRejected) {
  // At exit, so the cache holds every function the run compiled (the engine's too), not only the top level.
  process.once("exit", () => {
    try {
      replace(codeCache, script.createCachedData());
    } catch {
      // a read-only cache folder only costs the next run its compile time
    }
  });
}
const cjsModule = { exports: {} };
run(cjsModule.exports, createRequire(bundle), cjsModule, bundle, dir);
