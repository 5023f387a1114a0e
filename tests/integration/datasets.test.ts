import { readFileSync } from "node:fs";
import ExcelJS from "exceljs";
import { and, count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemoData } from "@/lib/demo/seed";
import { auditEntries, kineticsModels, kineticsSources, kineticsVersions, projects, rateDatasets, rateDatasetVersions } from "@/db/schema";
import type { Actor } from "@/lib/authz/policy";
import { readUpload } from "@/lib/http/read-upload";
import type { Upload } from "@/lib/datasets/parse-upload";
import { designTrains, type DesignSpec } from "@/lib/engine";
import { datasetCreateFieldsSchema, type DatasetMapping } from "@/lib/schemas/datasets";
import { addDatasetVersion, createDataset, createTableKinetics, getDataset, getDatasetVersion, listDatasetSources, listDatasets, previewDataset } from "@/lib/services/datasets";
import { createKineticsModel } from "@/lib/services/kinetics";
import { actorByEmail, type TestDatabase } from "../helpers/test-db";
import { DEMO_USERS } from "../helpers/demo-people";
import { ESTER_PROJECT, projectIdNamed, seededTestDatabase } from "./helpers/demo-team";
import { refusal } from "../helpers/refusal";

const fixture = (name: string) => new Uint8Array(readFileSync(`tests/fixtures/datasets/${name}`));
const MAPPING: DatasetMapping = {
  columns: { X: "conversion", "rate (mol/L/min)": "rate", "T (degC)": "temperature" },
  units: { conversion: "fraction", rate: "mol/(L min)", temperature: "degC" },
};
const upload = (name: string, mapping = MAPPING): Upload => ({ fileName: name, format: "csv", bytes: fixture(name), mapping });

let t: TestDatabase;
let engineer: Actor;
let projectId: string;

async function counts() {
  const [[d], [v], [a], [k], [s]] = await Promise.all([
    t.db.select({ n: count() }).from(rateDatasets),
    t.db.select({ n: count() }).from(rateDatasetVersions),
    t.db.select({ n: count() }).from(auditEntries),
    t.db.select({ n: count() }).from(kineticsVersions),
    t.db.select({ n: count() }).from(kineticsSources),
  ]);
  return { datasets: d.n, versions: v.n, audit: a.n, kinetics: k.n, sources: s.n };
}


beforeAll(async () => {
  t = await seededTestDatabase();
  engineer = await actorByEmail(t.db, DEMO_USERS.engineer);
  projectId = await projectIdNamed(t.db, ESTER_PROJECT);
});
afterAll(() => t.drop());

