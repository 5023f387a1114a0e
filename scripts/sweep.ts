/**
 * Command line: `npm run --silent sweep -- [--plot] FILE.json [FILE2.json ...]`.
 * One design (or rating) result per file, one JSON document per line, in file order; an error object
 * `{ "error": "...", "path": "..." }` on the line of a file that fails. Exit 1 if any failed, 2 when the
 * command line itself is wrong (an unknown option, no file).
 * Levenspiel plot points are left out unless `--plot` is given: they are most of the bytes and a batch
 * rarely draws them (docs/sweep-spec.md).
 */
import { readFileSync } from "node:fs";
import { designNetwork, designTrains, EngineError, rateTrain, type DesignResult } from "../lib/engine/index";
import { isNetworkSpec, networkSpecSchema } from "../lib/schemas/network-spec";
import { designSpecSchema, ratingSpecSchema } from "../lib/schemas/sweep-spec";
import { readSweepArgs } from "./sweep-args";

interface ErrorLine {
  error: string;
  path: string;
}

function fail(error: string, path: string): ErrorLine {
  return { error, path };
}

interface SchemaIssue {
  path: readonly PropertyKey[];
  message: string;
  code?: string;
  errors?: readonly (readonly SchemaIssue[])[];
}

/**
 * Inside a union of object forms (the train's three forms) the form that failed on the fewest fields, when
 * one clearly did and on a named field, is the one the file meant: its issue names the field ("train.recycleRatio:
 * Recycle ratio: ...") instead of "train: Invalid input". Other unions (a number or a quantity string) stay as they are.
 */
function closestIssue(issue: SchemaIssue): SchemaIssue {
  if (issue.code !== "invalid_union" || !issue.errors || issue.errors.length < 2) return issue;
  const sorted = [...issue.errors].sort((p, q) => p.length - q.length);
  const [best, next] = sorted;
  if (best.length === 0 || best.length >= next.length || best[0].path.length === 0) return issue;
  const inner = closestIssue(best[0]);
  return { ...inner, path: [...issue.path, ...inner.path] };
}

function schemaError(issues: readonly SchemaIssue[]): ErrorLine {
  const issue = closestIssue(issues[0]);
  const path = issue.path.map(String).join(".");
  return fail(path ? `${path}: ${issue.message}` : issue.message, path);
}

/**
 * The design without its plot points. Rest copies rather than `delete` (which would turn every stage into
 * a slow dictionary object before serialising) and rather than a JSON replacer (a call per key); any field
 * the engine adds later is kept.
 */
function withoutPlot(result: DesignResult): unknown {
  return {
    ...result,
    candidates: result.candidates.map((c) => ({ ...c, stages: c.stages.map(({ levenspiel: _plot, ...stage }) => stage) })),
  };
}

function runOne(file: string, plot: boolean): { line: unknown; ok: boolean } {
  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(file, "utf8"));
  } catch (err) {
    return { line: fail(`cannot read ${file} as JSON: ${err instanceof Error ? err.message : String(err)}`, ""), ok: false };
  }
  const isNetwork = isNetworkSpec(raw);
  const isRating = typeof raw === "object" && raw !== null && "stages" in raw && !("target" in raw);
  try {
    if (isNetwork) {
      // A file with "reactions" (several reactions) follows the network contract; its result has no plot points.
      const parsed = networkSpecSchema.safeParse(raw);
      if (!parsed.success) return { line: schemaError(parsed.error.issues), ok: false };
      return { line: designNetwork(parsed.data), ok: true };
    }
    if (isRating) {
      // A rating lists steady states per stage, no plot points.
      const parsed = ratingSpecSchema.safeParse(raw);
      if (!parsed.success) return { line: schemaError(parsed.error.issues), ok: false };
      return { line: rateTrain(parsed.data), ok: true };
    }
    const parsed = designSpecSchema.safeParse(raw);
    if (!parsed.success) return { line: schemaError(parsed.error.issues), ok: false };
    const design = designTrains(parsed.data);
    return { line: plot ? design : withoutPlot(design), ok: true };
  } catch (err) {
    if (err instanceof EngineError) return { line: fail(err.message, err.path), ok: false };
    return { line: fail(`internal error: ${err instanceof Error ? err.message : String(err)}`, ""), ok: false };
  }
}

function main(argv: readonly string[]): number {
  const args = readSweepArgs(argv);
  if ("error" in args) {
    process.stdout.write(`${JSON.stringify(fail(args.error, ""))}\n`);
    return 2;
  }
  let failed = false;
  const out: string[] = [];
  for (const file of args.files) {
    const { line, ok } = runOne(file, args.plot);
    failed ||= !ok;
    out.push(JSON.stringify(line));
  }
  process.stdout.write(`${out.join("\n")}\n`);
  return failed ? 1 : 0;
}

process.exitCode = main(process.argv.slice(2));
