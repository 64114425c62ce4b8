import Link from "next/link";
import type { ReactNode } from "react";
import { NameMark } from "@/components/brand/name-mark";

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center px-4 py-12">
      <Link href="/" className="mb-8 no-underline hover:no-underline" aria-label="Sagline home">
        <NameMark />
      </Link>
      <div className="w-full max-w-sm">{children}</div>
    </main>
  );
}
