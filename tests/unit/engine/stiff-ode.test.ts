import { EigenvalueDecomposition, inverse, Matrix } from "ml-matrix";
import { Solver } from "odex";
import { describe, expect, it } from "vitest";
import { centralDifferenceJacobian, forwardDifferenceJacobian } from "../../../lib/engine/difference-jacobian";
import { EngineError } from "../../../lib/engine/errors";
import { RODAS4 } from "../../../lib/engine/rosenbrock-tableau";
import { integrateStiff, type OdeFunction } from "../../../lib/engine/stiff-ode";
import { rel } from "./helpers";
import { robertson, robertsonJacobian } from "../../helpers/stiff-problems";


// A -> B -> C (first order, k1, k2) with the side reaction 2A -> D (rate k3 C_A^2, two A per event).
function network(k1: number, k2: number, k3: number) {
  return (_t: number, c: ArrayLike<number>, d: number[] | Float64Array) => {
    const r1 = k1 * c[0];
    const r2 = k2 * c[1];
    const r3 = k3 * c[0] * c[0];
    d[0] = -r1 - 2 * r3;
    d[1] = r1 - r2;
    d[2] = r2;
    d[3] = r3;
  };
}

// y' = A y with eigenvalues -1 (eigenvector (1, 1)) and -1e4 (eigenvector (1, -1)); from y(0) = (1, 0)
// the solution is 0.5 e^{-t} (1, 1) + 0.5 e^{-1e4 t} (1, -1) (2x2 closed form, common practice).
const linear: OdeFunction = (_t, y, d) => {
  d[0] = -5000.5 * y[0] + 4999.5 * y[1];
  d[1] = 4999.5 * y[0] - 5000.5 * y[1];
};
const linearExact = (t: number) => [0.5 * Math.exp(-t) + 0.5 * Math.exp(-1e4 * t), 0.5 * Math.exp(-t) - 0.5 * Math.exp(-1e4 * t)];

function linearError(rtol: number, atol: number): number {
  let worst = 0;
  for (const t of [1e-4, 1e-3, 0.1, 1, 5]) {
    const r = integrateStiff(linear, [1, 0], 0, t, { rtol, atol, autonomous: true });
    const exact = linearExact(t);
    for (let i = 0; i < 2; i++) worst = Math.max(worst, Math.abs(r.y[i] - exact[i]));
  }
  return worst;
}

/** Fixed steps of size h (tolerances so loose that no step is rejected or resized). */
function fixedSteps(f: OdeFunction, y0: number[], t1: number, steps: number, autonomous: boolean) {
  const h = t1 / steps;
  return integrateStiff(f, y0, 0, t1, { rtol: 1e30, atol: 1e30, initialStep: h, maxStep: h, autonomous });
}

