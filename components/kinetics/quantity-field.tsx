"use client";

import { useFormContext, useWatch } from "react-hook-form";
import { UnitOptions } from "@/components/ui/unit-options";
import { convert, formatNumber, type UnitKind } from "@/lib/units/display";

/** The field's id, from its form path. */
export const fieldId = (path: string) => `f-${path.replace(/[.]/g, "-")}`;

/** Message of a nested react-hook-form error (plain or on an array's root). */
export function messageAt(errors: unknown, path: string): string | undefined {
  let node: unknown = errors;
  for (const key of path.split(".")) node = node && typeof node === "object" ? (node as Record<string, unknown>)[key] : undefined;
  const n = node as { message?: string; root?: { message?: string } } | undefined;
  return n?.message ?? n?.root?.message;
}

/** Errors the live preview or the server reported, by form path; shown when the form has none there. */
export type ExternalErrors = Record<string, string>;

export function ErrorText({ id, message }: { id: string; message?: string }) {
  if (!message) return null;
  return (
    <p className="field-error" id={`${id}-error`} role="alert">
      <span aria-hidden="true">✕ </span>
      {message}
    </p>
  );
}

/**
 * A number with its unit picker. The number is what the user typed; picking another unit
 * converts it so the quantity stays the same. `path` points at a { value, unit } pair.
 */
export function QuantityField({
  path,
  label,
  kind,
  hint,
  external,
  optional = false,
}: {
  path: string;
  label: string;
  kind: UnitKind;
  hint?: string;
  external?: ExternalErrors;
  optional?: boolean;
}) {
  const { register, setValue, getValues, formState } = useFormContext();
  const id = fieldId(`${path}.value`);
  const error = messageAt(formState.errors, `${path}.value`) ?? external?.[`${path}.value`];
  const unit = useWatch({ name: `${path}.unit` }) as string;
  const unitField = register(`${path}.unit`);
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
        {optional ? <span className="ml-1 normal-case tracking-normal text-ink-soft">(optional)</span> : null}
      </label>
      <div className="flex gap-1.5">
        <input
          id={id}
          className="input num min-w-0 flex-1"
          inputMode="decimal"
          autoComplete="off"
          aria-invalid={!!error}
          aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
          {...register(`${path}.value`)}
        />
        <select
          aria-label={`${label} unit`}
          className="input w-auto shrink-0"
          {...unitField}
          value={unit}
          onChange={(e) => {
            const next = e.target.value;
            const typed = Number(String(getValues(`${path}.value`)).trim());
            const raw = String(getValues(`${path}.value`)).trim();
            if (raw !== "" && Number.isFinite(typed)) {
              setValue(`${path}.value`, formatNumber(convert(kind, typed, unit, next), 6), { shouldValidate: true, shouldDirty: true });
            }
            void unitField.onChange(e);
          }}
        >
          <UnitOptions kind={kind} />
        </select>
      </div>
      {hint && !error ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
          {hint}
        </p>
      ) : null}
      <ErrorText id={id} message={error} />
    </div>
  );
}
