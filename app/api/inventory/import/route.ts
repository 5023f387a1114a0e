import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { json, parseWith, route } from "@/lib/http";
import { inventoryImportFormSchema } from "@/lib/schemas/inventory-import";
import { importInventory } from "@/lib/services/inventory";

/** Multipart upload of a CSV or XLSX of vessels: a preview with row problems, or (accept=true) the import. */
export const POST = route(async (req) => {
  const actor = await requireActor();
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw new AppError("bad_request", "Send the file as multipart/form-data", { fields: { file: ["Attach a .csv or .xlsx file"] } });
  }
  const input = parseWith(inventoryImportFormSchema, Object.fromEntries(form.entries()));
  const result = await importInventory(getDb(), actor, { name: input.file.name, data: await input.file.arrayBuffer() }, input.accept === "true");
  return json({ import: result }, result.accepted ? 201 : 200);
});
