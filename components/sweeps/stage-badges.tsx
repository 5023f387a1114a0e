import type { StageType } from "@/lib/engine";

/** A stirred tank (CSTR) or a tube (PFR), drawn small beside the stage's name. */
export function StageGlyph({ type }: { type: StageType }) {
  return type === "CSTR" ? (
    <svg width={12} height={12} viewBox="0 0 12 12" aria-hidden="true" className="shrink-0">
      <rect x={1.5} y={2.5} width={9} height={8.5} rx={1.5} fill="none" stroke="currentColor" strokeWidth={1.3} />
      <path d="M6 0.5 V8 M3.5 8 H8.5" stroke="currentColor" strokeWidth={1.3} />
    </svg>
  ) : (
    <svg width={16} height={12} viewBox="0 0 16 12" aria-hidden="true" className="shrink-0">
      <rect x={0.7} y={3.5} width={14.6} height={5} rx={2.5} fill="none" stroke="currentColor" strokeWidth={1.3} />
      <path d="M4 6 H12 M10 4.5 L12 6 L10 7.5" fill="none" stroke="currentColor" strokeWidth={1.1} />
    </svg>
  );
}

/** A sequence of stages as compact badges in order, e.g. ▢ CSTR → ═ PFR; reads as "CSTR then PFR". */
export function StageBadges({ sequence }: { sequence: StageType[] }) {
  return (
    <span className="inline-flex flex-wrap items-center gap-0.5" aria-label={sequence.join(" then ")} role="img">
      {sequence.map((t, i) => (
        <span key={i} className="inline-flex items-center gap-0.5">
          {i ? <span aria-hidden="true" className="text-ink-faint">›</span> : null}
          <span
            className={`badge inline-flex items-center gap-1 normal-case ${t === "CSTR" ? "border-accent-200 bg-accent-50 text-accent-800" : "border-amber-300 bg-amber-50 text-amber-900"}`}
          >
            <StageGlyph type={t} />
            {t}
          </span>
        </span>
      ))}
    </span>
  );
}
