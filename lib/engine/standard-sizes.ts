import { purchase, type CostModel } from "./cost";
import { sharedPath, type SizingBasis } from "./sizing-basis";
import { pfrConversionAt } from "./pfr-runs";
import { reachLimit } from "./rating";
import { brentRoot } from "./root-finding";
import { cstrVolume, pfrVolume } from "./stages";
import type { StageType } from "./types";

/**
 * Exact least vessel cost with standard sizes (round up).
 *
 * With standard sizes the cost of a stage is constant on each "piece" (a count of identical parallel vessels
 * and their standard size), so every vessel is best used full: more volume never lowers a stage's outlet
 * conversion, and a higher inlet conversion never lowers the next one's. For one sequence the search runs
 * stage by stage over the purchase choices; the state is the conversion reached (rating form: outlet from
 * inlet and full vessel volume), and a Pareto front of (cost so far, conversion reached) is kept, dropping
 * every state that another state beats on both. The cheapest state past the target is the optimum over
 * every combination of sizes. Sequences sharing a prefix share its front (a trie, as in the grid search).
 */

/** One way to buy a stage: `count` vessels of standard size `sizeEach`, capacity count * sizeEach. */
export interface Piece {
  readonly count: number;
  readonly sizeEach: number;
  readonly sizeIndex: number;
  readonly capacity: number;
  readonly cost: number;
}

/** Most parallel vessels the search will consider for one stage. */
const MAX_COUNT = 4096;
/** Brackets of the scan for a CSTR's lowest steady state. */
const CSTR_SCAN = 128;
/** Where a stage cannot reach the target, volume beyond this fraction of its reach limit is ignored. */
const NEAR_LIMIT = 1 - 1e-9;

/** Purchase pieces of one stage type in order of capacity, generated on demand. */
class PieceList {
  readonly items: Piece[] = [];
  private nextCount = 1;

  constructor(
    private readonly cm: CostModel,
    private readonly type: StageType,
  ) {}

  /** Piece i, or null beyond the largest count considered. */
  at(i: number): Piece | null {
    while (this.items.length <= i && this.nextCount <= MAX_COUNT) this.extend();
    return this.items[i] ?? null;
  }

  private extend(): void {
    const c = this.nextCount++;
    const sizes = this.cm.sizes as readonly number[];
    sizes.forEach((s, index) => {
      // Only pieces that the purchase rule (fewest vessels, then the smallest size) would itself choose.
      const p = purchase(this.cm, this.type, c * s);
      if (p.count === c && p.sizeIndex === index) {
        this.items.push({ count: c, sizeEach: s, sizeIndex: index, capacity: c * s, cost: p.cost });
      }
    });
  }
}

/** Outlet of one piece: the conversion reached, or `done` when the target is reached or passed. */
interface Move {
  readonly piece: Piece;
  readonly x: number;
  readonly done: boolean;
}

interface State {
  readonly cost: number;
  /** Conversion reached (the target when done). */
  readonly x: number;
  readonly done: boolean;
  readonly parent: State | null;
  readonly piece: Piece | null;
}

/** First b in (lo, hi] with w(b) = capacity, given w(lo) < capacity <= w(hi) (w may be infinite at hi). */
function crossing(w: (b: number) => number, capacity: number, lo0: number, hi0: number): number {
  let lo = lo0;
  let hi = hi0;
  for (let k = 0; k < 80 && !Number.isFinite(w(hi)); k++) {
    const mid = 0.5 * (lo + hi);
    if (w(mid) >= capacity) hi = mid;
    else lo = mid;
  }
  if (!Number.isFinite(w(hi))) return lo;
  return brentRoot((b) => w(b) - capacity, lo, hi, 1e-15);
}

/** Outlet of a PFR of volume `capacity` fed at a, on [a, top] (top when beyond it). */
export function pfrOutletWithin(basis: SizingBasis, first: boolean, a: number, capacity: number, top: number, whole = pfrVolume(basis, first, a, top)): number {
  if (whole <= capacity) return top;
  return pfrConversionAt(basis, first, a, top, capacity, a + ((top - a) * capacity) / whole);
}

