import { describe, expect, it } from "vitest";
import { formatDateTime, formatDay } from "@/lib/format/dates";

// The expected strings are the British medium date style (day, abbreviated month, year; 24-hour
// clock), common practice for en-GB, and the instants are chosen on either side of midnight UTC.
describe("one date formatter", () => {
  it("writes a moment in UTC and says so, whatever form it comes in", () => {
    expect(formatDateTime("2026-12-03T08:05:00Z")).toBe("3 Dec 2026, 08:05 UTC");
    expect(formatDateTime(new Date(Date.UTC(2026, 0, 9, 23, 59)))).toBe("9 Jan 2026, 23:59 UTC");
    expect(formatDateTime(Date.UTC(2026, 5, 30, 0, 1))).toBe("30 Jun 2026, 00:01 UTC");
  });

  it("a time zone ahead of UTC still gives the UTC day", () => {
    // 00:30 in UTC+2 on 1 March is 22:30 UTC on 28 February.
    expect(formatDay("2026-03-01T00:30:00+02:00")).toBe("28 Feb 2026");
    expect(formatDay("2026-12-03T08:05:00Z")).toBe("03 Dec 2026");
  });

  it("shows a dash, never a wrong date, when there is none", () => {
    for (const v of [null, undefined, "", "not a date"]) {
      expect(formatDateTime(v)).toBe("—");
      expect(formatDay(v)).toBe("—");
    }
  });
});
