import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { getDb } from "@/db/client";
import { checkSignIn } from "@/lib/services/users";
import { EMAIL_NOT_CONFIRMED } from "@/lib/validation/account";
import { signInSchema } from "@/lib/validation/user";

/**
 * next-auth v4: e-mail + password, JWT sessions. The token carries only the
 * user id; every permission check re-reads roles from the database.
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
      async authorize(credentials) {
        const parsed = signInSchema.safeParse(credentials ?? {});
        if (!parsed.success) return null;
        const check = await checkSignIn(getDb(), parsed.data.email, parsed.data.password);
        // next-auth v4 passes a thrown error's message to the client as signIn()'s `error`
        if (!check.ok && check.reason === "unverified") throw new Error(EMAIL_NOT_CONFIRMED);
        return check.ok ? { id: check.user.id, email: check.user.email, name: check.user.name } : null;
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) token.sub = user.id;
      return token;
    },
    async session({ session, token }) {
      if (session.user && token.sub) session.user.id = token.sub;
      return session;
    },
  },
};
