import Papa from "papaparse";
import { AppError } from "@/lib/errors";
import { tooManyRows as rowLimitMessage, type Cell } from "@/lib/datasets/rate-table";
import { readFirstWorksheet } from "@/lib/datasets/xlsx-sheet";
import { inventoryVesselSchema, type InventoryVesselInput } from "@/lib/schemas/inventory";
import { UPLOAD_LIMITS } from "@/lib/schemas/upload-limits";
import { UNITS } from "@/lib/units/display";

/** A row of an inventory file that could not be read, with the column at fault. */
export interface RowProblem {
  /** 1-based row of the file, the header being row 1. */
  row: number;
  field: string;
  message: string;
}

export interface ParsedInventory {
  vessels: (InventoryVesselInput & { row: number })[];
  problems: RowProblem[];
}

/** Header spellings we read (lower-cased, spaces and underscores removed) → field. */
const HEADERS: Record<string, string> = {
  tag: "tag",
  type: "type",
  volume: "volume",
  unit: "unit",
  volumeunit: "unit",
  available: "available",
  reusecost: "reuseCost",
  cost: "reuseCost",
  location: "location",
  note: "note",
};

const VOLUME_UNITS: Record<string, number> = {
  m3: UNITS.volume.m3.factor,
  "m³": UNITS.volume.m3.factor,
  l: UNITS.volume.L.factor,
  gal: UNITS.volume.gal.factor,
  ft3: UNITS.volume.ft3.factor,
};

const YES = new Set(["yes", "y", "true", "1", "available"]);
const NO = new Set(["no", "n", "false", "0", "in use", "unavailable"]);

function fieldOf(header: string): string | null {
  return HEADERS[header.toLowerCase().replace(/[\s_()-]/g, "")] ?? null;
}

/** A volume cell ("2.5", "2500 L") with the row's unit column as the fallback unit, in m3. */
function volumeOf(cell: string, unitCell: string): { value?: number; problem?: { field: string; message: string } } {
  const m = /^\s*([0-9]*\.?[0-9]+(?:e[+-]?\d+)?)\s*([a-zA-Z³0-9]*)\s*$/.exec(cell.replace(/,/g, ""));
  if (!m) return { problem: { field: "volume", message: `"${cell}" is not a volume` } };
  const unit = (m[2] || unitCell || "m3").trim().toLowerCase();
  const factor = VOLUME_UNITS[unit];
  if (factor === undefined) return { problem: { field: m[2] ? "volume" : "unit", message: `Unknown volume unit "${unit}"; use m3, L, gal or ft3` } };
  return { value: Number(m[1]) * factor };
}

/** The whole file refused, named as the file's problem (row 0). */
const refusedFile = (message: string): ParsedInventory => ({ vessels: [], problems: [{ row: 0, field: "file", message }] });
const tooManyRows = (n: number) => refusedFile(rowLimitMessage(n));

/**
 * Reads records (header → text) into vessels, one problem per bad cell; row numbers count the
 * header as 1 (a record's own `rowOf` number when given, as a worksheet numbers its rows).
 */
export function readInventoryRecords(records: Record<string, string>[], rowOf: (i: number) => number = (i) => i + 2): ParsedInventory {
  const vessels: ParsedInventory["vessels"] = [];
  const problems: RowProblem[] = [];
  const seen = new Map<string, number>();
  records.forEach((raw, i) => {
    const row = rowOf(i);
    const cells: Record<string, string> = {};
    for (const [h, v] of Object.entries(raw)) {
      const f = fieldOf(h);
      if (f) cells[f] = String(v ?? "").trim();
    }
    if (Object.values(cells).every((v) => v === "")) return;
    const mine: RowProblem[] = [];
    const candidate: Record<string, unknown> = { tag: cells.tag ?? "", type: (cells.type ?? "").toUpperCase(), location: cells.location ?? "", note: cells.note ?? "" };
    const vol = volumeOf(cells.volume ?? "", cells.unit ?? "");
    if (vol.problem) mine.push({ row, ...vol.problem });
    else candidate.volume = vol.value;
    const avail = (cells.available ?? "").toLowerCase();
    if (avail === "" || YES.has(avail)) candidate.available = true;
    else if (NO.has(avail)) candidate.available = false;
    else mine.push({ row, field: "available", message: `"${cells.available}" is not yes or no` });
    const cost = (cells.reuseCost ?? "").replace(/[,\s]/g, "");
    if (cost === "") candidate.reuseCost = 0;
    else if (/^[0-9]*\.?[0-9]+$/.test(cost)) candidate.reuseCost = Number(cost);
    else mine.push({ row, field: "reuseCost", message: `"${cells.reuseCost}" is not a cost` });
    const parsed = inventoryVesselSchema.safeParse(candidate);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = String(issue.path[0] ?? "row");
        const covered = mine.some((p) => p.field === field) || (field === "volume" && vol.problem);
        if (!covered) mine.push({ row, field, message: issue.message });
      }
    }
    const tag = String(candidate.tag).toLowerCase();
    if (tag && seen.has(tag)) mine.push({ row, field: "tag", message: `Tag repeats row ${seen.get(tag)}` });
    else if (tag) seen.set(tag, row);
    if (mine.length || !parsed.success) problems.push(...mine);
    else vessels.push({ ...parsed.data, row });
  });
  return { vessels, problems };
}

