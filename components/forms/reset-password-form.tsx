"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { NewPasswordFields } from "./new-password-fields";
import { applyApiError } from "@/components/ui/form-error";
import { Notice } from "@/components/ui/notice";
import { apiFetch } from "@/lib/queries/fetcher";
import { newPasswordSchema } from "@/lib/validation/account";

type NewPassword = { password: string; confirmPassword: string };

export function ResetPasswordForm({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<NewPassword>({ resolver: zodResolver(newPasswordSchema), defaultValues: { password: "", confirmPassword: "" } });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      await apiFetch("/api/account/password-reset/confirm", { method: "POST", json: { token, ...values } });
      setDone(true);
    } catch (error) {
      const message = applyApiError(error, setError as never, ["password", "confirmPassword"]);
      if (message) setFailure(message);
    }
  });

  if (done) {
    return (
      <Notice tone="success" title="Your new password is set">
        <Link href="/signin">Sign in</Link> with it now.
      </Notice>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Choose a new password">
      {failure && (
        <Notice tone="error">
          {failure} <Link href="/forgot-password">Ask for a new link</Link>.
        </Notice>
      )}
      <NewPasswordFields
        label="New password"
        password={register("password")}
        confirm={register("confirmPassword")}
        errors={{ password: errors.password?.message, confirm: errors.confirmPassword?.message }}
      />
      <Button type="submit" className="w-full" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : "Set the new password"}
      </Button>
    </form>
  );
}
