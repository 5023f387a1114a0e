import { StageSwatch } from "@/components/charts/stage-patterns";
import { StageGlyph } from "@/components/sweeps/stage-badges";
import type { TrainStageType } from "@/lib/engine";
import { stageTypeName } from "@/lib/stage-types";

/**
 * The scrolling, captioned frame of a candidate's stage table: a keyboard user can scroll it and a
 * screen reader hears the caption. Trains of one reaction and of several use the same frame.
 */
export function StageTableFrame({ caption, testId, children }: { caption: string; testId: string; children: React.ReactNode }) {
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={caption}>
      <table className="table-dense" data-testid={testId}>
        <caption className="sr-only">{caption}</caption>
        {children}
      </table>
    </div>
  );
}

/** A stage's first cell: its colour in the charts, its number and its type. */
export function StageLabelCell({ index, type }: { index: number; type: TrainStageType }) {
  return (
    <td>
      <span className="inline-flex items-center gap-1.5 whitespace-nowrap">
        <StageSwatch index={index} />
        <span className="num">{index + 1}</span>
        <StageGlyph type={type} />
        {stageTypeName(type)}
      </span>
    </td>
  );
}
