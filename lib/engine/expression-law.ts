import type { ConcentrationBasis } from "./concentrations";
import { concentration } from "./concentrations";
import { EngineError } from "./errors";
import { EXPRESSION_CONSTANTS, EXPRESSION_FUNCTIONS, mathInstance } from "./math-instance";
import type { RateFunction } from "./sizing-basis";

const PATH = "reaction.rate.expression";

interface MathNode {
  type: string;
  name?: string;
  traverse(cb: (node: MathNode, path: string, parent: MathNode | null) => void): void;
  compile(): { evaluate(scope: Map<string, number>): unknown };
}

function parse(expression: string): MathNode {
  try {
    return mathInstance().parse(expression) as unknown as MathNode;
  } catch (err) {
    const why = err instanceof Error ? err.message : String(err);
    throw new EngineError("invalid-expression", `the rate expression does not parse: ${why}`, PATH);
  }
}

function checkSymbols(node: MathNode, allowed: ReadonlySet<string>): void {
  node.traverse((n, path, parent) => {
    if (n.type === "FunctionNode" && n.name !== undefined && !EXPRESSION_FUNCTIONS.includes(n.name)) {
      throw new EngineError("invalid-expression", `the rate expression calls an unknown function "${n.name}"`, PATH);
    }
    if (n.type !== "SymbolNode" || n.name === undefined) return;
    if (parent?.type === "FunctionNode" && path === "fn") return;
    if (!allowed.has(n.name)) {
      throw new EngineError(
        "invalid-expression",
        `the rate expression uses an unknown variable "${n.name}"; known: ${[...allowed].sort().join(", ")}`,
        PATH,
      );
    }
  });
  const forbidden = ["AssignmentNode", "FunctionAssignmentNode", "AccessorNode", "IndexNode", "ObjectNode", "BlockNode"];
  node.traverse((n) => {
    if (forbidden.includes(n.type)) {
      throw new EngineError("invalid-expression", `the rate expression may not contain a ${n.type}`, PATH);
    }
  });
}

/**
 * Compiles a user rate expression with mathjs (no eval): variables C_<species>, T, X and the parameters.
 */
export function expressionRate(
  expression: string,
  parameters: Readonly<Record<string, number>>,
  basis: ConcentrationBasis,
): RateFunction {
  const node = parse(expression);
  const concNames = basis.species.names.map((n) => `C_${n}`);
  const allowed = new Set([...concNames, "T", "X", ...Object.keys(parameters), ...EXPRESSION_CONSTANTS]);
  checkSymbols(node, allowed);
  const code = node.compile();
  const scope = new Map<string, number>(Object.entries(parameters));
  return (x, t) => {
    scope.set("X", x);
    scope.set("T", t);
    for (let i = 0; i < concNames.length; i++) scope.set(concNames[i], concentration(basis, i, x, t));
    const v = code.evaluate(scope);
    return typeof v === "number" ? v : Number.NaN;
  };
}
