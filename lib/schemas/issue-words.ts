import type { z } from "zod";

type Issue = z.core.$ZodIssue;

/** Zod's own wording starts like this; our schemas give their own sentences, which are kept. */
const ZOD_DEFAULT = /^(Invalid|Too (small|big)|Unrecognized key|Expected)/;

function fromLimit(issue: Issue & { code: "too_small" | "too_big" }): string {
  const bound = Number(issue.code === "too_small" ? issue.minimum : issue.maximum);
  const origin = (issue as { origin?: string }).origin;
  const inclusive = (issue as { inclusive?: boolean }).inclusive !== false;
  if (origin === "string") return issue.code === "too_small" ? (bound <= 1 ? "required" : `use at least ${bound} characters`) : `use at most ${bound} characters`;
  if (origin === "array" || origin === "set") return issue.code === "too_small" ? `give at least ${bound}` : `give at most ${bound}`;
  if (issue.code === "too_small") return inclusive ? `must be ${bound} or more` : `must be above ${bound}`;
  return inclusive ? `must be ${bound} or less` : `must be below ${bound}`;
}

function isQuantityUnion(issue: Issue): boolean {
  if (issue.code !== "invalid_union") return false;
  const branches = (issue as { errors?: Issue[][] }).errors ?? [];
  const expected = new Set(branches.flat().map((i) => (i.code === "invalid_type" ? i.expected : i.code)));
  return expected.has("number") && expected.has("string");
}

/**
 * One zod issue as a short sentence for a person, to follow the field's label ("Stage 1 volume:
 * enter a number"). Messages our schemas wrote are kept as written.
 */
export function issueInWords(issue: Issue): string {
  if (!ZOD_DEFAULT.test(issue.message)) return issue.message;
  switch (issue.code) {
    case "invalid_type": {
      if ((issue as { input?: unknown }).input === undefined) return "required";
      if (issue.expected === "number" || issue.expected === "int") return "enter a number";
      if (issue.expected === "string") return "enter text";
      if (issue.expected === "boolean") return "choose yes or no";
      if (issue.expected === "array") return "give a list";
      return "fill this in";
    }
    case "invalid_union":
      return isQuantityUnion(issue) ? "enter a number, or a quantity with a unit such as 2.5 m³" : "not one of the accepted forms";
    case "too_small":
    case "too_big":
      return fromLimit(issue);
    case "invalid_value":
      return "choose one of the offered values";
    case "unrecognized_keys":
      return issue.keys.length === 1 ? "holds an entry this form does not have" : `holds ${issue.keys.length} entries this form does not have`;
    case "invalid_format":
      return "not in the expected form";
    case "not_multiple_of":
      return "must be a whole number";
    default:
      return "not a value we can use";
  }
}