describe("RODAS4 coefficients", () => {
  // Back from the transformed form to the standard one: Gamma = (diag(1/gamma) - C)^{-1},
  // alpha_ij = (A Gamma)_ij, b = m Gamma (Hairer & Wanner II, Sect. IV.7, transformation (7.25), from memory).
  const s = RODAS4.stages;
  const square = (rows: readonly (readonly number[])[]) => Matrix.from1DArray(s, s, Array.from({ length: s * s }, (_, k) => rows[Math.floor(k / s)][k % s] ?? 0));
  const C = square(RODAS4.c);
  const gammaInverse = Matrix.eye(s, s).mul(1 / RODAS4.gamma).sub(C);
  const Gamma = inverse(gammaInverse);
  const alpha = square(RODAS4.a).mmul(Gamma);
  const beta = alpha.clone().add(Gamma); // alpha + Gamma, diagonal included
  const ones = Matrix.ones(s, 1);
  const weights = (m: readonly number[]) => new Matrix([Array.from(m)]).mmul(Gamma);
  const a1 = alpha.mmul(ones);
  const pow = (v: Matrix, p: number) => v.clone().apply(function (this: Matrix, i: number, j: number) { this.set(i, j, this.get(i, j) ** p); });
  const times = (u: Matrix, v: Matrix) => u.clone().apply(function (this: Matrix, i: number, j: number) { this.set(i, j, this.get(i, j) * v.get(i, j)); });
  const dot = (b: Matrix, v: Matrix) => b.mmul(v).get(0, 0);
  // The Rosenbrock order conditions written with the diagonal kept inside beta, where they read like
  // the Runge-Kutta ones (Hairer & Wanner II, Table IV.7.1, moved to this form; from memory).
  const conditions = (b: Matrix) => [
    dot(b, ones) - 1,
    dot(b, beta.mmul(ones)) - 1 / 2,
    dot(b, pow(a1, 2)) - 1 / 3,
    dot(b, beta.mmul(beta).mmul(ones)) - 1 / 6,
    dot(b, pow(a1, 3)) - 1 / 4,
    dot(b, times(a1, alpha.mmul(beta).mmul(ones))) - 1 / 8,
    dot(b, beta.mmul(pow(a1, 2))) - 1 / 12,
    dot(b, beta.mmul(beta).mmul(beta).mmul(ones)) - 1 / 24,
  ];

  it("satisfy the eight conditions of order 4, and the embedded solution those of order 3 but not 4", () => {
    for (const residual of conditions(weights(RODAS4.m))) expect(Math.abs(residual)).toBeLessThan(1e-13);
    const embedded = conditions(weights(RODAS4.mHat));
    for (const residual of embedded.slice(0, 4)) expect(Math.abs(residual)).toBeLessThan(1e-13);
    expect(Math.max(...embedded.slice(4).map(Math.abs))).toBeGreaterThan(1e-3);
  });

  it("have nodes equal to the row sums of alpha and d equal to the row sums of Gamma", () => {
    for (let i = 0; i < s; i++) {
      expect(Math.abs(a1.get(i, 0) - RODAS4.alpha[i])).toBeLessThan(1e-13);
      expect(Math.abs(Gamma.getRow(i).reduce((x, y) => x + y, 0) - RODAS4.d[i])).toBeLessThan(1e-13);
    }
  });

  it("are L-stable: the stability function vanishes at -infinity and stays below 1 on the left half-plane", () => {
    // R(z) = 1 + z b (I - z beta)^{-1} 1 (Hairer & Wanner II, Sect. IV.7, from memory).
    const b = weights(RODAS4.m);
    const R = (z: number) => 1 + z * dot(b, inverse(Matrix.eye(s, s).sub(beta.clone().mul(z))).mmul(ones));
    expect(Math.abs(R(-1e12))).toBeLessThan(1e-9);
    for (const z of [-0.1, -1, -10, -100, -1e4, -1e6]) expect(Math.abs(R(z))).toBeLessThan(1);
  });
});

describe("difference Jacobians", () => {
  // A <=> B with rate laws clamped at zero, plus 2B -> C: J = [[-k1, k2, 0], [k1, -k2 - 4 k3 B, 0], [0, 2 k3 B, 0]] (common practice).
  const k1 = 3;
  const k2 = 0.7;
  const k3 = 50;
  const f: OdeFunction = (_t, y, d) => {
    const a = Math.max(y[0], 0);
    const b = Math.max(y[1], 0);
    const r = k1 * a - k2 * b;
    d[0] = -r;
    d[1] = r - 2 * k3 * b * b;
    d[2] = k3 * b * b;
  };
  const exact = (b: number) => [-k1, k2, 0, k1, -k2 - 4 * k3 * b, 0, 0, 2 * k3 * b, 0];
  const differences = (y: number[], central: boolean) => {
    const yy = Float64Array.from(y);
    const f0 = new Float64Array(3);
    f(0, yy, f0);
    const J = new Float64Array(9);
    if (central) centralDifferenceJacobian(f, 0, yy, f0, J, new Float64Array(3), new Float64Array(3));
    else forwardDifferenceJacobian(f, 0, yy, f0, J, new Float64Array(3));
    expect(Array.from(yy)).toEqual(y);
    return Array.from(J);
  };

  it("are right at a species that is absent, where the rate law clamps at zero (probed on the positive side)", () => {
    // Forward differences carry an error of order sqrt(eps) times the rate terms over the increment; central ones eps^(2/3).
    for (const [central, tolerance] of [[true, 1e-7], [false, 1e-4]] as const) {
      const J = differences([2, 0, 0], central);
      exact(0).forEach((v, i) => expect(Math.abs(J[i] - v)).toBeLessThan(tolerance));
    }
  });

  it("central differences are exact to round-off for a rate quadratic in one concentration; forward ones are not", () => {
    const b = 1e-4;
    const central = differences([2, b, 0], true);
    const forward = differences([2, b, 0], false);
    const want = exact(b);
    // Forward: the truncation error k3 * increment (about 1e-6 relative here); central: round-off only.
    expect(Math.abs(central[7] - want[7]) / want[7]).toBeLessThan(1e-10);
    expect(Math.abs(forward[7] - want[7]) / want[7]).toBeGreaterThan(1e-7);
  });
});

