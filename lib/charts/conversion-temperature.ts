/**
 * The conversion–temperature chart of one train on a reversible exothermic reaction: the equilibrium
 * line, the best temperature path (the temperature of the highest rate at each conversion), the
 * highest temperature allowed, each stage's own path (an adiabatic stage a straight line of slope
 * equal to the adiabatic rise, a stage held at one temperature a level line) and the steps between
 * stages where the stream is cooled or heated at constant conversion. Plain data for the screens'
 * line chart and the PDF; temperatures are turned into the reader's unit by the caller's function.
 */

export interface TemperatureChartStage {
  type: string;
  conversionIn: number;
  conversionOut: number;
  temperatureIn: number;
  temperatureOut: number;
}

export interface TemperatureChartInput {
  stages: readonly TemperatureChartStage[];
  /** The scenario's best temperature path, when the reaction has one (reversible, exothermic). */
  bestPath?: { points: readonly { conversion: number; temperature: number; equilibriumTemperature?: number }[] } | null;
  /** Highest temperature a stage may reach, K. */
  maxTemperature?: number | null;
  /** What a stage type is called on screen, e.g. "CSTR", "Tube with recycle". */
  typeLabel?: (type: string) => string;
}

/** Tones the line chart draws: a stage's own style, or one of the neutral lines. */
export type TemperatureSeriesTone = { stage: number } | "reference" | "muted" | "limit" | "equilibrium";

export interface TemperatureSeries {
  id: string;
  label: string;
  points: { x: number; y: number }[];
  tone: TemperatureSeriesTone;
  markers?: boolean;
}

/** The chart's lines, temperatures in the reader's unit (`toDisplay` maps kelvin to it). */
export function conversionTemperatureSeries(input: TemperatureChartInput, toDisplay: (kelvin: number) => number = (t) => t): TemperatureSeries[] {
  const label = input.typeLabel ?? ((t: string) => t);
  const series: TemperatureSeries[] = [];
  const path = input.bestPath?.points ?? [];
  const equilibrium = path.filter((p) => p.equilibriumTemperature !== undefined && Number.isFinite(p.equilibriumTemperature));
  if (equilibrium.length >= 2) {
    series.push({ id: "equilibrium", label: "Equilibrium line", tone: "equilibrium", points: equilibrium.map((p) => ({ x: p.conversion, y: toDisplay(p.equilibriumTemperature as number) })) });
  }
  if (path.length >= 2) {
    series.push({ id: "best-path", label: "Best temperature path", tone: "reference", points: path.map((p) => ({ x: p.conversion, y: toDisplay(p.temperature) })) });
  }
  const xs = [...path.map((p) => p.conversion), ...input.stages.flatMap((s) => [s.conversionIn, s.conversionOut])].filter(Number.isFinite);
  if (input.maxTemperature !== null && input.maxTemperature !== undefined && Number.isFinite(input.maxTemperature) && xs.length) {
    const y = toDisplay(input.maxTemperature);
    series.push({ id: "max-temperature", label: "Highest temperature allowed", tone: "limit", points: [{ x: Math.min(0, ...xs), y }, { x: Math.max(...xs), y }] });
  }
  const steps: { x: number; y: number }[] = [];
  input.stages.forEach((s, i) => {
    series.push({
      id: `stage-${i + 1}`,
      label: `Stage ${i + 1} ${label(s.type)}`,
      tone: { stage: i },
      markers: true,
      points: [
        { x: s.conversionIn, y: toDisplay(s.temperatureIn) },
        { x: s.conversionOut, y: toDisplay(s.temperatureOut) },
      ],
    });
    const before = input.stages[i - 1];
    if (before && before.temperatureOut !== s.temperatureIn) {
      // A break in the line (NaN) keeps the steps apart when they are drawn as one series.
      if (steps.length) steps.push({ x: NaN, y: NaN });
      steps.push({ x: before.conversionOut, y: toDisplay(before.temperatureOut) }, { x: s.conversionIn, y: toDisplay(s.temperatureIn) });
    }
  });
  if (steps.length) series.push({ id: "between-stages", label: "Cooled or heated between stages", tone: "muted", points: steps });
  return series;
}

/** What a reader without the picture hears in its place. */
export function conversionTemperatureSummary(input: TemperatureChartInput, formatTemperature: (kelvin: number) => string): string {
  const parts: string[] = [];
  const path = input.bestPath?.points ?? [];
  if (path.length >= 2) {
    const first = path[0]!;
    const last = path[path.length - 1]!;
    parts.push(`best temperature path from ${formatTemperature(first.temperature)} at conversion ${first.conversion.toFixed(2)} to ${formatTemperature(last.temperature)} at ${last.conversion.toFixed(2)}`);
  }
  input.stages.forEach((s, i) => {
    parts.push(`stage ${i + 1} from ${formatTemperature(s.temperatureIn)} at conversion ${s.conversionIn.toFixed(3)} to ${formatTemperature(s.temperatureOut)} at ${s.conversionOut.toFixed(3)}`);
  });
  return `Conversion against temperature: ${parts.join("; ")}.`;
}

/**
 * The temperature axis: the lines' span with a margin (never from zero, unlike a volume axis). The
 * equilibrium line does not widen it: near zero conversion its temperature climbs far above anything a
 * stage reaches, and the chart clips it at the top instead.
 */
export function temperatureAxisRange(series: readonly TemperatureSeries[]): [number, number] {
  const ys = series.filter((s) => s.tone !== "equilibrium").flatMap((s) => s.points.map((p) => p.y)).filter(Number.isFinite);
  if (!ys.length) return [0, 1];
  const lo = Math.min(...ys);
  const hi = Math.max(...ys);
  const pad = Math.max((hi - lo) * 0.06, 1);
  return [lo - pad, hi + 2 * pad];
}
