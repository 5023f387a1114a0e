import { and, desc, eq, getTableColumns, max } from "drizzle-orm";
import type { Database, Executor } from "@/db/client";
import { rateDatasets, rateDatasetVersions } from "@/db/schema";
import { teamKineticsSources } from "@/db/queries/kinetics-sources";
import { teamDatasetVersion } from "@/db/queries/team-dataset-versions";
import { assertCan, type Actor } from "@/lib/authz/policy";
import { parseUpload, storedRow, type Upload } from "@/lib/datasets/parse-upload";
import type { ParsedTable, RowProblem } from "@/lib/datasets/rate-table";
import { tableLawFromRows, type StoredRateRow } from "@/lib/datasets/table-law";
import { AppError, notFound } from "@/lib/errors";
import type { TableKineticsInput } from "@/lib/schemas/datasets";
import type { KineticsSpec } from "@/lib/schemas/sweeps";
import { fileNameProblem } from "@/lib/schemas/text";
import { recordAudit } from "./audit";
import { addKineticsVersion, createKineticsModel, requireTeamModel, requireTeamProject } from "./kinetics";

/** A data line of the preview: its cells as read, its SI values when good, its problems when not. */
export interface PreviewLine {
  line: number;
  cells: Record<string, string>;
  si: Record<string, number> | null;
  problems: { column: string | null; message: string }[];
}

export interface DatasetPreview {
  fileName: string;
  format: Upload["format"];
  headers: string[];
  lines: PreviewLine[];
  /** Problems of the whole file or mapping (size, rows, missing columns); no line to mark. */
  fileProblems: RowProblem[];
  counts: { lines: number; good: number; withProblems: number };
}

function toPreview(upload: Upload, t: ParsedTable): DatasetPreview {
  const byLine = new Map<number, PreviewLine["problems"]>();
  const fileProblems: RowProblem[] = [];
  const dataLines = new Set(t.lines.map((l) => l.line));
  for (const p of t.problems) {
    if (dataLines.has(p.line)) {
      const list = byLine.get(p.line) ?? [];
      list.push({ column: p.column, message: p.message });
      byLine.set(p.line, list);
    } else fileProblems.push(p);
  }
  const good = new Map(t.rows.map((r) => [r.line, r]));
  const lines = t.lines.map((l) => ({ line: l.line, cells: l.cells, si: good.has(l.line) ? storedRow(good.get(l.line)!) : null, problems: byLine.get(l.line) ?? [] }));
  return {
    fileName: upload.fileName,
    format: upload.format,
    headers: t.headers,
    lines,
    fileProblems,
    counts: { lines: t.lineCount, good: t.rows.length, withProblems: byLine.size },
  };
}

/** Reads an upload and says what is wrong with it; stores nothing. */
export async function previewDataset(db: Database, actor: Actor, projectId: string, upload: Upload): Promise<DatasetPreview> {
  const project = await requireTeamProject(db, actor, projectId);
  assertCan(actor, "dataset.create", project, "project");
  return toPreview(upload, await parseUpload(upload));
}

const describeProblem = (p: RowProblem) => (p.line > 1 ? `line ${p.line}${p.column ? `, ${p.column}` : ""}: ${p.message}` : p.message);

/** The rows of an upload that is clean, or a 400 listing its problems (nothing is stored). */
async function cleanRows(upload: Upload): Promise<Record<string, number>[]> {
  const t = await parseUpload(upload);
  if (t.problems.length) {
    const shown = t.problems.slice(0, 50).map(describeProblem);
    if (t.problems.length > 50) shown.push(`… and ${t.problems.length - 50} more`);
    const badLines = new Set(t.problems.filter((p) => p.line > 1).map((p) => p.line)).size;
    const message = badLines ? `${badLines} row${badLines === 1 ? " has" : "s have"} problems; nothing was stored. Fix the file and upload it again.` : `${t.problems[0].message}; nothing was stored.`;
    throw new AppError("bad_request", message, { fields: { file: shown } });
  }
  if (!t.rows.length) throw new AppError("bad_request", "The file has no data rows; nothing was stored.", { fields: { file: ["The file has no data rows"] } });
  return t.rows.map(storedRow);
}

