import { SWEEP_STATUS } from "@/lib/glossary";
import type { SweepStatus } from "@/db/schema";
import type { SweepView } from "@/lib/services/views";

const STATUS_TONE: Record<SweepStatus, string> = {
  queued: "border-line bg-paper text-ink-soft",
  running: "border-accent-200 bg-accent-50 text-accent-800",
  succeeded: "border-accent-500 bg-accent-600 text-white",
  failed: "border-red-300 bg-red-50 text-red-800",
  cancelled: "border-amber-300 bg-amber-50 text-amber-900",
};

export function StatusBadge({ status }: { status: SweepStatus }) {
  return (
    <span className={`badge ${STATUS_TONE[status]}`} data-testid="sweep-status" title={SWEEP_STATUS[status].help}>
      {SWEEP_STATUS[status].label}
    </span>
  );
}

/** 75 → "1 min 15 s". */
export function formatDuration(seconds: number | null): string {
  if (seconds === null || !Number.isFinite(seconds)) return "—";
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `${s} s`;
  const m = Math.floor(s / 60);
  if (m < 60) return `${m} min ${s % 60} s`;
  return `${Math.floor(m / 60)} h ${m % 60} min`;
}

export function SweepProgressBar({ sweep }: { sweep: SweepView }) {
  const { done, total, fraction, elapsedSeconds, remainingSeconds } = sweep.progress;
  const pct = Math.round(fraction * 100);
  const active = sweep.status === "queued" || sweep.status === "running";
  return (
    <div className="space-y-1.5">
      <div className="flex flex-wrap items-baseline justify-between gap-2 text-sm">
        <span id="progress-label" className="font-medium">
          Scenarios optimised
        </span>
        <span className="num text-ink-soft" data-testid="progress-text">
          {done} / {total} · {pct} %
        </span>
      </div>
      <div
        role="progressbar"
        aria-labelledby="progress-label"
        aria-valuemin={0}
        aria-valuemax={total}
        aria-valuenow={done}
        aria-valuetext={`${done} of ${total} scenarios, ${pct} percent`}
        className="h-3 overflow-hidden rounded-full border border-line bg-paper"
      >
        <div
          className={`h-full transition-[width] duration-500 ${sweep.status === "failed" ? "bg-red-500" : sweep.status === "cancelled" ? "bg-amber-500" : "bg-accent-500"} ${active ? "bg-[repeating-linear-gradient(45deg,transparent_0_6px,rgba(255,255,255,.25)_6px_12px)]" : ""}`}
          style={{ width: `${pct}%` }}
        />
      </div>
      <p className="text-xs text-ink-soft" aria-live="polite">
        {active
          ? sweep.status === "queued"
            ? "Waiting for a worker…"
            : `Elapsed ${formatDuration(elapsedSeconds)} · about ${formatDuration(remainingSeconds)} left`
          : `Took ${formatDuration(elapsedSeconds)}${sweep.failedScenarios ? ` · ${sweep.failedScenarios} scenario(s) failed` : ""}`}
      </p>
    </div>
  );
}
