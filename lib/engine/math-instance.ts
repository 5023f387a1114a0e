import {
  absDependencies,
  addDependencies,
  compileDependencies,
  cosDependencies,
  coshDependencies,
  create,
  createUnitDependencies,
  divideDependencies,
  eDependencies,
  expDependencies,
  log10Dependencies,
  logDependencies,
  maxDependencies,
  minDependencies,
  multiplyDependencies,
  parseDependencies,
  piDependencies,
  powDependencies,
  sinDependencies,
  sinhDependencies,
  sqrtDependencies,
  subtractDependencies,
  tanhDependencies,
  unaryMinusDependencies,
  unaryPlusDependencies,
  unitDependencies,
  type MathJsInstance,
} from "mathjs";

/** Functions a rate expression may call. */
export const EXPRESSION_FUNCTIONS: readonly string[] = [
  "abs", "exp", "log", "log10", "sqrt", "pow", "min", "max", "sin", "cos", "sinh", "cosh", "tanh",
];

/** Constants a rate expression may use. */
export const EXPRESSION_CONSTANTS: readonly string[] = ["e", "pi"];

let instance: MathJsInstance | undefined;

/**
 * A private mathjs instance with only units, parsing and the functions above.
 * Created on first use because building the unit tables is slow and most specs are plain numbers.
 */
export function mathInstance(): MathJsInstance {
  if (instance) return instance;
  const m = create(
    {
      unitDependencies, createUnitDependencies, parseDependencies, compileDependencies,
      addDependencies, subtractDependencies, multiplyDependencies, divideDependencies, powDependencies,
      unaryMinusDependencies, unaryPlusDependencies, expDependencies, logDependencies, log10Dependencies,
      sqrtDependencies, absDependencies, minDependencies, maxDependencies, sinDependencies, cosDependencies,
      sinhDependencies, coshDependencies, tanhDependencies, eDependencies, piDependencies,
    },
    { number: "number" },
  );
  m.createUnit("M", "1 mol/L");
  m.createUnit("mM", "1 mmol/L");
  instance = m;
  return m;
}
