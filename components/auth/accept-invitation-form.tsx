"use client";

import { useState } from "react";
import { Field, FormMessage } from "@/components/ui/field";
import { ProblemAndSubmit } from "./problem-and-submit";
import { useSchemaForm } from "@/components/ui/use-schema-form";
import { applyServerFieldErrors } from "@/components/ui/server-errors";
import { ApiError, fetchJson } from "@/lib/client/fetch-json";
import { invitationAcceptSchema } from "@/lib/schemas/accounts";
import { signInWithPassword } from "./auth-client";

export function AcceptInvitationForm({ token, email }: { token: string; email: string }) {
  const [formError, setFormError] = useState<string>();
  const [existing, setExisting] = useState(false);
  const form = useSchemaForm(invitationAcceptSchema, { defaultValues: { token, name: "", password: "" } });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setFormError(undefined);
    try {
      const result = await fetchJson<{ createdAccount: boolean }>("/api/invitations/accept", { method: "POST", json: values });
      if (!result.createdAccount) {
        setExisting(true);
        return;
      }
      const outcome = await signInWithPassword(email, values.password);
      window.location.assign(outcome.ok ? outcome.url : "/signin");
    } catch (err) {
      if (err instanceof ApiError) {
        const rest = applyServerFieldErrors(err.fields, form.setError, ["name", "password"]);
        setFormError(rest.length ? err.message : undefined);
      } else setFormError("Could not reach the server. Try again.");
    }
  });

  if (existing) {
    return (
      <FormMessage kind="info">
        You already had an account with this address; the team is added to it. <a href="/signin" className="underline">Sign in</a> as usual.
      </FormMessage>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Accept invitation">
      <input type="hidden" {...form.register("token")} />
      <Field id="name" label="Your name" error={errors.name?.message}>
        <input id="name" className="input" autoComplete="name" aria-invalid={!!errors.name} {...form.register("name")} />
      </Field>
      <Field id="new-password" label="Password" error={errors.password?.message} hint="At least 10 characters.">
        <input id="new-password" type="password" autoComplete="new-password" className="input" aria-invalid={!!errors.password} {...form.register("password")} />
      </Field>
      <ProblemAndSubmit problem={formError} isSubmitting={isSubmitting} label="Create account and sign in" busyLabel="Creating account…" />
    </form>
  );
}