describe("stiff integrator: order and accuracy", () => {
  it("converges with order 4 on a non-autonomous problem, y' = -2 t y^2, y = 1 / (1 + t^2) (closed form)", () => {
    const f: OdeFunction = (t, y, d) => {
      d[0] = -2 * t * y[0] * y[0];
    };
    const errors = [20, 40, 80].map((n) => Math.abs(fixedSteps(f, [1], 2, n, false).y[0] - 1 / 5));
    const orders = [Math.log2(errors[0] / errors[1]), Math.log2(errors[1] / errors[2])];
    console.log(`order on y' = -2 t y^2: ${orders.map((o) => o.toFixed(2)).join(", ")}`);
    expect(orders[1]).toBeGreaterThan(3.6);
    expect(orders[1]).toBeLessThan(4.6);
  });

  it("converges with order 4 on A -> B -> C (closed form, common practice)", () => {
    const f = network(1, 0.5, 0) as OdeFunction;
    const exactB = (t: number) => (2 * 1) / (0.5 - 1) * (Math.exp(-1 * t) - Math.exp(-0.5 * t));
    const errors = [10, 20, 40].map((n) => Math.abs(fixedSteps(f, [2, 0, 0, 0], 3, n, true).y[1] - exactB(3)));
    const order = Math.log2(errors[1] / errors[2]);
    expect(order).toBeGreaterThan(3.6);
    expect(order).toBeLessThan(4.6);
  });

  it("stays accurate on a very stiff non-autonomous problem, y' = -1e6 (y - sin t) + cos t, y = sin t (closed form)", () => {
    // Stiff accuracy: the error does not grow with the stiffness (common practice for L-stable, stiffly accurate methods).
    const f: OdeFunction = (t, y, d) => {
      d[0] = -1e6 * (y[0] - Math.sin(t)) + Math.cos(t);
    };
    const r = integrateStiff(f, [0], 0, 10, { rtol: 1e-8, atol: 1e-10 });
    expect(r.status).toBe("ok");
    expect(Math.abs(r.y[0] - Math.sin(10))).toBeLessThan(1e-7);
  });

  it("solves a stiff linear system (eigenvalues -1 and -1e4) within the tolerance (2x2 closed form, common practice)", () => {
    expect(linearError(1e-8, 1e-12)).toBeLessThan(1e-7);
  });

  it("follows a fast equilibrium A <=> B (1e4, 5e3 per s) feeding a slow B -> C (1e-3 per s): matrix exponential by ml-matrix's eigen-decomposition", () => {
    // A linear first-order network y' = K y has y(t) = V exp(Lambda t) V^{-1} y0 (common practice); the
    // eigen-decomposition comes from ml-matrix, independently of the integrator.
    const K = new Matrix([
      [-1e4, 5e3, 0],
      [1e4, -5e3 - 1e-3, 0],
      [0, 1e-3, 0],
    ]);
    const eig = new EigenvalueDecomposition(K);
    const V = eig.eigenvectorMatrix;
    const c = inverse(V).mmul(Matrix.columnVector([3, 0, 0]));
    const exact = (t: number) => V.mmul(Matrix.columnVector(eig.realEigenvalues.map((l, i) => Math.exp(l * t) * c.get(i, 0)))).to1DArray();
    const f: OdeFunction = (_t, y, d) => {
      for (let i = 0; i < 3; i++) d[i] = K.get(i, 0) * y[0] + K.get(i, 1) * y[1] + K.get(i, 2) * y[2];
    };
    const times = [1e-5, 1e-4, 1e-3, 1, 100, 1000, 5000];
    const steps: Record<string, number> = {};
    for (const differences of ["central", "forward"] as const) {
      const r = integrateStiff(f, [3, 0, 0], 0, 5000, { rtol: 1e-8, atol: 1e-12, autonomous: true, outputTimes: times, differences });
      for (const o of r.outputs) {
        const e = exact(o.t);
        for (let i = 0; i < 3; i++) expect(Math.abs(o.y[i] - e[i])).toBeLessThan(1e-7 * Math.max(Math.abs(e[i]), 1e-3));
      }
      steps[differences] = r.steps;
    }
    // The fast equilibrium costs steps only while it settles (a non-stiff method would need about
    // 5000 x 1.5e4 / 3 steps), provided the Jacobian resolves the slow rate hidden in the fast block:
    // central differences do; forward ones stay accurate but need many more steps.
    expect(steps.central).toBeLessThan(1000);
    console.log(`fast equilibrium network to 5000: ${steps.central} steps (central differences), ${steps.forward} (forward)`);
  });

  it("controls the error: tightening rtol from 1e-4 to 1e-8 shrinks the achieved error at least 100-fold", () => {
    const loose = linearError(1e-4, 1e-8);
    const tight = linearError(1e-8, 1e-12);
    console.log(`linear stiff system, largest error: rtol 1e-4 ${loose.toExponential(2)}, rtol 1e-8 ${tight.toExponential(2)}`);
    expect(tight * 100).toBeLessThan(loose);
  });
});

