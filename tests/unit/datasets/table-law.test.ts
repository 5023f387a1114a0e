import { describe, expect, it } from "vitest";
import { tableLawFromRows } from "@/lib/datasets/table-law";
import { AppError } from "@/lib/errors";

function fieldsOf(fn: () => unknown): Record<string, string[]> | undefined {
  try {
    fn();
  } catch (err) {
    if (err instanceof AppError) return err.fields;
    throw err;
  }
  return undefined;
}

describe("a dataset version as a measured rate table", () => {
  it("sorts by conversion and converts concentrations by X = 1 − C_A/C_A0 (constant density)", () => {
    const { law, temperature } = tableLawFromRows(
      [
        { concA: 500, rate: 2 }, // X = 1 − 500/1000 = 0.5 (definition of conversion at constant density, common practice)
        { concA: 1000, rate: 8 }, // X = 0
        { concA: 750, rate: 4.5 }, // X = 0.25
      ],
      { feedConcA: 1000, phase: "liquid" },
    );
    expect(law).toEqual({ law: "table", conversion: [0, 0.25, 0.5], rate: [8, 4.5, 2] });
    expect(temperature).toBeUndefined();
  });

  it("keeps the rows at the feed temperature when the data span several", () => {
    const rows = [
      { conversion: 0, rate: 3, temperature: 333.15 },
      { conversion: 0.5, rate: 1, temperature: 333.15 },
      { conversion: 0, rate: 6, temperature: 343.15 },
      { conversion: 0.5, rate: 2, temperature: 343.15 },
    ];
    expect(fieldsOf(() => tableLawFromRows(rows, { feedConcA: 1000, phase: "liquid" }))).toHaveProperty("feed.temperature");
    expect(fieldsOf(() => tableLawFromRows(rows, { feedConcA: 1000, phase: "liquid", temperature: 353.15 }))?.["feed.temperature"][0]).toMatch(/No rows at 353.15 K/);
    expect(tableLawFromRows(rows, { feedConcA: 1000, phase: "liquid", temperature: 343.15 }).law.rate).toEqual([6, 2]);
  });

  it("refuses tables that do not start at the feed, concentrations above the feed, and gas with concentrations", () => {
    expect(fieldsOf(() => tableLawFromRows([{ conversion: 0.1, rate: 1 }, { conversion: 0.2, rate: 1 }], { feedConcA: 1, phase: "liquid" }))?.datasetVersion[0]).toMatch(/start at the feed/);
    expect(fieldsOf(() => tableLawFromRows([{ concA: 1200, rate: 1 }, { concA: 900, rate: 1 }], { feedConcA: 1000, phase: "liquid" }))).toHaveProperty("feed.concA");
    expect(fieldsOf(() => tableLawFromRows([{ concA: 1000, rate: 1 }, { concA: 900, rate: 1 }], { feedConcA: 1000, phase: "gas" }))).toHaveProperty("phase");
    expect(fieldsOf(() => tableLawFromRows([{ conversion: 0, rate: 1 }, { concA: 1000, rate: 2 }], { feedConcA: 1000, phase: "liquid" }))?.datasetVersion[0]).toMatch(/same conversion/);
  });
});
