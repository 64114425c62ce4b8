import type { Metadata } from "next";
import { SignOutButton } from "@/components/forms/sign-out-button";

export const metadata: Metadata = { title: "Sign out" };

export default function SignOutPage() {
  return (
    <div className="card text-center">
      <h1 className="mb-2">Sign out</h1>
      <p className="mb-6 text-sm text-ink-soft">You will need your e-mail and password to come back.</p>
      <SignOutButton />
    </div>
  );
}
