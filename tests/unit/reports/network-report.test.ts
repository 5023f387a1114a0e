import Papa from "papaparse";
import { PDFParse } from "pdf-parse";
import { beforeAll, describe, expect, it } from "vitest";
import { CAUTIONS, rateNetworkTrain, type NetworkSpec } from "@/lib/engine";
import { DEMO_NETWORK } from "@/lib/demo/network-demo";
import { buildDesignReport, type DesignReport } from "@/lib/reports/design-report";
import { stageTableCsv } from "@/lib/reports/exports";
import { networkCurves } from "@/lib/reports/network-curves";
import { buildNetworkReport } from "@/lib/reports/network-report";
import { renderReportPdf } from "@/lib/reports/report-pdf";
import type { PinnedNetworkCandidate } from "@/lib/sweeps/stored-json";
import { frozenNetworkPin } from "../helpers/network-pin";

/** The text of a PDF with its line breaks joined, so a sentence wrapped across lines is found whole. */
async function pdfText(buf: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(buf) });
  try {
    return (await parser.getText()).text.replace(/\s+/g, " ");
  } finally {
    await parser.destroy();
  }
}

let report: DesignReport;
let candidate: PinnedNetworkCandidate;
let chemistry: NetworkSpec;

beforeAll(() => {
  // (designNetwork and the curves run once here, for every check below.)
  const frozen = frozenNetworkPin();
  candidate = frozen.candidate;
  chemistry = frozen.spec;
  report = buildDesignReport({
    pin: frozen.pin,
    project: { id: frozen.pin.projectId, name: DEMO_NETWORK.project.name, description: "" },
    names: { u1: "Erin Engineer" },
    kinetics: { model: DEMO_NETWORK.model.name, version: 1, spec: DEMO_NETWORK.model.spec },
    source: null,
    candidate: null,
    costSettings: null,
    robustness: null,
    inventoryTags: {},
    now: new Date("2026-12-03T12:00:00Z"),
    network: { spec: frozen.spec as unknown as Record<string, unknown>, curves: networkCurves(frozen.spec as unknown as Record<string, unknown>, frozen.candidate, "B") },
  });
}, 120_000);

