import { AppError } from "@/lib/errors";
import type { DatasetMapping } from "@/lib/schemas/datasets";
import { parseRateCsv, type ColumnMapping, type ParsedTable } from "./rate-table";
import { parseRateXlsx } from "./rate-xlsx";
import { datasetUnit, DEFAULT_UNITS, VALUE_ROLES } from "./units";

export type UploadFormat = "csv" | "xlsx";

/** What the user sent: the file's name and bytes, and how to read its columns. */
export interface Upload {
  fileName: string;
  format: UploadFormat;
  bytes: Uint8Array;
  mapping: DatasetMapping;
}

/** The format from the file name; null for anything we do not read. */
export function formatOf(fileName: string): UploadFormat | null {
  const ext = /\.([a-z0-9]+)$/i.exec(fileName)?.[1]?.toLowerCase();
  return ext === "csv" || ext === "txt" ? "csv" : ext === "xlsx" ? "xlsx" : null;
}

export const NOT_A_TABLE = "This file is not a CSV or Excel table";

/**
 * Whether the bytes of a .csv/.txt upload can be a text table: no NUL byte, valid UTF-8 and a
 * delimiter (comma, semicolon or tab) in the header line. A picture or archive renamed .csv would
 * otherwise be split into "rows" of noise and reported as lines read.
 */
export function isTextTable(bytes: Uint8Array): boolean {
  if (bytes.includes(0)) return false;
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return false;
  }
  const header = text.replace(/^\uFEFF/, "").split(/\r?\n/, 1)[0] ?? "";
  return /[,;\t]/.test(header);
}

/** The user's unit choices as SI factor and offset per role (roles without a choice use the defaults). */
export function toColumnMapping(m: DatasetMapping): ColumnMapping {
  const toSI: ColumnMapping["toSI"] = {};
  for (const role of VALUE_ROLES) {
    const def = datasetUnit(role, m.units[role] ?? DEFAULT_UNITS[role])!;
    toSI[role] = { factor: def.factor, offset: def.offset ?? 0 };
  }
  return { columns: m.columns, toSI };
}

/**
 * Parses an upload of either format with the one row validator. A file refused as a whole (over
 * a limit, not a workbook) is a 400 naming the file; problems of rows and of the mapping come back
 * for the preview to show.
 */
export async function parseUpload(u: Upload): Promise<ParsedTable> {
  const mapping = toColumnMapping(u.mapping);
  const t = u.format === "xlsx" ? await parseRateXlsx(u.bytes, mapping) : parseRateCsv(new TextDecoder("utf-8").decode(u.bytes), mapping);
  const whole = t.problems.filter((p) => p.line === 0).map((p) => p.message);
  if (whole.length) throw new AppError("bad_request", whole.join("; "), { fields: { file: whole } });
  return t;
}

/** A stored row: SI values only, without the line number (the shape the fitting reads). */
export function storedRow(r: { conversion?: number; concA?: number; concR?: number; temperature?: number; rate: number }): Record<string, number> {
  const out: Record<string, number> = {};
  for (const k of ["conversion", "concA", "concR", "temperature"] as const) if (r[k] !== undefined) out[k] = r[k];
  out.rate = r.rate;
  return out;
}
