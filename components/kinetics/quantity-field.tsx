"use client";

import { useFormContext, useWatch } from "react-hook-form";
import { QuantityInput } from "@/components/ui/quantity-input";
import type { UnitKind } from "@/lib/units/display";

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
 * A kinetics quantity: the shared number-with-unit input bound to a { value, unit } pair at
 * `path`. Picking a unit never rewrites the number (60 then °C is 60 °C).
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
  const { register, formState } = useFormContext();
  const id = fieldId(`${path}.value`);
  const error = messageAt(formState.errors, `${path}.value`) ?? external?.[`${path}.value`];
  const unit = useWatch({ name: `${path}.unit` }) as string;
  const text = useWatch({ name: `${path}.value` }) as string;
  return (
    <QuantityInput
      id={id}
      label={label}
      kind={kind}
      number={register(`${path}.value`)}
      unit={register(`${path}.unit`)}
      unitValue={unit}
      numberText={text}
      error={error}
      hint={hint}
      optional={optional}
      echo
    />
  );
}
