import { TemperatureProfile } from "@/components/candidates/temperature-profile";
import { Cautions } from "@/components/cautions/cautions";
import { NetworkReportView } from "./network-report-view";
import { Pairs, Section, StageTable } from "./report-parts";
import { robustnessLines } from "@/lib/reports/robustness-lines";
import { LevenspielChart } from "@/components/charts/levenspiel-chart";
import type { StoredStage } from "@/lib/sweeps/stored-json";
import type { DesignReport } from "@/lib/reports/design-report";
import type { DisplayPreference } from "@/lib/units/display-preference";
import { inputLines } from "@/lib/reports/input-lines";
import { fmtConversion, fmtMoney, fmtVolume, hasRecycle, reportUnits, stageColumns } from "@/lib/reports/report-format";
import { stageTypeCautions } from "@/lib/stage-types";
import { formatDateTime } from "@/lib/format/dates";
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";

const NotRecorded = ({ children }: { children: React.ReactNode }) => <p className="text-sm text-ink-soft">{children}</p>;

/** The design report on screen and on paper: every section of the report model, in the PDF's order. */
export function DesignReportView({ report: r, preference = "si" }: { report: DesignReport; preference?: DisplayPreference }) {
  const cs = r.costs.settings;
  const currency = cs.recorded ? cs.currency : null;
  const units = reportUnits(r, preference);
  const STAGE_COLUMNS = stageColumns(units, hasRecycle(r.stages));
  return (
    <article id="design-report" className="space-y-4" data-testid="design-report">
      <header className="space-y-1">
        <p className="text-sm text-ink-soft">Design report · {r.project.name}</p>
        <h1 data-testid="report-train">{r.train.label || "Pinned design"}</h1>
        <Pairs
          lines={[
            { label: "Review state", value: r.pin.reviewedBy ? `${r.pin.stateLabel} by ${r.pin.reviewedBy}, ${formatDateTime(r.pin.reviewedAt)}` : r.pin.stateLabel },
            ...(r.pin.reviewComment ? [{ label: "Review comment", value: `“${r.pin.reviewComment}”` }] : []),
            { label: "Pinned by", value: `${r.pin.pinnedBy}, ${formatDateTime(r.pin.pinnedAt)}` },
            { label: "Kinetics", value: `${r.kinetics.label} (${r.kinetics.law})` },
            { label: "Generated", value: formatDateTime(r.generatedAt) },
          ]}
        />
      </header>

      <Cautions warnings={r.cautions.warnings} more={stageTypeCautions(r.train.sequence)} />

      {r.network ? (
        <NetworkReportView network={r.network} trainLabel={r.train.label} units={units} />
      ) : (
        <>
          <Section id="report-train-title" title="Train">
            <Pairs
              lines={[
                { label: "Sequence", value: r.train.label },
                { label: "Target conversion", value: fmtConversion(r.target.conversion) },
                { label: "Conversion reached", value: fmtConversion(r.target.conversionReached) },
                { label: "Total volume", value: fmtVolume(r.train.totalVolume, units) },
                ...(r.train.totalCost !== null ? [{ label: "Total vessel cost", value: fmtMoney(r.train.totalCost, currency) }] : []),
                { label: "Volume over single PFR", value: r.train.ratioToPfr === null ? "—" : formatNumber(r.train.ratioToPfr, 4, RECORD_NUMBERS) },
              ]}
            />
          </Section>

          <Section id="report-chart-title" title="Levenspiel plot">
            <div className="report-chart">
              <LevenspielChart curve={r.chart.curve} stages={r.chart.stages} target={r.chart.target ?? undefined} equilibrium={r.chart.equilibrium} />
            </div>
          </Section>

          <Section id="report-stages-title" title="Stages">
            <StageTable columns={STAGE_COLUMNS} stages={r.stages} />
          </Section>

          {(r.thermal.mode === "adiabatic" || r.references.bestTemperaturePath) && r.stages.length ? (
            <Section id="report-temperature-title" title={r.references.bestTemperaturePath ? "Conversion and temperature" : "Temperature profile (adiabatic)"}>
              <TemperatureProfile
                stages={r.stages as unknown as StoredStage[]}
                bestPath={r.references.bestTemperaturePath}
                maxTemperature={r.references.bestTemperaturePath?.highestTemperature ?? r.thermal.maxTemperature}
              />
            </Section>
          ) : null}

          <div className="grid gap-4 lg:grid-cols-2">
            <Section id="report-feed-title" title="Feed">
              <Pairs lines={r.feed} />
            </Section>
            <Section id="report-kinetics-title" title="Kinetics">
              <Pairs lines={[{ label: "Model and version", value: r.kinetics.label }, { label: "Rate law", value: `${r.kinetics.law}: ${r.kinetics.formula}` }, ...r.kinetics.parameters, ...r.kinetics.reaction]} />
            </Section>
          </div>

        </>
      )}

      <Section id="report-source-title" title="Source of the kinetics">
        {!r.source.recorded ? (
          <NotRecorded>Not recorded: the kinetics were typed in, not derived from a rate dataset.</NotRecorded>
        ) : (
          <div className="space-y-2">
            <Pairs
              lines={[
                { label: "Dataset", value: `${r.source.dataset}, version ${r.source.datasetVersion} (${r.source.fileName}, ${r.source.rowCount} rows)` },
                { label: "Use", value: r.source.kind === "fit" ? "fitted rate law" : "measured table" },
                ...(r.source.fit ? [{ label: "Fitted law", value: r.source.fit.formula ?? r.source.fit.law ?? "—" }, { label: "R²", value: r.source.fit.rSquared === null ? "—" : r.source.fit.rSquared.toFixed(4) }] : []),
              ]}
            />
            {r.source.fit?.parameters.length ? (
              <table className="table-dense">
                <thead>
                  <tr>
                    <th scope="col">Parameter</th>
                    <th scope="col" className="text-right">
                      Value
                    </th>
                    <th scope="col" className="text-right">
                      Standard error
                    </th>
                    <th scope="col" className="text-right">
                      95 % interval
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {r.source.fit.parameters.map((p) => (
                    <tr key={p.name}>
                      <td>{p.name}</td>
                      <td className="num text-right">{formatNumber(p.value, 5, RECORD_NUMBERS)}</td>
                      <td className="num text-right">{p.standardError === null ? "—" : `± ${formatNumber(p.standardError, 3, RECORD_NUMBERS)}`}</td>
                      <td className="num text-right">{p.interval95 ? `${formatNumber(p.interval95[0], 4, RECORD_NUMBERS)} to ${formatNumber(p.interval95[1], 4, RECORD_NUMBERS)}` : "—"}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            ) : null}
          </div>
        )}
      </Section>

      {r.network ? null : (
        <div className="grid gap-4 lg:grid-cols-2">
          <Section id="report-target-title" title="Target and search">
            <Pairs lines={[{ label: "Target conversion", value: fmtConversion(r.target.conversion) }, ...r.objective]} />
          </Section>
          <Section id="report-references-title" title="Equilibrium and references">
            <Pairs
              lines={[
                { label: "Equilibrium conversion", value: r.equilibriumConversion === null ? "none (irreversible rate)" : fmtConversion(r.equilibriumConversion) },
                { label: "Single CSTR to the target", value: fmtVolume(r.references.singleCSTR, units) },
                { label: "Single PFR to the target", value: fmtVolume(r.references.singlePFR, units) },
                { label: "Feed volumetric flow", value: r.references.feedVolumetricFlow === null ? "—" : `${formatNumber(r.references.feedVolumetricFlow, 4, RECORD_NUMBERS)} m³/s` },
              ]}
            />
          </Section>
        </div>
      )}

      <Section id="report-costs-title" title="Costs">
        <div className="space-y-2" data-testid="report-costs">
          <Pairs
            lines={[
              { label: "Total vessel cost", value: fmtMoney(r.costs.totalCost, currency) },
              { label: "Installed cost", value: r.costs.installedCost === null ? "not recorded" : fmtMoney(r.costs.installedCost, currency) },
            ]}
          />
          {!cs.recorded ? (
            <NotRecorded>Cost basis: not recorded for this project.</NotRecorded>
          ) : (
            <>
              <Pairs lines={[{ label: "Currency and basis year", value: `${cs.currency ?? "—"}, ${cs.basisYear ?? "—"}` }, ...cs.other]} />
              <ul className="list-disc pl-5 text-sm">
                {cs.correlations.map((c) => (
                  <li key={c.type}>
                    {c.type}: cost = {formatNumber(c.a, 4, RECORD_NUMBERS)} + {formatNumber(c.b, 4, RECORD_NUMBERS)} · V^{formatNumber(c.n, 4, RECORD_NUMBERS)} (source: {c.source})
                  </li>
                ))}
              </ul>
            </>
          )}
          {!r.costs.inventoryPlan.recorded ? (
            <NotRecorded>Reuse of idle vessels: not recorded.</NotRecorded>
          ) : (
            <ul className="list-disc pl-5 text-sm">
              <li>
                With reused vessels {fmtMoney(r.costs.inventoryPlan.totalCost, currency)} (all new: {fmtMoney(r.costs.inventoryPlan.allNewCost, currency)})
              </li>
              {r.costs.inventoryPlan.assignments.map((a) => (
                <li key={a.stage}>
                  Stage {a.stage}: {a.vesselId ? `reuse ${a.vesselTag ?? a.vesselId}` : "buy new"}, {fmtMoney(a.cost, currency)}
                </li>
              ))}
            </ul>
          )}
        </div>
      </Section>

      <Section id="report-robustness-title" title="Robustness">
        {!r.robustness.recorded ? (
          <NotRecorded>Not recorded: no finished Monte Carlo run for this pinned design.</NotRecorded>
        ) : (
          <Pairs lines={robustnessLines(r.robustness, r.network?.product ?? null)} />
        )}
      </Section>

      <Section id="report-assumptions-title" title="Assumptions">
        <Pairs lines={[{ label: "Note of the pin", value: r.pin.note || "—" }]} />
        <ul className="mt-2 list-disc pl-5 text-sm">
          {r.assumptions.model.map((a) => (
            <li key={a}>{a}</li>
          ))}
        </ul>
        <details className="mt-2 text-sm">
          <summary className="cursor-pointer text-accent-700">{r.network ? "Inputs as computed (as stored; a number without a unit is in SI units)" : "Inputs as computed (as stored, in SI units)"}</summary>
          <div className="mt-1">
            <Pairs lines={inputLines(r.assumptions.spec)} />
          </div>
        </details>
      </Section>

    </article>
  );
}
