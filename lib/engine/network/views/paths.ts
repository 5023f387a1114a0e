import { ensure } from "../../errors";
import type { Kinetics } from "../kinetics";
import { pfrOutlet } from "../pfr";
import { chemistryTimeScale } from "../time-scale";
import type { NetworkSpec } from "../types";
import { concentrationRecord, kineticsFor, productIndex } from "./common";
import { tankLocus } from "./tank-locus";
import type { NetworkPaths, NetworkPathsOptions, PathPoint } from "./types";

/**
 * The concentration paths from the feed: a single tube (C along it) and single stirred tanks of every
 * size (each tank's outlet), on one log-spaced grid of residence times, isothermal at the feed
 * temperature. What a chart of C_product against C_key, or of selectivity against conversion, draws.
 *
 * The grid runs from 1e-3 of the chemistry's time scale (time-scale.ts) to where the single tube has used
 * ~99.9 % of the key reactant, or where its composition stops changing (an equilibrium), capped at 1e4
 * time scales or options.maxResidenceTime. That end is found by a coarse tube integration (rtol 1e-6,
 * 200 points); the reported tube is one integration at the engine's normal tolerance. Tanks list every
 * steady state found (lowest conversion first; tank-locus.ts); a size whose balances cannot be solved is
 * left out rather than failing the whole view.
 * @throws EngineError naming the chemistry's field at fault, or "product" for a wanted product not in the feed.
 */
export function networkPaths(chemistry: NetworkSpec, product?: string, options: NetworkPathsOptions = {}): NetworkPaths {
  const kin = kineticsFor(chemistry);
  const net = kin.net;
  const p = productIndex(kin, product);
  const points = options.points ?? DEFAULT_POINTS;
  ensure(Number.isInteger(points) && points >= 2 && points <= MAX_POINTS, `the number of points is a whole number from 2 to ${MAX_POINTS}`, "points");
  const tc = chemistryTimeScale(kin);
  const cap = options.maxResidenceTime ?? CAP_SCALES * tc;
  ensure(Number.isFinite(cap) && cap > 0, "the longest residence time must be above zero", "maxResidenceTime");
  const from = Math.min(FIRST_SCALE * tc, FIRST_SCALE * cap);
  const to = pathEnd(kin, from, cap, tc);
  const grid = logGrid(from, to, points);

  const T = net.T0;
  const v0 = net.v0;
  const tube = pfrOutlet(kin, net.F0, T, to * v0, { outputVolumes: grid.map((t) => t * v0) });
  const point = (F: Float64Array, tau: number, steadyState?: number) => pathPoint(kin, p, F, T, tau, steadyState);
  const tubePoints = [point(net.F0, 0), ...tube.profile.map((q, i) => point(q.flows, grid[i]))];

  const tanks: PathPoint[] = [];
  const flows = tube.profile.map((q) => q.flows);
  tankLocus(kin, T, grid, flows, flows[flows.length - 1]).forEach((states, i) => states?.forEach((s, k) => tanks.push(point(s.flows, grid[i], k))));
  return { key: net.species[net.key], product: p >= 0 ? net.species[p] : null, tube: tubePoints, tanks, residenceTimes: { from, to } };
}

const DEFAULT_POINTS = 80;
const MAX_POINTS = 2000;
/** The grid starts at this fraction of the time scale (nothing visible has happened yet)... */
const FIRST_SCALE = 1e-3;
/** ...and looks no further than this many time scales. */
const CAP_SCALES = 1e4;
const USED_UP = 0.999;
const SCAN_POINTS = 200;
/** Composition "stops changing": every flow moves by less than this fraction of the flow in over STILL_STEPS scan steps. */
const STILL = 1e-6;
const STILL_STEPS = 5;

/** Where the single tube has used ~99.9 % of the key reactant or stops changing, within [from, cap]. */
function pathEnd(kin: Kinetics, from: number, cap: number, tc: number): number {
  const net = kin.net;
  const scan = logGrid(from, cap, SCAN_POINTS);
  const res = pfrOutlet(kin, net.F0, net.T0, cap * net.v0, { outputVolumes: scan.map((t) => t * net.v0), rtol: 1e-6 });
  const profile = res.profile;
  const fk0 = net.F0[net.key];
  for (let i = 0; i < profile.length; i++) {
    const F = profile[i].flows;
    if (1 - F[net.key] / fk0 >= USED_UP) return scan[Math.max(i, 1)];
    // The "still" test waits until one time scale has passed: a reaction that starts slowly (a catalyst
    // formed by the reaction itself) has not stopped changing before it has begun.
    if (i >= STILL_STEPS && scan[i] >= tc) {
      const before = profile[i - STILL_STEPS].flows;
      let moved = 0;
      for (let k = 0; k < net.nSpecies; k++) moved = Math.max(moved, Math.abs(F[k] - before[k]));
      if (moved <= STILL * net.FT0) return scan[i];
    }
  }
  return cap;
}

/** n residence times from `from` to `to`, evenly spaced in their logarithm (ends exact). */
function logGrid(from: number, to: number, n: number): number[] {
  const a = Math.log(from);
  const step = (Math.log(to) - a) / (n - 1);
  return Array.from({ length: n }, (_, i) => (i === 0 ? from : i === n - 1 ? to : Math.exp(a + i * step)));
}

function pathPoint(kin: Kinetics, p: number, F: Float64Array, T: number, residenceTime: number, steadyState?: number): PathPoint {
  const net = kin.net;
  const concentrations = concentrationRecord(kin, F, T);
  let selectivity: number | null = null;
  if (p >= 0) {
    // The ratio of the rates at which the product forms and the key reactant is used at this composition.
    kin.weight.fill(1);
    const R = new Float64Array(net.nSpecies);
    kin.production(F, T, R);
    selectivity = -R[net.key] > 0 ? R[p] / -R[net.key] : null;
  }
  const point: PathPoint = {
    residenceTime,
    conversion: 1 - F[net.key] / net.F0[net.key],
    key: concentrations[net.species[net.key]],
    product: p >= 0 ? concentrations[net.species[p]] : null,
    selectivity,
    concentrations,
  };
  if (steadyState !== undefined) point.steadyState = steadyState;
  return point;
}