describe("stiff integrator: published stiff test problems", () => {
  it("Robertson's problem at t = 40 with a finite-difference Jacobian matches the published reference", () => {
    const r = integrateStiff(robertson, [1, 0, 0], 0, 40, { rtol: 1e-8, atol: 1e-12, autonomous: true });
    // Reference values at t = 40 (Hairer & Wanner, Solving ODE II, Sect. IV.10; from memory).
    expect(Math.abs(r.y[0] - 0.7158270687193267)).toBeLessThan(1e-8);
    expect(rel(r.y[1], 0.9185534764557338e-5)).toBeLessThan(1e-6);
    expect(Math.abs(r.y[2] - 0.2841637457452089)).toBeLessThan(1e-8);
    // Mass is conserved: y1 + y2 + y3 = 1 (common practice; a Rosenbrock method keeps linear invariants).
    expect(Math.abs(r.y[0] + r.y[1] + r.y[2] - 1)).toBeLessThan(1e-12);
    console.log(`Robertson to 40 (finite-difference Jacobian): ${r.steps} steps, ${r.rejected} rejected, ${r.functionEvaluations} evaluations`);
  });

  it("Robertson's problem gives the same answer and work whatever the concentration unit (difference Jacobians)", () => {
    // Scaling y by S and the second-order rate constants by 1/S scales the solution by S (common practice).
    for (const differences of ["central", "forward"] as const) {
      const base = integrateStiff(robertson, [1, 0, 0], 0, 40, { rtol: 1e-8, atol: 1e-12, autonomous: true, differences });
      for (const S of [1e-3, 1e3]) {
        const scaled: OdeFunction = (_t, y, d) => {
          d[0] = -0.04 * y[0] + (1e4 / S) * y[1] * y[2];
          d[2] = (3e7 / S) * y[1] * y[1];
          d[1] = -d[0] - d[2];
        };
        const r = integrateStiff(scaled, [S, 0, 0], 0, 40, { rtol: 1e-8, atol: 1e-12 * S, autonomous: true, differences });
        // Reference at t = 40 (Hairer & Wanner II, Sect. IV.10; from memory).
        expect(Math.abs(r.y[0] / S - 0.7158270687193267)).toBeLessThan(1e-8);
        expect(rel(r.y[1] / S, 0.9185534764557338e-5)).toBeLessThan(1e-6);
        expect(Math.abs(r.steps - base.steps)).toBeLessThanOrEqual(2);
      }
    }
  });

  it.each([
    ["the analytic Jacobian", { jacobian: robertsonJacobian }],
    ["central differences", { differences: "central" as const }],
  ])("Robertson's problem to t = 1e11 with %s matches the published reference in a bounded number of steps", (label, jacobian) => {
    const r = integrateStiff(robertson, [1, 0, 0], 0, 1e11, { rtol: 1e-8, atol: 1e-12, autonomous: true, ...jacobian });
    // Reference at t = 1e11 from the test set for IVP solvers (Bari/CWI), problem ROBER (from memory).
    expect(Math.abs(r.y[0] - 0.2083340149701255e-7)).toBeLessThan(1e-12);
    expect(rel(r.y[1], 0.8333360770334713e-13)).toBeLessThan(1e-4);
    expect(Math.abs(r.y[2] - 0.999999979166505)).toBeLessThan(1e-10);
    expect(Math.abs(r.y[0] + r.y[1] + r.y[2] - 1)).toBeLessThan(1e-12);
    // An explicit method would need of the order of 1e11 / 1e-3 steps here; a stiff one a few thousand at most.
    expect(r.steps).toBeLessThan(5000);
    console.log(`Robertson to 1e11 (${label}): ${r.steps} steps, ${r.rejected} rejected, ${r.functionEvaluations} evaluations`);
  });

  it("Van der Pol in the stiff scaling (epsilon = 1e-6) to t = 2 matches the published reference", () => {
    // y1' = y2, y2' = ((1 - y1^2) y2 - y1) / epsilon, y(0) = (2, 0): problem VDPOL of the test set for IVP
    // solvers (Bari/CWI) and Hairer & Wanner II, Sect. IV.10; reference values from memory.
    const eps = 1e-6;
    const f: OdeFunction = (_t, y, d) => {
      d[0] = y[1];
      d[1] = ((1 - y[0] * y[0]) * y[1] - y[0]) / eps;
    };
    const times = Array.from({ length: 41 }, (_, i) => i * 0.05);
    const r = integrateStiff(f, [2, 0], 0, 2, { rtol: 1e-8, atol: 1e-8, autonomous: true, outputTimes: times });
    expect(r.status).toBe("ok");
    expect(Math.abs(r.y[0] - 1.706167732170483)).toBeLessThan(1e-6);
    expect(Math.abs(r.y[1] + 0.8928097010247975)).toBeLessThan(1e-6);
    // On and near the limit cycle |y1| stays at about 2 or less (from memory).
    for (const o of r.outputs) expect(Math.abs(o.y[0])).toBeLessThanOrEqual(2.1);
    console.log(`Van der Pol (epsilon 1e-6) to 2: ${r.steps} steps, ${r.rejected} rejected`);
  });
});

