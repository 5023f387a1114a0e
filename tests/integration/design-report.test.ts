import { and, eq } from "drizzle-orm";
import Papa from "papaparse";
import { PDFParse } from "pdf-parse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CAUTIONS as CAUTION_TEXTS } from "@/lib/engine";
import { candidates, inventoryVessels, kineticsSources, pinnedDesigns, projectCostSettings, rateDatasets, rateDatasetVersions, robustnessRuns } from "@/db/schema";
import type { Actor } from "@/lib/authz/policy";
import { getDesignReport } from "@/lib/services/design-reports";
import { candidatesCsv, stageTableCsv } from "@/lib/reports/exports";
import { fmtVolume, reportFileName } from "@/lib/reports/report-format";
import { renderReportPdf } from "@/lib/reports/report-pdf";
import { exportCandidates } from "@/lib/services/candidate-export";
import { listCandidates } from "@/lib/services/candidates";
import { reviewPin } from "@/lib/services/pins";
import type { TestDatabase } from "../helpers/test-db";
import type { DemoPerson } from "../helpers/demo-people";
import { accessOutcome, demoActors, ESTER_PROJECT, projectIdNamed, seededTestDatabase } from "./helpers/demo-team";

let t: TestDatabase;
let actors: Record<DemoPerson, Actor>;
let pinId: string;
let projectId: string;

beforeAll(async () => {
  t = await seededTestDatabase();
  actors = await demoActors(t.db);
  projectId = await projectIdNamed(t.db, ESTER_PROJECT);
  const [pin] = await t.db.select().from(pinnedDesigns).where(eq(pinnedDesigns.projectId, projectId));
  pinId = pin.id;
});
afterAll(() => t.drop());

async function pdfText(pdf: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    const { text } = await parser.getText();
    // Lines wrap at spaces; join them so sentences can be found whole.
    return text.replace(/\s+/g, " ");
  } finally {
    await parser.destroy();
  }
}

