"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { lockedOutMessage, signInRetryAt } from "@/lib/auth/sign-in-errors";
import { EMAIL_NOT_CONFIRMED } from "@/lib/validation/account";
import { signInSchema, type SignInInput } from "@/lib/validation/user";

export function SignInForm({ next }: { next: string }) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    formState: { errors, isSubmitting },
  } = useForm<SignInInput>({ resolver: zodResolver(signInSchema), defaultValues: { email: "", password: "" } });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const res = await signIn("credentials", { ...values, redirect: false });
    if (!res || res.error) {
      const retryAt = signInRetryAt(res?.error);
      setFailure(
        retryAt
          ? lockedOutMessage(retryAt)
          : res?.error === EMAIL_NOT_CONFIRMED
          ? "Confirm your e-mail address first: open the link we e-mailed you when you created the account."
          : "That e-mail and password do not match an account.",
      );
      return;
    }
    router.push(next);
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {failure && <Notice tone="error">{failure}</Notice>}
      <Field label="E-mail" type="email" autoComplete="username" error={errors.email?.message} {...register("email")} />
      <Field
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...register("password")}
      />
      <Button type="submit" className="w-full" disabled={isSubmitting}>
        {isSubmitting ? "Signing in…" : "Sign in"}
      </Button>
      <p className="flex justify-between text-sm">
        <Link href="/register">Create an account</Link>
        <Link href="/forgot-password">Forgot your password?</Link>
      </p>
    </form>
  );
}
