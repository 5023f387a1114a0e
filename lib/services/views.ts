/**
 * What the JSON API and the server pages hand to the screens, derived from the services that
 * produce it: a field added, renamed or retyped in a service shows up in every screen that reads
 * it at compile time, instead of in a hand-written copy that drifts. Types only (components take
 * them with `import type`), so nothing of the server reaches the browser.
 */
import type { listAuditEntries } from "./audit";
import type { compareCandidates, listCandidates } from "./candidates";
import type { getCandidate } from "./candidate-detail";
import type { CostBasisView } from "./costs";
import type { listDatasets } from "./datasets";
import type { listInventory } from "./inventory";
import type { listMembers, listOpenInvitations } from "./members";
import type { listPins } from "./pins";
import type { ProjectView } from "./projects";
import type { rateFixedTrain } from "./rating";
import type { listReviewInbox } from "./reviews";
import type { getRun, listCandidateRuns } from "./robustness";
import type { getSweep, listScenarios, listSweeps } from "./sweeps";

/**
 * A value after JSON.stringify and JSON.parse: dates become their ISO strings, objects and arrays
 * (tuples kept) are walked; an optional field stays optional (JSON leaves undefined out).
 */
export type Jsonify<T> = T extends Date
  ? string
  : T extends string | number | boolean | null | undefined
    ? T
    : T extends { toJSON(): infer J }
      ? Jsonify<J>
      : T extends object
        ? { [K in keyof T]: Jsonify<T[K]> }
        : T;

/** What a service resolves to, as the screen reads it from the API. */
type Answer<F extends (...args: never[]) => Promise<unknown>> = Jsonify<Awaited<ReturnType<F>>>;

export type SweepView = Answer<typeof getSweep>;
export type SweepListItem = Answer<typeof listSweeps>[number];
export type ScenarioRow = Answer<typeof listScenarios>[number];
export type CandidatePage = Answer<typeof listCandidates>;
export type CandidateRow = CandidatePage["items"][number];
/** One candidate of the candidate view and of the comparison, with its scenario, sweep and plot data; `kind` tells the two apart. */
export type CandidateDetail = Answer<typeof compareCandidates>[number];
/** A candidate of a model of one reaction (stages with conversions and Levenspiel plot data). */
export type SingleCandidateDetail = Extract<CandidateDetail, { kind: "single" }>;
/** A candidate of a model of several reactions (stages with outlet compositions). */
export type NetworkCandidateDetail = Extract<CandidateDetail, { kind: "network" }>;
/** GET /api/candidates/{id}: a network candidate also carries its chemistry, profiles and paths. */
export type CandidateAnswer = Answer<typeof getCandidate>;
export type NetworkCandidateAnswer = Extract<CandidateAnswer, { kind: "network" }>;

export type RobustnessList = Answer<typeof listCandidateRuns>;
export type RobustnessRunView = Answer<typeof getRun>;
export type OfferedField = RobustnessList["fields"][number];

/** A pinned design of the project list, with the frozen candidate it keeps. */
export type PinView = Answer<typeof listPins>[number];

export type RatingAnswer = Answer<typeof rateFixedTrain>;
export type CostBasisAnswer = Jsonify<CostBasisView>;
export type InventoryList = Answer<typeof listInventory>;
export type InventoryVesselView = InventoryList["vessels"][number];

export type ReviewItemView = Answer<typeof listReviewInbox>[number];
export type MemberView = Answer<typeof listMembers>[number];
export type OpenInvitationView = Answer<typeof listOpenInvitations>[number];

export type ProjectListItem = Jsonify<ProjectView>;
export type DatasetListItem = Answer<typeof listDatasets>[number];
export type AuditEntryView = Answer<typeof listAuditEntries>[number];
