import { describe, expect, it } from "vitest";
import { largestFeed } from "@/lib/rating/largest-feed";

const k = 0.002; // 1/s
const concA = 1500; // mol/m3
const reaction = { rate: { law: "power" as const, k, orders: { A: 1 } } };

describe("largest feed of a fixed train", () => {
  it("N equal CSTRs, first order: X = 1 − (1 + kτ)^−N solved for FA0 (common practice)", () => {
    const N = 3;
    const V = 4; // m3 each
    const target = 0.9;
    // By hand: (1 + kτ) = (1 − X)^(−1/N) → τ = ((1 − X)^(−1/N) − 1)/k; v0 = V/τ; FA0 = v0·CA0.
    const tau = (Math.pow(1 - target, -1 / N) - 1) / k;
    const expected = (V / tau) * concA;
    const r = largestFeed({ feed: { flowA: 0.05, concA }, reaction, stages: Array.from({ length: N }, () => ({ type: "CSTR" as const, volume: V })) }, target);
    expect(r.flowA).not.toBeNull();
    expect(Math.abs(r.flowA! / expected - 1)).toBeLessThan(1e-8);
    expect(r.conversion!).toBeGreaterThanOrEqual(target);
  });

  it("one PFR, first order: X = 1 − exp(−kτ) solved for FA0 (common practice)", () => {
    const V = 10;
    const target = 0.95;
    // τ = −ln(1 − X)/k; FA0 = CA0·V/τ.
    const expected = (concA * V * k) / -Math.log(1 - target);
    const r = largestFeed({ feed: { flowA: "1 mol/s", concA: "1.5 mol/L" }, reaction, stages: [{ type: "PFR", volume: "10 m^3" }] }, target);
    expect(Math.abs(r.flowA! / expected - 1)).toBeLessThan(1e-8);
    expect(Math.abs(r.feedVolumetricFlow! / (expected / concA) - 1)).toBeLessThan(1e-8);
  });

  it("finds the feed from below when the starting feed is too large", () => {
    const target = 0.5;
    // CSTR first order: X = kτ/(1 + kτ) → τ = X/(k(1 − X)) (common practice).
    const expected = (concA * 2) / (target / (k * (1 - target)));
    const r = largestFeed({ feed: { flowA: 100, concA }, reaction, stages: [{ type: "CSTR", volume: 2 }] }, target);
    expect(Math.abs(r.flowA! / expected - 1)).toBeLessThan(1e-8);
  });

  it("says so when equilibrium keeps the train below the target at any feed", () => {
    // Reversible first order with K = 1: equilibrium conversion 0.5 (common practice: X_eq = K/(1 + K)).
    const r = largestFeed(
      { feed: { flowA: 0.05, concA }, reaction: { stoichiometry: { A: -1, R: 1 }, rate: { law: "power", k, orders: { A: 1 }, reverse: { k, orders: { R: 1 } } } }, stages: [{ type: "PFR", volume: 5 }] },
      0.6,
    );
    expect(r.flowA).toBeNull();
    expect(r.reason).toMatch(/does not reach/);
  });
});
