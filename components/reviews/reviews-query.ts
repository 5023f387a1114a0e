/** One cache entry for the inbox page and the header's count, so approving updates both. */
export const REVIEWS_QUERY = ["reviews"] as const;

export interface ReviewsAnswer {
  count: number;
  reviews: {
    pinId: string;
    projectId: string;
    projectName: string;
    sweepName: string | null;
    sequence: ("CSTR" | "PFR")[];
    totalVolume: number | null;
    totalCost: number | null;
    note: string;
    pinnedByName: string;
    pinnedAt: string;
  }[];
}
