/**
 * The one way the product writes a moment and a day, on screens, in the report and in the PDF.
 * Always in UTC and always saying so: a team spread over time zones reads the same time for the
 * same event, and the server and the browser render the same text (no hydration mismatch).
 * Dependency-free, so client components, services and the PDF writer all use it.
 */

type When = Date | string | number | null | undefined;

const DATE_TIME = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" });
const DAY = new Intl.DateTimeFormat("en-GB", { day: "2-digit", month: "short", year: "numeric", timeZone: "UTC" });

function toDate(when: When): Date | null {
  if (when === null || when === undefined || when === "") return null;
  const d = when instanceof Date ? when : new Date(when);
  return Number.isNaN(d.getTime()) ? null : d;
}

/** "3 Dec 2026, 08:05 UTC"; "—" when there is no moment. */
export function formatDateTime(when: When): string {
  const d = toDate(when);
  return d ? `${DATE_TIME.format(d)} UTC` : "—";
}

/** "03 Dec 2026" (the UTC day); "—" when there is no day. */
export function formatDay(when: When): string {
  const d = toDate(when);
  return d ? DAY.format(d) : "—";
}
