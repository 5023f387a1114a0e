import { z } from "zod";
import { multilineText, text } from "./text";

/** A project's name and purpose, as the create and edit forms and the API take them. */
const projectName = text({ error: "Name is required" }).trim().min(2, "Use at least 2 characters").max(120, "Use at most 120 characters");
const projectDescription = multilineText({ error: "Purpose must be text" }).trim().max(2000, "Use at most 2000 characters");

export const projectCreateSchema = z.object({ name: projectName, description: projectDescription.default("") });
export type ProjectCreate = z.infer<typeof projectCreateSchema>;

export const projectUpdateSchema = z
  .object({
    name: projectName.optional(),
    description: projectDescription.optional(),
    archived: z.boolean({ error: "Choose archived or not" }).optional(),
  })
  .strict()
  .refine((v) => v.name !== undefined || v.description !== undefined || v.archived !== undefined, {
    message: "Change the name, the purpose or whether the project is archived",
  });
export type ProjectUpdate = z.infer<typeof projectUpdateSchema>;
