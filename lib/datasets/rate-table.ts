import Papa from "papaparse";

/** What a column of an uploaded table holds. */
export type ColumnRole = "conversion" | "concA" | "rate" | "temperature" | "ignore";

export interface ColumnMapping {
  /** Header → role. Columns not listed are ignored. */
  columns: Record<string, ColumnRole>;
  /** SI factor and offset per role, e.g. rate in mol/(L·min) → 1000/60; temperature in °C → offset 273.15. */
  toSI?: Partial<Record<Exclude<ColumnRole, "ignore">, { factor?: number; offset?: number }>>;
}

export interface RowProblem {
  /** 1-based line in the file (the header is line 1). */
  line: number;
  column: string | null;
  message: string;
}

export interface ParsedRow {
  line: number;
  conversion?: number;
  concA?: number;
  rate: number;
  temperature?: number;
}

export interface ParsedTable {
  headers: string[];
  rows: ParsedRow[];
  problems: RowProblem[];
  /** Lines read, header excluded. */
  lineCount: number;
}

export const UPLOAD_LIMITS = { bytes: 2_000_000, rows: 20_000 };

/**
 * Reads a CSV of measured rates: every data line becomes a row or one or more problems
 * (missing value, not a number, negative or zero rate, conversion outside [0, 1), a conversion
 * or concentration that appears twice at one temperature). Nothing is stored here; the caller
 * shows the problems and lets the user fix the file.
 */
export function parseRateCsv(text: string, mapping: ColumnMapping): ParsedTable {
  if (text.length > UPLOAD_LIMITS.bytes) {
    return { headers: [], rows: [], lineCount: 0, problems: [{ line: 0, column: null, message: `The file is larger than ${UPLOAD_LIMITS.bytes / 1e6} MB` }] };
  }
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), { header: true, skipEmptyLines: "greedy", transformHeader: (h) => h.trim() });
  const headers = parsed.meta.fields ?? [];
  const problems: RowProblem[] = [];
  const roles = Object.entries(mapping.columns).filter(([, r]) => r !== "ignore") as [string, Exclude<ColumnRole, "ignore">][];
  for (const [header] of roles) if (!headers.includes(header)) problems.push({ line: 1, column: header, message: `No column "${header}" in the file` });
  if (!roles.some(([, r]) => r === "rate")) problems.push({ line: 1, column: null, message: "Choose the column that holds the measured rate" });
  if (!roles.some(([, r]) => r === "conversion" || r === "concA")) problems.push({ line: 1, column: null, message: "Choose a column of conversion or of the concentration of A" });
  if (problems.length) return { headers, rows: [], problems, lineCount: parsed.data.length };
  if (parsed.data.length > UPLOAD_LIMITS.rows) {
    return { headers, rows: [], lineCount: parsed.data.length, problems: [{ line: 0, column: null, message: `The file has ${parsed.data.length} rows; at most ${UPLOAD_LIMITS.rows}` }] };
  }

  const rows: ParsedRow[] = [];
  const seen = new Map<string, number>();
  parsed.data.forEach((record, i) => {
    const line = i + 2;
    const before = problems.length;
    const row: Partial<ParsedRow> = { line };
    for (const [header, role] of roles) {
      const raw = (record[header] ?? "").trim();
      if (raw === "") {
        problems.push({ line, column: header, message: "missing" });
        continue;
      }
      const n = Number(raw.replace(/\s/g, ""));
      if (!Number.isFinite(n)) {
        problems.push({ line, column: header, message: `"${raw}" is not a number` });
        continue;
      }
      const si = n * (mapping.toSI?.[role]?.factor ?? 1) + (mapping.toSI?.[role]?.offset ?? 0);
      if (role === "rate" && !(si > 0)) problems.push({ line, column: header, message: "the rate must be positive" });
      else if (role === "conversion" && !(si >= 0 && si < 1)) problems.push({ line, column: header, message: "conversion must be in [0, 1)" });
      else if ((role === "concA" || role === "temperature") && !(si > 0)) problems.push({ line, column: header, message: `${role === "concA" ? "the concentration" : "the temperature"} must be positive` });
      else row[role] = si;
    }
    if (problems.length > before) return;
    const x = row.conversion ?? row.concA!;
    const key = `${row.temperature ?? ""}|${x}`;
    const first = seen.get(key);
    if (first !== undefined) {
      problems.push({ line, column: null, message: `duplicate ${row.conversion !== undefined ? "conversion" : "concentration"} ${x} (first on line ${first})` });
      return;
    }
    seen.set(key, line);
    rows.push(row as ParsedRow);
  });
  return { headers, rows, problems, lineCount: parsed.data.length };
}
