/**
 * The sections every design report shares, one-reaction or several: the pin and its review, where
 * the design came from, the source of the kinetics, the costs and the robustness run. Pure.
 */
import { labelFor } from "@/lib/schemas/field-labels";
import type { DesignReport, ReportInputs } from "./design-report";
import { STATE_LABEL } from "./design-report-states";
import type { WordLine } from "./kinetics-words";

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj => (v && typeof v === "object" && !Array.isArray(v) ? (v as Obj) : {});
const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);
const str = (v: unknown): string | null => (typeof v === "string" ? v : null);

export function fitSection(fit: Obj | null) {
  if (!fit) return null;
  const params = Array.isArray(fit.parameters) ? (fit.parameters as unknown[]).map(obj) : [];
  return {
    law: str(fit.kind) ?? str(fit.law),
    formula: str(fit.formula),
    parameters: params.map((p) => {
      const iv = Array.isArray(p.interval95) && p.interval95.length === 2 ? (p.interval95 as [number, number]) : null;
      return { name: String(p.name ?? "?"), value: num(p.value) ?? NaN, standardError: num(p.standardError), interval95: iv };
    }),
    rSquared: num(fit.rSquared),
    residualSumOfSquares: num(fit.residualSumOfSquares),
  };
}

export function uncertainLines(list: unknown): WordLine[] {
  return (Array.isArray(list) ? list : []).map(obj).map((u) => {
    // the label the form showed, from the one mapping; the report never prints a field path
    const field = labelFor(String(u.field ?? "input"));
    if (u.kind === "uniform") return { label: field, value: `uniform between ${u.low} and ${u.high}` };
    if (u.kind === "normal") return { label: field, value: `normal, mean ${u.mean}, standard deviation ${u.sd}` };
    if (u.kind === "plusMinus") return { label: field, value: `its value ± ${Math.round(Number(u.fraction) * 1000) / 10} %, uniformly` };
    return { label: field, value: "a spread this report cannot describe" };
  });
}

/** A cost-basis entry in words: sizes, limits and factors read as an engineer would write them. */
function costLine(key: string, v: unknown): WordLine {
  const o = obj(v);
  if (key === "sizes") {
    if (o.mode === "r10") return { label: "Standard sizes", value: `ISO 3 R10 preferred numbers from ${o.min} to ${o.max} m³` };
    if (o.mode === "custom") return { label: "Standard sizes", value: `${(Array.isArray(o.values) ? o.values : []).join(", ")} m³` };
    if (o.mode === "any") return { label: "Standard sizes", value: "any size" };
  }
  if (key === "maxVesselVolume") return { label: "Largest single vessel", value: v == null ? "no limit" : `${v} m³ (a larger stage is split into identical parallel vessels)` };
  if (key === "installationFactor") {
    const value = typeof v === "number" ? v : num(o.value);
    const source = str(o.source);
    return { label: "Installation factor", value: `${value ?? "—"} × purchase cost${source ? ` (${source})` : ""}` };
  }
  return { label: key, value: Array.isArray(v) ? v.join(", ") : typeof v === "object" && v !== null ? JSON.stringify(v) : String(v) };
}

export function costSettingsSection(row: ReportInputs["costSettings"]): DesignReport["costs"]["settings"] {
  if (!row) return { recorded: false };
  const s = row.settings;
  // The cost basis keeps correlations under "vessels"; older rows kept them at the top level.
  const vessels = obj(s.vessels);
  const correlations = (["CSTR", "PFR"] as const)
    .filter((t) => vessels[t] ?? s[t])
    .map((t) => {
      const c = obj(vessels[t] ?? s[t]);
      return { type: t, a: num(c.a), b: num(c.b), n: num(c.n), source: str(c.source) ?? "not given" };
    });
  const other: WordLine[] = Object.entries(s)
    .filter(([k]) => !["vessels", "CSTR", "PFR", "currency", "basisYear"].includes(k))
    .map(([k, v]) => costLine(k, v));
  return { recorded: true, currency: str(s.currency), basisYear: num(s.basisYear), correlations, other, updatedAt: row.updatedAt.toISOString() };
}


