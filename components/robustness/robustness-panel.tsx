"use client";

import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { refusalText } from "@/components/sweeps/loading-and-error-panels";
import { fetchJson } from "@/lib/client/fetch-json";
import { isNetworkRobustnessResult, MAX_SAMPLES, robustnessCreateSchema, type UncertainInput } from "@/lib/schemas/robustness";
import { RobustnessResult } from "./robustness-result";
import { NetworkRobustnessResult } from "./network-robustness-result";
import type { OfferedField, RobustnessList, RobustnessRunView } from "@/lib/services/views";
import { UncertainRow, type Draft } from "./uncertain-row";
import { spreadFractionFromPercent } from "./spread-percent";
import { formatDateTime } from "@/lib/format/dates";

function toInput(d: Draft): UncertainInput | { field: string; kind: string } {
  const num = (s: string) => (s.trim() === "" ? Number.NaN : Number(s));
  if (d.kind === "uniform") return { field: d.field, kind: "uniform", low: num(d.a), high: num(d.b) } as UncertainInput;
  if (d.kind === "normal") return { field: d.field, kind: "normal", mean: num(d.a), sd: num(d.b) } as UncertainInput;
  return { field: d.field, kind: "plusMinus", fraction: spreadFractionFromPercent(d.a) } as UncertainInput;
}

function firstDraft(fields: OfferedField[]): Draft {
  return { field: fields[0]?.field ?? "reaction.rate.k", kind: "plusMinus", a: "20", b: "" };
}

const pct = (x: number) => `${(100 * x).toFixed(1)} %`;

/** What the run checks, in the words of the train's kind. */
function introText(list: RobustnessList): string {
  const tail = "Each sample draws the uncertain inputs and rates the same stages.";
  if (list.kind !== "network" || !list.limits) return `How sure is this train to reach the target ${pct(list.target ?? 0)} if the inputs are not what was assumed? ${tail}`;
  const l = list.limits;
  const limits = [l.minYield !== null ? `the minimum yield ${pct(l.minYield)}${l.product ? ` of ${l.product}` : ""}` : null, l.minConversion !== null ? `the minimum conversion ${pct(l.minConversion)}` : null].filter(Boolean);
  return limits.length
    ? `How sure is this train to meet ${limits.join(" and ")} if the rate constants or the feed are not what was assumed? ${tail}`
    : `How widely do this train's conversion and yield spread if the rate constants or the feed are not what was assumed? ${tail}`;
}

/**
 * "Robustness": the fixed train rated by Monte Carlo under uncertain inputs, for a candidate or a
 * pinned design (`base` is its API path). Large runs go to the worker; the panel polls until done.
 */
