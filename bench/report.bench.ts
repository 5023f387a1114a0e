/**
 * `npm run bench:report`: time to render the design report PDF of the demo pin (median of 15
 * after warm-up), and of an adiabatic three-stage train (adds the temperature profile). The pin
 * is built in memory exactly as lib/demo/seed.ts builds it, so no database is needed. Prints figures.
 */
import { writeFileSync } from "node:fs";
import type { PinnedDesign } from "../db/schema";
import { DEMO_KINETICS } from "../lib/demo/seed";
import { designTrains, type DesignSpec } from "../lib/engine";
import { buildDesignReport, type DesignReport } from "../lib/reports/design-report";
import { renderReportPdf } from "../lib/reports/report-pdf";
import { freezeCandidate } from "../lib/sweeps/freeze-candidate";
import { applyOverrides } from "../lib/sweeps/grid";
import { candidateRows } from "../lib/sweeps/candidate-rows";

function pinOf(spec: Record<string, unknown>): DesignReport {
  const result = designTrains(spec as unknown as DesignSpec);
  const [row] = candidateRows("bench-sweep", "bench-scenario", result);
  const reference = { ...result.reference, equilibriumConversion: result.equilibriumConversion ?? null, feedVolumetricFlow: result.feedVolumetricFlow };
  const at = new Date("2026-01-05T09:00:00Z");
  const candidate = freezeCandidate({ ...row, id: "c", installedCost: null, probabilityMeet: null, inventoryPlan: null }, { index: 4, overrides: {}, reference }, { id: "s", name: "Demo: feed rate × target conversion" });
  const pin: PinnedDesign = {
    id: "00000000-0000-4000-8000-000000000000",
    teamId: "t",
    projectId: "p",
    sweepId: "s",
    candidateId: "c",
    kineticsVersionId: "k",
    candidate,
    spec,
    note: "Least volume at the design feed of 0.02 mol/s and X = 0.9 (demo).",
    state: "approved",
    pinnedBy: "u1",
    pinnedAt: at,
    reviewerId: "u2",
    reviewComment: "Within the envelope",
    reviewedAt: at,
  };
  return buildDesignReport({
    pin,
    project: { id: "p", name: "Ester line 3 revamp", description: "" },
    names: { u1: "Eli Engineer", u2: "Marta Manager" },
    kinetics: { model: DEMO_KINETICS[0].name, version: 1 },
    source: null,
    candidate: null,
    costSettings: null,
    robustness: null,
    inventoryTags: {},
    now: at,
  });
}

const base = { ...DEMO_KINETICS[0].spec, target: { conversion: 0.9 }, train: { maxStages: 3, types: ["CSTR", "PFR"] }, objective: { minimise: "volume" } } as Record<string, unknown>;
const demo = applyOverrides(base, { "feed.flowA": 0.02, "target.conversion": 0.9 });
const adiabatic = applyOverrides(
  { ...demo, reaction: { ...(demo.reaction as object), thermal: { mode: "adiabatic", adiabaticRise: 40, maxTemperature: 400 } }, train: { candidates: [["CSTR", "CSTR", "PFR"]] } },
  {},
);

console.log("Design report PDF (median of 15 runs after 3 warm-up runs; one core of a shared 2-core machine)");
for (const [name, spec] of [
  ["demo pin (isothermal)", demo],
  ["adiabatic CSTR-CSTR-PFR", adiabatic],
] as const) {
  const report = pinOf(spec);
  for (let i = 0; i < 3; i++) await renderReportPdf(report);
  const times: number[] = [];
  let pdf: Buffer = Buffer.alloc(0);
  for (let i = 0; i < 15; i++) {
    const t0 = performance.now();
    pdf = await renderReportPdf(report);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const pages = (pdf.toString("latin1").match(/\/Type \/Page\b/g) ?? []).length;
  console.log(`  ${name.padEnd(26)} ${report.train.label.padEnd(20)} median ${times[7].toFixed(1).padStart(6)} ms  max ${times[14].toFixed(1).padStart(6)} ms  ${(pdf.length / 1024).toFixed(0)} KiB, ${pages} pages`);
  if (process.env.REPORT_BENCH_OUT) writeFileSync(`${process.env.REPORT_BENCH_OUT}-${name.split(" ")[0]}.pdf`, pdf);
}
