import type { ReactNode } from "react";
import { PublicHeader } from "@/components/layout/public-header";
import { currentActor } from "@/lib/auth/session";

/** Pages for everyone, signed in or not, under one header. */
export default async function PublicLayout({ children }: { children: ReactNode }) {
  return (
    <div className="min-h-screen">
      <PublicHeader actor={await currentActor()} />
      {children}
    </div>
  );
}
