"use client";

import { useFieldArray, useFormContext, useWatch } from "react-hook-form";
import { ErrorText, messageAt } from "@/components/kinetics/quantity-field";
import { UnitOptions } from "@/components/ui/unit-options";
import { newNetworkAxis, type NetworkBuilderValues } from "./network-builder-form-state";
import type { NetworkGridField } from "./network-grid-fields";
import { DecimalField } from "./decimal-field";

/** The scenario grid of a network sweep: up to four inputs of the model, each with its values or a range. */
export function NetworkGridEditor({ fields }: { fields: NetworkGridField[] }) {
  const { control, register, formState, setValue } = useFormContext<NetworkBuilderValues>();
  const grid = useFieldArray({ control, name: "grid" });
  const axes = useWatch({ control, name: "grid" }) ?? [];
  const err = (p: string) => messageAt(formState.errors, p);
  const num = (path: string, label: string, extra = "w-24") => <DecimalField prefix="n" path={path} label={label} extra={extra} />;
  const unused = fields.find((f) => !axes.some((a) => a.field === f.field));

  return (
    <fieldset className="card space-y-3 p-4">
      <legend className="px-1 text-base font-semibold">Scenario grid</legend>
      <p className="text-sm text-ink-soft">Vary up to four inputs of the model; every combination of their values is one scenario. With none, the sweep is one scenario.</p>
      {grid.fields.map((f, i) => {
        const a = axes[i];
        const preset = fields.find((g) => g.field === a?.field);
        return (
          <div key={f.id} className="space-y-2 rounded border border-line p-3" data-testid="grid-axis">
            <div className="flex flex-wrap items-end gap-3">
              <div className="min-w-64 flex-1">
                <label htmlFor={`n-grid-${i}-field`} className="field-label">
                  Input {i + 1}
                </label>
                <select id={`n-grid-${i}-field`} className="input" aria-invalid={!!err(`grid.${i}.field`)} {...register(`grid.${i}.field`, {
                    // A new input starts in its own unit (a concentration in the model's, a temperature in K …).
                    onChange: (e: { target: { value: string } }) => setValue(`grid.${i}.unit`, fields.find((g) => g.field === e.target.value)?.defaultUnit ?? ""),
                  })}
                >
                  {fields.map((g) => (
                    <option key={g.field} value={g.field}>
                      {g.label}
                    </option>
                  ))}
                </select>
                <ErrorText id={`n-grid-${i}-field`} message={err(`grid.${i}.field`)} />
              </div>
              {preset?.kind ? (
                <div>
                  <label htmlFor={`n-grid-${i}-unit`} className="field-label">
                    Unit
                  </label>
                  <select id={`n-grid-${i}-unit`} className="input w-auto" {...register(`grid.${i}.unit`)}>
                    <UnitOptions kind={preset.kind} />
                  </select>
                </div>
              ) : null}
              <div>
                <label htmlFor={`n-grid-${i}-kind`} className="field-label">
                  Given as
                </label>
                <select id={`n-grid-${i}-kind`} className="input w-auto" {...register(`grid.${i}.kind`)}>
                  <option value="values">A list of values</option>
                  <option value="range">A range</option>
                </select>
              </div>
              <button type="button" className="btn-danger ml-auto py-1" onClick={() => grid.remove(i)}>
                Remove input {i + 1}
              </button>
            </div>
            {a?.kind === "range" ? (
              <div className="flex flex-wrap items-start gap-3">
                {num(`grid.${i}.from`, "From")}
                {num(`grid.${i}.to`, "To")}
                {num(`grid.${i}.steps`, "Steps")}
                <div>
                  <label htmlFor={`n-grid-${i}-scale`} className="field-label">
                    Spacing
                  </label>
                  <select id={`n-grid-${i}-scale`} className="input w-auto" {...register(`grid.${i}.scale`)}>
                    <option value="linear">Linear</option>
                    <option value="log">Logarithmic</option>
                  </select>
                </div>
              </div>
            ) : (
              num(`grid.${i}.values`, "Values (comma separated)", "w-full")
            )}
          </div>
        );
      })}
      {grid.fields.length < 4 && unused ? (
        <button type="button" className="btn-quiet py-1" onClick={() => grid.append(newNetworkAxis(unused))}>
          + Vary an input
        </button>
      ) : null}
      <ErrorText id="n-grid" message={err("grid")} />
    </fieldset>
  );
}