export function parseInventoryCsv(text: string): ParsedInventory {
  if (text.length > UPLOAD_LIMITS.bytes) return refusedFile(`The file is larger than ${UPLOAD_LIMITS.bytes / 1e6} MB`);
  // Row by row, keeping no more than the limit: past it rows are only counted for the message.
  const records: Record<string, string>[] = [];
  let count = 0;
  let fields: string[] = [];
  Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), {
    header: true,
    skipEmptyLines: "greedy",
    step: (r) => {
      fields = r.meta.fields ?? fields;
      if (++count <= UPLOAD_LIMITS.rows) records.push(r.data);
    },
  });
  if (count > UPLOAD_LIMITS.rows) return tooManyRows(count);
  return checkHeaders(fields, () => readInventoryRecords(records));
}

/** A worksheet cell as the text the inventory reads (a formula without a saved result reads as blank). */
const cellText = (c: Cell | undefined) => (!c || c.kind === "empty" || (c.kind === "error" && c.text.startsWith("=")) ? "" : c.text);

/** Reads the first worksheet within the upload limits: row 1 the headers, later rows the vessels. */
export async function parseInventoryXlsx(data: ArrayBuffer | Uint8Array): Promise<ParsedInventory> {
  const read = await readFirstWorksheet(data instanceof Uint8Array ? data : new Uint8Array(data));
  if ("refused" in read) return refusedFile(read.refused === "The workbook has no worksheet" ? "The workbook has no sheet" : read.refused);
  const { rows, dataRows } = read.sheet;
  if (dataRows > UPLOAD_LIMITS.rows) return tooManyRows(dataRows);
  const head = rows[0]?.row === 1 ? rows[0].cells : new Map<number, Cell>();
  const width = Math.max(0, ...head.keys());
  const headers = Array.from({ length: width }, (_, i) => cellText(head.get(i + 1)));
  const body = rows.filter((r) => r.row > 1);
  const records = body.map((r) => Object.fromEntries(headers.map((h, i) => [h, cellText(r.cells.get(i + 1))])));
  return checkHeaders(headers, () => readInventoryRecords(records, (i) => body[i].row));
}

function checkHeaders(headers: string[], read: () => ParsedInventory): ParsedInventory {
  const fields = new Set(headers.map(fieldOf));
  const missing = ["tag", "type", "volume"].filter((f) => !fields.has(f));
  if (missing.length) return { vessels: [], problems: missing.map((f) => ({ row: 1, field: f, message: `The header row has no "${f}" column` })) };
  return read();
}

/** Reads a CSV or XLSX file by its name; a file refused as a whole (over a limit, unreadable) is a 400 naming the file. */
export async function parseInventoryFile(name: string, data: ArrayBuffer | Uint8Array): Promise<ParsedInventory> {
  const parsed = await readInventoryFile(name, data);
  const whole = parsed.problems.filter((p) => p.row === 0).map((p) => p.message);
  if (whole.length) throw new AppError("bad_request", whole.join("; "), { fields: { file: whole } });
  return parsed;
}

async function readInventoryFile(name: string, data: ArrayBuffer | Uint8Array): Promise<ParsedInventory> {
  if (data.byteLength > UPLOAD_LIMITS.bytes) return refusedFile(`The file is larger than ${UPLOAD_LIMITS.bytes / 1e6} MB`);
  if (/\.xlsx$/i.test(name)) return parseInventoryXlsx(data);
  if (/\.(csv|txt)$/i.test(name)) return parseInventoryCsv(new TextDecoder().decode(data));
  return { vessels: [], problems: [{ row: 0, field: "file", message: "Upload a .csv or .xlsx file" }] };
}
