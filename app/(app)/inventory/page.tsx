import { InventoryScreen } from "@/components/inventory/inventory-screen";
import { requirePageActor } from "@/lib/auth/session";

export const dynamic = "force-dynamic";
export const metadata = { title: "Inventory" };

export default async function InventoryPage() {
  const actor = await requirePageActor();
  return (
    <div className="space-y-4">
      <div>
        <h1>Inventory</h1>
        <p className="text-ink-soft">Idle vessels {actor.teamName} already owns. A sweep can reuse the available ones instead of buying new.</p>
      </div>
      <InventoryScreen />
    </div>
  );
}
