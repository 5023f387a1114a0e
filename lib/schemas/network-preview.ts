import { z } from "zod";
import { networkKineticsSpecSchema } from "./network-spec";
import { keyText } from "./text";

/**
 * The live charts of a draft model of several reactions: its chemistry as a version would store it,
 * and optionally the wanted product to draw (else the chemistry's own `product`). A body whose `spec`
 * has `reaction` instead of `reactions` is today's one-reaction preview (kineticsPreviewSchema).
 */
export const networkPreviewSchema = z
  .strictObject({
    spec: networkKineticsSpecSchema,
    product: keyText().min(1, "choose a species").max(40, "Use at most 40 characters").optional(),
  })
  .superRefine((body, ctx) => {
    const product = body.product;
    if (product === undefined) return;
    if (!(product in body.spec.feed.concentrations)) ctx.addIssue({ code: "custom", path: ["product"], message: `${product} is not one of the feed's species` });
    else if (product === body.spec.keyReactant) ctx.addIssue({ code: "custom", path: ["product"], message: `${product} is the key reactant; the wanted product must be another species` });
  });
export type NetworkPreviewRequest = z.output<typeof networkPreviewSchema>;
