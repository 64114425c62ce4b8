import type { Metadata } from "next";
import { NotFoundNotice } from "@/components/layout/not-found-notice";

export const metadata: Metadata = { title: "Not found" };

/** A basin, run, scenario or plan that is not there, under the workspace header. */
export default function WorkspaceNotFound() {
  return <NotFoundNotice signedIn />;
}
