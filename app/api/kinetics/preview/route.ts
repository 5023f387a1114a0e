import { assertCan } from "@/lib/authz/policy";
import { json, readJson } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { kineticsPreviewSchema } from "@/lib/schemas/sweeps";
import { previewKinetics } from "@/lib/services/kinetics-checks";

/** The live chart's data for a draft kinetics spec, computed at once (no queue, nothing stored). */
export const POST = signedInRoute(async ({ req, actor }) => {
  assertCan(actor, "kinetics.read");
  const { spec, targetConversion } = await readJson(req, kineticsPreviewSchema);
  return json({ preview: previewKinetics(spec, targetConversion) });
});
