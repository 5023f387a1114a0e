#!/usr/bin/env node
// Entry of `npm run --silent sweep`. Plain JavaScript so it runs from a fresh clone: it bundles
// scripts/sweep.ts with esbuild on first use (and again when a file the bundle was built from is newer),
// then runs the bundle in this same process. The freshness check stats the files esbuild reported as the
// bundle's inputs, a millisecond or two, instead of a shell running `find` over source folders; esbuild
// itself is loaded only when a build is needed.
import { mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const dir = path.join(root, "node_modules", ".cache", "seriatim");
const bundle = path.join(dir, "sweep.mjs");
const manifest = path.join(dir, "sweep.inputs.json");
// Bump when the build options below change, so an older bundle is rebuilt.
const RECIPE = "esm-minify-1";
// Inputs besides the sources: this launcher, and the installed dependencies (npm rewrites this file on install).
const ALWAYS = ["scripts/sweep-run.mjs", "node_modules/.package-lock.json"];

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

async function build() {
  const { build: esbuild } = await import("esbuild");
  // Taken before reading the sources, so an edit made while building makes the next run build again.
  const builtAt = Date.now();
  const result = await esbuild({
    absWorkingDir: root,
    entryPoints: ["scripts/sweep.ts"],
    bundle: true,
    platform: "node",
    format: "esm",
    minify: true,
    metafile: true,
    write: false,
    outfile: bundle,
    logLevel: "error",
  });
  const sources = Object.keys(result.metafile.inputs).filter((f) => !f.startsWith("node_modules/"));
  mkdirSync(dir, { recursive: true });
  // Written aside and renamed: another run starting at the same time reads the old bundle or the new, never half of one.
  const tmp = `.${process.pid}.tmp`;
  writeFileSync(bundle + tmp, result.outputFiles[0].contents);
  renameSync(bundle + tmp, bundle);
  writeFileSync(manifest + tmp, JSON.stringify({ recipe: RECIPE, builtAt, inputs: [...ALWAYS, ...sources] }));
  renameSync(manifest + tmp, manifest);
}

if (!fresh()) await build();
await import(pathToFileURL(bundle).href);