describe("stiff integrator against odex and closed forms on a non-stiff network", () => {
  const k = { k1: 1, k2: 0.5, k3: 0.2 };
  const points = [0.25, 0.5, 1, 2, 5, 10];

  it("A -> B -> C with 2A -> D agrees with Hairer's ODEX (odex package) to 1e-7 at several points", () => {
    const f = network(k.k1, k.k2, k.k3);
    const solver = new Solver(4);
    solver.absoluteTolerance = 1e-13;
    solver.relativeTolerance = 1e-13;
    solver.maxSteps = 100000;
    for (const t of points) {
      const reference = solver.solve((x: number, y: number[]) => {
        const d = [0, 0, 0, 0];
        f(x, y, d);
        return d;
      }, 0, [2, 0, 0, 0], t).y;
      const r = integrateStiff(f as OdeFunction, [2, 0, 0, 0], 0, t, { rtol: 1e-10, atol: 1e-13, autonomous: true });
      for (let i = 0; i < 4; i++) expect(rel(r.y[i], reference[i])).toBeLessThan(1e-7);
    }
  });

  it("A -> B -> C matches C_B = C_A0 k1 / (k2 - k1) (e^{-k1 t} - e^{-k2 t}) at output points (closed form, common practice)", () => {
    const f = network(k.k1, k.k2, 0) as OdeFunction;
    const r = integrateStiff(f, [2, 0, 0, 0], 0, 10, { rtol: 1e-10, atol: 1e-13, autonomous: true, outputTimes: points });
    expect(r.outputs.map((o) => o.t)).toEqual(points);
    for (const o of r.outputs) {
      const exactA = 2 * Math.exp(-k.k1 * o.t);
      const exactB = ((2 * k.k1) / (k.k2 - k.k1)) * (Math.exp(-k.k1 * o.t) - Math.exp(-k.k2 * o.t));
      expect(rel(o.y[0], exactA)).toBeLessThan(1e-7);
      expect(rel(o.y[1], exactB)).toBeLessThan(1e-7);
    }
  });

  it("stops where a predicate first holds: half of A is gone at t = ln 2 / k1 (closed form, common practice)", () => {
    const f = network(k.k1, k.k2, 0) as OdeFunction;
    const r = integrateStiff(f, [2, 0, 0, 0], 0, 10, { rtol: 1e-10, atol: 1e-13, autonomous: true, stopWhen: (_t, y) => y[0] <= 1 });
    expect(r.status).toBe("stopped");
    expect(rel(r.t, Math.LN2 / k.k1)).toBeLessThan(1e-7);
    expect(rel(r.y[0], 1)).toBeLessThan(1e-7);
  });
});

