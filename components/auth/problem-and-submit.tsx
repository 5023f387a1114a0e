"use client";

import { FormMessage } from "@/components/ui/field";
import { useHydrated } from "@/components/ui/use-hydrated";

/**
 * The foot of an account form: what went wrong, if anything, then the full-width submit button.
 * The button waits for the page to be taken over by React, so a password is never sent the
 * browser's own way, and says what it is doing while the request is out.
 */
export function ProblemAndSubmit({ problem, isSubmitting, label, busyLabel }: { problem?: string; isSubmitting: boolean; label: string; busyLabel: string }) {
  const hydrated = useHydrated();
  return (
    <>
      {problem ? <FormMessage kind="error">{problem}</FormMessage> : null}
      <button type="submit" className="btn-primary w-full justify-center" disabled={!hydrated || isSubmitting}>
        {isSubmitting ? busyLabel : label}
      </button>
    </>
  );
}
