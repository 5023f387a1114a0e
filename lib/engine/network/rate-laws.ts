import { arrheniusFactor } from "../arrhenius";
import { EngineError, ensure } from "../errors";
import { EXPRESSION_CONSTANTS, EXPRESSION_FUNCTIONS, mathInstance } from "../math-instance";
import { anyToSI, DIM, rateConstantDimension, toSI } from "../units";
import type { NetworkExpressionRate, NetworkPowerRate } from "./types";

/**
 * The rate r_j of one reaction as a function of the concentrations (mol/m3, species order of the
 * network) and the temperature. Concentrations are clamped at zero here, never in the solvers: a law
 * must never see a negative concentration, but the integrators' error estimates need the raw values.
 */
export interface CompiledRate {
  rate(C: Float64Array, T: number): number;
  /** Forward plus reverse term, each taken positive (|r| for an expression): the size round-off scales with. */
  gross(C: Float64Array, T: number): number;
  /** Writes dr/dC_m into out (length = species); null when the law has no analytic gradient. */
  gradient: ((C: Float64Array, T: number, out: Float64Array) => void) | null;
  /** Forward order by species (0 for an expression law: it is not known). */
  forwardOrders: Float64Array;
  /** Reverse order by species, or null without a reverse term. */
  reverseOrders: Float64Array | null;
  /** True for an expression law, whose dependence on each concentration is unknown. */
  opaque: boolean;
}

interface Context {
  species: readonly string[];
  index: ReadonlyMap<string, number>;
  feedTemperature: number;
  /** Concentration scale, mol/m3, for the floor of fractional orders' derivatives at zero. */
  scale: number;
  path: string;
}

function readOrders(orders: Record<string, number>, ctx: Context, path: string): Float64Array {
  const out = new Float64Array(ctx.species.length);
  ensure(orders !== null && typeof orders === "object", "give the orders as a table of species and numbers", path);
  for (const [name, order] of Object.entries(orders)) {
    const i = ctx.index.get(name);
    if (i === undefined) throw new EngineError("invalid-spec", `species "${name}" is not in the feed; list it there (0 allowed)`, `${path}.${name}`);
    ensure(typeof order === "number" && Number.isFinite(order), "an order must be a number", `${path}.${name}`);
    ensure(order >= 0, "an order must be zero or more", `${path}.${name}`);
    out[i] = order;
  }
  return out;
}

function totalOrder(orders: Float64Array): number {
  let n = 0;
  for (const a of orders) n += a;
  return n;
}

/** prod C_m^a_m over the species with a nonzero order (C clamped at zero). */
function powerProduct(C: Float64Array, orders: Float64Array, used: Int32Array): number {
  let p = 1;
  for (let q = 0; q < used.length; q++) {
    const m = used[q];
    const c = C[m] > 0 ? C[m] : 0;
    const a = orders[m];
    p *= a === 1 ? c : a === 2 ? c * c : c ** a;
  }
  return p;
}

/** Adds sign * k * d(prod C^a)/dC_m into out. A fractional order's infinite slope at zero is taken at a tiny floor. */
function addPowerGradient(C: Float64Array, orders: Float64Array, used: Int32Array, k: number, floor: number, out: Float64Array): void {
  for (let q = 0; q < used.length; q++) {
    const m = used[q];
    const a = orders[m];
    let cm = C[m] > 0 ? C[m] : 0;
    if (a < 1 && cm < floor) cm = floor;
    let others = 1;
    for (let s = 0; s < used.length; s++) {
      if (s === q) continue;
      const c = C[used[s]] > 0 ? C[used[s]] : 0;
      others *= c ** orders[used[s]];
    }
    out[m] += k * a * cm ** (a - 1) * others;
  }
}

function usedIndices(orders: Float64Array): Int32Array {
  const used: number[] = [];
  orders.forEach((a, i) => {
    if (a !== 0) used.push(i);
  });
  return Int32Array.from(used);
}

