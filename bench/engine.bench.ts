/**
 * `npm run bench`: prints figures (never asserts): medians of the three reference cases, memory peak,
 * time against N = 1..8, a 24-spec command-line batch, accuracy against a fine-grid run, and the
 * whole-process comparison with the straightforward baseline in bench/baseline.ts.
 */
import { execFileSync, spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { designTrains, type DesignResult, type DesignSpec, type TrainStageType } from "../lib/engine/index";

// `npm run bench` bundles this file with esbuild (as the CLI is bundled) and runs it from the package root.
const root = process.cwd();
const fixture = (name: string): DesignSpec => JSON.parse(readFileSync(join(root, "tests/fixtures/specs", name), "utf8"));

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function timeIt(f: () => unknown, warm = 15, runs = 41): { median: number; min: number; p90: number } {
  for (let i = 0; i < warm; i++) f();
  const ts: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    f();
    ts.push(performance.now() - t);
  }
  const s = [...ts].sort((a, b) => a - b);
  return { median: median(ts), min: s[0], p90: s[Math.floor(0.9 * s.length)] };
}

function ms(v: number): string {
  return `${v.toFixed(2)} ms`;
}

function worstVolumeDifference(a: DesignResult, b: DesignResult): number {
  let worst = 0;
  const byKey = new Map(b.candidates.map((c) => [c.sequence.join("-"), c]));
  for (const c of a.candidates) {
    const ref = byKey.get(c.sequence.join("-"));
    const total = ref?.totalVolume ?? null;
    if (!ref || c.totalVolume === null || total === null) continue;
    if (a.objective === "cost") {
      // Free-size cost: compare the costs.
      worst = Math.max(worst, Math.abs((c.totalCost as number) - (ref.totalCost as number)) / (ref.totalCost as number));
      continue;
    }
    worst = Math.max(worst, Math.abs(c.totalVolume - total) / total);
    c.stages.forEach((s, i) => {
      const r = ref.stages[i].volume;
      worst = Math.max(worst, Math.abs(s.volume - r) / Math.max(r, 1e-6 * total));
    });
  }
  return worst;
}

const cases: [string, DesignSpec][] = [
  ["second order, 62 sequences (1..5 stages, CSTR/PFR)", fixture("second-order-five-stages.json")],
  ["adiabatic reversible, interstage cooling, 62 sequences", fixture("adiabatic-reversible-cooling.json")],
  ["cost objective with standard sizes, 62 sequences", fixture("cost-standard-sizes.json")],
];

// `BENCH_ONLY=cli node --import tsx bench/engine.bench.ts` prints only the whole-process figures (the command line).
const only = process.env.BENCH_ONLY;
const base = fixture("second-order-five-stages.json");
if (only !== "cli") inProcess();

function inProcess(): void {
  console.log("Seriatim engine benchmark (one process, after warm-up)\n");
  for (const [name, spec] of cases) {
    const t = timeIt(() => designTrains(spec));
    const sized = spec.objective?.minimise === "cost" && spec.objective.standardSizes !== undefined;
    const accuracy = sized
      ? "exact search over sizes (no grid; checked against exhaustive enumeration in the tests)"
      : `worst relative difference of stage volumes vs a 1024-point grid: ${worstVolumeDifference(designTrains(spec), designTrains(spec, { gridPoints: 1024 })).toExponential(2)}`;
    console.log(`${name}\n  median ${ms(t.median)}  (min ${ms(t.min)}, p90 ${ms(t.p90)}); ${accuracy}`);
  }

  temperatureFigures();

  recycleFigures();

  const rss = process.resourceUsage().maxRSS / 1024;
  const heap = process.memoryUsage().heapUsed / 2 ** 20;
  console.log(`\nmemory: peak RSS ${rss.toFixed(1)} MiB (whole process), heap in use now ${heap.toFixed(1)} MiB`);

  console.log("\ntime against N (second order, all sequences of 1..N stages of both types):");
  for (let n = 1; n <= 8; n++) {
    const spec: DesignSpec = { ...base, train: { maxStages: n, types: ["CSTR", "PFR"] } };
    const count = 2 ** (n + 1) - 2;
    const t = timeIt(() => designTrains(spec), n > 6 ? 3 : 8, n > 6 ? 9 : 21);
    console.log(`  N=${n}: ${String(count).padStart(3)} sequences  median ${ms(t.median).padStart(10)}  ${(t.median / count * 1000).toFixed(1)} us/sequence`);
  }
}

/**
 * Stage temperatures as decision variables: the adiabatic reversible case with its interstage temperature
 * fixed (330 K) against the same 62 sequences with each later stage's inlet chosen within 300–420 K (and,
 * third, the first stage's too). The goal is at most 300 ms for the second where the first takes about 20 ms;
 * on a loaded machine both grow, so the ratio is printed as well.
 */
