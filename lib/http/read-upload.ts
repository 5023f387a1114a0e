import type { z } from "zod";
import type { Upload } from "@/lib/datasets/parse-upload";
import { uploadedTable, uploadFieldValues } from "@/lib/datasets/upload-parts";
import { parseWith } from "@/lib/http";
import { readMultipart } from "@/lib/multipart";

/**
 * Reads a multipart upload: the `file` part (CSV or XLSX, within the size limit, counted while
 * it streams in) and the text fields, `mapping` being JSON. Every refusal names the part: 400,
 * or 413 for a file over the limit.
 */
export async function readUpload<S extends z.ZodObject>(req: Request, fieldsSchema: S): Promise<{ upload: Omit<Upload, "mapping">; fields: z.output<S> }> {
  const form = await readMultipart(req, Object.keys(fieldsSchema.shape), "Choose a CSV or XLSX file");
  const upload = uploadedTable(form.file);
  const fields = parseWith(fieldsSchema, uploadFieldValues(form.fields));
  return { upload, fields };
}
