import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { parseInventoryFile } from "@/lib/costs/inventory-file";
import { parseUpload, toColumnMapping } from "@/lib/datasets/parse-upload";
import type { Cell } from "@/lib/datasets/rate-table";
import { parseRateXlsx } from "@/lib/datasets/rate-xlsx";
import { readFirstWorksheet } from "@/lib/datasets/xlsx-sheet";
import { UPLOAD_LIMITS } from "@/lib/schemas/upload-limits";
import { inlineTextWorkbook, inventoryCsv, inventoryWorkbook, sparseLastRowWorkbook, workbookOf, zipBombWorkbook } from "../../helpers/crafted-uploads";
import { refusal } from "../../helpers/refusal";

const MAPPING = toColumnMapping({ columns: { h1: "conversion", h2: "rate" }, units: {} });
const MB = 1e6;

/**
 * Runs `work` while sampling this process's resident memory; returns the result, the largest
 * growth seen and the elapsed time. The bounds asserted on them are safety limits (the reads
 * these tests guard against took 150 s and 4 GB), far above what a correct read needs.
 */
async function watched<T>(work: () => Promise<T>): Promise<{ result: T; growthMB: number; seconds: number }> {
  globalThis.gc?.();
  const before = process.memoryUsage().rss;
  let peak = before;
  const timer = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 5);
  const t0 = performance.now();
  try {
    const result = await work();
    peak = Math.max(peak, process.memoryUsage().rss);
    return { result, growthMB: (peak - before) / MB, seconds: (performance.now() - t0) / 1000 };
  } finally {
    clearInterval(timer);
  }
}


describe("XLSX uploads crafted to exhaust the server are refused while reading", () => {
  it("refuses a 2 kB workbook whose one data row is numbered 1,048,576, without allocating the rows between", async () => {
    const bytes = sparseLastRowWorkbook();
    expect(bytes.byteLength).toBeLessThan(3000);
    const { result, growthMB, seconds } = await watched(() => parseRateXlsx(bytes, MAPPING));
    expect(result.problems).toEqual([{ line: 0, column: null, message: "The worksheet reaches row 1,048,576; rows past 100,000 are not read. Move the table to the top of the sheet" }]);
    expect(growthMB).toBeLessThan(100);
    expect(seconds).toBeLessThan(5);
    const inventory = await refusal(parseInventoryFile("vessels.xlsx", bytes));
    expect(inventory.status).toBe(400);
    expect(inventory.fields).toEqual({ file: ["The worksheet reaches row 1,048,576; rows past 100,000 are not read. Move the table to the top of the sheet"] });
  });

  it("stops a workbook of 100 MB of in-cell text packed into ~400 kB at the part limit, and 30 MB of it at the text limit", async () => {
    for (const [chars, message] of [
      [100 * MB, "A part of the workbook unpacks to more than 40 MB; it was not read"],
      [30 * MB, "The workbook holds more than 8,000,000 characters of text; it was not read"],
    ] as const) {
      const bytes = inlineTextWorkbook(chars);
      expect(bytes.byteLength).toBeLessThan(UPLOAD_LIMITS.bytes);
      const { result, growthMB, seconds } = await watched(() => refusal(parseInventoryFile("vessels.xlsx", bytes)));
      expect(result.fields).toEqual({ file: [message] });
      expect(growthMB).toBeLessThan(100);
      expect(seconds).toBeLessThan(5);
    }
  }, 60_000); // deflating the text in the test takes seconds

  it("stops a zip bomb while inflating: a part declared at its true 100 MB, and one whose archive claims 1 MB", async () => {
    for (const declared of [undefined, 1_000_000]) {
      const bytes = zipBombWorkbook(100 * MB, declared);
      expect(bytes.byteLength).toBeLessThan(UPLOAD_LIMITS.bytes);
      const { result, growthMB, seconds } = await watched(() => parseRateXlsx(bytes, MAPPING));
      expect(result.problems.map((p) => p.message)).toEqual(["A part of the workbook unpacks to more than 40 MB; it was not read"]);
      expect(growthMB).toBeLessThan(100);
      expect(seconds).toBeLessThan(5);
    }
  }, 60_000); // writing the 100 MB of blanks through deflate in the test takes seconds

  it("refuses columns past the last one read and more filled cells than the limit", async () => {
    const wide = workbookOf(['<row r="1"><c r="IW1"><v>1</v></c></row>']);
    expect((await parseRateXlsx(wide, MAPPING)).problems[0].message).toBe("The worksheet has a cell in column IW; columns past IV are not read");
    function* cells() {
      for (let r = 1; r <= 2_600; r++) yield `<row r="${r}">${Array.from({ length: 200 }, () => "<c><v>1</v></c>").join("")}</row>`;
    }
    const dense = workbookOf(cells());
    expect(dense.byteLength).toBeLessThan(UPLOAD_LIMITS.bytes);
    const { result, growthMB } = await watched(() => parseRateXlsx(dense, MAPPING));
    expect(result.problems[0].message).toBe("The worksheet has more than 500,000 filled cells; split the file");
    expect(growthMB).toBeLessThan(100);
  }, 30_000);

  it("holds the inventory to the one row limit, CSV and XLSX", async () => {
    const csv = await refusal(parseInventoryFile("vessels.csv", new TextEncoder().encode(inventoryCsv(25_000))));
    expect(csv.fields).toEqual({ file: ["The file has 25,000 rows; at most 20,000 are accepted"] });
    const xlsx = await refusal(parseInventoryFile("vessels.xlsx", inventoryWorkbook(25_000)));
    expect(xlsx.fields).toEqual({ file: ["The file has 25,000 rows; at most 20,000 are accepted"] });
    const atLimit = await parseInventoryFile("vessels.xlsx", inventoryWorkbook(UPLOAD_LIMITS.rows));
    expect(atLimit.problems).toEqual([]);
    expect(atLimit.vessels).toHaveLength(UPLOAD_LIMITS.rows);
    expect(atLimit.vessels.at(-1)).toMatchObject({ tag: "R-20000", row: 20_001, volume: 10 });
  }, 60_000);

  it("answers a rate-data upload refused as a whole with a 400 naming the file", async () => {
    const err = await refusal(parseUpload({ fileName: "bench.xlsx", format: "xlsx", bytes: sparseLastRowWorkbook(), mapping: { columns: { h1: "conversion", h2: "rate" }, units: {} } }));
    expect(err.status).toBe(400);
    expect(Object.keys(err.fields!)).toEqual(["file"]);
  });
});

