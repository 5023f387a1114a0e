import { describe, expect, it } from "vitest";
import { cellShade, nextCell, whiteReadsBetter } from "@/components/sweeps/scenario-picker";

// A 3 x 4 grid with a hole at row 1, column 2 (a scenario the sweep did not produce).
const exists = (r: number, c: number) => !(r === 1 && c === 2);
const go = (key: string, at: [number, number], ctrl = false) => nextCell(key, ctrl, at, 3, 4, exists);

describe("heat-map keys (ARIA grid pattern: arrows, Home, End, Ctrl+Home/End)", () => {
  it("arrows move one cell and stop at the edges", () => {
    expect(go("ArrowRight", [0, 0])).toEqual([0, 1]);
    expect(go("ArrowDown", [0, 0])).toEqual([1, 0]);
    expect(go("ArrowLeft", [0, 0])).toBeNull();
    expect(go("ArrowUp", [0, 0])).toBeNull();
    expect(go("ArrowRight", [2, 3])).toBeNull();
  });
  it("skips a hole in the grid", () => {
    expect(go("ArrowRight", [1, 1])).toEqual([1, 3]);
    expect(go("ArrowDown", [0, 2])).toEqual([2, 2]);
  });
  it("Home and End go to the row's ends, with Ctrl to the grid's corners", () => {
    expect(go("Home", [1, 3])).toEqual([1, 0]);
    expect(go("End", [1, 0])).toEqual([1, 3]);
    expect(go("Home", [2, 2], true)).toEqual([0, 0]);
    expect(go("End", [0, 0], true)).toEqual([2, 3]);
  });
  it("other keys are left alone", () => {
    expect(go("Enter", [0, 0])).toBeNull();
  });
});

/** WCAG 2.1 contrast ratio of two sRGB colours (published definition). */
function ratio(a: [number, number, number], b: [number, number, number]): number {
  const lum = ([r, g, bl]: [number, number, number]) => {
    const lin = (v: number) => (v / 255 <= 0.03928 ? v / 255 / 12.92 : ((v / 255 + 0.055) / 1.055) ** 2.4);
    return 0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(bl);
  };
  const [hi, lo] = [lum(a), lum(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

describe("heat-map cell colours", () => {
  it("every shade carries its figure at 4.5:1 or more (WCAG 2.1 AA for small text)", () => {
    const WHITE: [number, number, number] = [255, 255, 255];
    const INK: [number, number, number] = [0x1c, 0x24, 0x30];
    for (let i = 0; i <= 100; i++) {
      const bg = cellShade(i / 100);
      const text = whiteReadsBetter(bg) ? WHITE : INK;
      expect(ratio(bg, text), `shade ${i / 100}`).toBeGreaterThanOrEqual(4.5);
    }
  });
  it("darker shades stay darker: the order of the values is kept", () => {
    const lums = Array.from({ length: 101 }, (_, i) => cellShade(i / 100)).map(([r, g, b]) => r + g + b);
    for (let i = 1; i < lums.length; i++) expect(lums[i]).toBeLessThanOrEqual(lums[i - 1]);
  });
});
