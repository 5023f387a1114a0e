"use client";

import type { UseFormRegisterReturn } from "react-hook-form";

/** A radio group drawn as cards: a title and one line of explanation each. */
export function ChoiceCards({ label, options, current, field, columns = "sm:grid-cols-2" }: {
  label: string;
  options: readonly (readonly [string, string, string])[];
  current: string | undefined;
  field: UseFormRegisterReturn;
  columns?: string;
}) {
  return (
    <div role="radiogroup" aria-label={label} className={`grid gap-1.5 ${columns}`}>
      {options.map(([value, title, text]) => (
        <label key={value} className={`flex cursor-pointer items-start gap-2 rounded border p-2 text-sm ${current === value ? "border-accent-500 bg-accent-50" : "border-line"}`}>
          <input type="radio" value={value} className="mt-0.5" {...field} />
          <span>
            <span className="font-medium">
              {current === value ? <span className="sr-only">Chosen: </span> : null}
              {title}
            </span>
            <span className="block text-xs text-ink-soft">{text}</span>
          </span>
        </label>
      ))}
    </div>
  );
}