describe("design report of the demo pin", () => {
  it("reports the demo train with the volume of the closed-form PFR", async () => {
    const r = await getDesignReport(t.db, actors.manager, pinId);
    expect(r.pin.state).toBe("proposed");
    expect(r.kinetics.model).toBe("Esterification, second order");
    expect(r.kinetics.version).toBe(1);
    expect(r.train.sequence.length).toBeGreaterThan(0);
    // The stage volumes add up to the total (common practice: a train's volume is the sum of its stages).
    const sum = r.stages.reduce((s, x) => s + x.volume, 0);
    expect(sum).toBeCloseTo(r.train.totalVolume!, 10);
    // Second-order A + B in an isothermal liquid PFR (common practice, the integrated design equation):
    // V = FA0/(k CA0²) · ln[(θB − X)/(θB (1 − X))]/(θB − 1); FA0 0.02 mol/s, k 1e-4 m3/(mol s), CA0 1000 mol/m3,
    // θB 1.2, X 0.9 → 2e-4 · 5 · ln 2.5 = 9.163e-4 m3. The single-PFR reference is that volume.
    const closedForm = ((0.02 / (1e-4 * 1000 ** 2)) * Math.log((1.2 - 0.9) / (1.2 * (1 - 0.9)))) / (1.2 - 1);
    expect(r.references.singlePFR! / closedForm).toBeGreaterThan(0.995);
    expect(r.references.singlePFR! / closedForm).toBeLessThan(1.005);
    // Without rows in the other tables, their sections say "not recorded"; the demo project has a cost basis.
    expect(r.source.recorded).toBe(false);
    // The seed rates the demo pin with k ± 20 % (2,000 samples, seed 2026).
    expect(r.robustness.recorded).toBe(true);
    expect(r.costs.settings.recorded).toBe(true);
    if (r.costs.settings.recorded) {
      // The demo basis keeps its correlations under "vessels"; both types and the sizes read in words.
      expect(r.costs.settings.correlations.map((c) => [c.type, c.n])).toEqual([["CSTR", 0.6], ["PFR", 0.6]]);
      expect(r.costs.settings.other.find((l) => l.label === "Standard sizes")?.value).toBe("ISO 3 R10 preferred numbers from 0.001 to 1 m³");
      expect(r.costs.settings.other.map((l) => l.value).join(" ")).not.toContain("{");
    }
    expect(r.costs.inventoryPlan.recorded).toBe(false);
    expect(r.cautions.general).toEqual([...CAUTION_TEXTS]);
  });

  it("the PDF names the train, each stage volume, the kinetics, the review state and the cautions, with embedded fonts only", async () => {
    const r = await getDesignReport(t.db, actors.manager, pinId);
    const pdf = await renderReportPdf(r);
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    const text = await pdfText(pdf);
    expect(text).toContain(r.train.label);
    for (const s of r.stages) expect(text).toContain(fmtVolume(s.volume));
    expect(text).toContain("Esterification, second order, version 1");
    expect(text).toContain("power law");
    expect(text).toContain("Pending review");
    // The cautions appear once, boxed on page 1 (one caution block per document).
    for (const c of CAUTION_TEXTS) expect(text.split(c).length - 1, c).toBe(1);
    expect(text).toMatch(/Page 1 of \d+/);

    const raw = pdf.toString("latin1");
    expect(raw).toContain("/FontFile2");
    const baseFonts = [...raw.matchAll(/\/BaseFont\s*\/([^\s/>]+)/g)].map((m) => m[1]);
    expect(baseFonts.length).toBeGreaterThan(0);
    // Every font is an embedded subset of DejaVu; none of the 14 standard fonts a viewer would substitute.
    for (const f of baseFonts) expect(f).toMatch(/^[A-Z]{6}\+DejaVuSans/);
    expect(raw).not.toMatch(/\/BaseFont\s*\/(Helvetica|Times|Courier|Symbol|ZapfDingbats)/);
    expect(reportFileName(r, "pdf")).toMatch(/^ester-line-3-revamp-[a-z-]+-[0-9a-f]{8}\.pdf$/);
  });

  it("after approval the report and its PDF name the reviewer, and the viewer may read it", async () => {
    expect(await accessOutcome(() => getDesignReport(t.db, actors.viewer, pinId))).toBe("not_found");
    await reviewPin(t.db, actors.manager, pinId, { decision: "approve", comment: "Within the envelope of the bench data" });
    const r = await getDesignReport(t.db, actors.viewer, pinId);
    expect(r.pin.state).toBe("approved");
    expect(r.pin.reviewedBy).toBe("Marta Lindqvist");
    const text = await pdfText(await renderReportPdf(r));
    expect(text).toContain("Approved by Marta Lindqvist");
    expect(text).toContain("Within the envelope of the bench data");
    expect(await accessOutcome(() => getDesignReport(t.db, actors.otherTeam, pinId))).toBe("not_found");
  });

  it("with rows in kinetics_sources, project_cost_settings, robustness_runs and an inventory plan, the report carries those sections", async () => {
    const [pin] = await t.db.select().from(pinnedDesigns).where(eq(pinnedDesigns.id, pinId));
    const by = actors.engineer.userId;
    const [ds] = await t.db.insert(rateDatasets).values({ teamId: pin.teamId, projectId, name: "October bench runs", createdBy: by }).returning();
    const [dv] = await t.db
      .insert(rateDatasetVersions)
      .values({ datasetId: ds.id, version: 2, fileName: "bench-oct.csv", format: "csv", mapping: {}, rows: [{ concA: 500, rate: 0.03 }], rowCount: 14, createdBy: by })
      .returning();
    await t.db.insert(kineticsSources).values({
      kineticsVersionId: pin.kineticsVersionId,
      datasetVersionId: dv.id,
      kind: "fit",
      fit: { kind: "power", formula: "−rA = k·C_A^n", parameters: [{ name: "k", value: 1.02e-4, standardError: 3.1e-6, interval95: [9.5e-5, 1.09e-4] }], rSquared: 0.9934, residualSumOfSquares: 1.2e-5 },
    });
    // Invented figures standing in for a project's own cost basis (replaces the demo basis).
    const settings = { CSTR: { a: 12000, b: 41000, n: 0.6, source: "vendor quote 2026-03" }, PFR: { a: 8000, b: 30000, n: 0.62, source: "in-house database" }, currency: "EUR", basisYear: 2026, installationFactor: 3.1 };
    await t.db.insert(projectCostSettings).values({
      projectId,
      teamId: pin.teamId,
      settings,
      updatedBy: by,
    }).onConflictDoUpdate({
      target: projectCostSettings.projectId,
      set: { settings, updatedBy: by },
    });
    const [vessel] = await t.db.insert(inventoryVessels).values({ teamId: pin.teamId, tag: "R-107", type: "PFR", volume: 0.002, reuseCost: 1500, createdBy: by }).returning();
    await t.db
      .update(candidates)
      .set({ installedCost: 123456, inventoryPlan: { totalCost: 1500, allNewCost: 98000, assignments: [{ stage: 0, vesselId: vessel.id, cost: 1500 }] } })
      .where(eq(candidates.id, pin.candidateId!));
    const run = (status: "succeeded" | "failed", p50: number, finishedAt: Date) => ({
      teamId: pin.teamId,
      projectId,
      pinId,
      request: { uncertain: [{ field: "reaction.rate.k", kind: "plusMinus", fraction: 0.2 }], target: 0.9, samples: 2000, seed: 7 },
      status,
      result: status === "succeeded" ? { p5: 0.86, p50, p95: 0.93, mean: 0.899, probabilityOfMissingTarget: 0.42, probabilityStandardError: 0.011, samples: 2000, seed: 7, refusedSamples: 0, distribution: [] } : null,
      createdBy: by,
      finishedAt,
    });
    await t.db.insert(robustnessRuns).values([run("succeeded", 0.8, new Date(Date.now() + 60_000)), run("succeeded", 0.901, new Date(Date.now() + 120_000)), run("failed", 0, new Date(Date.now() + 180_000))]);

    const r = await getDesignReport(t.db, actors.manager, pinId);
    expect(r.source).toMatchObject({ recorded: true, kind: "fit", dataset: "October bench runs", datasetVersion: 2, rowCount: 14 });
    if (!r.source.recorded) throw new Error("unreachable");
    expect(r.source.fit?.rSquared).toBe(0.9934);
    expect(r.source.fit?.parameters[0]).toMatchObject({ name: "k", value: 1.02e-4, standardError: 3.1e-6 });
    expect(r.costs.settings).toMatchObject({ recorded: true, currency: "EUR", basisYear: 2026 });
    if (!r.costs.settings.recorded) throw new Error("unreachable");
    expect(r.costs.settings.correlations.map((c) => c.source)).toEqual(["vendor quote 2026-03", "in-house database"]);
    expect(r.costs.installedCost).toBe(123456);
    expect(r.costs.inventoryPlan).toMatchObject({ recorded: true, totalCost: 1500, allNewCost: 98000, assignments: [{ stage: 1, vesselTag: "R-107", cost: 1500 }] });
    // The latest succeeded run, not the older one nor the later failed one.
    expect(r.robustness).toMatchObject({ recorded: true, p50: 0.901, probabilityOfMissingTarget: 0.42, samples: 2000, seed: 7 });

    const text = await pdfText(await renderReportPdf(r));
    for (const s of ["October bench runs, version 2", "0.9934", "vendor quote 2026-03", "reuse R-107", "42.0 %", "0.9010"]) expect(text).toContain(s);
  });
});

