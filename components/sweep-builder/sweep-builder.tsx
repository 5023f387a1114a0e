"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { UnitOptions } from "@/components/ui/unit-options";
import { useEffect, useMemo, useState } from "react";
import { FormProvider, useFieldArray, useForm, useWatch } from "react-hook-form";
import { z } from "zod";
import { ErrorText, messageAt } from "@/components/kinetics/quantity-field";
import { SWEEP_OPTION_OFF, SweepRobustnessOption, sweepOptionValue } from "@/components/robustness/sweep-option";
import { ChoiceCards } from "@/components/forms/choice-cards";
import type { UnitKind } from "@/lib/units/display";
import { STAGE_TYPE_NAME, STAGE_TYPE_SHORT, STAGE_TYPES, TRAIN_STAGE_TYPES } from "@/lib/stage-types";
import type { TrainStageType } from "@/lib/engine";
import { RecycleRatioField } from "./recycle-ratio-field";
import { CostBasisOptions } from "./cost-basis-options";
import { DecimalField } from "./decimal-field";
import { SweepHead } from "./sweep-head";
import { ListedTrainsEditor } from "./listed-trains-editor";
import { SweepCountPanel } from "./sweep-count-panel";
import { useSweepSubmit } from "./use-sweep-submit";
import { builderToRequest, builderValuesSchema, GRID_FIELDS, implied, mapSweepServerFields, newAxis, type BuilderValues } from "./builder-form-state";

export interface VersionOption {
  id: string;
  label: string;
  /** The units the kinetics was typed in, by kind: a varied field starts in them. */
  units?: Partial<Record<UnitKind, string>>;
}

const schema = builderValuesSchema.transform((v, ctx) => {
  const { body, issues } = builderToRequest(v);
  for (const i of issues) ctx.addIssue({ code: "custom", path: i.path.split("."), message: i.message });
  return body ?? z.NEVER;
});

function StageBadge({ type }: { type: TrainStageType }) {
  return (
    <span className={`badge ${type === "CSTR" ? "border-accent-600 bg-accent-50 text-accent-800" : "border-ink-soft bg-white text-ink"}`} title={STAGE_TYPE_NAME[type]}>
      {type === "CSTR" ? "▣ " : type === "PFR" ? "▭ " : "↻ "}
      {STAGE_TYPE_SHORT[type]}
    </span>
  );
}

