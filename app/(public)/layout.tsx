import type { ReactNode } from "react";
import { PublicHeader } from "@/components/layout/public-header";

/** Pages for everyone, signed in or not, under one header (which learns who is signed in in the browser). */
export default function PublicLayout({ children }: { children: ReactNode }) {
  return (
    <div className="min-h-screen">
      <PublicHeader />
      {children}
    </div>
  );
}
