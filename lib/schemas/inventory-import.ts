import { z } from "zod";

/** The text part of an inventory upload (multipart, beside `file`): whether to write it (else a preview). */
export const inventoryImportFieldsSchema = z.strictObject({
  accept: z.enum(["true", "false"], { error: "Choose whether to import the good rows" }).default("false"),
});
