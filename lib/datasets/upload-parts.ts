import { AppError } from "@/lib/errors";
import { formatOf, isTextTable, NOT_A_TABLE, type Upload } from "./parse-upload";

const bad = (field: string, message: string) => new AppError("bad_request", message, { fields: { [field]: [message] } });

/** The uploaded file as a rate table to read: a .csv or .xlsx that holds something. Every refusal names the file part. */
export function uploadedTable(file: { name: string; bytes: Uint8Array }): Omit<Upload, "mapping"> {
  const format = formatOf(file.name);
  if (!format) throw bad("file", `"${file.name}" is neither a .csv nor an .xlsx file`);
  if (file.bytes.byteLength === 0) throw bad("file", "The file is empty");
  if (format === "csv" && !isTextTable(file.bytes)) throw bad("file", `${NOT_A_TABLE}: "${file.name}" holds no rows of text separated by commas, semicolons or tabs`);
  return { fileName: file.name.slice(0, 255), format, bytes: file.bytes };
}

/** The text parts of an upload as values to validate, `mapping` read as JSON. */
export function uploadFieldValues(fields: Record<string, string>): Record<string, unknown> {
  const raw: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(fields)) {
    if (key === "mapping") {
      try {
        raw.mapping = JSON.parse(value);
      } catch {
        throw bad("mapping", "The mapping must be JSON: { columns: { header: role }, units: { role: unit } }");
      }
    } else raw[key] = value;
  }
  return raw;
}
