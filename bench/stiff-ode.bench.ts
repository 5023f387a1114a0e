/**
 * Work and wall time of the stiff integrator (RODAS4) on
 * Robertson's problem, Van der Pol (epsilon = 1e-6), a fast equilibrium beside a slow step, and a non-stiff
 * A -> B -> C + 2A -> D network
 * (beside odex for scale), at rtol 1e-6 and 1e-8; then the cost of the small LU against ml-matrix's.
 * Prints figures, asserts nothing. Bundled with esbuild first (odex is CommonJS, as bench:robustness does):
 *   esbuild bench/stiff-ode.bench.ts --bundle --platform=node --format=esm \
 *     --outfile=node_modules/.cache/seriatim/bench-stiff.mjs --log-level=error && node node_modules/.cache/seriatim/bench-stiff.mjs
 */
import { LuDecomposition, Matrix } from "ml-matrix";
import { Solver } from "odex";
import { luFactor, luSolve } from "../lib/engine/small-lu";
import { integrateStiff, type OdeFunction, type StiffOptions, type StiffResult } from "../lib/engine/stiff-ode";
import { robertson, robertsonJacobian } from "../tests/helpers/stiff-problems";

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/** Median wall time in ms over runs after warm-up, and the last result. */
function timeIt<T>(f: () => T, warm = 3, runs = 11): { ms: number; result: T } {
  let result = f();
  for (let i = 1; i < warm; i++) result = f();
  const ts: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    result = f();
    ts.push(performance.now() - t);
  }
  return { ms: median(ts), result };
}

// Reference values: Hairer & Wanner II at t = 40, the IVP test set (ROBER) at 1e11 (from memory);
// at 1e5 and 4e10 a scipy Radau run at rtol 1e-12, atol 1e-20 made while writing this bench.
const robertsonY1: Record<string, number> = { "40": 0.7158270687193267, "100000": 0.017865921142100359, "40000000000": 5.2083451767934872e-8, "100000000000": 0.2083340149701255e-7 };

const eps = 1e-6;
const vanDerPol: OdeFunction = (_t, y, d) => {
  d[0] = y[1];
  d[1] = ((1 - y[0] * y[0]) * y[1] - y[0]) / eps;
};
const vanDerPolJacobian = (_t: number, y: Float64Array, J: number[][]) => {
  J[0][1] = 1;
  J[1][0] = (-2 * y[0] * y[1] - 1) / eps;
  J[1][1] = (1 - y[0] * y[0]) / eps;
};

// A <=> B fast (1e4 and 5e3 per s), B -> C slow (1e-3 per s): the fast equilibrium beside a slow step.
const K = [
  [-1e4, 5e3, 0],
  [1e4, -5e3 - 1e-3, 0],
  [0, 1e-3, 0],
];
const fastEquilibrium: OdeFunction = (_t, y, d) => {
  for (let i = 0; i < 3; i++) d[i] = K[i][0] * y[0] + K[i][1] * y[1] + K[i][2] * y[2];
};
const fastEquilibriumJacobian = (_t: number, _y: Float64Array, J: number[][]) => {
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) J[i][j] = K[i][j];
};

function jacobians(analytic: NonNullable<StiffOptions["jacobian"]>): [string, Partial<StiffOptions>][] {
  return [
    ["central differences", { differences: "central" }],
    ["forward differences", { differences: "forward" }],
    ["analytic Jacobian", { jacobian: analytic }],
  ];
}

const network = (_t: number, c: ArrayLike<number>, d: number[] | Float64Array) => {
  const r1 = c[0];
  const r2 = 0.5 * c[1];
  const r3 = 0.2 * c[0] * c[0];
  d[0] = -r1 - 2 * r3;
  d[1] = r1 - r2;
  d[2] = r2;
  d[3] = r3;
};

function row(label: string, r: StiffResult, ms: number, error?: number) {
  const err = error === undefined ? "" : `   error ${error.toExponential(1)}`;
  console.log(
    `  ${label.padEnd(52)} ${String(r.steps).padStart(6)} steps ${String(r.rejected).padStart(4)} rej ${String(r.functionEvaluations).padStart(7)} f-evals ${String(r.jacobianEvaluations).padStart(6)} Jac ${ms.toFixed(2).padStart(8)} ms${err}`,
  );
}

