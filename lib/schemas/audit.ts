import { z } from "zod";
import { uuidSchema } from "./ids";
import { text } from "./text";

/** GET /api/audit: ?entityType=project&entityId=<uuid>, both optional. */
export const auditQuerySchema = z.strictObject({
  entityType: text()
    .max(60, "Use at most 60 characters")
    .regex(/^[a-z][a-z_]*$/, "Give a kind of record such as project, invitation or inventory_vessel")
    .optional(),
  entityId: uuidSchema.optional(),
});
export type AuditQuery = z.infer<typeof auditQuerySchema>;
