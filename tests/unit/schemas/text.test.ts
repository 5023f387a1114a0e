import { describe, expect, it } from "vitest";
import { AppError, validationError } from "@/lib/errors";
import { queryValues, uuidParam } from "@/lib/http";
import { auditQuerySchema } from "@/lib/schemas/audit";
import { costBasisSchema } from "@/lib/schemas/costs";
import { projectCreateSchema } from "@/lib/schemas/projects";
import { kineticsModelCreateSchema, reviewSchema } from "@/lib/schemas/sweeps";
import { fileNameProblem, multilineText, text, TEXT_MESSAGES } from "@/lib/schemas/text";

const messages = (r: { success: boolean; error?: { issues: { message: string }[] } }) => (r.success ? [] : r.error!.issues.map((i) => i.message));

describe("the shared text schema", () => {
  it("accepts plain text, accents, CJK and astral characters such as emoji", () => {
    for (const s of ["Reactor train 2", "Äthylacetat, café", "反应器 連続槽", "𠀀𠀁 (CJK extension B)", "🧪⚗️ test", "👩‍🔬", ""]) {
      expect(text().safeParse(s).success, s).toBe(true);
      expect(multilineText().safeParse(s).success, s).toBe(true);
    }
  });

  it("refuses NUL and other C0 control characters, with a message a user understands", () => {
    for (const s of ["a\u0000b", "\u0000", "bell\u0007", "esc\u001B[0m", "vt\u000B"]) {
      expect(messages(text().safeParse(s))).toEqual([TEXT_MESSAGES.singleLineControl]);
      expect(messages(multilineText().safeParse(s))).toEqual([TEXT_MESSAGES.multiLineControl]);
    }
  });

  it("allows tab, line feed and carriage return only in multi-line text", () => {
    for (const s of ["line 1\nline 2", "a\tb", "windows\r\nline"]) {
      expect(multilineText().safeParse(s).success, JSON.stringify(s)).toBe(true);
      expect(text().safeParse(s).success, JSON.stringify(s)).toBe(false);
    }
  });

  it("refuses a lone high or low surrogate, and a pair in the wrong order", () => {
    for (const s of ["\uD83D", "\uDE00", "a\uD83Dz", "x\uDFFF", "\uDE00\uD83D", "🧪\uD83D"]) {
      expect(messages(text().safeParse(s)), JSON.stringify(s)).toEqual([TEXT_MESSAGES.brokenCharacter]);
    }
    // The same two halves in the right order are one character (😀) and pass.
    expect(text().safeParse("\uD83D\uDE00").success).toBe(true);
  });

  it("keeps each field's own length and emptiness rules", () => {
    expect(messages(text().trim().min(2, "Use at least 2 characters").safeParse(" a "))).toEqual(["Use at least 2 characters"]);
    expect(text().max(3).safeParse("🧪").success).toBe(true);
  });

  it("names the field in the 400 of a stored record", () => {
    const project = projectCreateSchema.safeParse({ name: "Pilot\u0000", description: "ok\nfine" });
    expect(project.success).toBe(false);
    expect(Object.keys(validationError(project.error!).fields!)).toEqual(["name"]);

    const review = reviewSchema.safeParse({ decision: "approve", comment: "looks right\u0000" });
    expect(validationError(review.error!).fields).toEqual({ comment: [TEXT_MESSAGES.multiLineControl] });

    const correlation = { a: 1, b: 2, n: 0.6, source: "vendor quote" };
    const costs = costBasisSchema.safeParse({
      vessels: { CSTR: { ...correlation, source: "quote \uD800" }, PFR: correlation },
      currency: "USD",
      basisYear: 2024,
      sizes: { mode: "any" },
      maxVesselVolume: null,
      installationFactor: { value: 3, source: "from memory" },
    });
    expect(validationError(costs.error!).fields).toEqual({ "vessels.CSTR.source": [TEXT_MESSAGES.brokenCharacter] });
  });

  it("reaches strings inside a stored kinetics spec, keys included", () => {
    const spec = { feed: { flowA: 1, concA: "2 mol/L" }, reaction: { stoichiometry: { "A\u0000": -1 }, rate: { law: "power", k: "0.1 1/s\u0000", orders: { A: 1 } } } };
    const parsed = kineticsModelCreateSchema.safeParse({ name: "First order", spec });
    expect(parsed.success).toBe(false);
    const fields = Object.keys(validationError(parsed.error!).fields!);
    expect(fields).toContain("spec.reaction.rate.k");
    expect(fields.some((f) => f.startsWith("spec.reaction.stoichiometry"))).toBe(true);
  });

  it("refuses a file name with NUL or a broken character", () => {
    expect(fileNameProblem("rates.csv")).toBeNull();
    expect(fileNameProblem("反应 🧪.xlsx")).toBeNull();
    expect(fileNameProblem("rates\u0000.csv")).toMatch(/^The file name: /);
    expect(fileNameProblem("rates\uDC00.csv")).toMatch(/broken character/);
  });
});

describe("query values and path ids", () => {
  const refusal = (fn: () => unknown) => {
    try {
      fn();
    } catch (err) {
      expect(err).toBeInstanceOf(AppError);
      return err as AppError;
    }
    throw new Error("not refused");
  };

  it("refuses NUL, an over-long value and an over-long query string, naming the parameter", () => {
    const nul = refusal(() => queryValues(new Request("http://x/api/audit?entityId=%00")));
    expect(nul.status).toBe(400);
    expect(Object.keys(nul.fields!)).toEqual(["entityId"]);
    const long = refusal(() => queryValues(new Request(`http://x/api/audit?entityType=${"a".repeat(100_000)}`)));
    expect(long.status).toBe(400);
    const many = refusal(() => queryValues(new Request(`http://x/api/audit?${Array.from({ length: 400 }, (_, i) => `p${i}=abcdef`).join("&")}`)));
    expect(many.status).toBe(400);
    expect(queryValues(new Request("http://x/api/audit?entityType=project&entityType=pin"))).toEqual({ entityType: "pin" });
  });

  it("the audit query takes a kind of record and a uuid, nothing else", () => {
    expect(auditQuerySchema.safeParse({ entityType: "inventory_vessel", entityId: "6f1c3a52-0a57-4c4f-9d59-0d1b2f1b7a10" }).success).toBe(true);
    expect(auditQuerySchema.safeParse({ entityId: "\u0000" }).success).toBe(false);
    expect(auditQuerySchema.safeParse({ entityType: "Project; drop" }).success).toBe(false);
    expect(auditQuerySchema.safeParse({ colour: "red" }).success).toBe(false);
  });

  it("a path id that is not a uuid is not found", async () => {
    const ctx = (id: string) => ({ params: Promise.resolve({ id }) });
    for (const id of ["\u0000", "%FF%FE", "\uFFFD\uFFFD", "'; select 1", "6f1c3a52-0a57-4c4f-9d59-0d1b2f1b7a1"]) {
      await expect(uuidParam(ctx(id), "id", "project")).rejects.toMatchObject({ status: 404, message: "No such project" });
    }
    await expect(uuidParam(ctx("6F1C3A52-0A57-4C4F-9D59-0D1B2F1B7A10"), "id", "project")).resolves.toBe("6F1C3A52-0A57-4C4F-9D59-0D1B2F1B7A10");
  });
});