console.log("Stiff integrator (RODAS4), median wall time of 11 runs (5 for Robertson to 4e10 and Van der Pol) after 3 warm-up runs; atol = rtol x 1e-4 unless stated");
for (const rtol of [1e-6, 1e-8]) {
  const atol = rtol * 1e-4;
  console.log(`rtol ${rtol}`);
  for (const T of [40, 1e5, 4e10]) {
    for (const [label, jac] of jacobians(robertsonJacobian)) {
      const { ms, result } = timeIt(() => integrateStiff(robertson, [1, 0, 0], 0, T, { rtol, atol, autonomous: true, ...jac }), 3, T > 1e5 ? 5 : 11);
      row(`Robertson to ${T}, ${label}`, result, ms, Math.abs(result.y[0] - robertsonY1[String(T)]));
    }
  }
  for (const [label, jac] of jacobians(vanDerPolJacobian)) {
    const { ms, result } = timeIt(() => integrateStiff(vanDerPol, [2, 0], 0, 2, { rtol, atol: rtol, autonomous: true, ...jac }), 3, 5);
    row(`Van der Pol to 2 (atol = rtol), ${label}`, result, ms, Math.abs(result.y[0] - 1.706167732170483));
  }
  for (const [label, jac] of jacobians(fastEquilibriumJacobian)) {
    const { ms, result } = timeIt(() => integrateStiff(fastEquilibrium, [3, 0, 0], 0, 5000, { rtol, atol, autonomous: true, ...jac }));
    row(`fast A <=> B, slow B -> C to 5000, ${label}`, result, ms);
  }
  const { ms, result } = timeIt(() => integrateStiff(network as OdeFunction, [2, 0, 0, 0], 0, 10, { rtol, atol, autonomous: true }));
  const solver = new Solver(4);
  solver.absoluteTolerance = atol;
  solver.relativeTolerance = rtol;
  let odexEvaluations = 0;
  const odex = timeIt(() => {
    odexEvaluations = 0;
    return solver.solve((x: number, y: number[]) => {
      odexEvaluations++;
      const d = [0, 0, 0, 0];
      network(x, y, d);
      return d;
    }, 0, [2, 0, 0, 0], 10);
  });
  const fine = new Solver(4);
  fine.absoluteTolerance = 1e-14;
  fine.relativeTolerance = 1e-14;
  const reference = fine.solve((x: number, y: number[]) => {
    const d = [0, 0, 0, 0];
    network(x, y, d);
    return d;
  }, 0, [2, 0, 0, 0], 10).y;
  row("non-stiff network to 10 (central differences)", result, ms, Math.abs(result.y[1] - reference[1]));
  console.log(`  ${"  same network, odex (non-stiff extrapolation)".padEnd(52)} ${String(odex.result.nStep).padStart(6)} steps          ${String(odexEvaluations).padStart(7)} f-evals            ${odex.ms.toFixed(2).padStart(8)} ms   error ${Math.abs(odex.result.y[1] - reference[1]).toExponential(1)}`);
}

// Why a hand-written LU: the integrator factors one small matrix per step.
console.log("LU factor + one solve, microseconds per call (median of 11 batches of 20,000)");
for (const n of [3, 12]) {
  const base = Array.from({ length: n * n }, (_, k) => (k % (n + 1) === 0 ? 10 + k : Math.sin(k)));
  const a = new Float64Array(n * n);
  const pivots = new Int32Array(n);
  const b = new Float64Array(n);
  const batch = 20000;
  const own = timeIt(() => {
    for (let i = 0; i < batch; i++) {
      a.set(base);
      luFactor(a, n, pivots);
      b.fill(1);
      luSolve(a, n, pivots, b);
    }
    return b[0];
  });
  const rhs = Matrix.ones(n, 1);
  const lib = timeIt(() => {
    let x = 0;
    for (let i = 0; i < batch; i++) x = new LuDecomposition(Matrix.from1DArray(n, n, base)).solve(rhs).get(0, 0);
    return x;
  });
  console.log(`  n = ${String(n).padStart(2)}: hand-written ${((own.ms * 1000) / batch).toFixed(3)} us, ml-matrix LuDecomposition ${((lib.ms * 1000) / batch).toFixed(3)} us (same answer: ${Math.abs(own.result - lib.result) < 1e-12})`);
}
