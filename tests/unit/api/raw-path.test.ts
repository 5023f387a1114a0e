import { describe, expect, it } from "vitest";
import { hasMalformedPathEncoding, malformedPathResponse } from "@/lib/http/raw-path";

describe("addresses that cannot be decoded", () => {
  it("finds invalid percent-encoding in any segment", () => {
    for (const p of ["/api/projects/%FF%FE", "/api/projects/%ED%A0%80", "/api/projects/%", "/api/projects/%zz", "/api/projects/abc%", "/api/pins/%C0%AF/report.pdf", "/projects/%E0%80%80"]) {
      expect(hasMalformedPathEncoding(p), p).toBe(true);
    }
  });

  it("leaves valid encodings alone, NUL and emoji included (the route decides those)", () => {
    for (const p of ["/", "/api/projects", "/api/projects/%00", "/api/projects/%F0%9F%A7%AA", "/api/projects/%E5%8F%8D%E5%BA%94", "/api/auth/callback/credentials", "/api/pins/6f1c3a52-0a57-4c4f-9d59-0d1b2f1b7a10/export.csv"]) {
      expect(hasMalformedPathEncoding(p), p).toBe(false);
      expect(malformedPathResponse(p)).toBeNull();
    }
  });

  it("answers the API with 404 in the error shape, pages with a plain 404", async () => {
    const api = malformedPathResponse("/api/team/members/%FF")!;
    expect(api.status).toBe(404);
    expect(await api.json()).toEqual({ error: { code: "not_found", message: expect.stringMatching(/^No such record/) } });
    const page = malformedPathResponse("/projects/%FF")!;
    expect(page.status).toBe(404);
    expect(await page.text()).toMatch(/^Page not found/);
  });
});
