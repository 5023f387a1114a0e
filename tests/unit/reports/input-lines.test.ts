import { describe, expect, it } from "vitest";
import { inputLines } from "@/lib/reports/input-lines";

describe("the report's inputs as computed", () => {
  const spec = {
    feed: { flowA: 1.3888888888888888, concA: 1500, temperature: 333.15 },
    reaction: { stoichiometry: { R: 1 }, phase: "liquid", rate: { law: "power", k: 0.002, orders: { A: 1 } } },
    target: { conversion: 0.9 },
    shownUnits: { "feed.flowA": "kmol/h" },
  };
  const lines = inputLines(spec);

  it("reads every stored number with its label and SI unit, never a field path or a data format", () => {
    expect(lines).toContainEqual({ label: "Feed rate of A", value: "1.38889 mol/s" });
    expect(lines).toContainEqual({ label: "Feed temperature", value: "333.15 K" });
    for (const l of lines) {
      expect(l.label).not.toMatch(/\w\.\w|[{}"]/);
      expect(l.value).not.toMatch(/[{}"]/);
    }
  });

  it("leaves out the units the form was typed in, which are for showing the form again", () => {
    expect(lines.some((l) => l.value === "kmol/h")).toBe(false);
    expect(lines.length).toBe(9);
  });
});