describe("stiff integrator failures", () => {
  it("refuses an interval that runs backwards or a negative tolerance, in words", () => {
    const f: OdeFunction = (_t, y, d) => {
      d[0] = -y[0];
    };
    expect(() => integrateStiff(f, [1], 2, 1, { rtol: 1e-6, atol: 1e-9, variable: "V" })).toThrow("the integration needs an end point after its start (V from 2 to 1)");
    expect(() => integrateStiff(f, [1], 2, 1, { rtol: 1e-6, atol: 1e-9 })).toThrow(expect.objectContaining({ code: "invalid-spec" }));
    expect(() => integrateStiff(f, [1], 0, 1, { rtol: 1e-6, atol: [-1] })).toThrow("the integration needs absolute tolerances above zero");
    expect(() => integrateStiff(f, [1], 0, 1, { rtol: 1e-6, atol: 1e-9, outputTimes: [0.5, 0.2] })).toThrow("the integration needs its output points in ascending order between 0 and 1");
  });

  it("accepts one absolute tolerance per component: a trace species held to 1e-20 keeps its digits (closed form, common practice)", () => {
    // A -> B -> C with k1 = 1e-12: B stays near C_A0 k1 t, far below any shared absolute tolerance.
    const f = network(1e-12, 1, 0) as OdeFunction;
    const exactB = (t: number) => ((2 * 1e-12) / (1 - 1e-12)) * (Math.exp(-1e-12 * t) - Math.exp(-t));
    const shared = integrateStiff(f, [2, 0, 0, 0], 0, 5, { rtol: 1e-8, atol: 1e-10, autonomous: true });
    const perSpecies = integrateStiff(f, [2, 0, 0, 0], 0, 5, { rtol: 1e-8, atol: [1e-10, 1e-20, 1e-10, 1e-10], autonomous: true });
    expect(rel(perSpecies.y[1], exactB(5))).toBeLessThan(1e-6);
    // With the shared 1e-10 the trace species is below the noise floor and the solver rightly spends almost nothing on it.
    expect(Math.abs(shared.y[1] - exactB(5))).toBeLessThan(1e-10);
    expect(perSpecies.steps).toBeGreaterThan(5 * shared.steps);
  });

  it("gives up with an engine error in words when the step limit is reached", () => {
    const run = () => integrateStiff(robertson, [1, 0, 0], 0, 1e5, { rtol: 1e-8, atol: 1e-12, autonomous: true, maxSteps: 10, subject: "the species balances along the PFR", variable: "V", path: "reactions" });
    expect(run).toThrow(EngineError);
    expect(run).toThrow(/^the species balances along the PFR did not reach the end within 10 steps \(stopped at V = [0-9.e-]+ of 100000\); the reactions may be too fast/);
    try {
      run();
    } catch (e) {
      expect((e as EngineError).code).toBe("infeasible");
      expect((e as EngineError).path).toBe("reactions");
    }
  });

  it("gives up with an engine error in words when the solution blows up (y' = y^2 from 1 is infinite at t = 1)", () => {
    const f: OdeFunction = (_t, y, d) => {
      d[0] = y[0] * y[0];
    };
    expect(() => integrateStiff(f, [1], 0, 2, { rtol: 1e-6, atol: 1e-9, autonomous: true })).toThrow(
      /^the integration cannot continue at t = (0\.99\d*|1): the step became too small to resolve/,
    );
  });
});
