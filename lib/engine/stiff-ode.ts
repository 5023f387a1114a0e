import { centralDifferenceJacobian, forwardDifferenceJacobian } from "./difference-jacobian";
import { EngineError } from "./errors";
import { RODAS4, type RosenbrockTableau } from "./rosenbrock-tableau";
import { hermite, locateFirstTrue, pushOutputs } from "./ode-dense-output";
import { initialStep } from "./ode-initial-step";
import { luFactor, luSolve } from "./small-lu";

/**
 * An integrator for stiff systems of ordinary differential equations y' = f(t, y): the Rosenbrock-Wanner
 * method RODAS4 (L-stable, order 4, embedded order 3) with error-per-step control, a finite-difference
 * Jacobian when none is given (second-order differences unless forward ones are asked for), cubic
 * Hermite dense output for requested output points, and an optional stopping predicate located by
 * bisection on that dense output. A Rosenbrock method needs a good Jacobian at every step (it does
 * not iterate to correct a poor one): an analytic Jacobian is best, and cheapest.
 *
 * Non-negativity is NOT enforced: a concentration may dip slightly below zero within the tolerances.
 * Rate laws that would misbehave there (fractional orders, logarithms) must see max(C, 0) — the
 * caller's job, because clamping inside the solver would break its error estimate.
 */

/** Right-hand side: writes f(t, y) into dydt. Must not keep references to y or dydt. */
export type OdeFunction = (t: number, y: Float64Array, dydt: Float64Array) => void;

export interface StiffOptions {
  /** Relative tolerance of the local error per step. */
  rtol: number;
  /** Absolute tolerance (above zero): one number or one per component. */
  atol: number | ArrayLike<number>;
  /** Analytic Jacobian: fills J[i][j] = d f_i / d y_j (J starts as zeros). Finite differences otherwise. */
  jacobian?: (t: number, y: Float64Array, J: number[][]) => void;
  /**
   * Finite differences for the Jacobian when none is given: "central" (default; 2 evaluations per
   * component, accurate enough for fast equilibria) or "forward" (1 evaluation, cheaper on mild problems).
   */
  differences?: "central" | "forward";
  /** When true, f does not depend on t explicitly, which saves one evaluation per step. */
  autonomous?: boolean;
  /** Attempted steps (accepted and rejected) before giving up; default 100000. */
  maxSteps?: number;
  /** First trial step; estimated from f when omitted. */
  initialStep?: number;
  /** Largest step; default the whole interval. */
  maxStep?: number;
  /** Points (ascending, within [t0, t1]) where the solution is wanted, from the dense output. */
  outputTimes?: readonly number[];
  /**
   * Largest step as a fraction of the distance from the start, never below `floor`: keeps every step short
   * against where it lies, for a caller that reads values between steps off the cubic Hermite dense output.
   */
  maxStepRelative?: { fraction: number; floor: number };
  /** Called with the start and with every accepted point (t, y, f(t, y)); the arrays are reused afterwards: copy them. */
  onStep?: (t: number, y: Float64Array, f: Float64Array) => void;
  /** Stop at the first point where this becomes true (located by bisection on the dense output). */
  stopWhen?: (t: number, y: Float64Array) => boolean;
  /** How the integration is named in error messages, e.g. "the species balances along the PFR". */
  subject?: string;
  /** Name of the independent variable in error messages, e.g. "V"; default "t". */
  variable?: string;
  /** Dotted path of the field an error is reported against. */
  path?: string;
}

export interface StiffResult {
  /** Where the integration ended: t1, or the located stopping point. */
  t: number;
  y: Float64Array;
  /** "ok": reached t1; "stopped": stopWhen became true first. */
  status: "ok" | "stopped";
  /** Attempted steps, rejected ones included. */
  steps: number;
  accepted: number;
  rejected: number;
  jacobianEvaluations: number;
  /** Evaluations of f, including those spent on finite-difference Jacobians. */
  functionEvaluations: number;
  luDecompositions: number;
  /** The solution at outputTimes (those before a stopping point). */
  outputs: { t: number; y: Float64Array }[];
}

const EPS = Number.EPSILON;
// Step-size controller constants as in Hairer & Wanner's codes: safety factor, largest shrink and
// growth per step. The growth cap of 6 lets the step recover quickly after a fast transient.
const SAFETY = 0.9;
const MAX_SHRINK = 5;
const MAX_GROW = 6;

function fmt(x: number): string {
  return Number(x.toPrecision(4)).toString();
}