interface VersionInput {
  upload: Upload;
  feedConcA?: number;
  note: string;
}

/** A file name PostgreSQL cannot store (NUL, a broken character) is refused before any write. */
function assertStorableFileName(upload: Upload): void {
  const problem = fileNameProblem(upload.fileName);
  if (problem) throw new AppError("bad_request", problem, { fields: { file: [problem] } });
}

const versionValues = (datasetId: string, version: number, actor: Actor, input: VersionInput, rows: Record<string, number>[]) => ({
  datasetId,
  version,
  fileName: input.upload.fileName,
  format: input.upload.format,
  mapping: input.upload.mapping as Record<string, unknown>,
  rows,
  rowCount: rows.length,
  feedConcA: input.feedConcA ?? null,
  note: input.note,
  createdBy: actor.userId,
});

/** Creates a dataset and its version 1 from a clean upload, in one transaction with its audit entry. */
export async function createDataset(db: Database, actor: Actor, projectId: string, input: VersionInput & { name: string }) {
  const project = await requireTeamProject(db, actor, projectId);
  assertCan(actor, "dataset.create", project, "project");
  assertStorableFileName(input.upload);
  const rows = await cleanRows(input.upload);
  return db.transaction(async (tx) => {
    const [dataset] = await tx.insert(rateDatasets).values({ teamId: actor.teamId, projectId, name: input.name, createdBy: actor.userId }).returning();
    const [version] = await tx.insert(rateDatasetVersions).values(versionValues(dataset.id, 1, actor, input, rows)).returning();
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "dataset.created", entityType: "project", entityId: projectId, details: { dataset: dataset.name, datasetId: dataset.id, version: 1, rows: rows.length, file: input.upload.fileName } });
    return { dataset, version: withoutRows(version) };
  });
}

async function requireTeamDataset(db: Executor, actor: Actor, datasetId: string) {
  const [d] = await db.select().from(rateDatasets).where(and(eq(rateDatasets.id, datasetId), eq(rateDatasets.teamId, actor.teamId)));
  if (!d) throw notFound("dataset");
  return d;
}

/** A new version of a dataset from a clean upload; earlier versions stay as they were. */
export async function addDatasetVersion(db: Database, actor: Actor, datasetId: string, input: VersionInput) {
  const dataset = await requireTeamDataset(db, actor, datasetId);
  assertCan(actor, "dataset.create", dataset, "dataset");
  assertStorableFileName(input.upload);
  const rows = await cleanRows(input.upload);
  return db.transaction(async (tx) => {
    // Lock the dataset row so two uploads at once get consecutive numbers.
    await tx.select({ id: rateDatasets.id }).from(rateDatasets).where(eq(rateDatasets.id, datasetId)).for("update");
    const [{ latest }] = await tx.select({ latest: max(rateDatasetVersions.version) }).from(rateDatasetVersions).where(eq(rateDatasetVersions.datasetId, datasetId));
    const [version] = await tx.insert(rateDatasetVersions).values(versionValues(datasetId, (latest ?? 0) + 1, actor, input, rows)).returning();
    await recordAudit(tx, { teamId: actor.teamId, actorId: actor.userId, action: "dataset.version_added", entityType: "project", entityId: dataset.projectId, details: { dataset: dataset.name, datasetId, version: version.version, rows: rows.length, file: input.upload.fileName } });
    return withoutRows(version);
  });
}

// Lists carry version metadata only; the rows come with one version at a time.
const { rows: _rows, ...versionMeta } = getTableColumns(rateDatasetVersions);
function withoutRows<T extends { rows: unknown }>(v: T): Omit<T, "rows"> {
  const { rows: _omit, ...rest } = v;
  return rest;
}

