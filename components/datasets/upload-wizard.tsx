"use client";

import { keepPreviousData, useMutation, useQuery } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useId, useMemo, useState } from "react";
import { Field, FormMessage } from "@/components/ui/field";
import { OptionList } from "@/components/ui/unit-options";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { guessMapping } from "@/lib/datasets/guess-mapping";
import { COLUMN_ROLES, DATASET_UNITS, datasetUnitOptions, DEFAULT_UNITS, ROLE_LABELS, ROLE_UNIT_KIND, type ColumnRole, type ValueRole } from "@/lib/datasets/units";
import type { DatasetMapping } from "@/lib/schemas/datasets";
import type { DatasetPreview, PreviewLine } from "@/lib/services/datasets";
import { Pager, usePage } from "./pager";

const COLUMN_ROLE_OPTIONS = COLUMN_ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));

export type UploadTarget = { kind: "new"; projectId: string } | { kind: "version"; projectId: string; datasetId: string; datasetName: string; nextVersion: number };

const EMPTY: DatasetMapping = { columns: {}, units: {} };

function uploadBody(file: File, mapping: DatasetMapping, extra: Record<string, string> = {}) {
  const form = new FormData();
  form.set("file", file);
  form.set("mapping", JSON.stringify(mapping));
  for (const [k, v] of Object.entries(extra)) if (v !== "") form.set(k, v);
  return form;
}

/**
 * Upload of measured rates: choose a CSV or XLSX file, say what each column holds and in
 * which unit, read the preview with every bad row marked and explained, pick a corrected
 * file if needed (the column choices stay), and accept the rows once they are all clean.
 */
