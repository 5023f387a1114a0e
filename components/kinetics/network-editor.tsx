"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useCallback, useMemo, useState } from "react";
import { FormProvider, useFieldArray, useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { FormMessage } from "@/components/ui/field";
import { ApiError } from "@/lib/client/fetch-json";
import { MAX_NETWORK_REACTIONS } from "@/lib/schemas/network-spec";
import { isUnit } from "@/lib/units/display";
import { blankReaction, formToNetworkSpec, mapNetworkServerFields, networkFormSchema, type NetworkFormValues } from "./network-form-state";
import { NetworkPreviewPanel } from "./network-preview-panel";
import { NetworkReactionEditor } from "./network-reaction-editor";
import { NetworkSpeciesEditor } from "./network-species-editor";
import { ErrorText, messageAt } from "./quantity-field";
import { KineticsSaveBar, markRefusedFields, saveKinetics } from "./kinetics-save";
import { ModelNameNote, type KineticsEditorMode } from "./model-name-note";

type Mode = KineticsEditorMode;

/**
 * The editor of a kinetics model of several reactions: feed and species, reactions 1..10, and beside
 * them the live concentration path and selectivity charts. Saves a new model or a new version.
 */
export function NetworkEditor({ mode, initial }: { mode: Mode; initial: NetworkFormValues }) {
  const router = useRouter();
  const schema = useMemo(() => networkFormSchema(mode.kind), [mode.kind]);
  const form = useForm<z.input<typeof schema>, unknown, z.output<typeof schema>>({ resolver: zodResolver(schema), defaultValues: initial, mode: "onChange" });
  const { formState, control } = form;
  const values = useWatch({ control }) as NetworkFormValues;
  const reactions = useFieldArray({ control, name: "reactions" });
  const [engineFields, setEngineFields] = useState<Record<string, string[]>>({});
  const [formError, setFormError] = useState<string>();
  const [saved, setSaved] = useState<string>();

  const draft = useMemo(() => formToNetworkSpec(values), [values]);
  const specJson = draft.spec ? JSON.stringify(draft.spec) : null;
  const engine = useMemo(() => mapNetworkServerFields(engineFields, values), [engineFields, values]);
  // What is wrong with the draft shows at its field as it is typed; the engine's word comes after.
  const external = useMemo(() => {
    const out: Record<string, string> = { ...engine.byField };
    for (const i of draft.issues) out[i.path] ??= i.message;
    return out;
  }, [draft.issues, engine.byField]);
  const errorAt = (path: string) => messageAt(formState.errors, path) ?? external[path];
  const onEngineErrors = useCallback((fields: Record<string, string[]>) => setEngineFields(fields), []);
  const keySpecies = values.species?.find((s) => s?.key === values.keyReactant);

  const onSubmit = form.handleSubmit(async (body) => {
    setFormError(undefined);
    setSaved(undefined);
    try {
      const message = await saveKinetics(mode, body, router, true);
      if (message) {
        setSaved(message);
        form.reset(form.getValues());
        // The page reopens on the new version (the editor remounts on it): its banner carries the news.
      }
    } catch (e) {
      if (!(e instanceof ApiError)) return setFormError("Could not reach the server; nothing was saved.");
      const { rest, marked } = markRefusedFields(e.fields, (f) => mapNetworkServerFields(f, form.getValues()), form.setError);
      setFormError(marked && !rest.length ? "Fix the fields marked with ✕." : [e.message, ...rest].filter((m, i, a) => a.indexOf(m) === i).join(" "));
    }
  });

  return (
    <FormProvider {...form}>
      <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <form onSubmit={onSubmit} noValidate aria-label={mode.kind === "create" ? "New kinetics" : "New version"} className="space-y-4">
          <ModelNameNote mode={mode} namePlaceholder="e.g. Mono-adduct, bench fit" errorAt={errorAt} />

          <NetworkSpeciesEditor errorAt={errorAt} external={external} />

          <section aria-labelledby="reactions-title" className="space-y-3">
            <h2 id="reactions-title">Reactions</h2>
            {reactions.fields.map((f, j) => (
              <NetworkReactionEditor key={f.id} index={j} count={reactions.fields.length} onRemove={() => reactions.remove(j)} errorAt={errorAt} external={external} />
            ))}
            {reactions.fields.length < MAX_NETWORK_REACTIONS ? (
              <button type="button" className="btn-quiet py-1" onClick={() => reactions.append(blankReaction())}>
                + Add a reaction
              </button>
            ) : null}
            <ErrorText id="f-reactions" message={errorAt("reactions")} />
          </section>

          <KineticsSaveBar mode={mode} formError={formError} saved={saved} submitting={formState.isSubmitting} />
        </form>
        <div className="lg:sticky lg:top-4 lg:self-start">
          <NetworkPreviewPanel specJson={specJson} concUnit={keySpecies?.conc?.unit && isUnit("concentration", keySpecies.conc.unit) ? keySpecies.conc.unit : "mol/L"} onEngineErrors={onEngineErrors} />
          {engine.rest.length ? (
            <div className="mt-2">
              <FormMessage kind="error">{engine.rest.join(" ")}</FormMessage>
            </div>
          ) : null}
        </div>
      </div>
    </FormProvider>
  );
}
