import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { allowedOrigins, checkBodyType, checkOrigin, checkWrite, expectedBodyType, type WriteRequest } from "@/lib/http/same-origin";

const APP = allowedOrigins("http://127.0.0.1:3000");

function req(method: string, headers: Record<string, string>, pathname = "/api/projects"): WriteRequest {
  return { method, pathname, headers: new Headers(headers) };
}
const JSON_BODY = { "content-type": "application/json", "content-length": "20" };
const COOKIE = { cookie: "authjs.session-token=abc" };

describe("allowed origins", () => {
  it("are APP_URL's origin and, on the loopback interface, the other loopback names with the same port", () => {
    expect([...APP].sort()).toEqual(["http://127.0.0.1:3000", "http://[::1]:3000", "http://localhost:3000"]);
  });
  it("are only APP_URL's origin for a real host name", () => {
    expect([...allowedOrigins("https://seriatim.example.com/some/path")]).toEqual(["https://seriatim.example.com"]);
  });
});

describe("the origin check of a state-changing request", () => {
  it("lets the app's own pages through, under either loopback name", () => {
    expect(checkOrigin(req("POST", { ...COOKIE, origin: "http://127.0.0.1:3000" }), APP)).toBeNull();
    expect(checkOrigin(req("DELETE", { ...COOKIE, origin: "http://localhost:3000" }), APP)).toBeNull();
  });

  it.each([
    ["another site", "https://evil.example"],
    ["another port of the same host", "http://127.0.0.1:3001"],
    ["https on the same host and port", "https://127.0.0.1:3000"],
    ["an opaque origin (sandboxed frame, data: page)", "null"],
  ])("refuses a request whose Origin is %s, with a 403 a user understands", (_what, origin) => {
    const r = checkOrigin(req("POST", { ...COOKIE, origin }), APP);
    expect(r?.status).toBe(403);
    expect(r?.message).toMatch(/sent from a page outside Seriatim/);
  });

  it("without Origin, decides by Sec-Fetch-Site: same-origin and a typed address pass, same-site and cross-site do not", () => {
    expect(checkOrigin(req("POST", { ...COOKIE, "sec-fetch-site": "same-origin" }), APP)).toBeNull();
    expect(checkOrigin(req("POST", { ...COOKIE, "sec-fetch-site": "none" }), APP)).toBeNull();
    expect(checkOrigin(req("POST", { ...COOKIE, "sec-fetch-site": "same-site" }), APP)?.status).toBe(403);
    expect(checkOrigin(req("POST", { ...COOKIE, "sec-fetch-site": "cross-site" }), APP)?.status).toBe(403);
  });

  it("without Origin or Sec-Fetch-Site, decides by the Referer's origin", () => {
    expect(checkOrigin(req("PATCH", { ...COOKIE, referer: "http://127.0.0.1:3000/projects/1" }), APP)).toBeNull();
    expect(checkOrigin(req("PATCH", { ...COOKIE, referer: "https://evil.example/attack.html" }), APP)?.status).toBe(403);
    expect(checkOrigin(req("PATCH", { ...COOKIE, referer: "not a url" }), APP)?.status).toBe(403);
  });

  it("refuses a cookie-carrying request that names no page at all, and says what to do instead", () => {
    const r = checkOrigin(req("POST", COOKIE), APP);
    expect(r?.status).toBe(403);
    expect(r?.message).toMatch(/personal API token/);
  });

  it("lets through a request with no cookie and no page headers (a script without a session: nothing to ride on)", () => {
    expect(checkOrigin(req("POST", {}), APP)).toBeNull();
  });

  it("skips the check for a Bearer token, which no page of another site can attach", () => {
    expect(checkOrigin(req("POST", { authorization: "Bearer srt_x", origin: "https://evil.example" }), APP)).toBeNull();
    expect(checkOrigin(req("POST", { authorization: "Basic eDp5", ...COOKIE, origin: "https://evil.example" }), APP)?.status).toBe(403);
  });

  it("does not check reads", () => {
    expect(checkOrigin(req("GET", { ...COOKIE, origin: "https://evil.example" }), APP)).toBeNull();
    expect(checkOrigin(req("HEAD", COOKIE), APP)).toBeNull();
  });
});

