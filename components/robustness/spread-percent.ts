/**
 * The ± spread of an uncertain input: the form takes percent (20 means ±20 %), the API and the
 * stored run take the fraction of the input's own value (0.2). The one conversion is here, so the
 * number typed and the number stored can never be read on different scales.
 */
export function spreadFractionFromPercent(typed: string): number {
  const t = typed.trim().replace(/\s*%$/, "");
  return t === "" ? Number.NaN : Number(t) / 100;
}

/** The percent a stored fraction reads as on screen (0.2 → "20"). */
export function spreadPercentFromFraction(fraction: number): string {
  return String(Number((fraction * 100).toPrecision(6)));
}
