import busboy from "busboy";
import { AppError } from "@/lib/errors";
import { fileNameProblem } from "@/lib/schemas/text";
import { fileTooLarge } from "@/lib/http/read-body";
import { UPLOAD_BODY_BYTES, UPLOAD_LIMITS } from "@/lib/schemas/upload-limits";

/** Longest single text field, bytes. */
const FIELD_BYTES = 64_000;

export interface MultipartUpload {
  /** The one file part, read whole (it is within the size limit). */
  file: { name: string; bytes: Uint8Array };
  /** The text parts by name. */
  fields: Record<string, string>;
}

const bad = (part: string, message: string) => new AppError("bad_request", message, { fields: { [part]: [message] } });

/**
 * Reads a multipart/form-data body with one file part (`file`) and the named text parts, within
 * bounds: a declared Content-Length over the limit is refused before any byte is read, and the
 * bytes are counted while streaming so reading stops at the limit (413 naming the file) whatever
 * the sender declares. Malformed forms, parts without a name, a file where text is expected (or
 * text where the file is expected), unknown parts and a missing file are 400s naming the part.
 */
export async function readMultipart(req: Request, textFields: readonly string[], fileHint: string): Promise<MultipartUpload> {
  const contentType = req.headers.get("content-type") ?? "";
  const formHint = `Send the form as multipart/form-data with the parts file and ${textFields.join(", ")}`;
  if (!/^multipart\/form-data\s*;/i.test(contentType) || !/;\s*boundary=/i.test(contentType)) throw bad("(body)", formHint);

  const maxBody = UPLOAD_BODY_BYTES;
  const declared = Number(req.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > maxBody) throw fileTooLarge();
  if (!req.body) throw bad("file", fileHint);

  // busboy signals "limit" on reaching fileSize, so one byte more than allowed is what trips it.
  let parser: busboy.Busboy;
  try {
    parser = busboy({
      headers: { "content-type": contentType },
      limits: { fileSize: UPLOAD_LIMITS.bytes + 1, files: 2, fields: textFields.length + 4, parts: textFields.length + 6, fieldSize: FIELD_BYTES, fieldNameSize: 200 },
    });
  } catch {
    throw bad("(body)", formHint);
  }

  // Set by the parser's events while the body streams in; the first refusal wins.
  const state: { failure: AppError | null } = { failure: null };
  const fail = (e: AppError) => void (state.failure ??= e);
  const fields: Record<string, string> = {};
  let file: { name: string; chunks: Buffer[]; size: number } | null = null;
  let part = 0;

  parser.on("file", (name, stream, info) => {
    part++;
    // A body that ends inside the file errors its stream as well as the form: one refusal, below.
    stream.on("error", () => fail(bad("(body)", `The form is incomplete or malformed. ${formHint}`)));
    if (!name) fail(bad("(body)", `Part ${part} of the form has no name`));
    else if (name !== "file") fail(textFields.includes(name) ? bad(name, `${name} must be text, not a file`) : bad(name, `Unknown part ${name}`));
    else if (file) fail(bad("file", "Send one file at a time"));
    if (state.failure) return void stream.resume();
    const mine = { name: info.filename ?? "", chunks: [] as Buffer[], size: 0 };
    file = mine;
    stream.on("data", (chunk: Buffer) => {
      mine.size += chunk.length;
      if (!state.failure) mine.chunks.push(chunk);
    });
    stream.on("limit", () => fail(fileTooLarge()));
  });
  parser.on("field", (name, value, info) => {
    part++;
    if (!name) fail(bad("(body)", `Part ${part} of the form has no name`));
    else if (name === "file") fail(bad("file", fileHint));
    else if (!textFields.includes(name)) fail(bad(name, `Unknown part ${name}`));
    else if (info.valueTruncated) fail(bad(name, `${name} is longer than ${FIELD_BYTES / 1000} kB`));
    else if (name in fields) fail(bad(name, `${name} is sent twice`));
    else fields[name] = value;
  });
  const expected = ["file", ...textFields].join(", ");
  for (const event of ["partsLimit", "filesLimit", "fieldsLimit"] as const) parser.on(event, () => fail(bad("(body)", `The form has more parts than ${expected}`)));
  const done = new Promise<void>((resolve) => {
    parser.on("close", resolve);
    parser.on("error", () => {
      fail(bad("(body)", `The form is incomplete or malformed. ${formHint}`));
      resolve();
    });
  });

  const reader = req.body.getReader();
  let received = 0;
  try {
    for (;;) {
      const { done: end, value } = await reader.read();
      if (end) break;
      received += value.byteLength;
      if (received > maxBody) fail(fileTooLarge());
      if (state.failure) break;
      await new Promise<void>((resolve) => parser.write(value, () => resolve()));
      if (state.failure) break;
    }
  } catch {
    fail(bad("(body)", `The form could not be read to its end. ${formHint}`));
  }
  if (state.failure) {
    // Stop reading: nothing more of this body is wanted.
    await reader.cancel().catch(() => undefined);
    parser.destroy();
    throw state.failure;
  }
  parser.end();
  await done;
  if (state.failure) throw state.failure;
  const got = file as { name: string; chunks: Buffer[]; size: number } | null;
  if (!got) throw bad("file", fileHint);
  // The file name is stored with the upload: the same text rules as every other stored text.
  const nameProblem = fileNameProblem(got.name);
  if (nameProblem) throw bad("file", nameProblem);
  return { file: { name: got.name, bytes: new Uint8Array(Buffer.concat(got.chunks, got.size)) }, fields };
}
