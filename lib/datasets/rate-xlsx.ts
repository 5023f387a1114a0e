import ExcelJS from "exceljs";
import { tooLarge, UPLOAD_LIMITS, validateRecords, type Cell, type ColumnMapping, type ParsedTable, type RawRecord } from "./rate-table";

/** A worksheet cell's value as one of our cells: numbers and formula results count, text and dates do not. */
export function xlsxCell(value: ExcelJS.CellValue): Cell {
  if (value === null || value === undefined) return { kind: "empty" };
  if (typeof value === "number") return Number.isFinite(value) ? { kind: "number", value, text: String(value) } : { kind: "text", text: String(value) };
  if (typeof value === "string") return value.trim() === "" ? { kind: "empty" } : { kind: "text", text: value.trim() };
  if (typeof value === "boolean") return { kind: "text", text: String(value).toUpperCase() };
  if (value instanceof Date) return { kind: "date", text: value.toISOString().slice(0, 10) };
  if ("error" in value) return { kind: "error", text: value.error, message: `the cell holds the error ${value.error}` };
  if ("richText" in value) return xlsxCell(value.richText.map((r) => r.text).join(""));
  if ("hyperlink" in value) return xlsxCell(value.text);
  if ("formula" in value || "sharedFormula" in value) {
    const result = (value as ExcelJS.CellFormulaValue).result;
    if (result === undefined || result === null) {
      const f = (value as ExcelJS.CellFormulaValue).formula ?? (value as ExcelJS.CellSharedFormulaValue).sharedFormula;
      return { kind: "error", text: `=${f}`, message: "a formula without a saved result: open and save the workbook in a spreadsheet program first" };
    }
    return xlsxCell(result);
  }
  return { kind: "text", text: String(value) };
}

/**
 * Reads the first worksheet of an XLSX workbook of measured rates: row 1 holds the headers,
 * every later non-empty row is a data line (numbered as the worksheet numbers its rows).
 */
export async function parseRateXlsx(data: ArrayBuffer | Uint8Array, mapping: ColumnMapping): Promise<ParsedTable> {
  if (data.byteLength > UPLOAD_LIMITS.bytes) return { headers: [], rows: [], problems: [tooLarge(data.byteLength)], lineCount: 0, lines: [] };
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(data instanceof Uint8Array ? (data.buffer.slice(data.byteOffset, data.byteOffset + data.byteLength) as ArrayBuffer) : data);
  } catch {
    return { headers: [], rows: [], problems: [{ line: 0, column: null, message: "The file is not a readable XLSX workbook" }], lineCount: 0, lines: [] };
  }
  const sheet = workbook.worksheets[0];
  if (!sheet) return { headers: [], rows: [], problems: [{ line: 0, column: null, message: "The workbook has no worksheet" }], lineCount: 0, lines: [] };

  const headerRow = sheet.getRow(1);
  const columns: { index: number; header: string }[] = [];
  for (let c = 1; c <= sheet.columnCount; c++) {
    const cell = xlsxCell(headerRow.getCell(c).value);
    const header = cell.kind === "empty" ? "" : cell.kind === "number" ? cell.text : cell.text.trim();
    if (header) columns.push({ index: c, header });
  }
  const records: RawRecord[] = [];
  for (let r = 2; r <= sheet.rowCount; r++) {
    const row = sheet.getRow(r);
    const cells = Object.fromEntries(columns.map(({ index, header }) => [header, xlsxCell(row.getCell(index).value)]));
    if (Object.values(cells).every((c) => c.kind === "empty")) continue;
    records.push({ line: r, cells });
  }
  return validateRecords(
    columns.map((c) => c.header),
    records,
    mapping,
  );
}
