/**
 * The product's one name for each state, with a short help line (docs/glossary.md explains them).
 * Every screen, the report and the PDF take state words from here, so one state reads the same
 * on the project list, the sweep page and the report.
 */
import type { PinnedDesign, RobustnessRun, SweepStatus } from "@/db/schema";

export interface GlossaryEntry {
  label: string;
  help: string;
}

export const SWEEP_STATUS = {
  queued: { label: "Queued", help: "Waiting for a worker to start its scenarios." },
  running: { label: "Running", help: "Scenarios are being sized; the ranked table fills in as they finish." },
  succeeded: { label: "Finished", help: "Every scenario has been sized (some may have no feasible train)." },
  failed: { label: "Failed", help: "The sweep stopped on an error; nothing after it was sized." },
  cancelled: { label: "Cancelled", help: "Stopped by a person before every scenario was sized." },
} as const satisfies Record<SweepStatus, GlossaryEntry>;

export const PIN_STATE = {
  proposed: { label: "Pending review", help: "Pinned by an engineer and waiting for a manager's decision." },
  approved: { label: "Approved", help: "Accepted by a manager into the project's design basis." },
  rejected: { label: "Rejected", help: "Turned down by a manager, with the reason in the review comment." },
  superseded: { label: "Superseded", help: "Replaced by a later pin of the same project." },
} as const satisfies Record<PinnedDesign["state"], GlossaryEntry>;

export const ROBUSTNESS_RUN_STATUS = {
  queued: { label: "Queued", help: "Waiting for a worker to draw the samples." },
  running: { label: "Running", help: "Samples are being rated." },
  succeeded: { label: "Finished", help: "Every sample has been rated; the spread of outlet conversion is shown." },
  failed: { label: "Failed", help: "The run stopped on an error." },
} as const satisfies Record<RobustnessRun["status"], GlossaryEntry>;

/** The label of a state, or the state itself (capitalised) when it is not in the glossary. */
export function stateLabel(table: Record<string, GlossaryEntry>, state: string): string {
  return table[state]?.label ?? state.charAt(0).toUpperCase() + state.slice(1);
}
