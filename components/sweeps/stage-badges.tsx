import type { TrainStageType } from "@/lib/engine";
import { STAGE_TYPE_NAME, STAGE_TYPE_SHORT } from "@/lib/stage-types";

/** A stirred tank (CSTR), a tube (PFR) or a tube with a loop back to its inlet (tube with recycle), drawn small beside the stage's name. */
export function StageGlyph({ type }: { type: TrainStageType }) {
  if (type === "CSTR")
    return (
      <svg width={12} height={12} viewBox="0 0 12 12" aria-hidden="true" className="shrink-0">
        <rect x={1.5} y={2.5} width={9} height={8.5} rx={1.5} fill="none" stroke="currentColor" strokeWidth={1.3} />
        <path d="M6 0.5 V8 M3.5 8 H8.5" stroke="currentColor" strokeWidth={1.3} />
      </svg>
    );
  if (type === "PFR-recycle")
    return (
      <svg width={16} height={12} viewBox="0 0 16 12" aria-hidden="true" className="shrink-0">
        <rect x={0.7} y={5.5} width={14.6} height={5} rx={2.5} fill="none" stroke="currentColor" strokeWidth={1.3} />
        <path d="M13 5.5 V1.5 H3 V5.5 M1.8 4 L3 5.5 L4.2 4" fill="none" stroke="currentColor" strokeWidth={1.1} />
      </svg>
    );
  return (
    <svg width={16} height={12} viewBox="0 0 16 12" aria-hidden="true" className="shrink-0">
      <rect x={0.7} y={3.5} width={14.6} height={5} rx={2.5} fill="none" stroke="currentColor" strokeWidth={1.3} />
      <path d="M4 6 H12 M10 4.5 L12 6 L10 7.5" fill="none" stroke="currentColor" strokeWidth={1.1} />
    </svg>
  );
}

const BADGE_COLOURS: Readonly<Record<TrainStageType, string>> = {
  CSTR: "border-accent-200 bg-accent-50 text-accent-800",
  PFR: "border-amber-300 bg-amber-50 text-amber-900",
  "PFR-recycle": "border-violet-300 bg-violet-50 text-violet-900",
};

/** A sequence of stages as compact badges in order, e.g. ▢ CSTR → ═ PFR; reads as "CSTR then PFR". */
export function StageBadges({ sequence }: { sequence: TrainStageType[] }) {
  return (
    <span className="inline-flex flex-wrap items-center gap-0.5" aria-label={sequence.map((t) => STAGE_TYPE_NAME[t] ?? t).join(" then ")} role="img">
      {sequence.map((t, i) => (
        <span key={i} className="inline-flex items-center gap-0.5">
          {i ? <span aria-hidden="true" className="text-ink-faint">›</span> : null}
          <span className={`badge inline-flex items-center gap-1 normal-case ${BADGE_COLOURS[t] ?? BADGE_COLOURS.PFR}`} title={STAGE_TYPE_NAME[t]}>
            <StageGlyph type={t} />
            {STAGE_TYPE_SHORT[t] ?? t}
          </span>
        </span>
      ))}
    </span>
  );
}