/** The cell as exceljs reads it, by the rules the reader had before it streamed (the reference). */
function exceljsCell(value: ExcelJS.CellValue): Cell {
  if (value === null || value === undefined) return { kind: "empty" };
  if (typeof value === "number") return { kind: "number", value, text: String(value) };
  if (typeof value === "string") return value.trim() === "" ? { kind: "empty" } : { kind: "text", text: value.trim() };
  if (typeof value === "boolean") return { kind: "text", text: String(value).toUpperCase() };
  if (value instanceof Date) return { kind: "date", text: value.toISOString().slice(0, 10) };
  if ("error" in value) return { kind: "error", text: value.error, message: `the cell holds the error ${value.error}` };
  if ("richText" in value) return exceljsCell(value.richText.map((r) => r.text).join(""));
  if ("formula" in value || "sharedFormula" in value) {
    const f = value as ExcelJS.CellFormulaValue;
    if (f.result === undefined || f.result === null) return { kind: "error", text: `=${f.formula}`, message: "a formula without a saved result: open and save the workbook in a spreadsheet program first" };
    return exceljsCell(f.result as ExcelJS.CellValue);
  }
  return { kind: "text", text: String(value) };
}

describe("the streamed reader agrees with exceljs on every kind of cell", () => {
  it("reads numbers, text, rich text, booleans, dates by format, errors and formulas as exceljs does", async () => {
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet("kinds");
    ws.addRow(["X", "rate", "note"]);
    ws.addRow([0.1, 2.5, "  padded  "]);
    ws.addRow([1e-7, -3, { richText: [{ text: "rich " }, { font: { bold: true }, text: "text" }] }]);
    ws.addRow([true, false, new Date(Date.UTC(2026, 9, 14))]);
    ws.addRow([{ formula: "A2*2", result: 0.2 }, { formula: "1/0", result: { error: "#DIV/0!" } }, { formula: "B2" }]);
    ws.addRow([{ formula: "A2&\"x\"", result: "0.1x" }, { formula: "TODAY()", result: new Date(Date.UTC(2025, 0, 2)) }, { error: "#N/A" }]);
    ws.getCell("C8").value = 42; // a sparse row further down
    const dated = ws.getCell("A9");
    dated.value = 45_000;
    dated.numFmt = "yyyy-mm-dd";
    const bytes = new Uint8Array(await wb.xlsx.writeBuffer());

    const reference = new ExcelJS.Workbook();
    await reference.xlsx.load(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
    const sheet = reference.worksheets[0];
    const expected: [number, number, Cell][] = [];
    sheet.eachRow((row, r) => row.eachCell((cell, c) => void (exceljsCell(cell.value).kind !== "empty" && expected.push([r, c, exceljsCell(cell.value)]))));

    const read = await readFirstWorksheet(bytes);
    if ("refused" in read) throw new Error(read.refused);
    const got = read.sheet.rows.flatMap(({ row, cells }) => [...cells.entries()].map(([c, cell]) => [row, c, cell] as [number, number, Cell]));
    expect(got).toEqual(expected);
    expect(got.find(([r, c]) => r === 9 && c === 1)?.[2]).toEqual({ kind: "date", text: "2023-03-15" }); // serial 45000 = 2023-03-15 (common practice: days since 1899-12-30)
    expect(read.sheet.dataRows).toBe(7);
  });

  it("reads shared formulas, phonetic guides, prefixed tags, rows without numbers and 1904 dates as written by other programs", async () => {
    const strings = '<sst xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><si><t>rate</t></si><si><r><t>con</t></r><r><t>version</t></r><rPh sb="0" eb="1"><t>ignored</t></rPh></si></sst>';
    const styles =
      '<styleSheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><numFmts count="1"><numFmt numFmtId="164" formatCode="&quot;day&quot; 0.0"/></numFmts><cellStyleXfs count="1"><xf numFmtId="14"/></cellStyleXfs><cellXfs count="3"><xf numFmtId="0"/><xf numFmtId="14"/><xf numFmtId="164"/></cellXfs></styleSheet>';
    const workbook =
      '<x:workbook xmlns:x="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"><x:workbookPr date1904="1"/><x:sheets><x:sheet name="S" sheetId="1" r:id="rId1"/></x:sheets></x:workbook>';
    const rels =
      '<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet1.xml"/><Relationship Id="rId2" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/sharedStrings" Target="sharedStrings.xml"/><Relationship Id="rId3" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/styles" Target="/xl/styles.xml"/></Relationships>';
    const bytes = workbookOf(
      [
        '<row><c t="s"><v>1</v></c><c t="s"><v>0</v></c></row>', // no r attributes: row 1, columns A and B
        '<row r="3"><c r="A3"><v>0.5</v></c><c r="B3"><f t="shared" ref="B3:B4" si="0">A3*2</f><v>1</v></c></row>',
        '<row><c r="A4"><v>0.25</v></c><c r="B4"><f t="shared" si="0"/></c><c r="C4" s="1"><v>0</v></c><c r="D4" s="2"><v>3</v></c><c r="E4" t="d"><v>2026-03-01T00:00:00</v></c></row>',
      ],
      { "xl/sharedStrings.xml": [strings], "xl/styles.xml": [styles], "xl/workbook.xml": [workbook], "xl/_rels/workbook.xml.rels": [rels] },
    );
    const read = await readFirstWorksheet(bytes);
    if ("refused" in read) throw new Error(read.refused);
    const [head, r3, r4] = read.sheet.rows;
    expect([...head.cells.values()]).toEqual([
      { kind: "text", text: "conversion" },
      { kind: "text", text: "rate" },
    ]);
    expect(r3.row).toBe(3);
    expect(r3.cells.get(2)).toEqual({ kind: "number", value: 1, text: "1" });
    expect(r4.row).toBe(4);
    expect(r4.cells.get(2)).toEqual({ kind: "error", text: "=A3*2", message: "a formula without a saved result: open and save the workbook in a spreadsheet program first" });
    expect(r4.cells.get(3)).toEqual({ kind: "date", text: "1904-01-01" }); // serial 0 in the 1904 date system
    expect(r4.cells.get(4)).toEqual({ kind: "number", value: 3, text: "3" }); // quoted "day" is text, not a date format
    expect(r4.cells.get(5)).toEqual({ kind: "date", text: "2026-03-01" });
    const t = await parseRateXlsx(bytes, toColumnMapping({ columns: { conversion: "conversion", rate: "rate" }, units: {} }));
    expect(t.rows).toMatchObject([{ line: 3, conversion: 0.5 }]);
    expect(t.rows[0].rate).toBeCloseTo(1000 / 60, 12); // 1 mol/(L·min), the default unit, is 1000/60 mol/(m³·s) exactly
    expect(t.problems.map((p) => p.line)).toEqual([4]);
  });
});