export const kineticsLabel = (input: ReportInputs) => (input.kinetics ? `${input.kinetics.model}, version ${input.kinetics.version}` : "kinetics version not found");

export function pinSection(input: ReportInputs): DesignReport["pin"] {
  const { pin } = input;
  const name = (id: string | null) => (id ? (input.names[id] ?? "someone") : null);
  return {
    id: pin.id,
    state: pin.state,
    stateLabel: STATE_LABEL[pin.state],
    note: pin.note,
    pinnedBy: name(pin.pinnedBy)!,
    pinnedAt: pin.pinnedAt.toISOString(),
    reviewedBy: name(pin.reviewerId),
    reviewedAt: pin.reviewedAt?.toISOString() ?? null,
    reviewComment: pin.reviewComment,
  };
}

export function originSection(input: ReportInputs): DesignReport["origin"] {
  const c = obj(input.pin.candidate);
  const scenario = obj(c.scenario);
  return {
    sweep: c.sweep ? { id: String(obj(c.sweep).id), name: String(obj(c.sweep).name) } : null,
    scenarioIndex: num(scenario.index),
    overrides: obj(scenario.overrides) as Record<string, number>,
    rank: num(c.rank),
  };
}

export function sourceSection(input: ReportInputs): DesignReport["source"] {
  return input.source
    ? { recorded: true, kind: input.source.kind, dataset: input.source.dataset, datasetVersion: input.source.datasetVersion, fileName: input.source.fileName, rowCount: input.source.rowCount, fit: fitSection(input.source.fit) }
    : { recorded: false };
}

export function costsSection(input: ReportInputs, totalCost: number | null): DesignReport["costs"] {
  const plan = input.candidate?.inventoryPlan ?? null;
  return {
    settings: costSettingsSection(input.costSettings),
    totalCost,
    installedCost: input.candidate?.installedCost ?? null,
    inventoryPlan: plan
      ? {
          recorded: true,
          totalCost: num(plan.totalCost),
          allNewCost: num(plan.allNewCost),
          assignments: (Array.isArray(plan.assignments) ? plan.assignments : []).map(obj).map((a) => {
            const vesselId = str(a.vesselId);
            return { stage: (num(a.stage) ?? 0) + 1, vesselId, vesselTag: vesselId ? (input.inventoryTags[vesselId] ?? str(a.tag)) : null, cost: num(a.cost) };
          }),
        }
      : { recorded: false },
  };
}

/** The latest finished Monte Carlo run; a run of a train of several reactions also carries its yield's distribution. */
export function robustnessSection(input: ReportInputs): DesignReport["robustness"] {
  const run = input.robustness;
  if (!run) return { recorded: false };
  const rres = run.result;
  const rreq = run.request;
  const y = obj(rres.yield);
  return {
    recorded: true,
    runId: run.id,
    finishedAt: run.finishedAt?.toISOString() ?? null,
    samples: num(rres.samples) ?? num(rreq.samples),
    seed: num(rres.seed) ?? num(rreq.seed),
    target: num(rreq.target),
    uncertain: uncertainLines(rreq.uncertain),
    p5: num(rres.p5),
    p50: num(rres.p50),
    p95: num(rres.p95),
    mean: num(rres.mean),
    probabilityOfMissingTarget: num(rres.probabilityOfMissingTarget),
    probabilityStandardError: num(rres.probabilityStandardError),
    refusedSamples: num(rres.refusedSamples),
    network:
      rres.kind === "network"
        ? {
            yield: rres.yield ? { p5: num(y.p5), p50: num(y.p50), p95: num(y.p95), mean: num(y.mean) } : null,
            minYield: num(rres.minYield),
            probabilityMissMinYield: num(rres.probabilityMissMinYield),
            probabilityMeet: num(rres.probabilityMeet),
          }
        : null,
  };
}
