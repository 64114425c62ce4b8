import type { Metadata } from "next";
import { SignInForm } from "@/components/forms/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string }> }) {
  const { callbackUrl } = await searchParams;
  // Only same-site paths are honoured as a destination after sign-in.
  const next = callbackUrl && callbackUrl.startsWith("/") && !callbackUrl.startsWith("//") ? callbackUrl : "/basins";
  return (
    <div className="card">
      <h1 className="mb-1">Sign in</h1>
      <p className="mb-6 text-sm text-ink-soft">Use the e-mail address of your Sagline account.</p>
      <SignInForm next={next} />
    </div>
  );
}
