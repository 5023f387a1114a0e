import { z } from "zod";
import { text } from "./text";

/**
 * The unit the engineer picked for each field, by the field's place in the model ("feed.flowA" →
 * "kmol/h"; a rate constant's "mol/L|h" is its concentration and time basis; "reactions.0.rate.k" in a
 * model of several reactions). The numbers stay SI; this only lets the model reopen in the units it was
 * typed in. Older models have none.
 */
export const shownUnitsSchema = z.record(
  text().max(80, "Use at most 80 characters").regex(/^[A-Za-z_]\w*(\.\w+)+$/, "Each shown unit belongs to a field of the model, e.g. feed.flowA"),
  text().min(1, "Name the unit").max(40, "Use at most 40 characters"),
);
