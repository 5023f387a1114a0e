import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { Brand } from "@/components/layout/brand";
import { getSessionUserId } from "@/lib/auth/session";

export const dynamic = "force-dynamic";
export const metadata = { title: "Sign in" };

const ERRORS: Record<string, string> = {
  Verification: "That sign-in link has expired or was already used. Ask for a new one.",
  CredentialsSignin: "Wrong e-mail or password.",
  AccessDenied: "This account cannot sign in.",
};

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  if (await getSessionUserId()) redirect("/");
  const { error, callbackUrl } = await searchParams;
  const safeCallback = callbackUrl?.startsWith("/") && !callbackUrl.startsWith("//") ? callbackUrl : "/";
  return (
    <main id="main-content" tabIndex={-1} className="grid min-h-screen place-items-center px-4">
      <div className="flex w-full max-w-sm flex-col items-center gap-6">
        <Brand size="lg" />
        <p className="text-center text-ink-soft">Reactor trains, sized and ranked — sign in to your team.</p>
        <SignInForm callbackUrl={safeCallback} initialError={error ? (ERRORS[error] ?? "Sign-in failed. Try again.") : undefined} />
      </div>
    </main>
  );
}
