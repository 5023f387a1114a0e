import { and, eq } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { rateDatasets, rateDatasetVersions, type projects } from "@/db/schema";

/*
 * Demo rate datasets of "Ester line 3 revamp". INVENTED demo data, not measurements: the
 * numbers come from the seeded demo kinetics (second order, -rA = k C_A C_B with
 * k = 1e-4 m³/(mol·s) at 340 K and Ea = 55 kJ/mol, C_A0 = 1000 mol/m³, B fed at 1.2 × A)
 * times a fixed, invented scatter of a few per cent, rounded as a bench sheet would be.
 */

const GAS_CONSTANT = 8.314462618; // J/(mol K), CODATA 2018 exact value
const ACTIVATION_ENERGY = 55_000; // J/mol, as in the demo kinetics
const K_340 = 1e-4; // m³/(mol s) at 340 K, as in the demo kinetics

/** A fixed, invented scatter (multipliers), so every seed gives the same numbers. */
const SCATTER = [1.02, 0.97, 1.01, 0.985, 1.03, 0.975, 1.015, 0.99, 1.025, 0.98, 1.01, 0.995];

const round = (v: number, digits = 4) => Number(v.toPrecision(digits));
const arrheniusK = (t: number) => K_340 * Math.exp((-ACTIVATION_ENERGY / GAS_CONSTANT) * (1 / t - 1 / 340));

/** Isothermal runs at 67 °C: rate against conversion, B fed at 1.2 × A. */
function isothermalRows(): Record<string, number>[] {
  const t = 340.15;
  const xs = [0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.85, 0.9];
  return xs.map((x, i) => ({ conversion: x, temperature: t, rate: round(arrheniusK(t) * 1000 * 1000 * (1 - x) * (1.2 - x) * SCATTER[i]) }));
}

/** Equimolar runs (C_B = C_A) at four temperatures: rate against the concentration of A. */
function multiTemperatureRows(): Record<string, number>[] {
  const rows: Record<string, number>[] = [];
  let i = 0;
  for (const celsius of [50, 60, 70, 80]) {
    const t = celsius + 273.15;
    for (const concA of [1000, 800, 600, 450, 300, 200]) {
      rows.push({ concA, temperature: t, rate: round(arrheniusK(t) * concA * concA * SCATTER[i++ % SCATTER.length]) });
    }
  }
  return rows;
}

export const DEMO_DATASETS = [
  {
    project: "Ester line 3 revamp",
    name: "Bench runs at 67 °C (rate vs conversion)",
    fileName: "ester-bench-67C.csv",
    mapping: { columns: { X: "conversion", "rate (mol/L/min)": "rate", "T (degC)": "temperature" }, units: { conversion: "fraction", rate: "mol/(L min)", temperature: "degC" } },
    rows: isothermalRows,
    feedConcA: 1000,
    note: "October bench campaign, batch samples (invented demo data).",
  },
  {
    project: "Ester line 3 revamp",
    name: "Equimolar runs, 50–80 °C (for an Arrhenius fit)",
    fileName: "ester-equimolar-4T.csv",
    mapping: { columns: { "T (degC)": "temperature", "C_A (mol/L)": "concA", "rate (mol/L/min)": "rate" }, units: { concA: "mol/L", rate: "mol/(L min)", temperature: "degC" } },
    rows: multiTemperatureRows,
    feedConcA: 1000,
    note: "Initial-rate runs at four temperatures, equimolar A and B (invented demo data).",
  },
];

/** Inserts the demo datasets (version 1 each) unless a dataset of that name exists. */
export async function seedDemoDatasets(tx: Executor, projectRows: (typeof projects.$inferSelect)[]): Promise<void> {
  for (const d of DEMO_DATASETS) {
    const project = projectRows.find((p) => p.name === d.project);
    if (!project) continue;
    const existing = await tx.select({ id: rateDatasets.id }).from(rateDatasets).where(and(eq(rateDatasets.projectId, project.id), eq(rateDatasets.name, d.name)));
    if (existing.length) continue;
    const [dataset] = await tx.insert(rateDatasets).values({ teamId: project.teamId, projectId: project.id, name: d.name, createdBy: project.createdBy }).returning();
    const rows = d.rows();
    await tx.insert(rateDatasetVersions).values({
      datasetId: dataset.id,
      version: 1,
      fileName: d.fileName,
      format: "csv",
      mapping: d.mapping,
      rows,
      rowCount: rows.length,
      feedConcA: d.feedConcA,
      note: d.note,
      createdBy: project.createdBy,
    });
  }
}
