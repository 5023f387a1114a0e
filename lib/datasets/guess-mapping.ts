import type { DatasetMapping } from "@/lib/schemas/datasets";
import type { ColumnRole } from "./units";

/**
 * A first guess of each column's role and unit from its header, for the upload screen to
 * start from; the user confirms or changes every choice before anything is read for real.
 */
export function guessMapping(headers: string[]): DatasetMapping {
  const columns: Record<string, ColumnRole> = {};
  const units: DatasetMapping["units"] = {};
  const taken = new Set<ColumnRole>();
  for (const header of headers) {
    const h = header.toLowerCase();
    const role = guessRole(h);
    if (role === "ignore" || taken.has(role)) {
      columns[header] = "ignore";
      continue;
    }
    taken.add(role);
    columns[header] = role;
    if (role === "conversion" && h.includes("%")) units.conversion = "percent";
    if (role === "temperature") units.temperature = /k\)|\[k\]|kelvin|\(k$/.test(h) || /\bk$/.test(h) ? "K" : /f\)|degf|°f/.test(h) ? "degF" : "degC";
    if (role === "rate") {
      const r = h.replace(/\s/g, "");
      units.rate = /kmol/.test(r) ? "kmol/(m3 h)" : /m3|m³/.test(r) ? "mol/(m3 s)" : /\/h|h\)|·h/.test(r) ? "mol/(L h)" : /\/s|s\)|·s/.test(r) ? "mol/(L s)" : "mol/(L min)";
    }
    if (role === "concA" || role === "concR") units[role] = /mmol/.test(h) ? "mmol/L" : /kmol/.test(h) ? "kmol/m3" : /m3|m³/.test(h) ? "mol/m3" : "mol/L";
  }
  return { columns, units };
}

function guessRole(h: string): ColumnRole {
  if (/^x\b|conv/.test(h)) return "conversion";
  if (/rate|^-?r_?a\b|^r\b/.test(h)) return "rate";
  if (/^t\b|temp/.test(h)) return "temperature";
  if (/^c_?a\b|conc.*\ba\b|\[a\]/.test(h)) return "concA";
  if (/^c_?r\b|conc.*\br\b|\[r\]|product/.test(h)) return "concR";
  return "ignore";
}
