import { posix } from "node:path";
import { SaxesParser, type SaxesTagPlain } from "saxes";
import { formatLimit, UPLOAD_LIMITS } from "@/lib/schemas/upload-limits";
import type { Cell } from "./rate-table";
import { toCell, type RawCell, type SheetContext } from "./xlsx-cell";
import { openWorkbookZip, UNREADABLE, WorkbookRefused, type WorkbookZip } from "./xlsx-zip";

/** A worksheet row that holds at least one value: its number and its cells by column (1-based). */
export interface SheetRow {
  row: number;
  cells: Map<number, Cell>;
}

export interface FirstSheet {
  /** Rows with a value, in sheet order; at most the row limit of data rows plus row 1 are kept. */
  rows: SheetRow[];
  /** Rows with a value below row 1, all counted (past the row limit they are counted, not kept). */
  dataRows: number;
}

export type SheetRead = { sheet: FirstSheet } | { refused: string };

/**
 * Reads the first worksheet of an XLSX workbook within the upload limits, streaming each part of
 * the archive through an XML parser: a part that inflates past its limit, a row or column number
 * past the sheet's bounds, too many filled cells or too much text stop the reading there, before
 * memory grows. Only rows that hold values are kept (a sheet whose one row is numbered 1,048,576
 * costs one row, and is refused by its number).
 */
export async function readFirstWorksheet(data: Uint8Array): Promise<SheetRead> {
  try {
    const zip = await openWorkbookZip(data);
    const book = await readWorkbook(zip);
    if (!book.sheetPath) return { refused: "The workbook has no worksheet" };
    const budget = { text: 0, cells: 0 };
    const strings = zip.has(book.stringsPath) ? await readSharedStrings(zip, book.stringsPath, budget) : [];
    const dateStyles = zip.has(book.stylesPath) ? await readDateStyles(zip, book.stylesPath) : new Set<number>();
    return { sheet: await readSheet(zip, book.sheetPath, { strings, dateStyles, date1904: book.date1904, budget }) };
  } catch (e) {
    if (e instanceof WorkbookRefused) return { refused: e.message };
    throw e;
  }
}

/** Streams one XML part of the archive through SAX handlers; malformed XML is an unreadable file. */
async function parsePart(zip: WorkbookZip, name: string, on: { open?: (tag: string, attrs: Record<string, string>) => void; text?: (t: string) => void; close?: (tag: string) => void }) {
  const parser = new SaxesParser({ xmlns: false });
  const local = (name: string) => name.slice(name.indexOf(":") + 1);
  parser.on("error", () => {
    throw new WorkbookRefused(UNREADABLE);
  });
  if (on.open) parser.on("opentag", (tag: SaxesTagPlain) => on.open!(local(tag.name), tag.attributes as Record<string, string>));
  if (on.text) {
    parser.on("text", on.text);
    parser.on("cdata", on.text);
  }
  if (on.close) parser.on("closetag", (tag: SaxesTagPlain) => on.close!(local(tag.name)));
  await zip.read(name, (text) => void parser.write(text));
  parser.close();
}

const attrEnding = (attrs: Record<string, string>, suffix: string) => Object.entries(attrs).find(([k]) => k === suffix || k.endsWith(`:${suffix}`))?.[1];

