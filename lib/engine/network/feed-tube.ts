import { EngineError } from "../errors";
import { hermite } from "../ode-dense-output";
import { integrateStiff } from "../stiff-ode";
import type { Kinetics } from "./kinetics";
import { jacobianRows } from "./pfr";

/**
 * A tube fed with the feed itself at the feed's temperature is one trajectory whatever its length: the
 * search reads its outlet at any residence time off one fine integration instead of integrating again
 * for every trial length (a train whose first stage is a tube, and the single-tube reference).
 *
 * The trajectory is integrated once with RODAS4 at a relative tolerance of 1e-10, every step kept no
 * longer than STEP_FRACTION of its distance from the inlet (and STEP_FLOOR_FRACTION of the search's
 * smallest time near it), and read between steps by cubic Hermite interpolation, the integrator's own
 * dense output. For a solution that changes on the scale of its distance from the inlet, the
 * interpolation error is about STEP_FRACTION^4 / 384 = 5e-11 of the flow; tests/unit/engine/network/
 * feed-tube.test.ts compares it with direct integrations at 1e-10. Beyond the integrated length, or for
 * networks where a species can run out under a reaction that keeps going (the tube then switches which
 * species it holds, pfr.ts), the search integrates each tube itself.
 */
export interface FeedTube {
  /** Outlet flows (mol/s) after residence time tau (s), or null beyond the integrated length. */
  at(tau: number): Float64Array | null;
  /** Residence time integrated to, s. */
  length: number;
}

const STEP_FRACTION = 0.0116;
const STEP_FLOOR_FRACTION = 1e-3;
const RTOL = 1e-10;

export function buildFeedTube(kin: Kinetics, tauSmall: number, tauEnd: number): FeedTube | null {
  const net = kin.net;
  if (net.depleting.some((d) => d.length > 0) || !(tauEnd > 0) || !Number.isFinite(tauEnd)) return null;
  const n = net.nSpecies;
  const v0 = net.v0;
  const T = net.T0;
  const ts: number[] = [];
  const ys: Float64Array[] = [];
  const fs: Float64Array[] = [];
  kin.weight.fill(1);
  try {
    integrateStiff((_v, y, dydv) => kin.production(y, T, dydv), net.F0, 0, tauEnd * v0, {
      rtol: RTOL,
      atol: 1e-13 * Math.max(net.FT0, Number.MIN_VALUE),
      autonomous: true,
      jacobian: (_v, y, J) => jacobianRows(kin, y, T, J),
      maxStepRelative: { fraction: STEP_FRACTION, floor: STEP_FLOOR_FRACTION * tauSmall * v0 },
      onStep: (v, y, f) => {
        ts.push(v / v0);
        ys.push(Float64Array.from(y));
        // Slopes per unit residence time: dF/dtau = v0 dF/dV.
        fs.push(Float64Array.from(f, (x) => x * v0));
      },
    });
  } catch (err) {
    if (err instanceof EngineError) return null;
    throw err;
  }
  const end = ts[ts.length - 1];
  return {
    length: end,
    at(tau: number) {
      if (!(tau >= 0) || tau > end) return null;
      // The step containing tau: the last stored point at or before it.
      let lo = 0;
      let hi = ts.length - 1;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (ts[mid] <= tau) lo = mid;
        else hi = mid;
      }
      const out = new Float64Array(n);
      if (tau === ts[lo]) out.set(ys[lo]);
      else hermite(ts[lo], ts[hi] - ts[lo], ys[lo], ys[hi], fs[lo], fs[hi], tau, out);
      return out;
    },
  };
}
