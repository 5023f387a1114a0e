import { readdirSync, readFileSync, readlinkSync } from "node:fs";
import { request as httpRequest } from "node:http";
import { expect, test, type APIRequestContext } from "@playwright/test";
import { inlineTextWorkbook, inventoryCsv, inventoryWorkbook, sparseLastRowWorkbook, zipBombWorkbook } from "../helpers/crafted-uploads";
import { baseURL, signedInContext } from "./fixtures";
import { firstProjectId } from "./sweep-fixtures";

/**
 * Hostile uploads sent over HTTP to the production server: each is refused with a 4xx naming
 * the file or the limit, the server's memory stays flat, and the health route keeps answering
 * while it is read. Times and memory are safety limits (the reads guarded against took 150 s
 * and 4 GB); the machine is shared, so they are generous.
 */

const SAFETY_SECONDS = 5;
const SAFETY_GROWTH_MB = 100;
const ORIGIN = { Origin: baseURL };
const MAPPING = JSON.stringify({ columns: { h1: "conversion", h2: "rate" }, units: {} });
const XLSX = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

/** The pid of the process listening on the app's port, found through its socket (no guessing by name). */
function serverPid(): number {
  const port = Number(new URL(baseURL).port);
  const hexPort = port.toString(16).toUpperCase().padStart(4, "0");
  const inodes = new Set(
    readFileSync("/proc/net/tcp", "utf8")
      .split("\n")
      .slice(1)
      .map((l) => l.trim().split(/\s+/))
      .filter((f) => f[1]?.endsWith(`:${hexPort}`) && f[3] === "0A")
      .map((f) => f[9]),
  );
  for (const pid of readdirSync("/proc").filter((d) => /^\d+$/.test(d))) {
    let fds: string[];
    try {
      fds = readdirSync(`/proc/${pid}/fd`);
    } catch {
      continue;
    }
    for (const fd of fds) {
      try {
        const m = /^socket:\[(\d+)\]$/.exec(readlinkSync(`/proc/${pid}/fd/${fd}`));
        if (m && inodes.has(m[1])) return Number(pid);
      } catch {
        // a descriptor closed while we looked
      }
    }
  }
  throw new Error(`no process listens on port ${port}`);
}

const rssMB = (pid: number) => Number(/VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, "utf8"))![1]) / 1024;

/**
 * Sends one upload while sampling the server's memory and asking the health route every 100 ms;
 * returns the response with the peak memory growth, the elapsed time and the health answers.
 */
async function watched(health: APIRequestContext, send: () => Promise<{ status: number; body: unknown }>) {
  const pid = serverPid();
  const before = rssMB(pid);
  let peak = before;
  const sampler = setInterval(() => (peak = Math.max(peak, rssMB(pid))), 20);
  const answers: { status: number; seconds: number }[] = [];
  let sending = true;
  const poll = (async () => {
    while (sending) {
      const t = performance.now();
      const res = await health.get("/api/health", { timeout: 30_000 });
      answers.push({ status: res.status(), seconds: (performance.now() - t) / 1000 });
      await new Promise((r) => setTimeout(r, 100));
    }
  })();
  const t0 = performance.now();
  try {
    const response = await send();
    const seconds = (performance.now() - t0) / 1000;
    sending = false;
    await poll;
    return { ...response, seconds, growthMB: Math.max(peak, rssMB(pid)) - before, answers };
  } finally {
    sending = false;
    clearInterval(sampler);
  }
}

function expectBounded(r: Awaited<ReturnType<typeof watched>>) {
  // The figures go into the report beside the test, for the record; the assertions below are the safety limits.
  const slowestHealth = Math.max(...r.answers.map((a) => a.seconds));
  test.info().annotations.push({ type: "measured", description: `${r.status} in ${r.seconds.toFixed(2)} s, server memory +${r.growthMB.toFixed(1)} MB, ${r.answers.length} health answers, slowest ${slowestHealth.toFixed(2)} s` });
  console.log(`  measured: ${test.info().title}: ${r.status} in ${r.seconds.toFixed(2)} s, server memory +${r.growthMB.toFixed(1)} MB, ${r.answers.length} health answers, slowest ${slowestHealth.toFixed(2)} s`);
  expect(r.seconds).toBeLessThan(SAFETY_SECONDS);
  expect(r.growthMB).toBeLessThan(SAFETY_GROWTH_MB);
  expect(r.answers.length).toBeGreaterThan(0);
  for (const a of r.answers) expect([a.status, a.seconds < SAFETY_SECONDS]).toEqual([200, true]);
}

