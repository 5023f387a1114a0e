import { ApiError } from "@/lib/client/fetch-json";

/** A refusal from the API as a sentence: who may do it, when the role is the reason. */
export function refusalText(err: unknown, action: string, roleHint: string): string {
  if (err instanceof ApiError) {
    if (err.status === 403) return `You cannot ${action}: ${err.message}. ${roleHint}`;
    if (err.status === 409) return `Could not ${action}: ${err.message}.`;
    return `Could not ${action}: ${err.message}`;
  }
  return `Could not ${action}: the server did not answer. Check the connection and try again.`;
}

export function LoadingPanel({ label, bare = false }: { label: string; bare?: boolean }) {
  return (
    <div role="status" className={`${bare ? "" : "card"} flex items-center gap-3 p-6 text-ink-soft`}>
      <span aria-hidden="true" className="size-4 animate-spin rounded-full border-2 border-accent-200 border-t-accent-600" />
      {label}
    </div>
  );
}

export function ErrorPanel({ error, what, bare = false }: { error: unknown; what: string; bare?: boolean }) {
  const status = error instanceof ApiError ? error.status : 0;
  const text =
    status === 403
      ? `Your role cannot open ${what}. Sweeps and their results are open to engineers, managers and admins; viewers see approved designs on the project page.`
      : status === 404
        ? `There is no such ${what.replace(/^(this|the) /, "")} in your team.`
        : `Could not load ${what}${error instanceof Error ? `: ${error.message}` : "."}`;
  return (
    <div role="alert" className={`${bare ? "" : "card"} border-red-200 p-6 text-sm text-red-800`} data-testid="error-panel">
      {text}
    </div>
  );
}
