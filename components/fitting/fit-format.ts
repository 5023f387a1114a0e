import type { DataRange, FitParameterOut } from "@/lib/schemas/fits";

/** A number in 4 significant figures, exponent form when very small or large. */
export function sig(v: number | null | undefined, digits = 4): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const a = Math.abs(v);
  return a < 1e-3 || a >= 1e5 ? v.toExponential(digits - 1) : Number(v.toPrecision(digits)).toString();
}

/** "k = 2.500e-5 ± 1.2e-8" */
export const valuePlusMinus = (p: FitParameterOut) => `${p.name} = ${sig(p.value)} ± ${sig(p.standardError, 2)}`;

/** The measured ranges, one phrase each. */
export function rangePhrases(r: DataRange): string[] {
  const out: string[] = [];
  if (r.conversion) out.push(`conversion ${sig(r.conversion[0], 3)} to ${sig(r.conversion[1], 3)}`);
  if (r.concA) out.push(`C_A ${sig(r.concA[0])} to ${sig(r.concA[1])} mol/m³`);
  if (r.concR) out.push(`C_R ${sig(r.concR[0])} to ${sig(r.concR[1])} mol/m³`);
  if (r.temperature) out.push(r.temperature[0] === r.temperature[1] ? `temperature ${sig(r.temperature[0])} K only` : `temperature ${sig(r.temperature[0])} to ${sig(r.temperature[1])} K`);
  out.push(`rate ${sig(r.rate[0])} to ${sig(r.rate[1])} mol/(m³·s)`);
  return out;
}
