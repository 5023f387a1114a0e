import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { isTextTable } from "@/lib/datasets/parse-upload";

const bytes = (s: string) => new TextEncoder().encode(s);

describe("isTextTable: whether a .csv upload can be a text table at all", () => {
  it("reads the demo bench rates, and tables split by semicolons or tabs, with or without a byte-order mark", () => {
    expect(isTextTable(new Uint8Array(readFileSync("tests/fixtures/datasets/ester-bench.csv")))).toBe(true);
    expect(isTextTable(bytes("X;rate\n0,1;2,5\n"))).toBe(true);
    expect(isTextTable(bytes("X\trate\r\n0.1\t2.5\r\n"))).toBe(true);
    expect(isTextTable(bytes("\uFEFFX,rate\n0.1,2\n"))).toBe(true);
    expect(isTextTable(bytes("T (°C),rate\n67,2\n"))).toBe(true);
  });

  it("refuses a PNG (its signature per the PNG specification, 5.2), text with a NUL, bad UTF-8 and a header with no delimiter", () => {
    expect(isTextTable(new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]))).toBe(false);
    expect(isTextTable(bytes("X,rate\n0.1,\u00002\n"))).toBe(false);
    // 0xE9 alone is "é" in Latin-1 but not valid UTF-8 (RFC 3629).
    expect(isTextTable(new Uint8Array([0x58, 0x2c, 0x72, 0x0a, 0xe9, 0x2c, 0x31]))).toBe(false);
    expect(isTextTable(bytes("just some words\nand more\n"))).toBe(false);
  });
});
