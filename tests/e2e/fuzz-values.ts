import { uniformFloat64 } from "pure-rand/distribution/uniformFloat64";
import { xoroshiro128plus } from "pure-rand/generator/xoroshiro128plus";

/** A JSON Schema node as the OpenAPI document gives it (zod's toJSONSchema output). */
export interface JsonSchema {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  additionalProperties?: boolean | JsonSchema;
  items?: JsonSchema;
  minItems?: number;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  enum?: unknown[];
  const?: unknown;
  format?: string;
  pattern?: string;
  minLength?: number;
  maxLength?: number;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  default?: unknown;
}

/** Path ids that are not ids: bad percent-encoding, NUL, overlong UTF-8, traversal, huge. */
export const MALFORMED_IDS = [
  "%FF%FE",
  "%ED%A0%80",
  "%00",
  "%C0%AF",
  "%E0%80%80",
  "%F4%90%80%80",
  "%",
  "%zz",
  "abc%",
  "%2e%2e%2F%2e%2e",
  "..%2F..%2Fetc",
  "%0A%0D",
  "%F0%9F%A7%AA",
  "%E5%8F%8D",
  "null",
  "-1",
  "1e3",
  "00000000-0000-0000-0000-00000000000%00",
  "x".repeat(3000),
];

/** Strings no stored text may hold (or too long for any field). */
export const NASTY_STRINGS = [
  "\u0000",
  "Reactor\u0000train",
  "\u0000\u0000\u0000",
  "\uD800",
  "\uDFFF",
  "high \uD83D alone",
  "low \uDE00 alone",
  "\uDE00\uD83D",
  "bell\u0007",
  "esc\u001B[31m",
  "\u0001\u0002\u0003",
  "a".repeat(100_000),
  "\u0000".repeat(5000),
];

/** Values of the wrong type for any field. */
const WRONG_TYPES: (() => unknown)[] = [
  () => null,
  () => true,
  () => [],
  () => ({}),
  () => [1, "two", null],
  () => ({ "\u0000": "\uD800" }),
  () => 1e308,
  () => -1e308,
  () => deepArray(2000),
  () => deepObject(2000),
];

/** Whole bodies that are not the JSON a handler expects. */
export const RAW_BODIES: (string | Uint8Array<ArrayBuffer>)[] = [
  "",
  "{",
  '{"name":',
  "nul\u0000l",
  "[]",
  "null",
  "42",
  '"text"',
  "{'single': 'quotes'}",
  "\uFEFF{}",
  new Uint8Array([0xff, 0xfe, 0x7b, 0x22, 0xc0, 0xaf, 0x22, 0x7d]),
  new Uint8Array([0x7b, 0x22, 0x6e, 0x22, 0x3a, 0x22, 0xed, 0xa0, 0x80, 0x22, 0x7d]),
  "[".repeat(50_000),
  '{"a":'.repeat(20_000),
  JSON.stringify({ name: "\uD800", note: "\u0000", description: "\u0000" }),
];

/** Content types a client may wrongly send. */
export const WRONG_CONTENT_TYPES: (string | null)[] = [
  null,
  "text/plain",
  "application/x-www-form-urlencoded",
  "multipart/form-data",
  "multipart/form-data; boundary=",
  "application/xml",
  "application/json; charset=latin1",
  "application/octet-stream",
];

export function deepArray(depth: number): unknown {
  let v: unknown = "\u0000";
  for (let i = 0; i < depth; i++) v = [v];
  return v;
}

export function deepObject(depth: number): unknown {
  let v: unknown = "\u0000";
  for (let i = 0; i < depth; i++) v = { a: v };
  return v;
}

// sample() names the one entry it puts in a record (a map of species or column names) so.
const RECORD_KEYS = ["A", "conc"];

// Values for string patterns the schemas use, so a generated body gets past them.
const PATTERN_SAMPLES: [RegExp, string][] = [
  [/A-Z\]\{3\}/, "USD"],
  [/\\\.\[A-Za-z_\]/, "feed.flowA"],
  [/CSTR\|PFR/, "CSTR-PFR"],
  [/\[a-z\]\[a-z_\]/, "project"],
];

/** A seeded source of fuzz: the same seed gives the same requests. */
export class Fuzzer {
  private readonly rng;

  constructor(
    seed: number,
    /** A real id for a property or path parameter of this name, when the test has one. */
    private readonly idFor: (name: string) => string | undefined,
  ) {
    this.rng = xoroshiro128plus(seed);
  }

  float(): number {
    return uniformFloat64(this.rng);
  }

  int(n: number): number {
    return Math.floor(this.float() * n);
  }

  chance(p: number): boolean {
    return this.float() < p;
  }

  pick<T>(list: readonly T[]): T {
    return list[this.int(list.length)];
  }

