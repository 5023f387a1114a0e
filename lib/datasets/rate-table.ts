import Papa from "papaparse";
import { formatLimit, UPLOAD_LIMITS } from "@/lib/schemas/upload-limits";
import type { ColumnRole, ValueRole } from "./units";

export type { ColumnRole } from "./units";

export interface ColumnMapping {
  /** Header → role. Columns not listed are ignored. */
  columns: Record<string, ColumnRole>;
  /** SI factor and offset per role, e.g. rate in mol/(L·min) → 1000/60; temperature in °C → offset 273.15. */
  toSI?: Partial<Record<ValueRole, { factor?: number; offset?: number }>>;
}

export interface RowProblem {
  /** 1-based line in the file or row of the worksheet (the header is line 1); 0 for the whole file. */
  line: number;
  column: string | null;
  message: string;
}

export interface ParsedRow {
  line: number;
  conversion?: number;
  concA?: number;
  concR?: number;
  rate: number;
  temperature?: number;
}

/** One data line as read, for showing bad rows beside good ones: header → text of the cell. */
export interface RawLine {
  line: number;
  cells: Record<string, string>;
}

export interface ParsedTable {
  headers: string[];
  rows: ParsedRow[];
  problems: RowProblem[];
  /** Data lines read (blank lines and the header excluded). */
  lineCount: number;
  /** Every data line as text, in file order (empty when the file was refused as a whole). */
  lines: RawLine[];
}

/** A cell as the file holds it, before any unit: CSV gives numbers, text or nothing; XLSX also dates and errors. */
export type Cell =
  | { kind: "empty" }
  | { kind: "number"; value: number; text: string }
  | { kind: "text"; text: string }
  | { kind: "date"; text: string }
  | { kind: "error"; text: string; message: string };

/** A data line of either format: its line number and its cells by header. */
export interface RawRecord {
  line: number;
  cells: Record<string, Cell>;
}

export { UPLOAD_LIMITS } from "@/lib/schemas/upload-limits";

/** The one row-limit message of every upload. */
export const tooManyRows = (n: number) => `The file has ${formatLimit(n)} rows; at most ${formatLimit(UPLOAD_LIMITS.rows)} are accepted`;

export const tooLarge = (bytes: number): RowProblem => ({ line: 0, column: null, message: `The file is ${(bytes / 1e6).toFixed(1)} MB; it is larger than ${UPLOAD_LIMITS.bytes / 1e6} MB` });

const refused = (headers: string[], problems: RowProblem[], lineCount = 0): ParsedTable => ({ headers, rows: [], problems, lineCount, lines: [] });

export function cellText(c: Cell): string {
  return c.kind === "empty" ? "" : c.text;
}

/**
 * The one validator behind every format: checks the mapping against the headers, then turns
 * each record into an SI row or into one or more problems (missing value, not a number, a
 * date or error cell, non-positive rate, concentration or temperature, conversion outside
 * [0, 1), a conversion or concentration of A seen twice at one temperature).
 */