function temperatureFigures(): void {
  const fixed = fixture("adiabatic-reversible-cooling.json");
  const thermal = fixed.reaction.thermal;
  if (thermal?.mode !== "adiabatic") throw new Error("the adiabatic fixture changed");
  const free: DesignSpec = { ...fixed, reaction: { ...fixed.reaction, thermal: { ...thermal, interstageTemperature: { min: 300, max: 420 } } } };
  const feedToo: DesignSpec = { ...free, reaction: { ...free.reaction, thermal: { ...thermal, interstageTemperature: { min: 300, max: 420 }, feedTemperature: { min: 300, max: 420 } } } };
  const a = timeIt(() => designTrains(fixed), 5, 15);
  const b = timeIt(() => designTrains(free), 3, 11);
  const c = timeIt(() => designTrains(feedToo), 3, 11);
  const best = designTrains(free);
  console.log("\nstage temperatures chosen (adiabatic reversible, 62 sequences, minimum volume; medians after warm-up):");
  console.log(`  interstage temperature fixed at 330 K: median ${ms(a.median)} (min ${ms(a.min)})`);
  console.log(`  interstage temperature chosen in 300-420 K: median ${ms(b.median)} (min ${ms(b.min)}, p90 ${ms(b.p90)}), x${(b.median / a.median).toFixed(1)} the fixed case; goal <= 300 ms`);
  console.log(`  feed and interstage temperatures chosen: median ${ms(c.median)} (min ${ms(c.min)})`);
  console.log(`  best train ${best.candidates[0].sequence.join("-")}: ${best.candidates[0].totalVolume?.toPrecision(6)} m3, ${best.candidates[0].volumeOverBestPath?.toFixed(4)} x the best temperature path (${best.reference.bestTemperaturePath?.volume.toPrecision(6)} m3)`);
}

/**
 * The tube with recycle in a minimum-volume sweep. More types make more sequences (1..5 stages of three
 * types are 363, of two 62), so three figures: the 62 CSTR/PFR sequences; the 62 sequences with the tube
 * with recycle in place of the plain tube (CSTR/PFR-recycle, same count); and all 363 of the three types,
 * per sequence against the 62. The "at most a factor of two" is read as the second against the
 * first, and per sequence for the third.
 */
function recycleFigures(): void {
  const autocatalytic: DesignSpec = {
    feed: { flowA: 0.01, concA: 500, temperature: 300, ratios: { R: 0.02 } },
    reaction: { stoichiometry: { A: -1, R: 1 }, rate: { law: "power", k: 2e-5, orders: { A: 1, R: 1 } } },
    target: { conversion: 0.95 },
    train: { maxStages: 5 },
  };
  const specs: [string, DesignSpec][] = [
    ["second order", base],
    ["adiabatic reversible, interstage cooling", fixture("adiabatic-reversible-cooling.json")],
    ["autocatalytic A + R -> 2R", autocatalytic],
  ];
  console.log("\ntube with recycle (minimum volume, 1..5 stages; medians after warm-up):");
  for (const [name, spec] of specs) {
    const withTypes = (types: TrainStageType[]): DesignSpec => ({ ...spec, train: { maxStages: 5, types } });
    const plain = timeIt(() => designTrains(withTypes(["CSTR", "PFR"])), 5, 15).median;
    const swapped = timeIt(() => designTrains(withTypes(["CSTR", "PFR-recycle"])), 5, 15).median;
    const all = timeIt(() => designTrains(withTypes(["CSTR", "PFR", "PFR-recycle"])), 3, 9).median;
    console.log(
      `  ${name}: 62 CSTR/PFR ${ms(plain)}; 62 CSTR/PFR-recycle ${ms(swapped)} (x${(swapped / plain).toFixed(2)}); ` +
        `363 of all three ${ms(all)}, ${((all / 363) * 1000).toFixed(0)} us/sequence against ${((plain / 62) * 1000).toFixed(0)} (x${((all / 363) / (plain / 62)).toFixed(2)})`,
    );
  }
}

// Whole processes: the command line as `npm run --silent sweep` runs it (scripts/sweep-run.mjs, its bundle and
// code cache) and the baseline, bundled.
const dir = mkdtempSync(join(tmpdir(), "seriatim-bench-"));
const esbuild = join(root, "node_modules/.bin/esbuild");
const bundle = (entry: string, out: string) =>
  execFileSync(esbuild, [entry, "--bundle", "--platform=node", "--format=esm", "--minify", `--outfile=${out}`, "--log-level=error"], { cwd: root });
const ours = join(root, "scripts/sweep-run.mjs");
const theirs = join(dir, "baseline.mjs");
bundle("bench/baseline-cli.ts", theirs);

