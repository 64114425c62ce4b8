import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { getDb } from "@/db/client";
import { clientAddressFromRecord } from "@/lib/security/client-address";
import { RateLimitedError } from "@/lib/security/rate-limit";
import { signInLimited } from "@/lib/services/users";
import { EMAIL_NOT_CONFIRMED } from "@/lib/validation/account";
import { signInSchema } from "@/lib/validation/user";
import { safeCallbackPath } from "./safe-redirect";
import { rateLimitedSignInError } from "./sign-in-errors";

/**
 * next-auth v4: e-mail + password, JWT sessions. The token carries the user
 * id and the account's session version at sign-in; every request re-reads
 * the account (lib/auth/guard loadActor) and treats a token whose version is
 * behind as signed out. Permissions are re-read from the database too.
 */
export const authOptions: NextAuthOptions = {
  secret: process.env.NEXTAUTH_SECRET,
  session: { strategy: "jwt", maxAge: 8 * 60 * 60 },
  pages: { signIn: "/signin" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: {
        email: { label: "E-mail", type: "email" },
        password: { label: "Password", type: "password" },
      },
      async authorize(credentials, req) {
        const parsed = signInSchema.safeParse(credentials ?? {});
        if (!parsed.success) return null;
        let check;
        try {
          check = await signInLimited(getDb(), parsed.data.email, parsed.data.password, clientAddressFromRecord(req?.headers));
        } catch (error) {
          // the sign-in page reads the retry time out of the message (lib/auth/sign-in-errors)
          if (error instanceof RateLimitedError) throw new Error(rateLimitedSignInError(error.retryAt));
          throw error;
        }
        // next-auth v4 passes a thrown error's message to the client as signIn()'s `error`
        if (!check.ok && check.reason === "unverified") throw new Error(EMAIL_NOT_CONFIRMED);
        return check.ok
          ? { id: check.user.id, email: check.user.email, name: check.user.name, sessionVersion: check.sessionVersion }
          : null;
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.sub = user.id;
        token.sv = user.sessionVersion ?? 0;
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user && token.sub) {
        session.user.id = token.sub;
        session.user.sv = typeof token.sv === "number" ? token.sv : 0;
      }
      return session;
    },
    // Same-origin targets only, resolved as a browser would (lib/auth/safe-redirect).
    async redirect({ url, baseUrl }) {
      return `${baseUrl.replace(/\/$/, "")}${safeCallbackPath(url, baseUrl)}`;
    },
  },
};
