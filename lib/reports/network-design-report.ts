/**
 * The design report of a pinned train of several reactions: the shared sections (pin, origin,
 * costs, robustness, cautions) as for one reaction, the chemistry, composition and path in
 * `network`, and the one-reaction sections left empty (no Levenspiel plot: a network has no single
 * rate curve of conversion). Pure.
 */
import { CAUTIONS, MODEL_ASSUMPTIONS, thermalWarnings } from "@/lib/engine";
import type { PinnedNetworkCandidate } from "@/lib/sweeps/stored-json";
import { typedUnits, type WithShownUnits } from "@/lib/units/typed-units";
import { REPORT_FORMAT, type DesignReport, type ReportInputs } from "./design-report";
import { buildNetworkReport } from "./network-report";
import { costsSection, kineticsLabel, originSection, pinSection, robustnessSection, sourceSection } from "./report-sections";

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj => (v && typeof v === "object" && !Array.isArray(v) ? (v as Obj) : {});

/** What a model of several reactions assumes beyond the engine's general list. */
export const NETWORK_ASSUMPTIONS = [
  "Each stirred tank is perfectly mixed and each tube in plug flow; every stage is isothermal.",
  "A liquid keeps a constant density; a gas is ideal at constant pressure, its flow following its total moles and temperature.",
  "A stirred tank with several steady states is continued from the one of lowest conversion of the key reactant.",
];

export function networkDesignReport(input: ReportInputs): DesignReport {
  const candidate = input.pin.candidate as unknown as PinnedNetworkCandidate;
  const spec = input.network?.spec ?? obj(input.pin.spec);
  const model = obj(input.kinetics?.spec);
  const shownUnits = (obj(model.shownUnits) as Record<string, string>) ?? {};
  const network = buildNetworkReport({
    candidate,
    spec,
    shownUnits,
    modelProduct: typeof model.product === "string" ? model.product : null,
    curves: input.network?.curves ?? null,
  });
  const sequence = candidate.sequence;
  const constraints = obj(spec.constraints);
  return {
    format: REPORT_FORMAT,
    kind: "network",
    network,
    generatedAt: input.now.toISOString(),
    project: input.project,
    pin: pinSection(input),
    origin: originSection(input),
    feed: network.feed,
    kinetics: {
      label: kineticsLabel(input),
      model: input.kinetics?.model ?? null,
      version: input.kinetics?.version ?? null,
      typedUnits: typedUnits(model as WithShownUnits),
      law: network.reactions.length === 1 ? "one reaction" : `${network.reactions.length} reactions`,
      formula: network.reactions.map((r) => r.equation).join("; "),
      parameters: [],
      reaction: [],
    },
    source: sourceSection(input),
    target: { conversion: typeof constraints.minConversion === "number" ? constraints.minConversion : null, conversionReached: candidate.conversion },
    objective: network.objective,
    train: { sequence, label: sequence.join(" → "), totalVolume: candidate.totalVolume, totalCost: null, ratioToPfr: null },
    stages: [],
    equilibriumConversion: null,
    references: { singleCSTR: candidate.scenario.reference?.singleCSTR?.volume ?? null, singlePFR: candidate.scenario.reference?.singlePFR?.volume ?? null, feedVolumetricFlow: candidate.scenario.reference?.feedVolumetricFlow ?? null, bestTemperaturePath: null },
    thermal: { mode: "isothermal", adiabaticRise: null, maxTemperature: null },
    costs: costsSection(input, null),
    robustness: robustnessSection(input),
    assumptions: { note: input.pin.note, model: [...NETWORK_ASSUMPTIONS, ...MODEL_ASSUMPTIONS.filter((a) => !a.startsWith("One reaction"))], spec },
    chart: { curve: [], stages: [], target: null, equilibrium: null },
    cautions: {
      warnings: [
        ...thermalWarnings({ thermal: null }),
        ...(obj(spec.thermal).mode === "stageTemperature"
          ? ["Each stage is held at its own temperature: the heating or cooling that keeps it there is not sized here, and must be studied with heat removal and runaway before relying on these sizes."]
          : []),
      ],
      general: [...CAUTIONS],
    },
  };
}
