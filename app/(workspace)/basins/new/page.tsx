import type { Metadata } from "next";
import { NewBasin } from "@/components/forms/new-basin";
import { Denied } from "@/components/ui/denied";
import { getDb } from "@/db/client";
import { currentActor } from "@/lib/auth/session";
import { canCreateBasin } from "@/lib/services/basins";

export const metadata: Metadata = { title: "New basin" };

export default async function NewBasinPage() {
  if (!(await canCreateBasin(getDb(), await currentActor()))) {
    return <Denied message="Only site administrators and basin leads may create basins." />;
  }
  return (
    <div>
      <h1 className="mb-6">New basin</h1>
      <NewBasin />
    </div>
  );
}