describe("design report of a pinned train of several reactions", () => {
  it("is a network report of the pinned train, with the cautions", () => {
    expect(report.kind).toBe("network");
    expect(report.network).not.toBeNull();
    expect(report.train.label).toBe(candidate.sequence.join(" → "));
    expect(report.cautions.general).toEqual([...CAUTIONS]);
    // The JSON export carries the pinned candidate, the chemistry and the profiles.
    const n = report.network!;
    expect(n.candidate).toEqual(candidate);
    expect(n.chemistry.reactions).toEqual(chemistry.reactions);
    expect(n.profiles?.stages).toHaveLength(candidate.stages.length);
  });

  it("the composition table's stage rows are the engine's outlets of the same train rated on its own", () => {
    const n = report.network!;
    expect(n.composition.species).toEqual(["A", "B", "C", "D"]);
    // The fixed train rated again from the feed (rateNetworkTrain), independently of the designer's search.
    const rated = rateNetworkTrain(chemistry, candidate.stages.map((s) => ({ type: s.type, volume: s.volume })), "B");
    n.composition.rows.slice(1).forEach((row, i) => {
      expect(row.label).toBe(`Stage ${i + 1} (${candidate.stages[i].type}) outlet`);
      row.values.forEach((v, j) => {
        const engine = rated.stages[i].outlet[n.composition.species[j]];
        expect(Math.abs(v! - engine)).toBeLessThanOrEqual(1e-6 * 1200);
      });
    });
    // The last row's yield of B, C_B/C_A0 (liquid, constant density), is the pinned yield.
    const last = n.composition.rows.at(-1)!.values;
    expect(last[1]! / 1200).toBeCloseTo(candidate.yield!, 6);
  });

  it("the feed row is the feed in mol/m³, and every row keeps A + B + C + 2 D at the feed's A", () => {
    const n = report.network!;
    // 1.2 mol/L = 1200 mol/m³ (common practice: 1 L = 1e-3 m³).
    expect(n.composition.rows[0].label).toBe("Feed");
    expect(n.composition.rows[0].values).toEqual([1200, 0, 0, 0]);
    // A -> B, B -> C, 2 A -> D in a liquid: each A unit ends as A, B, C or half a D (a stoichiometric invariant, common practice).
    for (const row of n.composition.rows) {
      const [a, b, c, d] = row.values as number[];
      expect(Math.abs(a + b + c + 2 * d - 1200)).toBeLessThan(1e-6 * 1200);
    }
  });

  it("writes each reaction as an equation with its rate law and constants as typed", () => {
    const n = report.network!;
    expect(n.reactions.map((r) => r.equation)).toEqual(["A → B", "B → C", "2 A → D"]);
    expect(n.reactions[2].formula).toBe("r = k·C_A^2");
    expect(n.reactions[0].constants).toEqual([{ label: "k", value: "0.004 1/s" }]);
    expect(n.reactions[2].constants).toEqual([{ label: "k", value: "0.002 L/(mol*s)" }]);
    expect(n.keyReactant).toBe("A");
    expect(n.product).toBe("B");
    expect(n.heat).toBe("Isothermal at the feed temperature");
    expect(n.objective).toContainEqual({ label: "Objective", value: "Highest yield of B" });
    expect(n.objective).toContainEqual({ label: "Minimum conversion", value: "60 %" });
    expect(n.objective).toContainEqual({ label: "Largest total volume", value: "4 m³" });
  });

  it("draws each stage's segment from the feed to the train's outlet over the single tube", () => {
    const c = report.network!.chart!;
    expect(c.key).toBe("A");
    expect(c.product).toBe("B");
    expect(c.stages).toHaveLength(candidate.stages.length);
    expect(c.stages[0].points[0].x).toBeCloseTo(1200, 6);
    expect(c.stages[0].points[0].y).toBeCloseTo(0, 9);
    const end = c.stages.at(-1)!.points.at(-1)!;
    const outlet = candidate.stages.at(-1)!.outlet;
    expect(Math.abs(end.x - outlet.A)).toBeLessThan(1e-6 * 1200);
    expect(Math.abs(end.y - outlet.B)).toBeLessThan(1e-6 * 1200);
    // The single tube starts at the feed and only loses A along the way.
    expect(c.tube[0]).toEqual({ x: 1200, y: 0 });
    for (let i = 1; i < c.tube.length; i++) expect(c.tube[i].x).toBeLessThanOrEqual(c.tube[i - 1].x + 1e-9);
  });

  // Fonts subset and text read back: a safety bound for a loaded machine, not a timing.
  it("the PDF carries the composition table's headers and rows, the reactions, the path chart and the cautions", { timeout: 60_000 }, async () => {
    const pdf = await renderReportPdf(report);
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    const text = await pdfText(pdf);
    for (const h of ["Outlet composition", "Stream", "C_A, mol/m³", "C_B, mol/m³", "C_C, mol/m³", "C_D, mol/m³"]) expect(text).toContain(h);
    for (const row of report.network!.composition.rows) expect(text).toContain(row.label);
    expect(text).toContain("Reaction 3: 2 A → D");
    expect(text).toContain("Concentration path");
    expect(text).toContain("Highest yield of B");
    expect(text).toContain("Key reactant");
    expect(text).toContain("Wanted product");
    for (const caution of CAUTIONS) expect(text).toContain(caution);
    // No Levenspiel plot: a network has no single rate curve of conversion.
    expect(text).not.toContain("Levenspiel plot");
  });

  it("the CSV is the composition table with each stage's size and the train's totals, cautions first", () => {
    const csv = stageTableCsv(report);
    const lines = csv.split("\n");
    expect(lines[0].startsWith("# ")).toBe(true);
    expect(lines[1]).toContain(CAUTIONS[0]);
    const parsed = Papa.parse<Record<string, string>>(lines.slice(2).join("\n"), { header: true, skipEmptyLines: true });
    expect(parsed.meta.fields).toEqual(expect.arrayContaining(["stream", "type", "volume (m3)", "A (mol/m3)", "D (mol/m3)", "conversion of A (-)", "yield of B (-)", "selectivity to B (-)"]));
    const rows = parsed.data;
    expect(rows).toHaveLength(candidate.stages.length + 2);
    expect(Number(rows[0]["A (mol/m3)"])).toBe(1200);
    const totals = rows.at(-1)!;
    expect(totals.stream).toBe("Train outlet (totals)");
    expect(Number(totals["volume (m3)"])).toBeCloseTo(candidate.totalVolume!, 12);
    expect(Number(totals["yield of B (-)"])).toBeCloseTo(candidate.yield!, 12);
    expect(Number(totals["conversion of A (-)"])).toBeCloseTo(candidate.conversion!, 12);
    // The stage volumes add up to the total (common practice).
    const sum = rows.slice(1, -1).reduce((s, r) => s + Number(r["volume (m3)"]), 0);
    expect(sum).toBeCloseTo(candidate.totalVolume!, 9);
  });

  it("notes a stage on a limit and a stirred tank with several steady states, in words", () => {
    const stages = candidate.stages.map((st, i) =>
      i === 0 ? { ...st, steadyStates: [{ conversion: 0.12, outlet: st.outlet }, { conversion: 0.5, outlet: st.outlet }, { conversion: 0.93, outlet: st.outlet }] } : st,
    );
    const n = buildNetworkReport({ candidate: { ...candidate, stages, onBound: ["stage 2: largest stage volume", "largest total volume"] }, spec: chemistry as never, shownUnits: {}, modelProduct: null, curves: null });
    expect(n.limitNotes).toEqual(["At a limit: Stage 2: largest stage volume.", "At a limit: Largest total volume."]);
    expect(n.steadyStateNotes).toHaveLength(1);
    expect(n.steadyStateNotes[0]).toContain("Stage 1 (CSTR) has 3 steady states at this size (conversion 12 %, 50 %, 93 %)");
    expect(n.stages[0].steadyStates).toBe(3);
    // Without the curves the chart is left out with a reason, and the feed row still reads the stored numbers where it can.
    expect(n.chart).toBeNull();
    expect(n.chartNote).toBe("The concentration path could not be computed for this design.");
  });
});

