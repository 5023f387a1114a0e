"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Cautions } from "@/components/cautions/cautions";
import { thermalWarnings } from "@/lib/engine";
import { RobustnessPanel } from "@/components/robustness/robustness-panel";
import { StageBadges } from "@/components/sweeps/stage-badges";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { PIN_STATE } from "@/lib/glossary";
import { reviewSchema } from "@/lib/schemas/sweeps";
import { formatDateTime } from "@/lib/format/dates";
import { PinSize } from "./pin-size";
import type { PinnedDesign } from "@/db/schema";
import type { TrainStageType } from "@/lib/engine";

export interface PinRow {
  id: string;
  state: PinnedDesign["state"];
  note: string;
  pinnedAt: string;
  pinnedByName: string;
  reviewerName: string | null;
  reviewComment: string | null;
  reviewedAt: string | null;
  kinetics: { label: string; href: string | null };
  sweep: { id: string; name: string } | null;
  sequence: TrainStageType[];
  totalVolume: number | null;
  totalCost: number | null;
  stageTemperatures: number[];
  spec: Record<string, unknown>;
  canReview: boolean;
  /** The printable report page of this pin. */
  reportHref?: string;
}

const STATE: Record<PinRow["state"], { text: string; glyph: string; tone: string }> = {
  proposed: { text: PIN_STATE.proposed.label, glyph: "◷", tone: "border-amber-400 bg-amber-50 text-amber-900" },
  approved: { text: PIN_STATE.approved.label, glyph: "✓", tone: "border-accent-600 bg-accent-50 text-accent-800" },
  rejected: { text: PIN_STATE.rejected.label, glyph: "✕", tone: "border-red-300 bg-red-50 text-red-800" },
  superseded: { text: PIN_STATE.superseded.label, glyph: "↷", tone: "border-line bg-paper text-ink-soft" },
};

export function PinsPanel({ pins, viewerOnly }: { pins: PinRow[]; viewerOnly: boolean }) {
  const current = pins.find((p) => p.state === "proposed" || p.state === "approved");
  return (
    <section className="card overflow-hidden" aria-labelledby="pins-title">
      <div className="border-b border-line px-3 py-2">
        <h2 id="pins-title">Pinned designs</h2>
        <p className="text-xs text-ink-soft">{viewerOnly ? "Approved designs of this project." : "The history of designs pinned for the design basis, newest first."}</p>
      </div>
      {pins.length === 0 ? (
        <p className="px-3 py-6 text-center text-ink-soft">
          {viewerOnly ? "No approved design yet." : "Nothing pinned yet: open a candidate on a sweep page and pin it with a note."}
        </p>
      ) : (
        <ol className="divide-y divide-line" data-testid="pins-list">
          {pins.map((p) => (
            <PinItem key={p.id} pin={p} isCurrent={p.id === current?.id} canRun={!viewerOnly} />
          ))}
        </ol>
      )}
    </section>
  );
}

