"use client";
import { NotFoundNotice } from "@/components/layout/not-found-notice";
import { useSignedIn } from "@/lib/queries/account";

/** The not-found notice outside the workspace: the ways back fit the reader once the browser knows who is signed in. */
export function PublicNotFoundNotice() {
  const me = useSignedIn();
  return <NotFoundNotice signedIn={me.data?.signedIn ?? false} />;
}
