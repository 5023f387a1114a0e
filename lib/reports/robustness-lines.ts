/**
 * The robustness run of a report in words, for the page and the PDF alike: the samples, the
 * uncertain inputs, the conversion's spread and, for one reaction, the chance of missing the
 * target conversion; for several reactions, the yield's spread and the chances of missing the
 * minimum yield and of meeting every limit.
 */
import { formatDateTime } from "@/lib/format/dates";
import type { DesignReport } from "./design-report";
import type { WordLine } from "./kinetics-words";
import { fmtConversion, fmtPercent } from "./report-format";

type Recorded = Extract<DesignReport["robustness"], { recorded: true }>;

export function robustnessLines(rb: Recorded, product: string | null = null): WordLine[] {
  const head: WordLine[] = [
    { label: "Samples and random seed", value: `${rb.samples ?? "—"} samples, random seed ${rb.seed ?? "—"}${rb.refusedSamples ? `, ${rb.refusedSamples} could not be rated` : ""}` },
    ...rb.uncertain.map((u) => ({ label: `Uncertain: ${u.label}`, value: u.value })),
  ];
  const finished = { label: "Finished", value: formatDateTime(rb.finishedAt) };
  const net = rb.network;
  if (!net) {
    return [
      ...head,
      { label: "Outlet conversion P5 / P50 / P95", value: `${fmtConversion(rb.p5)} / ${fmtConversion(rb.p50)} / ${fmtConversion(rb.p95)}` },
      { label: "Mean outlet conversion", value: fmtConversion(rb.mean) },
      { label: "Probability of missing the target", value: `${fmtPercent(rb.probabilityOfMissingTarget)} ± ${fmtPercent(rb.probabilityStandardError)} (target ${fmtConversion(rb.target)})` },
      finished,
    ];
  }
  const of = product ? ` of ${product}` : "";
  const lines: WordLine[] = [...head, { label: "Conversion P5 / P50 / P95", value: `${fmtPercent(rb.p5)} / ${fmtPercent(rb.p50)} / ${fmtPercent(rb.p95)}` }];
  if (net.yield) {
    lines.push({ label: `Yield${of} P5 / P50 / P95`, value: `${fmtPercent(net.yield.p5)} / ${fmtPercent(net.yield.p50)} / ${fmtPercent(net.yield.p95)}` });
    lines.push({ label: `Mean yield${of}`, value: fmtPercent(net.yield.mean) });
  }
  lines.push({
    label: "Chance of missing the minimum yield",
    value: net.probabilityMissMinYield === null ? "no minimum yield set" : `${fmtPercent(net.probabilityMissMinYield)} (minimum yield ${fmtPercent(net.minYield)})`,
  });
  lines.push({ label: "Chance of meeting every limit", value: fmtPercent(net.probabilityMeet) });
  lines.push(finished);
  return lines;
}
