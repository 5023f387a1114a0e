import { AppError } from "@/lib/errors";
import { json, parseWith } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { readMultipart } from "@/lib/multipart";
import { inventoryImportFieldsSchema } from "@/lib/schemas/inventory-import";
import { importInventory } from "@/lib/services/inventory";

/** Multipart upload of a CSV or XLSX of vessels: a preview with row problems, or (accept=true) the import. */
export const POST = signedInRoute(async ({ req, actor, db }) => {
  const form = await readMultipart(req, ["accept"], "Attach a .csv or .xlsx file");
  if (form.file.bytes.byteLength === 0) throw new AppError("bad_request", "The file is empty", { fields: { file: ["The file is empty"] } });
  const input = parseWith(inventoryImportFieldsSchema, form.fields);
  const { bytes } = form.file;
  const data = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
  const result = await importInventory(db, actor, { name: form.file.name, data }, input.accept === "true");
  return json({ import: result }, result.accepted ? 201 : 200);
});
