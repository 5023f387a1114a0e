import type { Cell } from "./rate-table";

/** What a cell's value needs from the rest of the workbook, and the budget its reading spends. */
export interface SheetContext {
  strings: string[];
  dateStyles: Set<number>;
  date1904: boolean;
  budget: { text: number; cells: number };
}

/** A worksheet cell (`<c>`) as read: its type and style, and the text of its value, formula and in-cell string. */
export interface RawCell {
  type: string;
  style: number;
  value?: string;
  formula?: string;
  sharedIndex?: string;
  inline?: string;
}

const trimmedText = (text: string): Cell => (text.trim() === "" ? { kind: "empty" } : { kind: "text", text: text.trim() });
const errorCell = (code: string): Cell => ({ kind: "error", text: code, message: `the cell holds the error ${code}` });

/** A serial day number as a date (days since 1899-12-30, or since 1904-01-01 in 1904 workbooks). */
function dateCell(serial: number, date1904: boolean): Cell {
  const date = new Date(Math.round((serial - 25569 + (date1904 ? 1462 : 0)) * 86_400_000));
  return Number.isFinite(date.getTime()) ? { kind: "date", text: date.toISOString().slice(0, 10) } : { kind: "text", text: String(serial) };
}

function numberCell(text: string, style: number, ctx: SheetContext): Cell {
  const value = parseFloat(text);
  if (!Number.isFinite(value)) return trimmedText(text);
  return ctx.dateStyles.has(style) ? dateCell(value, ctx.date1904) : { kind: "number", value, text: String(value) };
}

/** One cell as the file holds it: numbers, text, dates (by the cell's number format), errors, formula results. */
export function toCell(c: RawCell, ctx: SheetContext): Cell {
  if (c.formula !== undefined) {
    // A formula's saved result counts; without one there is nothing to read.
    if (!c.value) return { kind: "error", text: `=${c.formula}`, message: "a formula without a saved result: open and save the workbook in a spreadsheet program first" };
    if (c.type === "str") return trimmedText(c.value);
    if (c.type === "b") return { kind: "text", text: parseInt(c.value, 10) !== 0 ? "TRUE" : "FALSE" };
    if (c.type === "e") return errorCell(c.value);
    return numberCell(c.value, c.style, ctx);
  }
  switch (c.type) {
    case "s": {
      if (c.value === undefined) return { kind: "empty" };
      const s = ctx.strings[parseInt(c.value, 10)];
      return s === undefined ? { kind: "empty" } : trimmedText(s);
    }
    case "inlineStr":
      return trimmedText(c.inline ?? c.value ?? "");
    case "str":
      return trimmedText(c.value ?? "");
    case "b":
      return c.value === undefined ? { kind: "empty" } : { kind: "text", text: parseInt(c.value, 10) !== 0 ? "TRUE" : "FALSE" };
    case "e":
      return c.value === undefined ? { kind: "empty" } : errorCell(c.value);
    case "d":
      return c.value === undefined ? { kind: "empty" } : { kind: "date", text: c.value.slice(0, 10) };
    default:
      return c.value === undefined ? { kind: "empty" } : numberCell(c.value, c.style, ctx);
  }
}
