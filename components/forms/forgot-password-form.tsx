"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { applyApiError } from "@/components/ui/form-error";
import { Notice } from "@/components/ui/notice";
import { apiFetch } from "@/lib/queries/fetcher";
import { resetRequestSchema, type ResetRequestInput } from "@/lib/validation/account";

/** Asks for a reset link; the answer is the same whether or not the address has an account. */
export function ForgotPasswordForm() {
  const [done, setDone] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<ResetRequestInput>({ resolver: zodResolver(resetRequestSchema), defaultValues: { email: "" } });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const res = await apiFetch<{ message: string }>("/api/account/password-reset", { method: "POST", json: values });
      setDone(res.message);
    } catch (error) {
      const message = applyApiError(error, setError as never, ["email"]);
      if (message) setFailure(message);
    }
  });

  if (done) {
    return (
      <Notice tone="success" title="Check your e-mail">
        {done} The link works for one hour.
      </Notice>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Ask for a new password">
      {failure && <Notice tone="error">{failure}</Notice>}
      <Field label="E-mail" type="email" autoComplete="email" error={errors.email?.message} {...register("email")} />
      <Button type="submit" className="w-full" disabled={isSubmitting}>
        {isSubmitting ? "Sending…" : "Send me a link"}
      </Button>
    </form>
  );
}
