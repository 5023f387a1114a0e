import { deflateRawSync, inflateRawSync } from "node:zlib";

/*
 * How a candidate's stages are kept in the database: a few bytes instead of a JSON document.
 *
 * A one-reaction stage is nine fields, most of which repeat what another stage or the feed already
 * says (a stage's inlet conversion is the previous outlet; an isothermal train has one temperature;
 * a residence time is the volume over the feed's volumetric flow; a stage bought as one vessel is
 * that vessel). As JSON that was about 1,150 bytes a candidate; here it is about 17 bytes a stage.
 * The reading is exact: every number comes back bit for bit, and a stage list that does not fit
 * the compact form (several reactions, anything unusual) is kept as JSON, deflated when that is
 * smaller. Bytes are little-endian float64 / uint32.
 *
 *   byte 0   form: 0 JSON text, 1 compact, 2 deflated JSON text
 *   compact: [1][stage count][flags] [T if ONE_TEMPERATURE] [v0 if TAU_FROM_FLOW]
 *            then per stage: [type] [volume] [conversionOut] [conversionIn unless CHAINED]
 *            [temperatureIn temperatureOut unless ONE_TEMPERATURE] [residenceTime unless TAU_FROM_FLOW]
 *            [count sizeEach unless ONE_VESSEL_EACH] [cost (NaN for none) unless NO_COST]
 *            [recycleRatio, a tube with recycle only] [chosen-temperature mark if MARKS_CHOSEN: 0 none, 1 true, 2 false]
 */

const FORM_JSON = 0;
const FORM_COMPACT = 1;
const FORM_DEFLATED = 2;

const CHAINED = 1;
const ONE_TEMPERATURE = 2;
const TAU_FROM_FLOW = 4;
const ONE_VESSEL_EACH = 8;
const NO_COST = 16;
const MARKS_CHOSEN = 32;

/** Stage types by their code; a tube with recycle (code 2) also keeps its recycle ratio. */
const TYPES = ["CSTR", "PFR", "PFR-recycle"] as const;
const RECYCLE = 2;
const STAGE_KEYS = ["type", "conversionIn", "conversionOut", "temperatureIn", "temperatureOut", "volume", "residenceTime", "vessels", "cost"];
/** JSON shorter than this is not worth deflating. */
const DEFLATE_FROM = 160;

type Stage = Record<string, unknown>;

interface CompactStage {
  type: number;
  conversionIn: number;
  conversionOut: number;
  temperatureIn: number;
  temperatureOut: number;
  volume: number;
  residenceTime: number;
  count: number;
  sizeEach: number;
  cost: number | null;
  recycleRatio: number | null;
  /** The stage's `temperatureChosen` mark, when it has one. */
  chosen: boolean | null;
}

/** The stored bytes of a stage list. */
export function encodeStages(stages: readonly Stage[]): Buffer {
  const compact = stages.length ? compactStages(stages) : null;
  if (compact) return writeCompact(compact);
  const text = Buffer.from(JSON.stringify(stages), "utf8");
  if (text.length >= DEFLATE_FROM) {
    const packed = deflateRawSync(text);
    if (packed.length < text.length) return Buffer.concat([Buffer.of(FORM_DEFLATED), packed]);
  }
  return Buffer.concat([Buffer.of(FORM_JSON), text]);
}

/** The stage list stored as `encodeStages` wrote it. */
export function decodeStages(bytes: Uint8Array): Stage[] {
  const buf = Buffer.isBuffer(bytes) ? bytes : Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (buf.length === 0) throw new Error("stored stages: no bytes");
  switch (buf[0]) {
    case FORM_JSON:
      return JSON.parse(buf.toString("utf8", 1)) as Stage[];
    case FORM_DEFLATED:
      return JSON.parse(inflateRawSync(buf.subarray(1)).toString("utf8")) as Stage[];
    case FORM_COMPACT:
      return readCompact(buf);
    default:
      throw new Error(`stored stages: unknown form ${buf[0]}`);
  }
}

/** -0 is kept as 0, as JSON would. */
const plain = (x: number) => (x === 0 ? 0 : x);
const isFinite = (x: unknown): x is number => typeof x === "number" && Number.isFinite(x);

/** The stages as compact fields, or null when any does not have the one-reaction shape exactly. */
function compactStages(stages: readonly Stage[]): CompactStage[] | null {
  if (!Array.isArray(stages) || stages.length > 255) return null;
  const out: CompactStage[] = [];
  for (const s of stages) {
    if (typeof s !== "object" || s === null || Array.isArray(s)) return null;
    const type = TYPES.indexOf(s.type as (typeof TYPES)[number]);
    if (type < 0) return null;
    const recycle = type === RECYCLE;
    const marked = "temperatureChosen" in s;
    if (marked && typeof s.temperatureChosen !== "boolean") return null;
    if (Object.keys(s).length !== STAGE_KEYS.length + (recycle ? 1 : 0) + (marked ? 1 : 0) || !STAGE_KEYS.every((k) => k in s)) return null;
    if (recycle && !isFinite(s.recycleRatio)) return null;
    const nums = [s.conversionIn, s.conversionOut, s.temperatureIn, s.temperatureOut, s.volume, s.residenceTime];
    if (!nums.every(isFinite)) return null;
    const v = s.vessels as Record<string, unknown> | null;
    if (typeof v !== "object" || v === null || Array.isArray(v) || Object.keys(v).length !== 2) return null;
    if (!Number.isInteger(v.count) || (v.count as number) < 0 || (v.count as number) > 0xffffffff || !isFinite(v.sizeEach)) return null;
    if (s.cost !== null && !isFinite(s.cost)) return null;
    out.push({
      type,
      conversionIn: plain(s.conversionIn as number),
      conversionOut: plain(s.conversionOut as number),
      temperatureIn: plain(s.temperatureIn as number),
      temperatureOut: plain(s.temperatureOut as number),
      volume: plain(s.volume as number),
      residenceTime: plain(s.residenceTime as number),
      count: v.count as number,
      sizeEach: plain(v.sizeEach as number),
      cost: s.cost === null ? null : plain(s.cost as number),
      recycleRatio: recycle ? plain(s.recycleRatio as number) : null,
      chosen: marked ? (s.temperatureChosen as boolean) : null,
    });
  }
  return out;
}

