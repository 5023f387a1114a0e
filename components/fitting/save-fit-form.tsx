"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormProvider, useForm, useWatch } from "react-hook-form";
import { ErrorText, QuantityField } from "@/components/kinetics/quantity-field";
import { FormMessage } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { FIT_LAW_INFO, type FitLaw } from "@/lib/schemas/fits";
import { toSI, type UnitKind } from "@/lib/units/display";

type Q = { value: string; unit: string };
interface Values {
  target: "new" | "existing";
  modelName: string;
  modelId: string;
  feed: { flowA: Q; concA: Q; temperature: Q };
  note: string;
}

const FEED_FIELDS = [
  ["flowA", "molarFlow"],
  ["concA", "concentration"],
  ["temperature", "temperature"],
] as const satisfies readonly (readonly [keyof Values["feed"], UnitKind])[];

/**
 * Saves the shown fit as a kinetics model of the project (or a new version of one): the server
 * refits the law itself and keeps the dataset version as the source.
 */
export function SaveFitForm({
  projectId,
  versionId,
  law,
  feedConcA,
  defaultTemperature,
  models,
}: {
  projectId: string;
  versionId: string;
  law: FitLaw;
  feedConcA: number | null;
  defaultTemperature: number;
  models: { id: string; name: string }[];
}) {
  const router = useRouter();
  const form = useForm<Values>({
    defaultValues: {
      target: "new",
      modelName: `${FIT_LAW_INFO[law].label}, fitted`,
      modelId: models[0]?.id ?? "",
      feed: {
        flowA: { value: "", unit: "mol/s" },
        concA: { value: feedConcA ? String(feedConcA / 1000) : "", unit: "mol/L" },
        temperature: { value: String(Math.round(defaultTemperature * 100) / 100), unit: "K" },
      },
      note: "",
    },
  });
  const target = useWatch({ control: form.control, name: "target" });
  const [message, setMessage] = useState<string>();
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (v) => {
    setMessage(undefined);
    const feed: Record<string, number> = {};
    let bad = false;
    for (const [key, kind] of FEED_FIELDS) {
      const n = Number(v.feed[key].value.trim());
      if (v.feed[key].value.trim() === "" || !Number.isFinite(n)) {
        form.setError(`feed.${key}.value`, { type: "client", message: "Enter a number" });
        bad = true;
      } else feed[key] = toSI(kind, n, v.feed[key].unit);
    }
    if (bad) return;
    const body = {
      law,
      ...(v.target === "new" ? { modelName: v.modelName } : { modelId: v.modelId }),
      feed,
      ...(feedConcA ? { feedConcA } : {}),
      note: v.note,
    };
    try {
      const res = await fetchJson<{ model: { id: string } }>(`/api/dataset-versions/${versionId}/kinetics`, { method: "POST", json: body });
      router.push(`/projects/${projectId}/kinetics/${res.model.id}?saved=1`);
    } catch (e) {
      if (!(e instanceof ApiError)) return setMessage("Could not reach the server; nothing was saved.");
      const rest: string[] = [];
      for (const [field, msgs] of Object.entries(e.fields)) {
        const path = field.startsWith("feed.") ? `${field.split(".").slice(0, 2).join(".")}.value` : field;
        if (["feed.flowA.value", "feed.concA.value", "feed.temperature.value", "modelName", "modelId", "note"].includes(path)) {
          form.setError(path as "modelName", { type: "server", message: msgs.join(" ") });
        } else rest.push(...msgs);
      }
      setMessage([e.message, ...rest].filter((m, i, a) => a.indexOf(m) === i).join(" "));
    }
  });

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate aria-labelledby="save-fit-title" className="card space-y-3 p-4" data-testid="save-fit-form">
        <h2 id="save-fit-title">Save the {FIT_LAW_INFO[law].label.toLowerCase()} as kinetics</h2>
        <p className="text-sm text-ink-soft">The server fits the law again from the stored points and keeps this dataset version as the source of the kinetics version.</p>
        <fieldset className="flex flex-wrap gap-4 text-sm">
          <legend className="field-label">Save as</legend>
          <label className="flex items-center gap-1">
            <input type="radio" value="new" {...form.register("target")} /> a new kinetics model
          </label>
          <label className="flex items-center gap-1">
            <input type="radio" value="existing" disabled={!models.length} {...form.register("target")} /> a new version of an existing model
          </label>
        </fieldset>
        {target === "new" ? (
          <div>
            <label htmlFor="f-modelName" className="field-label">
              Model name
            </label>
            <input id="f-modelName" className="input" aria-invalid={!!errors.modelName} aria-describedby={errors.modelName ? "f-modelName-error" : undefined} {...form.register("modelName")} />
            <ErrorText id="f-modelName" message={errors.modelName?.message} />
          </div>
        ) : (
          <div>
            <label htmlFor="f-modelId" className="field-label">
              Kinetics model of this project
            </label>
            <select id="f-modelId" className="input" {...form.register("modelId")}>
              {models.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.name}
                </option>
              ))}
            </select>
            <ErrorText id="f-modelId" message={errors.modelId?.message} />
          </div>
        )}
        <div className="grid gap-3 sm:grid-cols-3">
          <QuantityField path="feed.flowA" label="Molar flow of A, FA0" kind="molarFlow" />
          <QuantityField path="feed.concA" label="Concentration of A, CA0" kind="concentration" />
          <QuantityField path="feed.temperature" label="Feed temperature" kind="temperature" />
        </div>
        {law === "reversible" ? <p className="text-xs text-ink-soft">The reaction is saved as A → R (stoichiometry A −1, R +1) with no R in the feed, so the reverse term reads C_R.</p> : null}
        <div>
          <label htmlFor="f-note" className="field-label">
            Note <span className="ml-1 normal-case tracking-normal text-ink-soft">(optional)</span>
          </label>
          <input id="f-note" className="input" {...form.register("note")} />
        </div>
        {message ? <FormMessage kind="error">{message}</FormMessage> : null}
        <button type="submit" className="btn-primary" disabled={form.formState.isSubmitting}>
          {form.formState.isSubmitting ? "Saving…" : "Save as kinetics"}
        </button>
      </form>
    </FormProvider>
  );
}
