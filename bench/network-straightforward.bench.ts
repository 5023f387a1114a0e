/**
 * The comparison issue 13 asks for: the network designer's command line against a straightforward script
 * doing the same work the obvious way, whole process against whole process, on the three-reaction example
 * (tests/fixtures/specs/network-three-reactions.json: every sequence of 1..3 stirred tanks and tubes,
 * highest yield of B, at least 50 % conversion, at most 2 m3 in all), then the same widened to 1..5 stages
 * (62 sequences, the case of the performance paragraph).
 *
 * The straightforward script (run by this file as a child process with `--straightforward FILE`):
 * per sequence, 8 Nelder–Mead searches from random residence times (seeded), each stage's time searched as
 * its logarithm; tubes integrated by a general stiff solver (the engine's Rosenbrock integrator used as a
 * library: rtol 1e-4, Jacobian by finite differences, no knowledge of the kinetics); a stirred tank solved by
 * a general damped Newton from its feed with a difference Jacobian; the minimum conversion by a penalty and
 * the volume limit by scaling the times down. Power laws and isothermal stages only (all the example needs).
 *
 * Prints both wall times, their ratio and the gap of each sequence's objective. Asserts nothing (the
 * issue's goal: the command line at least 30 times faster). Run with `npm run bench:network-compare`.
 */
import { spawnSync } from "node:child_process";
import { readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { integrateStiff } from "../lib/engine/stiff-ode";

interface PowerReaction {
  stoichiometry: Record<string, number>;
  rate: { law: "power"; k: number; orders: Record<string, number> };
}
interface ExampleSpec {
  feed: { volumetricFlow: number; concentrations: Record<string, number> };
  reactions: PowerReaction[];
  keyReactant: string;
  train: { maxStages: number; types: ("CSTR" | "PFR")[] };
  objective: { maximise: "yield"; product: string };
  constraints: { minConversion: number; maxTotalVolume: number };
}
interface Outcome {
  sequence: string[];
  objective: number | null;
}

const FIXTURE = "tests/fixtures/specs/network-three-reactions.json";

function straightforward(spec: ExampleSpec): Outcome[] {
  const species = Object.keys(spec.feed.concentrations);
  const n = species.length;
  const C0 = species.map((s) => spec.feed.concentrations[s]);
  const key = species.indexOf(spec.keyReactant);
  const product = species.indexOf(spec.objective.product);
  const maxTau = spec.constraints.maxTotalVolume / spec.feed.volumetricFlow;
  const dCdt = (C: ArrayLike<number>, out: Float64Array) => {
    out.fill(0);
    for (const r of spec.reactions) {
      let rate = r.rate.k;
      for (const [s, a] of Object.entries(r.rate.orders)) rate *= Math.max(C[species.indexOf(s)], 0) ** a;
      for (const [s, nu] of Object.entries(r.stoichiometry)) out[species.indexOf(s)] += nu * rate;
    }
  };
  const tube = (Cin: Float64Array, tau: number) =>
    tau <= 0 ? Cin : integrateStiff((_t, y, d) => dCdt(y, d), Cin, 0, tau, { rtol: 1e-4, atol: 1e-8 * Math.max(...C0), autonomous: true }).y;
  const tank = (Cin: Float64Array, tau: number) => {
    // G(C) = Cin - C + tau R(C) = 0 by Newton from the feed, difference Jacobian, halving steps.
    const C = Float64Array.from(Cin);
    const R = new Float64Array(n);
    const G = (x: Float64Array) => {
      dCdt(x, R);
      return Array.from(x, (c, i) => Cin[i] - c + tau * R[i]);
    };
    let g = G(C);
    for (let it = 0; it < 100; it++) {
      const norm = Math.max(...g.map(Math.abs));
      if (norm < 1e-10 * Math.max(...C0)) break;
      const J = Array.from({ length: n }, () => new Array<number>(n).fill(0));
      for (let k = 0; k < n; k++) {
        const h = 1e-7 * Math.max(Math.abs(C[k]), 1e-3);
        const x = Float64Array.from(C);
        x[k] += h;
        const gk = G(x);
        for (let i = 0; i < n; i++) J[i][k] = (gk[i] - g[i]) / h;
      }
      const step = solve(J, g.map((v) => -v));
      let alpha = 1;
      for (let half = 0; half < 30; half++, alpha /= 2) {
        const x = Float64Array.from(C, (c, i) => Math.max(c + alpha * step[i], 0));
        const gx = G(x);
        if (Math.max(...gx.map(Math.abs)) < norm) {
          C.set(x);
          g = gx;
          break;
        }
      }
    }
    return C;
  };
  const train = (sequence: string[], taus: number[]) => {
    let C: Float64Array = Float64Array.from(C0);
    sequence.forEach((type, s) => {
      C = type === "PFR" ? tube(C, taus[s]) : tank(C, taus[s]);
    });
    return C;
  };
  const random = mulberry32(13);
  const outcomes: Outcome[] = [];
  const sequences: string[][] = [];
  let layer: string[][] = [[]];
  for (let k = 1; k <= spec.train.maxStages; k++) {
    layer = layer.flatMap((s) => spec.train.types.map((t) => [...s, t]));
    sequences.push(...layer);
  }
  for (const sequence of sequences) {
    const toTaus = (x: number[]) => {
      const taus = x.map((v) => Math.exp(v));
      const sum = taus.reduce((a, b) => a + b, 0);
      return sum > maxTau ? taus.map((t) => (t * maxTau) / sum) : taus;
    };
    const measure = (taus: number[]) => {
      const C = train(sequence, taus);
      return { X: 1 - C[key] / C0[key], Y: (C[product] - C0[product]) / C0[key] };
    };
    const merit = (x: number[]) => {
      try {
        const m = measure(toTaus(x));
        return -m.Y + 1e3 * Math.max(0, spec.constraints.minConversion - m.X);
      } catch {
        return Number.POSITIVE_INFINITY;
      }
    };
    let best: { x: number[]; f: number } | null = null;
    for (let start = 0; start < 8; start++) {
      const x0 = sequence.map(() => Math.log(1e-3 * maxTau) + random() * Math.log(1e3));
      const res = textbookNelderMead(merit, x0, 1e-10, 300 * sequence.length);
      if (best === null || res.f < best.f) best = res;
    }
    const m = measure(toTaus(best!.x));
    outcomes.push({ sequence, objective: m.X >= spec.constraints.minConversion - 1e-6 ? m.Y : null });
  }
  return outcomes;
}

/** Gaussian elimination with partial pivoting. */
function solve(A: number[][], b: number[]): number[] {
  const n = b.length;
  const M = A.map((row, i) => [...row, b[i]]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r][c]) > Math.abs(M[p][c])) p = r;
    [M[c], M[p]] = [M[p], M[c]];
    for (let r = c + 1; r < n; r++) {
      const f = M[r][c] / M[c][c];
      for (let k = c; k <= n; k++) M[r][k] -= f * M[c][k];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = M[r][n];
    for (let k = r + 1; k < n; k++) s -= M[r][k] * x[k];
    x[r] = s / M[r][r];
  }
  return x;
}

