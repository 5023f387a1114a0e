"use client";

import Link from "next/link";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { ReviewForm } from "@/components/pins/pins-panel";
import { StageBadges } from "@/components/sweeps/stage-badges";
import { ErrorPanel, LoadingPanel } from "@/components/sweeps/loading-and-error-panels";
import { fetchJson } from "@/lib/client/fetch-json";
import { REVIEWS_QUERY, type ReviewsAnswer } from "./reviews-query";
import { formatDateTime } from "@/lib/format/dates";
import { PinSize } from "@/components/pins/pin-size";

/** Designs waiting for this manager's review across the team's projects, oldest first. */
export function ReviewInbox() {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: REVIEWS_QUERY, queryFn: () => fetchJson<ReviewsAnswer>("/api/reviews"), refetchOnWindowFocus: true });
  if (q.isPending) return <LoadingPanel label="Loading the designs waiting for review…" />;
  if (q.isError) return <ErrorPanel error={q.error} what="the review inbox" />;
  const { reviews } = q.data;
  if (reviews.length === 0) {
    return (
      <p className="card px-3 py-6 text-center text-ink-soft" data-testid="reviews-empty">
        No design is waiting for your review.
      </p>
    );
  }
  return (
    <ol className="space-y-3" data-testid="reviews-list">
      {reviews.map((r) => (
        <li key={r.pinId} className="card space-y-2 p-3" data-testid="review-item">
          <div className="flex flex-wrap items-center gap-2">
            <Link href={`/projects/${r.projectId}`} className="font-medium text-accent-700 underline">
              {r.projectName}
            </Link>
            <StageBadges sequence={r.sequence} />
            <PinSize totalVolume={r.totalVolume} totalCost={r.totalCost} />
          </div>
          <dl className="grid gap-x-4 gap-y-0.5 text-sm sm:grid-cols-[8rem_1fr]">
            <dt className="text-ink-soft">Pinned by</dt>
            <dd>
              {r.pinnedByName}, <span className="num">{formatDateTime(r.pinnedAt)}</span>
            </dd>
            {r.sweepName ? (
              <>
                <dt className="text-ink-soft">From sweep</dt>
                <dd>{r.sweepName}</dd>
              </>
            ) : null}
            <dt className="text-ink-soft">Note</dt>
            <dd>{r.note || "—"}</dd>
          </dl>
          <ReviewForm pinId={r.pinId} onDone={() => qc.invalidateQueries({ queryKey: REVIEWS_QUERY })} />
        </li>
      ))}
    </ol>
  );
}
