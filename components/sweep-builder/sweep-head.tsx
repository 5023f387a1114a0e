"use client";

import { useFormContext } from "react-hook-form";
import { ErrorText, messageAt } from "@/components/kinetics/quantity-field";

/**
 * The head of the sweep form: which kinetics version to sweep and the sweep's name. Both sweep forms
 * share it; `beside` fills the column next to the version (the target, or what the model is), and
 * `choose` offers an empty first choice where no version need be picked yet.
 */
export function SweepHead({ prefix, versions, choose = false, beside }: { prefix: string; versions: { id: string; label: string }[]; choose?: boolean; beside: React.ReactNode }) {
  const { register, formState } = useFormContext();
  const err = (p: string) => messageAt(formState.errors, p);
  return (
    <section className="card grid gap-3 p-4 sm:grid-cols-[2fr_1fr]">
      <div>
        <label htmlFor={`${prefix}-kineticsVersionId`} className="field-label">
          Kinetics version
        </label>
        <select id={`${prefix}-kineticsVersionId`} className="input" aria-invalid={!!err("kineticsVersionId")} {...register("kineticsVersionId")}>
          {choose ? <option value="">Choose…</option> : null}
          {versions.map((o) => (
            <option key={o.id} value={o.id}>
              {o.label}
            </option>
          ))}
        </select>
        <ErrorText id={`${prefix}-kineticsVersionId`} message={err("kineticsVersionId")} />
      </div>
      {beside}
      <div className="sm:col-span-2">
        <label htmlFor={`${prefix}-name`} className="field-label">
          Sweep name <span className="normal-case tracking-normal text-ink-soft">(optional)</span>
        </label>
        <input id={`${prefix}-name`} className="input" placeholder="Named after the kinetics and scenario count when blank" {...register("name")} />
        <ErrorText id={`${prefix}-name`} message={err("name")} />
      </div>
    </section>
  );
}