/** A feed volumetric flow that gives every stage's residence time exactly, if one does. */
function flowOf(stages: readonly CompactStage[]): number | null {
  const first = stages.find((s) => s.residenceTime !== 0);
  if (!first) return null;
  const v0 = first.volume / first.residenceTime;
  if (!Number.isFinite(v0) || v0 === 0) return null;
  return stages.every((s) => s.volume / v0 === s.residenceTime) ? v0 : null;
}

function writeCompact(stages: CompactStage[]): Buffer {
  const chained = stages.every((s, k) => s.conversionIn === (k === 0 ? 0 : stages[k - 1].conversionOut));
  const t = stages.length ? stages[0].temperatureIn : 0;
  const oneTemperature = stages.every((s) => s.temperatureIn === t && s.temperatureOut === t);
  const v0 = flowOf(stages);
  const oneVesselEach = stages.every((s) => s.count === 1 && s.sizeEach === s.volume);
  const noCost = stages.every((s) => s.cost === null);
  const marksChosen = stages.some((s) => s.chosen !== null);
  const flags = (marksChosen ? MARKS_CHOSEN : 0) | (chained ? CHAINED : 0) | (oneTemperature ? ONE_TEMPERATURE : 0) | (v0 !== null ? TAU_FROM_FLOW : 0) | (oneVesselEach ? ONE_VESSEL_EACH : 0) | (noCost ? NO_COST : 0);

  const perStage = 17 + (chained ? 0 : 8) + (oneTemperature ? 0 : 16) + (v0 !== null ? 0 : 8) + (oneVesselEach ? 0 : 12) + (noCost ? 0 : 8);
  const recycles = stages.filter((s) => s.type === RECYCLE).length;
  const buf = Buffer.alloc(3 + (oneTemperature ? 8 : 0) + (v0 !== null ? 8 : 0) + perStage * stages.length + 8 * recycles + (marksChosen ? stages.length : 0));
  buf[0] = FORM_COMPACT;
  buf[1] = stages.length;
  buf[2] = flags;
  let at = 3;
  const f64 = (x: number) => {
    buf.writeDoubleLE(x, at);
    at += 8;
  };
  if (oneTemperature) f64(t);
  if (v0 !== null) f64(v0);
  for (const s of stages) {
    buf[at++] = s.type;
    f64(s.volume);
    f64(s.conversionOut);
    if (!chained) f64(s.conversionIn);
    if (!oneTemperature) {
      f64(s.temperatureIn);
      f64(s.temperatureOut);
    }
    if (v0 === null) f64(s.residenceTime);
    if (!oneVesselEach) {
      buf.writeUInt32LE(s.count, at);
      at += 4;
      f64(s.sizeEach);
    }
    if (!noCost) f64(s.cost ?? NaN);
    if (s.type === RECYCLE) f64(s.recycleRatio as number);
    if (marksChosen) buf[at++] = s.chosen === null ? 0 : s.chosen ? 1 : 2;
  }
  return buf;
}

function readCompact(buf: Buffer): Stage[] {
  const n = buf[1];
  const flags = buf[2];
  let at = 3;
  const f64 = () => {
    const x = buf.readDoubleLE(at);
    at += 8;
    return x;
  };
  const t = flags & ONE_TEMPERATURE ? f64() : 0;
  const v0 = flags & TAU_FROM_FLOW ? f64() : 0;
  const stages: Stage[] = [];
  let previousOut = 0;
  for (let k = 0; k < n; k++) {
    const type = TYPES[buf[at++]];
    if (type === undefined) throw new Error("stored stages: unknown stage type");
    const volume = f64();
    const conversionOut = f64();
    const conversionIn = flags & CHAINED ? previousOut : f64();
    const temperatureIn = flags & ONE_TEMPERATURE ? t : f64();
    const temperatureOut = flags & ONE_TEMPERATURE ? t : f64();
    const residenceTime = flags & TAU_FROM_FLOW ? plain(volume / v0) : f64();
    let vessels = { count: 1, sizeEach: volume };
    if (!(flags & ONE_VESSEL_EACH)) {
      const count = buf.readUInt32LE(at);
      at += 4;
      vessels = { count, sizeEach: f64() };
    }
    const c = flags & NO_COST ? NaN : f64();
    const stage: Stage = { type, conversionIn, conversionOut, temperatureIn, temperatureOut, volume, residenceTime, vessels, cost: Number.isNaN(c) ? null : c };
    if (type === "PFR-recycle") stage.recycleRatio = f64();
    if (flags & MARKS_CHOSEN) {
      const mark = buf[at++];
      if (mark) stage.temperatureChosen = mark === 1;
    }
    stages.push(stage);
    previousOut = conversionOut;
  }
  if (at !== buf.length) throw new Error("stored stages: length does not match");
  return stages;
}