describe("the body type of a state-changing API request", () => {
  it("must be JSON for ordinary routes; charset parameters and letter case do not matter", () => {
    expect(checkBodyType(req("POST", JSON_BODY))).toBeNull();
    expect(checkBodyType(req("POST", { "content-type": "Application/JSON; charset=utf-8", "content-length": "2" }))).toBeNull();
  });

  it.each(["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x"])("refuses %s on a JSON route with 415 naming the body", (type) => {
    const r = checkBodyType(req("POST", { "content-type": type, "content-length": "10" }));
    expect(r).toMatchObject({ status: 415, code: "unsupported_media_type" });
    expect(r?.message).toBe("The request body must be JSON (Content-Type: application/json)");
  });

  it("refuses a body without any type, and lets a request without a body through", () => {
    expect(checkBodyType(req("POST", { "content-length": "5" }))?.status).toBe(415);
    expect(checkBodyType(req("POST", { "transfer-encoding": "chunked" }))?.status).toBe(415);
    expect(checkBodyType(req("DELETE", {}))).toBeNull();
    expect(checkBodyType(req("POST", { "content-length": "0" }))).toBeNull();
  });

  it("is a file form on the upload routes and a sign-in form under /api/auth", () => {
    const multipart = { "content-type": "multipart/form-data; boundary=abc", "content-length": "100" };
    expect(checkBodyType(req("POST", multipart, "/api/projects/p1/datasets"))).toBeNull();
    expect(checkBodyType(req("POST", multipart, "/api/projects/p1/datasets/preview"))).toBeNull();
    expect(checkBodyType(req("POST", multipart, "/api/datasets/d1/versions"))).toBeNull();
    expect(checkBodyType(req("POST", multipart, "/api/inventory/import"))).toBeNull();
    expect(checkBodyType(req("POST", JSON_BODY, "/api/inventory/import"))?.status).toBe(415);
    const form = { "content-type": "application/x-www-form-urlencoded", "content-length": "30" };
    expect(checkBodyType(req("POST", form, "/api/auth/callback/credentials"))).toBeNull();
    expect(checkBodyType(req("POST", { "content-type": "text/plain", "content-length": "3" }, "/api/auth/signout"))?.status).toBe(415);
  });

  it("does not apply to pages", () => {
    expect(checkBodyType(req("POST", { "content-type": "text/plain", "content-length": "3" }, "/projects"))).toBeNull();
  });
});

describe("both checks together", () => {
  it("answer the origin first: a foreign page learns nothing about the body a route takes", () => {
    expect(checkWrite(req("POST", { ...COOKIE, origin: "https://evil.example", "content-type": "text/plain", "content-length": "9" }), APP)?.status).toBe(403);
  });
  it("still check the body type of a same-origin request", () => {
    expect(checkWrite(req("POST", { ...COOKIE, origin: "http://127.0.0.1:3000", "content-type": "text/plain", "content-length": "9" }), APP)?.status).toBe(415);
  });
});

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((e) => {
    const p = path.join(dir, e);
    return statSync(p).isDirectory() ? routeFiles(p) : e === "route.ts" ? [p] : [];
  });
}

describe("the route table of body types", () => {
  it("expects a file form on exactly the routes that read one, and JSON on the routes that call readJson", () => {
    for (const file of routeFiles("app/api")) {
      const rel = "/" + path.dirname(path.relative("app", file)).split(path.sep).join("/");
      if (rel.startsWith("/api/auth")) continue;
      const apiPath = rel.replace(/\[[^\]]+\]/g, "x");
      const src = readFileSync(file, "utf8");
      const readsFile = /formData\(\)|readUpload\(|readMultipart\(/.test(src);
      expect(expectedBodyType(apiPath), apiPath).toBe(readsFile ? "multipart/form-data" : "application/json");
    }
  });
});
