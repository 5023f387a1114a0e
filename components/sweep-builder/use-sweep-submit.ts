"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";

type ServerFieldMap = (fields: Record<string, string[]>) => { byField: Record<string, string>; rest: string[] };

/**
 * Submitting a sweep, the same for one reaction and several: post it, open it on success; on a
 * refusal mark the fields the server named and say the rest above the button. A message describes
 * the values then sent, so once any field changes (`valuesKey`) it is no longer shown.
 */
export function useSweepSubmit<V extends FieldValues>({
  projectId,
  valuesKey,
  mapFields,
  setError,
}: {
  projectId: string;
  valuesKey: string;
  mapFields: ServerFieldMap;
  setError: UseFormSetError<V>;
}) {
  const router = useRouter();
  const [formError, setFormError] = useState<string>();
  const [sentKey, setSentKey] = useState<string>();
  const shownError = formError !== undefined && sentKey === valuesKey ? formError : undefined;

  /** Sends `json`, unless `refused` says why the form cannot go as it stands. */
  const submit = async (json: unknown, refused?: string) => {
    setFormError(undefined);
    setSentKey(valuesKey);
    if (refused) return setFormError(refused);
    try {
      const res = await fetchJson<{ sweep: { id: string } }>(`/api/projects/${projectId}/sweeps`, { method: "POST", json });
      router.push(`/projects/${projectId}/sweeps/${res.sweep.id}`);
    } catch (e) {
      if (!(e instanceof ApiError)) return setFormError("Could not reach the server; nothing was submitted.");
      const { byField, rest } = mapFields(e.fields);
      for (const [p, message] of Object.entries(byField)) setError(p as Path<V>, { type: "server", message });
      setFormError([e.message, ...rest].filter((m, i, a) => a.indexOf(m) === i).join(" "));
    }
  };
  return { shownError, submit };
}
