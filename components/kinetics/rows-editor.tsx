"use client";

import { useFieldArray, useFormContext } from "react-hook-form";
import { ErrorText, fieldId, messageAt, type ExternalErrors } from "./quantity-field";

/**
 * A small list of name → number pairs (species ratios, stoichiometric coefficients, orders,
 * expression parameters), with add and remove buttons.
 */
export function RowsEditor({
  path,
  legend,
  nameLabel,
  valueLabel,
  addLabel,
  hint,
  external,
  fixed,
}: {
  path: string;
  legend: string;
  nameLabel: string;
  valueLabel: string;
  addLabel: string;
  hint?: string;
  external?: ExternalErrors;
  /** A read-only first row, e.g. A: −1 in the stoichiometry. */
  fixed?: { name: string; value: string };
}) {
  const { control, formState } = useFormContext();
  const { fields, append, remove } = useFieldArray({ control, name: path });
  const groupId = fieldId(path);
  const groupError = messageAt(formState.errors, path) ?? external?.[path];
  return (
    <fieldset className="min-w-0" aria-describedby={groupError ? `${groupId}-error` : undefined}>
      <legend className="field-label">{legend}</legend>
      {hint ? <p className="-mt-0.5 mb-1 text-xs text-ink-soft">{hint}</p> : null}
      <div className="space-y-1.5">
        {fixed ? (
          <div className="grid grid-cols-[1fr_1fr_auto] gap-1.5 text-sm">
            <span className="input bg-paper text-ink-soft">{fixed.name}</span>
            <span className="input num bg-paper text-ink-soft">{fixed.value}</span>
            <span className="w-[4.5rem] self-center text-xs text-ink-soft">fixed</span>
          </div>
        ) : null}
        {fields.map((f, i) => {
          const nameErr = messageAt(formState.errors, `${path}.${i}.name`);
          const valueErr = messageAt(formState.errors, `${path}.${i}.value`);
          const nid = fieldId(`${path}.${i}.name`);
          const vid = fieldId(`${path}.${i}.value`);
          return (
            <div key={f.id}>
              <div className="grid grid-cols-[1fr_1fr_auto] gap-1.5">
                <RowInput path={`${path}.${i}.name`} label={`${nameLabel} ${i + 1}`} error={nameErr} />
                <RowInput path={`${path}.${i}.value`} label={`${valueLabel} ${i + 1}`} error={valueErr} numeric />
                <button type="button" className="btn-quiet w-[4.5rem] justify-center py-1" onClick={() => remove(i)} aria-label={`Remove ${nameLabel.toLowerCase()} ${i + 1}`}>
                  Remove
                </button>
              </div>
              <ErrorText id={nid} message={nameErr} />
              <ErrorText id={vid} message={valueErr} />
            </div>
          );
        })}
      </div>
      <button type="button" className="btn-quiet mt-1.5 py-1" onClick={() => append({ name: "", value: "" })}>
        + {addLabel}
      </button>
      <ErrorText id={groupId} message={groupError} />
    </fieldset>
  );
}

/** One cell of a row: the name, or (numeric) the value, registered with the form at `path`. */
function RowInput({ path, label, error, numeric = false }: { path: string; label: string; error?: string; numeric?: boolean }) {
  const { register } = useFormContext();
  return (
    <input
      id={fieldId(path)}
      className={numeric ? "input num" : "input"}
      aria-label={label}
      aria-invalid={!!error}
      inputMode={numeric ? "decimal" : undefined}
      autoComplete="off"
      {...register(path)}
    />
  );
}