test.describe("uploads are read within bounds", () => {
  test.describe.configure({ mode: "serial" });
  let engineer: APIRequestContext;
  let health: APIRequestContext;
  let projectId: string;

  test.beforeAll(async () => {
    engineer = await signedInContext("engineer");
    health = await signedInContext("anonymous");
    projectId = await firstProjectId(engineer);
    // Load both routes once, so the memory measured below is the upload's, not the first import of the code.
    const warm = await engineer.post(`/api/projects/${projectId}/datasets/preview`, { headers: ORIGIN, multipart: { file: { name: "w.csv", mimeType: "text/csv", buffer: Buffer.from("h1,h2\n0,1\n") }, mapping: MAPPING } });
    expect(warm.status()).toBe(200);
    const warmInventory = await engineer.post("/api/inventory/import", { headers: ORIGIN, multipart: { file: { name: "w.csv", mimeType: "text/csv", buffer: Buffer.from("tag,type,volume\nW-1,CSTR,1\n") }, accept: "false" } });
    expect(warmInventory.status()).toBe(200);
  });
  test.afterAll(async () => {
    await engineer.dispose();
    await health.dispose();
  });

  const preview = (name: string, buffer: Buffer, mimeType = XLSX) => async () => {
    const res = await engineer.post(`/api/projects/${projectId}/datasets/preview`, { headers: ORIGIN, multipart: { file: { name, mimeType, buffer }, mapping: MAPPING }, timeout: 60_000 });
    return { status: res.status(), body: await res.json() };
  };
  const inventory = (name: string, buffer: Buffer, mimeType = XLSX) => async () => {
    const res = await engineer.post("/api/inventory/import", { headers: ORIGIN, multipart: { file: { name, mimeType, buffer }, accept: "true" }, timeout: 60_000 });
    return { status: res.status(), body: await res.json() };
  };

  test("a workbook whose one data row is numbered 1,048,576 is refused by its row number", async () => {
    const bytes = Buffer.from(sparseLastRowWorkbook());
    const message = "The worksheet reaches row 1,048,576; rows past 100,000 are not read. Move the table to the top of the sheet";
    for (const send of [preview("last-row.xlsx", bytes), inventory("last-row.xlsx", bytes)]) {
      const r = await watched(health, send);
      expect([r.status, r.body]).toEqual([400, { error: { code: "bad_request", message, fields: { file: [message] } } }]);
      expectBounded(r);
    }
  });

  test("100 MB of in-cell text packed into a small workbook and a zip bomb stop at the part limit", async () => {
    const message = "A part of the workbook unpacks to more than 40 MB; it was not read";
    for (const send of [inventory("text.xlsx", Buffer.from(inlineTextWorkbook(100e6))), preview("bomb.xlsx", Buffer.from(zipBombWorkbook(100e6, 1_000_000)))]) {
      const r = await watched(health, send);
      expect([r.status, (r.body as { error: { fields: unknown } }).error.fields]).toEqual([400, { file: [message] }]);
      expectBounded(r);
    }
  });

  test("an inventory of 25,000 vessels is refused at the one row limit, CSV and XLSX", async () => {
    const message = "The file has 25,000 rows; at most 20,000 are accepted";
    for (const send of [inventory("vessels.csv", Buffer.from(inventoryCsv(25_000)), "text/csv"), inventory("vessels.xlsx", Buffer.from(inventoryWorkbook(25_000)))]) {
      const r = await watched(health, send);
      expect([r.status, (r.body as { error: { fields: unknown } }).error.fields]).toEqual([400, { file: [message] }]);
      expectBounded(r);
    }
  });

  test("a 50 MB body is refused with a 413 naming the file, declared or streamed", async () => {
    const big = Buffer.alloc(50e6, 0x61);
    const declared = await watched(health, preview("big.csv", big, "text/csv"));
    expect([declared.status, declared.body]).toEqual([413, { error: { code: "payload_too_large", message: "The file is larger than 2 MB; split it into smaller files", fields: { file: ["The file is larger than 2 MB"] } } }]);
    expectBounded(declared);

    // Chunked, with no Content-Length: the server must count while reading and stop at the limit.
    const cookie = (await engineer.storageState()).cookies.map((c) => `${c.name}=${c.value}`).join("; ");
    const streamed = await watched(health, () => sendChunked(`/api/projects/${projectId}/datasets/preview`, cookie, 50e6));
    expect(streamed.status).toBe(413);
    expect((streamed.body as { error: { fields: unknown } }).error.fields).toEqual({ file: ["The file is larger than 2 MB"] });
    expectBounded(streamed);
  });

  test("malformed forms are a 400 naming the part", async () => {
    const url = `/api/projects/${projectId}/datasets/preview`;
    const noBoundary = await engineer.post(url, { headers: { ...ORIGIN, "Content-Type": "multipart/form-data" }, data: "x" });
    expect([noBoundary.status(), (await noBoundary.json()).error.fields]).toEqual([400, { "(body)": ["Send the form as multipart/form-data with the parts file and mapping"] }]);
    const b = "----e2e";
    const raw = (parts: string) => engineer.post(url, { headers: { ...ORIGIN, "Content-Type": `multipart/form-data; boundary=${b}` }, data: `${parts}--${b}--\r\n` });
    const noName = await raw(`--${b}\r\nContent-Disposition: form-data\r\n\r\nx\r\n`);
    expect([noName.status(), (await noName.json()).error.fields]).toEqual([400, { "(body)": ["Part 1 of the form has no name"] }]);
    const mappingAsFile = await raw(`--${b}\r\nContent-Disposition: form-data; name="mapping"; filename="m.json"\r\n\r\n{}\r\n`);
    expect([mappingAsFile.status(), (await mappingAsFile.json()).error.fields]).toEqual([400, { mapping: ["mapping must be text, not a file"] }]);
    const noFile = await raw(`--${b}\r\nContent-Disposition: form-data; name="mapping"\r\n\r\n${MAPPING}\r\n`);
    expect([noFile.status(), (await noFile.json()).error.fields]).toEqual([400, { file: ["Choose a CSV or XLSX file"] }]);
    const inventoryNoFile = await engineer.post("/api/inventory/import", { headers: { ...ORIGIN, "Content-Type": `multipart/form-data; boundary=${b}` }, data: `--${b}\r\nContent-Disposition: form-data; name="accept"\r\n\r\nfalse\r\n--${b}--\r\n` });
    expect([inventoryNoFile.status(), (await inventoryNoFile.json()).error.fields]).toEqual([400, { file: ["Attach a .csv or .xlsx file"] }]);
  });
});

