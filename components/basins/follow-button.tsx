"use client";
import { Button } from "@/components/ui/button";
import { useFollowMutation, useFollowQuery } from "@/lib/queries/follows";

/**
 * Follow or unfollow a basin for its e-mail notices (review opened or closing,
 * plan published). For signed-in users; `followed` is the state the page read.
 */
export function FollowButton({ basinId, followed: initial }: { basinId: string; followed: boolean }) {
  const followed = useFollowQuery(basinId, initial).data.followed;
  const toggle = useFollowMutation(basinId);
  return (
    <div className="space-y-2" data-testid="follow-basin">
      <p className="text-sm text-ink-soft">
        {followed
          ? "You follow this basin: we e-mail you when a review opens or closes soon and when a plan is published."
          : "Follow this basin to be e-mailed when a review opens or closes soon and when a plan is published."}
      </p>
      <Button variant={followed ? "secondary" : "primary"} disabled={toggle.isPending} onClick={() => toggle.mutate(!followed)}>
        {followed ? "Unfollow" : "Follow this basin"}
      </Button>
      {toggle.error && (
        <p role="alert" className="field-error">
          {toggle.error.message}
        </p>
      )}
    </div>
  );
}
