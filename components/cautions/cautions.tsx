import { CAUTIONS } from "@/lib/engine";

/**
 * The cautions box, in the one wording of lib/engine/cautions.ts (the same sentences as the
 * report, the PDF and the API); `warnings` (from thermalWarnings) are shown first and stronger.
 * A page shows the general cautions once: parts inside a page that already has its box (a pinned design in the
 * project's list) pass `warningsOnly`, which shows their own thermal warnings and nothing else. `more` are cautions
 * of what is shown (a tube with recycle's), listed after the general ones.
 */
export function Cautions({
  warnings = [],
  compact = false,
  warningsOnly = false,
  more = [],
  className = "",
}: {
  warnings?: string[];
  compact?: boolean;
  warningsOnly?: boolean;
  more?: string[];
  className?: string;
}) {
  if (warningsOnly && warnings.length === 0) return null;
  return (
    <aside aria-label="Cautions" className={`space-y-2 text-xs ${className}`} data-testid="cautions">
      {warnings.length ? (
        <div role="alert" className="rounded border border-red-300 bg-red-50 px-3 py-2 text-red-900">
          <p className="font-semibold">
            <span aria-hidden="true">⚠ </span>Thermal warning
          </p>
          <ul className="mt-1 list-disc space-y-0.5 pl-4">
            {warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {warningsOnly ? null : (
        <div className="rounded border border-amber-300 bg-amber-50 px-3 py-2 text-amber-950">
          <p className="font-semibold">Before you rely on this</p>
          {compact ? (
            <p className="mt-0.5">{[...CAUTIONS, ...more].join(" ")}</p>
          ) : (
            <ul className="mt-1 list-disc space-y-0.5 pl-4">
              {[...CAUTIONS, ...more].map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
          )}
        </div>
      )}
    </aside>
  );
}
