import { z } from "zod";
import { assertCan } from "@/lib/authz/policy";
import { json, parseWith, readJson } from "@/lib/http";
import { signedInRoute } from "@/lib/http/signed-in-route";
import { isNetworkSpec } from "@/lib/schemas/network-spec";
import { networkPreviewSchema } from "@/lib/schemas/network-preview";
import { kineticsPreviewSchema } from "@/lib/schemas/sweeps";
import { previewKinetics } from "@/lib/services/kinetics-checks";
import { previewNetwork } from "@/lib/services/network-preview";

/**
 * The live charts' data for a draft kinetics spec, computed at once (no queue, nothing stored): the
 * Levenspiel curve of one reaction, or the concentration paths of several (picked by the spec's shape).
 */
export const POST = signedInRoute(async ({ req, actor }) => {
  assertCan(actor, "kinetics.read");
  const body = await readJson(req, z.unknown());
  const spec = typeof body === "object" && body !== null ? (body as { spec?: unknown }).spec : undefined;
  if (isNetworkSpec(spec)) return json(previewNetwork(parseWith(networkPreviewSchema, body)));
  const { spec: single, targetConversion } = parseWith(kineticsPreviewSchema, body);
  return json({ preview: previewKinetics(single, targetConversion) });
});
