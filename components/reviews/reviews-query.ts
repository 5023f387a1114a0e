import type { ReviewItemView } from "@/lib/services/views";

/** One cache entry for the inbox page and the header's count, so approving updates both. */
export const REVIEWS_QUERY = ["reviews"] as const;

/** GET /api/reviews: the service's items as JSON carries them (dates as ISO text). */
export interface ReviewsAnswer {
  count: number;
  reviews: ReviewItemView[];
}
