"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { UnitOptions } from "@/components/ui/unit-options";
import { useRouter } from "next/navigation";
import { useCallback, useMemo, useState } from "react";
import { FormProvider, useForm, useFormContext, useWatch, type Path } from "react-hook-form";
import type { z } from "zod";
import { ChoiceCards } from "@/components/forms/choice-cards";
import { FormMessage } from "@/components/ui/field";
import { ApiError } from "@/lib/client/fetch-json";
import { rateConstantLabel, unitOptions } from "@/lib/units/display";
import { formToSpec, kineticsFormSchema, mapServerFields, type KineticsFormValues } from "./kinetics-form-state";
import { PreviewPanel } from "./preview-panel";
import { ErrorText, fieldId, messageAt, QuantityField, type ExternalErrors } from "./quantity-field";
import { RowsEditor } from "./rows-editor";
import { KineticsSaveBar, markRefusedFields, saveKinetics } from "./kinetics-save";
import { ModelNameNote, type KineticsEditorMode } from "./model-name-note";

type Mode = KineticsEditorMode;

const LAWS = [
  ["power", "Power law", "k ∏ Cᵢ^aᵢ, optional reverse term"],
  ["saturation", "Saturation", "vmax C_A/(km + C_A + C_A²/ki)"],
  ["expression", "Expression", "your formula of C_i, T and X"],
  ["table", "Rate table", "measured −rA against X"],
] as const;

