import type { Point } from "../../../lib/charts/levenspiel-geometry";

/** Relative difference. */
export const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

// First order, liquid: -rA = k CA0 (1 - X).
export const FA0 = 0.05; // mol/s
export const CA0 = 1500; // mol/m3
export const K = 0.002; // 1/s
/** The Levenspiel curve's height FA0/(-rA). */
export const height = (x: number) => FA0 / (K * CA0 * (1 - x));
// closed form, common practice: CSTR V = FA0 (Xout - Xin) / (k CA0 (1 - Xout))
export const cstrVolume = (a: number, b: number) => (FA0 * (b - a)) / (K * CA0 * (1 - b));
// closed form, common practice: PFR V = (FA0 / (k CA0)) ln((1 - Xin) / (1 - Xout))
export const pfrVolume = (a: number, b: number) => (FA0 / (K * CA0)) * Math.log((1 - a) / (1 - b));
/** n evenly spaced points of the curve from a to b. */
export const sampled = (a: number, b: number, n = 25): Point[] => Array.from({ length: n }, (_, i) => a + ((b - a) * i) / (n - 1)).map((x) => [x, height(x)]);
