"use client";

import type { UnitKind } from "@/lib/units/display";
import Link from "next/link";
import { ProjectCrumbs } from "@/components/layout/breadcrumbs";
import { useRouter } from "next/navigation";
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { Cautions } from "@/components/cautions/cautions";
import { thermalWarnings } from "@/lib/engine";
import { useDisplayUnits } from "@/components/layout/display-units-context";
import { fetchJson } from "@/lib/client/fetch-json";
import { thumbnailYMax } from "@/lib/charts/thumbnail-plots";
import { ErrorPanel, LoadingPanel, refusalText } from "./loading-and-error-panels";
import { ResultsToolbar } from "./results-toolbar";
import { RankedTable } from "./ranked-table";
import { ObjectiveHeatMap, ScenarioPicker, twoVariedFields } from "./scenario-picker";
import { StatusBadge, SweepProgressBar } from "./sweep-progress";
import type { CandidatePage, ScenarioRow, SweepView as Sweep } from "@/lib/services/views";
import { candidatesKey, NETWORK_COLUMNS, serialiseViewState, useViewState } from "./view-state";
import type { FirstPage } from "./view-query";
import { isNetworkSweep, networkConstraintsOf, networkObjectiveOf } from "./network-sweep";
import { objectiveLabel, percent } from "@/components/candidates/network-results-data";
import { useNetworkUnits } from "@/components/candidates/network-units";
import type { RankedBy } from "./scenario-picker";
import type { SortKey } from "@/lib/sweeps/sort-keys";
import { trainsWithRecycle } from "./sweep-train-types";
import { stageTypeCautions } from "@/lib/stage-types";

const ACTIVE = new Set(["queued", "running"]);

