import type { ReactNode } from "react";

export function Field({ id, label, error, children, hint }: { id: string; label: string; error?: string; hint?: string; children: ReactNode }) {
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      {children}
      {hint && !error ? <p className="mt-1 text-xs text-ink-faint">{hint}</p> : null}
      {error ? (
        <p className="field-error" id={`${id}-error`} role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export function FormMessage({ kind, children }: { kind: "error" | "info"; children: ReactNode }) {
  const tone = kind === "error" ? "border-red-200 bg-red-50 text-red-800" : "border-accent-200 bg-accent-50 text-accent-800";
  return (
    <div role={kind === "error" ? "alert" : "status"} className={`rounded border px-3 py-2 text-sm ${tone}`}>
      {children}
    </div>
  );
}
