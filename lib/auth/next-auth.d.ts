import type { DefaultSession } from "next-auth";

declare module "next-auth" {
  interface Session {
    /** sv: the account's session version when this session signed in. */
    user: { id: string; sv?: number } & DefaultSession["user"];
  }
  interface User {
    sessionVersion?: number;
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    /** The account's session version at sign-in (users.session_version). */
    sv?: number;
  }
}
