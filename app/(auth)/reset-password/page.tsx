import type { Metadata } from "next";
import Link from "next/link";
import { ResetPasswordForm } from "@/components/forms/reset-password-form";
import { Notice } from "@/components/ui/notice";
import { tokenSchema } from "@/lib/validation/account";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  const valid = tokenSchema.safeParse(token ?? "");
  return (
    <div className="card">
      <h1 className="mb-4">Choose a new password</h1>
      {valid.success ? (
        <ResetPasswordForm token={valid.data} />
      ) : (
        <Notice tone="error" title="This link is not complete">
          Open the link from the e-mail again, or <Link href="/forgot-password">ask for a new one</Link>.
        </Notice>
      )}
    </div>
  );
}
