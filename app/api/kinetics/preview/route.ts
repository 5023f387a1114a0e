import { assertCan } from "@/lib/authz/policy";
import { json, readJsonOfKind } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { isNetworkSpec } from "@/lib/schemas/network-spec";
import { networkPreviewSchema, type NetworkPreviewRequest } from "@/lib/schemas/network-preview";
import { isNetworkKineticsBody, kineticsPreviewSchema } from "@/lib/schemas/sweeps";
import { previewKinetics } from "@/lib/services/kinetics-checks";
import { previewNetwork } from "@/lib/services/network-preview";

const severalReactions = (body: { spec: unknown }): body is NetworkPreviewRequest => isNetworkSpec(body.spec);

/**
 * The live charts' data for a draft kinetics spec, computed at once (no queue, nothing stored): the
 * Levenspiel curve of one reaction, or the concentration paths of several (picked by the spec's shape).
 */
export const POST = signedInRoute(async ({ req, actor }) => {
  assertCan(actor, "kinetics.read");
  const body = await readJsonOfKind(req, isNetworkKineticsBody, networkPreviewSchema, kineticsPreviewSchema);
  if (severalReactions(body)) return json(previewNetwork(body));
  return json({ preview: previewKinetics(body.spec, body.targetConversion) });
});
