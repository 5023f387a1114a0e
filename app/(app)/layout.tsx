import { AppHeader } from "@/components/layout/app-header";
import { DisplayUnitsProvider } from "@/components/layout/display-units-context";
import { getDb } from "@/db/client";
import { requirePageActor } from "@/lib/auth/session";
import { listTeamsOfUser } from "@/lib/authz/actor";
import { getDisplayPreference } from "@/lib/services/display-units";

export const dynamic = "force-dynamic";

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor();
  const teams = await listTeamsOfUser(getDb(), actor.userId);
  const displayUnits = await getDisplayPreference(getDb(), actor.userId);
  return (
    <>
      <AppHeader
        userName={actor.name ?? actor.email}
        userEmail={actor.email}
        teamId={actor.teamId}
        teamName={actor.teamName}
        role={actor.role}
        teams={teams}
      />
      <main id="main-content" tabIndex={-1} className="mx-auto max-w-6xl px-4 py-6">
        <DisplayUnitsProvider preference={displayUnits}>{children}</DisplayUnitsProvider>
      </main>
    </>
  );
}