function PinItem({ pin, isCurrent, canRun }: { pin: PinRow; isCurrent: boolean; canRun: boolean }) {
  const s = STATE[pin.state];
  const [showSpec, setShowSpec] = useState(false);
  const [showRobustness, setShowRobustness] = useState(false);
  const reaction = pin.spec.reaction as { thermal?: { mode: string; adiabaticRise?: unknown; maxTemperature?: unknown } } | undefined;
  return (
    <li className="space-y-2 px-3 py-3" data-testid="pin" data-state={pin.state}>
      <div className="flex flex-wrap items-center gap-2">
        <span className={`badge ${s.tone}`} data-testid="pin-state">
          <span aria-hidden="true">{s.glyph} </span>
          {s.text}
        </span>
        {isCurrent ? <span className="badge border-ink bg-ink text-white">current</span> : null}
        <StageBadges sequence={pin.sequence} />
        <PinSize totalVolume={pin.totalVolume} totalCost={pin.totalCost} />
        {pin.reportHref ? (
          <span className="ml-auto flex gap-2">
            <a href={pin.reportHref} className="btn-quiet py-0.5 text-xs" data-testid="pin-report">
              Report
            </a>
            <a href={`/api/pins/${pin.id}/report.pdf`} download className="btn-quiet py-0.5 text-xs" data-testid="pin-pdf">
              PDF
            </a>
          </span>
        ) : null}
      </div>
      <dl className="grid gap-x-4 gap-y-0.5 text-sm sm:grid-cols-[8rem_1fr]">
        <dt className="text-ink-soft">Pinned by</dt>
        <dd>
          {pin.pinnedByName}, <span className="num">{formatDateTime(pin.pinnedAt)}</span>
        </dd>
        <dt className="text-ink-soft">Note</dt>
        <dd>{pin.note || "—"}</dd>
        <dt className="text-ink-soft">From</dt>
        <dd>
          {pin.kinetics.href ? (
            <a href={pin.kinetics.href} className="text-accent-700 underline">
              {pin.kinetics.label}
            </a>
          ) : (
            pin.kinetics.label
          )}
          {pin.sweep ? <> · sweep {pin.sweep.name}</> : null}{" "}
          <button type="button" className="ml-1 text-xs text-accent-700 underline" aria-expanded={showSpec} onClick={() => setShowSpec((x) => !x)}>
            {showSpec ? "Hide the inputs as computed" : "Show the inputs as computed"}
          </button>{" "}
          <button type="button" className="ml-1 text-xs text-accent-700 underline" aria-expanded={showRobustness} onClick={() => setShowRobustness((x) => !x)}>
            {showRobustness ? "Hide robustness" : "Robustness"}
          </button>
        </dd>
        {pin.reviewerName ? (
          <>
            <dt className="text-ink-soft">Reviewed by</dt>
            <dd>
              {pin.reviewerName}
              {pin.reviewedAt ? <span className="num">, {formatDateTime(pin.reviewedAt)}</span> : null}: “{pin.reviewComment}”
            </dd>
          </>
        ) : null}
      </dl>
      {showRobustness ? (
        <section className="rounded border border-line p-3" aria-label="Robustness of this pinned design">
          <RobustnessPanel base={`/api/pins/${pin.id}`} canRun={canRun} />
        </section>
      ) : null}
      {showSpec ? <pre className="max-h-64 overflow-auto rounded bg-paper p-2 text-xs">{JSON.stringify(pin.spec, null, 2)}</pre> : null}
      <Cautions compact warningsOnly warnings={thermalWarnings({ thermal: reaction?.thermal, stageTemperatures: pin.stageTemperatures })} />
      {pin.canReview && pin.state === "proposed" ? <ReviewForm pinId={pin.id} /> : null}
    </li>
  );
}

/** Approve or send back one proposed design; onDone lets a list other than the project page refresh itself. */
export function ReviewForm({ pinId, onDone }: { pinId: string; onDone?: () => unknown }) {
  const router = useRouter();
  const [comment, setComment] = useState("");
  const [error, setError] = useState<string>();
  const [busy, setBusy] = useState(false);
  const id = `review-${pinId}`;
  async function decide(decision: "approve" | "reject") {
    const parsed = reviewSchema.safeParse({ decision, comment });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    setBusy(true);
    setError(undefined);
    try {
      await fetchJson(`/api/pins/${pinId}/review`, { method: "POST", json: parsed.data });
      await onDone?.();
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? (e.fields.comment?.join(" ") ?? e.message) : "Could not reach the server; nothing was recorded.");
    } finally {
      setBusy(false);
    }
  }
  return (
    <form className="rounded border border-line bg-paper p-2" aria-label="Review this design" onSubmit={(e) => e.preventDefault()}>
      <label htmlFor={id} className="field-label">
        Review comment
      </label>
      <textarea id={id} rows={2} className="input" value={comment} aria-invalid={!!error} aria-describedby={error ? `${id}-error` : undefined} onChange={(e) => setComment(e.target.value)} />
      {error ? (
        <p id={`${id}-error`} className="field-error" role="alert">
          {error}
        </p>
      ) : null}
      <div className="mt-2 flex gap-2">
        <button type="button" className="btn-primary py-1" disabled={busy} onClick={() => decide("approve")}>
          ✓ Approve
        </button>
        <button type="button" className="btn-danger py-1" disabled={busy} onClick={() => decide("reject")}>
          ✕ Reject
        </button>
      </div>
    </form>
  );
}
