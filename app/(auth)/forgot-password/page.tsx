import type { Metadata } from "next";
import Link from "next/link";
import { ForgotPasswordForm } from "@/components/forms/forgot-password-form";

export const metadata: Metadata = { title: "Forgot your password?" };

export default function ForgotPasswordPage() {
  return (
    <div className="card">
      <h1 className="mb-1">Forgot your password?</h1>
      <p className="mb-6 text-sm text-ink-soft">
        Enter the e-mail address of your account and we will send you a link to choose a new password. The link also
        confirms the address if you have not done so yet.
      </p>
      <ForgotPasswordForm />
      <p className="mt-4 text-center text-sm text-ink-soft">
        <Link href="/signin">Back to sign in</Link>
      </p>
    </div>
  );
}
