import { describe, expect, it } from "vitest";
import { nextCell } from "@/components/sweeps/scenario-picker";

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
