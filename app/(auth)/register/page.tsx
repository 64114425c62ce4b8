import type { Metadata } from "next";
import { RegisterForm } from "@/components/forms/register-form";

export const metadata: Metadata = { title: "Create an account" };

export default function RegisterPage() {
  return (
    <div className="card">
      <h1 className="mb-1">Create an account</h1>
      <p className="mb-6 text-sm text-ink-soft">
        Follow basins, read plans under review and comment on them. We will e-mail you a link to confirm your address.
      </p>
      <RegisterForm />
    </div>
  );
}
