"use client";

import { useFieldArray, useFormContext, useWatch } from "react-hook-form";
import { QuantityInput } from "@/components/ui/quantity-input";
import { MAX_NETWORK_SPECIES } from "@/lib/schemas/network-spec";
import type { NetworkFormValues } from "./network-form-state";
import { nextSpeciesId } from "./network-form-state";
import { ErrorText, fieldId, QuantityField, type ExternalErrors } from "./quantity-field";

/**
 * The feed of a model of several reactions: volumetric flow, temperature and phase, the species with
 * their feed concentrations (inerts too), and the key reactant and wanted product chosen among them.
 * Removing a species also clears what the reactions typed against it.
 */
export function NetworkSpeciesEditor({ errorAt, external }: { errorAt: (path: string) => string | undefined; external: ExternalErrors }) {
  const { control, register, getValues, setValue } = useFormContext<NetworkFormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: "species", keyName: "rowId" });
  const species = (useWatch({ control, name: "species" }) ?? []) as NetworkFormValues["species"];
  const named = species.filter((s) => s?.name?.trim());

  const removeSpecies = (i: number) => {
    const gone = getValues(`species.${i}.key`);
    const reactions = getValues("reactions").map((r) => {
      const drop = (m: Record<string, string>) => Object.fromEntries(Object.entries(m).filter(([k]) => k !== gone));
      return { ...r, coefficients: drop(r.coefficients), orders: drop(r.orders), reverse: { ...r.reverse, orders: drop(r.reverse.orders) } };
    });
    setValue("reactions", reactions, { shouldValidate: true });
    if (getValues("keyReactant") === gone) setValue("keyReactant", "", { shouldValidate: true });
    if (getValues("product") === gone) setValue("product", "", { shouldValidate: true });
    remove(i);
  };

  const picker = (path: "keyReactant" | "product", label: string, blank: string, hint: string) => {
    const id = fieldId(path);
    const message = errorAt(path);
    return (
      <div>
        <label htmlFor={id} className="field-label">
          {label}
        </label>
        <select id={id} className="input" aria-invalid={!!message} aria-describedby={message ? `${id}-error` : `${id}-hint`} {...register(path)}>
          <option value="">{blank}</option>
          {named.map((s) => (
            <option key={s.key} value={s.key}>
              {s.name.trim()}
            </option>
          ))}
        </select>
        {message ? null : (
          <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
            {hint}
          </p>
        )}
        <ErrorText id={id} message={message} />
      </div>
    );
  };

  return (
    <fieldset className="card space-y-3 p-4">
      <legend className="px-1 text-base font-semibold">Feed and species</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        <QuantityField path="feed.volumetricFlow" label="Feed volumetric flow" kind="volumetricFlow" external={external} />
        <QuantityField path="feed.temperature" label="Feed temperature" kind="temperature" external={external} />
      </div>
      <fieldset>
        <legend className="field-label">Phase</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          <label className="flex items-center gap-1.5">
            <input type="radio" value="liquid" {...register("phase")} /> Liquid (constant density)
          </label>
          <label className="flex items-center gap-1.5">
            <input type="radio" value="gas" {...register("phase")} /> Gas (isobaric; the flow follows the moles and the temperature)
          </label>
        </div>
      </fieldset>

      <fieldset aria-describedby={errorAt("species") ? `${fieldId("species")}-error` : undefined}>
        <legend className="field-label">Species and their feed concentrations</legend>
        <p className="-mt-0.5 mb-1 text-xs text-ink-soft">Every species a reaction uses, inerts included; 0 for those not fed.</p>
        <div className="space-y-2">
          {fields.map((f, i) => {
            const nameId = fieldId(`species.${i}.name`);
            const nameError = errorAt(`species.${i}.name`);
            return (
              <div key={f.rowId} className="grid grid-cols-[7rem_1fr_auto] items-start gap-1.5">
                <div>
                  <label htmlFor={nameId} className="field-label">
                    Species {i + 1}
                  </label>
                  <input id={nameId} className="input" autoComplete="off" aria-invalid={!!nameError} {...register(`species.${i}.name`)} />
                  <ErrorText id={nameId} message={nameError} />
                </div>
                <SpeciesConcentration index={i} name={species[i]?.name?.trim() || `species ${i + 1}`} error={errorAt(`species.${i}.conc.value`)} />
                <button type="button" className="btn-quiet mt-6 py-1" onClick={() => removeSpecies(i)} aria-label={`Remove species ${i + 1}`}>
                  Remove
                </button>
              </div>
            );
          })}
        </div>
        {fields.length < MAX_NETWORK_SPECIES ? (
          <button
            type="button"
            className="btn-quiet mt-1.5 py-1"
            onClick={() => append({ key: nextSpeciesId(getValues("species")), name: "", conc: { value: "0", unit: getValues("species.0.conc.unit") ?? "mol/L" } })}
          >
            + Add a species
          </button>
        ) : null}
        <ErrorText id={fieldId("species")} message={errorAt("species")} />
      </fieldset>

      <div className="grid gap-3 sm:grid-cols-2">
        {picker("keyReactant", "Key reactant", "Choose…", "Conversion is measured on it.")}
        {picker("product", "Wanted product", "None chosen", "Yield and selectivity are counted for it.")}
      </div>
    </fieldset>
  );
}

function SpeciesConcentration({ index, name, error }: { index: number; name: string; error?: string }) {
  const { register } = useFormContext<NetworkFormValues>();
  const unit = useWatch({ name: `species.${index}.conc.unit` }) as string;
  const text = useWatch({ name: `species.${index}.conc.value` }) as string;
  return (
    <QuantityInput
      id={fieldId(`species.${index}.conc.value`)}
      label={`Feed concentration of ${name}`}
      kind="concentration"
      number={register(`species.${index}.conc.value`)}
      unit={register(`species.${index}.conc.unit`)}
      unitValue={unit}
      numberText={text}
      error={error}
      echo
    />
  );
}