const files: string[] = [];
for (let i = 0; i < 24; i++) {
  const spec: DesignSpec = { ...base, reaction: { rate: { law: "power", k: 2.5e-5 * (1 + 0.1 * i), orders: { A: 2 } } }, target: { conversion: 0.8 + 0.007 * i } };
  const f = join(dir, `spec-${i}.json`);
  writeFileSync(f, JSON.stringify(spec));
  files.push(f);
}
const wall = (cmd: string, args: string[], cwd = root) => {
  const t = performance.now();
  const r = spawnSync(cmd, args, { cwd, encoding: "utf8", maxBuffer: 1 << 30 });
  return { ms: performance.now() - t, out: r.stdout };
};
const median5 = (cmd: string, args: string[], cwd = root) => median([0, 1, 2, 3, 4].map(() => wall(cmd, args, cwd).ms));

// npm's own floor: `npm run --silent` of a script that does nothing, in a copy of this package.json.
const npmDir = join(dir, "npm-floor");
mkdirSync(npmDir);
const manifest = JSON.parse(readFileSync(join(root, "package.json"), "utf8"));
writeFileSync(join(npmDir, "package.json"), JSON.stringify({ ...manifest, scripts: { ...manifest.scripts, nothing: "true" } }));

// The first run builds the bundle if stale and writes its code cache; the runs timed below find both.
spawnSync("npm", ["run", "--silent", "sweep", "--", files[0]], { cwd: root });
const batchNpm = median5("npm", ["run", "--silent", "sweep", "--", ...files]);
const batchNode = median5("node", [ours, ...files]);
const plotNpm = median5("npm", ["run", "--silent", "sweep", "--", "--plot", ...files]);
const npmFloor = median5("npm", ["run", "--silent", "nothing"], npmDir);
const nodeFloor = median5("node", ["-e", "0"]);
// Loaded with nothing to do: an unknown option is refused after the bundle has loaded (exit 2).
const loaded = median5("node", [ours, "--nothing"]);
const bytes = Buffer.byteLength(wall("node", [ours, ...files]).out);
const plotBytes = Buffer.byteLength(wall("node", [ours, "--plot", ...files]).out);
console.log(`\n24-spec batch through the command line (62 sequences each, start-up included; medians of 5):`);
console.log(`  npm run --silent sweep: ${ms(batchNpm)}   node on the bundle alone (node scripts/sweep-run.mjs): ${ms(batchNode)}`);
console.log(`  with --plot: ${ms(plotNpm)} through npm`);
console.log(`  output: ${bytes} bytes without plot points, ${plotBytes} bytes with --plot`);
console.log(`  where the time goes: npm run --silent of a script that does nothing ${ms(npmFloor)}; node -e 0 ${ms(nodeFloor)};`);
console.log(`    the command line loaded with nothing to do ${ms(loaded)}; designing and printing the 24 specs ≈ ${ms(batchNode - loaded)}`);

if (only !== "cli") againstBaseline();

/** The same work through the straightforward baseline, whole process and in process. */
function againstBaseline(): void {
  const baseBatch = wall("node", [theirs, ...files]).ms;
  console.log(`  baseline on the same 24 specs, one process: ${ms(baseBatch)}   whole-process factor ${(baseBatch / batchNode).toFixed(1)}x (node on the bundles)`);

  const specFile = join(dir, "second-order.json");
  writeFileSync(specFile, JSON.stringify(base));
  const oursOne = median([0, 1, 2].map(() => wall("node", [ours, specFile]).ms));
  const runs = [0, 1, 2].map(() => wall("node", [theirs, specFile]));
  const theirsOne = median(runs.map((r) => r.ms));
  const baselineVolumes: number[] = JSON.parse(runs[0].out.trim()).volumes;
  const ourResult = designTrains(base);
  const ourVolumes = new Map(ourResult.candidates.map((c) => [c.sequence.join("-"), c.totalVolume as number]));
  const seqs: string[] = [];
  let level: string[][] = [[]];
  for (let n = 1; n <= 5; n++) {
    level = level.flatMap((s) => ["CSTR", "PFR"].map((t) => [...s, t]));
    seqs.push(...level.map((s) => s.join("-")));
  }
  const baseErr = Math.max(...seqs.map((s, i) => Math.abs(baselineVolumes[i] - (ourVolumes.get(s) as number)) / (ourVolumes.get(s) as number)));
  console.log(`\nwhole process, one 62-sequence second-order case:`);
  console.log(`  baseline (golden-section per sequence, adaptive Simpson, tightened to 1e-4): ${ms(theirsOne)}`);
  console.log(`  Seriatim (node on the CLI bundle): ${ms(oursOne)}   factor ${(theirsOne / oursOne).toFixed(1)}x`);
  const bt = timeIt(() => execFileSync("node", ["-e", "0"]), 1, 5);
  console.log(`  (bare node start-up on this machine: ${ms(bt.median)}; in-process baseline vs engine factor below)`);
  const inBase = timeIt(() => spawnSync("node", [theirs, specFile]), 0, 3).median - bt.median;
  console.log(`  baseline minus node start-up ≈ ${ms(inBase)}; engine in-process median ${ms(timeIt(() => designTrains(base)).median)}`);
  console.log(`  largest relative difference between baseline and Seriatim totals: ${baseErr.toExponential(2)}`);
}
