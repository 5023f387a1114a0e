/** Stable error codes; callers switch on these, never on messages. */
export type EngineErrorCode = "invalid-spec" | "invalid-unit" | "infeasible" | "equilibrium" | "invalid-expression";

/** An error the engine raises for a request it cannot serve, with the JSON path of the field at fault. */
export class EngineError extends Error {
  readonly code: EngineErrorCode;
  /** Dotted JSON path of the field, e.g. "reaction.rate.k". */
  readonly path: string;

  constructor(code: EngineErrorCode, message: string, path: string) {
    super(message);
    this.name = "EngineError";
    this.code = code;
    this.path = path;
  }
}

/** Throws an invalid-spec error unless the condition holds. */
export function ensure(condition: boolean, message: string, path: string): asserts condition {
  if (!condition) throw new EngineError("invalid-spec", message, path);
}
