import { z } from "zod";

/* What both kinetics editors (one reaction, several reactions) share about a typed quantity and a form problem. */

/** A number as typed and the unit picked beside it. */
export const quantityInput = z.object({ value: z.string(), unit: z.string() });
export type QuantityInput = z.infer<typeof quantityInput>;

/** A problem at a field of the form, by the form's own field path (e.g. "feed.flowA.value", "reactions.1.k.value"). */
export interface FormIssue {
  path: string;
  message: string;
}

export const q = (value: string | number, unit: string): QuantityInput => ({ value: String(value), unit });

/** A number typed in a field: undefined when blank ("Required" when it must be given) or not a number ("Enter a number"). */
export function readTypedNumber(text: string | undefined, required: boolean, problem: (message: string) => void): number | undefined {
  const t = (text ?? "").trim();
  if (t === "") {
    if (required) problem("Required");
    return undefined;
  }
  const n = Number(t);
  if (!Number.isFinite(n)) {
    problem("Enter a number");
    return undefined;
  }
  return n;
}
