import { Suspense } from "react";
import { CompareView } from "@/components/compare/compare-view";
import { requirePageActor } from "@/lib/auth/session";

export const dynamic = "force-dynamic";

export default async function ComparePage() {
  await requirePageActor();
  return (
    <Suspense>
      <CompareView />
    </Suspense>
  );
}