/** Integrates y' = f(t, y) from t0 to t1 (t1 > t0) with RODAS4. Throws EngineError when it cannot. */
export function integrateStiff(f: OdeFunction, y0: ArrayLike<number>, t0: number, t1: number, options: StiffOptions): StiffResult {
  const tab: RosenbrockTableau = RODAS4;
  const n = y0.length;
  const path = options.path ?? "";
  const subject = options.subject ?? "the integration";
  const variable = options.variable ?? "t";
  // A request the solver cannot take is "invalid-spec"; a problem it could not integrate is "infeasible".
  const refuse = (message: string): never => {
    throw new EngineError("invalid-spec", `${subject} ${message}`, path);
  };
  const fail = (message: string): never => {
    throw new EngineError("infeasible", `${subject} ${message}`, path);
  };
  if (!(t1 >= t0) || !Number.isFinite(t0) || !Number.isFinite(t1)) refuse(`needs an end point after its start (${variable} from ${fmt(t0)} to ${fmt(t1)})`);
  if (n === 0) refuse("needs at least one unknown");
  if (!(options.rtol > 0)) refuse("needs a relative tolerance above zero");
  const atol = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    atol[i] = typeof options.atol === "number" ? options.atol : options.atol[i];
    // Zero would make the error scale vanish for a species that is absent at both ends of a step.
    if (!(atol[i] > 0)) refuse("needs absolute tolerances above zero");
  }
  const rtol = options.rtol;
  const maxSteps = options.maxSteps ?? 100000;
  const hmax = Math.min(options.maxStep ?? Infinity, t1 - t0);
  const outputTimes = options.outputTimes ?? [];
  for (let i = 0; i < outputTimes.length; i++) {
    const ok = outputTimes[i] >= t0 && outputTimes[i] <= t1 && (i === 0 || outputTimes[i] >= outputTimes[i - 1]);
    if (!ok) refuse(`needs its output points in ascending order between ${fmt(t0)} and ${fmt(t1)}`);
  }

  let t = t0;
  let y: Float64Array = Float64Array.from(y0);
  const stats = { steps: 0, accepted: 0, rejected: 0, jacobianEvaluations: 0, functionEvaluations: 0, luDecompositions: 0 };
  const evalF = (tt: number, yy: Float64Array, out: Float64Array) => {
    stats.functionEvaluations++;
    f(tt, yy, out);
  };
  const outputs: { t: number; y: Float64Array }[] = [];
  let nextOutput = 0;
  const finish = (status: "ok" | "stopped"): StiffResult => ({ t, y, status, ...stats, outputs });

  let f0 = new Float64Array(n);
  evalF(t, y, f0);
  if (!allFinite(f0)) fail(`cannot start: the rates are not finite at ${variable} = ${fmt(t0)}`);
  while (nextOutput < outputTimes.length && outputTimes[nextOutput] === t0) outputs.push({ t: outputTimes[nextOutput++], y: Float64Array.from(y) });
  options.onStep?.(t, y, f0);
  if (options.stopWhen?.(t, y)) return finish("stopped");
  if (t1 === t0) return finish("ok");

  // Work arrays, allocated once: the solver is called inside sweeps, many times per candidate train.
  const J = new Float64Array(n * n);
  const jRows: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const E = new Float64Array(n * n);
  const pivots = new Int32Array(n);
  const ft = new Float64Array(n);
  const k: Float64Array[] = Array.from({ length: tab.stages }, () => new Float64Array(n));
  const arg = new Float64Array(n);
  const fs = new Float64Array(n);
  let yNew: Float64Array = new Float64Array(n);
  let f1 = new Float64Array(n);
  const scratch = new Float64Array(n);
  const scratch2 = new Float64Array(n);

  const jacobianAt = () => {
    stats.jacobianEvaluations++;
    if (options.jacobian) {
      for (const row of jRows) row.fill(0);
      options.jacobian(t, y, jRows);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) J[i * n + j] = jRows[i][j];
    } else {
      if (options.differences === "forward") forwardDifferenceJacobian(evalF, t, y, f0, J, scratch);
      else centralDifferenceJacobian(evalF, t, y, f0, J, scratch, scratch2);
    }
    if (options.autonomous) ft.fill(0);
    else {
      // The same rule for the time derivative, with the length of the interval as the scale.
      const span = t1 - t0;
      const delta = t + Math.sqrt(EPS * span * Math.max(1e-5 * span, Math.abs(t))) - t;
      evalF(t + delta, y, scratch);
      for (let i = 0; i < n; i++) ft[i] = (scratch[i] - f0[i]) / delta;
    }
  };

  let h = Math.min(options.initialStep ?? initialStep(evalF, t, y, f0, atol, rtol, tab.order), hmax);
  let jacobianCurrent = false;
  let reject = false;
  let hAccepted = 0;
  let errAccepted = 0;

  for (;;) {
    if (stats.steps >= maxSteps) fail(`did not reach the end within ${maxSteps} steps (stopped at ${variable} = ${fmt(t)} of ${fmt(t1)}); the reactions may be too fast for the interval, or a rate expression may jump`);
    if (0.1 * Math.abs(h) <= Math.abs(t) * EPS || !(h > 0)) fail(`cannot continue at ${variable} = ${fmt(t)}: the step became too small to resolve (a rate may be discontinuous or the solution may grow without bound)`);
    if (options.maxStepRelative) h = Math.min(h, options.maxStepRelative.fraction * Math.max(t - t0, options.maxStepRelative.floor));
    let last = false;
    if (t + 1.0001 * h >= t1) {
      h = t1 - t;
      last = true;
    }
    if (!jacobianCurrent) {
      jacobianAt();
      jacobianCurrent = true;
    }
    stats.steps++;

    const fac = 1 / (h * tab.gamma);
    for (let i = 0; i < n * n; i++) E[i] = -J[i];
    for (let i = 0; i < n; i++) E[i * n + i] += fac;
    stats.luDecompositions++;
    let err = Infinity;
    if (luFactor(E, n, pivots)) {
      for (let s = 0; s < tab.stages; s++) {
        let fStage: Float64Array = f0;
        if (s > 0) {
          arg.set(y);
          for (let j = 0; j < s; j++) axpy(tab.a[s][j], k[j], arg);
          evalF(t + tab.alpha[s] * h, arg, fs);
          fStage = fs;
        }
        const ks = k[s];
        for (let i = 0; i < n; i++) ks[i] = fStage[i] + h * tab.d[s] * ft[i];
        for (let j = 0; j < s; j++) axpy(tab.c[s][j] / h, k[j], ks);
        luSolve(E, n, pivots, ks);
      }
      yNew.set(y);
      err = 0;
      for (let i = 0; i < n; i++) {
        let step = 0;
        let diff = 0;
        for (let s = 0; s < tab.stages; s++) {
          step += tab.m[s] * k[s][i];
          diff += (tab.m[s] - tab.mHat[s]) * k[s][i];
        }
        yNew[i] += step;
        const sk = atol[i] + rtol * Math.max(Math.abs(y[i]), Math.abs(yNew[i]));
        err += (diff / sk) ** 2;
      }
      err = Math.sqrt(err / n);
    }
    const tNew = last ? t1 : t + h;
    if (err <= 1) {
      evalF(tNew, yNew, f1);
      // A step that lands where the rates are not finite (e.g. a concentration overshooting into a
      // fractional power) is rejected like an inaccurate one.
      if (!allFinite(f1)) err = Infinity;
    }
    if (!Number.isFinite(err)) {
      // Overflow or a singular iteration matrix: the step was far too long, not a verdict on the problem.
      h /= MAX_SHRINK;
      reject = true;
      stats.rejected++;
      continue;
    }

    let factor = Math.max(1 / MAX_GROW, Math.min(MAX_SHRINK, err ** (1 / tab.order) / SAFETY));
    if (err <= 1) {
      // Gustafsson's predictive controller: uses the previous accepted step too, which damps the
      // oscillation of step sizes typical of stiff problems.
      if (stats.accepted > 0) {
        const gus = Math.max(1 / MAX_GROW, Math.min(MAX_SHRINK, ((hAccepted / h) * (err * err / errAccepted) ** (1 / tab.order)) / SAFETY));
        factor = Math.max(factor, gus);
      }
      hAccepted = h;
      errAccepted = Math.max(1e-2, err);
      stats.accepted++;

      const tOld = t;
      const yOld = y;
      const fOld = f0;
      const dense = (tt: number, out: Float64Array) => hermite(tOld, tNew - tOld, yOld, yNew, fOld, f1, tt, out);

      if (options.stopWhen?.(tNew, yNew)) {
        const stop = locateFirstTrue(options.stopWhen, tOld, tNew, yNew, dense);
        nextOutput = pushOutputs(outputs, outputTimes, nextOutput, stop.t, dense, n);
        t = stop.t;
        y = stop.y;
        return finish("stopped");
      }
      nextOutput = pushOutputs(outputs, outputTimes, nextOutput, tNew, dense, n);

      // Swap buffers instead of copying: y and f0 become the new point, the old arrays are reused.
      y = yNew;
      yNew = yOld;
      f0 = f1;
      f1 = fOld;
      t = tNew;
      jacobianCurrent = false;
      options.onStep?.(t, y, f0);
      if (last) return finish("ok");
      let hNew = Math.min(h / factor, hmax);
      if (reject) hNew = Math.min(hNew, h);
      reject = false;
      h = hNew;
    } else {
      reject = true;
      stats.rejected++;
      h /= factor;
    }
  }
}

function axpy(a: number, x: Float64Array, y: Float64Array) {
  if (a === 0) return;
  for (let i = 0; i < x.length; i++) y[i] += a * x[i];
}

function allFinite(v: Float64Array): boolean {
  for (let i = 0; i < v.length; i++) if (!Number.isFinite(v[i])) return false;
  return true;
}