async function readWorkbook(zip: WorkbookZip) {
  let firstSheetRel: string | undefined;
  let date1904 = false;
  await parsePart(zip, "xl/workbook.xml", {
    open(tag, attrs) {
      if (tag === "workbookPr") date1904 = attrs.date1904 === "1" || attrs.date1904 === "true";
      if (tag === "sheet" && firstSheetRel === undefined) firstSheetRel = attrEnding(attrs, "id") ?? "";
    },
  });
  const targets = new Map<string, string>();
  const byType = new Map<string, string>();
  if (zip.has("xl/_rels/workbook.xml.rels")) {
    await parsePart(zip, "xl/_rels/workbook.xml.rels", {
      open(tag, attrs) {
        if (tag !== "Relationship" || !attrs.Target) return;
        const path = attrs.Target.startsWith("/") ? attrs.Target.slice(1) : posix.normalize(`xl/${attrs.Target}`);
        targets.set(attrs.Id, path);
        byType.set(String(attrs.Type).split("/").pop()!, path);
      },
    });
  }
  const sheetPath = firstSheetRel === undefined ? null : (targets.get(firstSheetRel) ?? "xl/worksheets/sheet1.xml");
  return { sheetPath: sheetPath && zip.has(sheetPath) ? sheetPath : null, date1904, stringsPath: byType.get("sharedStrings") ?? "xl/sharedStrings.xml", stylesPath: byType.get("styles") ?? "xl/styles.xml" };
}

function spendText(budget: { text: number }, chars: number) {
  budget.text += chars;
  if (budget.text > UPLOAD_LIMITS.textChars) throw new WorkbookRefused(`The workbook holds more than ${formatLimit(UPLOAD_LIMITS.textChars)} characters of text; it was not read`);
}
const tooManyCells = () => new WorkbookRefused(`The worksheet has more than ${formatLimit(UPLOAD_LIMITS.cells)} filled cells; split the file`);

/** The shared strings table; phonetic guides (rPh) are not part of the text. */
async function readSharedStrings(zip: WorkbookZip, path: string, budget: { text: number }): Promise<string[]> {
  const strings: string[] = [];
  let current: string | null = null;
  let inText = false;
  let inPhonetic = false;
  await parsePart(zip, path, {
    open(tag) {
      if (tag === "si") current = "";
      else if (tag === "rPh") inPhonetic = true;
      else if (tag === "t") inText = current !== null && !inPhonetic;
    },
    text(t) {
      if (!inText) return;
      spendText(budget, t.length);
      current += t;
    },
    close(tag) {
      if (tag === "t") inText = false;
      else if (tag === "rPh") inPhonetic = false;
      else if (tag === "si") {
        strings.push(current ?? "");
        current = null;
        if (strings.length > UPLOAD_LIMITS.cells) throw tooManyCells();
      }
    },
  });
  return strings;
}

/** Built-in number formats that show a date or time. */
const isBuiltInDate = (id: number) => (id >= 14 && id <= 22) || (id >= 27 && id <= 36) || (id >= 45 && id <= 47) || (id >= 50 && id <= 58);
/** A format code that shows a date or time: date letters outside quotes and brackets. */
const isDateCode = (code: string) => /[ymdhMsb]/.test(code.replace(/\[[^\]]*]/g, "").replace(/"[^"]*"/g, ""));

/** Indices of the cell styles whose number format is a date. */
async function readDateStyles(zip: WorkbookZip, path: string): Promise<Set<number>> {
  const codes = new Map<number, string>();
  const formats: number[] = [];
  let inCellXfs = false;
  await parsePart(zip, path, {
    open(tag, attrs) {
      if (tag === "numFmt") codes.set(Number(attrs.numFmtId), attrs.formatCode ?? "");
      else if (tag === "cellXfs") inCellXfs = true;
      else if (tag === "xf" && inCellXfs) {
        formats.push(Number(attrs.numFmtId ?? 0));
        if (formats.length > UPLOAD_LIMITS.cells) throw new WorkbookRefused(UNREADABLE);
      }
    },
    close(tag) {
      if (tag === "cellXfs") inCellXfs = false;
    },
  });
  const dates = new Set<number>();
  formats.forEach((id, i) => {
    const code = codes.get(id);
    if (code !== undefined ? isDateCode(code) : isBuiltInDate(id)) dates.add(i);
  });
  return dates;
}

/** Column letters as a spreadsheet shows them (28 → "AB"). */
const letters = (n: number): string => (n > 26 ? letters(Math.floor((n - 1) / 26)) : "") + String.fromCharCode(65 + ((n - 1) % 26));

