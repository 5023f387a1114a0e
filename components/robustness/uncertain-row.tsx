"use client";

import type { OfferedField } from "@/lib/services/views";

export interface Draft {
  field: string;
  kind: "plusMinus" | "uniform" | "normal";
  a: string;
  b: string;
}

const PARAMS: Record<Draft["kind"], [string, string | null]> = {
  plusMinus: ["± %", null],
  uniform: ["Low", "High"],
  normal: ["Mean", "Standard deviation"],
};

/** One uncertain input: the field (with its current value in SI units), its distribution and range. */
export function UncertainRow({
  index,
  draft,
  fields,
  error,
  onChange,
  onRemove,
}: {
  index: number;
  draft: Draft;
  fields: OfferedField[];
  error?: string;
  onChange: (d: Draft) => void;
  onRemove?: () => void;
}) {
  const id = `rb-${index}`;
  const current = fields.find((f) => f.field === draft.field);
  const [first, second] = PARAMS[draft.kind];
  const setKind = (kind: Draft["kind"]) => {
    const v = current?.value ?? 0;
    if (kind === "plusMinus") onChange({ ...draft, kind, a: "20", b: "" });
    else if (kind === "uniform") onChange({ ...draft, kind, a: String(Number((v * 0.8).toPrecision(6))), b: String(Number((v * 1.2).toPrecision(6))) });
    else onChange({ ...draft, kind, a: String(v), b: String(Number((v * 0.1).toPrecision(6))) });
  };
  return (
    <div className="flex flex-wrap items-end gap-2 rounded border border-line p-2" data-testid={`uncertain-${index}`}>
      <div>
        <label htmlFor={`${id}-field`} className="field-label">
          Input
        </label>
        <select id={`${id}-field`} className="input" value={draft.field} onChange={(e) => onChange({ ...draft, field: e.target.value })}>
          {fields.map((f) => (
            <option key={f.field} value={f.field}>
              {f.label} (now {Number(f.value.toPrecision(6))} {f.unit})
            </option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor={`${id}-kind`} className="field-label">
          Distribution
        </label>
        <select id={`${id}-kind`} className="input" value={draft.kind} onChange={(e) => setKind(e.target.value as Draft["kind"])}>
          <option value="plusMinus">± a percentage, uniform</option>
          <option value="uniform">Uniform between two values</option>
          <option value="normal">Normal</option>
        </select>
      </div>
      <NumberBox id={`${id}-a`} label={first} value={draft.a} onChange={(a) => onChange({ ...draft, a })} />
      {second ? <NumberBox id={`${id}-b`} label={second} value={draft.b} onChange={(b) => onChange({ ...draft, b })} /> : null}
      {onRemove ? (
        <button type="button" className="btn-quiet text-sm" onClick={onRemove} aria-label={`Remove uncertain input ${index + 1}`}>
          Remove
        </button>
      ) : null}
      {error ? (
        <p className="field-error w-full" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** A labelled number of the distribution (± %, low, high, mean or standard deviation). */
function NumberBox({ id, label, value, onChange }: { id: string; label: string; value: string; onChange: (v: string) => void }) {
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <input id={id} className="input w-32" inputMode="decimal" value={value} onChange={(e) => onChange(e.target.value)} />
    </div>
  );
}
