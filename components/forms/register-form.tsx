"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { NewPasswordFields } from "./new-password-fields";
import { applyApiError } from "@/components/ui/form-error";
import { Notice } from "@/components/ui/notice";
import { apiFetch } from "@/lib/queries/fetcher";
import { registerSchema, type RegisterInput } from "@/lib/validation/account";

/** Self-registration: the account signs in once the e-mailed link confirms the address. */
export function RegisterForm() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<RegisterInput>({
    resolver: zodResolver(registerSchema),
    defaultValues: { name: "", email: "", password: "", confirmPassword: "" },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const done = await apiFetch<{ email: string }>("/api/account/register", { method: "POST", json: values });
      setSentTo(done.email);
    } catch (error) {
      const message = applyApiError(error, setError as never, ["name", "email", "password", "confirmPassword"]);
      if (message) setFailure(message);
    }
  });

  if (sentTo) {
    return (
      <Notice tone="success" title="Check your e-mail">
        We sent a link to <strong>{sentTo}</strong>. Open it to confirm the address, then sign in. The link works for 48
        hours.
      </Notice>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Create an account">
      {failure && <Notice tone="error">{failure}</Notice>}
      <Field label="Your name" autoComplete="name" error={errors.name?.message} {...register("name")} />
      <Field label="E-mail" type="email" autoComplete="email" error={errors.email?.message} {...register("email")} />
      <NewPasswordFields
        label="Password"
        password={register("password")}
        confirm={register("confirmPassword")}
        errors={{ password: errors.password?.message, confirm: errors.confirmPassword?.message }}
      />
      <Button type="submit" className="w-full" disabled={isSubmitting}>
        {isSubmitting ? "Creating…" : "Create account"}
      </Button>
      <p className="text-center text-sm text-ink-soft">
        Already have an account? <Link href="/signin">Sign in</Link>
      </p>
    </form>
  );
}
