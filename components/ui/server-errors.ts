import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import type { FieldErrors } from "@/lib/errors";
import { labelFor } from "@/lib/schemas/field-labels";

/**
 * Puts the server's field errors beside the matching inputs; returns what had no field, each led
 * by the field's label (from the one mapping) since no input stands beside it.
 */
export function applyServerFieldErrors<T extends FieldValues>(
  fields: FieldErrors | undefined,
  setError: UseFormSetError<T>,
  known: readonly Path<T>[],
): string[] {
  const rest: string[] = [];
  for (const [key, messages] of Object.entries(fields ?? {})) {
    if ((known as readonly string[]).includes(key)) setError(key as Path<T>, { type: "server", message: messages.join(" ") });
    else rest.push(`${labelFor(key)}: ${messages.join(" ")}`);
  }
  return rest;
}
