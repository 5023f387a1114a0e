import { EngineError } from "../../errors";
import { cstrSteadyStates } from "../cstr";
import type { Kinetics } from "../kinetics";
import type { NetworkSteadyState } from "../types";

/**
 * Every steady state of single stirred tanks fed with the network's feed, at each residence time of an
 * ascending grid: the locus a chart of paths draws. null where the balances could not be solved.
 *
 * The full steady-state search (cstr.ts, ~25 starts and deflation rounds) at each of 80 sizes costs far
 * more than a chart drawn as the user types can afford, and most sizes have one state. So:
 * 1. every size is solved cheaply by Newton from a few starts: the feed, the tube's composition at the
 *    same time, the tube's composition at the end of the grid (nearly as far as the reactions go), and
 *    the states of the next smaller size (following each branch of the locus upward);
 * 2. the full search runs at every SAMPLE-th size, at both ends, wherever the cheap solve failed or found
 *    several states, and next to every size where the full search found a different number of states
 *    than the cheap solve, spreading until they agree, so a region of several states is searched in full
 *    over its whole width.
 * A region of several states narrower than SAMPLE grid steps that Newton from none of those starts
 * reveals would be missed; the multiplicity checks (tests/unit/engine/network/views) count every
 * state against the roots of the balance.
 */
export function tankLocus(kin: Kinetics, T: number, taus: readonly number[], tubeFlows: readonly Float64Array[], far: Float64Array): (NetworkSteadyState[] | null)[] {
  const net = kin.net;
  const n = taus.length;
  const solve = (i: number, full: boolean): NetworkSteadyState[] | null => {
    try {
      if (full) return cstrSteadyStates(kin, net.F0, T, taus[i] * net.v0);
      const seeds = [tubeFlows[i], far, ...(i > 0 ? (cheap[i - 1] ?? []).map((s) => s.flows) : [])];
      return cstrSteadyStates(kin, net.F0, T, taus[i] * net.v0, { starts: 0, seeds });
    } catch (err) {
      // One size the tank's balances cannot be solved at leaves a gap in the locus, not an empty chart.
      if (err instanceof EngineError) return null;
      throw err;
    }
  };
  const cheap: (NetworkSteadyState[] | null)[] = [];
  for (let i = 0; i < n; i++) cheap.push(solve(i, false));

  const result = [...cheap];
  const searched = new Set<number>();
  const queue: number[] = [];
  for (let i = 0; i < n; i++) {
    const c = cheap[i];
    if (i % SAMPLE === 0 || i === n - 1 || c === null || c.length > 1) queue.push(i);
    if (c !== null && c.length > 1) queue.push(i - 1, i + 1);
  }
  while (queue.length > 0) {
    const i = queue.pop()!;
    if (i < 0 || i >= n || searched.has(i)) continue;
    searched.add(i);
    const full = solve(i, true);
    if (full !== null) result[i] = full;
    if ((full?.length ?? 0) !== (cheap[i]?.length ?? 0)) queue.push(i - 1, i + 1);
  }
  return result;
}

/** Every this many sizes the full search checks the cheap one. */
const SAMPLE = 8;
