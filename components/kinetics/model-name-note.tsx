"use client";

import { useFormContext } from "react-hook-form";
import { ErrorText } from "./quantity-field";

/** Whether the editor makes a new model or a new version of one, as both kinetics editors take it. */
export type KineticsEditorMode = { kind: "create"; projectId: string } | { kind: "version"; projectId: string; modelId: string; modelName: string; latestVersion: number };

/**
 * The head of a kinetics editor: the model's name (or which version saving makes) and the note.
 * Models of one reaction and of several are named and noted alike; only the example name differs.
 */
export function ModelNameNote({ mode, namePlaceholder, errorAt }: { mode: KineticsEditorMode; namePlaceholder: string; errorAt: (path: string) => string | undefined }) {
  const { register } = useFormContext();
  return (
    <section className="card space-y-3 p-4">
      {mode.kind === "create" ? (
        <div>
          <label htmlFor="f-name" className="field-label">
            Model name
          </label>
          <input id="f-name" className="input" placeholder={namePlaceholder} aria-invalid={!!errorAt("name")} {...register("name")} />
          <ErrorText id="f-name" message={errorAt("name")} />
        </div>
      ) : (
        <p className="text-sm text-ink-soft">
          Saving makes version {mode.latestVersion + 1} of <strong className="text-ink">{mode.modelName}</strong>; earlier versions and the sweeps run on them stay as they were.
        </p>
      )}
      <div>
        <label htmlFor="f-note" className="field-label">
          Note <span className="normal-case tracking-normal text-ink-soft">(optional)</span>
        </label>
        <input id="f-note" className="input" placeholder="Where the numbers come from" aria-invalid={!!errorAt("note")} {...register("note")} />
        <ErrorText id="f-note" message={errorAt("note")} />
      </div>
    </section>
  );
}
