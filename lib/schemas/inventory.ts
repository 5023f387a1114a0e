import { z } from "zod";
import { multilineText, text } from "./text";
import { STAGE_TYPES } from "@/lib/stage-types";

const finite = z.number({ error: "Must be a number" }).finite("Must be finite");

const fields = {
  tag: text({ error: "Tag is required" }).trim().min(1, "Tag is required").max(60, "Use at most 60 characters"),
  type: z.enum(STAGE_TYPES, { error: "Choose CSTR or PFR" }),
  volume: finite.gt(0, "Volume must be above 0").max(1e4, "Volume must be at most 10,000 m3"),
  available: z.boolean({ error: "Choose available or not" }),
  reuseCost: finite.min(0, "Reuse cost must be 0 or more"),
  location: text().trim().max(120, "Use at most 120 characters"),
  note: multilineText().trim().max(2000, "Use at most 2000 characters"),
};

/** An idle vessel as the API takes it: volume in m3, reuse cost in the team's money. */
export const inventoryVesselSchema = z.strictObject({
  ...fields,
  available: fields.available.default(true),
  reuseCost: fields.reuseCost.default(0),
  location: fields.location.default(""),
  note: fields.note.default(""),
});
export type InventoryVesselInput = z.infer<typeof inventoryVesselSchema>;

/** A change to a vessel: only the fields given change. */
export const inventoryVesselUpdateSchema = z
  .strictObject({
    tag: fields.tag.optional(),
    type: fields.type.optional(),
    volume: fields.volume.optional(),
    available: fields.available.optional(),
    reuseCost: fields.reuseCost.optional(),
    location: fields.location.optional(),
    note: fields.note.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: "Change at least one field" });
export type InventoryVesselUpdate = z.infer<typeof inventoryVesselUpdateSchema>;