export function KineticsEditor({ mode, initial }: { mode: Mode; initial: KineticsFormValues }) {
  const router = useRouter();
  const schema = useMemo(() => kineticsFormSchema(mode.kind), [mode.kind]);
  const form = useForm<z.input<typeof schema>, unknown, z.output<typeof schema>>({
    resolver: zodResolver(schema),
    defaultValues: initial,
    mode: "onChange",
  });
  const { register, formState, control } = form;
  const values = useWatch({ control }) as KineticsFormValues;
  const [target, setTarget] = useState("0.9");
  const [engine, setEngine] = useState<{ byField: ExternalErrors; rest: string[] }>({ byField: {}, rest: [] });
  const [formError, setFormError] = useState<string>();
  const [saved, setSaved] = useState<string>();

  const draft = useMemo(() => formToSpec(values), [values]);
  const specJson = draft.spec ? JSON.stringify(draft.spec) : null;
  const onEngineErrors = useCallback((fields: Record<string, string[]>) => setEngine(mapServerFields(fields)), []);
  const ext = engine.byField;
  const err = (path: string) => messageAt(formState.errors, path) ?? ext[path];

  const law = values.reaction?.rate?.law ?? "power";
  const order = (values.reaction?.rate?.orders ?? []).reduce((a, r) => a + (Number(r?.value) || 0), 0);
  const reverseOrder = (values.reaction?.rate?.reverse?.orders ?? []).reduce((a, r) => a + (Number(r?.value) || 0), 0);
  const adiabatic = values.reaction?.thermal?.mode === "adiabatic";

  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(undefined);
    setSaved(undefined);
    try {
      const message = await saveKinetics(mode, body, router);
      if (message) {
        setSaved(message);
        form.reset(form.getValues());
      }
    } catch (e) {
      if (!(e instanceof ApiError)) return setFormError("Could not reach the server; nothing was saved.");
      const { rest } = markRefusedFields(e.fields, mapServerFields, form.setError);
      setFormError(rest.length || !Object.keys(e.fields).length ? [e.message, ...rest].filter((m, i, a) => a.indexOf(m) === i).join(" ") : "Fix the fields marked with ✕.");
    }
  });

  const select = (path: string, label: string, options: { value: string; label: string }[]) => (
    <select aria-label={label} className="input w-auto" {...register(path as Path<KineticsFormValues>)}>
      {options.map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </select>
  );
  const rateConstant = (path: string, label: string, n: number) => {
    const id = fieldId(`${path}.value`);
    const message = err(`${path}.value`);
    const conc = (path === "reaction.rate.k" ? values.reaction?.rate?.k?.conc : values.reaction?.rate?.reverse?.k?.conc) ?? "mol/L";
    const time = (path === "reaction.rate.k" ? values.reaction?.rate?.k?.time : values.reaction?.rate?.reverse?.k?.time) ?? "s";
    return (
      <div>
        <label htmlFor={id} className="field-label">
          {label}
        </label>
        <div className="flex flex-wrap gap-1.5">
          <input id={id} className="input num min-w-0 flex-1" inputMode="decimal" autoComplete="off" aria-invalid={!!message} aria-describedby={`${id}-hint`} {...register(`${path}.value` as Path<KineticsFormValues>)} />
          {select(`${path}.conc`, `${label} concentration basis`, unitOptions("concentration"))}
          {select(`${path}.time`, `${label} time basis`, unitOptions("time"))}
        </div>
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
          In {rateConstantLabel(n, conc, time)} for total order {Math.round(n * 1000) / 1000}.
        </p>
        <ErrorText id={id} message={message} />
      </div>
    );
  };

  return (
    <FormProvider {...form}>
      <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <form onSubmit={onSubmit} noValidate aria-label={mode.kind === "create" ? "New kinetics" : "New version"} className="space-y-4">
          <ModelNameNote mode={mode} namePlaceholder="e.g. Esterification, bench fit" errorAt={err} />

          <fieldset className="card space-y-3 p-4">
            <legend className="px-1 text-base font-semibold">Feed</legend>
            <div className="grid gap-3 sm:grid-cols-2">
              <QuantityField path="feed.flowA" label="Molar flow of A, FA0" kind="molarFlow" external={ext} />
              <QuantityField path="feed.concA" label="Concentration of A, CA0" kind="concentration" external={ext} />
              <QuantityField path="feed.temperature" label="Feed temperature" kind="temperature" external={ext} />
            </div>
            <RowsEditor
              path="feed.ratios"
              legend="Other species in the feed, Θ = Ci0/CA0"
              nameLabel="Feed species"
              valueLabel="Ratio to A"
              addLabel="Add a feed species"
              hint="Inerts included; species not listed enter at zero."
              external={ext}
            />
          </fieldset>

          <fieldset className="card space-y-3 p-4">
            <legend className="px-1 text-base font-semibold">Reaction</legend>
            <RowsEditor
              path="reaction.stoichiometry"
              legend="Stoichiometric coefficients per mole of A"
              nameLabel="Species"
              valueLabel="Coefficient"
              addLabel="Add a species"
              hint="Products positive, other reactants negative, inerts 0."
              fixed={{ name: "A", value: "−1" }}
              external={ext}
            />
            <div className="grid gap-3 sm:grid-cols-2">
              <fieldset>
                <legend className="field-label">Phase</legend>
                <div className="flex gap-4 text-sm">
                  <label className="flex items-center gap-1.5">
                    <input type="radio" value="liquid" {...register("reaction.phase")} /> Liquid (constant density)
                  </label>
                  <label className="flex items-center gap-1.5">
                    <input type="radio" value="gas" {...register("reaction.phase")} /> Gas (isobaric)
                  </label>
                </div>
              </fieldset>
              {values.reaction?.phase === "gas" ? (
                <div>
                  <label htmlFor={fieldId("reaction.epsilon")} className="field-label">
                    Expansion factor ε <span className="normal-case tracking-normal text-ink-soft">(optional)</span>
                  </label>
                  <input id={fieldId("reaction.epsilon")} className="input num" inputMode="decimal" placeholder="from stoichiometry" aria-invalid={!!err("reaction.epsilon")} {...register("reaction.epsilon")} />
                  <ErrorText id={fieldId("reaction.epsilon")} message={err("reaction.epsilon")} />
                </div>
              ) : null}
            </div>
          </fieldset>

          <fieldset className="card space-y-3 p-4">
            <legend className="px-1 text-base font-semibold">Rate law, −rA</legend>
            <ChoiceCards label="Rate law" options={LAWS} current={law} field={register("reaction.rate.law")} />
            <ErrorText id={fieldId("reaction.rate.law")} message={err("reaction.rate.law")} />

            {law === "power" ? (
              <div className="space-y-3">
                {rateConstant("reaction.rate.k", "Rate constant k", order)}
                <RowsEditor path="reaction.rate.orders" legend="Orders" nameLabel="Order species" valueLabel="Order" addLabel="Add an order" external={ext} />
                <label className="flex items-center gap-2 text-sm">
                  <input type="checkbox" {...register("reaction.rate.reverseOn")} /> Reversible: subtract a reverse term
                </label>
                {values.reaction?.rate?.reverseOn ? (
                  <div className="space-y-3 border-l-2 border-line pl-3">
                    {rateConstant("reaction.rate.reverse.k", "Reverse rate constant", reverseOrder)}
                    <RowsEditor path="reaction.rate.reverse.orders" legend="Reverse orders" nameLabel="Reverse order species" valueLabel="Reverse order" addLabel="Add a reverse order" external={ext} />
                  </div>
                ) : null}
              </div>
            ) : null}
            {law === "saturation" ? (
              <div className="grid gap-3 sm:grid-cols-2">
                <QuantityField path="reaction.rate.vmax" label="vmax" kind="rate" external={ext} />
                <QuantityField path="reaction.rate.km" label="km" kind="concentration" external={ext} />
                <label className="flex items-center gap-2 self-end text-sm">
                  <input type="checkbox" {...register("reaction.rate.kiOn")} /> Substrate inhibition
                </label>
                {values.reaction?.rate?.kiOn ? <QuantityField path="reaction.rate.ki" label="ki" kind="concentration" external={ext} /> : null}
              </div>
            ) : null}
            {law === "power" || law === "saturation" ? (
              <div className="space-y-3">
                <label className="flex items-center gap-2 text-sm">
                  <input type="checkbox" {...register("reaction.rate.arrheniusOn")} /> Arrhenius temperature dependence
                </label>
                {values.reaction?.rate?.arrheniusOn ? (
                  <div className="grid gap-3 border-l-2 border-line pl-3 sm:grid-cols-2">
                    <QuantityField path="reaction.rate.activationEnergy" label="Activation energy" kind="energyPerMol" external={ext} />
                    <QuantityField path="reaction.rate.referenceTemperature" label="Reference temperature" kind="temperature" hint="Blank: the feed temperature." optional external={ext} />
                    {law === "power" && values.reaction?.rate?.reverseOn ? (
                      <QuantityField path="reaction.rate.reverse.activationEnergy" label="Reverse activation energy" kind="energyPerMol" hint="Blank: the reverse term does not vary with T." optional external={ext} />
                    ) : null}
                  </div>
                ) : null}
              </div>
            ) : null}
            {law === "expression" ? (
              <div className="space-y-3">
                <div>
                  <label htmlFor={fieldId("reaction.rate.expression")} className="field-label">
                    Expression for −rA, mol/(m³·s)
                  </label>
                  <textarea
                    id={fieldId("reaction.rate.expression")}
                    rows={2}
                    className="input font-mono"
                    spellCheck={false}
                    aria-invalid={!!err("reaction.rate.expression")}
                    aria-describedby={`${fieldId("reaction.rate.expression")}-hint`}
                    {...register("reaction.rate.expression")}
                  />
                  <p id={`${fieldId("reaction.rate.expression")}-hint`} className="mt-1 text-xs text-ink-soft">
                    Variables C_A, C_B… (mol/m³), T (K) and X; functions exp, log, sqrt, pow, min, max…
                  </p>
                  <ErrorText id={fieldId("reaction.rate.expression")} message={err("reaction.rate.expression")} />
                </div>
                <RowsEditor path="reaction.rate.parameters" legend="Parameters (in SI units)" nameLabel="Parameter" valueLabel="Parameter value" addLabel="Add a parameter" external={ext} />
              </div>
            ) : null}
            {law === "table" ? <RateTable external={ext} /> : null}
          </fieldset>

          <fieldset className="card space-y-3 p-4">
            <legend className="px-1 text-base font-semibold">Thermal mode</legend>
            <div className="flex gap-4 text-sm">
              <label className="flex items-center gap-1.5">
                <input type="radio" value="isothermal" {...register("reaction.thermal.mode")} /> Isothermal at the feed temperature
              </label>
              <label className="flex items-center gap-1.5">
                <input type="radio" value="adiabatic" {...register("reaction.thermal.mode")} /> Adiabatic
              </label>
            </div>
            {adiabatic ? (
              <div className="grid gap-3 sm:grid-cols-3">
                <QuantityField path="reaction.thermal.adiabaticRise" label="Adiabatic rise at X = 1" kind="temperatureDifference" hint="Negative when endothermic." external={ext} />
                <QuantityField path="reaction.thermal.maxTemperature" label="Maximum temperature" kind="temperature" optional external={ext} />
                <QuantityField path="reaction.thermal.interstageTemperature" label="Interstage temperature" kind="temperature" hint="Blank: no cooling between stages." optional external={ext} />
              </div>
            ) : null}
          </fieldset>

          <KineticsSaveBar mode={mode} formError={formError} saved={saved} submitting={formState.isSubmitting} />
        </form>
        <div className="lg:sticky lg:top-4 lg:self-start">
          <PreviewPanel specJson={specJson} target={target} onTarget={setTarget} targetError={ext.previewTarget} onEngineErrors={onEngineErrors} />
          {engine.rest.length ? (
            <div className="mt-2">
              <FormMessage kind="error">{engine.rest.join(" ")}</FormMessage>
            </div>
          ) : null}
        </div>
      </div>
    </FormProvider>
  );
}

