import { describe, expect, it } from "vitest";
import { quasiNewton } from "../../../../lib/engine/network/quasi-newton";

describe("projected quasi-Newton in a box", () => {
  it("Rosenbrock's function: its minimum at (1, 1) with value 0 (Rosenbrock, Computer Journal 3, 1960)", () => {
    const f = (x: readonly number[]) => 100 * (x[1] - x[0] ** 2) ** 2 + (1 - x[0]) ** 2;
    const r = quasiNewton(f, [-1.2, 1], { lower: [-5, -5], upper: [5, 5], h: 1e-6, maxIterations: 200 });
    expect(Math.abs(r.x[0] - 1)).toBeLessThan(1e-4);
    expect(Math.abs(r.x[1] - 1)).toBeLessThan(1e-4);
    expect(r.value).toBeLessThan(1e-8);
  });

  it("a quadratic whose unconstrained minimum lies outside the box stops on the face (algebra)", () => {
    // (x - 2)^2 + (y - 0.5)^2 + x y in [0, 1]^2: on the face x = 1, d/dy = 2(y - 0.5) + 1 = 0 gives y = 0, a corner;
    // at (1, 0) the gradient (2(1 - 2) + 0, 2(0 - 0.5) + 1) = (-2, 0) pushes out through x = 1 only.
    const f = (x: readonly number[]) => (x[0] - 2) ** 2 + (x[1] - 0.5) ** 2 + x[0] * x[1];
    const r = quasiNewton(f, [0.2, 0.8], { lower: [0, 0], upper: [1, 1], h: 1e-6 });
    expect(r.x[0]).toBe(1);
    expect(Math.abs(r.x[1])).toBeLessThan(1e-6);
    expect(Math.abs(r.value - 1.25)).toBeLessThan(1e-10);
  });
});
