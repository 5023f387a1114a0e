import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, type FieldValues, type UseFormProps } from "react-hook-form";
import type { z } from "zod";

/**
 * A form checked in the browser by the same zod schema the route checks on the server: the
 * fields hold what the schema takes in while editing, and submit hands on what it gives out.
 */
export function useSchemaForm<S extends z.ZodType<FieldValues, FieldValues>>(schema: S, options: Omit<UseFormProps<z.input<S>, unknown, z.output<S>>, "resolver"> = {}) {
  return useForm<z.input<S>, unknown, z.output<S>>({ resolver: zodResolver(schema), ...options });
}