export function SweepBuilder({
  projectId,
  versions,
  initial,
  onVersionChange,
}: {
  projectId: string;
  versions: VersionOption[];
  initial: BuilderValues;
  /** Told of the chosen version, so a model of several reactions can bring its own form. */
  onVersionChange?: (id: string) => void;
}) {
  const form = useForm<z.input<typeof schema>, unknown, z.output<typeof schema>>({ resolver: zodResolver(schema), defaultValues: initial, mode: "onChange" });
  const { register, control, formState, setValue, setError } = form;
  const v = useWatch({ control }) as BuilderValues;
  const [uncertainty, setUncertainty] = useState(SWEEP_OPTION_OFF);
  const uncertaintyValue = sweepOptionValue(uncertainty);
  const grid = useFieldArray({ control, name: "grid" });
  const count = useMemo(() => implied(v), [v]);
  const chosenVersion = v.kineticsVersionId;
  useEffect(() => {
    if (chosenVersion) onVersionChange?.(chosenVersion);
  }, [chosenVersion, onVersionChange]);
  const { shownError, submit } = useSweepSubmit({ projectId, valuesKey: JSON.stringify([v, uncertainty]), mapFields: mapSweepServerFields, setError });
  const err = (p: string) => messageAt(formState.errors, p);
  const typed = versions.find((o) => o.id === v.kineticsVersionId)?.units ?? {};
  /** A varied field's starting unit: the one the kinetics was typed in, else the field's usual one. */
  const unitFor = (field: string) => {
    const g = GRID_FIELDS.find((f) => f.field === field);
    return (g?.kind ? typed[g.kind] : undefined) ?? g?.defaultUnit ?? "";
  };

  const onSubmit = form.handleSubmit((body) =>
    submit(uncertaintyValue.value ? { ...body, robustness: uncertaintyValue.value } : body, uncertaintyValue.error ? `Uncertainty: ${uncertaintyValue.error}` : undefined),
  );

  const num = (path: string, label: string, extra = "w-24") => <DecimalField prefix="s" path={path} label={label} extra={extra} />;

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate aria-label="New sweep" className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_18rem]">
        <div className="space-y-4">
          <SweepHead prefix="s" versions={versions} choose beside={num("target", "Target conversion X", "w-full")} />

          <fieldset className="card space-y-3 p-4">
            <legend className="px-1 text-base font-semibold">Trains to try</legend>
            <ChoiceCards
              label="Train space"
              columns="sm:grid-cols-3"
              current={v.trainMode}
              field={register("trainMode")}
              options={[
                ["range", "Up to N stages", "every sequence of 1…N stages"],
                ["candidates", "Listed sequences", "exactly the ones you compose"],
                ["multiset", "A set of stages", "all orderings of it"],
              ]}
            />
            {v.trainMode === "range" ? (
              <div className="flex flex-wrap items-start gap-4">
                {num("maxStages", "Largest number of stages (1–8)")}
                <fieldset>
                  <legend className="field-label">Stage types</legend>
                  <div className="flex gap-3 text-sm">
                    <label className="flex items-center gap-1.5">
                      <input type="checkbox" {...register("useCSTR")} /> CSTR
                    </label>
                    <label className="flex items-center gap-1.5">
                      <input type="checkbox" {...register("usePFR")} /> PFR
                    </label>
                    <label className="flex items-center gap-1.5">
                      <input type="checkbox" {...register("usePFRrecycle")} /> {STAGE_TYPE_NAME["PFR-recycle"]}
                    </label>
                  </div>
                  <ErrorText id="s-useCSTR" message={err("useCSTR")} />
                </fieldset>
              </div>
            ) : null}
            {v.trainMode === "candidates" ? (
              <ListedTrainsEditor prefix="s" noun="sequence" maxStages={8} types={TRAIN_STAGE_TYPES} badges={(seq) => seq.map((t, j) => <StageBadge key={j} type={t} />)} />
            ) : null}
            {(v.trainMode === "range" && v.usePFRrecycle) || (v.trainMode === "candidates" && v.candidates?.some((c) => c.seq?.includes("PFRrecycle"))) ? <RecycleRatioField mode={v.recycleMode ?? "optimised"} /> : null}
            {v.trainMode === "multiset" ? (
              <div className="flex flex-wrap gap-4">
                {num("multisetCSTR", "CSTRs")}
                {num("multisetPFR", "PFRs")}
              </div>
            ) : null}
            <label className="flex items-center gap-2 text-sm">
              <input type="checkbox" {...register("equalVolume")} /> All stages of a train the same volume
            </label>
            <ErrorText id="s-equalVolume" message={err("equalVolume")} />
            <ErrorText id="s-trainMode" message={err("trainMode")} />
          </fieldset>

          <fieldset className="card space-y-3 p-4">
            <legend className="px-1 text-base font-semibold">Objective</legend>
            <div className="flex gap-4 text-sm">
              <label className="flex items-center gap-1.5">
                <input type="radio" value="volume" {...register("objective")} /> Least total volume
              </label>
              <label className="flex items-center gap-1.5">
                <input type="radio" value="cost" {...register("objective")} /> Least vessel cost
              </label>
            </div>
            {v.objective === "cost" ? (
              <div className="space-y-3">
                <p className="text-xs text-ink-soft">Each vessel costs a + b·S^n with S its volume in m³, in the currency of your choice.</p>
                <CostBasisOptions projectId={projectId} />
                {STAGE_TYPES.map((t) => (
                  <fieldset key={t} className="flex flex-wrap items-start gap-3">
                    <legend className="field-label">{t} vessel</legend>
                    {num(`vessel${t}.a`, `${t} a`)}
                    {num(`vessel${t}.b`, `${t} b`)}
                    {num(`vessel${t}.n`, `${t} n`)}
                  </fieldset>
                ))}
                <div className="flex flex-wrap items-start gap-3">
                  {num("standardSizes", "Standard sizes (comma separated, optional)", "w-64")}
                  {num("maxVessel", "Largest vessel (optional)")}
                  <div>
                    <label htmlFor="s-sizeUnit" className="field-label">
                      Size unit
                    </label>
                    <select id="s-sizeUnit" className="input w-auto" {...register("sizeUnit")}>
                      <UnitOptions kind={"volume"} />
                    </select>
                  </div>
                </div>
              </div>
            ) : null}
          </fieldset>

          <fieldset className="card space-y-3 p-4">
            <legend className="px-1 text-base font-semibold">Scenario grid</legend>
            <p className="text-sm text-ink-soft">Vary up to four fields; every combination of their values is one scenario. With none, the sweep is one scenario.</p>
            {grid.fields.map((f, i) => {
              const a = v.grid?.[i] ?? newAxis();
              const preset = GRID_FIELDS.find((g) => g.field === a.field);
              return (
                <div key={f.id} className="space-y-2 rounded border border-line p-3" role="group" aria-label={`Varied field ${i + 1}`}>
                  <div className="flex flex-wrap items-start gap-3">
                    <div>
                      <label htmlFor={`s-grid-${i}-field`} className="field-label">
                        Field {i + 1}
                      </label>
                      <select
                        id={`s-grid-${i}-field`}
                        className="input w-auto"
                        {...register(`grid.${i}.field`, {
                          onChange: (e: { target: { value: string } }) => setValue(`grid.${i}.unit`, unitFor(e.target.value)),
                        })}
                      >
                        {GRID_FIELDS.map((g) => (
                          <option key={g.field} value={g.field}>
                            {g.label}
                          </option>
                        ))}
                      </select>
                    </div>
                    {a.field === "custom" ? num(`grid.${i}.customField`, "Input name, as in a sweep file", "w-64 font-mono") : null}
                    {preset?.kind ? (
                      <div>
                        <label htmlFor={`s-grid-${i}-unit`} className="field-label">
                          Unit
                        </label>
                        <select id={`s-grid-${i}-unit`} className="input w-auto" {...register(`grid.${i}.unit`)}>
                          <UnitOptions kind={preset.kind} />
                        </select>
                      </div>
                    ) : null}
                    <fieldset>
                      <legend className="field-label">Given as</legend>
                      <div className="flex gap-3 text-sm">
                        <label className="flex items-center gap-1.5">
                          <input type="radio" value="values" {...register(`grid.${i}.kind`)} /> Values
                        </label>
                        <label className="flex items-center gap-1.5">
                          <input type="radio" value="range" {...register(`grid.${i}.kind`)} /> Range
                        </label>
                      </div>
                    </fieldset>
                    <button type="button" className="btn-danger ml-auto py-1" onClick={() => grid.remove(i)}>
                      Remove field {i + 1}
                    </button>
                  </div>
                  {a.kind === "values" ? (
                    num(`grid.${i}.values`, "Values (comma separated)", "w-full")
                  ) : (
                    <div className="flex flex-wrap items-start gap-3">
                      {num(`grid.${i}.from`, "From")}
                      {num(`grid.${i}.to`, "To")}
                      {num(`grid.${i}.steps`, "Steps")}
                      <div>
                        <label htmlFor={`s-grid-${i}-scale`} className="field-label">
                          Spacing
                        </label>
                        <select id={`s-grid-${i}-scale`} className="input w-auto" {...register(`grid.${i}.scale`)}>
                          <option value="linear">Linear</option>
                          <option value="log">Logarithmic</option>
                        </select>
                      </div>
                    </div>
                  )}
                </div>
              );
            })}
            {grid.fields.length < 4 ? (
              <button type="button" className="btn-quiet py-1" onClick={() => {
                  const field = GRID_FIELDS[Math.min(grid.fields.length, 2)].field;
                  grid.append({ ...newAxis(field), unit: unitFor(field) });
                }}>
                + Vary a field
              </button>
            ) : null}
            <ErrorText id="s-grid" message={err("grid")} />
          </fieldset>
          <SweepRobustnessOption state={uncertainty} onChange={setUncertainty} error={uncertaintyValue.error} />
        </div>

        <SweepCountPanel count={count} error={shownError} submitting={formState.isSubmitting} />
      </form>
    </FormProvider>
  );
}
