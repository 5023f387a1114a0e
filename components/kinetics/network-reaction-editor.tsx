"use client";

import { useFieldArray, useFormContext, useWatch } from "react-hook-form";
import { UnitOptions } from "@/components/ui/unit-options";
import { rateConstantLabel } from "@/lib/units/display";
import { reactionText, type NetworkFormValues, type NetworkReactionValues } from "./network-form-state";
import { ErrorText, fieldId, QuantityField, type ExternalErrors } from "./quantity-field";

type ErrorAt = (path: string) => string | undefined;
type Species = NetworkFormValues["species"];

/**
 * One reaction of a model of several reactions: its stoichiometry (a coefficient per species, blank
 * when the species takes no part) and its rate law (a power law with optional reverse term and
 * Arrhenius terms, or an expression of C_<species> and T), shown also as an equation.
 */
export function NetworkReactionEditor({ index, count, onRemove, errorAt, external }: { index: number; count: number; onRemove: () => void; errorAt: ErrorAt; external: ExternalErrors }) {
  const { control, register } = useFormContext<NetworkFormValues>();
  const values = useWatch({ control }) as NetworkFormValues;
  const species = (values.species ?? []).filter(Boolean);
  const r = values.reactions?.[index];
  if (!r) return null;
  const at = `reactions.${index}` as const;
  const orderSum = (orders: Record<string, string> | undefined) => Object.values(orders ?? {}).reduce((a, t) => a + (Number(t) || 0), 0);

  return (
    <fieldset className="card space-y-3 p-4" aria-labelledby={`${fieldId(at)}-title`} data-testid={`reaction-${index + 1}`}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={`${fieldId(at)}-title`} className="text-base font-semibold">
          Reaction {index + 1}
          <span className="ml-2 font-mono text-sm font-normal text-ink-soft" data-testid={`reaction-${index + 1}-equation`}>
            {reactionText(values, index)}
          </span>
        </h3>
        {count > 1 ? (
          <button type="button" className="btn-quiet py-1" onClick={onRemove} aria-label={`Remove reaction ${index + 1}`}>
            Remove
          </button>
        ) : null}
      </div>

      <PerSpecies
        legend="Stoichiometry"
        hint="Negative for what it consumes, positive for what it forms; blank when a species takes no part."
        path={`${at}.coefficients`}
        species={species}
        errorAt={errorAt}
      />

      <div role="radiogroup" aria-label={`Reaction ${index + 1} rate law`} className="flex flex-wrap gap-4 text-sm">
        <label className="flex items-center gap-1.5">
          <input type="radio" value="power" {...register(`${at}.law`)} /> Power law, k ∏ Cᵢ^aᵢ
        </label>
        <label className="flex items-center gap-1.5">
          <input type="radio" value="expression" {...register(`${at}.law`)} /> Expression of C_species and T
        </label>
      </div>
      <ErrorText id={fieldId(`${at}.law`)} message={errorAt(`${at}.law`)} />

      {r.law === "power" ? (
        <div className="space-y-3">
          <RateConstant path={`${at}.k`} label="Rate constant k" order={orderSum(r.orders)} value={r.k} errorAt={errorAt} />
          <PerSpecies legend="Orders" hint="Blank is order 0." path={`${at}.orders`} species={species} errorAt={errorAt} />
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" {...register(`${at}.reverseOn`)} /> Reversible: subtract a reverse term
          </label>
          {r.reverseOn ? (
            <div className="space-y-3 border-l-2 border-line pl-3">
              <RateConstant path={`${at}.reverse.k`} label="Reverse rate constant" order={orderSum(r.reverse?.orders)} value={r.reverse?.k} errorAt={errorAt} />
              <PerSpecies legend="Reverse orders" path={`${at}.reverse.orders`} species={species} errorAt={errorAt} />
            </div>
          ) : null}
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" {...register(`${at}.arrheniusOn`)} /> Arrhenius temperature dependence
          </label>
          {r.arrheniusOn ? (
            <div className="grid gap-3 border-l-2 border-line pl-3 sm:grid-cols-2">
              <QuantityField path={`${at}.activationEnergy`} label="Activation energy" kind="energyPerMol" external={external} />
              <QuantityField path={`${at}.referenceTemperature`} label="Reference temperature" kind="temperature" hint="Blank: the feed temperature." optional external={external} />
              {r.reverseOn ? (
                <QuantityField path={`${at}.reverse.activationEnergy`} label="Reverse activation energy" kind="energyPerMol" hint="Blank: the reverse term does not vary with T." optional external={external} />
              ) : null}
            </div>
          ) : null}
        </div>
      ) : (
        <ExpressionLaw index={index} errorAt={errorAt} />
      )}
    </fieldset>
  );
}