export function UploadWizard({ target, initialMapping }: { target: UploadTarget; initialMapping?: DatasetMapping }) {
  const router = useRouter();
  const ids = useId();
  const [file, setFile] = useState<File | null>(null);
  const [fileKey, setFileKey] = useState(0);
  const [mapping, setMapping] = useState<DatasetMapping>(initialMapping ?? EMPTY);
  const [name, setName] = useState("");
  const [note, setNote] = useState("");
  const [feedConc, setFeedConc] = useState("");
  const [feedUnit, setFeedUnit] = useState("mol/L");
  const [onlyProblems, setOnlyProblems] = useState(false);

  const preview = useQuery({
    queryKey: ["dataset-preview", target.projectId, fileKey, JSON.stringify(mapping)],
    enabled: file !== null,
    retry: false,
    staleTime: Infinity,
    placeholderData: keepPreviousData,
    queryFn: () => fetchJson<{ preview: DatasetPreview }>(`/api/projects/${target.projectId}/datasets/preview`, { method: "POST", body: uploadBody(file!, mapping) }).then((r) => r.preview),
  });
  const p = preview.data;

  /** A new file whose headers match none of the chosen columns starts from a guess made from its headers. */
  async function chooseFile(f: File | null) {
    accept.reset();
    if (f) {
      const first = await fetchJson<{ preview: DatasetPreview }>(`/api/projects/${target.projectId}/datasets/preview`, { method: "POST", body: uploadBody(f, mapping) }).catch(() => null);
      const headers = first?.preview.headers ?? [];
      if (headers.length && !Object.keys(mapping.columns).some((h) => headers.includes(h))) setMapping(guessMapping(headers));
    }
    setFile(f);
    setFileKey((k) => k + 1);
  }

  const accept = useMutation({
    mutationFn: () => {
      const feedConcA = feedConc.trim() === "" ? "" : String(Number(feedConc) * DATASET_UNITS.concentration[feedUnit as keyof typeof DATASET_UNITS.concentration].factor);
      const body = uploadBody(file!, mapping, { feedConcA, note, ...(target.kind === "new" ? { name } : {}) });
      return target.kind === "new"
        ? fetchJson<{ dataset: { id: string }; version: { version: number } }>(`/api/projects/${target.projectId}/datasets`, { method: "POST", body }).then((r) => ({ datasetId: r.dataset.id, version: r.version.version }))
        : fetchJson<{ version: { version: number } }>(`/api/datasets/${target.datasetId}/versions`, { method: "POST", body }).then((r) => ({ datasetId: target.datasetId, version: r.version.version }));
    },
    onSuccess: ({ datasetId, version }) => router.push(`/projects/${target.projectId}/datasets/${datasetId}?version=${version}&saved=1`),
  });
  const acceptError = accept.error instanceof ApiError ? accept.error : null;

  const setRole = (header: string, role: ColumnRole) => setMapping((m) => ({ ...m, columns: { ...m.columns, [header]: role } }));
  const setUnit = (role: ValueRole, unit: string) => setMapping((m) => ({ ...m, units: { ...m.units, [role]: unit } }));

  const clean = p !== undefined && p.fileProblems.length === 0 && p.counts.withProblems === 0 && p.counts.good > 0;
  const usesConcA = Object.values(mapping.columns).includes("concA");
  const shown = useMemo(() => (p ? (onlyProblems ? p.lines.filter((l) => l.problems.length) : p.lines) : []), [p, onlyProblems]);
  const paged = usePage(shown);
  const mapped = p ? p.headers.filter((h) => (mapping.columns[h] ?? "ignore") !== "ignore") : [];

  return (
    <div className="space-y-4">
      <section className="card space-y-3 p-4" aria-labelledby={`${ids}-file`}>
        <h2 id={`${ids}-file`} className="text-base font-semibold">
          1. File
        </h2>
        <Field id={`${ids}-input`} label="CSV or XLSX file">
          <input
            id={`${ids}-input`}
            type="file"
            accept=".csv,.txt,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
            className="input"
            onChange={(e) => void chooseFile(e.target.files?.[0] ?? null)}
          />
          <p className="mt-1 text-xs text-ink-soft">First row: column headers. XLSX: the first worksheet is read. At most 2 MB and 20,000 rows.</p>
        </Field>
        {file ? (
          <p className="text-sm text-ink-soft" data-testid="chosen-file">
            {/* One state at a time: reading while the preview is asked for, then read or not read. */}
            {preview.isFetching ? "Reading" : preview.isError ? "Could not read" : "Read"} <span className="font-medium text-ink">{file.name}</span>
            {preview.isFetching ? " …" : ""}
          </p>
        ) : null}
        {preview.error ? <FormMessage kind="error">{preview.error.message}</FormMessage> : null}
      </section>

      {p && p.headers.length ? (
        <section className="card overflow-hidden" aria-labelledby={`${ids}-columns`}>
          <h2 id={`${ids}-columns`} className="border-b border-line px-3 py-2 text-base font-semibold">
            2. What each column holds
          </h2>
          <table className="table-dense" data-testid="column-mapping">
            <thead>
              <tr>
                <th scope="col">Column in the file</th>
                <th scope="col">Holds</th>
                <th scope="col">Unit</th>
              </tr>
            </thead>
            <tbody>
              {p.headers.map((h, i) => {
                const role = mapping.columns[h] ?? "ignore";
                return (
                  <tr key={h}>
                    <th scope="row" className="font-medium normal-case tracking-normal">
                      {h}
                    </th>
                    <td>
                      <select aria-label={`Column "${h}" holds`} className="input w-auto" value={role} onChange={(e) => setRole(h, e.target.value as ColumnRole)} id={`${ids}-role-${i}`}>
                        <OptionList options={COLUMN_ROLE_OPTIONS} />
                      </select>
                    </td>
                    <td>
                      {role === "ignore" ? (
                        <span className="text-ink-soft">—</span>
                      ) : (
                        <select aria-label={`Unit of column "${h}"`} className="input w-auto" value={mapping.units[role] ?? DEFAULT_UNITS[role]} onChange={(e) => setUnit(role, e.target.value)}>
                          <OptionList options={datasetUnitOptions(ROLE_UNIT_KIND[role])} />
                        </select>
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </section>
      ) : null}

      {p ? (
        <section className="card overflow-hidden" aria-labelledby={`${ids}-preview`}>
          <div className="flex flex-wrap items-center justify-between gap-3 border-b border-line px-3 py-2">
            <h2 id={`${ids}-preview`} className="text-base font-semibold">
              3. Preview
            </h2>
            <label className="flex items-center gap-2 text-sm">
              <input type="checkbox" checked={onlyProblems} onChange={(e) => setOnlyProblems(e.target.checked)} />
              Show only rows with problems
            </label>
          </div>
          <div className="space-y-2 px-3 py-2">
            <p data-testid="preview-counts" role="status">
              {p.counts.lines} rows read: {p.counts.good} good, {p.counts.withProblems} with problems.
            </p>
            {p.fileProblems.length ? (
              <FormMessage kind="error">
                <ul className="list-disc pl-4" data-testid="file-problems">
                  {p.fileProblems.map((fp, i) => (
                    <li key={i}>{fp.message}</li>
                  ))}
                </ul>
              </FormMessage>
            ) : p.counts.withProblems ? (
              <FormMessage kind="error">
                <span data-testid="fix-advice">
                  {p.counts.withProblems} row{p.counts.withProblems === 1 ? " has" : "s have"} problems, listed below with the reason. Correct them in your file, save it, and choose the corrected
                  file under 1. File — your column choices are kept. Nothing is stored until every row is clean and you accept.
                </span>
              </FormMessage>
            ) : null}
          </div>
          {mapped.length ? <PreviewTable lines={paged.rows} columns={mapped} /> : null}
          <Pager label="Preview pages" {...paged} />
        </section>
      ) : null}

      {clean ? (
        <section className="card space-y-3 p-4" aria-labelledby={`${ids}-accept`}>
          <h2 id={`${ids}-accept`} className="text-base font-semibold">
            4. {target.kind === "new" ? "Name and accept" : `Accept as version ${target.nextVersion} of ${target.datasetName}`}
          </h2>
          <form
            className="space-y-3"
            aria-label="Accept the rows"
            onSubmit={(e) => {
              e.preventDefault();
              accept.mutate();
            }}
          >
            <div className="grid gap-3 sm:grid-cols-2">
              {target.kind === "new" ? (
                <Field id={`${ids}-name`} label="Dataset name" error={acceptError?.fields.name?.join(" ")}>
                  <input id={`${ids}-name`} className="input" value={name} onChange={(e) => setName(e.target.value)} required minLength={2} maxLength={120} />
                </Field>
              ) : null}
              <Field id={`${ids}-feed`} label={`Feed concentration of A${usesConcA ? "" : " (optional)"}`} error={acceptError?.fields.feedConcA?.join(" ")}>
                <div className="flex gap-2">
                  <input id={`${ids}-feed`} className="input num min-w-0 flex-1" inputMode="decimal" value={feedConc} onChange={(e) => setFeedConc(e.target.value)} />
                  <select aria-label="Feed concentration unit" className="input w-auto" value={feedUnit} onChange={(e) => setFeedUnit(e.target.value)}>
                    <OptionList options={datasetUnitOptions("concentration")} />
                  </select>
                </div>
                <p className="mt-1 text-xs text-ink-soft">Converts concentrations of A to conversion, X = 1 − C_A/C_A0.</p>
              </Field>
              <Field id={`${ids}-note`} label="Note (optional)">
                <input id={`${ids}-note`} className="input" value={note} onChange={(e) => setNote(e.target.value)} maxLength={2000} />
              </Field>
            </div>
            {acceptError ? (
              <FormMessage kind="error">
                {acceptError.message}
                {acceptError.fields.file ? (
                  <ul className="list-disc pl-4">
                    {acceptError.fields.file.map((m) => (
                      <li key={m}>{m}</li>
                    ))}
                  </ul>
                ) : null}
              </FormMessage>
            ) : null}
            <button type="submit" className="btn-primary" disabled={accept.isPending || preview.isFetching}>
              Accept {p!.counts.good} rows
            </button>
          </form>
        </section>
      ) : null}
    </div>
  );
}

function PreviewTable({ lines, columns }: { lines: PreviewLine[]; columns: string[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="table-dense" data-testid="preview-table">
        <thead>
          <tr>
            <th scope="col">Line</th>
            {columns.map((c) => (
              <th scope="col" key={c} className="normal-case tracking-normal">
                {c}
              </th>
            ))}
            <th scope="col">Check</th>
          </tr>
        </thead>
        <tbody>
          {lines.map((l) => {
            const bad = l.problems.length > 0;
            return (
              <tr key={l.line} className={bad ? "bg-red-50" : undefined} data-problem={bad ? "yes" : "no"}>
                <td className="num">{l.line}</td>
                {columns.map((c) => {
                  const cellBad = l.problems.some((pr) => pr.column === c);
                  return (
                    <td key={c} className={`num ${cellBad ? "font-semibold text-red-800 underline decoration-dotted" : ""}`}>
                      {l.cells[c] === "" ? <span className="italic">(empty)</span> : l.cells[c]}
                    </td>
                  );
                })}
                <td>
                  {bad ? (
                    <span className="flex items-start gap-1 text-red-800">
                      <span aria-hidden="true">⚠</span>
                      <span>
                        <span className="sr-only">Problem: </span>
                        {l.problems.map((pr) => (pr.column ? `${pr.column}: ${pr.message}` : pr.message)).join("; ")}
                      </span>
                    </span>
                  ) : (
                    <span className="flex items-center gap-1 text-ink-soft">
                      <span aria-hidden="true">✓</span> OK
                    </span>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
