import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { parseInventoryCsv, parseInventoryFile } from "@/lib/costs/inventory-file";
import { AppError } from "@/lib/errors";

describe("reading an inventory file", () => {
  it("reads vessels with units and reports each bad cell by row and column", () => {
    const csv = [
      "Tag,Type,Volume,Unit,Available,Reuse cost,Location",
      "R-101,cstr,2500,L,yes,12000,Bay 2",
      "T-201,PFR,1.6 m3,,no,,Yard",
      "R-102,CSTR,500,gal,yes,0,Bay 3",
      "R-103,tank,2,m3,yes,0,",
      "R-104,CSTR,-1,m3,maybe,abc,",
      "R-101,CSTR,2,m3,yes,0,",
      "R-105,CSTR,3,bbl,yes,0,",
    ].join("\n");
    const r = parseInventoryCsv(csv);
    expect(r.vessels.map((v) => v.tag)).toEqual(["R-101", "T-201", "R-102"]);
    expect(r.vessels[0]).toMatchObject({ type: "CSTR", volume: 2.5, available: true, reuseCost: 12000, location: "Bay 2", row: 2 });
    expect(r.vessels[1]).toMatchObject({ type: "PFR", volume: 1.6, available: false, reuseCost: 0 });
    // 1 US gal = 3.785411784 L exactly (common practice: the definition, 231 in3).
    expect(r.vessels[2].volume).toBeCloseTo(500 * 3.785411784e-3, 12);
    const at = (row: number) => r.problems.filter((p) => p.row === row).map((p) => p.field).sort();
    expect(at(5)).toEqual(["type"]);
    expect(at(6)).toEqual(["available", "reuseCost", "volume"]);
    expect(at(7)).toEqual(["tag"]);
    expect(at(8)).toEqual(["unit"]);
  });

  it("names a missing column", () => {
    const r = parseInventoryCsv("Tag,Volume\nR-1,2\n");
    expect(r.vessels).toEqual([]);
    expect(r.problems).toEqual([{ row: 1, field: "type", message: 'The header row has no "type" column' }]);
  });

  it("reads the same vessels from an XLSX workbook written by exceljs", async () => {
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet("Vessels");
    ws.addRow(["tag", "type", "volume", "unit", "available", "reuse_cost", "location"]);
    ws.addRow(["R-201", "CSTR", 4, "m3", "yes", 5000, "North"]);
    ws.addRow(["R-202", "PFR", "x", "m3", "yes", 0, ""]);
    const buf = (await wb.xlsx.writeBuffer()) as ArrayBuffer;
    const r = await parseInventoryFile("vessels.xlsx", buf);
    expect(r.vessels).toHaveLength(1);
    expect(r.vessels[0]).toMatchObject({ tag: "R-201", type: "CSTR", volume: 4, reuseCost: 5000, location: "North" });
    expect(r.problems).toEqual([{ row: 3, field: "volume", message: '"x" is not a volume' }]);
  });

  it("refuses other file kinds with a 400 naming the file", async () => {
    const err = await parseInventoryFile("vessels.pdf", new ArrayBuffer(4)).then(
      () => null,
      (e: unknown) => e,
    );
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).status).toBe(400);
    expect((err as AppError).fields).toEqual({ file: ["Upload a .csv or .xlsx file"] });
  });
});
