import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { commentText, FORMULA_LIKE, SAFE_UNPARSE, safeCell } from "@/lib/client/csv-safety";

// The neutralising rule is the common practice against CSV injection: a leading single quote.
describe("a CSV cell that a spreadsheet would read as a formula", () => {
  it.each([
    ["=", '=HYPERLINK("https://evil.example","open")'],
    ["+", "+1+cmd|' /C calc'!A0"],
    ["-", "-2+3"],
    ["@", "@SUM(A1:A9)"],
    ["tab", "\t=1+1"],
    ["carriage return", "\r=1+1"],
    ["spaces before =", "   =1+1"],
  ])("starting with %s gets a leading quote", (_rule, text) => {
    expect(safeCell(text)).toBe(`'${text}`);
  });

  it.each(["-1.5", "+2", "-3e-5", "-.5", "12", "1.5E+3"])("is left alone when it is a plain number: %s", (text) => {
    expect(safeCell(text)).toBe(text);
  });

  it.each(["CSTR-PFR", "Ester line 3", "a=b", "x@y.example", ""])("is left alone when it does not start like a formula: %s", (text) => {
    expect(safeCell(text)).toBe(text);
  });

  it("papaparse with the same rule quotes text cells and never touches numbers", () => {
    const csv = Papa.unparse([["=1+1", -1.5, "-1.5", "-x", "@me", 3]], SAFE_UNPARSE);
    expect(csv).toBe(`"'=1+1",-1.5,-1.5,"'-x","'@me",3`);
    const back = Papa.parse<unknown[]>(csv, { dynamicTyping: true }).data[0];
    expect(back).toEqual(["'=1+1", -1.5, -1.5, "'-x", "'@me", 3]);
    expect(FORMULA_LIKE.test("-1.5")).toBe(false);
  });
});

describe("a comment line holding user text", () => {
  it("cannot start a row of its own", () => {
    // The line break becomes a space: the formula is then mid-cell, where it is only text.
    expect(commentText("Ester\n=HYPERLINK(\"https://evil.example\")")).toBe(`Ester =HYPERLINK("https://evil.example")`);
    expect(commentText("\r\n@SUM(1)")).toBe("' @SUM(1)");
  });

  it("cannot put a formula in a cell a spreadsheet splits off at a comma, semicolon or tab", () => {
    expect(commentText("x,=1+1;+2+cmd\t-3+cmd, ok,-4")).toBe("x,'=1+1;'+2+cmd\t'-3+cmd, ok,-4");
  });

  it("leaves ordinary text as it was", () => {
    expect(commentText("Ester line 3 revamp: CSTR-PFR, pinned design 1 (pinned)")).toBe("Ester line 3 revamp: CSTR-PFR, pinned design 1 (pinned)");
  });
});
