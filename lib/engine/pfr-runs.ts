import type { ReactorModel } from "./model";
import { levenspielHeight, pfrVolume, type StagePlace } from "./stages";

/** Conversion where a PFR from a reaches `volume`, within [a, b]: Newton's method (dV/dX = FA0/(-rA)), kept in its bracket. */
function pfrConversionAt(model: ReactorModel, first: boolean, a: number, b: number, volume: number, guess: number): number {
  let lo = a;
  let hi = b;
  let x = Math.min(Math.max(guess, a), b);
  for (let i = 0; i < 60; i++) {
    const f = pfrVolume(model, first, a, x) - volume;
    if (Math.abs(f) <= 1e-13 * volume) return x;
    if (f > 0) hi = x;
    else lo = x;
    const step = f / levenspielHeight(model, first, a, x);
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
export function equalisePfrRuns(model: ReactorModel, places: readonly StagePlace[], x: readonly number[]): number[] {
  const out = x.slice();
  let k = 0;
  while (k < places.length) {
    if (places[k].type !== "PFR") {
      k++;
      continue;
    }
    let end = k;
    while (end + 1 < places.length && places[end + 1].type === "PFR") end++;
    const count = end - k + 1;
    if (count > 1) {
      const a = out[k];
      const b = out[end + 1];
      const total = pfrVolume(model, places[k].first, a, b);
      // Each boundary from the previous one: short integrals, and Newton starts close to the answer.
      let prev = a;
      for (let i = 1; i < count; i++) {
        const guess = prev + (b - prev) / (count - i + 1);
        out[k + i] = pfrConversionAt(model, places[k].first, prev, b, total / count, guess);
        prev = out[k + i];
      }
    }
    k = end + 1;
  }
  return out;
}
