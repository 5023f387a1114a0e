import { describe, expect, it } from "vitest";
import { EngineError } from "@/lib/engine";
import { rateConstantDimension, toSI } from "@/lib/engine/units";

// Unit factors are exact by definition (1 min = 60 s, 1 h = 3600 s, 1 L = 1e-3 m³; SI brochure, common practice).
describe("rate constants with reciprocal units", () => {
  const first = rateConstantDimension(1);
  it.each([
    ["0.06 1/min", 0.001],
    ["0.06 min^-1", 0.001],
    ["0.06 1/(min)", 0.001],
    ["7.2 1/h", 0.002],
    ["0.5 1/s", 0.5],
  ])("%s is %f 1/s", (text, si) => {
    expect(toSI(text, first, "reaction.rate.k")).toBeCloseTo(si, 15);
  });

  it("a second-order constant in L/(mol min) converts to m³/(mol s)", () => {
    expect(toSI("2 L/(mol min)", rateConstantDimension(2), "reaction.rate.k")).toBeCloseTo((2 * 1e-3) / 60, 18);
  });

  it("a reciprocal unit of the wrong dimension is a field error, not a crash", () => {
    const attempt = () => toSI("3 1/h", rateConstantDimension(2), "reaction.rate.k");
    expect(attempt).toThrow(EngineError);
    expect(attempt).toThrow(/reaction\.rate\.k/);
  });
});
