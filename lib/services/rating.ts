import { and, eq, inArray } from "drizzle-orm";
import type { Database } from "@/db/client";
import { inventoryVessels } from "@/db/schema";
import { assertCan, type Actor } from "@/lib/authz/policy";
import { EngineError, rateTrain, type RatingSpec, type StageType } from "@/lib/engine";
import { stageTypeCautions } from "@/lib/stage-types";
import { AppError } from "@/lib/errors";
import { largestFeed } from "@/lib/rating/largest-feed";
import type { RateRequest } from "@/lib/schemas/costs";
import type { KineticsSpec } from "@/lib/schemas/sweeps";
import { toBadRequest } from "./engine-errors";
import { requireTeamKineticsVersion, requireTeamProject } from "./kinetics";

const WHY_FEED_LOWERS_CONVERSION =
  "At a fixed feed concentration, a larger feed of A means a larger volumetric flow v0 = FA0/CA0, so every stage's space time τ = V/v0 is shorter and the conversion falls.";

/** Rates a fixed train of a project's kinetics version: the conversion it reaches, and the largest feed that still meets the target. */
export async function rateFixedTrain(db: Database, actor: Actor, projectId: string, input: RateRequest) {
  const project = await requireTeamProject(db, actor, projectId);
  assertCan(actor, "train.rate", project, "project");
  const kv = await requireTeamKineticsVersion(db, actor, input.kineticsVersionId);
  if (!kv || kv.model.projectId !== projectId) {
    throw new AppError("not_found", "No such kinetics version in this project", { fields: { kineticsVersionId: ["No such kinetics version in this project"] } });
  }
  const ids = input.stages.flatMap((s) => ("inventoryVesselId" in s ? [s.inventoryVesselId] : []));
  const vessels = ids.length
    ? await db.select().from(inventoryVessels).where(and(eq(inventoryVessels.teamId, actor.teamId), inArray(inventoryVessels.id, ids)))
    : [];
  const byId = new Map(vessels.map((v) => [v.id, v]));
  const stages = input.stages.map((s, i) => {
    if (!("inventoryVesselId" in s)) return { type: s.type, volume: s.volume, recycleRatio: s.recycleRatio, tag: null as string | null };
    const v = byId.get(s.inventoryVesselId);
    if (!v) throw new AppError("bad_request", "No such vessel in the team's inventory", { fields: { [`stages.${i}.inventoryVesselId`]: ["No such vessel in the inventory"] } });
    return { type: v.type as StageType, volume: v.volume as number | string, recycleRatio: undefined, tag: v.tag };
  });
  const chemistry = kv.version.spec as unknown as KineticsSpec;
  const spec: RatingSpec = { feed: chemistry.feed, reaction: chemistry.reaction, stages: stages.map(({ type, volume, recycleRatio }) => ({ type, volume, ...(recycleRatio !== undefined ? { recycleRatio } : {}) })) };
  try {
    const rating = rateTrain(spec);
    const feed = largestFeed(spec, input.target);
    // The engine's rating carries the general cautions; a tube with recycle adds its own (pump and line not included).
    const cautions = [...rating.cautions, ...stageTypeCautions(stages.map((s) => s.type))];
    const several = rating.stages.filter((s) => s.multiple);
    if (several.length) {
      // A tube with recycle, like a stirred tank, can have several steady states (adiabatic, with back-mixing through the recycle).
      const which = several.every((s) => s.type === "CSTR") ? "A stirred tank" : several.every((s) => s.type === "PFR-recycle") ? "A tube with recycle" : "A stage";
      cautions.unshift(`${which} of this train has more than one steady state; the figures follow the lowest one (a cold start). Start-up and control decide which one the plant runs at.`);
    }
    return {
      kineticsVersion: { id: kv.version.id, version: kv.version.version, modelName: kv.model.name },
      stages: rating.stages.map((s, i) => ({ ...s, tag: stages[i].tag })),
      conversionOut: rating.conversionOut,
      target: input.target,
      meetsTarget: rating.conversionOut >= input.target,
      largestFeed: { ...feed, why: WHY_FEED_LOWERS_CONVERSION },
      cautions,
    };
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    throw toBadRequest(err);
  }
}