/** Compiles a power law with optional reverse term and Arrhenius factors. */
export function compilePowerRate(spec: NetworkPowerRate, ctx: Context): CompiledRate {
  const p = ctx.path;
  const forwardOrders = readOrders(spec.orders, ctx, `${p}.orders`);
  const k = toSI(spec.k, rateConstantDimension(totalOrder(forwardOrders)), `${p}.k`);
  ensure(k >= 0, "a rate constant must be zero or more", `${p}.k`);
  const ea = spec.activationEnergy === undefined ? 0 : toSI(spec.activationEnergy, DIM.energyPerMole, `${p}.activationEnergy`);
  const tref = spec.referenceTemperature === undefined ? ctx.feedTemperature : toSI(spec.referenceTemperature, DIM.temperature, `${p}.referenceTemperature`);
  ensure(tref > 0, "the reference temperature must be above absolute zero", `${p}.referenceTemperature`);
  let reverseOrders: Float64Array | null = null;
  let kr = 0;
  let ear = 0;
  if (spec.reverse) {
    reverseOrders = readOrders(spec.reverse.orders, ctx, `${p}.reverse.orders`);
    kr = toSI(spec.reverse.k, rateConstantDimension(totalOrder(reverseOrders)), `${p}.reverse.k`);
    ensure(kr >= 0, "a rate constant must be zero or more", `${p}.reverse.k`);
    if (spec.reverse.activationEnergy !== undefined) ear = toSI(spec.reverse.activationEnergy, DIM.energyPerMole, `${p}.reverse.activationEnergy`);
  }
  const fUsed = usedIndices(forwardOrders);
  const rUsed = reverseOrders ? usedIndices(reverseOrders) : new Int32Array(0);
  const rOrders = reverseOrders ?? new Float64Array(ctx.species.length);
  const floor = 1e-12 * ctx.scale;
  // The Arrhenius factors are cached for the last temperature: a stage is isothermal, so every call
  // within one stage solve has the same T.
  let lastT = Number.NaN;
  let kf = 0;
  let kb = 0;
  const constantsAt = (T: number) => {
    if (T === lastT) return;
    lastT = T;
    kf = k * arrheniusFactor(ea, tref, T);
    kb = kr * arrheniusFactor(ear, tref, T);
  };
  return {
    rate(C, T) {
      constantsAt(T);
      const forward = kf === 0 ? 0 : kf * powerProduct(C, forwardOrders, fUsed);
      return kb === 0 ? forward : forward - kb * powerProduct(C, rOrders, rUsed);
    },
    gross(C, T) {
      constantsAt(T);
      const forward = kf === 0 ? 0 : kf * powerProduct(C, forwardOrders, fUsed);
      return kb === 0 ? forward : forward + kb * powerProduct(C, rOrders, rUsed);
    },
    gradient(C, T, out) {
      constantsAt(T);
      out.fill(0);
      if (kf !== 0) addPowerGradient(C, forwardOrders, fUsed, kf, floor, out);
      if (kb !== 0) addPowerGradient(C, rOrders, rUsed, -kb, floor, out);
    },
    forwardOrders,
    reverseOrders,
    opaque: false,
  };
}

interface MathNode {
  type: string;
  name?: string;
  traverse(cb: (node: MathNode, path: string, parent: MathNode | null) => void): void;
  compile(): { evaluate(scope: Map<string, number>): unknown };
}

const FORBIDDEN = ["AssignmentNode", "FunctionAssignmentNode", "AccessorNode", "IndexNode", "ObjectNode", "BlockNode"];

/** Compiles an expression law with mathjs (parsed to a tree and checked, never eval'd). */
export function compileExpressionRate(spec: NetworkExpressionRate, ctx: Context): CompiledRate {
  const p = ctx.path;
  const where = `${p}.expression`;
  ensure(typeof spec.expression === "string" && spec.expression.trim() !== "", "write the rate as an expression", where);
  const parameters: Record<string, number> = {};
  for (const [name, value] of Object.entries(spec.parameters ?? {})) {
    ensure(/^[A-Za-z_]\w*$/.test(name), `"${name}" cannot name a parameter: use letters, digits and _`, `${p}.parameters.${name}`);
    ensure(!/^C_/.test(name) && name !== "T", `"${name}" is reserved for a concentration or the temperature`, `${p}.parameters.${name}`);
    parameters[name] = anyToSI(value, `${p}.parameters.${name}`);
  }
  let node: MathNode;
  try {
    node = mathInstance().parse(spec.expression) as unknown as MathNode;
  } catch (err) {
    const why = err instanceof Error ? err.message : String(err);
    throw new EngineError("invalid-expression", `the rate expression does not parse: ${why}`, where);
  }
  const concNames = ctx.species.map((s) => `C_${s}`);
  const allowed = new Set([...concNames, "T", ...Object.keys(parameters), ...EXPRESSION_CONSTANTS]);
  node.traverse((n, path, parent) => {
    if (FORBIDDEN.includes(n.type)) throw new EngineError("invalid-expression", "the rate expression may only combine numbers, variables and functions", where);
    if (n.type === "FunctionNode" && n.name !== undefined && !EXPRESSION_FUNCTIONS.includes(n.name)) {
      throw new EngineError("invalid-expression", `the rate expression calls an unknown function "${n.name}"`, where);
    }
    if (n.type !== "SymbolNode" || n.name === undefined) return;
    if (parent?.type === "FunctionNode" && path === "fn") return;
    if (!allowed.has(n.name)) {
      const hint = /^C_/.test(n.name) ? `species "${n.name.slice(2)}" is not in the feed; list it there (0 allowed)` : `unknown name "${n.name}"; known: ${[...allowed].sort().join(", ")}`;
      throw new EngineError("invalid-expression", `the rate expression uses ${hint}`, where);
    }
  });
  const code = node.compile();
  const scope = new Map<string, number>(Object.entries(parameters));
  const rate = (C: Float64Array, T: number) => {
    scope.set("T", T);
    for (let i = 0; i < concNames.length; i++) scope.set(concNames[i], C[i] > 0 ? C[i] : 0);
    const v = code.evaluate(scope);
    return typeof v === "number" ? v : Number.NaN;
  };
  return {
    rate,
    gross: (C, T) => Math.abs(rate(C, T)),
    gradient: null,
    forwardOrders: new Float64Array(ctx.species.length),
    reverseOrders: null,
    opaque: true,
  };
}
