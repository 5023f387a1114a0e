/** `npm run bench:upload`: time to read and check a rate table at the row limit, CSV and XLSX (median of 5). Prints figures. */
import ExcelJS from "exceljs";
import { parseUpload } from "../lib/datasets/parse-upload";
import { UPLOAD_LIMITS } from "../lib/datasets/rate-table";
import type { DatasetMapping } from "../lib/schemas/datasets";

const n = UPLOAD_LIMITS.rows;
const mapping: DatasetMapping = { columns: { X: "conversion", rate: "rate", T: "temperature" }, units: { rate: "mol/(L min)", temperature: "degC" } };
const rows = Array.from({ length: n }, (_, i) => [(i % 5000) / 5000, 6 * (1 - (i % 5000) / 5000) + 0.1, 50 + 10 * Math.floor(i / 5000)]);
const csv = new TextEncoder().encode(["X,rate,T", ...rows.map((r) => r.join(","))].join("\n"));
const wb = new ExcelJS.Workbook();
const ws = wb.addWorksheet("bench");
ws.addRow(["X", "rate", "T"]);
for (const r of rows) ws.addRow(r);
const xlsx = new Uint8Array(await wb.xlsx.writeBuffer());

console.log(`Reading ${n.toLocaleString("en")} rows (median of 5 runs after 1 warm-up)`);
for (const [format, bytes] of [["csv", csv], ["xlsx", xlsx]] as const) {
  const upload = { fileName: `bench.${format}`, format, bytes, mapping };
  await parseUpload(upload);
  const times: number[] = [];
  let good = 0;
  for (let i = 0; i < 5; i++) {
    const t0 = performance.now();
    good = (await parseUpload(upload)).rows.length;
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  console.log(`  ${format.padEnd(5)} ${(bytes.byteLength / 1e6).toFixed(2)} MB  ${times[2].toFixed(0).padStart(5)} ms  ${good} good rows`);
}