function RateTable({ external }: { external: ExternalErrors }) {
  const { register, formState, control, setValue, getValues } = useFormContext();
  const rows = (useWatch({ control, name: "reaction.rate.table.rows" }) as { conversion: string; rate: string }[] | undefined) ?? [];
  const groupError = messageAt(formState.errors, "reaction.rate.table") ?? external["reaction.rate.table"];
  const id = fieldId("reaction.rate.table");
  return (
    <fieldset aria-describedby={groupError ? `${id}-error` : undefined}>
      <legend className="field-label">Measured rate against conversion</legend>
      <div className="mb-2 flex items-center gap-2 text-sm">
        <label htmlFor={fieldId("reaction.rate.table.rateUnit")}>Rate unit</label>
        <select id={fieldId("reaction.rate.table.rateUnit")} className="input w-auto" {...register("reaction.rate.table.rateUnit")}>
          <UnitOptions kind={"rate"} />
        </select>
      </div>
      <table className="table-dense">
        <thead>
          <tr>
            <th scope="col">X</th>
            <th scope="col">−rA</th>
            <th scope="col">
              <span className="sr-only">Remove</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((_, i) => (
            <tr key={i}>
              <td>
                <input className="input num" aria-label={`Conversion ${i + 1}`} aria-invalid={!!messageAt(formState.errors, `reaction.rate.table.rows.${i}.conversion`)} {...register(`reaction.rate.table.rows.${i}.conversion`)} />
              </td>
              <td>
                <input className="input num" aria-label={`Rate ${i + 1}`} aria-invalid={!!messageAt(formState.errors, `reaction.rate.table.rows.${i}.rate`)} {...register(`reaction.rate.table.rows.${i}.rate`)} />
              </td>
              <td className="text-right">
                <button
                  type="button"
                  className="btn-quiet py-1"
                  aria-label={`Remove point ${i + 1}`}
                  onClick={() => setValue("reaction.rate.table.rows", (getValues("reaction.rate.table.rows") as unknown[]).filter((__, j) => j !== i), { shouldValidate: true })}
                >
                  Remove
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <button
        type="button"
        className="btn-quiet mt-1.5 py-1"
        onClick={() => setValue("reaction.rate.table.rows", [...(getValues("reaction.rate.table.rows") as unknown[]), { conversion: "", rate: "" }], { shouldValidate: true })}
      >
        + Add a point
      </button>
      <p className="mt-1 text-xs text-ink-soft">From X = 0 to at least the target; interpolated, never extrapolated.</p>
      <ErrorText id={id} message={groupError} />
    </fieldset>
  );
}