/** The textbook method (reflect, expand, contract, shrink), unit initial steps, no bounds. */
function textbookNelderMead(f: (x: number[]) => number, x0: number[], tol: number, maxEvaluations: number): { x: number[]; f: number } {
  const n = x0.length;
  const pts = [x0, ...x0.map((_, i) => x0.map((v, d) => (d === i ? v + 1 : v)))];
  const vals = pts.map(f);
  let evaluations = n + 1;
  while (evaluations < maxEvaluations) {
    const order = vals.map((_, i) => i).sort((a, b) => vals[a] - vals[b]);
    const P = order.map((i) => pts[i]);
    const V = order.map((i) => vals[i]);
    for (let i = 0; i <= n; i++) [pts[i], vals[i]] = [P[i], V[i]];
    if (Math.abs(vals[n] - vals[0]) <= tol * (1 + Math.abs(vals[0]))) break;
    const c = new Array<number>(n).fill(0);
    for (let i = 0; i < n; i++) for (let d = 0; d < n; d++) c[d] += pts[i][d] / n;
    const along = (t: number) => c.map((v, d) => v + t * (pts[n][d] - v));
    const xr = along(-1);
    const fr = f(xr);
    evaluations++;
    if (fr < vals[0]) {
      const xe = along(-2);
      const fe = f(xe);
      evaluations++;
      [pts[n], vals[n]] = fe < fr ? [xe, fe] : [xr, fr];
    } else if (fr < vals[n - 1]) [pts[n], vals[n]] = [xr, fr];
    else {
      const xc = fr < vals[n] ? along(-0.5) : along(0.5);
      const fc = f(xc);
      evaluations++;
      if (fc < Math.min(fr, vals[n])) [pts[n], vals[n]] = [xc, fc];
      else
        for (let i = 1; i <= n; i++) {
          pts[i] = pts[i].map((v, d) => pts[0][d] + 0.5 * (v - pts[0][d]));
          vals[i] = f(pts[i]);
          evaluations++;
        }
    }
  }
  return { x: pts[0], f: vals[0] };
}

