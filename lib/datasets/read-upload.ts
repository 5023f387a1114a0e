import type { z } from "zod";
import { AppError } from "@/lib/errors";
import { parseWith } from "@/lib/http";
import { readMultipart } from "@/lib/multipart";
import { formatOf, isTextTable, NOT_A_TABLE, type Upload } from "./parse-upload";

const bad = (field: string, message: string) => new AppError("bad_request", message, { fields: { [field]: [message] } });

/**
 * Reads a multipart upload: the `file` part (CSV or XLSX, within the size limit, counted while
 * it streams in) and the text fields, `mapping` being JSON. Every refusal names the part: 400,
 * or 413 for a file over the limit.
 */
export async function readUpload<S extends z.ZodObject>(req: Request, fieldsSchema: S): Promise<{ upload: Omit<Upload, "mapping">; fields: z.output<S> }> {
  const form = await readMultipart(req, Object.keys(fieldsSchema.shape), "Choose a CSV or XLSX file");
  const { file } = form;
  const format = formatOf(file.name);
  if (!format) throw bad("file", `"${file.name}" is neither a .csv nor an .xlsx file`);
  if (file.bytes.byteLength === 0) throw bad("file", "The file is empty");
  if (format === "csv" && !isTextTable(file.bytes)) throw bad("file", `${NOT_A_TABLE}: "${file.name}" holds no rows of text separated by commas, semicolons or tabs`);

  const raw: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(form.fields)) {
    if (key === "mapping") {
      try {
        raw.mapping = JSON.parse(value);
      } catch {
        throw bad("mapping", "The mapping must be JSON: { columns: { header: role }, units: { role: unit } }");
      }
    } else raw[key] = value;
  }
  const fields = parseWith(fieldsSchema, raw);
  return { upload: { fileName: file.name.slice(0, 255), format, bytes: file.bytes }, fields };
}