describe("exports", () => {
  it("the stage CSV parses back to the report's numbers, with units in the headers", async () => {
    const r = await getDesignReport(t.db, actors.engineer, pinId);
    const parsed = Papa.parse<Record<string, unknown>>(stageTableCsv(r), { header: true, comments: "#", dynamicTyping: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toContain("volume (m3)");
    expect(parsed.meta.fields).toContain("residence time (s)");
    expect(parsed.data).toHaveLength(r.stages.length);
    parsed.data.forEach((row, i) => {
      expect(row["volume (m3)"]).toBe(r.stages[i].volume);
      expect(row["conversion out (-)"]).toBe(r.stages[i].conversionOut);
      expect(row["temperature out (K)"]).toBe(r.stages[i].temperatureOut);
      expect(row.type).toBe(r.stages[i].type);
    });
  });

  it("the ranked-list CSV holds every candidate of the scenario with the JSON API's numbers", async () => {
    const [pin] = await t.db.select().from(pinnedDesigns).where(eq(pinnedDesigns.id, pinId));
    const index = (pin.candidate as { scenario: { index: number } }).scenario.index;
    const q = { sort: "totalVolume", dir: "asc" } as const;
    const data = await exportCandidates(t.db, actors.engineer, pin.sweepId!, index, q);
    const api = await listCandidates(t.db, actors.engineer, pin.sweepId!, index, { ...q, page: 1, pageSize: 500 });
    expect(data.items.length).toBe(api.total);
    const parsed = Papa.parse<Record<string, unknown>>(candidatesCsv(pin.sweepId!, data), { header: true, comments: "#", dynamicTyping: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toHaveLength(api.total);
    parsed.data.forEach((row, i) => {
      const c = api.items[i];
      expect(row.sequence).toBe(c.sequence.join("-"));
      expect(row.rank).toBe(c.rank);
      expect(row["total volume (m3)"]).toBe(c.totalVolume ?? null);
      expect(row["installed cost (currency of the cost basis)"]).toBe(c.installedCost ?? null);
      expect(row["reused idle vessels"]).toBe(c.reused);
      expect(row["probability of meeting the target (-)"]).toBe(c.probabilityMeet ?? null);
      expect(String(row["stage volumes (m3)"]).split(" | ").map(Number)).toEqual(c.stages.map((s) => Number(s.volume)));
    });
  });

  it("exports refuse viewers and other teams like the ranked table", async () => {
    const [pin] = await t.db.select().from(pinnedDesigns).where(and(eq(pinnedDesigns.id, pinId)));
    expect(await accessOutcome(() => exportCandidates(t.db, actors.viewer, pin.sweepId!, 0, { sort: "rank", dir: "asc" }))).toBe("forbidden");
    expect(await accessOutcome(() => exportCandidates(t.db, actors.otherTeam, pin.sweepId!, 0, { sort: "rank", dir: "asc" }))).toBe("not_found");
  });
});
