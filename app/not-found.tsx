import type { Metadata } from "next";
import { NotFoundNotice } from "@/components/layout/not-found-notice";
import { PublicHeader } from "@/components/layout/public-header";
import { currentActor } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Not found" };

/** An address outside every section: under the public header, with the ways back. */
export default async function NotFound() {
  const actor = await currentActor();
  return (
    <div className="min-h-screen">
      <PublicHeader actor={actor} />
      <main className="mx-auto max-w-6xl px-4 sm:px-6">
        <NotFoundNotice signedIn={actor !== null} />
      </main>
    </div>
  );
}