/** Column number of a cell reference ("AB12" → 28); 0 when there is none. */
function columnOf(ref: string): number {
  let col = 0;
  for (const ch of ref.toUpperCase()) {
    const code = ch.charCodeAt(0);
    if (code < 65 || code > 90) break;
    col = col * 26 + code - 64;
    if (col > 1e6) break;
  }
  return col;
}

async function readSheet(zip: WorkbookZip, path: string, ctx: SheetContext): Promise<FirstSheet> {
  const rows: SheetRow[] = [];
  let dataRows = 0;
  let row: SheetRow | null = null;
  let lastRow = 0;
  let lastCol = 0;
  let cell: RawCell | null = null;
  let col = 0;
  let into: "value" | "formula" | "inline" | null = null;
  let inInline = false;
  let inPhonetic = false;
  const sharedFormulas = new Map<string, string>();

  await parsePart(zip, path, {
    open(tag, attrs) {
      if (tag === "row") {
        const n = attrs.r ? Number(attrs.r) : lastRow + 1;
        if (!Number.isInteger(n) || n < 1) throw new WorkbookRefused(UNREADABLE);
        if (n > UPLOAD_LIMITS.sheetRows) throw new WorkbookRefused(`The worksheet reaches row ${formatLimit(n)}; rows past ${formatLimit(UPLOAD_LIMITS.sheetRows)} are not read. Move the table to the top of the sheet`);
        row = { row: n, cells: new Map() };
        lastRow = n;
        lastCol = 0;
      } else if (tag === "c" && row) {
        col = attrs.r ? columnOf(attrs.r) : lastCol + 1;
        if (col < 1) throw new WorkbookRefused(UNREADABLE);
        if (col > UPLOAD_LIMITS.sheetColumns) throw new WorkbookRefused(`The worksheet has a cell in column ${letters(col)}; columns past ${letters(UPLOAD_LIMITS.sheetColumns)} are not read`);
        lastCol = col;
        cell = { type: attrs.t ?? "n", style: Number(attrs.s ?? 0) };
      } else if (cell) {
        if (tag === "v") into = "value";
        else if (tag === "f") {
          into = "formula";
          cell.formula ??= "";
          if (attrs.t === "shared" && attrs.si !== undefined) cell.sharedIndex = attrs.si;
        } else if (tag === "is") inInline = true;
        else if (tag === "rPh") inPhonetic = true;
        else if (tag === "t" && inInline && !inPhonetic) into = "inline";
      }
    },
    text(t) {
      if (!cell || !into) return;
      spendText(ctx.budget, t.length);
      if (into === "value") cell.value = (cell.value ?? "") + t;
      else if (into === "formula") cell.formula += t;
      else cell.inline = (cell.inline ?? "") + t;
    },
    close(tag) {
      if (tag === "v" || tag === "f" || tag === "t") into = null;
      else if (tag === "is") inInline = false;
      else if (tag === "rPh") inPhonetic = false;
      else if (tag === "c" && cell && row) {
        if (cell.sharedIndex !== undefined) {
          if (cell.formula) sharedFormulas.set(cell.sharedIndex, cell.formula);
          else cell.formula = sharedFormulas.get(cell.sharedIndex) ?? "";
        }
        const value = toCell(cell, ctx);
        if (value.kind !== "empty") {
          if (++ctx.budget.cells > UPLOAD_LIMITS.cells) throw tooManyCells();
          row.cells.set(col, value);
        }
        cell = null;
      } else if (tag === "row" && row) {
        if (row.cells.size) {
          if (row.row > 1) dataRows++;
          // Past the row limit rows are only counted, so the message can say how many there are.
          if (dataRows <= UPLOAD_LIMITS.rows) rows.push(row);
        }
        row = null;
      }
    },
  });
  return { rows, dataRows };
}
