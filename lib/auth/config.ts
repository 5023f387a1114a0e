import NextAuth from "next-auth";
import Credentials from "next-auth/providers/credentials";
import Nodemailer from "next-auth/providers/nodemailer";
import { DrizzleAdapter } from "@auth/drizzle-adapter";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { accounts, sessions, users, verificationTokens } from "@/db/schema";
import { getEnv } from "@/lib/env";
import { appLink, sendMail } from "@/lib/mail";
import { passwordSignInSchema } from "@/lib/schemas/accounts";
import { verifyAgainstNothing, verifyPassword } from "./password";
import { endSession, isSessionId, startSession } from "./sign-in-sessions";
import { recordSignInAttempt } from "./throttle";

declare module "next-auth" {
  interface Session {
    /** The sign-in row this cookie belongs to (lib/auth/sign-in-sessions.ts). */
    sessionId?: string;
  }
}

async function findUserByEmail(email: string) {
  const [user] = await getDb().select().from(users).where(eq(users.email, email.toLowerCase()));
  return user;
}

/** The same path on the advertised origin (APP_URL), whatever host Auth.js saw. */
function toAppUrl(url: string): string {
  const u = new URL(url, getEnv().APP_URL);
  return appLink(u.pathname + u.search + u.hash);
}

// Lazy configuration: nothing reads the environment or the database at build time.
export const { handlers, auth, signIn, signOut } = NextAuth(() => {
  const env = getEnv();
  return {
    secret: env.AUTH_SECRET,
    trustHost: true,
    session: { strategy: "jwt", maxAge: 8 * 60 * 60 },
    logger: {
      // A wrong password is an expected outcome, counted by the throttle; not a server error.
      error(error) {
        if (error.name === "CredentialsSignin") return;
        console.error(`[auth] ${error.name}: ${error.message}`);
      },
    },
    adapter: DrizzleAdapter(getDb(), {
      usersTable: users,
      accountsTable: accounts,
      sessionsTable: sessions,
      verificationTokensTable: verificationTokens,
    }),
    pages: { signIn: "/signin", verifyRequest: "/signin/check-email", error: "/signin" },
    providers: [
      Credentials({
        credentials: { email: {}, password: {} },
        async authorize(raw) {
          const parsed = passwordSignInSchema.safeParse(raw);
          if (!parsed.success) return null;
          const { email, password } = parsed.data;
          const user = await findUserByEmail(email);
          const ok = user?.passwordHash ? await verifyPassword(password, user.passwordHash) : await verifyAgainstNothing(password);
          await recordSignInAttempt(getDb(), email, ok);
          return ok && user ? { id: user.id, email: user.email, name: user.name } : null;
        },
      }),
      Nodemailer({
        server: env.SMTP_URL,
        from: env.MAIL_FROM,
        maxAge: 15 * 60,
        async sendVerificationRequest({ identifier, url }) {
          // Auth.js builds the link from the request host; mail the configured origin instead,
          // for the link and for the page it returns to.
          const link = new URL(url);
          const back = link.searchParams.get("callbackUrl");
          if (back) link.searchParams.set("callbackUrl", toAppUrl(back));
          const advertised = appLink(link.pathname + link.search);
          await sendMail({
            to: identifier,
            subject: "Your Seriatim sign-in link",
            text: `Sign in to Seriatim with this link (valid for 15 minutes, once):\n${advertised}\n\nIf you did not ask for it, ignore this message.`,
          });
        },
      }),
    ],
    callbacks: {
      async signIn({ user, account, email }) {
        // Sign-in links go only to existing accounts; accounts are created by invitation.
        // Unknown addresses see the same "check your mail" page, so nothing is revealed.
        if (account?.provider === "nodemailer" && email?.verificationRequest) {
          return (await findUserByEmail(user.email ?? "")) ? true : "/signin/check-email";
        }
        return true;
      },
      redirect({ url, baseUrl }) {
        const target = new URL(url, baseUrl);
        const sameApp = target.origin === new URL(baseUrl).origin || target.origin === new URL(getEnv().APP_URL).origin;
        return sameApp ? toAppUrl(url) : getEnv().APP_URL;
      },
      // Each sign-in gets a row; its id travels in the cookie and is checked on every request.
      async jwt({ token, user, trigger }) {
        if ((trigger === "signIn" || trigger === "signUp") && user?.id) token.sid = await startSession(getDb(), user.id);
        return token;
      },
      session({ session, token }) {
        if (token.sub) session.user.id = token.sub;
        if (isSessionId(token.sid)) session.sessionId = token.sid;
        return session;
      },
    },
    events: {
      // The cookie is cleared by Auth.js; ending the row makes any copy of it worthless too.
      async signOut(message) {
        const sid = "token" in message ? message.token?.sid : undefined;
        if (isSessionId(sid)) await endSession(getDb(), sid, "signed out");
      },
    },
  };
});
