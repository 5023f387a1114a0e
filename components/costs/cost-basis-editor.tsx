"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Field, FormMessage } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { formatNumber, TABLE_NUMBERS } from "@/lib/format/numbers";
import type { CostBasisAnswer } from "@/lib/services/views";
import { STAGE_TYPES } from "@/lib/stage-types";
import { basisToForm, formFieldOf, formToBody, type CostForm } from "./cost-basis-form-state";

interface CostsAnswer {
  costs: CostBasisAnswer;
}

/** The project's cost basis: correlations with their sources, money basis, sizes, largest vessel, installation factor. */
export function CostBasisEditor({ projectId }: { projectId: string }) {
  const url = `/api/projects/${projectId}/costs`;
  const q = useQuery({ queryKey: ["costs", projectId], queryFn: () => fetchJson<CostsAnswer>(url).then((r) => r.costs) });
  if (q.isPending) return <p className="text-ink-soft">Loading the cost basis…</p>;
  if (q.isError) return <FormMessage kind="error">Could not load the cost basis.</FormMessage>;
  return <CostBasisForm url={url} projectId={projectId} data={q.data} />;
}

function CostBasisForm({ url, projectId, data }: { url: string; projectId: string; data: CostsAnswer["costs"] }) {
  const client = useQueryClient();
  const [form, setForm] = useState<CostForm>(() => basisToForm(data.basis));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ kind: "error" | "info"; text: string }>();
  const readOnly = !data.permissions.update;
  const save = useMutation({
    mutationFn: () => fetchJson<CostsAnswer>(url, { method: "PUT", json: formToBody(form) }),
    onSuccess: (r) => {
      setErrors({});
      setMessage({ kind: "info", text: "Cost basis saved." });
      client.setQueryData(["costs", projectId], r.costs);
    },
    onError: (e) => {
      if (!(e instanceof ApiError)) return setMessage({ kind: "error", text: "Could not reach the server; nothing was saved." });
      const next: Record<string, string> = {};
      for (const [k, m] of Object.entries(e.fields)) next[formFieldOf(k)] = m.join(" ");
      setErrors(next);
      setMessage({ kind: "error", text: `${e.message}. Nothing was saved.` });
    },
  });

  const set = (k: string) => (e: { target: { value: string } }) => setForm((f) => ({ ...f, [k]: e.target.value }));
  const input = (k: string, label: string, cls = "w-28", hint?: string) => {
    const id = `c-${k.replace(/\./g, "-")}`;
    return (
      <Field id={id} label={label} error={errors[k]}>
        <input id={id} className={`input ${cls}`} value={form[k]} onChange={set(k)} readOnly={readOnly} aria-invalid={!!errors[k]} aria-describedby={errors[k] ? `${id}-error` : hint ? `${id}-hint` : undefined} />
        {hint && !errors[k] ? (
          <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
            {hint}
          </p>
        ) : null}
      </Field>
    );
  };

  return (
    <form
      className="space-y-4"
      noValidate
      aria-label="Cost basis"
      onSubmit={(e) => {
        e.preventDefault();
        setMessage(undefined);
        save.mutate();
      }}
    >
      {data.isDefault ? <FormMessage kind="info">This project has no cost basis of its own yet: these are the defaults. Saving makes them the project&apos;s.</FormMessage> : null}
      {STAGE_TYPES.map((t) => (
        <fieldset key={t} className="card space-y-2 p-4">
          <legend className="px-1 text-base font-semibold">{t} purchase cost = a + b·S^n (S: one vessel&apos;s volume, m³)</legend>
          <div className="flex flex-wrap gap-3">
            {input(`vessels.${t}.a`, "a")}
            {input(`vessels.${t}.b`, "b")}
            {input(`vessels.${t}.n`, "n (size exponent)", "w-20", "Near 0.6 is common practice")}
          </div>
          {input(`vessels.${t}.source`, "Source of these numbers", "w-full", "A published source, a quote, or \u201cfrom memory\u201d")}
        </fieldset>
      ))}
      <fieldset className="card flex flex-wrap gap-3 p-4">
        <legend className="px-1 text-base font-semibold">Money</legend>
        {input("currency", "Currency", "w-20")}
        {input("basisYear", "Basis year", "w-24")}
      </fieldset>
      <fieldset className="card space-y-3 p-4">
        <legend className="px-1 text-base font-semibold">Sizes one can buy</legend>
        <div className="flex flex-wrap gap-4 text-sm" role="radiogroup" aria-label="Standard sizes">
          {[
            ["r10", "ISO 3 R10 preferred numbers in a range"],
            ["custom", "My own list"],
            ["any", "Any size"],
          ].map(([v, label]) => (
            <label key={v} className="flex items-center gap-1.5">
              <input type="radio" name="sizes-mode" value={v} checked={form["sizes.mode"] === v} onChange={set("sizes.mode")} disabled={readOnly} /> {label}
            </label>
          ))}
        </div>
        {form["sizes.mode"] === "r10" ? (
          <div className="flex flex-wrap gap-3">
            {input("sizes.min", "Smallest, m³")}
            {input("sizes.max", "Largest, m³")}
          </div>
        ) : form["sizes.mode"] === "custom" ? (
          input("sizes.values", "Sizes, m³ (comma separated)", "w-96")
        ) : null}
        {data.standardSizes && form["sizes.mode"] !== "any" ? (
          <p className="text-xs text-ink-soft" data-testid="saved-sizes">
            Saved sizes: <span className="num">{data.standardSizes.map((s) => formatNumber(s, 3, TABLE_NUMBERS)).join(", ")}</span> m³
          </p>
        ) : null}
        {input("maxVesselVolume", "Largest single vessel, m³ (blank: no limit)", "w-28", "A larger stage is split into the fewest identical parallel vessels")}
      </fieldset>
      <fieldset className="card space-y-2 p-4">
        <legend className="px-1 text-base font-semibold">Installation</legend>
        {input("installationFactor.value", "Installation factor (installed cost = purchase × factor)", "w-24")}
        {input("installationFactor.source", "Source of the factor", "w-full")}
      </fieldset>
      {message ? <FormMessage kind={message.kind}>{message.text}</FormMessage> : null}
      {readOnly ? (
        <p className="text-sm text-ink-soft">Your role reads the cost basis but does not change it.</p>
      ) : (
        <button type="submit" className="btn-primary" disabled={save.isPending}>
          Save cost basis
        </button>
      )}
    </form>
  );
}
