import { getDb } from "@/db/client";
import { requireActor } from "@/lib/auth/session";
import { json, route } from "@/lib/http";
import { listReviewInbox } from "@/lib/services/reviews";

/** The signed-in manager's review inbox; the header's count reads it too. */
export const GET = route(async () => {
  const actor = await requireActor();
  const reviews = await listReviewInbox(getDb(), actor);
  return json({ reviews, count: reviews.length });
});
