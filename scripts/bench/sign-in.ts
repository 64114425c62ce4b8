/** Sign in over HTTP as a browser would (next-auth's CSRF cookie, then the credentials callback); returns the session cookie. */
export async function signInOverHttp(base: string, email: string, password: string): Promise<string> {
  const csrfRes = await fetch(`${base}/api/auth/csrf`);
  const jar = (csrfRes.headers.getSetCookie?.() ?? []).map((c) => c.split(";")[0]);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: jar.join("; ") },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
  });
  const session = (res.headers.getSetCookie?.() ?? []).map((c) => c.split(";")[0]).find((c) => c.startsWith("next-auth.session-token="));
  if (!session) throw new Error(`sign-in as ${email} failed (${res.status})`);
  return session;
}
