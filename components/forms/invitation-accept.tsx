"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { NewPasswordFields } from "./new-password-fields";
import { applyApiError } from "@/components/ui/form-error";
import { Notice } from "@/components/ui/notice";
import { useAcceptInvitationMutation, useRegisterByInvitationMutation } from "@/lib/queries/invitations";
import type { AcceptedDto } from "@/lib/services/invitations";
import { invitationRegisterSchema, type InvitationRegisterInput } from "@/lib/validation/account";

/** Signed in as the invited address: one button joins the basin. */
export function AcceptInvitationButton({ token }: { token: string }) {
  const router = useRouter();
  const accept = useAcceptInvitationMutation(token);
  // busy from the click until the basin's page opens (not only while the request runs)
  const busy = accept.isPending || accept.isSuccess;
  const onAccept = () =>
    accept.mutate(undefined, {
      onSuccess: (done) => {
        router.push(`/basins/${done.basinId}`);
        router.refresh();
      },
    });
  return (
    <div className="space-y-3">
      {accept.error && <Notice tone="error">{accept.error.message}</Notice>}
      <Button className="w-full" onClick={onAccept} disabled={busy}>
        {busy ? "Joining…" : "Accept and join the basin"}
      </Button>
    </div>
  );
}

/** No account for the invited address yet: create it here (the invitation confirms the address), join, sign in. */
export function InvitationRegisterForm({ token, email }: { token: string; email: string }) {
  const router = useRouter();
  const join = useRegisterByInvitationMutation(token);
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<InvitationRegisterInput>({
    resolver: zodResolver(invitationRegisterSchema),
    defaultValues: { name: "", password: "", confirmPassword: "" },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    let done: AcceptedDto;
    try {
      done = await join.mutateAsync(values);
    } catch (error) {
      const message = applyApiError(error, setError as never, ["name", "password", "confirmPassword"]);
      if (message) setFailure(message);
      return;
    }
    const res = await signIn("credentials", { email: done.email, password: values.password, redirect: false });
    router.push(res && !res.error ? `/basins/${done.basinId}` : "/signin");
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Create your account and join">
      {failure && <Notice tone="error">{failure}</Notice>}
      <Field label="E-mail" type="email" value={email} readOnly disabled />
      <Field label="Your name" autoComplete="name" error={errors.name?.message} {...register("name")} />
      <NewPasswordFields
        label="Password"
        password={register("password")}
        confirm={register("confirmPassword")}
        errors={{ password: errors.password?.message, confirm: errors.confirmPassword?.message }}
      />
      <Button type="submit" className="w-full" disabled={isSubmitting}>
        {isSubmitting ? "Joining…" : "Create account and join"}
      </Button>
      <p className="text-center text-sm text-ink-soft">
        <Link href={`/signin?callbackUrl=${encodeURIComponent(`/invite?token=${token}`)}`}>I already have an account</Link>
      </p>
    </form>
  );
}
