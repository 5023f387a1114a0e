/**
 * The numbers a robustness run of several reactions may vary, as SI numbers: a chemistry written with
 * units ("0.004 1/s", "3.6 m^3/h", as a model may be stored) is converted field by field with the
 * engine's own unit reader, so a ± spread applies to the SI value and a drawn SI number replaces it.
 * A field the engine cannot read is left as written (the rating then names it). Pure.
 */
import { DIM, EngineError, toSI, type Quantity } from "@/lib/engine";

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj => (v && typeof v === "object" && !Array.isArray(v) ? (v as Obj) : {});

/** SI unit of a power-law rate constant of total order n: (m3/mol)^(n-1)/s (common practice). */
function rateConstantUnit(orders: unknown): string {
  const p = Object.values(obj(orders)).reduce<number>((s, n) => s + (typeof n === "number" ? n : 0), 0) - 1;
  return Math.abs(p) < 1e-12 ? "1/s" : `m^${3 * p} / (mol^${p} s)`;
}

function si(value: unknown, dimension: string, path: string): unknown {
  if (typeof value !== "string") return value;
  try {
    return toSI(value as Quantity, dimension, path);
  } catch (err) {
    if (err instanceof EngineError) return value;
    throw err;
  }
}

/** The chemistry with its feed flow and temperature and every power law's constants as SI numbers. */
export function siChemistry(chemistry: Obj): Obj {
  const feed = obj(chemistry.feed);
  const reactions = (Array.isArray(chemistry.reactions) ? chemistry.reactions : []).map((r, j) => {
    const rate = obj(obj(r).rate);
    if (rate.law !== "power") return r;
    const at = `reactions.${j}.rate`;
    const out: Obj = { ...rate, k: si(rate.k, rateConstantUnit(rate.orders), `${at}.k`) };
    if (rate.activationEnergy !== undefined) out.activationEnergy = si(rate.activationEnergy, DIM.energyPerMole, `${at}.activationEnergy`);
    if (rate.referenceTemperature !== undefined) out.referenceTemperature = si(rate.referenceTemperature, DIM.temperature, `${at}.referenceTemperature`);
    if (rate.reverse) {
      const rev = obj(rate.reverse);
      out.reverse = { ...rev, k: si(rev.k, rateConstantUnit(rev.orders), `${at}.reverse.k`) };
    }
    return { ...obj(r), rate: out };
  });
  return {
    ...chemistry,
    feed: {
      ...feed,
      volumetricFlow: si(feed.volumetricFlow, "m^3/s", "feed.volumetricFlow"),
      ...(feed.temperature !== undefined ? { temperature: si(feed.temperature, DIM.temperature, "feed.temperature") } : {}),
    },
    reactions,
  };
}
