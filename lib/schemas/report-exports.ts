import { z } from "zod";
import { candidateQuerySchema } from "./sweeps";

/** GET …/candidates/export: the ranked list's sort and filters, every page, as CSV or JSON. */
export const candidateExportQuerySchema = candidateQuerySchema.omit({ page: true, pageSize: true, include: true }).extend({
  format: z.enum(["csv", "json"], { error: "Choose CSV or JSON" }).default("csv"),
});
export type CandidateExportQuery = z.infer<typeof candidateExportQuerySchema>;
