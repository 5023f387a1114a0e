import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, type FieldValues, type Path, type UseFormProps, type UseFormSetError } from "react-hook-form";
import type { z } from "zod";
import { ApiError } from "@/lib/client/fetch-json";
import { applyServerFieldErrors } from "./server-errors";

/**
 * A form checked in the browser by the same zod schema the route checks on the server: the
 * fields hold what the schema takes in while editing, and submit hands on what it gives out.
 */
export function useSchemaForm<S extends z.ZodType<FieldValues, FieldValues>>(schema: S, options: Omit<UseFormProps<z.input<S>, unknown, z.output<S>>, "resolver"> = {}) {
  return useForm<z.input<S>, unknown, z.output<S>>({ resolver: zodResolver(schema), ...options });
}

/**
 * After a refused submit: puts the server's messages under the fields the form shows, and returns
 * what is left to say above the form (a problem with a field it does not show, a refusal naming
 * no field, or the server out of reach); undefined when every message found its field.
 */
export function messageAfterRefusal<T extends FieldValues>(err: unknown, setError: UseFormSetError<T>, shown: readonly Path<T>[]): string | undefined {
  if (!(err instanceof ApiError)) return "Could not reach the server.";
  const rest = applyServerFieldErrors(err.fields, setError, shown);
  return rest.length || !err.fields ? err.message : undefined;
}
