import { requireActor } from "@/lib/auth/session";
import { assertCan } from "@/lib/authz/policy";
import { json, readJson, route } from "@/lib/http";
import { kineticsPreviewSchema } from "@/lib/schemas/sweeps";
import { previewKinetics } from "@/lib/services/kinetics-checks";

/** The live chart's data for a draft kinetics spec, computed at once (no queue, nothing stored). */
export const POST = route(async (req) => {
  const actor = await requireActor();
  assertCan(actor, "kinetics.read");
  const { spec, targetConversion } = await readJson(req, kineticsPreviewSchema);
  return json({ preview: previewKinetics(spec, targetConversion) });
});
