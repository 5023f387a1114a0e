import { describe, expect, it } from "vitest";
import { spreadFractionFromPercent, spreadPercentFromFraction } from "@/components/robustness/spread-percent";
import { rateUnderUncertainty } from "@/lib/robustness/monte-carlo";
import { robustnessCreateSchema } from "@/lib/schemas/robustness";

// First-order isothermal liquid PFR: X = 1 - exp(-k tau) (common practice). With k uniform on
// k0 (1 ± s), the p-quantile of X is X at k0 (1 - s + 2 s p), since X rises with k.
const FA0 = 0.02; // mol/s
const CA0 = 1000; // mol/m3
const k0 = 1e-3; // 1/s
const tau = 2300; // s
const V = tau * (FA0 / CA0); // m3
const X = (k: number) => 1 - Math.exp(-k * tau);

function runTyped(typed: string) {
  const fraction = spreadFractionFromPercent(typed);
  const body = robustnessCreateSchema.parse({ uncertain: [{ field: "reaction.rate.k", kind: "plusMinus", fraction }], samples: 4000, seed: 7 });
  return rateUnderUncertainty({
    spec: { feed: { flowA: FA0, concA: CA0 }, reaction: { rate: { law: "power", k: k0, orders: { A: 1 } } }, stages: [{ type: "PFR", volume: V }] },
    uncertain: body.uncertain,
    target: 0.9,
    samples: body.samples,
    seed: body.seed,
  });
}

describe("the ± spread is typed in percent", () => {
  it("20 typed is ±20 % of k: P5 and P95 match the closed form at k0·0.82 and k0·1.18", () => {
    const r = runTyped("20");
    expect(r.p5).toBeCloseTo(X(k0 * (1 - 0.2 + 0.4 * 0.05)), 2);
    expect(r.p95).toBeCloseTo(X(k0 * (1 - 0.2 + 0.4 * 0.95)), 2);
  });

  it("20 gives a wider P5–P95 than 2", () => {
    const wide = runTyped("20");
    const narrow = runTyped("2");
    expect(wide.p95 - wide.p5).toBeGreaterThan(5 * (narrow.p95 - narrow.p5));
  });

  it("converts once, both ways, and accepts a trailing % sign", () => {
    expect(spreadFractionFromPercent("20")).toBeCloseTo(0.2, 12);
    expect(spreadFractionFromPercent("20 %")).toBeCloseTo(0.2, 12);
    expect(spreadPercentFromFraction(0.2)).toBe("20");
    expect(Number.isNaN(spreadFractionFromPercent(""))).toBe(true);
  });

  it("500 typed is refused in percent words, never advising a fraction", () => {
    const r = robustnessCreateSchema.safeParse({ uncertain: [{ field: "reaction.rate.k", kind: "plusMinus", fraction: spreadFractionFromPercent("500") }], samples: 10, seed: 1 });
    expect(r.success).toBe(false);
    const messages = r.error!.issues.map((i) => i.message).join(" ");
    expect(messages).toContain("below 100 %");
    expect(messages).not.toMatch(/fraction|0\.2/);
  });
});
