/** The app's public address, for links in e-mails (NEXTAUTH_URL, as the sign-in callbacks use it). */
export const appUrl = (): string => (process.env.NEXTAUTH_URL ?? "http://127.0.0.1:3000").replace(/\/$/, "");
