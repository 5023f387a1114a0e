import { z } from "zod";
import { UPLOAD_LIMITS } from "./upload-limits";

/** Largest inventory file read, bytes: the one limit of every upload. */
export const MAX_INVENTORY_FILE_BYTES = UPLOAD_LIMITS.bytes;

/** The text part of an inventory upload (multipart, beside `file`): whether to write it (else a preview). */
export const inventoryImportFieldsSchema = z.strictObject({
  accept: z.enum(["true", "false"], { error: "accept must be true or false" }).default("false"),
});
