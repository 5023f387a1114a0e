"use client";

import type { ReactNode } from "react";
import { useFormContext, useWatch } from "react-hook-form";
import { ChoiceCards } from "@/components/forms/choice-cards";
import { ErrorText, messageAt } from "@/components/kinetics/quantity-field";
import { StageBadges } from "@/components/sweeps/stage-badges";
import { MAX_NETWORK_STAGES } from "@/lib/schemas/network-spec";
import type { NetworkBuilderValues } from "./network-builder-form-state";
import { ListedTrainsEditor } from "./listed-trains-editor";

/** The trains a network sweep tries: every sequence up to a largest number of stages, or listed trains. */
export function NetworkTrainFields({ num }: { num: (path: string, label: string) => ReactNode }) {
  const { control, register, formState } = useFormContext<NetworkBuilderValues>();
  const v = useWatch({ control }) as NetworkBuilderValues;
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
        <ListedTrainsEditor prefix="n" noun="train" maxStages={MAX_NETWORK_STAGES} badges={(seq) => <StageBadges sequence={seq} />} />
      )}
      <ErrorText id="n-trainMode" message={err("trainMode")} />
    </fieldset>
  );
}
