import { ReviewInbox } from "@/components/reviews/review-inbox";
import { requirePageActor } from "@/lib/auth/session";
import { can } from "@/lib/authz/policy";

export const metadata = { title: "Reviews" };
export const dynamic = "force-dynamic";

export default async function ReviewsPage() {
  const actor = await requirePageActor();
  if (!can(actor, "pin.review")) {
    return (
      <div className="card p-6">
        <h1>Reviews</h1>
        <p className="mt-2 text-ink-soft">Managers review pinned designs; your role does not.</p>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <div>
        <h1>Waiting for your review</h1>
        <p className="mt-1 text-sm text-ink-soft">Designs pinned in {actor.teamName}&apos;s projects, oldest first. Approve or reject with a comment.</p>
      </div>
      <ReviewInbox />
    </div>
  );
}
