import { LineChart, type LineSeries } from "@/components/charts/line-chart";
import type { NetworkReport } from "@/lib/reports/network-report";
import { chemistryLines, compositionHeadings, fmtConcentration, measureLines, networkStageColumns, referenceLines } from "@/lib/reports/network-format";
import type { DisplayUnits } from "@/lib/units/display-preference";
import { Pairs, Section, StageTable } from "./report-parts";

function pathSeries(n: NetworkReport): LineSeries[] {
  const c = n.chart;
  if (!c) return [];
  return [
    { id: "tanks", label: "Single stirred tanks", points: c.tanks, tone: "muted", markers: true, line: false },
    { id: "tube", label: "Single tube", points: c.tube, tone: "reference" },
    ...c.stages.map((s) => ({ id: `stage-${s.index}`, label: `Stage ${s.index + 1} ${s.type}`, points: s.points, tone: { stage: s.index }, markers: s.type === "CSTR" })),
  ];
}

/** The sections of a report that belong to a train of several reactions, in the PDF's order. */
export function NetworkReportView({ network: n, trainLabel, units }: { network: NetworkReport; trainLabel: string; units: DisplayUnits }) {
  const columns = networkStageColumns(units);
  const headings = compositionHeadings(n);
  return (
    <>
      <Section id="report-train-title" title="Train">
        <Pairs lines={[{ label: "Sequence", value: trainLabel }, { label: "Ranked by", value: n.measures.objectiveLabel }, ...measureLines(n, units)]} />
        {n.limitNotes.length + n.steadyStateNotes.length > 0 ? (
          <ul className="mt-2 list-disc pl-5 text-sm" data-testid="report-network-notes">
            {[...n.limitNotes, ...n.steadyStateNotes].map((t) => (
              <li key={t}>{t}</li>
            ))}
          </ul>
        ) : null}
      </Section>

      <Section id="report-stages-title" title="Stages">
        <StageTable columns={columns} stages={n.stages} />
      </Section>

      <Section id="report-composition-title" title="Outlet composition">
        <div className="overflow-x-auto">
          <table className="table-dense" data-testid="report-composition-table">
            <thead>
              <tr>
                {headings.map((h, i) => (
                  <th key={h} scope="col" className={i > 0 ? "text-right" : undefined}>
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {n.composition.rows.map((row) => (
                <tr key={row.label}>
                  <th scope="row" className="whitespace-nowrap">
                    {row.label}
                  </th>
                  {row.values.map((v, i) => (
                    <td key={n.composition.species[i]} className="num text-right whitespace-nowrap">
                      {fmtConcentration(v)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Section>

      <Section id="report-path-title" title="Concentration path">
        {n.chart ? (
          <div className="report-chart">
            <LineChart
              series={pathSeries(n)}
              xLabel={`C_${n.chart.key}, mol/m³`}
              yLabel={`C_${n.chart.product}, mol/m³`}
              summary={`Concentration path of ${n.chart.product} against ${n.chart.key}: each stage's segment of the train over the single tube and single stirred tanks from the same feed; the numbers are in the composition table.`}
              testId="report-path-chart"
            />
          </div>
        ) : (
          <p className="text-sm text-ink-soft">{n.chartNote}</p>
        )}
      </Section>

      <div className="grid gap-4 lg:grid-cols-2">
        <Section id="report-reactions-title" title="Reactions">
          <Pairs lines={chemistryLines(n)} />
          <ol className="mt-2 space-y-2 text-sm" data-testid="report-reactions">
            {n.reactions.map((rx) => (
              <li key={rx.index}>
                <p className="font-medium">
                  Reaction {rx.index}: {rx.equation}
                </p>
                <Pairs lines={[{ label: "Rate law", value: `${rx.law}: ${rx.formula}` }, ...rx.constants]} />
              </li>
            ))}
          </ol>
        </Section>
        <div className="space-y-4">
          <Section id="report-feed-title" title="Feed">
            <Pairs lines={n.feed} />
          </Section>
          <Section id="report-target-title" title="Objective and limits">
            <Pairs lines={n.objective} />
          </Section>
          {n.references.length ? (
            <Section id="report-references-title" title="Single-stage references">
              <Pairs lines={referenceLines(n, units)} />
            </Section>
          ) : null}
        </div>
      </div>
    </>
  );
}
