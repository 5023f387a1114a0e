import type { SizingBasis } from "./sizing-basis";
import { levenspielHeight, pfrVolume, type StagePlace } from "./stages";

/** Conversion where a PFR from a reaches `volume`, within [a, b]: Newton's method (dV/dX = FA0/(-rA)), kept in its bracket. */
export function pfrConversionAt(basis: SizingBasis, first: boolean, a: number, b: number, volume: number, guess: number): number {
  let lo = a;
  let hi = b;
  let x = Math.min(Math.max(guess, a), b);
  for (let i = 0; i < 60; i++) {
    const f = pfrVolume(basis, first, a, x) - volume;
    if (Math.abs(f) <= 1e-13 * volume) return x;
    if (f > 0) hi = x;
    else lo = x;
    const step = f / levenspielHeight(basis, first, a, x);
    let next = x - step;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - x) <= 1e-14 || hi - lo < 1e-15) return next;
    x = next;
  }
  return x;
}

/**
 * On a shared temperature path, PFRs in a row act as one PFR: any split has the same total volume.
 * Splitting it into equal volumes makes the answer unique (and the vessels identical).
 */
export function equalisePfrRuns(basis: SizingBasis, places: readonly StagePlace[], x: readonly number[]): number[] {
  const out = x.slice();
  // A zero-volume CSTR inside a run of PFRs does not break it: the run still acts as one PFR.
  const joins = (k: number) => places[k].type === "PFR" || x[k + 1] === x[k];
  let k = 0;
  while (k < places.length) {
    if (places[k].type !== "PFR") {
      k++;
      continue;
    }
    let end = k;
    while (end + 1 < places.length && joins(end + 1)) end++;
    while (places[end].type !== "PFR") end--;
    const members = [];
    for (let i = k; i <= end; i++) if (places[i].type === "PFR") members.push(i);
    if (members.length > 1) {
      const first = places[k].first;
      const a = out[k];
      const total = pfrVolume(basis, first, a, out[end + 1]);
      let prev = a;
      let done = 0;
      for (let i = k; i < end; i++) {
        if (places[i].type !== "PFR") {
          out[i + 1] = prev;
          continue;
        }
        done++;
        const b = out[end + 1];
        const guess = prev + (b - prev) / (members.length - done + 1);
        out[i + 1] = pfrConversionAt(basis, first, prev, b, total / members.length, guess);
        prev = out[i + 1];
      }
    }
    k = end + 1;
  }
  return out;
}
