/**
 * Where a network sweep request's field errors (from the form's own check or the server's answer)
 * show on the form. Pure.
 */

/** A request field path (from zod or the server) → the form field that shows it ("" for none). */
export function networkBuilderPathOf(path: string): string {
  const p = path.replace(/^spec\./, "");
  if (p.startsWith("kineticsVersionId")) return "kineticsVersionId";
  if (p === "name") return "name";
  if (p.startsWith("thermal.min")) return "tMin";
  if (p.startsWith("thermal.max")) return "tMax";
  if (p.startsWith("thermal")) return "heat";
  if (p.startsWith("train.maxStages")) return "maxStages";
  if (p.startsWith("train.types")) return "useCSTR";
  const c = /^train\.candidates\.(\d+)/.exec(p);
  if (c) return `candidates.${c[1]}.seq`;
  if (p.startsWith("train")) return "trainMode";
  if (p.startsWith("objective.product")) return "product";
  if (p.startsWith("objective")) return "objective";
  for (const k of ["minConversion", "minYield", "maxTotalVolume", "maxStageVolume"]) if (p.startsWith(`constraints.${k}`)) return k;
  const g = /^grid\.(\d+)\.(\w+)/.exec(p);
  if (g) return g[2] === "field" ? `grid.${g[1]}.field` : ["from", "to", "steps"].includes(g[2]!) ? `grid.${g[1]}.${g[2]}` : `grid.${g[1]}.values`;
  if (p.startsWith("grid")) return "grid";
  return "";
}

/** The form's field for each API field error; the rest are general. */
export function mapNetworkServerFields(fields: Record<string, string[]>): { byField: Record<string, string>; rest: string[] } {
  const byField: Record<string, string> = {};
  const rest: string[] = [];
  for (const [key, messages] of Object.entries(fields)) {
    const field = networkBuilderPathOf(key);
    if (field) byField[field] = [byField[field], ...messages].filter(Boolean).join(" ");
    else rest.push(...messages);
  }
  return { byField, rest };
}
