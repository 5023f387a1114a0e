import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { parseUpload, toColumnMapping } from "@/lib/datasets/parse-upload";
import { UPLOAD_LIMITS } from "@/lib/datasets/rate-table";
import { parseRateXlsx } from "@/lib/datasets/rate-xlsx";
import type { DatasetMapping } from "@/lib/schemas/datasets";

/** A workbook built here, in memory, as a spreadsheet program would save it. */
async function workbook(rows: ExcelJS.CellValue[][], extraSheet = false): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet("bench");
  for (const r of rows) ws.addRow(r);
  if (extraSheet) wb.addWorksheet("notes").addRow(["not read"]);
  return new Uint8Array(await wb.xlsx.writeBuffer());
}

const HEAD = ["X", "rate (mol/L/min)", "T (degC)"];
const mapping: DatasetMapping = {
  columns: { X: "conversion", "rate (mol/L/min)": "rate", "T (degC)": "temperature" },
  units: { conversion: "fraction", rate: "mol/(L min)", temperature: "degC" },
};

describe("XLSX uploads", () => {
  it("reads numbers and formula results of the first worksheet in SI", async () => {
    const bytes = await workbook(
      [
        HEAD,
        [0, 0.72, 60],
        [0.1, { formula: "B2*0.8", result: 0.576 }, 60],
        [], // a blank row is skipped, not a problem
        [0.2, 0.6, { formula: "C2", result: 60 }],
      ],
      true,
    );
    const t = await parseRateXlsx(bytes, toColumnMapping(mapping));
    expect(t.problems).toEqual([]);
    expect(t.headers).toEqual(HEAD);
    // 1 mol/(L·min) = 1000 mol/m³ / 60 s, exact by definition; T[K] = T[°C] + 273.15 (common practice)
    expect(t.rows).toEqual([
      { line: 2, conversion: 0, rate: 12, temperature: 333.15 },
      { line: 3, conversion: 0.1, rate: 9.6, temperature: 333.15 },
      { line: 5, conversion: 0.2, rate: 10, temperature: 333.15 },
    ]);
  });

  it("marks every kind of bad cell with its worksheet row and column", async () => {
    const bytes = await workbook([
      HEAD,
      [0, 0.72, 60], // good: line 2
      [null, 0.5, 60], // missing conversion
      [0.3, "fast", 60], // text in a numeric column
      [0.35, 0.4, new Date(Date.UTC(2026, 9, 14))], // a date in a numeric column
      [0.4, -0.2, 60], // negative rate
      [1.2, 0.1, 60], // conversion out of range
      [0.5, 0, 60], // zero rate
      [0.6, { formula: "1/0", result: { error: "#DIV/0!" } }, 60], // formula error
      [0.7, { formula: "B2/2" }, 60], // formula never calculated
      [0, 0.71, 60], // duplicate conversion at one temperature
      [0, 0.9, 80], // the same conversion at another temperature is fine: line 12
    ]);
    const t = await parseRateXlsx(bytes, toColumnMapping(mapping));
    expect(t.rows.map((r) => r.line)).toEqual([2, 12]);
    expect(t.problems).toEqual([
      { line: 3, column: "X", message: "missing" },
      { line: 4, column: "rate (mol/L/min)", message: '"fast" is not a number' },
      { line: 5, column: "T (degC)", message: "2026-10-14 is a date, not a number" },
      { line: 6, column: "rate (mol/L/min)", message: "the rate must be positive" },
      { line: 7, column: "X", message: "conversion must be in [0, 1)" },
      { line: 8, column: "rate (mol/L/min)", message: "the rate must be positive" },
      { line: 9, column: "rate (mol/L/min)", message: "the cell holds the error #DIV/0!" },
      { line: 10, column: "rate (mol/L/min)", message: "a formula without a saved result: open and save the workbook in a spreadsheet program first" },
      { line: 11, column: null, message: "duplicate conversion 0 at one temperature (first on line 2)" },
    ]);
    // Bad lines are kept as text so the preview can show them beside their reasons.
    expect(t.lines.find((l) => l.line === 4)?.cells["rate (mol/L/min)"]).toBe("fast");
  });

  it("converts percent, concentrations, °F and the other rate units exactly", async () => {
    const bytes = await workbook([
      ["conv %", "CA", "CR", "r", "T"],
      [50, 2.5, 0.5, 1.8, 212],
    ]);
    const m: DatasetMapping = {
      columns: { "conv %": "conversion", CA: "concA", CR: "concR", r: "rate", T: "temperature" },
      units: { conversion: "percent", concA: "mmol/L", concR: "kmol/m3", rate: "kmol/(m3 h)", temperature: "degF" },
    };
    const t = await parseUpload({ fileName: "u.xlsx", format: "xlsx", bytes, mapping: m });
    expect(t.problems).toEqual([]);
    const [row] = t.rows;
    expect(row.conversion).toBe(0.5); // 50 % = 0.5
    expect(row.concA).toBe(2.5); // 1 mmol/L = 1 mol/m³, exact by definition
    expect(row.concR).toBe(500); // 1 kmol/m³ = 1000 mol/m³
    expect(row.rate).toBeCloseTo(0.5, 12); // 1.8 kmol/(m³·h) = 1800 mol / 3600 s per m³
    expect(row.temperature).toBeCloseTo(373.15, 10); // 212 °F = 100 °C = 373.15 K (common practice)
    const litres = await parseUpload({ fileName: "u.xlsx", format: "xlsx", bytes, mapping: { ...m, units: { ...m.units, concA: "mol/L", rate: "mol/(L h)" } } });
    expect(litres.rows[0].concA).toBe(2500); // 1 mol/L = 1000 mol/m³
    expect(litres.rows[0].rate).toBeCloseTo(0.5, 12); // 1.8 mol/(L·h) = 1800 mol/(m³·h)
  });

  it("refuses a mapping that names a missing column or no rate, and two columns for one role", async () => {
    const bytes = await workbook([HEAD, [0, 1, 60]]);
    const t = await parseRateXlsx(bytes, toColumnMapping({ columns: { X: "conversion", "T (degC)": "rate", "rate (mol/L/min)": "rate", Y: "concA" }, units: {} }));
    expect(t.problems.map((p) => p.message)).toEqual(['No column "Y" in the file', 'Only one column may hold rate; "T (degC)" and "rate (mol/L/min)" both do']);
    const noRate = await parseRateXlsx(bytes, toColumnMapping({ columns: { X: "conversion" }, units: {} }));
    expect(noRate.problems[0].message).toMatch(/measured rate/);
  });

  it("refuses files over the size and row limits, and files that are not workbooks", async () => {
    const big = new Uint8Array(UPLOAD_LIMITS.bytes + 1);
    expect((await parseRateXlsx(big, toColumnMapping(mapping))).problems[0].message).toMatch(/larger than 2 MB/);
    const many = await workbook([HEAD, ...Array.from({ length: UPLOAD_LIMITS.rows + 1 }, (_, i) => [i / 1e6, 1, 60])]);
    expect(many.byteLength).toBeLessThan(UPLOAD_LIMITS.bytes);
    expect((await parseRateXlsx(many, toColumnMapping(mapping))).problems[0].message).toBe("The file has 20,001 rows; at most 20,000 are accepted");
    const csvBytes = new TextEncoder().encode("X,rate\n0,1\n");
    expect((await parseRateXlsx(csvBytes, toColumnMapping(mapping))).problems[0].message).toBe("The file is not a readable XLSX workbook");
  }, 60_000); // writing and reading a 20,001-row workbook takes seconds on a busy machine
});

describe("first guess of the column mapping", () => {
  it("reads roles and units from usual headers", async () => {
    const { guessMapping } = await import("@/lib/datasets/guess-mapping");
    expect(guessMapping(["X", "rate (mol/L/min)", "T (degC)", "operator"])).toEqual({
      columns: { X: "conversion", "rate (mol/L/min)": "rate", "T (degC)": "temperature", operator: "ignore" },
      units: { rate: "mol/(L min)", temperature: "degC" },
    });
    expect(guessMapping(["C_A (mmol/L)", "C_R (mmol/L)", "-rA (kmol/m3/h)", "T (K)"])).toEqual({
      columns: { "C_A (mmol/L)": "concA", "C_R (mmol/L)": "concR", "-rA (kmol/m3/h)": "rate", "T (K)": "temperature" },
      units: { concA: "mmol/L", concR: "mmol/L", rate: "kmol/(m3 h)", temperature: "K" },
    });
  });
});