export function validateRecords(headers: string[], records: RawRecord[], mapping: ColumnMapping): ParsedTable {
  const problems: RowProblem[] = [];
  const roles = Object.entries(mapping.columns).filter(([, r]) => r !== "ignore") as [string, ValueRole][];
  for (const [header] of roles) if (!headers.includes(header)) problems.push({ line: 1, column: header, message: `No column "${header}" in the file` });
  for (const role of new Set(roles.map(([, r]) => r))) {
    const named = roles.filter(([, r]) => r === role).map(([h]) => h);
    if (named.length > 1) problems.push({ line: 1, column: named[1], message: `Only one column may hold ${role}; "${named.join('" and "')}" both do` });
  }
  if (!roles.some(([, r]) => r === "rate")) problems.push({ line: 1, column: null, message: "Choose the column that holds the measured rate" });
  if (!roles.some(([, r]) => r === "conversion" || r === "concA")) problems.push({ line: 1, column: null, message: "Choose a column of conversion or of the concentration of A" });
  if (problems.length) return refused(headers, problems, records.length);
  if (records.length > UPLOAD_LIMITS.rows) return refused(headers, [{ line: 0, column: null, message: tooManyRows(records.length) }], records.length);

  const rows: ParsedRow[] = [];
  const seen = new Map<string, number>();
  for (const record of records) {
    const { line } = record;
    const before = problems.length;
    const row: Partial<ParsedRow> = { line };
    for (const [header, role] of roles) {
      const message = cellProblem(record.cells[header] ?? { kind: "empty" }, role, mapping, (si) => (row[role] = si));
      if (message) problems.push({ line, column: header, message });
    }
    if (problems.length > before) continue;
    const x = row.conversion ?? row.concA!;
    const key = `${row.temperature ?? ""}|${x}`;
    const first = seen.get(key);
    if (first !== undefined) {
      problems.push({ line, column: null, message: `duplicate ${row.conversion !== undefined ? "conversion" : "concentration of A"} ${x} at one temperature (first on line ${first})` });
      continue;
    }
    seen.set(key, line);
    rows.push(row as ParsedRow);
  }
  const lines = records.map((r) => ({ line: r.line, cells: Object.fromEntries(headers.map((h) => [h, cellText(r.cells[h] ?? { kind: "empty" })])) }));
  return { headers, rows, problems, lineCount: records.length, lines };
}

/** Why a cell cannot be used, or null after handing its SI value to `accept`. */
function cellProblem(cell: Cell, role: ValueRole, mapping: ColumnMapping, accept: (si: number) => void): string | null {
  switch (cell.kind) {
    case "empty":
      return "missing";
    case "text":
      return `"${cell.text}" is not a number`;
    case "date":
      return `${cell.text} is a date, not a number`;
    case "error":
      return cell.message;
  }
  const si = cell.value * (mapping.toSI?.[role]?.factor ?? 1) + (mapping.toSI?.[role]?.offset ?? 0);
  if (role === "rate" && !(si > 0)) return "the rate must be positive";
  if (role === "conversion" && !(si >= 0 && si < 1)) return "conversion must be in [0, 1)";
  if ((role === "concA" || role === "temperature") && !(si > 0)) return `${role === "concA" ? "the concentration" : "the temperature"} must be positive`;
  if (role === "concR" && !(si >= 0)) return "the product concentration must not be negative";
  accept(si);
  return null;
}

/** A CSV cell: blank, a number (spaces inside ignored, as in "1 200"), or text. */
function csvCell(raw: string | undefined): Cell {
  const text = (raw ?? "").trim();
  if (text === "") return { kind: "empty" };
  const value = Number(text.replace(/\s/g, ""));
  return Number.isFinite(value) ? { kind: "number", value, text } : { kind: "text", text };
}

/** Reads a CSV of measured rates (first line = headers). Nothing is stored here. */
export function parseRateCsv(text: string, mapping: ColumnMapping): ParsedTable {
  if (text.length > UPLOAD_LIMITS.bytes) return refused([], [tooLarge(text.length)]);
  let headers: string[] | null = null;
  const records: RawRecord[] = [];
  let count = 0;
  let line = 0;
  // Row by row: past the row limit lines are only counted (for the message), not kept.
  // Line numbers count blank lines too, so they match what the user sees in an editor.
  Papa.parse<string[]>(text.replace(/^\uFEFF/, ""), {
    header: false,
    skipEmptyLines: false,
    step: ({ data: fields }) => {
      line++;
      if (headers === null) return void (headers = fields.map((h) => h.trim()));
      if (fields.every((f) => f.trim() === "")) return;
      if (++count > UPLOAD_LIMITS.rows) return;
      const head = headers;
      records.push({ line, cells: Object.fromEntries(head.map((h, j) => [h, csvCell(fields[j])])) });
    },
  });
  const head: string[] = headers ?? [];
  if (count > UPLOAD_LIMITS.rows) return refused(head, [{ line: 0, column: null, message: tooManyRows(count) }], count);
  return validateRecords(head, records, mapping);
}