/** Every useful piece from inlet a for one stage, with its outlet. */
function moves(basis: SizingBasis, list: PieceList, type: StageType, first: boolean, a: number, target: number, limit: number): Move[] {
  const reaches = target <= limit;
  const top = reaches ? target : a + (limit - a) * NEAR_LIMIT;
  // The volume past which a piece saturates: it reaches `top` (the target, or next to the reach limit).
  let saturation: number;
  const samples: number[] = [];
  if (type === "PFR") {
    saturation = pfrVolume(basis, first, a, top);
  } else {
    saturation = 0;
    for (let i = 1; i <= CSTR_SCAN; i++) {
      const v = cstrVolume(basis, first, a, i === CSTR_SCAN ? top : a + ((top - a) * i) / CSTR_SCAN);
      samples.push(v);
      saturation = Math.max(saturation, v);
    }
  }
  if (!Number.isFinite(saturation)) return [];
  const out: Move[] = [];
  let scan = 0;
  let prevB = a;
  let cheapestSaturating: Piece | null = null;
  for (let i = 0; ; i++) {
    const p = list.at(i);
    if (!p) break;
    if (p.capacity >= saturation) {
      // All further pieces saturate too; only the cheapest of them matters (costs grow with the count).
      if (!cheapestSaturating || p.cost < cheapestSaturating.cost) cheapestSaturating = p;
      if (p.count > cheapestSaturating.count + 1) break;
      continue;
    }
    let x: number;
    if (type === "PFR") {
      x = pfrOutletWithin(basis, first, a, p.capacity, top, saturation);
    } else {
      // Capacities rise, so the first sample at or above the capacity only moves forward.
      while (samples[scan] < p.capacity) {
        prevB = a + ((top - a) * (scan + 1)) / CSTR_SCAN;
        scan++;
      }
      const hi = scan === CSTR_SCAN - 1 ? top : a + ((top - a) * (scan + 1)) / CSTR_SCAN;
      x = crossing((b) => cstrVolume(basis, first, a, b), p.capacity, prevB, hi);
    }
    out.push({ piece: p, x, done: false });
  }
  if (cheapestSaturating) out.push({ piece: cheapestSaturating, x: top, done: reaches });
  return out;
}

/** Keeps the states no other state beats on both cost and conversion; cheapest first. */
function paretoFront(states: State[]): State[] {
  states.sort((p, q) => p.cost - q.cost || Number(q.done) - Number(p.done) || q.x - p.x);
  const front: State[] = [];
  let best = -Infinity;
  for (const s of states) {
    if (s.done) {
      front.push(s);
      break;
    }
    if (s.x > best) {
      front.push(s);
      best = s.x;
    }
  }
  return front;
}

/** Best way to buy one sequence: the piece of every stage, or null when no combination reaches the target. */
export interface SizedDesign {
  readonly cost: number;
  readonly pieces: Piece[];
}

interface Node {
  readonly children: Map<StageType, Node>;
  readonly leafOf: number[];
}

/**
 * Least-cost purchase of every sequence with standard sizes, exact over all combinations of sizes and
 * parallel counts (up to MAX_COUNT vessels a stage), with each CSTR at its lowest steady state from the feed side.
 */
