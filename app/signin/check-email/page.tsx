import Link from "next/link";
import { Brand } from "@/components/layout/brand";

export const metadata = { title: "Check your e-mail" };

export default function CheckEmailPage() {
  return (
    <main id="main-content" tabIndex={-1} className="grid min-h-screen place-items-center px-4">
      <div className="card max-w-sm space-y-4 p-6 text-center">
        <Brand />
        <h1>Check your e-mail</h1>
        <p className="text-ink-soft">If the address has a Seriatim account, a sign-in link is on its way. It works once, for 15 minutes.</p>
        <Link href="/signin" className="text-accent-700 underline">
          Back to sign-in
        </Link>
      </div>
    </main>
  );
}
