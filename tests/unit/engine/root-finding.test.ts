import { describe, expect, it } from "vitest";
import { allRoots } from "../../../lib/engine/root-finding";

describe("every root of a function on an interval", () => {
  it("finds two roots that lie within one step of the scan, above a first root (the factors' zeros, by construction)", () => {
    // f = (x - 0.3)(x - 0.53)(x - 0.5301): with 10 steps, 0.53 and 0.5301 share the step [0.5, 0.6].
    const f = (x: number) => (x - 0.3) * (x - 0.53) * (x - 0.5301);
    const roots = allRoots(f, 0, 1, 10);
    expect(roots.length).toBe(3);
    [0.3, 0.53, 0.5301].forEach((r, i) => expect(Math.abs(roots[i] - r)).toBeLessThan(1e-12));
  });

  it("finds the same pair when the function is negative between them", () => {
    const f = (x: number) => -(x - 0.2) * (x - 0.71) * (x - 0.7102);
    const roots = allRoots(f, 0, 1, 10);
    expect(roots.map((r) => Number(r.toFixed(10)))).toEqual([0.2, 0.71, 0.7102]);
  });

  it("adds no root where |f| only dips without reaching zero", () => {
    // (x - 0.3)((x - 0.53)^2 + 1e-6) has one real root.
    const f = (x: number) => (x - 0.3) * ((x - 0.53) ** 2 + 1e-6);
    expect(allRoots(f, 0, 1, 10)).toEqual([expect.closeTo(0.3, 12)]);
  });

  it("seeks no pair below the first root a sign change shows (the lowest stays the first crossing)", () => {
    // Negative at both ends of [0.1, 0.2] but positive between 0.15 and 0.1501; first sign change at 0.6.
    const f = (x: number) => -(x - 0.15) * (x - 0.1501) * (x - 0.6);
    const roots = allRoots(f, 0, 1, 10);
    expect(roots.length).toBe(1);
    expect(Math.abs(roots[0] - 0.6)).toBeLessThan(1e-12);
  });
});