function mulberry32(seed: number): () => number {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function timed(command: string, args: string[]): { ms: number; stdout: string } {
  const t = performance.now();
  const run = spawnSync(command, args, { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });
  const ms = performance.now() - t;
  if (run.status !== 0) throw new Error(`${command} ${args.join(" ")} failed: ${run.stderr}`);
  return { ms, stdout: run.stdout };
}

if (process.argv[2] === "--straightforward") {
  console.log(JSON.stringify(straightforward(JSON.parse(readFileSync(process.argv[3], "utf8")) as ExampleSpec)));
} else {
  const self = fileURLToPath(import.meta.url);
  // The example as it stands (1..3 stages), and widened to 1..5 stages (62 sequences), the case.
  const wide = join(tmpdir(), `seriatim-network-five-stages-${process.pid}.json`);
  writeFileSync(wide, JSON.stringify({ ...JSON.parse(readFileSync(FIXTURE, "utf8")), train: { maxStages: 5, types: ["CSTR", "PFR"] } }));
  try {
    timed("npm", ["run", "--silent", "sweep", "--", FIXTURE]); // builds the command line's bundle if stale
    for (const [label, file] of [["the example, 1..3 stages", FIXTURE], ["the example widened to 1..5 stages", wide]]) compare(label, file, self);
    // What any command-line run pays before designing: npm, Node and the bundle's start-up.
    const floor = [0, 1, 2].map(() => timed("npm", ["run", "--silent", "sweep", "--", "tests/fixtures/specs/first-order-liquid.json"]).ms).sort((a, b) => a - b)[1];
    console.log(`start-up floor of the command line (a one-reaction spec, median of 3): ${floor.toFixed(0)} ms`);
  } finally {
    rmSync(wide, { force: true });
  }
}

function compare(label: string, file: string, self: string): void {
  const sweeps = [0, 1, 2].map(() => timed("npm", ["run", "--silent", "sweep", "--", file]));
  const sweep = sweeps.sort((a, b) => a.ms - b.ms)[1];
  const plain = timed(process.execPath, [self, "--straightforward", file]);
  const ours = (JSON.parse(sweep.stdout) as { candidates: Outcome[] }).candidates;
  const theirs = JSON.parse(plain.stdout) as Outcome[];
  let worst = 0;
  let better = 0;
  for (const c of ours) {
    const s = theirs.find((q) => q.sequence.join() === c.sequence.join());
    if (!s || c.objective === null || s.objective === null) continue;
    worst = Math.max(worst, Math.abs(c.objective - s.objective) / Math.abs(c.objective));
    if (s.objective > c.objective * (1 + 1e-9)) better++;
  }
  const bestOurs = Math.max(...ours.map((c) => c.objective ?? -Infinity));
  const bestTheirs = Math.max(...theirs.map((c) => c.objective ?? -Infinity));
  console.log(`${label}, ${theirs.length} sequences, whole process:`);
  console.log(`  npm run sweep (median of 3): ${sweep.ms.toFixed(0)} ms; straightforward script: ${plain.ms.toFixed(0)} ms; ratio ${(plain.ms / sweep.ms).toFixed(1)}x`);
  console.log(`  best yield: ours ${bestOurs}, straightforward ${bestTheirs} (relative gap ${(Math.abs(bestOurs - bestTheirs) / bestOurs).toExponential(2)})`);
  console.log(`  largest relative gap of a sequence's objective ${worst.toExponential(2)}; straightforward better by > 1e-9 on ${better} sequences`);
}
