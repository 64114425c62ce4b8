import type { Metadata } from "next";
import Link from "next/link";
import { VerifyEmail } from "@/components/forms/verify-email";
import { Notice } from "@/components/ui/notice";
import { tokenSchema } from "@/lib/validation/account";

export const metadata: Metadata = { title: "Confirm your e-mail address" };

export default async function VerifyPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  const valid = tokenSchema.safeParse(token ?? "");
  return (
    <div className="card">
      <h1 className="mb-4">Confirm your e-mail address</h1>
      {valid.success ? (
        <VerifyEmail token={valid.data} />
      ) : (
        <Notice tone="error" title="This link is not complete">
          Open the link from the e-mail again, or <Link href="/register">create an account</Link>.
        </Notice>
      )}
    </div>
  );
}
