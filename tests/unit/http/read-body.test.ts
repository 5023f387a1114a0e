import { describe, expect, it } from "vitest";
import { z } from "zod";
import { AppError } from "@/lib/errors";
import { readJson } from "@/lib/http";
import { formatBytes, jsonBodyLimit, MAX_BODY_BYTES, SMALL_JSON_BYTES, SPEC_JSON_BYTES, UPLOAD_BYTES } from "@/lib/http/body-limits";
import path from "node:path";
import { pathToFileURL } from "node:url";

const schema = z.object({ name: z.string() });

/** A body that streams `chunks` chunks of `size` bytes without declaring its length, counting what was pulled. */
function streamingRequest(chunks: number, size: number, url = "http://127.0.0.1/api/projects") {
  let pulled = 0;
  const body = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (pulled >= chunks) return controller.close();
      pulled++;
      controller.enqueue(new Uint8Array(size).fill(0x20));
    },
  });
  const req = new Request(url, { method: "POST", body, duplex: "half", headers: { "content-type": "application/json" } } as RequestInit);
  return { req, pulled: () => pulled };
}

async function refusal(p: Promise<unknown>): Promise<AppError> {
  const err = await p.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(AppError);
  return err as AppError;
}

describe("readJson's body limit", () => {
  it("reads a body within the limit", async () => {
    const req = new Request("http://127.0.0.1/api/projects", { method: "POST", body: JSON.stringify({ name: "Ester line" }) });
    expect(await readJson(req, schema)).toEqual({ name: "Ester line" });
  });

  it("refuses a declared Content-Length above the limit with 413 naming the body, before reading it", async () => {
    const req = new Request("http://127.0.0.1/api/projects", { method: "POST", body: "{}", headers: { "content-length": String(50 * 1024 * 1024) } });
    const err = await refusal(readJson(req, schema));
    expect(err.status).toBe(413);
    expect(err.message).toBe("The request body is 50 MB; this request takes at most 64 KB");
    expect(err.fields).toEqual({ "(body)": ["At most 64 KB"] });
  });

  it("stops reading an undeclared body as soon as it passes the limit (the rest is never pulled)", async () => {
    const { req, pulled } = streamingRequest(800, 64 * 1024); // 50 MB if read to the end
    const err = await refusal(readJson(req, schema));
    expect(err.status).toBe(413);
    expect(err.message).toBe("The request body is too large; this request takes at most 64 KB");
    expect(pulled()).toBeLessThan(10);
  });

  it("accepts a body of exactly the limit and refuses one byte more", async () => {
    const exact = `{"name":"${"a".repeat(SMALL_JSON_BYTES - 11)}"}`;
    expect(new TextEncoder().encode(exact).byteLength).toBe(SMALL_JSON_BYTES);
    const ok = await readJson(new Request("http://127.0.0.1/api/projects", { method: "POST", body: exact }), schema);
    expect(ok.name.length).toBe(SMALL_JSON_BYTES - 11);
    const over = `{"name":"${"a".repeat(SMALL_JSON_BYTES - 10)}"}`;
    expect((await refusal(readJson(new Request("http://127.0.0.1/api/projects", { method: "POST", body: over }), schema))).status).toBe(413);
  });

  it("counts bytes, not characters", async () => {
    const body = `{"name":"${"é".repeat(SMALL_JSON_BYTES / 2)}"}`; // two bytes each
    expect((await refusal(readJson(new Request("http://127.0.0.1/api/projects", { method: "POST", body }), schema))).status).toBe(413);
  });

  it("gives sweep and kinetics routes the larger limit", async () => {
    const { req } = streamingRequest(20, 64 * 1024, "http://127.0.0.1/api/projects/p/sweeps"); // 1.25 MB of spaces: within 2 MB
    expect((await refusal(readJson(req, schema))).status).toBe(400); // read whole, then not JSON
    expect(jsonBodyLimit("/api/projects/p/sweeps")).toBe(SPEC_JSON_BYTES);
    expect(jsonBodyLimit("/api/projects/p/kinetics")).toBe(SPEC_JSON_BYTES);
    expect(jsonBodyLimit("/api/kinetics/m/versions")).toBe(SPEC_JSON_BYTES);
    expect(jsonBodyLimit("/api/kinetics/preview")).toBe(SPEC_JSON_BYTES);
    expect(jsonBodyLimit("/api/projects/p/rate")).toBe(SPEC_JSON_BYTES);
    expect(jsonBodyLimit("/api/projects/p")).toBe(SMALL_JSON_BYTES);
    expect(jsonBodyLimit("/api/team/invitations")).toBe(SMALL_JSON_BYTES);
  });

  it("answers malformed JSON and non-UTF-8 bytes with 400 naming the body", async () => {
    const bad = await refusal(readJson(new Request("http://127.0.0.1/api/projects", { method: "POST", body: "{name:" }), schema));
    expect(bad.status).toBe(400);
    expect(bad.fields).toEqual({ "(body)": ["Malformed JSON"] });
    const latin1 = await refusal(readJson(new Request("http://127.0.0.1/api/projects", { method: "POST", body: new Uint8Array([0x7b, 0xe9, 0x7d]) }), schema));
    expect(latin1.status).toBe(400);
    expect(latin1.fields).toEqual({ "(body)": ["Not UTF-8 text"] });
  });
});

describe("the limits", () => {
  it("fit under the largest body, which is what the proxy's body buffer holds (next.config.mjs)", async () => {
    expect(Math.max(SMALL_JSON_BYTES, SPEC_JSON_BYTES, UPLOAD_BYTES)).toBeLessThanOrEqual(MAX_BODY_BYTES);
    const nextConfig: unknown = (await import(/* @vite-ignore */ pathToFileURL(path.resolve("next.config.mjs")).href)).default;
    expect((nextConfig as { experimental?: { proxyClientMaxBodySize?: number } }).experimental?.proxyClientMaxBodySize).toBe(MAX_BODY_BYTES);
  });
  it("read as a user reads them", () => {
    expect(formatBytes(64 * 1024)).toBe("64 KB");
    expect(formatBytes(2 * 1024 * 1024)).toBe("2 MB");
    expect(formatBytes(1536 * 1024)).toBe("1.5 MB");
    expect(formatBytes(12)).toBe("12 bytes");
  });
});
