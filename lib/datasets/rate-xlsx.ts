import { UPLOAD_LIMITS } from "@/lib/schemas/upload-limits";
import { tooLarge, tooManyRows, validateRecords, type ColumnMapping, type ParsedTable, type RawRecord } from "./rate-table";
import { readFirstWorksheet } from "./xlsx-sheet";

const refused = (message: string, lineCount = 0): ParsedTable => ({ headers: [], rows: [], problems: [{ line: 0, column: null, message }], lineCount, lines: [] });

/**
 * Reads the first worksheet of an XLSX workbook of measured rates: row 1 holds the headers,
 * every later non-empty row is a data line (numbered as the worksheet numbers its rows).
 * Numbers and formula results count; text, dates and errors are problems of their cell.
 * The workbook is read within the upload limits (see readFirstWorksheet).
 */
export async function parseRateXlsx(data: ArrayBuffer | Uint8Array, mapping: ColumnMapping): Promise<ParsedTable> {
  if (data.byteLength > UPLOAD_LIMITS.bytes) return { headers: [], rows: [], problems: [tooLarge(data.byteLength)], lineCount: 0, lines: [] };
  const read = await readFirstWorksheet(data instanceof Uint8Array ? data : new Uint8Array(data));
  if ("refused" in read) return refused(read.refused);
  const { rows, dataRows } = read.sheet;
  if (dataRows > UPLOAD_LIMITS.rows) return refused(tooManyRows(dataRows), dataRows);

  const headerRow = rows[0]?.row === 1 ? rows[0].cells : new Map();
  const columns: { index: number; header: string }[] = [];
  for (const [index, cell] of [...headerRow.entries()].sort(([a], [b]) => a - b)) {
    const header = cell.kind === "empty" ? "" : cell.text.trim();
    if (header) columns.push({ index, header });
  }
  const records: RawRecord[] = [];
  for (const { row, cells } of rows) {
    if (row === 1) continue;
    const mine = columns.filter(({ index }) => cells.has(index));
    if (!mine.length) continue;
    records.push({ line: row, cells: Object.fromEntries(columns.map(({ index, header }) => [header, cells.get(index) ?? { kind: "empty" as const }])) });
  }
  return validateRecords(
    columns.map((c) => c.header),
    records,
    mapping,
  );
}
