import { describe, expect, it } from "vitest";
import { STAGE_STYLES, stageStyle } from "@/lib/charts/stage-styles";

describe("stage styles shared by the charts and the PDF", () => {
  it("give each of the first stages its own colour and its own pattern, so grey print keeps them apart", () => {
    expect(new Set(STAGE_STYLES.map((s) => s.fill)).size).toBe(STAGE_STYLES.length);
    expect(new Set(STAGE_STYLES.map((s) => s.kind)).size).toBe(STAGE_STYLES.length);
    for (const s of STAGE_STYLES) expect(s.stroke).toMatch(/^#[0-9a-f]{6}$/);
  });

  it("repeat past the end of the list rather than running out", () => {
    const n = STAGE_STYLES.length;
    expect(stageStyle(0)).toBe(STAGE_STYLES[0]);
    expect(stageStyle(n + 2)).toBe(STAGE_STYLES[2]);
    expect(stageStyle(-1)).toBe(STAGE_STYLES[n - 1]);
  });
});
