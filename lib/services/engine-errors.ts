import type { EngineError } from "@/lib/engine";
import { AppError } from "@/lib/errors";
import { labelFor } from "@/lib/schemas/field-labels";

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

/**
 * What the engine said about one field, without the field's path or key, in words a person reads
 * after the field's label: "Stage 1 volume: "abc" is not a quantity with a unit, e.g. 2.5 m³".
 * The engine itself stays free of labels (it is also a command-line tool that speaks paths).
 */
export function engineMessageInWords(err: EngineError): string {
  const last = err.path.split(".").at(-1) ?? "";
  let m = err.message.replace(new RegExp(`^${escape(err.path)}:? ?`), "");
  const unreadable = /^cannot read "(.*)" as a quantity/.exec(m);
  if (err.code === "invalid-unit" && unreadable) return `"${unreadable[1]}" is not a quantity with a unit, e.g. 2.5 m³`;
  const range = /must be an integer within (-?\d+)\.\.(-?\d+)$/.exec(m);
  if (range) return `a whole number from ${range[1]} to ${range[2]}`;
  if (last && !/^\d+$/.test(last)) m = m.replace(new RegExp(`^${escape(last)} `), "");
  m = m
    .replace(/^must be a finite number$/, "enter a number")
    .replace(/within \(0, 1\)/g, "between 0 and 1 (not 0 or 1)")
    .replace(/within \(0, (\d+)\]/g, "above 0 and at most $1")
    .replace(/>= ?(-?[\d.]+)/g, "$1 or more")
    .replace(/> ?(-?[\d.]+)/g, "above $1")
    .replace(/\b(\d+)\.\.(\d+)\b/g, "$1 to $2");
  return m.charAt(0).toLowerCase() === m.charAt(0) ? m : m.charAt(0).toLowerCase() + m.slice(1);
}

/** An engine refusal as a 400 naming the field; `prefix` maps engine paths into the request body. */
export function toBadRequest(err: EngineError, prefix = ""): AppError {
  const field = prefix ? `${prefix}.${err.path}` : err.path;
  const words = engineMessageInWords(err);
  return new AppError("bad_request", `${labelFor(field)}: ${words}`, { fields: { [field]: [words] } });
}
