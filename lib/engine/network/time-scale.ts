import type { Kinetics } from "./kinetics";

/**
 * Time scale of the chemistry, s: how long the feed's key reactant lasts at its initial rate of use,
 * C_K0 / (-R_K(feed)). When the feed does not use the key reactant at first (an autocatalysis fed
 * without its catalyst), the fastest gross reaction rate stands in; 1 s when nothing reacts at all.
 * The views' residence-time grids start from it.
 */
export function chemistryTimeScale(kin: Kinetics): number {
  const net = kin.net;
  const R = new Float64Array(net.nSpecies);
  kin.production(net.F0, net.T0, R);
  const tc = net.C0[net.key] / -R[net.key];
  if (tc > 0 && Number.isFinite(tc)) return tc;
  const g = new Float64Array(net.nReactions);
  kin.grossRates(net.F0, net.T0, g);
  const fastest = Math.max(...g);
  return fastest > 0 ? net.C0[net.key] / fastest : 1;
}