export async function listDatasets(db: Database, actor: Actor, projectId: string) {
  const project = await requireTeamProject(db, actor, projectId);
  assertCan(actor, "dataset.read", project, "project");
  const datasets = await db.select().from(rateDatasets).where(eq(rateDatasets.projectId, projectId)).orderBy(rateDatasets.name);
  const out = [];
  for (const d of datasets) {
    // .at(0) rather than destructuring: its type says a dataset may have no version yet.
    const latest = (await db.select(versionMeta).from(rateDatasetVersions).where(eq(rateDatasetVersions.datasetId, d.id)).orderBy(desc(rateDatasetVersions.version)).limit(1)).at(0);
    out.push({ ...d, latestVersion: latest ?? null });
  }
  return out;
}

export async function getDataset(db: Database, actor: Actor, datasetId: string) {
  const dataset = await requireTeamDataset(db, actor, datasetId);
  assertCan(actor, "dataset.read", dataset, "dataset");
  const versions = await db.select(versionMeta).from(rateDatasetVersions).where(eq(rateDatasetVersions.datasetId, datasetId)).orderBy(desc(rateDatasetVersions.version));
  return { ...dataset, versions };
}

async function requireTeamDatasetVersion(db: Executor, actor: Actor, versionId: string) {
  const row = await teamDatasetVersion(db, actor.teamId, versionId);
  if (!row) throw notFound("dataset version");
  return row;
}

/** One version with its SI rows and the mapping it was read with, and its dataset. */
export async function getDatasetVersion(db: Database, actor: Actor, versionId: string) {
  const { version, dataset } = await requireTeamDatasetVersion(db, actor, versionId);
  assertCan(actor, "dataset.read", dataset, "dataset");
  return { ...version, dataset };
}

/**
 * Uses a dataset version as a measured rate table: a kinetics model (or a new version of one
 * of the same project) whose rate law is the table, with its source row written in the same
 * transaction as the kinetics version.
 */
export async function createTableKinetics(db: Database, actor: Actor, versionId: string, input: TableKineticsInput) {
  const { version, dataset } = await requireTeamDatasetVersion(db, actor, versionId);
  assertCan(actor, "dataset.read", dataset, "dataset");
  assertCan(actor, "kinetics.create", dataset, "dataset");
  const phase = input.phase ?? "liquid";
  const { law, temperature } = tableLawFromRows(version.rows as unknown as StoredRateRow[], {
    feedConcA: version.feedConcA ?? input.feed.concA,
    temperature: input.feed.temperature,
    phase,
  });
  const spec: KineticsSpec = {
    feed: { flowA: input.feed.flowA, concA: input.feed.concA, ...(temperature !== undefined ? { temperature } : {}) },
    reaction: { ...(input.stoichiometry ? { stoichiometry: input.stoichiometry } : {}), phase, rate: law, thermal: { mode: "isothermal" } },
  };
  const note = input.note ?? `Measured rate table: ${dataset.name} v${version.version} (${law.conversion.length} points)`;
  const source = { datasetVersionId: version.id, kind: "table" as const, fit: null };
  if (input.modelId) {
    const model = await requireTeamModel(db, actor, input.modelId);
    if (model.projectId !== dataset.projectId) throw new AppError("bad_request", "That kinetics model belongs to another project", { fields: { modelId: ["Choose a model of this dataset's project"] } });
    const kv = await addKineticsVersion(db, actor, model.id, { spec, note, source });
    return { model, version: kv };
  }
  return createKineticsModel(db, actor, dataset.projectId, { name: input.modelName!, spec, note, source });
}

/** The kinetics versions made from a dataset's versions (as a measured table or a fit), newest first. */
export async function listDatasetSources(db: Database, actor: Actor, datasetId: string) {
  const dataset = await requireTeamDataset(db, actor, datasetId);
  assertCan(actor, "dataset.read", dataset, "dataset");
  const rows = await teamKineticsSources(db, actor.teamId, { datasetId });
  // the law a fit chose, as stored with it; a hand-typed source has none
  return rows.map(({ fit, ...r }) => ({ ...r, law: typeof fit?.kind === "string" ? fit.kind : null }));
}
