import type { Metadata } from "next";
import { SignInForm } from "@/components/forms/sign-in-form";
import { safeCallbackPath } from "@/lib/auth/safe-redirect";
import { appUrl } from "@/lib/email/app-url";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string }> }) {
  const { callbackUrl } = await searchParams;
  // Only targets on the app's own origin are honoured after sign-in (resolved as a browser would).
  const next = safeCallbackPath(callbackUrl, appUrl());
  return (
    <div className="card">
      <h1 className="mb-1">Sign in</h1>
      <p className="mb-6 text-sm text-ink-soft">Use the e-mail address of your Sagline account.</p>
      <SignInForm next={next} />
    </div>
  );
}
