"use client";

import { useFormContext } from "react-hook-form";
import { ErrorText, messageAt } from "@/components/kinetics/quantity-field";

/**
 * A labelled number box of the sweep form with its error under it. The id is the form's prefix and
 * the field's path with dots as dashes, so a server message finds its box on either form.
 */
export function DecimalField({ prefix, path, label, extra = "w-24" }: { prefix: string; path: string; label: string; extra?: string }) {
  const { register, formState } = useFormContext();
  const id = `${prefix}-${path.replace(/\./g, "-")}`;
  const error = messageAt(formState.errors, path);
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <input id={id} className={`input num ${extra}`} inputMode="decimal" autoComplete="off" aria-invalid={!!error} {...register(path)} />
      <ErrorText id={id} message={error} />
    </div>
  );
}
