"use client";

import { useFieldArray, useFormContext, useWatch } from "react-hook-form";
import { ErrorText, messageAt } from "@/components/kinetics/quantity-field";
import type { TrainStageType } from "@/lib/engine";
import { sequenceKey, STAGE_TYPE_NAME, STAGE_TYPES } from "@/lib/stage-types";
import { parseSequence } from "./builder-form-state";

/**
 * The listed trains of a sweep, composed stage by stage: add a stage of one of the offered `types`
 * (CSTR and PFR unless told), take the last stage back, delete a train. Both sweep forms compose trains this way; each names a train in its own
 * word (`noun`), caps its length (`maxStages`) and draws the stages (`badges`).
 */
export function ListedTrainsEditor({
  prefix,
  noun,
  maxStages,
  badges,
  types = STAGE_TYPES,
}: {
  prefix: string;
  noun: "sequence" | "train";
  maxStages: number;
  badges: (seq: TrainStageType[]) => React.ReactNode;
  types?: readonly TrainStageType[];
}) {
  const { control, formState, setValue } = useFormContext<{ candidates: { seq: string }[] }>();
  const rows = useWatch({ control, name: "candidates" });
  const candidates = useFieldArray({ control, name: "candidates" });
  const err = (p: string) => messageAt(formState.errors, p);
  const Noun = noun[0]!.toUpperCase() + noun.slice(1);
  return (
    <div className="space-y-2" data-testid="sequence-editor">
      {candidates.fields.map((f, i) => {
        const seq = parseSequence(rows?.[i]?.seq ?? "");
        // Kept as its sequence key, so a tube with recycle ("PFR-recycle") reads back as one stage.
        const set = (next: TrainStageType[]) => setValue(`candidates.${i}.seq`, sequenceKey(next), { shouldValidate: true });
        return (
          <div key={f.id} className="rounded border border-line p-2">
            <div className="flex flex-wrap items-center gap-1.5" aria-label={`${Noun} ${i + 1}`} role="group">
              <span className="mr-1 text-xs text-ink-soft">#{i + 1}</span>
              {seq.length ? badges(seq) : <span className="text-xs text-ink-soft">empty</span>}
              <span className="ml-auto flex gap-1">
                {types.map((t) => (
                  <button key={t} type="button" className="btn-quiet py-0.5" onClick={() => set([...seq, t])} disabled={seq.length >= maxStages} aria-label={`Add a ${STAGE_TYPE_NAME[t].replace(/^Tube/, "tube")} to ${noun} ${i + 1}`}>
                    + {STAGE_TYPE_NAME[t]}
                  </button>
                ))}
                <button type="button" className="btn-quiet py-0.5" onClick={() => set(seq.slice(0, -1))} disabled={!seq.length} aria-label={`Remove the last stage of ${noun} ${i + 1}`}>
                  ⌫
                </button>
                <button type="button" className="btn-danger py-0.5" onClick={() => candidates.remove(i)} aria-label={`Delete ${noun} ${i + 1}`}>
                  Delete
                </button>
              </span>
            </div>
            <ErrorText id={`${prefix}-candidates-${i}`} message={err(`candidates.${i}.seq`)} />
          </div>
        );
      })}
      <button type="button" className="btn-quiet py-1" onClick={() => candidates.append({ seq: "" })}>
        + Add a {noun}
      </button>
      <ErrorText id={`${prefix}-candidates`} message={err("candidates")} />
    </div>
  );
}
