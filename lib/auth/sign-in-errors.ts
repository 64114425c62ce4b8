/**
 * next-auth v4 hands a message thrown in `authorize` to the client as
 * signIn()'s `error`; a locked-out sign-in sends "RateLimited:<epoch ms>",
 * the time from which it may try again.
 */
export const RATE_LIMITED_PREFIX = "RateLimited:";

export function rateLimitedSignInError(retryAt: Date): string {
  return `${RATE_LIMITED_PREFIX}${retryAt.getTime()}`;
}

/** The retry time a sign-in error carries, or null when it is another error. */
export function signInRetryAt(error: string | null | undefined): Date | null {
  if (!error?.startsWith(RATE_LIMITED_PREFIX)) return null;
  const ms = Number(error.slice(RATE_LIMITED_PREFIX.length));
  return Number.isFinite(ms) && ms > 0 ? new Date(ms) : null;
}

/** "Too many sign-in attempts. Try again at 14:05 (in about 12 minutes)." */
export function lockedOutMessage(retryAt: Date, now = new Date()): string {
  const minutes = Math.max(1, Math.ceil((retryAt.getTime() - now.getTime()) / 60_000));
  const at = retryAt.toLocaleTimeString(undefined, { hour: "2-digit", minute: "2-digit" });
  return `Too many sign-in attempts. Sign-in is paused for this account or network; try again at ${at} (in about ${minutes} minute${minutes === 1 ? "" : "s"}).`;
}
