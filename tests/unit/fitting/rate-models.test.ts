import { describe, expect, it } from "vitest";
import { fitRateModel, type RatePoint } from "@/lib/fitting/rate-models";

const R = 8.314462618; // J/(mol K), CODATA exact

/** A small deterministic generator (xorshift32) for reproducible measurement noise. */
function noise(seed: number) {
  let s = seed >>> 0 || 1;
  return () => {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    return ((s >>> 0) / 4294967296 - 0.5) * 2;
  };
}

const concentrations = Array.from({ length: 25 }, (_, i) => 50 + i * 40);

describe("rate-law fits recover the parameters of exact data from the published rate laws", () => {
  it("power law k C^n", () => {
    const pts: RatePoint[] = concentrations.map((c) => ({ concA: c, rate: 3e-5 * c ** 1.5 }));
    const fit = fitRateModel("power", pts);
    expect(fit.parameters[0].value).toBeCloseTo(3e-5, 12);
    expect(fit.parameters[1].value).toBeCloseTo(1.5, 9);
    expect(fit.rSquared).toBeCloseTo(1, 12);
  });

  it("reversible kf C_A − kr C_R", () => {
    const pts: RatePoint[] = concentrations.map((c) => ({ concA: c, concR: 1100 - c, rate: 4e-3 * c - 1e-3 * (1100 - c) }));
    const fit = fitRateModel("reversible", pts);
    expect(fit.parameters.map((p) => p.value)).toEqual([expect.closeTo(4e-3, 12), expect.closeTo(1e-3, 12)]);
  });

  it("saturation and saturation with substrate inhibition", () => {
    const sat = fitRateModel("saturation", concentrations.map((c) => ({ concA: c, rate: (2.0 * c) / (300 + c) })));
    expect(sat.parameters[0].value).toBeCloseTo(2.0, 9);
    expect(sat.parameters[1].value).toBeCloseTo(300, 6);
    const inh = fitRateModel("saturation-inhibition", concentrations.map((c) => ({ concA: c, rate: (2.0 * c) / (300 + c + (c * c) / 800) })));
    expect(inh.parameters.map((p) => p.value)).toEqual([expect.closeTo(2.0, 6), expect.closeTo(300, 3), expect.closeTo(800, 3)]);
  });

  it("Arrhenius across temperatures", () => {
    const pts: RatePoint[] = [320, 335, 350, 365].flatMap((T) =>
      concentrations.slice(0, 10).map((c) => ({ concA: c, temperature: T, rate: 1e-4 * Math.exp((-65000 / R) * (1 / T - 1 / 340)) * c })),
    );
    const fit = fitRateModel("power-arrhenius", pts);
    const [kRef, ea, n] = fit.parameters.map((p) => p.value);
    expect(ea).toBeCloseTo(65000, 3);
    expect(n).toBeCloseTo(1, 9);
    // k at 340 K from the fitted reference point, compared with the generating value.
    expect(kRef * Math.exp((-ea / R) * (1 / 340 - 1 / fit.referenceTemperature!))).toBeCloseTo(1e-4, 12);
  });
});

describe("statistics on noisy data", () => {
  it("the 95 % intervals cover the true parameters and R² reflects the noise", () => {
    const rnd = noise(20261201);
    const pts: RatePoint[] = concentrations.map((c) => ({ concA: c, rate: ((2.0 * c) / (300 + c)) * (1 + 0.01 * rnd()) }));
    const fit = fitRateModel("saturation", pts);
    const [vmax, km] = fit.parameters;
    expect(vmax.interval95[0]).toBeLessThan(2.0);
    expect(vmax.interval95[1]).toBeGreaterThan(2.0);
    expect(km.interval95[0]).toBeLessThan(300);
    expect(km.interval95[1]).toBeGreaterThan(300);
    expect(fit.rSquared).toBeGreaterThan(0.99);
    expect(fit.rSquared).toBeLessThan(1);
    expect(fit.parity).toHaveLength(pts.length);
    expect(fit.residuals.reduce((s, r) => s + r * r, 0)).toBeCloseTo(fit.residualSumOfSquares, 15);
  });

  it("refuses what a law cannot fit", () => {
    expect(() => fitRateModel("power", [{ concA: 1, rate: -1 }, { concA: 2, rate: 1 }, { concA: 3, rate: 2 }])).toThrow(/positive rate/);
    expect(() => fitRateModel("power-arrhenius", concentrations.map((c) => ({ concA: c, temperature: 330, rate: c })))).toThrow(/two temperatures/);
  });
});
