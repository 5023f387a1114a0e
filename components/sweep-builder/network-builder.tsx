"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useMemo } from "react";
import { FormProvider, useForm, useWatch } from "react-hook-form";
import { z } from "zod";
import { ErrorText, messageAt } from "@/components/kinetics/quantity-field";
import { ChoiceCards } from "@/components/forms/choice-cards";
import { UnitOptions } from "@/components/ui/unit-options";
import {
  defaultProduct,
  networkBuilderToRequest,
  networkBuilderValuesSchema,
  networkImplied,
  type NetworkBuilderValues,
  type NetworkVersionInfo,
} from "./network-builder-form-state";
import { NetworkGridEditor } from "./network-grid-editor";
import { NetworkTrainFields } from "./network-train-fields";
import { mapNetworkServerFields } from "./network-field-paths";
import { networkGridFields } from "./network-grid-fields";
import { DecimalField } from "./decimal-field";
import { SweepHead } from "./sweep-head";
import { SweepCountPanel } from "./sweep-count-panel";
import { useSweepSubmit } from "./use-sweep-submit";

/** A version in the picker: either kind, so choosing a one-reaction model hands over to its own form. */
export interface AnyVersionOption {
  id: string;
  label: string;
  network?: NetworkVersionInfo;
}

/** The sweep form for a kinetics model of several reactions. */
export function NetworkBuilder({
  projectId,
  versions,
  initial,
  onVersionChange,
}: {
  projectId: string;
  versions: AnyVersionOption[];
  initial: NetworkBuilderValues;
  onVersionChange: (id: string) => void;
}) {
  const versionOf = (id: string) => versions.find((o) => o.id === id)?.network;
  const schema = useMemo(
    () =>
      networkBuilderValuesSchema.transform((v, ctx) => {
        const { body, issues } = networkBuilderToRequest(v, versions.find((o) => o.id === v.kineticsVersionId)?.network);
        for (const i of issues) ctx.addIssue({ code: "custom", path: i.path.split("."), message: i.message });
        return body ?? z.NEVER;
      }),
    [versions],
  );
  const form = useForm<z.input<typeof schema>, unknown, z.output<typeof schema>>({ resolver: zodResolver(schema), defaultValues: initial, mode: "onChange" });
  const { register, control, formState, setValue, setError } = form;
  const v = useWatch({ control }) as NetworkBuilderValues;
  const version = versionOf(v.kineticsVersionId);
  const count = useMemo(() => networkImplied(v, version), [v, version]);
  const gridFields = useMemo(() => (version ? networkGridFields(version) : []), [version]);
  const { shownError, submit } = useSweepSubmit({ projectId, valuesKey: JSON.stringify(v), mapFields: mapNetworkServerFields, setError });
  const err = (p: string) => messageAt(formState.errors, p);

  // Another model: hand over to the one-reaction form, or take this model's wanted product.
  const chosen = v.kineticsVersionId;
  useEffect(() => {
    if (!versionOf(chosen)) {
      onVersionChange(chosen);
      return;
    }
    const next = versionOf(chosen)!;
    if (!next.species.includes(form.getValues("product"))) setValue("product", defaultProduct(next), { shouldValidate: true });
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only when the chosen version changes
  }, [chosen]);

  const onSubmit = form.handleSubmit((body) => submit(body));

  const num = (path: string, label: string, extra = "w-24") => <DecimalField prefix="n" path={path} label={label} extra={extra} />;
  const unitSelect = (path: "tUnit" | "volumeUnit", kind: "temperature" | "volume", label: string) => (
    <div>
      <label htmlFor={`n-${path}`} className="field-label">
        {label}
      </label>
      <select id={`n-${path}`} className="input w-auto" {...register(path)}>
        <UnitOptions kind={kind} />
      </select>
    </div>
  );
  const species = version?.species ?? [];

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate aria-label="New sweep" className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_18rem]">
        <div className="space-y-4">
          <SweepHead
            prefix="n"
            versions={versions}
            beside={
              <p className="self-end text-sm text-ink-soft">
                Several reactions · key reactant <strong>{version?.keyReactant ?? "—"}</strong>
              </p>
            }
          />

          <fieldset className="card space-y-3 p-4">
            <legend className="px-1 text-base font-semibold">Rank by</legend>
            <ChoiceCards
              label="Objective"
              columns="sm:grid-cols-3"
              current={v.objective}
              field={register("objective")}
              options={[
                ["yield", `Highest yield of ${v.product || "the product"}`, "wanted product formed per key reactant fed"],
                ["selectivity", `Highest selectivity to ${v.product || "the product"}`, "wanted product formed per key reactant used"],
                ["volume", "Least total volume", "the smallest train that reaches the minimum conversion"],
              ]}
            />
            <div className="flex flex-wrap items-start gap-4">
              <div>
                <label htmlFor="n-product" className="field-label">
                  Wanted product
                </label>
                <select id="n-product" className="input w-auto" aria-invalid={!!err("product")} {...register("product")}>
                  {v.objective === "volume" ? <option value="">None</option> : null}
                  {species
                    .filter((s) => s !== version?.keyReactant)
                    .map((s) => (
                      <option key={s} value={s}>
                        {s}
                      </option>
                    ))}
                </select>
                <ErrorText id="n-product" message={err("product")} />
              </div>
            </div>
          </fieldset>

          <fieldset className="card space-y-3 p-4">
            <legend className="px-1 text-base font-semibold">Limits</legend>
            <p className="text-sm text-ink-soft">Every train ranked must meet these; leave a limit blank to go without it.</p>
            <div className="flex flex-wrap items-start gap-4">
              {num("minConversion", "Minimum conversion, %")}
              {num("minYield", "Minimum yield, %")}
              {num("maxTotalVolume", "Largest total volume")}
              {num("maxStageVolume", "Largest stage volume")}
              {unitSelect("volumeUnit", "volume", "Volume unit")}
            </div>
          </fieldset>

          <fieldset className="card space-y-3 p-4">
            <legend className="px-1 text-base font-semibold">Heat</legend>
            <ChoiceCards
              label="Heat mode"
              current={v.heat}
              field={register("heat")}
              options={[
                ["isothermal", "Isothermal at the feed temperature", "every stage at the feed's temperature"],
                ["stageTemperature", "Each stage at its own temperature", "chosen between a lowest and a highest"],
              ]}
            />
            {v.heat === "stageTemperature" ? (
              <div className="flex flex-wrap items-start gap-4">
                {num("tMin", "Lowest stage temperature")}
                {num("tMax", "Highest stage temperature")}
                {unitSelect("tUnit", "temperature", "Temperature unit")}
              </div>
            ) : null}
            <ErrorText id="n-heat" message={err("heat")} />
          </fieldset>

          <NetworkTrainFields num={num} />

          <NetworkGridEditor fields={gridFields} />
        </div>

        <SweepCountPanel count={count} error={shownError} submitting={formState.isSubmitting} />
      </form>
    </FormProvider>
  );
}
