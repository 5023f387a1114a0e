"use client";

import { useState } from "react";
import { Field, FormMessage } from "@/components/ui/field";
import { ProblemAndSubmit } from "./problem-and-submit";
import { useSchemaForm } from "@/components/ui/use-schema-form";
import { applyServerFieldErrors } from "@/components/ui/server-errors";
import { linkSignInSchema, passwordSignInSchema } from "@/lib/schemas/accounts";
import { requestSignInLink, signInWithPassword } from "./auth-client";
import { useHydrated } from "@/components/ui/use-hydrated";

type Method = "password" | "link";

export function SignInForm({ callbackUrl, initialError }: { callbackUrl: string; initialError?: string }) {
  const [method, setMethod] = useState<Method>("password");
  // The message carried in from a failed attempt (?error=) is about that attempt only: it goes as
  // soon as the user edits a field or a newer message appears, so two verdicts never stand together.
  const [carriedError, setCarriedError] = useState(initialError);
  const hydrated = useHydrated();
  const dropCarried = () => setCarriedError(undefined);
  return (
    <div className="card w-full max-w-sm p-6">
      <div className="mb-5 flex rounded border border-line p-0.5 text-sm" role="tablist" aria-label="Sign-in method">
        {(["password", "link"] as const).map((m) => (
          <button
            key={m}
            type="button"
            role="tab"
            aria-selected={method === m}
            onClick={() => setMethod(m)}
            disabled={!hydrated}
            className={`flex-1 rounded px-3 py-1.5 ${method === m ? "bg-accent-600 text-white" : "text-ink-soft hover:text-ink"}`}
          >
            {m === "password" ? "Password" : "E-mail link"}
          </button>
        ))}
      </div>
      {carriedError ? (
        <div className="mb-4">
          <FormMessage kind="error">{carriedError}</FormMessage>
        </div>
      ) : null}
      {method === "password" ? <PasswordForm callbackUrl={callbackUrl} onEdit={dropCarried} /> : <LinkForm callbackUrl={callbackUrl} onEdit={dropCarried} />}
    </div>
  );
}

function PasswordForm({ callbackUrl, onEdit }: { callbackUrl: string; onEdit: () => void }) {
  const [formError, setFormError] = useState<string>();
  const form = useSchemaForm(passwordSignInSchema);
  const { errors, isSubmitting } = form.formState;

  const clearStale = () => {
    setFormError(undefined);
    onEdit();
  };
  const onSubmit = form.handleSubmit(async ({ email, password }) => {
    clearStale();
    const outcome = await signInWithPassword(email, password, callbackUrl);
    if (outcome.ok) {
      window.location.assign(outcome.url);
      return;
    }
    const rest = applyServerFieldErrors(outcome.fields, form.setError, ["email", "password"]);
    setFormError(rest.length ? rest.join(" ") : outcome.message);
  }, clearStale);

  return (
    <form onSubmit={onSubmit} onChange={clearStale} noValidate className="space-y-4" aria-label="Sign in with password">
      <Field id="email" label="E-mail" error={errors.email?.message}>
        <input id="email" type="email" autoComplete="username" className="input" aria-invalid={!!errors.email} {...form.register("email")} />
      </Field>
      <Field id="password" label="Password" error={errors.password?.message}>
        <input id="password" type="password" autoComplete="current-password" className="input" aria-invalid={!!errors.password} {...form.register("password")} />
      </Field>
      <ProblemAndSubmit problem={formError} isSubmitting={isSubmitting} label="Sign in" busyLabel="Signing in…" />
    </form>
  );
}

function LinkForm({ callbackUrl, onEdit }: { callbackUrl: string; onEdit: () => void }) {
  const [sentTo, setSentTo] = useState<string>();
  const [formError, setFormError] = useState<string>();
  const form = useSchemaForm(linkSignInSchema);
  const { errors, isSubmitting } = form.formState;

  const clearStale = () => {
    setFormError(undefined);
    onEdit();
  };
  const onSubmit = form.handleSubmit(async ({ email }) => {
    clearStale();
    const outcome = await requestSignInLink(email, callbackUrl);
    if (outcome.ok) setSentTo(email);
    else {
      const rest = applyServerFieldErrors(outcome.fields, form.setError, ["email"]);
      setFormError(rest.length ? rest.join(" ") : outcome.message);
    }
  }, clearStale);

  if (sentTo) {
    return (
      <FormMessage kind="info">
        If <b>{sentTo}</b> has a Seriatim account, a sign-in link is on its way. It works once, for 15 minutes.
      </FormMessage>
    );
  }
  return (
    <form onSubmit={onSubmit} onChange={clearStale} noValidate className="space-y-4" aria-label="Sign in with an e-mail link">
      <Field id="link-email" label="E-mail" error={errors.email?.message} hint="We send a one-time link; no password needed.">
        <input id="link-email" type="email" autoComplete="username" className="input" aria-invalid={!!errors.email} {...form.register("email")} />
      </Field>
      <ProblemAndSubmit problem={formError} isSubmitting={isSubmitting} label="Send sign-in link" busyLabel="Sending…" />
    </form>
  );
}