/** A row of per-species numbers (coefficients or orders), one small input per species. */
function PerSpecies({ legend, hint, path, species, errorAt }: { legend: string; hint?: string; path: string; species: Species; errorAt: ErrorAt }) {
  const { register } = useFormContext();
  const groupId = fieldId(path);
  const group = errorAt(path);
  return (
    <fieldset aria-describedby={group ? `${groupId}-error` : undefined}>
      <legend className="field-label">{legend}</legend>
      {hint ? <p className="-mt-0.5 mb-1 text-xs text-ink-soft">{hint}</p> : null}
      <div className="flex flex-wrap gap-2">
        {species.map((s, i) => {
          const name = s.name?.trim() || `species ${i + 1}`;
          const id = fieldId(`${path}.${s.key}`);
          const message = errorAt(`${path}.${s.key}`);
          return (
            <div key={s.key} className="w-24">
              <label htmlFor={id} className="block text-xs text-ink-soft">
                {name}
              </label>
              <input
                id={id}
                className="input num"
                inputMode="decimal"
                autoComplete="off"
                aria-label={`${legend}, ${name}`}
                aria-invalid={!!message}
                aria-describedby={message ? `${id}-error` : undefined}
                {...register(`${path}.${s.key}`)}
              />
              <ErrorText id={id} message={message} />
            </div>
          );
        })}
      </div>
      <ErrorText id={groupId} message={group} />
    </fieldset>
  );
}

/** A power-law rate constant: the number, its concentration and time basis, and the unit that makes for this order. */
function RateConstant({ path, label, order, value, errorAt }: { path: string; label: string; order: number; value?: NetworkReactionValues["k"]; errorAt: ErrorAt }) {
  const { register } = useFormContext();
  const id = fieldId(`${path}.value`);
  const message = errorAt(`${path}.value`);
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <div className="flex flex-wrap gap-1.5">
        <input id={id} className="input num min-w-0 flex-1" inputMode="decimal" autoComplete="off" aria-invalid={!!message} aria-describedby={message ? `${id}-error` : `${id}-hint`} {...register(`${path}.value`)} />
        <select aria-label={`${label} concentration basis`} className="input w-auto" {...register(`${path}.conc`)}>
          <UnitOptions kind="concentration" />
        </select>
        <select aria-label={`${label} time basis`} className="input w-auto" {...register(`${path}.time`)}>
          <UnitOptions kind="time" />
        </select>
      </div>
      <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
        In {rateConstantLabel(order, value?.conc ?? "mol/L", value?.time ?? "s")} for total order {Math.round(order * 1000) / 1000}.
      </p>
      <ErrorText id={id} message={message} />
    </div>
  );
}

function ExpressionLaw({ index, errorAt }: { index: number; errorAt: ErrorAt }) {
  const { control, register } = useFormContext<NetworkFormValues>();
  const at = `reactions.${index}` as const;
  const { fields, append, remove } = useFieldArray({ control, name: `${at}.parameters` });
  const id = fieldId(`${at}.expression`);
  return (
    <div className="space-y-3">
      <div>
        <label htmlFor={id} className="field-label">
          Rate of reaction {index + 1}, mol/(m³·s)
        </label>
        <textarea id={id} rows={2} className="input font-mono" spellCheck={false} aria-invalid={!!errorAt(`${at}.expression`)} aria-describedby={`${id}-hint`} {...register(`${at}.expression`)} />
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
          Variables C_A, C_B… (mol/m³) and T (K); functions exp, log, sqrt, pow, min, max…
        </p>
        <ErrorText id={id} message={errorAt(`${at}.expression`)} />
      </div>
      <fieldset>
        <legend className="field-label">Parameters (in SI units)</legend>
        <div className="space-y-1.5">
          {fields.map((f, i) => {
            const nid = fieldId(`${at}.parameters.${i}.name`);
            const vid = fieldId(`${at}.parameters.${i}.value`);
            return (
              <div key={f.id}>
                <div className="grid grid-cols-[1fr_1fr_auto] gap-1.5">
                  <input id={nid} className="input" aria-label={`Parameter ${i + 1}`} autoComplete="off" aria-invalid={!!errorAt(`${at}.parameters.${i}.name`)} {...register(`${at}.parameters.${i}.name`)} />
                  <input id={vid} className="input num" aria-label={`Parameter value ${i + 1}`} inputMode="decimal" autoComplete="off" aria-invalid={!!errorAt(`${at}.parameters.${i}.value`)} {...register(`${at}.parameters.${i}.value`)} />
                  <button type="button" className="btn-quiet py-1" onClick={() => remove(i)} aria-label={`Remove parameter ${i + 1}`}>
                    Remove
                  </button>
                </div>
                <ErrorText id={nid} message={errorAt(`${at}.parameters.${i}.name`)} />
                <ErrorText id={vid} message={errorAt(`${at}.parameters.${i}.value`)} />
              </div>
            );
          })}
        </div>
        <button type="button" className="btn-quiet mt-1.5 py-1" onClick={() => append({ name: "", value: "" })}>
          + Add a parameter
        </button>
        <ErrorText id={fieldId(`${at}.parameters`)} message={errorAt(`${at}.parameters`)} />
      </fieldset>
    </div>
  );
}
