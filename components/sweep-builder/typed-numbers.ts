/** A problem with one field of the sweep form, at its form path, in words for the engineer. */
export interface BuilderIssue {
  path: string;
  message: string;
}

/**
 * A number typed in a box of the sweep form, or an issue at its path. Both sweep forms (one
 * reaction and several) read numbers alike, so the messages are the same on both.
 */
export function numberIn(text: string, path: string, issues: BuilderIssue[], required = true): number | undefined {
  const t = text.trim();
  if (!t) {
    if (required) issues.push({ path, message: "Required" });
    return undefined;
  }
  const n = Number(t);
  if (!Number.isFinite(n)) {
    issues.push({ path, message: "Enter a number" });
    return undefined;
  }
  return n;
}

/** A list of numbers typed with commas (or spaces), or an issue at its path. */
export function listIn(text: string, path: string, issues: BuilderIssue[]): number[] {
  // A doubled separator ("1,,2") is a value left out, not a separator to skip.
  const parts = text.trim() ? text.trim().split(/\s*[,;]\s*|\s+/) : [];
  const out = parts.map(Number);
  if (parts.length === 0) issues.push({ path, message: "Give at least one value" });
  else if (parts.some((p) => p === "")) issues.push({ path, message: "A value is missing between two commas" });
  else if (out.some((n) => !Number.isFinite(n))) issues.push({ path, message: "Separate numbers with commas, e.g. 0.01, 0.02, 0.04" });
  return out;
}
