import { z } from "zod";
import { text } from "./text";

const NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;
const PERCENT = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*%$/;

/**
 * A dimensionless number given as a number or as a string ("1.2"; with `percent`, also "90 %"
 * or "90%", read as 0.9), as the spec's contract promises a string wherever a number is.
 * A string that is neither is refused naming the field in words.
 */
export function dimensionless(label: string, { percent = false }: { percent?: boolean } = {}) {
  const hint = percent ? `give a fraction such as 0.9 or a percent such as 90 %` : `give a plain number such as 1.2`;
  return z.union([z.number({ error: `${label}: ${hint}` }), text().max(40, `${label}: use at most 40 characters`)], { error: `${label}: ${hint}` }).transform((v, ctx) => {
    if (typeof v === "number") return v;
    const t = v.trim();
    if (NUMBER.test(t)) return Number(t);
    const p = percent ? PERCENT.exec(t) : null;
    if (p) return Number(p[1]) / 100;
    ctx.addIssue({ code: "custom", message: `${label}: cannot read "${v}"; ${hint}` });
    return z.NEVER;
  });
}
