import { getDb } from "@/db/client";
import { DisplayUnitsForm } from "@/components/settings/display-units-form";
import { requirePageActor } from "@/lib/auth/session";
import { getDisplayPreference } from "@/lib/services/display-units";

export const metadata = { title: "Settings" };

export default async function SettingsPage() {
  const actor = await requirePageActor();
  const current = await getDisplayPreference(getDb(), actor.userId);
  return (
    <div className="max-w-2xl space-y-4">
      <h1>Your settings</h1>
      <DisplayUnitsForm current={current} />
    </div>
  );
}