describe("rate-data uploads", () => {
  it("seeds two demo datasets once, however often the seed runs", async () => {
    await seedDemoData(t.db);
    const list = await listDatasets(t.db, engineer, projectId);
    expect(list.map((d) => [d.name, d.latestVersion?.version])).toEqual([
      ["Bench runs at 67 °C (rate vs conversion)", 1],
      ["Equimolar runs, 50–80 °C (for an Arrhenius fit)", 1],
    ]);
    const multi = await getDatasetVersion(t.db, engineer, (await getDataset(t.db, engineer, list[1].id)).versions[0].id);
    expect(new Set(multi.rows.map((r) => r.temperature)).size).toBe(4);
  });

  it("previews a file with bad rows, marking each with its reason, and stores nothing", async () => {
    const before = await counts();
    const p = await previewDataset(t.db, engineer, projectId, upload("ester-bench-with-errors.csv"));
    expect(await counts()).toEqual(before);
    expect(p.counts).toEqual({ lines: 10, good: 5, withProblems: 5 });
    expect(p.fileProblems).toEqual([]);
    const bad = p.lines.filter((l) => l.problems.length).map((l) => [l.line, l.problems.map((x) => x.message).join("; ")]);
    expect(bad).toEqual([
      [4, "missing"],
      [6, '"n/a" is not a number'],
      [7, "the rate must be positive"],
      [9, "conversion must be in [0, 1)"],
      [10, "duplicate conversion 0.6 at one temperature (first on line 8)"],
    ]);
    // 7.344 mol/(L·min) = 7.344 × 1000/60 mol/(m³·s), exact by definition of the units
    expect(Object.keys(p.lines[0].si!).sort()).toEqual(["conversion", "rate", "temperature"]);
    expect(p.lines[0].si!.conversion).toBe(0);
    expect(p.lines[0].si!.rate).toBeCloseTo((7.344 * 1000) / 60, 12);
    expect(p.lines[0].si!.temperature).toBeCloseTo(67 + 273.15, 12);
  });

  it("refuses to accept a file that still has bad rows, writing nothing", async () => {
    const before = await counts();
    const err = await refusal(createDataset(t.db, engineer, projectId, { name: "Should not exist", upload: upload("ester-bench-with-errors.csv"), note: "" }));
    expect(err.status).toBe(400);
    expect(err.message).toBe("5 rows have problems; nothing was stored. Fix the file and upload it again.");
    expect(err.fields?.file).toContain('line 6, rate (mol/L/min): "n/a" is not a number');
    expect(await counts()).toEqual(before);
  });

  it("refuses a file name PostgreSQL cannot store (NUL, a lone surrogate), naming the file, writing nothing", async () => {
    const before = await counts();
    for (const fileName of ["ester-bench\u0000.csv", "ester-bench-\uD800.csv"]) {
      const err = await refusal(createDataset(t.db, engineer, projectId, { name: "Should not exist", upload: { ...upload("ester-bench.csv"), fileName }, note: "" }));
      expect(err.status).toBe(400);
      expect(Object.keys(err.fields ?? {})).toEqual(["file"]);
      expect(err.message).toMatch(/^The file name: /);
    }
    expect(await counts()).toEqual(before);
  });

  let datasetId: string;
  let v1Id: string;
  it("accepts the corrected file as version 1 and a second upload as version 2, each with an audit entry", async () => {
    const before = await counts();
    const created = await createDataset(t.db, engineer, projectId, { name: "Bench check", upload: upload("ester-bench.csv"), note: "" });
    datasetId = created.dataset.id;
    v1Id = created.version.id;
    expect(created.version).toMatchObject({ version: 1, rowCount: 10, fileName: "ester-bench.csv", format: "csv" });
    const v2 = await addDatasetVersion(t.db, engineer, datasetId, { upload: upload("ester-bench.csv"), feedConcA: 1000, note: "re-run" });
    expect(v2).toMatchObject({ version: 2, rowCount: 10, feedConcA: 1000 });
    const after = await counts();
    expect(after).toMatchObject({ datasets: before.datasets + 1, versions: before.versions + 2, audit: before.audit + 2 });
    const dataset = await getDataset(t.db, engineer, datasetId);
    expect(dataset.versions.map((v) => v.version)).toEqual([2, 1]);
    const v1 = await getDatasetVersion(t.db, engineer, v1Id);
    expect(v1.mapping).toEqual(MAPPING);
    expect(v1.rows[9]).toMatchObject({ conversion: 0.85, temperature: 340.15 });
    expect(v1.rows[9].rate).toBeCloseTo((0.309 * 1000) / 60, 12); // mol/(L·min) → mol/(m³·s), exact factor 1000/60
    const bad = await refusal(addDatasetVersion(t.db, engineer, datasetId, { upload: upload("ester-bench-with-errors.csv"), note: "" }));
    expect(bad.status).toBe(400);
    expect((await getDataset(t.db, engineer, datasetId)).versions).toHaveLength(2);
  });

  it("accepts an XLSX workbook through the same checks", async () => {
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet("bench");
    ws.addRow(["C_A (mol/L)", "rate (mol/L/min)", "T (degC)"]);
    ws.addRow([1, 6, 67]);
    ws.addRow([0.5, { formula: "6*0.25", result: 1.5 }, 67]);
    const bytes = new Uint8Array(await wb.xlsx.writeBuffer());
    const mapping: DatasetMapping = { columns: { "C_A (mol/L)": "concA", "rate (mol/L/min)": "rate", "T (degC)": "temperature" }, units: { concA: "mol/L", rate: "mol/(L min)", temperature: "degC" } };
    const { version } = await createDataset(t.db, engineer, projectId, { name: "Workbook", upload: { fileName: "bench.xlsx", format: "xlsx", bytes, mapping }, feedConcA: 1000, note: "" });
    expect(version).toMatchObject({ format: "xlsx", rowCount: 2, feedConcA: 1000 });
    const stored = await getDatasetVersion(t.db, engineer, version.id);
    expect(stored.rows.map((r) => r.concA)).toEqual([1000, 500]); // 1 mol/L = 1000 mol/m³
    expect(stored.rows[1].rate).toBeCloseTo(25, 12); // 1.5 mol/(L·min) = 1500/60 mol/(m³·s)
  });

  it("answers a bad mapping with a 400 naming the field", async () => {
    const form = (mapping: string) => {
      const f = new FormData();
      f.set("name", "Bench");
      f.set("mapping", mapping);
      f.set("file", new File([fixture("ester-bench.csv")], "ester-bench.csv", { type: "text/csv" }));
      return new Request("http://localhost/api/x", { method: "POST", body: f });
    };
    const notJson = await refusal(readUpload(form("{columns:"), datasetCreateFieldsSchema));
    expect(Object.keys(notJson.fields!)).toEqual(["mapping"]);
    const badRole = await refusal(readUpload(form(JSON.stringify({ columns: { X: "speed" } })), datasetCreateFieldsSchema));
    expect(Object.keys(badRole.fields!)).toEqual(["mapping.columns.X"]);
    const badUnit = await refusal(readUpload(form(JSON.stringify({ columns: { X: "conversion" }, units: { rate: "furlongs" } })), datasetCreateFieldsSchema));
    expect(Object.keys(badUnit.fields!)).toEqual(["mapping.units.rate"]);
    const f = new FormData();
    f.set("mapping", JSON.stringify(MAPPING));
    f.set("name", "x");
    f.set("file", new File(["a"], "bench.ods"));
    const wrongType = await refusal(readUpload(new Request("http://localhost/api/x", { method: "POST", body: f }), datasetCreateFieldsSchema));
    expect(Object.keys(wrongType.fields!)).toEqual(["file"]);
    const ok = await readUpload(form(JSON.stringify(MAPPING)), datasetCreateFieldsSchema);
    expect(ok.fields.mapping).toEqual(MAPPING);
    expect(ok.upload.format).toBe("csv");
  });

  it("uses a version as a measured rate table: kinetics version and source row together, and the engine sizes on it", async () => {
    const before = await counts();
    const feed = { flowA: 0.02, concA: 1000, temperature: 340.15 };
    const { model, version } = await createTableKinetics(t.db, engineer, v1Id, { modelName: "Bench table, 67 °C", feed });
    expect(await counts()).toMatchObject({ kinetics: before.kinetics + 1, sources: before.sources + 1, audit: before.audit + 1 });
    const [source] = await t.db.select().from(kineticsSources).where(eq(kineticsSources.kineticsVersionId, version.id));
    expect(source).toMatchObject({ kind: "table", datasetVersionId: v1Id });
    const spec = version.spec as unknown as DesignSpec;
    expect(spec.reaction.rate).toMatchObject({ law: "table" });
    // One CSTR to X = 0.8, a table point: V = F_A0 X / (-rA at X) (CSTR design equation, common practice),
    // with -rA = 0.492 mol/(L·min) = 8.2 mol/(m³·s) as measured; PCHIP passes through its points.
    const result = designTrains({ ...spec, target: { conversion: 0.8 }, train: { candidates: [["CSTR"]] } });
    expect(result.candidates[0].totalVolume).toBeCloseTo((0.02 * 0.8) / ((0.492 * 1000) / 60), 9);

    const again = await createTableKinetics(t.db, engineer, (await getDataset(t.db, engineer, datasetId)).versions[0].id, { modelId: model.id, feed });
    expect(again.version.version).toBe(2);
    // The dataset page lists both kinetics versions made from it, newest first.
    const made = await listDatasetSources(t.db, engineer, datasetId);
    expect(made.map((m) => [m.modelName, m.kineticsVersion, m.kind])).toEqual([
      ["Bench table, 67 °C", 2, "table"],
      ["Bench table, 67 °C", 1, "table"],
    ]);
    const [other] = await t.db.select().from(projects).where(eq(projects.name, "Lactone pilot unit"));
    const [otherModel] = await t.db.select().from(kineticsModels).where(eq(kineticsModels.projectId, other.id));
    const wrongProject = await refusal(createTableKinetics(t.db, engineer, v1Id, { modelId: otherModel.id, feed }));
    expect(Object.keys(wrongProject.fields!)).toEqual(["modelId"]);
  });

  it("converts concentrations to conversion and asks for a temperature when the data span several", async () => {
    const [multi] = await t.db.select().from(rateDatasets).where(and(eq(rateDatasets.projectId, projectId), eq(rateDatasets.name, "Equimolar runs, 50–80 °C (for an Arrhenius fit)")));
    const [v] = await t.db.select().from(rateDatasetVersions).where(eq(rateDatasetVersions.datasetId, multi.id));
    const feed = { flowA: 0.02, concA: 1000 };
    const noT = await refusal(createTableKinetics(t.db, engineer, v.id, { modelName: "Equimolar at 60 °C", feed }));
    expect(noT.fields).toHaveProperty("feed.temperature");
    const { version } = await createTableKinetics(t.db, engineer, v.id, { modelName: "Equimolar at 60 °C", feed: { ...feed, temperature: 333.15 } });
    const law = (version.spec as unknown as DesignSpec).reaction.rate as { conversion: number[] };
    // C_A = 1000, 800, 600, 450, 300, 200 mol/m³ of C_A0 = 1000: X = 1 − C_A/C_A0
    expect(law.conversion.map((x) => Number(x.toFixed(12)))).toEqual([0, 0.2, 0.4, 0.55, 0.7, 0.8]);
  });

  it("writes no kinetics version when its source row cannot be written (one transaction)", async () => {
    const before = await counts();
    const spec = { feed: { flowA: 0.02, concA: 1000 }, reaction: { rate: { law: "table" as const, conversion: [0, 0.5], rate: [10, 5] } } };
    await expect(createKineticsModel(t.db, engineer, projectId, { name: "Orphan table", spec, note: "", source: { datasetVersionId: "00000000-0000-4000-8000-000000000000", kind: "table", fit: null } })).rejects.toThrow();
    expect(await counts()).toEqual(before);
    expect(await t.db.select().from(kineticsModels).where(eq(kineticsModels.name, "Orphan table"))).toEqual([]);
  });
});
