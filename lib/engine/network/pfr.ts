import { ensure, EngineError } from "../errors";
import { integrateStiff } from "../stiff-ode";
import { makeKinetics, type Kinetics } from "./kinetics";
import type { ResolvedNetwork } from "./resolve";
import { makeHeldRates } from "./run-out";
import type { PfrResult, ProfilePoint } from "./types";

/**
 * A plug-flow tube: dF/dV = R(C(F), T) integrated along the volume by the stiff integrator (RODAS4
 * with the analytic Jacobian of power laws), isothermal at T.
 *
 * A reaction whose rate does not vanish as something it consumes runs out (a zero order, or an
 * expression) is followed to the point where that species reaches zero, located on the integrator's
 * dense output. From there the species is held at exactly zero and those reactions run at the fraction
 * of their rate that its formation by the other reactions can feed (run-out.ts), until formation
 * outgrows them again, which releases it. Segments with a held species use difference Jacobians.
 */
export interface PfrOptions {
  /** Volumes (ascending, within [0, V]) where the flows are wanted, m3. */
  outputVolumes?: readonly number[];
  /** Stop where this species' flow is largest (its production rate turns negative), when inside the tube. */
  stopAtMaxOf?: string;
  /** Relative tolerance per step. @default 1e-9 */
  rtol?: number;
  /** Absolute tolerance as a fraction of the total molar flow in. @default 1e-13 */
  atolFraction?: number;
  /** Field an error is reported against. @default "" */
  path?: string;
}

export function kineticsOf(net: ResolvedNetwork | Kinetics): Kinetics {
  return "weight" in net ? net : makeKinetics(net);
}

/** Flows (mol/s) at the outlet of a tube of volume V (m3) at temperature T (K), fed with flows Fin (mol/s). */
export function pfrOutlet(network: ResolvedNetwork | Kinetics, Fin: ArrayLike<number>, T: number, V: number, options: PfrOptions = {}): PfrResult {
  const kin = kineticsOf(network);
  const net = kin.net;
  const n = net.nSpecies;
  const path = options.path ?? "";
  ensure(V >= 0 && Number.isFinite(V), "a tube volume must be zero or more", path);
  ensure(T > 0, "a stage temperature must be above absolute zero", path);
  kin.weight.fill(1);
  let F: Float64Array = Float64Array.from(Fin);
  let FTin = 0;
  for (let i = 0; i < n; i++) FTin += F[i];
  const atol = (options.atolFraction ?? 1e-13) * Math.max(FTin, Number.MIN_VALUE);
  const rtol = options.rtol ?? 1e-9;
  const R = new Float64Array(n);
  const outputs = options.outputVolumes ?? [];
  const profile: ProfilePoint[] = [];
  let nextOut = 0;
  const product = options.stopAtMaxOf === undefined ? -1 : (net.index.get(options.stopAtMaxOf) ?? -2);
  if (product === -2) throw new EngineError("invalid-spec", `species "${options.stopAtMaxOf}" is not in the feed`, path);
  const held = makeHeldRates(kin, T);

  const record = (v: number, y: Float64Array) => profile.push({ volume: v, residenceTime: v / net.v0, flows: Float64Array.from(y) });
  const growing = (y: Float64Array) => {
    held.production(y, R);
    return R[product] >= 0;
  };

  let v = 0;
  held.holdRunOut(F);
  if (product >= 0 && !growing(F)) {
    while (nextOut < outputs.length && outputs[nextOut] === 0) record(0, F);
    return { volume: 0, flows: F, status: "stopped", profile };
  }
  // Each pass runs to the end of the tube, to where a watched species runs out, or to where a held one
  // is formed faster than it is consumed; each such point changes which species are held.
  for (let pass = 0; pass <= 4 * n + 4; pass++) {
    const watched = held.watched(F);
    const holding = held.count() > 0;
    const stopWhen = (_t: number, y: Float64Array) => {
      for (const i of watched) if (y[i] < 0) return true;
      if (holding && held.releaseDue(y)) return true;
      return product >= 0 && !growing(y);
    };
    const res = integrateStiff((_t, y, dydt) => held.production(y, dydt), F, v, V, {
      rtol,
      atol,
      autonomous: true,
      jacobian: holding ? undefined : (_t, y, J) => jacobianRows(kin, y, T, J),
      outputTimes: outputs.slice(nextOut),
      stopWhen: watched.length > 0 || holding || product >= 0 ? stopWhen : undefined,
      subject: "the species balances along the tube",
      variable: "V",
      path,
    });
    for (const o of res.outputs) record(o.t, o.y);
    nextOut += res.outputs.length;
    F = res.y;
    v = res.t;
    if (res.status === "ok") break;
    const ranOut = watched.filter((i) => F[i] < 0);
    const released = holding && held.releaseDue(F);
    if (ranOut.length === 0 && !released) {
      // The product's flow stopped growing first: its largest value along the tube is here.
      return { volume: v, flows: F, status: v < V ? "stopped" : "ok", profile };
    }
    for (const i of ranOut) F[i] = 0;
    if (released) held.release(F);
    held.holdRunOut(F);
    if (v >= V) break;
  }
  kin.weight.fill(1);
  if (v < V) throw new EngineError("infeasible", `the species balances along the tube could not be followed past V = ${Number(v.toPrecision(4))} m3: species kept running out and forming again`, path);
  while (nextOut < outputs.length) record(outputs[nextOut++], F);
  return { volume: V, flows: F, status: "ok", profile };
}

/** The outlet of a tube given by its residence time tau = V / v0 (s, measured at the feed flow). */
export function pfrOutletByResidenceTime(network: ResolvedNetwork | Kinetics, Fin: ArrayLike<number>, T: number, tau: number, options: PfrOptions = {}): PfrResult {
  const net = "weight" in network ? network.net : network;
  return pfrOutlet(network, Fin, T, tau * net.v0, options);
}

export function jacobianRows(kin: Kinetics, y: Float64Array, T: number, J: number[][]): void {
  const n = kin.net.nSpecies;
  const flat = scratchFor(n);
  kin.jacobian(y, T, flat);
  for (let i = 0; i < n; i++) {
    const row = J[i];
    for (let k = 0; k < n; k++) row[k] = flat[i * n + k];
  }
}

const scratch = new Map<number, Float64Array>();
function scratchFor(n: number): Float64Array {
  let s = scratch.get(n);
  if (!s) scratch.set(n, (s = new Float64Array(n * n)));
  return s;
}
