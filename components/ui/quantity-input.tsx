"use client";

import type { ComponentPropsWithoutRef, ReactNode } from "react";
import { UnitOptions } from "@/components/ui/unit-options";
import { echoInEngineUnits, type UnitKind } from "@/lib/units/display";

type InputProps = Omit<ComponentPropsWithoutRef<"input">, "id" | "type"> & { ref?: React.Ref<HTMLInputElement> };
type SelectProps = Omit<ComponentPropsWithoutRef<"select">, "children"> & { ref?: React.Ref<HTMLSelectElement> };

/**
 * The one number-with-unit input of the forms. The number and the unit are two independent
 * fields: picking another unit never rewrites the number, so "60" then °C means 60 °C. The
 * form converts to the engine's units when it saves, and keeps the picked unit to show it again.
 * `number` and `unit` take what react-hook-form's register() (or a plain value/onChange) gives.
 */
export function QuantityInput({
  id,
  label,
  kind,
  number,
  unit,
  unitValue,
  numberText,
  error,
  hint,
  optional = false,
  echo = false,
  className = "",
  inputClassName = "min-w-0 flex-1",
}: {
  id: string;
  label: ReactNode;
  kind: UnitKind;
  number: InputProps;
  unit: SelectProps;
  /** The unit picked now and the text typed now, for the echo in the engine's units. */
  unitValue?: string;
  numberText?: string;
  error?: string;
  hint?: string;
  optional?: boolean;
  /** Show what the typed quantity is in the engine's units, e.g. "= 333.15 K". */
  echo?: boolean;
  className?: string;
  inputClassName?: string;
}) {
  const echoText = echo && unitValue !== undefined && numberText !== undefined ? echoInEngineUnits(kind, numberText, unitValue) : "";
  const described = [error ? `${id}-error` : hint ? `${id}-hint` : "", echoText ? `${id}-echo` : ""].filter(Boolean).join(" ");
  return (
    <div className={className}>
      <label htmlFor={id} className="field-label">
        {label}
        {optional ? <span className="ml-1 normal-case tracking-normal text-ink-soft">(optional)</span> : null}
      </label>
      <div className="flex gap-1.5">
        <input
          id={id}
          className={`input num ${inputClassName}`}
          inputMode="decimal"
          autoComplete="off"
          aria-invalid={!!error}
          aria-describedby={described || undefined}
          {...number}
        />
        <select aria-label={typeof label === "string" ? `${label} unit` : "Unit"} className="input w-auto shrink-0" {...unit}>
          <UnitOptions kind={kind} />
        </select>
      </div>
      {echoText ? (
        <p id={`${id}-echo`} className="mt-1 text-xs text-ink-soft" data-testid={`${id}-echo`}>
          {echoText}
        </p>
      ) : null}
      {hint && !error ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-soft">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p className="field-error" id={`${id}-error`} role="alert">
          <span aria-hidden="true">✕ </span>
          {error}
        </p>
      ) : null}
    </div>
  );
}
