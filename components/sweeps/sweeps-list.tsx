"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { fetchJson } from "@/lib/client/fetch-json";
import type { SweepStatus } from "@/db/schema";
import { SWEEP_STATUS } from "@/lib/glossary";
import { formatDateTime } from "@/lib/format/dates";
import type { SweepListItem } from "@/lib/services/views";

/** One sweep of the project's list, as the sweeps endpoint and the project page give it. */
export type SweepRow = SweepListItem;


const STATUS: Record<SweepStatus, { text: string; glyph: string; tone: string }> = {
  queued: { text: SWEEP_STATUS.queued.label, glyph: "◷", tone: "border-line text-ink-soft" },
  running: { text: SWEEP_STATUS.running.label, glyph: "▶", tone: "border-accent-500 text-accent-700" },
  succeeded: { text: SWEEP_STATUS.succeeded.label, glyph: "✓", tone: "border-accent-600 bg-accent-50 text-accent-800" },
  failed: { text: SWEEP_STATUS.failed.label, glyph: "✕", tone: "border-red-300 bg-red-50 text-red-800" },
  cancelled: { text: SWEEP_STATUS.cancelled.label, glyph: "■", tone: "border-line bg-paper text-ink-soft" },
};

export function StatusBadge({ status }: { status: SweepStatus }) {
  const s = STATUS[status];
  return (
    <span className={`badge ${s.tone}`}>
      <span aria-hidden="true">{s.glyph} </span>
      {s.text}
    </span>
  );
}

/** The project's sweeps, refreshed every two seconds while one is queued or running. */
export function SweepsList({ projectId, initial, canCreate }: { projectId: string; initial: SweepRow[]; canCreate: boolean }) {
  const { data, isError, isFetching } = useQuery({
    queryKey: ["project-sweeps", projectId],
    queryFn: () => fetchJson<{ sweeps: SweepRow[] }>(`/api/projects/${projectId}/sweeps`).then((r) => r.sweeps),
    initialData: initial,
    refetchInterval: (q) => (q.state.data?.some((s) => s.status === "queued" || s.status === "running") ? 2000 : false),
  });
  const sweeps = data ?? [];
  return (
    <section className="card overflow-hidden" aria-labelledby="sweeps-title">
      <div className="flex items-center justify-between border-b border-line px-3 py-2">
        <h2 id="sweeps-title">Sweeps</h2>
        {canCreate ? (
          <Link href={`/projects/${projectId}/sweeps/new`} className="btn-primary py-1">
            New sweep
          </Link>
        ) : null}
      </div>
      {isError ? (
        <p role="alert" className="px-3 py-2 text-sm text-red-800">
          Could not refresh the sweeps; the list may be out of date.
        </p>
      ) : null}
      {sweeps.length === 0 ? (
        <p className="px-3 py-6 text-center text-ink-soft">No sweeps yet{canCreate ? ": build one from a kinetics version." : "."}</p>
      ) : (
        <table className="table-dense" data-testid="sweeps-table" aria-busy={isFetching}>
          <thead>
            <tr>
              <th scope="col">Name</th>
              <th scope="col">Status</th>
              <th scope="col">Progress</th>
              <th scope="col">Created (UTC)</th>
            </tr>
          </thead>
          <tbody>
            {sweeps.map((s) => (
              <tr key={s.id}>
                <td>
                  <Link href={`/projects/${projectId}/sweeps/${s.id}`} className="font-medium text-accent-700 hover:underline">
                    {s.name}
                  </Link>
                </td>
                <td>
                  <StatusBadge status={s.status} />
                  {s.failedScenarios ? <span className="ml-1 text-xs text-red-700">{s.failedScenarios} failed</span> : null}
                </td>
                <td className="min-w-40">
                  <div className="flex items-center gap-2">
                    <div
                      className="h-1.5 w-24 overflow-hidden rounded bg-line"
                      role="progressbar"
                      aria-label={`Progress of ${s.name}`}
                      aria-valuemin={0}
                      aria-valuemax={s.progress.total}
                      aria-valuenow={s.progress.done}
                    >
                      <div className="h-full bg-accent-600" style={{ width: `${Math.round(s.progress.fraction * 100)}%` }} />
                    </div>
                    <span className="num text-xs text-ink-soft">
                      {s.progress.done}/{s.progress.total}
                    </span>
                  </div>
                </td>
                <td className="num whitespace-nowrap">{formatDateTime(s.createdAt)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </section>
  );
}
