import { FormMessage } from "@/components/ui/field";

/** How many scenarios and trains a sweep implies; null where a field is not yet complete. */
export interface SweepCount {
  scenarios: number | null;
  sequences: number | null;
  optimisations: number | null;
}

/**
 * The side panel of the sweep form: the count of trains the sweep will size, the last refusal and
 * the submit button. Forms for one reaction and for several show the same panel.
 */
export function SweepCountPanel({ count, error, submitting }: { count: SweepCount; error?: string; submitting: boolean }) {
  return (
    <aside className="lg:sticky lg:top-4 lg:self-start">
      <div className="card space-y-3 p-4" aria-live="polite">
        <h2>This sweep</h2>
        <dl className="grid grid-cols-[1fr_auto] gap-y-1 text-sm">
          <dt className="text-ink-soft">Scenarios</dt>
          <dd className="num text-right" data-testid="scenario-count">
            {count.scenarios ?? "—"}
          </dd>
          <dt className="text-ink-soft">Trains per scenario</dt>
          <dd className="num text-right" data-testid="sequence-count">
            {count.sequences ?? "—"}
          </dd>
          <dt className="border-t border-line pt-1 font-medium">Trains sized in all</dt>
          <dd className="num border-t border-line pt-1 text-right text-lg font-semibold" data-testid="optimisation-count">
            {count.optimisations ?? "—"}
          </dd>
        </dl>
        {count.optimisations === null ? <p className="text-xs text-ink-soft">Complete the fields marked with ✕ to see the count.</p> : null}
        {error ? <FormMessage kind="error">{error}</FormMessage> : null}
        <button type="submit" className="btn-primary w-full justify-center" disabled={submitting}>
          {submitting ? "Submitting…" : "Submit sweep"}
        </button>
        <p className="text-xs text-ink-soft">The sweep runs on the queue; you can leave the page and come back.</p>
      </div>
    </aside>
  );
}
