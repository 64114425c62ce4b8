import type { Metadata } from "next";
import Link from "next/link";
import { AcceptInvitationButton, InvitationRegisterForm } from "@/components/forms/invitation-accept";
import { Notice } from "@/components/ui/notice";
import { getDb } from "@/db/client";
import { currentActor } from "@/lib/auth/session";
import { AppError } from "@/lib/errors";
import { previewInvitation, type InvitationPreviewDto } from "@/lib/services/invitations";
import { tokenSchema } from "@/lib/validation/account";

export const metadata: Metadata = { title: "Invitation" };

const STATUS_TEXT = {
  accepted: "This invitation has already been accepted.",
  revoked: "This invitation was withdrawn by the basin's lead.",
  expired: "This invitation has expired. Ask the basin's lead to invite you again.",
} as const;

async function load(token: string | undefined): Promise<InvitationPreviewDto | null> {
  const valid = tokenSchema.safeParse(token ?? "");
  if (!valid.success) return null;
  try {
    return await previewInvitation(getDb(), valid.data);
  } catch (error) {
    if (error instanceof AppError && error.status === 404) return null;
    throw error;
  }
}

export default async function InvitePage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  const invitation = await load(token);
  if (!invitation || !token) {
    return (
      <div className="card">
        <h1 className="mb-4">Invitation</h1>
        <Notice tone="error" title="This invitation link is not valid">
          Open the link from the e-mail again, or ask the basin&apos;s lead to invite you again.
        </Notice>
      </div>
    );
  }
  const actor = await currentActor();
  const here = `/invite?token=${token}`;
  const role = invitation.role === "discharger" && invitation.facilityName ? `discharger for ${invitation.facilityName}` : invitation.role;
  return (
    <div className="card space-y-4">
      <h1>Join {invitation.basinName}</h1>
      <p className="text-sm text-ink-soft">
        {invitation.invitedBy ?? "The basin's lead"} invites <strong>{invitation.email}</strong> to {invitation.basinName}{" "}
        as <strong>{role}</strong>.
      </p>
      {invitation.status !== "pending" ? (
        <Notice tone="warning">{STATUS_TEXT[invitation.status]}</Notice>
      ) : actor ? (
        actor.email === invitation.email ? (
          <AcceptInvitationButton token={token} />
        ) : (
          <Notice tone="warning" title="Signed in with another address">
            You are signed in as {actor.email}; this invitation is for {invitation.email}.{" "}
            <Link href={`/signout`}>Sign out</Link> and sign in with the invited address to accept it.
          </Notice>
        )
      ) : invitation.accountExists ? (
        <p className="text-sm">
          An account already uses this address.{" "}
          <Link href={`/signin?callbackUrl=${encodeURIComponent(here)}`} className="font-medium">
            Sign in to accept
          </Link>
          .
        </p>
      ) : (
        <InvitationRegisterForm token={token} email={invitation.email} />
      )}
    </div>
  );
}