/** Posts a multipart body of `total` bytes in chunks, without a Content-Length, and reads the answer. */
function sendChunked(path: string, cookie: string, total: number): Promise<{ status: number; body: unknown }> {
  const b = "----e2e-chunked";
  return new Promise((resolve, reject) => {
    let answered = false;
    const req = httpRequest(`${baseURL}${path}`, { method: "POST", headers: { Origin: baseURL, Cookie: cookie, "Content-Type": `multipart/form-data; boundary=${b}`, "Transfer-Encoding": "chunked" } }, (res) => {
      let text = "";
      res.setEncoding("utf8");
      res.on("data", (d: string) => (text += d));
      res.on("end", () => {
        req.destroy();
        resolve({ status: res.statusCode ?? 0, body: JSON.parse(text) });
      });
    });
    // The server may close the connection once it has answered; that ends the sending, not the test.
    req.on("error", (e) => (answered ? undefined : reject(e)));
    req.on("response", () => (answered = true));
    const chunk = Buffer.alloc(65_536, 0x61);
    let sent = 0;
    req.write(`--${b}\r\nContent-Disposition: form-data; name="mapping"\r\n\r\n${MAPPING}\r\n--${b}\r\nContent-Disposition: form-data; name="file"; filename="big.csv"\r\n\r\n`);
    const pump = () => {
      while (!answered && sent < total) {
        sent += chunk.length;
        if (!req.write(chunk)) return void req.once("drain", pump);
      }
      if (!answered) req.end(`\r\n--${b}--\r\n`);
    };
    pump();
  });
}
