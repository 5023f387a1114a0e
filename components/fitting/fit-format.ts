import type { DataRange, FitParameterOut } from "@/lib/schemas/fits";
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";

/** "k = 2.500e-5 ± 1.2e-8" */
export const valuePlusMinus = (p: FitParameterOut) => `${p.name} = ${formatNumber(p.value, 4, RECORD_NUMBERS)} ± ${formatNumber(p.standardError, 2, RECORD_NUMBERS)}`;

/** The measured ranges, one phrase each. */
export function rangePhrases(r: DataRange): string[] {
  const out: string[] = [];
  if (r.conversion) out.push(`conversion ${formatNumber(r.conversion[0], 3, RECORD_NUMBERS)} to ${formatNumber(r.conversion[1], 3, RECORD_NUMBERS)}`);
  if (r.concA) out.push(`C_A ${formatNumber(r.concA[0], 4, RECORD_NUMBERS)} to ${formatNumber(r.concA[1], 4, RECORD_NUMBERS)} mol/m³`);
  if (r.concR) out.push(`C_R ${formatNumber(r.concR[0], 4, RECORD_NUMBERS)} to ${formatNumber(r.concR[1], 4, RECORD_NUMBERS)} mol/m³`);
  if (r.temperature) out.push(r.temperature[0] === r.temperature[1] ? `temperature ${formatNumber(r.temperature[0], 4, RECORD_NUMBERS)} K only` : `temperature ${formatNumber(r.temperature[0], 4, RECORD_NUMBERS)} to ${formatNumber(r.temperature[1], 4, RECORD_NUMBERS)} K`);
  out.push(`rate ${formatNumber(r.rate[0], 4, RECORD_NUMBERS)} to ${formatNumber(r.rate[1], 4, RECORD_NUMBERS)} mol/(m³·s)`);
  return out;
}
