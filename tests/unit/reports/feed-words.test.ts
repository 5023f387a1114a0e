import { describe, expect, it } from "vitest";
import { describeFeed, describeReaction } from "@/lib/reports/kinetics-words";

describe("the report's feed and temperatures in the reader's units", () => {
  // 1 kmol/h = 1000 mol / 3600 s; T[°C] = T[K] − 273.15 (both exact by definition, common practice).
  const feed = { flowA: 5000 / 3600, concA: 1500, temperature: 333.15 };

  it("shows the reader's unit first and the stored SI value beside it", () => {
    const lines = describeFeed(feed, { molarFlow: "kmol/h", concentration: "mol/L", temperature: "degC" });
    expect(lines.map((l) => l.value)).toEqual(["5 kmol/h (1.389 mol/s)", "1.5 mol/L (1500 mol/m³)", "60 °C (333.15 K)"]);
  });

  it("shows SI alone when the reader asked for SI or for nothing", () => {
    expect(describeFeed(feed)[0]!.value).toBe("1.389 mol/s");
    expect(describeFeed(feed, { molarFlow: "mol/s", concentration: "mol/m3", temperature: "K" })[2]!.value).toBe("333.15 K");
  });

  it("converts a temperature rise as a difference, without the offset", () => {
    const lines = describeReaction({ thermal: { mode: "adiabatic", adiabaticRise: 50 } }, { temperatureDifference: "degF" });
    // 50 K of rise = 90 °F of rise (1 K = 1.8 °F as a difference, common practice).
    expect(lines.find((l) => l.label.startsWith("Adiabatic rise"))!.value).toBe("90 °F (difference) (50 K)");
  });
});
