import type { Metadata } from "next";
import { PublicHeader } from "@/components/layout/public-header";
import { PublicNotFoundNotice } from "@/components/layout/public-not-found";

export const metadata: Metadata = { title: "Not found" };

/**
 * An address outside every section: under the public header, with the ways back. It reads
 * no cookie (the browser asks who is signed in), so a stored public page that turns out
 * missing renders it too.
 */
export default function NotFound() {
  return (
    <div className="min-h-screen">
      <PublicHeader />
      <main className="mx-auto max-w-6xl px-4 sm:px-6">
        <PublicNotFoundNotice />
      </main>
    </div>
  );
}
