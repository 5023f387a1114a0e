import { json } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { listReviewInbox } from "@/lib/services/reviews";

/** The signed-in manager's review inbox; the header's count reads it too. */
export const GET = signedInRoute(async ({ actor, db }) => {
  const reviews = await listReviewInbox(db, actor);
  return json({ reviews, count: reviews.length });
});