export function optimiseStandardSizes(
  basis: SizingBasis,
  cm: CostModel,
  target: number,
  sequences: readonly (readonly StageType[])[],
): (SizedDesign | null)[] {
  const lists = { CSTR: new PieceList(cm, "CSTR"), PFR: new PieceList(cm, "PFR") };
  // A stage after the target is reached still is a vessel: the cheapest single vessel.
  const cheapestOf = (list: PieceList): Piece => {
    list.at(0);
    return list.items.filter((p) => p.count === 1).reduce((p, q) => (q.cost < p.cost ? q : p));
  };
  const cheapest = { CSTR: cheapestOf(lists.CSTR), PFR: cheapestOf(lists.PFR) };
  const memo = new Map<string, Move[]>();
  // On a shared temperature path the reach limit (rate or temperature limit) is the same from every inlet.
  const feedLimit = reachLimit(basis, true, 0);
  const shared = sharedPath(basis);
  const movesFrom = (type: StageType, first: boolean, a: number): Move[] => {
    const key = `${type}${first ? 1 : 0}${a}`;
    let m = memo.get(key);
    if (!m) {
      const limit = first || shared ? feedLimit : reachLimit(basis, false, a);
      m = moves(basis, lists[type], type, first, a, target, limit);
      memo.set(key, m);
    }
    return m;
  };

  const root: Node = { children: new Map(), leafOf: [] };
  sequences.forEach((seq, i) => {
    let node = root;
    for (const t of seq) {
      let next = node.children.get(t);
      if (!next) {
        next = { children: new Map(), leafOf: [] };
        node.children.set(t, next);
      }
      node = next;
    }
    node.leafOf.push(i);
  });

  const results: (SizedDesign | null)[] = sequences.map(() => null);
  const visit = (node: Node, front: State[], depth: number): void => {
    for (const [type, child] of node.children) {
      const next: State[] = [];
      for (const s of front) {
        if (s.done) {
          const p = cheapest[type];
          next.push({ cost: s.cost + p.cost, x: s.x, done: true, parent: s, piece: p });
          continue;
        }
        for (const m of movesFrom(type, depth === 0, s.x)) {
          next.push({ cost: s.cost + m.piece.cost, x: m.done ? target : m.x, done: m.done, parent: s, piece: m.piece });
        }
      }
      const childFront = paretoFront(next);
      const end = childFront[childFront.length - 1];
      for (const i of child.leafOf) results[i] = end?.done ? { cost: end.cost, pieces: piecesOf(end) } : null;
      visit(child, childFront, depth + 1);
    }
  };
  visit(root, [{ cost: 0, x: 0, done: false, parent: null, piece: null }], 0);
  return results;
}

function piecesOf(s: State): Piece[] {
  const out: Piece[] = [];
  for (let p: State | null = s; p && p.piece; p = p.parent) out.unshift(p.piece);
  return out;
}

/**
 * Outlet of a stage of volume `capacity` fed at a (rating form; a CSTR at its lowest steady state), with no
 * upper bound but the stage's reach limit: the bracket [a, hi] grows toward the limit geometrically, so a
 * rate that vanishes there (equilibrium, complete conversion) costs no singular integral.
 */
function outletAtCapacity(basis: SizingBasis, type: StageType, first: boolean, a: number, capacity: number, limit: number): number {
  let lo = a;
  let hi = a;
  for (let k = 1; k <= 40; k++) {
    hi = a + (limit - a) * (1 - Math.pow(2, -k));
    if (type === "PFR") {
      const whole = pfrVolume(basis, first, a, hi);
      if (whole >= capacity) return pfrOutletWithin(basis, first, a, capacity, hi, whole);
    } else {
      const w = (b: number) => cstrVolume(basis, first, a, b);
      let prev = lo;
      for (let i = 1; i <= CSTR_SCAN; i++) {
        const b = i === CSTR_SCAN ? hi : lo + ((hi - lo) * i) / CSTR_SCAN;
        if (w(b) >= capacity) return crossing(w, capacity, prev, b);
        prev = b;
      }
    }
    lo = hi;
  }
  return hi;
}

/**
 * Conversions reached by a train of full vessels (rating form), stage by stage from the feed; a CSTR is
 * taken at its lowest steady state. The last may pass the target.
 */
export function fullVesselConversions(basis: SizingBasis, types: readonly StageType[], capacities: readonly number[]): number[] {
  const x = [0];
  types.forEach((type, k) => {
    const a = x[k];
    const first = k === 0;
    x.push(outletAtCapacity(basis, type, first, a, capacities[k], reachLimit(basis, first, a)));
  });
  return x;
}
