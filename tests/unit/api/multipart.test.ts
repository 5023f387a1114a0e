import { describe, expect, it } from "vitest";
import { readMultipart } from "@/lib/multipart";
import { UPLOAD_LIMITS } from "@/lib/schemas/upload-limits";
import { refusal } from "../../helpers/refusal";

const BOUNDARY = "----seriatim-test-boundary";
const FIELDS = ["mapping", "name"] as const;

/** A multipart body written by hand, so each part can be as wrong as a hostile client makes it. */
function body(parts: { headers: string; content: string }[], close = true): string {
  return parts.map((p) => `--${BOUNDARY}\r\n${p.headers}\r\n\r\n${p.content}\r\n`).join("") + (close ? `--${BOUNDARY}--\r\n` : "");
}
const filePart = (content = "X,rate\n0,1\n", name = "file", fileName = "bench.csv") => ({ headers: `Content-Disposition: form-data; name="${name}"; filename="${fileName}"\r\nContent-Type: text/csv`, content });
const textPart = (name: string, content: string) => ({ headers: `Content-Disposition: form-data; name="${name}"`, content });

function post(text: string, headers: Record<string, string> = { "content-type": `multipart/form-data; boundary=${BOUNDARY}` }) {
  return new Request("http://127.0.0.1/api/upload", { method: "POST", headers, body: text });
}


/** A body of `total` bytes served in 64 kB chunks on demand; `pulled` counts what the reader took. */
function endlessBody(total: number) {
  const chunk = new Uint8Array(65_536).fill(0x61);
  const head = new TextEncoder().encode(`--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename="big.csv"\r\n\r\n`);
  const counter = { pulled: 0 };
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      const next = counter.pulled === 0 ? head : chunk;
      if (counter.pulled >= total) return controller.close();
      counter.pulled += next.byteLength;
      controller.enqueue(next);
    },
  });
  return { stream, counter };
}

describe("reading a multipart upload within bounds", () => {
  it("reads the file and the text parts of a well-formed form", async () => {
    const form = await readMultipart(post(body([textPart("mapping", "{}"), filePart(), textPart("name", "Bench")])), FIELDS, "Choose a CSV or XLSX file");
    expect(form.fields).toEqual({ mapping: "{}", name: "Bench" });
    expect(form.file.name).toBe("bench.csv");
    expect(new TextDecoder().decode(form.file.bytes)).toBe("X,rate\n0,1\n");
  });

  it("names the part at fault in a 400 for every malformed form", async () => {
    const cases: [Request, string, string][] = [
      [post("x", { "content-type": "multipart/form-data" }), "(body)", "Send the form as multipart/form-data with the parts file and mapping, name"],
      [post("{}", { "content-type": "application/json" }), "(body)", "Send the form as multipart/form-data with the parts file and mapping, name"],
      [post(body([{ headers: "Content-Disposition: form-data", content: "anonymous" }, filePart()])), "(body)", "Part 1 of the form has no name"],
      [post(body([filePart("{}", "mapping", "mapping.json"), filePart()])), "mapping", "mapping must be text, not a file"],
      [post(body([textPart("file", "X,rate")])), "file", "Choose a CSV or XLSX file"],
      [post(body([textPart("mapping", "{}")])), "file", "Choose a CSV or XLSX file"],
      [post(body([filePart(), textPart("colour", "blue")])), "colour", "Unknown part colour"],
      [post(body([filePart(), filePart()])), "file", "Send one file at a time"],
      [post(body([filePart(), textPart("name", "a"), textPart("name", "b")])), "name", "name is sent twice"],
      [post(body([filePart()], false)), "(body)", "The form is incomplete or malformed. Send the form as multipart/form-data with the parts file and mapping, name"],
    ];
    for (const [req, part, message] of cases) {
      const err = await refusal(readMultipart(req, FIELDS, "Choose a CSV or XLSX file"));
      expect([err.status, err.fields]).toEqual([400, { [part]: [message] }]);
    }
  });

  it("refuses a declared 50 MB body with a 413 naming the file before reading a byte of it", async () => {
    const { stream, counter } = endlessBody(50e6);
    const req = new Request("http://127.0.0.1/api/upload", {
      method: "POST",
      headers: { "content-type": `multipart/form-data; boundary=${BOUNDARY}`, "content-length": String(50e6) },
      body: stream,
      duplex: "half",
    } as RequestInit);
    const err = await refusal(readMultipart(req, FIELDS, "Choose a CSV or XLSX file"));
    expect([err.status, err.code, err.fields]).toEqual([413, "payload_too_large", { file: ["The file is larger than 2 MB"] }]);
    expect(counter.pulled).toBeLessThanOrEqual(65_536 * 2); // what the stream queued up front, nothing read on purpose
  });

  it("stops reading an undeclared 50 MB body at the limit, with flat memory", async () => {
    const { stream, counter } = endlessBody(50e6);
    const req = new Request("http://127.0.0.1/api/upload", { method: "POST", headers: { "content-type": `multipart/form-data; boundary=${BOUNDARY}` }, body: stream, duplex: "half" } as RequestInit);
    const before = process.memoryUsage().rss;
    const err = await refusal(readMultipart(req, FIELDS, "Choose a CSV or XLSX file"));
    expect([err.status, err.fields]).toEqual([413, { file: ["The file is larger than 2 MB"] }]);
    // Reading stopped within a few chunks of the limit (file + room for the text parts), far short of 50 MB.
    expect(counter.pulled).toBeLessThan(UPLOAD_LIMITS.bytes + 512_000);
    expect((process.memoryUsage().rss - before) / 1e6).toBeLessThan(100);
  });

  it("accepts a file of exactly the limit and refuses one byte more", async () => {
    const exact = "a".repeat(UPLOAD_LIMITS.bytes);
    const form = await readMultipart(post(body([filePart(exact)])), FIELDS, "Choose a CSV or XLSX file");
    expect(form.file.bytes.byteLength).toBe(UPLOAD_LIMITS.bytes);
    const err = await refusal(readMultipart(post(body([filePart(`${exact}a`)])), FIELDS, "Choose a CSV or XLSX file"));
    expect(err.status).toBe(413);
  });
});
