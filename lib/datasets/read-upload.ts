import type { z } from "zod";
import { AppError } from "@/lib/errors";
import { parseWith } from "@/lib/http";
import { formatOf, type Upload } from "./parse-upload";
import { UPLOAD_LIMITS } from "./rate-table";

const bad = (field: string, message: string) => new AppError("bad_request", message, { fields: { [field]: [message] } });

/**
 * Reads a multipart upload: the `file` part (CSV or XLSX, within the size limit) and the text
 * fields, `mapping` being JSON. Every refusal is a 400 naming the field.
 */
export async function readUpload<S extends z.ZodObject>(req: Request, fieldsSchema: S): Promise<{ upload: Omit<Upload, "mapping">; fields: z.output<S> }> {
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw bad("(body)", "Send the file as multipart/form-data with the fields file and mapping");
  }
  const file = form.get("file");
  if (!file || typeof file === "string") throw bad("file", "Choose a CSV or XLSX file");
  const format = formatOf(file.name);
  if (!format) throw bad("file", `"${file.name}" is neither a .csv nor an .xlsx file`);
  if (file.size === 0) throw bad("file", "The file is empty");
  if (file.size > UPLOAD_LIMITS.bytes) throw bad("file", `The file is ${(file.size / 1e6).toFixed(1)} MB; at most ${UPLOAD_LIMITS.bytes / 1e6} MB are accepted`);

  const raw: Record<string, unknown> = {};
  for (const key of Object.keys(fieldsSchema.shape)) {
    const value = form.get(key);
    if (value === null) continue;
    if (typeof value !== "string") throw bad(key, `${key} must be text`);
    if (key === "mapping") {
      try {
        raw.mapping = JSON.parse(value);
      } catch {
        throw bad("mapping", "The mapping must be JSON: { columns: { header: role }, units: { role: unit } }");
      }
    } else raw[key] = value;
  }
  for (const key of form.keys()) if (key !== "file" && !(key in fieldsSchema.shape)) throw bad(key, `Unknown field ${key}`);
  const fields = parseWith(fieldsSchema, raw);
  return { upload: { fileName: file.name.slice(0, 255), format, bytes: new Uint8Array(await file.arrayBuffer()) }, fields };
}
