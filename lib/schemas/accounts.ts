import { z } from "zod";
import { ROLES } from "@/lib/authz/policy";
import { text } from "./text";

/** Sign-in, invitations and membership: shared by the server (route handlers, actions) and the client forms. */
export const emailSchema = z
  .string({ error: "E-mail is required" })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: "Enter a valid e-mail address" }));

export const passwordSignInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: "Password is required" }).min(1, "Password is required").max(200),
});
export type PasswordSignIn = z.infer<typeof passwordSignInSchema>;

export const linkSignInSchema = z.object({ email: emailSchema });

export const newPasswordSchema = z
  .string({ error: "Password is required" })
  .min(10, "Use at least 10 characters")
  .max(200, "Use at most 200 characters");

export const roleSchema = z.enum(ROLES, { error: `Role must be one of ${ROLES.join(", ")}` });

export const invitationCreateSchema = z.object({ email: emailSchema, role: roleSchema });
export type InvitationCreate = z.infer<typeof invitationCreateSchema>;

export const memberUpdateSchema = z.object({ role: roleSchema }).strict();

export const invitationAcceptSchema = z.object({
  token: text({ error: "The invitation token is missing" }).min(20, "The invitation token is malformed").max(200),
  name: text({ error: "Name is required" }).trim().min(2, "Use at least 2 characters").max(120),
  password: newPasswordSchema,
});
export type InvitationAccept = z.infer<typeof invitationAcceptSchema>;
