import { z } from "zod";
import { fileNameProblem } from "./text";

/** Largest inventory file read, bytes. */
export const MAX_INVENTORY_FILE_BYTES = 2_000_000;

/** The multipart form of an inventory upload: the file, and whether to write it (else a preview). */
export const inventoryImportFormSchema = z.strictObject({
  file: z
    .instanceof(File, { message: "Attach a .csv or .xlsx file" })
    .refine((f) => f.size > 0, "The file is empty")
    .refine((f) => f.size <= MAX_INVENTORY_FILE_BYTES, "The file is larger than 2 MB")
    .superRefine((f, ctx) => {
      const problem = fileNameProblem(f.name);
      if (problem) ctx.addIssue({ code: "custom", message: problem });
    }),
  accept: z.enum(["true", "false"], { error: "accept must be true or false" }).default("false"),
});
