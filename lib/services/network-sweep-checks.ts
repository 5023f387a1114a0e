import { designNetwork, EngineError, type NetworkDesignSpec } from "@/lib/engine";
import { AppError, labelled } from "@/lib/errors";
import { labelFor } from "@/lib/schemas/field-labels";
import { issueInWords } from "@/lib/schemas/issue-words";
import { networkSpecSchema, type NetworkKineticsSpec } from "@/lib/schemas/network-spec";
import type { NetworkSweepCreate } from "@/lib/schemas/sweeps";
import { applyOverrides, type GridAxis, type Overrides } from "@/lib/sweeps/grid";
import { toBadRequest } from "./engine-errors";

/** The chemistry's fields: a problem there is the kinetics version's, named through it. */
const CHEMISTRY = /^(feed|phase|reactions|keyReactant)(\.|$)/;

/**
 * The spec every scenario of a network sweep starts from: the model's chemistry (without the units it
 * was typed in or its wanted product, which the objective names) with the sweep's heat mode, trains,
 * objective and limits: the engine's input as the command line reads it.
 */
export function networkBaseSpec(chemistry: NetworkKineticsSpec, input: NetworkSweepCreate): Record<string, unknown> {
  const { shownUnits: _units, product: _product, ...rest } = chemistry;
  return {
    ...rest,
    thermal: input.thermal,
    train: input.train,
    objective: input.objective,
    ...(input.constraints && Object.keys(input.constraints).length ? { constraints: input.constraints } : {}),
  };
}

function badField(field: string, words: string): AppError {
  return new AppError("bad_request", labelled(labelFor(field), words), { fields: { [field]: [words] } });
}

/** Where a field of a scenario's spec came from in the request, for error paths. */
function fieldOfRequest(path: string, grid: GridAxis[]): string {
  const axis = grid.findIndex((a) => a.field === path || path.startsWith(`${a.field}.`) || a.field.startsWith(`${path}.`));
  if (axis >= 0) return `grid.${axis}.field`;
  return CHEMISTRY.test(path) ? `kineticsVersionId (${path})` : path;
}

/** Records whose keys name species or parameters: only the ones the model lists can be varied. */
const NAMED_ONLY = /^(feed\.concentrations|reactions\.\d+\.stoichiometry|reactions\.\d+\.rate\.parameters)$/;

/**
 * Every varied field must lead somewhere in the base spec: a reaction that exists, a species of the feed.
 * Only the last step may be new (an optional limit such as the largest total volume, or an activation
 * energy the model left out); the schema then says whether such a field may be there at all.
 */
function checkAxesExist(base: Record<string, unknown>, grid: GridAxis[]): void {
  grid.forEach((axis, i) => {
    const keys = axis.field.split(".");
    let node: unknown = base;
    for (const key of keys.slice(0, -1)) {
      const next = Array.isArray(node) ? (/^\d+$/.test(key) ? node[Number(key)] : undefined) : node !== null && typeof node === "object" ? (node as Record<string, unknown>)[key] : undefined;
      // An optional group of the sweep (its limits) may be absent until a grid value fills it in.
      if (next === undefined && node === base && key === "constraints") return;
      if (next === null || typeof next !== "object") throw badField(`grid.${i}.field`, "this model has no such input; choose one from the list");
      node = next;
    }
    if (Array.isArray(node)) throw badField(`grid.${i}.field`, "this model has no such input; choose one from the list");
    const leaf = (node as Record<string, unknown>)[keys.at(-1)!];
    // A new key there would add a species or a parameter to the chemistry, not vary one.
    if (leaf === undefined && NAMED_ONLY.test(keys.slice(0, -1).join("."))) throw badField(`grid.${i}.field`, "this model has no such input; choose one from the list");
    if (leaf !== undefined && typeof leaf !== "number" && typeof leaf !== "string") throw badField(`grid.${i}.field`, "this input is not a number; choose one from the list");
  });
}

/**
 * Checks the resolved scenarios of a network sweep before anything is written: the grid's fields, the
 * shape of the first and last scenario, and the engine on the first. A limit one scenario cannot meet is
 * that scenario's result, unless the sweep has only one scenario; a malformed spec is the request's error.
 */
export function checkNetworkScenarios(base: Record<string, unknown>, grid: GridAxis[], all: Overrides[]): void {
  checkAxesExist(base, grid);
  const probes = all.length > 1 ? [all[0]!, all[all.length - 1]!] : all;
  let first: NetworkDesignSpec | null = null;
  for (const o of probes) {
    const parsed = networkSpecSchema.safeParse(applyOverrides(base, o));
    if (!parsed.success) {
      const issue = parsed.error.issues[0]!;
      const path = issue.path.join(".");
      const unknownKey = issue.code === "unrecognized_keys" ? grid.findIndex((a) => a.field.startsWith(path)) : -1;
      throw badField(unknownKey >= 0 ? `grid.${unknownKey}.field` : fieldOfRequest(path, grid), issueInWords(issue));
    }
    first ??= parsed.data;
  }
  try {
    designNetwork(first!);
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    if (all.length > 1 && err.code === "infeasible") return;
    const bad = toBadRequest(err);
    const words = bad.fields?.[err.path] ?? [bad.message];
    const field = fieldOfRequest(err.path, grid);
    throw new AppError("bad_request", `${labelFor(field)}: ${words.join(" ")}`, { fields: { [field]: words } });
  }
}
