import { describe, expect, it } from "vitest";
import { toSI } from "@/lib/engine/units";
import { designSpecSchema } from "@/lib/schemas/sweep-spec";

const base = {
  feed: { flowA: 0.05, concA: "1.5 mol/L" },
  reaction: { rate: { law: "power", k: 0.002, orders: { A: 1 } } },
  train: { maxStages: 2 },
};

// 1 % = 0.01 by definition (common practice); the SI values below need no other factor.
describe("dimensionless fields given as strings", () => {
  it.each([
    ["90 %", 0.9],
    ["90%", 0.9],
    ["0.9", 0.9],
    [0.9, 0.9],
  ])("target conversion %j reads as %d", (given, expected) => {
    const parsed = designSpecSchema.safeParse({ ...base, target: { conversion: given } });
    expect(parsed.success).toBe(true);
    expect(parsed.data!.target.conversion).toBeCloseTo(expected, 15);
  });

  it("a feed ratio and an expansion factor given as strings are read", () => {
    const parsed = designSpecSchema.parse({ ...base, feed: { ...base.feed, ratios: { B: "1.2" } }, reaction: { ...base.reaction, epsilon: "0.5" }, target: { conversion: 0.9 } });
    expect(parsed.feed.ratios).toEqual({ B: 1.2 });
    expect(parsed.reaction.epsilon).toBe(0.5);
  });

  it("a bad one is refused naming the field in words", () => {
    const bad = designSpecSchema.safeParse({ ...base, target: { conversion: "ninety" } });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0].message).toMatch(/^Target conversion: cannot read "ninety"/);
    const ratio = designSpecSchema.safeParse({ ...base, feed: { ...base.feed, ratios: { B: "1.2 mol" } }, target: { conversion: 0.9 } });
    expect(ratio.error!.issues[0].message).toMatch(/^Feed ratio to A/);
  });

  it("the engine reads a percent where it expects a plain number", () => {
    expect(toSI("90 %", null, "target.conversion")).toBeCloseTo(0.9, 15);
    expect(() => toSI("90 K", null, "target.conversion")).toThrow(/dimensionless/);
  });
});
