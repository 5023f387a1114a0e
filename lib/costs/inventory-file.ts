import ExcelJS from "exceljs";
import Papa from "papaparse";
import { inventoryVesselSchema, type InventoryVesselInput } from "@/lib/schemas/inventory";
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

/** Reads records (header → text) into vessels, one problem per bad cell; row numbers count the header as 1. */
export function readInventoryRecords(records: Record<string, string>[]): ParsedInventory {
  const vessels: ParsedInventory["vessels"] = [];
  const problems: RowProblem[] = [];
  const seen = new Map<string, number>();
  records.forEach((raw, i) => {
    const row = i + 2;
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
  const out = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), { header: true, skipEmptyLines: "greedy" });
  return checkHeaders(out.meta.fields ?? [], () => readInventoryRecords(out.data));
}

export async function parseInventoryXlsx(data: ArrayBuffer): Promise<ParsedInventory> {
  const wb = new ExcelJS.Workbook();
  try {
    await wb.xlsx.load(data);
  } catch {
    return { vessels: [], problems: [{ row: 0, field: "file", message: "The file is not a readable XLSX workbook" }] };
  }
  const sheet = wb.worksheets[0];
  if (!sheet) return { vessels: [], problems: [{ row: 0, field: "file", message: "The workbook has no sheet" }] };
  const text = (c: ExcelJS.Cell) => (c.value === null || c.value === undefined ? "" : typeof c.value === "object" && "result" in c.value ? String(c.value.result ?? "") : c.text);
  const headers: string[] = [];
  sheet.getRow(1).eachCell({ includeEmpty: true }, (c, col) => (headers[col - 1] = text(c)));
  const records: Record<string, string>[] = [];
  for (let r = 2; r <= sheet.rowCount; r++) {
    const row = sheet.getRow(r);
    records.push(Object.fromEntries(headers.map((h, i) => [h, text(row.getCell(i + 1))])));
  }
  return checkHeaders(headers, () => readInventoryRecords(records));
}

function checkHeaders(headers: string[], read: () => ParsedInventory): ParsedInventory {
  const fields = new Set(headers.map(fieldOf));
  const missing = ["tag", "type", "volume"].filter((f) => !fields.has(f));
  if (missing.length) return { vessels: [], problems: missing.map((f) => ({ row: 1, field: f, message: `The header row has no "${f}" column` })) };
  return read();
}

/** Reads a CSV or XLSX file by its name. */
export async function parseInventoryFile(name: string, data: ArrayBuffer): Promise<ParsedInventory> {
  if (/\.xlsx$/i.test(name)) return parseInventoryXlsx(data);
  if (/\.(csv|txt)$/i.test(name)) return parseInventoryCsv(new TextDecoder().decode(data));
  return { vessels: [], problems: [{ row: 0, field: "file", message: "Upload a .csv or .xlsx file" }] };
}
