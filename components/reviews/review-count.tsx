"use client";

import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/lib/client/fetch-json";
import { REVIEWS_QUERY, type ReviewsAnswer } from "./reviews-query";

/** The header's "Reviews" link with how many designs wait; refreshed on focus and every minute. */
export function ReviewCount({ active }: { active: boolean }) {
  const q = useQuery({ queryKey: REVIEWS_QUERY, queryFn: () => fetchJson<ReviewsAnswer>("/api/reviews"), refetchOnWindowFocus: true, refetchInterval: 60_000 });
  const count = q.data?.count;
  return (
    <Link href="/reviews" className={active ? "font-medium text-accent-700" : "text-ink-soft hover:text-ink"} aria-label={count === undefined ? "Reviews" : `Reviews, ${count} waiting`}>
      Reviews{" "}
      {count !== undefined ? (
        <span className={`badge ml-0.5 py-0 ${count ? "border-amber-400 bg-amber-50 text-amber-900" : "border-line"}`} data-testid="review-count">
          {count}
        </span>
      ) : null}
    </Link>
  );
}
