"use client";

import Link from "next/link";
import { useState } from "react";
import { useMutation } from "@tanstack/react-query";
import { fetchJson } from "@/lib/client/fetch-json";
import { refusalText } from "@/components/sweeps/states";

/** "Pin to project" with a note: proposes the train for the design basis, for a manager to review. */
export function PinForm({ candidateId, projectId, feasible, canPin }: { candidateId: string; projectId: string; feasible: boolean; canPin: boolean }) {
  const [note, setNote] = useState("");
  const pin = useMutation({ mutationFn: () => fetchJson<{ pin: { id: string } }>(`/api/candidates/${candidateId}/pin`, { method: "POST", json: { note } }) });
  if (!canPin) return <p className="text-sm text-ink-soft">Engineers, managers and admins pin trains to the project; your role reads them.</p>;
  if (pin.isSuccess)
    return (
      <div role="status" className="rounded border border-accent-200 bg-accent-50 px-3 py-2 text-sm text-accent-800" data-testid="pin-done">
        Pinned to the project; it awaits a manager&apos;s review.{" "}
        <Link href={`/projects/${projectId}`} className="underline">
          Open the project
        </Link>
      </div>
    );
  return (
    <form
      className="space-y-2"
      onSubmit={(e) => {
        e.preventDefault();
        pin.mutate();
      }}
    >
      <label htmlFor="pin-note" className="field-label">
        Note for the reviewer
      </label>
      <textarea id="pin-note" className="input min-h-20" maxLength={2000} value={note} onChange={(e) => setNote(e.target.value)} placeholder="Why this train, what to check" />
      <div className="flex items-center gap-3">
        <button type="submit" className="btn-primary" disabled={pin.isPending || !feasible} data-testid="pin-button">
          {pin.isPending ? "Pinning…" : "Pin to project"}
        </button>
        {!feasible ? <span className="text-xs text-ink-soft">An infeasible train cannot be pinned.</span> : null}
      </div>
      {pin.isError ? (
        <p role="alert" className="field-error">
          {refusalText(pin.error, "pin this train", "Pinning needs the engineer, manager or admin role.")}
        </p>
      ) : null}
    </form>
  );
}
