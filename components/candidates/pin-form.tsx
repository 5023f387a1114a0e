"use client";

import Link from "next/link";
import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { fetchJson } from "@/lib/client/fetch-json";
import { refusalText } from "@/components/sweeps/loading-and-error-panels";
import type { PinView } from "@/lib/services/views";
import { stageTypeName } from "@/lib/stage-types";

type ProjectPin = PinView;

/** One name per state, the same words as the project's pinned designs. */
const PIN_STATE: Record<"proposed" | "approved", string> = { proposed: "pending review", approved: "approved" };

/**
 * "Pin to project" with a note: proposes the train for the design basis, for a manager to review.
 * Once this candidate is the project's current pin the form gives way to what happened to it; when
 * another train is current, pinning this one replaces it, so we say so and ask first.
 */
export function PinForm({ candidateId, projectId, feasible, canPin }: { candidateId: string; projectId: string; feasible: boolean; canPin: boolean }) {
  const qc = useQueryClient();
  const [note, setNote] = useState("");
  const [asking, setAsking] = useState(false);
  const pinsQ = useQuery({
    queryKey: ["project-pins", projectId],
    queryFn: () => fetchJson<{ pins: ProjectPin[] }>(`/api/projects/${projectId}/pins`).then((r) => r.pins),
  });
  const projectQ = useQuery({
    queryKey: ["project", projectId],
    queryFn: () => fetchJson<{ project: { name: string } }>(`/api/projects/${projectId}`).then((r) => r.project),
  });
  const pin = useMutation({
    mutationFn: () => fetchJson<{ pin: { id: string } }>(`/api/candidates/${candidateId}/pin`, { method: "POST", json: { note } }),
    onSettled: () => {
      setAsking(false);
      return qc.invalidateQueries({ queryKey: ["project-pins", projectId] });
    },
  });
  if (!canPin) return <p className="text-sm text-ink-soft">Engineers, managers and admins pin trains to the project; your role reads them.</p>;
  if (pinsQ.isPending) return <p className="text-sm text-ink-soft">Checking the project&apos;s pinned designs…</p>;

  const current = (pinsQ.data ?? []).find((p) => p.state === "proposed" || p.state === "approved");
  const projectName = projectQ.data?.name ?? "the project";
  if (current && current.candidateId === candidateId) {
    return (
      <div role="status" className="rounded border border-accent-200 bg-accent-50 px-3 py-2 text-sm text-accent-800" data-testid="pin-done" data-state={current.state}>
        Pinned to {projectName} — {PIN_STATE[current.state as "proposed" | "approved"]}.{" "}
        <Link href={`/projects/${projectId}`} className="underline">
          Open the project
        </Link>
      </div>
    );
  }

  const currentTrain = current?.candidate.sequence?.map(stageTypeName).join(" → ") ?? "";
  return (
    <form
      className="space-y-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (current) setAsking(true);
        else pin.mutate();
      }}
    >
      <label htmlFor="pin-note" className="field-label">
        Note for the reviewer
      </label>
      <textarea id="pin-note" className="input min-h-20" maxLength={2000} value={note} onChange={(e) => setNote(e.target.value)} placeholder="Why this train, what to check" />
      {current ? (
        <p className="text-xs text-ink-soft" data-testid="pin-supersede-note">
          {projectName} already has {current.state === "proposed" ? "a design pending review" : "an approved design"} ({currentTrain}); pinning this train supersedes it.
        </p>
      ) : null}
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
      <ConfirmDialog
        open={asking}
        title="Supersede the current design?"
        confirmLabel="Pin and supersede"
        tone="primary"
        busy={pin.isPending}
        onConfirm={() => pin.mutate()}
        onCancel={() => setAsking(false)}
      >
        {current?.state === "proposed"
          ? `A ${currentTrain} design in ${projectName} is pending review. The new pin will supersede it, and the review will be of this train instead.`
          : `The approved ${currentTrain} design of ${projectName} will be superseded by this pin, which then waits for review.`}
      </ConfirmDialog>
    </form>
  );
}
