"use client";

import type { ReactNode } from "react";
import { useFieldArray, useFormContext, useWatch } from "react-hook-form";
import { ChoiceCards } from "@/components/forms/choice-cards";
import { ErrorText, messageAt } from "@/components/kinetics/quantity-field";
import { StageBadges } from "@/components/sweeps/stage-badges";
import { MAX_NETWORK_STAGES } from "@/lib/schemas/network-spec";
import { parseSequence } from "./builder-form-state";
import type { NetworkBuilderValues } from "./network-builder-form-state";

/** The trains a network sweep tries: every sequence up to a largest number of stages, or listed trains. */
export function NetworkTrainFields({ num }: { num: (path: string, label: string) => ReactNode }) {
  const { control, register, formState, setValue } = useFormContext<NetworkBuilderValues>();
  const v = useWatch({ control }) as NetworkBuilderValues;
  const candidates = useFieldArray({ control, name: "candidates" });
  const err = (p: string) => messageAt(formState.errors, p);
  return (
    <fieldset className="card space-y-3 p-4">
      <legend className="px-1 text-base font-semibold">Trains to try</legend>
      <ChoiceCards
        label="Train space"
        current={v.trainMode}
        field={register("trainMode")}
        options={[
          ["range", "Up to N stages", `every sequence of 1…N stages (N up to ${MAX_NETWORK_STAGES})`],
          ["candidates", "Listed trains", "exactly the ones you compose"],
        ]}
      />
      {v.trainMode === "range" ? (
        <div className="flex flex-wrap items-start gap-4">
          {num("maxStages", `Largest number of stages (1–${MAX_NETWORK_STAGES})`)}
          <fieldset>
            <legend className="field-label">Stage types</legend>
            <div className="flex gap-3 text-sm">
              <label className="flex items-center gap-1.5">
                <input type="checkbox" {...register("useCSTR")} /> CSTR
              </label>
              <label className="flex items-center gap-1.5">
                <input type="checkbox" {...register("usePFR")} /> PFR
              </label>
            </div>
            <ErrorText id="n-useCSTR" message={err("useCSTR")} />
          </fieldset>
        </div>
      ) : (
        <div className="space-y-2" data-testid="sequence-editor">
          {candidates.fields.map((f, i) => {
            const seq = parseSequence(v.candidates?.[i]?.seq ?? "");
            const set = (next: string[]) => setValue(`candidates.${i}.seq`, next.join("-"), { shouldValidate: true });
            return (
              <div key={f.id} className="rounded border border-line p-2">
                <div className="flex flex-wrap items-center gap-1.5" aria-label={`Train ${i + 1}`} role="group">
                  <span className="mr-1 text-xs text-ink-soft">#{i + 1}</span>
                  {seq.length ? <StageBadges sequence={seq} /> : <span className="text-xs text-ink-soft">empty</span>}
                  <span className="ml-auto flex gap-1">
                    <button type="button" className="btn-quiet py-0.5" onClick={() => set([...seq, "CSTR"])} disabled={seq.length >= MAX_NETWORK_STAGES} aria-label={`Add a CSTR to train ${i + 1}`}>
                      + CSTR
                    </button>
                    <button type="button" className="btn-quiet py-0.5" onClick={() => set([...seq, "PFR"])} disabled={seq.length >= MAX_NETWORK_STAGES} aria-label={`Add a PFR to train ${i + 1}`}>
                      + PFR
                    </button>
                    <button type="button" className="btn-quiet py-0.5" onClick={() => set(seq.slice(0, -1))} disabled={!seq.length} aria-label={`Remove the last stage of train ${i + 1}`}>
                      ⌫
                    </button>
                    <button type="button" className="btn-danger py-0.5" onClick={() => candidates.remove(i)} aria-label={`Delete train ${i + 1}`}>
                      Delete
                    </button>
                  </span>
                </div>
                <ErrorText id={`n-candidates-${i}`} message={err(`candidates.${i}.seq`)} />
              </div>
            );
          })}
          <button type="button" className="btn-quiet py-1" onClick={() => candidates.append({ seq: "" })}>
            + Add a train
          </button>
          <ErrorText id="n-candidates" message={err("candidates")} />
        </div>
      )}
      <ErrorText id="n-trainMode" message={err("trainMode")} />
    </fieldset>
  );
}
