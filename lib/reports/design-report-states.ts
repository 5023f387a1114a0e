import type { PinnedDesign } from "@/db/schema";
import { PIN_STATE } from "@/lib/glossary";

export type PinState = PinnedDesign["state"];

/** The pin states' one names, from the glossary (the screens use the same). */
export const STATE_LABEL: Record<PinState, string> = {
  proposed: PIN_STATE.proposed.label,
  approved: PIN_STATE.approved.label,
  rejected: PIN_STATE.rejected.label,
  superseded: PIN_STATE.superseded.label,
};
