import { AcceptInvitationForm } from "@/components/auth/accept-invitation-form";
import { Brand } from "@/components/layout/brand";
import { getDb } from "@/db/client";
import { getOpenInvitationByToken } from "@/lib/services/members";

export const dynamic = "force-dynamic";
export const metadata = { title: "Accept invitation" };

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = token.length >= 20 && token.length <= 200 ? await getOpenInvitationByToken(getDb(), token) : null;
  return (
    <main id="main-content" tabIndex={-1} className="grid min-h-screen place-items-center px-4">
      <div className="flex w-full max-w-sm flex-col items-center gap-6">
        <Brand size="lg" />
        {invitation ? (
          <div className="card w-full space-y-4 p-6">
            <div>
              <h1>Join {invitation.teamName}</h1>
              <p className="mt-1 text-ink-soft">
                You are invited as <b>{invitation.role}</b> with <b>{invitation.email}</b>. Choose your name and password.
              </p>
            </div>
            <AcceptInvitationForm token={token} email={invitation.email} />
          </div>
        ) : (
          <div className="card w-full p-6 text-center">
            <h1>Invitation not valid</h1>
            <p className="mt-2 text-ink-soft">This link was used, revoked or has expired. Ask your team admin for a new one.</p>
          </div>
        )}
      </div>
    </main>
  );
}
