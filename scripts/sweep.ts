/**
 * Command line: `npm run --silent sweep -- FILE.json [FILE2.json ...]`.
 * One design (or rating) result per file, one JSON document per line, in file order; an error object
 * `{ "error": "...", "path": "..." }` on the line of a spec that fails. Exit 1 if any failed.
 */
import { readFileSync } from "node:fs";
import { designNetwork, designTrains, EngineError, rateTrain } from "../lib/engine/index";
import { isNetworkSpec, networkSpecSchema } from "../lib/schemas/network-spec";
import { designSpecSchema, ratingSpecSchema } from "../lib/schemas/sweep-spec";

interface ErrorLine {
  error: string;
  path: string;
}

function fail(error: string, path: string): ErrorLine {
  return { error, path };
}

function schemaError(issues: readonly { path: readonly PropertyKey[]; message: string }[]): ErrorLine {
  const issue = issues[0];
  const path = issue.path.map(String).join(".");
  return fail(path ? `${path}: ${issue.message}` : issue.message, path);
}

function runOne(file: string): { line: unknown; ok: boolean } {
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
      // A spec with "reactions" (several reactions) follows the network contract; "reaction" keeps today's.
      const parsed = networkSpecSchema.safeParse(raw);
      if (!parsed.success) return { line: schemaError(parsed.error.issues), ok: false };
      return { line: designNetwork(parsed.data), ok: true };
    }
    if (isRating) {
      const parsed = ratingSpecSchema.safeParse(raw);
      if (!parsed.success) return { line: schemaError(parsed.error.issues), ok: false };
      return { line: rateTrain(parsed.data), ok: true };
    }
    const parsed = designSpecSchema.safeParse(raw);
    if (!parsed.success) return { line: schemaError(parsed.error.issues), ok: false };
    return { line: designTrains(parsed.data), ok: true };
  } catch (err) {
    if (err instanceof EngineError) return { line: fail(err.message, err.path), ok: false };
    return { line: fail(`internal error: ${err instanceof Error ? err.message : String(err)}`, ""), ok: false };
  }
}

function main(files: readonly string[]): number {
  if (files.length === 0) {
    process.stdout.write(`${JSON.stringify(fail("usage: npm run --silent sweep -- FILE.json [FILE2.json ...]", ""))}\n`);
    return 1;
  }
  let failed = false;
  const out: string[] = [];
  for (const file of files) {
    const { line, ok } = runOne(file);
    failed ||= !ok;
    out.push(JSON.stringify(line));
  }
  process.stdout.write(`${out.join("\n")}\n`);
  return failed ? 1 : 0;
}

process.exitCode = main(process.argv.slice(2).filter((a) => a !== "--"));
