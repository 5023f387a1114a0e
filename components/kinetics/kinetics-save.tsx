"use client";

import Link from "next/link";
import type { useRouter } from "next/navigation";
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { FormMessage } from "@/components/ui/field";
import { fetchJson } from "@/lib/client/fetch-json";
import type { KineticsEditorMode } from "./model-name-note";

type Router = ReturnType<typeof useRouter>;

/**
 * Saves a kinetics model, the same for one reaction and several: a new model opens its page; a new
 * version stays and returns the words that say so. `reopen` sends the page to the new version too.
 */
export async function saveKinetics(mode: KineticsEditorMode, body: { spec: unknown; note?: string }, router: Router, reopen = false): Promise<string | undefined> {
  if (mode.kind === "create") {
    const res = await fetchJson<{ model: { id: string } }>(`/api/projects/${mode.projectId}/kinetics`, { method: "POST", json: body });
    router.push(`/projects/${mode.projectId}/kinetics/${res.model.id}?saved=1`);
    return undefined;
  }
  const res = await fetchJson<{ version: { version: number } }>(`/api/kinetics/${mode.modelId}/versions`, { method: "POST", json: { spec: body.spec, note: body.note } });
  if (reopen) router.replace(`/projects/${mode.projectId}/kinetics/${mode.modelId}?saved=1`);
  router.refresh();
  return `Saved as version ${res.version.version}.`;
}

/**
 * Marks at their fields what the server refused in a save: the chemistry's fields through `mapSpec`,
 * the name and the note as they are. Returns what has no field, and whether any field was marked.
 */
export function markRefusedFields<V extends FieldValues>(
  fields: Record<string, string[]>,
  mapSpec: (specFields: Record<string, string[]>) => { byField: Record<string, string>; rest: string[] },
  setError: UseFormSetError<V>,
): { rest: string[]; marked: boolean } {
  const { byField, rest } = mapSpec(Object.fromEntries(Object.entries(fields).filter(([k]) => k.startsWith("spec."))));
  for (const [path, message] of Object.entries(byField)) setError(path as Path<V>, { type: "server", message });
  for (const key of ["name", "note"] as const) if (fields[key]) setError(key as Path<V>, { type: "server", message: fields[key].join(" ") });
  return { rest, marked: Object.keys(byField).length > 0 || !!fields.name || !!fields.note };
}

/** The foot of a kinetics editor: the last refusal or save, the save button and the way back. */
export function KineticsSaveBar({ mode, formError, saved, submitting }: { mode: KineticsEditorMode; formError?: string; saved?: string; submitting: boolean }) {
  return (
    <>
      {formError ? <FormMessage kind="error">{formError}</FormMessage> : null}
      {saved ? <FormMessage kind="info">{saved}</FormMessage> : null}
      <div className="flex items-center gap-2">
        <button type="submit" className="btn-primary" disabled={submitting}>
          {mode.kind === "create" ? "Save kinetics" : `Save as version ${mode.latestVersion + 1}`}
        </button>
        <Link href={`/projects/${mode.projectId}`} className="btn-quiet">
          Back to the project
        </Link>
      </div>
    </>
  );
}