export function RobustnessPanel({ base, canRun }: { base: string; canRun: boolean }) {
  const qc = useQueryClient();
  const list = useQuery({ queryKey: ["robustness", base], queryFn: () => fetchJson<RobustnessList>(`${base}/robustness`) });
  const [drafts, setDrafts] = useState<Draft[] | null>(null);
  const [samples, setSamples] = useState("1000");
  const [seed, setSeed] = useState("1");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [shownId, setShownId] = useState<string | null>(null);

  const latestId = shownId ?? list.data?.runs[0]?.id ?? null;
  const run = useQuery({
    queryKey: ["robustness-run", latestId],
    queryFn: () => fetchJson<{ run: RobustnessRunView }>(`/api/robustness/${latestId}`).then((r) => r.run),
    enabled: !!latestId,
    refetchInterval: (q) => (q.state.data && (q.state.data.status === "queued" || q.state.data.status === "running") ? 1000 : false),
  });

  const create = useMutation({
    mutationFn: (body: unknown) => fetchJson<{ run: RobustnessRunView }>(`${base}/robustness`, { method: "POST", json: body }),
    onSuccess: ({ run: r }) => {
      setShownId(r.id);
      qc.setQueryData(["robustness-run", r.id], r);
      void qc.invalidateQueries({ queryKey: ["robustness", base] });
    },
  });

  if (list.isPending) return <p className="text-sm text-ink-soft">Loading robustness runs…</p>;
  if (list.isError) return <p className="field-error">{refusalText(list.error, "load robustness runs", "")}</p>;
  const fields = list.data.fields;
  const rows = drafts ?? [firstDraft(fields)];

  const submit = () => {
    const body = { uncertain: rows.map(toInput), samples: Number(samples), seed: Number(seed) };
    const parsed = robustnessCreateSchema.safeParse(body);
    if (!parsed.success) {
      const next: Record<string, string> = {};
      for (const issue of parsed.error.issues) next[issue.path.join(".")] ??= issue.message;
      setErrors(next);
      return;
    }
    setErrors({});
    create.mutate(parsed.data);
  };
  const serverFields = create.error && "fields" in create.error ? (create.error.fields as Record<string, string[]>) : {};
  const errorFor = (key: string) => errors[key] ?? serverFields[key]?.[0];
  const current = run.data;

  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">{introText(list.data)}</p>
      {canRun ? (
        <form
          className="space-y-3"
          aria-label="Robustness run"
          onSubmit={(e) => {
            e.preventDefault();
            submit();
          }}
        >
          <fieldset className="space-y-2">
            <legend className="field-label">Uncertain inputs</legend>
            {rows.map((d, i) => (
              <UncertainRow
                key={i}
                index={i}
                draft={d}
                fields={fields}
                error={errorFor(`uncertain.${i}.field`) ?? errorFor(`uncertain.${i}.low`) ?? errorFor(`uncertain.${i}.high`) ?? errorFor(`uncertain.${i}.sd`) ?? errorFor(`uncertain.${i}.fraction`) ?? errorFor(`uncertain.${i}.mean`)}
                onChange={(next) => setDrafts(rows.map((r, k) => (k === i ? next : r)))}
                onRemove={rows.length > 1 ? () => setDrafts(rows.filter((_, k) => k !== i)) : undefined}
              />
            ))}
            {rows.length < Math.min(6, fields.length) ? (
              <button type="button" className="btn-quiet text-sm" onClick={() => setDrafts([...rows, { ...firstDraft(fields), field: fields.find((f) => !rows.some((r) => r.field === f.field))?.field ?? fields[0].field }])}>
                Add an uncertain input
              </button>
            ) : null}
            {errorFor("uncertain") ? <p className="field-error">{errorFor("uncertain")}</p> : null}
          </fieldset>
          <div className="flex flex-wrap items-end gap-3">
            <div>
              <label htmlFor="rb-samples" className="field-label">
                Samples
              </label>
              <input id="rb-samples" className="input w-32" inputMode="numeric" value={samples} onChange={(e) => setSamples(e.target.value)} aria-describedby="rb-samples-hint" />
              <p id="rb-samples-hint" className="mt-1 text-xs text-ink-soft">
                1 to {MAX_SAMPLES.toLocaleString("en")}; above {list.data.inlineSamples.toLocaleString("en")} the run is queued
              </p>
              {errorFor("samples") ? <p className="field-error">{errorFor("samples")}</p> : null}
            </div>
            <div>
              <label htmlFor="rb-seed" className="field-label">
                Random seed (repeatable draws)
              </label>
              <input id="rb-seed" className="input w-28" inputMode="numeric" value={seed} onChange={(e) => setSeed(e.target.value)} />
              {errorFor("seed") ? <p className="field-error">{errorFor("seed")}</p> : null}
            </div>
            <button type="submit" className="btn-primary" disabled={create.isPending} data-testid="robustness-run">
              {create.isPending ? "Rating…" : "Run"}
            </button>
          </div>
          {create.isError && Object.keys(serverFields).length === 0 ? (
            <p role="alert" className="field-error">
              {refusalText(create.error, "run the robustness check", "Runs need the engineer, manager or admin role.")}
            </p>
          ) : null}
        </form>
      ) : (
        <p className="text-sm text-ink-soft">Engineers, managers and admins run robustness checks; your role reads them.</p>
      )}

      <div aria-live="polite">
        {current ? (
          current.status === "succeeded" && current.result ? (
            isNetworkRobustnessResult(current.result) ? (
              <NetworkRobustnessResult result={current.result} />
            ) : (
              <RobustnessResult result={current.result} />
            )
          ) : current.status === "failed" ? (
            <p role="alert" className="field-error">
              The run failed: {current.error}
            </p>
          ) : (
            <p role="status" className="text-sm text-ink-soft" data-testid="robustness-waiting">
              {current.request.samples.toLocaleString("en")} samples are {current.status === "queued" ? "queued for the worker" : "being rated"}; this updates by itself.
            </p>
          )
        ) : null}
      </div>

      {list.data.runs.length > 1 ? (
        <div>
          <label htmlFor="rb-history" className="field-label">
            Earlier runs
          </label>
          <select id="rb-history" className="input" value={latestId ?? ""} onChange={(e) => setShownId(e.target.value)}>
            {list.data.runs.map((r) => (
              <option key={r.id} value={r.id}>
                {formatDateTime(r.createdAt)} · {r.request.samples.toLocaleString("en")} samples · {r.status}
              </option>
            ))}
          </select>
        </div>
      ) : null}
    </div>
  );
}