export function SweepView({
  sweepId,
  projectId,
  projectName,
  canSubmit,
  typedUnits,
  initial,
}: {
  sweepId: string;
  projectId: string;
  projectName: string;
  canSubmit: boolean;
  /** The units the sweep's kinetics was typed in: the grid axis speaks them. */
  typedUnits?: Partial<Record<UnitKind, string>>;
  /** What the server read for the first paint: the sweep, its scenarios and the first table page. */
  initial?: FirstPage;
}) {
  const router = useRouter();
  const qc = useQueryClient();
  const [urlView, setView] = useViewState();
  const [selected, setSelected] = useState<string[]>([]);
  const [actionError, setActionError] = useState<string | null>(null);

  const sweepQ = useQuery({
    queryKey: ["sweep", sweepId],
    queryFn: () => fetchJson<{ sweep: Sweep }>(`/api/sweeps/${sweepId}`).then((r) => r.sweep),
    refetchInterval: (q) => (q.state.data && !ACTIVE.has(q.state.data.status) ? false : 1000),
    initialData: initial?.sweep,
    // A running sweep is read again at once (its progress moves); a finished one the server just read is not.
    staleTime: (q) => (q.state.data && !ACTIVE.has(q.state.data.status) ? 15_000 : 0),
  });
  const sweep = sweepQ.data;
  const finished = !!sweep && !ACTIVE.has(sweep.status);
  const hasResults = finished && sweep.done > 0;

  // When the run ends, the scenarios and their candidates are new: read them again.
  const wasActive = useRef(false);
  useEffect(() => {
    if (sweep && ACTIVE.has(sweep.status)) wasActive.current = true;
    else if (sweep && wasActive.current) {
      wasActive.current = false;
      void qc.invalidateQueries({ queryKey: ["scenarios", sweepId] });
      void qc.invalidateQueries({ queryKey: ["candidates", sweepId] });
    }
  }, [sweep, qc, sweepId]);

  // Scenarios and candidates are asked for at once with the sweep, not after it: one round trip
  // less before the table. While the sweep runs they are not shown, and are read again when it ends.
  const scenariosQ = useQuery({
    queryKey: ["scenarios", sweepId],
    queryFn: () => fetchJson<{ scenarios: ScenarioRow[] }>(`/api/sweeps/${sweepId}/scenarios`).then((r) => r.scenarios),
    enabled: !sweep || hasResults,
    initialData: initial?.scenarios,
  });
  // Thumbnails ride along with the page while it is small enough (a network has no Levenspiel chart).
  const network = isNetworkSweep(sweep);
  const networkUnits = useNetworkUnits(typedUnits);
  const candidatesKeyNow = candidatesKey(sweepId, urlView, network);
  // The server's first page seeds the cache only under the key it answers; any other sort, page or
  // scenario is fetched. A finished scenario's ranking never changes, so a page read once stays fresh
  // (the end of a run invalidates them explicitly above).
  const seeded = initial?.candidates && JSON.stringify(initial.candidates.key) === JSON.stringify(candidatesKeyNow) ? initial.candidates.page : undefined;
  const readPage = useCallback((key: ReturnType<typeof candidatesKey>) => () => fetchJson<CandidatePage>(`/api/sweeps/${sweepId}/scenarios/${key[2]}/candidates?${key[3]}`), [sweepId]);
  const candidatesQ = useQuery({
    queryKey: candidatesKeyNow,
    queryFn: readPage(candidatesKeyNow),
    enabled: !sweep || hasResults,
    initialData: seeded,
    staleTime: finished ? Infinity : 0,
    // The rows on screen stay while the next sort or page loads: no flash of an empty table.
    placeholderData: keepPreviousData,
  });

  const rowsShown = !!candidatesQ.data && !candidatesQ.isPlaceholderData;
  const lastPage = candidatesQ.data ? Math.max(1, Math.ceil(candidatesQ.data.total / urlView.pageSize)) : 1;
  // A finished sweep's next page is read while the reader looks at this one, so "Next →" shows it at
  // once (its ranking never changes, so what is read stays right). Left to an idle moment: the page's
  // own first paint and clicks come first.
  useEffect(() => {
    if (!finished || !rowsShown || urlView.page >= lastPage) return;
    const key = candidatesKey(sweepId, { ...urlView, page: urlView.page + 1 }, network);
    const run = () => void qc.prefetchQuery({ queryKey: key, queryFn: readPage(key), staleTime: Infinity });
    if (typeof window.requestIdleCallback !== "function") return run();
    const idle = window.requestIdleCallback(run, { timeout: 500 });
    return () => window.cancelIdleCallback(idle);
  }, [finished, rowsShown, lastPage, urlView, sweepId, network, qc, readPage]);

  // A sort, filter, page or scenario change asks for its rows at the click, before the page redraws
  // for the new view (the query would otherwise start only once that redraw is committed).
  const changeView = useCallback(
    (patch: Parameters<typeof setView>[0]) => {
      const next = setView(patch);
      if (finished) {
        const key = candidatesKey(sweepId, next, network);
        void qc.prefetchQuery({ queryKey: key, queryFn: readPage(key), staleTime: Infinity });
      }
    },
    [setView, finished, sweepId, network, qc, readPage],
  );
  const selectScenario = useCallback((scenario: number) => changeView({ scenario }), [changeView]);
  const sortBy = useCallback((sort: SortKey, dir: "asc" | "desc") => changeView({ sort, dir }), [changeView]);

  const cancel = useMutation({
    mutationFn: () => fetchJson<{ sweep: Sweep }>(`/api/sweeps/${sweepId}/cancel`, { method: "POST" }),
    onMutate: () => setActionError(null),
    onSuccess: (r) => qc.setQueryData(["sweep", sweepId], r.sweep),
    onError: (e) => setActionError(refusalText(e, "cancel this sweep", "Engineers may cancel only the sweeps they submitted; a manager or an admin can cancel any.")),
  });
  const rerun = useMutation({
    mutationFn: () => fetchJson<{ sweep: Sweep }>(`/api/sweeps/${sweepId}/rerun`, { method: "POST" }),
    onMutate: () => setActionError(null),
    onSuccess: (r) => router.push(`/projects/${projectId}/sweeps/${r.sweep.id}`),
    onError: (e) => setActionError(refusalText(e, "re-run this sweep", "Re-running needs the engineer, manager or admin role.")),
  });

  // Volumes follow the user's display-unit setting (litres while the largest train on the page is
  // below 1 m³) unless a unit was picked on this page, which the URL then keeps.
  const largestVolume = useMemo(() => Math.max(0, ...(candidatesQ.data?.items ?? []).map((r) => r.totalVolume ?? 0)), [candidatesQ.data]);
  const shownUnits = useDisplayUnits(largestVolume || null, typedUnits);
  const view = useMemo(() => ({ ...urlView, unit: urlView.unit ?? shownUnits.volume }), [urlView, shownUnits.volume]);

  const toggle = useCallback((id: string) => setSelected((s) => (s.includes(id) ? s.filter((x) => x !== id) : s.length >= 4 ? s : [...s, id])), []);
  const qs = serialiseViewState(urlView);
  const back = encodeURIComponent(`/projects/${projectId}/sweeps/${sweepId}${qs ? `?${qs}` : ""}`);
  const candidateHref = useCallback((id: string) => `/projects/${projectId}/sweeps/${sweepId}/candidates/${id}?${urlView.unit ? `unit=${urlView.unit}&` : ""}back=${back}`, [projectId, sweepId, urlView.unit, back]);

  const rows = candidatesQ.data?.items;
  const singleSpec = sweep?.kind === "single" ? sweep.spec : undefined;
  const target = singleSpec?.target?.conversion;
  const yMax = useMemo(() => (network || !rows ? undefined : thumbnailYMax(rows, target)), [rows, target, network]);
  const scenarios = useMemo(() => scenariosQ.data ?? [], [scenariosQ.data]);
  const grid2 = useMemo(() => twoVariedFields(scenarios), [scenarios]);

  if (sweepQ.isPending) return <LoadingPanel label="Loading the sweep…" />;
  if (sweepQ.isError || !sweep) return <ErrorPanel error={sweepQ.error} what="this sweep" />;

  const networkObjective = networkObjectiveOf(sweep);
  const objective: RankedBy = networkObjective ? ("maximise" in networkObjective ? networkObjective.maximise : "volume") : (singleSpec?.objective?.minimise ?? "volume");
  const product = networkObjective?.product ?? null;
  const limits = networkConstraintsOf(sweep);
  // When the target is a grid variable the base value is not what was run: show the grid's range.
  const swept = scenarios.map((sc) => sc.overrides["target.conversion"]).filter((x): x is number => typeof x === "number");
  const targetText = swept.length ? `${Math.min(...swept)}–${Math.max(...swept)} (varied)` : (target ?? "—");
  const page = candidatesQ.data;
  const pages = page ? Math.max(1, Math.ceil(page.total / view.pageSize)) : 1;
  const warnings = network ? [] : thermalWarnings({ thermal: singleSpec?.reaction?.thermal, stageTemperatures: (rows ?? []).slice(0, 1).flatMap((r) => r.stages.map((s) => s.temperatureOut)) });

  return (
    <div className="space-y-5">
      <ProjectCrumbs project={{ id: projectId, name: projectName }} here="Sweep" />
      <header className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <h1 data-testid="sweep-title">{sweep.name}</h1>
          <p className="mt-1 flex flex-wrap items-center gap-2 text-ink-soft">
            <StatusBadge status={sweep.status} />
            {network ? (
              <span data-testid="sweep-objective">
                {sweep.total} scenario{sweep.total === 1 ? "" : "s"} · {objectiveLabel(networkObjective)}
                {limits.minConversion !== undefined ? ` · minimum conversion ${percent(limits.minConversion)}` : ""}
                {limits.minYield !== undefined ? ` · minimum yield ${percent(limits.minYield)}` : ""}
              </span>
            ) : (
              <span>
                {sweep.total} scenario{sweep.total === 1 ? "" : "s"} · minimise {objective} · target X {targetText}
              </span>
            )}
          </p>
        </div>
        {canSubmit ? (
          <div className="flex gap-2">
            {!finished ? (
              <button type="button" className="btn-danger" onClick={() => cancel.mutate()} disabled={cancel.isPending}>
                {cancel.isPending ? "Cancelling…" : "Cancel sweep"}
              </button>
            ) : (
              <button type="button" className="btn-quiet" onClick={() => rerun.mutate()} disabled={rerun.isPending}>
                {rerun.isPending ? "Submitting…" : "Re-run"}
              </button>
            )}
          </div>
        ) : null}
      </header>
      {actionError ? (
        <div role="alert" className="rounded border border-red-200 bg-red-50 px-3 py-2 text-sm text-red-800" data-testid="action-error">
          {actionError}
        </div>
      ) : null}

      <section className="card p-4" aria-label="Progress">
        <SweepProgressBar sweep={sweep} />
        {sweep.error ? <p className="mt-2 text-sm text-red-800">{sweep.error}</p> : null}
      </section>

      {!hasResults ? (
        <section className="card p-6 text-center text-ink-soft" data-testid="results-pending">
          {finished ? "This sweep ended before any scenario was optimised." : "The ranked table appears here as soon as the sweep finishes."}
        </section>
      ) : (
        <>
          {scenariosQ.isError ? <ErrorPanel error={scenariosQ.error} what="the scenarios" /> : null}
          {grid2 && scenarios.length > 1 ? (
            <ObjectiveHeatMap scenarios={scenarios} fields={grid2} selected={view.scenario} onSelect={selectScenario} objective={objective} unit={view.unit} typedUnits={typedUnits} />
          ) : null}
          <section className="card" aria-labelledby="ranked-title">
            <div className="space-y-3 border-b border-line p-4">
              <div className="flex flex-wrap items-end justify-between gap-3">
                <h2 id="ranked-title">Ranked trains</h2>
                <Link
                  href={`/compare?ids=${selected.join(",")}${urlView.unit ? `&unit=${urlView.unit}` : ""}`}
                  aria-disabled={selected.length < 2}
                  // Not fetched ahead while it cannot be followed: Next.js fetches a link in view
                  // again on every change of the page's URL, so each sort asked for it once more.
                  prefetch={selected.length < 2 ? false : undefined}
                  onClick={(e) => selected.length < 2 && e.preventDefault()}
                  className={`btn-primary ${selected.length < 2 ? "pointer-events-none opacity-50" : ""}`}
                  data-testid="compare-selected"
                >
                  Compare selected ({selected.length})
                </Link>
              </div>
              {scenarios.length > 1 ? (
                <ScenarioPicker scenarios={scenarios} value={view.scenario} onChange={selectScenario} objective={objective} unit={view.unit} />
              ) : null}
              <ResultsToolbar sweepId={sweepId} view={view} setView={changeView} withRecycle={trainsWithRecycle(singleSpec)} {...(network ? { columns: NETWORK_COLUMNS } : {})} />
            </div>
            {candidatesQ.isPending ? (
              <LoadingPanel label="Loading the ranked trains…" bare />
            ) : candidatesQ.isError ? (
              <ErrorPanel error={candidatesQ.error} what="the ranked trains" bare />
            ) : page && page.items.length === 0 ? (
              <p className="p-6 text-center text-ink-soft" data-testid="table-empty">
                No train matches these filters.{" "}
                <button type="button" className="text-accent-700 underline" onClick={() => changeView({ feasible: false, contains: "", stages: null })}>
                  Clear the filters
                </button>
              </p>
            ) : (
              <div aria-busy={candidatesQ.isFetching}>
                <RankedTable
                  rows={rows}
                  view={view}
                  onSort={sortBy}
                  selected={selected}
                  onToggle={toggle}
                  candidateHref={candidateHref}
                  yMax={yMax}
                  target={target}
                  network={network ? { product, timeUnit: networkUnits.time } : undefined}
                />
              </div>
            )}
            {page && page.total > 0 ? (
              <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-3 p-3 text-sm">
                <span className="text-ink-soft" data-testid="page-info">
                  {(page.page - 1) * view.pageSize + 1}–{Math.min(page.total, page.page * view.pageSize)} of {page.total} trains
                </span>
                <span className="flex items-center gap-2">
                  <button type="button" className="btn-quiet" disabled={view.page <= 1} onClick={() => changeView({ page: view.page - 1 })}>
                    ← Previous
                  </button>
                  <span className="num">
                    Page {view.page} of {pages}
                  </span>
                  <button type="button" className="btn-quiet" disabled={view.page >= pages} onClick={() => changeView({ page: view.page + 1 })}>
                    Next →
                  </button>
                </span>
              </nav>
            ) : null}
          </section>
        </>
      )}
      <Cautions warnings={warnings} compact more={trainsWithRecycle(singleSpec) ? stageTypeCautions(["PFR-recycle"]) : []} />
    </div>
  );
}