  uuid(): string {
    const hex = () => this.int(16).toString(16);
    const part = (n: number) => Array.from({ length: n }, hex).join("");
    return `${part(8)}-${part(4)}-4${part(3)}-a${part(3)}-${part(12)}`;
  }

  nastyString(): string {
    return this.pick(NASTY_STRINGS);
  }

  wrongType(): unknown {
    return this.pick(WRONG_TYPES)();
  }

  /** A plausible value for a schema: what a well-meaning client would send. */
  sample(s: JsonSchema, name = "", depth = 0): unknown {
    if (depth > 12) return null;
    if (s.const !== undefined) return s.const;
    if (s.enum) return this.pick(s.enum);
    const branches = s.anyOf ?? s.oneOf;
    if (branches) return this.sample(this.pick(branches), name, depth + 1);
    if (s.allOf?.length) return this.sample(s.allOf[0], name, depth + 1);
    const type = Array.isArray(s.type) ? s.type.find((t) => t !== "null") ?? "null" : s.type;
    switch (type) {
      case "object": {
        const out: Record<string, unknown> = {};
        for (const [key, sub] of Object.entries(s.properties ?? {})) {
          if (s.required?.includes(key) || this.chance(0.5)) out[key] = this.sample(sub, key, depth + 1);
        }
        if (typeof s.additionalProperties === "object") out[name === "columns" ? "conc" : "A"] = this.sample(s.additionalProperties, "", depth + 1);
        return out;
      }
      case "array": {
        const n = Math.max(s.minItems ?? 0, 1);
        return Array.from({ length: n }, () => this.sample(s.items ?? {}, name, depth + 1));
      }
      case "string": {
        if (s.format === "uuid") return this.idFor(name) ?? this.uuid();
        if (s.format === "email") return `fuzz.${this.int(1e6)}@nowhere.example`;
        const patterned = s.pattern ? PATTERN_SAMPLES.find(([re]) => re.test(s.pattern!))?.[1] : undefined;
        if (patterned) return patterned;
        const base = "Fuzz sample text";
        const min = s.minLength ?? 0;
        const text = base.length >= min ? base : base.padEnd(min, "x");
        return s.maxLength !== undefined ? text.slice(0, Math.max(s.maxLength, min)) : text;
      }
      case "integer":
      case "number": {
        const lo = s.minimum ?? (s.exclusiveMinimum !== undefined ? s.exclusiveMinimum : 0);
        const hi = s.maximum ?? (s.exclusiveMaximum !== undefined ? s.exclusiveMaximum : lo + 10);
        const mid = (lo + Math.min(hi, lo + 10)) / 2 || 0.5;
        return type === "integer" ? Math.max(Math.ceil(lo), Math.min(Math.floor(hi), Math.round(mid))) : mid;
      }
      case "boolean":
        return true;
      case "null":
        return null;
      default:
        return "Fuzz sample text";
    }
  }

  /**
   * The body with one value, or one key of a record, made bad: a nasty string, a wrong type,
   * deep nesting. Every result is something the API must refuse.
   */
  mutate(body: unknown): unknown {
    const slots: { get: () => unknown; set: (v: unknown) => void; renameKey?: (k: string) => void; recordKey: boolean }[] = [];
    const walk = (holder: Record<string, unknown> | unknown[], key: string | number) => {
      const value = (holder as Record<string | number, unknown>)[key];
      const slot = {
        recordKey: RECORD_KEYS.includes(key as string),
        get: () => value,
        set: (v: unknown) => ((holder as Record<string | number, unknown>)[key] = v),
        renameKey: Array.isArray(holder)
          ? undefined
          : (k: string) => {
              const h = holder as Record<string, unknown>;
              delete h[key as string];
              h[k] = value;
            },
      };
      slots.push(slot);
      if (value && typeof value === "object") {
        if (Array.isArray(value)) value.forEach((_, i) => walk(value, i));
        else for (const k of Object.keys(value)) walk(value as Record<string, unknown>, k);
      }
    };
    const root = { body };
    walk(root, "body");
    const slot = slots.length > 1 && this.chance(0.9) ? slots[1 + this.int(slots.length - 1)] : slots[0];
    const current = slot.get();
    const recordKeys = slots.filter((s) => s.recordKey);
    if (recordKeys.length && this.chance(0.3)) {
      // A key of a record (species, column header) is stored too; it must be refused itself.
      this.pick(recordKeys).renameKey!(this.pick(["\u0000", "A\u0000", "\uD800", "k".repeat(5000), "\u0007"]));
      return root.body;
    }
    if (typeof current === "string" || this.chance(0.5)) slot.set(this.nastyString());
    else slot.set(this.wrongType());
    return root.body;
  }
}
