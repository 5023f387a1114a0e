import { z } from "zod";
import { DISPLAY_PREFERENCES } from "@/lib/units/display-preference";

/** Body of PUT /api/me/display-units: one of the offered unit sets. */
export const displayUnitsSchema = z
  .object({
    displayUnits: z.enum(DISPLAY_PREFERENCES, { error: "Show results in: choose one of the offered unit sets" }),
  })
  .strict();
